// A next-auth session cookie minted the way next-auth itself mints one at sign-in (its own `encode`, the app's secret),
// so route handlers can be called "from a browser" through the real guard and the real session decoding.
import { encode, type JWT } from "next-auth/jwt";
import { authOptions, SESSION_MAX_AGE_SECONDS } from "@/lib/auth/options";
import { env } from "@/lib/env";

/** next-auth v4's cookie name on plain http (on https it carries the __Secure- prefix). */
export const SESSION_COOKIE = "next-auth.session-token";

export async function sessionToken(claims: JWT): Promise<string> {
  return encode({ token: claims, secret: authOptions().secret ?? env().authSecret, maxAge: SESSION_MAX_AGE_SECONDS });
}

/** The Cookie header of a browser signed in as this user (claims as the jwt callback writes them). */
export async function sessionCookieHeader(claims: JWT): Promise<string> {
  return `${SESSION_COOKIE}=${await sessionToken(claims)}`;
}
