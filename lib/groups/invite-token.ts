// Invite links carry 32 random bytes; only their SHA-256 digest is stored, so a leaked database opens no group.
import { createHash, randomBytes } from "node:crypto";

const INVITE_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

export function newInviteToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashInviteToken(token) };
}

export function hashInviteToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function looksLikeInviteToken(token: string): boolean {
  return INVITE_TOKEN_PATTERN.test(token);
}

export function invitePath(token: string): string {
  return `/invite/${token}`;
}
