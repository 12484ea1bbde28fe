// next-auth configuration: email + password always, institutional single sign-on when configured; JWT sessions.
import { type NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { env } from "@/lib/env";
import { RateLimitedError, logUnexpected } from "@/lib/errors";
import { OIDC_PROVIDER_ID, oidcEmail, oidcProvider, type OidcProfile } from "@/lib/auth/oidc";
import { clientAddressFrom } from "@/lib/auth/rate-limit";
import { currentSessionVersion, endSessions } from "@/lib/auth/sessions";
import { firstGroupId, isMemberOf, signInWithPassword, userForSingleSignOn } from "@/lib/auth/sign-in";

export const SESSION_MAX_AGE_SECONDS = 7 * 24 * 60 * 60;

function requestedGroupId(update: unknown): string | null {
  if (typeof update !== "object" || update === null || !("activeGroupId" in update)) return null;
  return typeof update.activeGroupId === "string" ? update.activeGroupId : null;
}

async function singleSignOnUser(profile: unknown, displayName: string | null | undefined) {
  // The signIn callback has already refused profiles without a verified email; userForSingleSignOn checks again.
  return userForSingleSignOn(profile as OidcProfile | undefined, displayName ?? null);
}

function buildAuthOptions(): NextAuthOptions {
  const settings = env();
  const credentials = CredentialsProvider({
    id: "credentials",
    name: "Email and password",
    credentials: { email: { label: "Email", type: "email" }, password: { label: "Password", type: "password" } },
    async authorize(input, req) {
      try {
        return await signInWithPassword(input, clientAddressFrom(req.headers ?? {}, settings.trustedProxies));
      } catch (error) {
        // next-auth passes a thrown message to the sign-in page; only our own messages may travel that way.
        if (error instanceof RateLimitedError) throw new Error(error.message);
        const id = logUnexpected(error, "password sign-in");
        throw new Error(`Sign-in is unavailable right now (reference ${id}).`);
      }
    },
  });
  return {
    secret: settings.authSecret,
    session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: settings.oidc ? [credentials, oidcProvider(settings.oidc)] : [credentials],
    callbacks: {
      signIn({ account, profile }) {
        if (account?.provider !== OIDC_PROVIDER_ID) return true;
        return oidcEmail(profile as OidcProfile | undefined) !== null;
      },
      async jwt({ token, user, account, profile, trigger, session }) {
        if (user) {
          const signedIn = account?.provider === OIDC_PROVIDER_ID ? await singleSignOnUser(profile, user.name) : { id: user.id, email: user.email ?? "", name: user.name ?? "" };
          token.uid = signedIn.id;
          token.email = signedIn.email;
          token.name = signedIn.name;
          token.activeGroupId = await firstGroupId(signedIn.id);
          token.sv = await currentSessionVersion(signedIn.id);
        }
        if (trigger === "update" && token.uid) {
          const wanted = requestedGroupId(session);
          if (wanted !== null && (await isMemberOf(token.uid, wanted))) token.activeGroupId = wanted;
        }
        return token;
      },
      session({ session, token }) {
        session.user = { id: token.uid ?? "", name: token.name ?? "", email: token.email ?? "" };
        session.activeGroupId = token.activeGroupId ?? null;
        session.sessionVersion = token.sv ?? 0;
        return session;
      },
    },
    events: {
      // Signing out ends the session everywhere: a copy of the cookie taken before sign-out no longer opens anything.
      async signOut({ token }) {
        if (typeof token?.uid === "string" && token.uid !== "") await endSessions(token.uid);
      },
    },
  };
}

let cached: NextAuthOptions | undefined;

/** Built on first use, not at import, so `next build` needs no secret and no database. */
export function authOptions(): NextAuthOptions {
  return (cached ??= buildAuthOptions());
}
