// API tokens look like "lw_" + 43 base64url characters (32 random bytes). Only their SHA-256 digest is stored; a
// token is shown once, when it is created. A fast digest is enough here (unlike passwords) because the token
// carries 256 bits of randomness, so there is nothing to guess.
import { createHash, randomBytes } from "node:crypto";

export const API_TOKEN_PREFIX = "lw_";
const TOKEN_PATTERN = /^lw_[A-Za-z0-9_-]{43}$/;

export function newApiToken(): { token: string; tokenHash: string; prefix: string } {
  const token = API_TOKEN_PREFIX + randomBytes(32).toString("base64url");
  return { token, tokenHash: hashApiToken(token), prefix: token.slice(0, 9) };
}

export function hashApiToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function looksLikeApiToken(token: string): boolean {
  return TOKEN_PATTERN.test(token);
}
