// Password and email rules, free of server imports so forms can show the same messages the server enforces.
import { z } from "zod";

/** bcrypt only reads the first 72 bytes of a password; longer ones are refused rather than silently truncated. */
export const PASSWORD_MAX_BYTES = 72;
export const PASSWORD_MIN_LENGTH = 10;

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .refine((p) => new TextEncoder().encode(p).length <= PASSWORD_MAX_BYTES, {
    message: `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters).`,
  });

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export const emailSchema = z
  .string()
  .trim()
  .max(254, "An email address has at most 254 characters.")
  .pipe(z.email("Enter an email address like name@example.org."))
  .transform(normaliseEmail);
