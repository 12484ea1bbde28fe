import bcrypt from "bcryptjs";
import { describe, expect, it } from "vitest";
import { BCRYPT_COST, hashPassword, verifyPassword } from "@/lib/auth/password";
import { PASSWORD_MAX_BYTES, emailSchema } from "@/lib/auth/password-rules";

describe("password hashing", () => {
  const password = "correct horse battery"; // invented

  it("stores a salted bcrypt hash at cost 12 that verifies only the same password", async () => {
    const hash = await hashPassword(password);
    // Modular crypt format $2b$<cost>$<22-char salt><31-char hash> (bcrypt, Provos & Mazières 1999; OpenBSD crypt(3)).
    expect(hash).toMatch(/^\$2[aby]\$12\$[./A-Za-z0-9]{53}$/);
    expect(bcrypt.getRounds(hash)).toBe(BCRYPT_COST);
    expect(hash).not.toContain(password);
    await expect(verifyPassword(password, hash)).resolves.toBe(true);
    await expect(verifyPassword(`${password} `, hash)).resolves.toBe(false);
    await expect(verifyPassword("Correct horse battery", hash)).resolves.toBe(false);
  });

  it("salts every hash, so equal passwords do not give equal hashes", async () => {
    const [a, b] = await Promise.all([hashPassword(password), hashPassword(password)]);
    expect(a).not.toBe(b);
    await expect(verifyPassword(password, b)).resolves.toBe(true);
  });

  it("answers false, after a full comparison, when there is no stored hash", async () => {
    await expect(verifyPassword(password, null)).resolves.toBe(false);
    await expect(verifyPassword("", undefined)).resolves.toBe(false);
  });

  it("refuses passwords bcrypt would truncate or that are too short, with the message the form shows", async () => {
    await expect(hashPassword("short")).rejects.toThrow("Use at least 10 characters.");
    // 37 two-byte letters = 74 bytes: over bcrypt's 72-byte input limit although only 37 characters long.
    const long = "éàüöçñ".repeat(6) + "é";
    expect(new TextEncoder().encode(long).length).toBeGreaterThan(PASSWORD_MAX_BYTES);
    await expect(hashPassword(long)).rejects.toThrow("Use at most 72 bytes");
    await expect(hashPassword("éàüöçñ".repeat(6))).resolves.toMatch(/^\$2/);
  });

  it("normalises emails so sign-in is case-insensitive and refuses malformed ones", () => {
    expect(emailSchema.parse("  Ana.Quintero@Example.ORG ")).toBe("ana.quintero@example.org");
    const bad = emailSchema.safeParse("not-an-email");
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.message).toBe("Enter an email address like name@example.org.");
  });
});
