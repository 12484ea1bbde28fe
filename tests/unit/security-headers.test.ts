// The policy the proxy sends (W3C Content Security Policy Level 3; OWASP Secure Headers Project for the others).
// Before there was no Content-Security-Policy, frame-ancestors, nosniff or Referrer-Policy at all.
import { describe, expect, it } from "vitest";
import { API_CONTENT_SECURITY_POLICY, COMMON_SECURITY_HEADERS, contentSecurityPolicy, newNonce } from "@/lib/security-headers";

describe("security headers", () => {
  it("allows only scripts carrying this response's nonce, no framing, no plugins, no foreign forms", () => {
    const policy = contentSecurityPolicy({ nonce: "abc123==" });
    const directives = new Map(policy.split("; ").map((d) => [d.split(" ")[0], d]));
    expect(directives.get("script-src")).toBe("script-src 'self' 'nonce-abc123==' 'strict-dynamic'");
    expect(directives.get("frame-ancestors")).toBe("frame-ancestors 'none'");
    expect(directives.get("object-src")).toBe("object-src 'none'");
    expect(directives.get("base-uri")).toBe("base-uri 'self'");
    expect(directives.get("form-action")).toBe("form-action 'self'");
    expect(policy).not.toMatch(/unsafe-eval|script-src[^;]*unsafe-inline/);
    expect(contentSecurityPolicy({ nonce: "n", formTargets: ["https://login.example.edu"] })).toContain("form-action 'self' https://login.example.edu");
    expect(contentSecurityPolicy({ nonce: "n", development: true })).toContain("'unsafe-eval'");
  });

  it("sends nosniff, a referrer policy and DENY framing everywhere, and a locked-down policy on the API", () => {
    expect(COMMON_SECURITY_HEADERS).toEqual({ "X-Content-Type-Options": "nosniff", "Referrer-Policy": "strict-origin-when-cross-origin", "X-Frame-Options": "DENY" });
    expect(API_CONTENT_SECURITY_POLICY).toContain("default-src 'none'");
    expect(API_CONTENT_SECURITY_POLICY).toContain("frame-ancestors 'none'");
  });

  it("makes a fresh 128-bit nonce each time", () => {
    const a = newNonce();
    expect(Buffer.from(a, "base64")).toHaveLength(16);
    expect(newNonce()).not.toBe(a);
  });
});
