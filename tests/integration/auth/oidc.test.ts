import { expect, it } from "vitest";
import { OIDC_PROVIDER_ID, oidcEmail, oidcProvider } from "@/lib/auth/oidc";
import { resolveMember } from "@/lib/authz/guard";
import { NoMembershipError } from "@/lib/errors";
import { userForSingleSignOn } from "@/lib/auth/sign-in";
import { describeWithAppDatabase } from "./app-database";
import { sessionOf } from "./fixtures";

const settings = { issuer: "https://login.example.edu/realms/chem/", clientId: "layerwise", clientSecret: "s3cret", name: "Campus sign-in" };

it("configures an OpenID Connect provider from discovery, with PKCE and state", () => {
  const provider = oidcProvider(settings);
  expect(provider.id).toBe(OIDC_PROVIDER_ID);
  expect(provider.name).toBe("Campus sign-in");
  // OpenID Connect Discovery 1.0 §4: <issuer>/.well-known/openid-configuration (no doubled slash).
  expect(provider.wellKnown).toBe("https://login.example.edu/realms/chem/.well-known/openid-configuration");
  expect(provider.checks).toEqual(["pkce", "state"]);
  expect(provider.idToken).toBe(true);
});

it("trusts an email only when the identity provider does not call it unverified", () => {
  expect(oidcEmail({ sub: "1", email: " Kai.Rowe@Example.edu" })).toBe("kai.rowe@example.edu");
  expect(oidcEmail({ sub: "1", email: "kai.rowe@example.edu", email_verified: true })).toBe("kai.rowe@example.edu");
  expect(oidcEmail({ sub: "1", email: "kai.rowe@example.edu", email_verified: false })).toBeNull();
  expect(oidcEmail({ sub: "1" })).toBeNull();
  expect(oidcEmail(undefined)).toBeNull();
});

describeWithAppDatabase("single sign-on accounts", (t) => {
  it("are created on first sign-in without a password and see nothing until invited", async () => {
    const first = await userForSingleSignOn("kai.rowe@example.edu", "Kai Rowe");
    const again = await userForSingleSignOn("kai.rowe@example.edu", "Someone Else");
    expect(again).toEqual(first);
    const stored = await t.db.user.findUniqueOrThrow({ where: { id: first.id }, omit: { passwordHash: false } });
    expect(stored).toMatchObject({ name: "Kai Rowe", passwordHash: null });
    await expect(resolveMember(sessionOf(first.id, null), "data:read")).rejects.toBeInstanceOf(NoMembershipError);
  });
});
