// Password hashing with bcrypt (bcryptjs, pure JavaScript so nothing native is built). Cost 12 follows the OWASP
// Password Storage Cheat Sheet's guidance of a work factor of at least 10, raised as hardware allows.
import bcrypt from "bcryptjs";
import { passwordSchema } from "@/lib/auth/password-rules";

export const BCRYPT_COST = 12;

export async function hashPassword(password: string): Promise<string> {
  passwordSchema.parse(password);
  return bcrypt.hash(password, BCRYPT_COST);
}

/**
 * A fixed bcrypt hash at BCRYPT_COST (of a throw-away phrase), compared against when there is no stored hash. Fixed
 * rather than computed on first use, so even the first unknown email costs one comparison and not a hash plus one.
 */
export const DUMMY_HASH = "$2b$12$0.RD23Yz5XxiQ5RXTodQmuMWRn9ecgydm3Loz23XG5FvP6tIkTtFy";

/**
 * Compares a password with a stored hash. With no stored hash (unknown email, or an account that only signs in
 * through single sign-on) it still spends one bcrypt comparison at the same cost, so response time does not tell
 * which emails exist.
 */
export async function verifyPassword(password: string, storedHash: string | null | undefined): Promise<boolean> {
  if (!storedHash) {
    await bcrypt.compare(password, DUMMY_HASH);
    return false;
  }
  return bcrypt.compare(password, storedHash);
}
