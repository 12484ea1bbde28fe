// Response headers that keep other sites from framing, sniffing or scripting our pages. Pure (no Next imports) so the
// proxy and the tests share it.
//   - Content-Security-Policy, nonce-based (W3C CSP Level 3; the "strict CSP" recipe in Next.js's Content Security
//     Policy guide): scripts run only with this response's nonce, and 'strict-dynamic' lets those load Next's chunks.
//     Styles: our CSS files plus nonce'd <style>; style="" attributes (React inline styles, chart SVG) stay allowed.
//   - frame-ancestors 'none' (and the older X-Frame-Options: DENY): no site may frame the app (clickjacking).
//   - X-Content-Type-Options: nosniff; Referrer-Policy: strict-origin-when-cross-origin (no paths or ids leak).

export interface CspOptions {
  nonce: string;
  /** `next dev` needs eval for React's debugging aids; never in production. */
  development?: boolean;
  /** Extra form targets: the single sign-on issuer's origin, reached by a redirect after the sign-in POST. */
  formTargets?: readonly string[];
}

export function contentSecurityPolicy({ nonce, development = false, formTargets = [] }: CspOptions): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ""}`,
    `style-src 'self' 'nonce-${nonce}'${development ? " 'unsafe-inline'" : ""}`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    `form-action 'self'${formTargets.map((t) => ` ${t}`).join("")}`,
    "frame-ancestors 'none'",
  ].join("; ");
}

/** For JSON, CSV and SVG answers of the API: nothing in them may load or run anything, or be framed. */
export const API_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'; sandbox";

export const COMMON_SECURITY_HEADERS: Readonly<Record<string, string>> = {
  "X-Content-Type-Options": "nosniff",
  "Referrer-Policy": "strict-origin-when-cross-origin",
  "X-Frame-Options": "DENY",
};

/** A fresh nonce for one response: 16 random bytes, base64 (CSP nonce-source syntax). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
