// New passwords are checked against common passwords, simple patterns and the account's own email, as NIST SP 800-63B
// §5.1.1.2 asks ("passwords obtained from previous breach corpuses", "dictionary words", "repetitive or sequential
// characters", "context-specific words, such as ... the username"). Before, only the length was checked: the four
// reported passwords below were all accepted.
import { describe, expect, it } from "vitest";
import { COMMON_PASSWORD_MESSAGE, EMAIL_PASSWORD_MESSAGE, passwordSchema, weakPasswordReason } from "@/lib/auth/password-rules";
import { newAccountSchema } from "@/lib/groups/schemas";

const account = (password: string, email = "nadia.velasquez@example.org") =>
  newAccountSchema.safeParse({ name: "Nadia Velasquez", email, password, confirmPassword: password });

describe("new passwords", () => {
  it("refuses the reported ones: 1234567890, password12, qwertyuiop, ten spaces and the user's own email", () => {
    for (const weak of ["1234567890", "password12", "qwertyuiop", " ".repeat(10)]) {
      expect(weakPasswordReason(weak)).toBe(COMMON_PASSWORD_MESSAGE);
      expect(passwordSchema.safeParse(weak).success).toBe(false);
    }
    const own = account("nadia.velasquez@example.org");
    expect(own.success).toBe(false);
    expect(own.error?.issues.map((i) => i.message)).toContain(EMAIL_PASSWORD_MESSAGE);
  });

  it("refuses common families: keyboard rows, runs, repeats, 'password' and 'qwerty' with digits, the email's name part", () => {
    // Common practice: these are the shapes that dominate published breached-password lists.
    for (const weak of ["qwertyuiop", "QwertyUiop1", "asdfghjkl1", "abcdefghij", "9876543210", "aaaaaaaaaaaa", "abababababab", "P@ssw0rd2024", "qwerty2024!", "Password1234"]) {
      expect(weakPasswordReason(weak), weak).toBe(COMMON_PASSWORD_MESSAGE);
    }
    expect(weakPasswordReason("nadiavelasquez77", "nadia.velasquez@example.org")).toBe(EMAIL_PASSWORD_MESSAGE);
  });

  it("refuses common passwords the patterns do not describe, from the shipped breached-password dictionary", () => {
    // From memory: all near the top of the published breached-password frequency lists (SecLists'
    // 10-million-password-list-top-10000, from the RockYou and similar leaks); none is a run, a row or a repeat.
    for (const weak of ["basketball", "Manchester", "harrypotter", "strawberry", "1234554321", "123qweasdzxc"]) {
      expect(weakPasswordReason(weak), weak).toBe(COMMON_PASSWORD_MESSAGE);
      expect(passwordSchema.safeParse(weak).success, weak).toBe(false);
    }
  });

  it("accepts ordinary long passphrases and a long random one", () => {
    for (const good of ["titration-curve-42", "separatory funnel at dawn", "brine wash x3, then MgSO4", "vq7R-2mLx-Tz9e-hKp4"]) {
      expect(weakPasswordReason(good, "nadia.velasquez@example.org"), good).toBeNull();
      expect(account(good).success, good).toBe(true);
    }
  });
});
