// Password hashing with bcrypt (bcryptjs, pure JavaScript so nothing native is built). Cost 12 follows the OWASP
// Password Storage Cheat Sheet's guidance of a work factor of at least 10, raised as hardware allows.
import bcrypt from "bcryptjs";
import { passwordSchema } from "@/lib/auth/password-rules";

export const BCRYPT_COST = 12;

export async function hashPassword(password: string): Promise<string> {
  passwordSchema.parse(password);
  return bcrypt.hash(password, BCRYPT_COST);
}

let dummyHash: Promise<string> | undefined;

/**
 * Compares a password with a stored hash. With no stored hash (unknown email, or an account that only signs in
 * through single sign-on) it still spends one bcrypt comparison, so response time does not tell which emails exist.
 */
export async function verifyPassword(password: string, storedHash: string | null | undefined): Promise<boolean> {
  if (!storedHash) {
    dummyHash ??= bcrypt.hash("layerwise-timing-equaliser", BCRYPT_COST);
    await bcrypt.compare(password, await dummyHash);
    return false;
  }
  return bcrypt.compare(password, storedHash);
}
