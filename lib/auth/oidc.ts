// Optional institutional single sign-on through any OpenID Connect issuer (discovery document at
// <issuer>/.well-known/openid-configuration, OpenID Connect Discovery 1.0 §4). Configured only from the
// environment (lib/env.ts: OIDC_ISSUER, OIDC_CLIENT_ID, OIDC_CLIENT_SECRET, OIDC_NAME).
import { type OAuthConfig } from "next-auth/providers/oauth";
import { type OidcSettings } from "@/lib/env";

export const OIDC_PROVIDER_ID = "oidc";

export interface OidcProfile extends Record<string, unknown> {
  sub: string;
  email?: string;
  email_verified?: boolean;
  name?: string;
  preferred_username?: string;
}

export function oidcProvider(settings: OidcSettings): OAuthConfig<OidcProfile> {
  const issuer = settings.issuer.replace(/\/+$/, "");
  return {
    id: OIDC_PROVIDER_ID,
    name: settings.name,
    type: "oauth",
    wellKnown: `${issuer}/.well-known/openid-configuration`,
    issuer,
    clientId: settings.clientId,
    clientSecret: settings.clientSecret,
    authorization: { params: { scope: "openid email profile" } },
    idToken: true,
    checks: ["pkce", "state"],
    profile(profile) {
      return {
        id: profile.sub,
        email: profile.email ?? null,
        name: profile.name ?? profile.preferred_username ?? profile.email ?? null,
      };
    },
  };
}

/**
 * The email an issuer vouches for, or null. Only `email_verified: true` counts (OpenID Connect Core 1.0 §5.1: the
 * claim says whether the provider took affirmative steps to verify the address); an absent claim, or a string such as
 * "true", is not a promise. An unverified email could otherwise claim someone else's Layerwise account.
 */
export function oidcEmail(profile: OidcProfile | undefined): string | null {
  if (!profile || typeof profile.email !== "string" || profile.email_verified !== true) return null;
  const email = profile.email.trim().toLowerCase();
  return email === "" ? null : email;
}
