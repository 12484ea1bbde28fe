import { expect, it } from "vitest";
import { OIDC_PROVIDER_ID, oidcEmail, oidcProvider } from "@/lib/auth/oidc";
import { resolveMember } from "@/lib/authz/guard";
import { ForbiddenError, NoMembershipError } from "@/lib/errors";
import { userForSingleSignOn } from "@/lib/auth/sign-in";
import { authOptions } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { describeWithAppDatabase } from "./app-database";
import { makeUser, sessionOf } from "./fixtures";

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

// OpenID Connect Core 1.0 §5.1: email_verified is true only when the provider verified the address; an absent claim
// promises nothing. Before this check an absent claim was trusted (the first line below answered the email).
it("trusts an email only when the identity provider says email_verified: true", () => {
  expect(oidcEmail({ sub: "1", email: " Kai.Rowe@Example.edu" })).toBeNull();
  expect(oidcEmail({ sub: "1", email: " Kai.Rowe@Example.edu", email_verified: true })).toBe("kai.rowe@example.edu");
  expect(oidcEmail({ sub: "1", email: "kai.rowe@example.edu", email_verified: "true" as unknown as boolean })).toBeNull();
  expect(oidcEmail({ sub: "1", email: "kai.rowe@example.edu", email_verified: false })).toBeNull();
  expect(oidcEmail({ sub: "1" })).toBeNull();
  expect(oidcEmail(undefined)).toBeNull();
});

describeWithAppDatabase("single sign-on accounts", (t) => {
  it("are created on first sign-in without a password and see nothing until invited", async () => {
    const first = await userForSingleSignOn({ sub: "k1", email: "kai.rowe@example.edu", email_verified: true }, "Kai Rowe");
    const again = await userForSingleSignOn({ sub: "k1", email: "kai.rowe@example.edu", email_verified: true }, "Someone Else");
    expect(again).toEqual(first);
    const stored = await t.db.user.findUniqueOrThrow({ where: { id: first.id }, omit: { passwordHash: false } });
    expect(stored).toMatchObject({ name: "Kai Rowe", passwordHash: null });
    await expect(resolveMember(sessionOf(first.id, null), "data:read")).rejects.toBeInstanceOf(NoMembershipError);
  });

  it("never sign in to, or merge into, an existing password account by an email that is not verified", async () => {
    const owner = await makeUser(t.db, "Lena Ostrowski", await hashPassword("separatory-funnel-77"));
    const before = await t.db.user.findUniqueOrThrow({ where: { id: owner.id }, omit: { passwordHash: false } });
    const account = { provider: OIDC_PROVIDER_ID, type: "oauth" as const, providerAccountId: "evil-1" };
    const signIn = authOptions().callbacks!.signIn!;
    for (const profile of [{ sub: "evil-1", email: owner.email }, { sub: "evil-1", email: owner.email, email_verified: false }]) {
      // Before: an absent email_verified claim passed this callback and the jwt callback returned the owner's id.
      expect(await signIn({ user: { id: "evil-1" }, account, profile })).toBe(false);
      await expect(userForSingleSignOn(profile, "Impostor")).rejects.toBeInstanceOf(ForbiddenError);
      const jwt = authOptions().callbacks!.jwt!;
      await expect(jwt({ token: {}, user: { id: "evil-1", email: owner.email, name: "Impostor" }, account, profile, trigger: "signIn" })).rejects.toBeInstanceOf(ForbiddenError);
    }
    expect(await t.db.user.findUniqueOrThrow({ where: { id: owner.id }, omit: { passwordHash: false } })).toEqual(before);
    expect(await t.db.user.count({ where: { email: owner.email } })).toBe(1);
  });
});
