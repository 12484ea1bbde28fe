// Runs before every request (Next.js 16 "proxy", the former middleware): security headers on every answer, and for
// pages a Content-Security-Policy with a fresh nonce, passed to Next on the request headers so that it puts the nonce
// on its own scripts (lib/security-headers.ts says why each header is there).
import { NextResponse, type NextRequest } from "next/server";
import { API_CONTENT_SECURITY_POLICY, COMMON_SECURITY_HEADERS, contentSecurityPolicy, newNonce } from "@/lib/security-headers";

// OIDC_ISSUER and NODE_ENV only shape the policy; they are validated by lib/env.ts when the app itself reads them.
// Reading env() here would load the whole settings module (and the auth secret file) on every request.
// eslint-disable-next-line no-restricted-properties
const issuer = process.env.OIDC_ISSUER;
// eslint-disable-next-line no-restricted-properties
const development = process.env.NODE_ENV === "development";

function origin(url: string | undefined): string[] {
  try {
    return url ? [new URL(url).origin] : [];
  } catch {
    return [];
  }
}

export function proxy(request: NextRequest): NextResponse {
  const isApi = request.nextUrl.pathname.startsWith("/api/");
  let response: NextResponse;
  if (isApi) {
    response = NextResponse.next();
    response.headers.set("Content-Security-Policy", API_CONTENT_SECURITY_POLICY);
  } else {
    const nonce = newNonce();
    const policy = contentSecurityPolicy({ nonce, development, formTargets: origin(issuer) });
    const requestHeaders = new Headers(request.headers);
    requestHeaders.set("x-nonce", nonce);
    requestHeaders.set("Content-Security-Policy", policy);
    response = NextResponse.next({ request: { headers: requestHeaders } });
    response.headers.set("Content-Security-Policy", policy);
  }
  for (const [name, value] of Object.entries(COMMON_SECURITY_HEADERS)) response.headers.set(name, value);
  return response;
}

export const config = {
  // Everything but Next's own static files (hashed, immutable, and not HTML).
  matcher: [{ source: "/((?!_next/static|_next/image|favicon.ico).*)" }],
};
