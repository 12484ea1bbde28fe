// Password and email rules, free of server imports so forms can show the same messages the server enforces. Client
// components that only need the length import it from password-limits.ts and leave the dictionary out of the bundle.
import { z } from "zod";
import { isCommonPassword } from "@/lib/auth/common-passwords";
import { PASSWORD_MIN_LENGTH } from "@/lib/auth/password-limits";

export { PASSWORD_MIN_LENGTH };

/** bcrypt only reads the first 72 bytes of a password; longer ones are refused rather than silently truncated. */
export const PASSWORD_MAX_BYTES = 72;

export const COMMON_PASSWORD_MESSAGE = "This password is among the most used ones (or a simple pattern); choose something less guessable.";
export const EMAIL_PASSWORD_MESSAGE = "Do not use your email address (or its name part) as the password.";

const KEYBOARD_ROWS = ["1234567890", "qwertyuiop", "asdfghjkl", "zxcvbnm", "0987654321", "poiuytrewq"];

/** Runs and repeats (NIST SP 800-63B §5.1.1.2: refuse "repetitive or sequential characters" and dictionary words). */
function isSimplePattern(lower: string): boolean {
  const chars = [...lower];
  if (new Set(chars).size <= 2) return true; // "          ", "aaaaaaaaaa", "abababababab"
  const steps = chars.slice(1).map((c, i) => c.codePointAt(0)! - chars[i]!.codePointAt(0)!);
  if (steps.every((d) => d === steps[0] && Math.abs(d) === 1)) return true; // "abcdefghij", "9876543210"
  const core = lower.replace(/[\d!?.]+$/, "");
  for (const candidate of [lower, core]) if (candidate.length >= 6 && KEYBOARD_ROWS.some((row) => row.includes(candidate))) return true;
  return /^(p[a@]ssw[o0]rd|qwerty|letmein|welcome|admin)[\d!?.]*$/.test(lower);
}

/** Why a new password is too easy to guess, or null. `email` is the account's own address, when known. */
export function weakPasswordReason(password: string, email?: string): string | null {
  const lower = password.trim().toLowerCase();
  if (isCommonPassword(lower) || isSimplePattern(lower)) return COMMON_PASSWORD_MESSAGE;
  if (email) {
    const address = email.trim().toLowerCase();
    const local = address.split("@")[0] ?? "";
    const compact = lower.replace(/[^\p{L}\p{N}]/gu, "");
    if (lower.includes(address) || (local.length >= 4 && compact.includes(local.replace(/[^\p{L}\p{N}]/gu, "")))) return EMAIL_PASSWORD_MESSAGE;
  }
  return null;
}

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .refine((p) => new TextEncoder().encode(p).length <= PASSWORD_MAX_BYTES, {
    message: `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters).`,
  })
  .refine((p) => weakPasswordReason(p) === null, { message: COMMON_PASSWORD_MESSAGE });

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export const emailSchema = z
  .string()
  .trim()
  .max(254, "An email address has at most 254 characters.")
  .pipe(z.email("Enter an email address like name@example.org."))
  .transform(normaliseEmail);
