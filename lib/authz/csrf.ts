// Cross-site request forgery defence for route handlers reached with the session cookie. The cookie is SameSite=Lax,
// which still lets a top-level cross-site form POST through in some browsers and says nothing about sibling
// subdomains; so a state-changing request carried by the cookie must also prove it came from our own pages:
//   1. `Sec-Fetch-Site: same-origin` (Fetch Metadata, sent by every current browser), or an `Origin` header naming
//      this host (OWASP CSRF Prevention Cheat Sheet, "Verifying Origin With Standard Headers");
//   2. a body in a type a cross-site HTML form cannot produce without a CORS preflight: `application/json`, or the
//      route's own upload type. text/plain, urlencoded and multipart are the "CORS-safelisted" types (Fetch standard,
//      §2.2.2 CORS-safelisted request-header) that a foreign page can send freely.
// Bearer-token requests carry no ambient credential, so they are not checked here.
import { ForbiddenError, UnsupportedMediaTypeError } from "@/lib/errors";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export interface WriteOriginOptions {
  /** Media types this route accepts as its body (default: application/json only). */
  bodyTypes?: readonly string[];
  /** The app's public URL when configured (NEXTAUTH_URL); its host is also accepted as our own. */
  publicUrl?: string;
}

function hostOf(url: string): string | null {
  try {
    return new URL(url).host.toLowerCase();
  } catch {
    return null;
  }
}

function ownHosts(headers: Headers, publicUrl: string | undefined): Set<string> {
  const hosts = new Set<string>();
  for (const name of ["host", "x-forwarded-host"]) {
    const value = headers.get(name)?.split(",")[0]?.trim().toLowerCase();
    if (value) hosts.add(value);
  }
  const configured = publicUrl ? hostOf(publicUrl) : null;
  if (configured) hosts.add(configured);
  return hosts;
}

export function isSameOriginRequest(headers: Headers, publicUrl?: string): boolean {
  const site = headers.get("sec-fetch-site");
  if (site !== null) return site === "same-origin";
  const origin = headers.get("origin");
  if (origin === null || origin === "null") return false;
  const host = hostOf(origin);
  return host !== null && ownHosts(headers, publicUrl).has(host);
}

function mediaType(headers: Headers): string | null {
  const raw = headers.get("content-type");
  return raw === null ? null : (raw.split(";")[0] ?? "").trim().toLowerCase();
}

function hasBody(headers: Headers): boolean {
  return headers.has("content-type") || headers.has("transfer-encoding") || Number(headers.get("content-length") ?? "0") > 0;
}

/** Throws 403 (foreign origin) or 415 (a body type a foreign form could send) for a cookie-carried write. */
export function assertSameOriginWrite(request: Request, options: WriteOriginOptions = {}): void {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return;
  if (!isSameOriginRequest(request.headers, options.publicUrl)) {
    throw new ForbiddenError("This request did not come from a Layerwise page. Scripts should use an API token (Authorization: Bearer …).");
  }
  if (!hasBody(request.headers)) return;
  const allowed = options.bodyTypes ?? ["application/json"];
  const type = mediaType(request.headers);
  if (type === null || !allowed.includes(type)) {
    throw new UnsupportedMediaTypeError(`Send the body as ${allowed.join(" or ")}.`);
  }
}
