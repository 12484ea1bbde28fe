import { beforeAll, expect, it } from "vitest";
import { hashPassword } from "@/lib/auth/password";
import {
  MAX_FAILURES_PER_ADDRESS,
  MAX_FAILURES_PER_EMAIL,
  SIGN_IN_WINDOW_MS,
  assertSignInAllowed,
  attemptKeys,
  clientAddressFrom,
  recordSignInAttempt,
} from "@/lib/auth/rate-limit";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { RateLimitedError } from "@/lib/errors";
import { describeWithAppDatabase } from "./app-database";
import { makeUser } from "./fixtures";

const PASSWORD = "titration-curve-42"; // invented

describeWithAppDatabase("password sign-in and its rate limit", (t) => {
  let email = "";
  let otherEmail = "";
  beforeAll(async () => {
    const hash = await hashPassword(PASSWORD);
    email = (await makeUser(t.db, "Rosa Ketteler", hash)).email;
    otherEmail = (await makeUser(t.db, "Ivo Brandt", hash)).email;
  });

  it("signs in with the right password, case-insensitively on the email, and not otherwise", async () => {
    const user = await signInWithPassword({ email: email.toUpperCase(), password: PASSWORD }, "10.0.0.1");
    expect(user).toMatchObject({ email, name: "Rosa Ketteler" });
    expect(user).not.toHaveProperty("passwordHash");
    expect(await signInWithPassword({ email, password: "wrong-password" }, "10.0.0.1")).toBeNull();
    expect(await signInWithPassword({ email: "nobody@example.org", password: PASSWORD }, "10.0.0.1")).toBeNull();
    expect(await signInWithPassword({ email: 42, password: PASSWORD }, "10.0.0.1")).toBeNull();
  });

  it(`refuses the ${MAX_FAILURES_PER_ADDRESS + 1}th attempt after ${MAX_FAILURES_PER_ADDRESS} failures from one address, even with the right password`, async () => {
    const address = "10.0.0.2";
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) {
      expect(await signInWithPassword({ email: otherEmail, password: `guess-${i}-xxxxx` }, address)).toBeNull();
    }
    const refused = signInWithPassword({ email: otherEmail, password: PASSWORD }, address);
    await expect(refused).rejects.toBeInstanceOf(RateLimitedError);
    await expect(signInWithPassword({ email: otherEmail, password: PASSWORD }, address)).rejects.toThrow(
      /^Too many failed sign-ins for this email\. Try again in 1[45] minutes\.$/,
    );
    // The same person from another address, and another person from this address, are not locked out.
    expect(await signInWithPassword({ email: otherEmail, password: PASSWORD }, "10.0.0.3")).toMatchObject({ email: otherEmail });
    expect(await signInWithPassword({ email, password: PASSWORD }, address)).toMatchObject({ email });
  });

  it("forgets failures older than the window and failures before a successful sign-in", async () => {
    const key = "window@example.org";
    const address = "10.0.1.1";
    const now = new Date();
    const longAgo = new Date(now.getTime() - SIGN_IN_WINDOW_MS - 1000);
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) await recordSignInAttempt(t.db, key, address, false, longAgo);
    await expect(assertSignInAllowed(t.db, key, address, now)).resolves.toBeUndefined();

    const recent = new Date(now.getTime() - 60_000);
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS - 1; i++) await recordSignInAttempt(t.db, key, address, false, recent);
    await recordSignInAttempt(t.db, key, address, true, new Date(now.getTime() - 30_000));
    await recordSignInAttempt(t.db, key, address, false, new Date(now.getTime() - 20_000));
    await expect(assertSignInAllowed(t.db, key, address, now)).resolves.toBeUndefined();
  });

  it("tells how long to wait: until the oldest counted failure leaves the window", async () => {
    const key = "wait@example.org";
    const address = "10.0.2.1";
    const now = new Date();
    const tenMinutesAgo = new Date(now.getTime() - 10 * 60_000);
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) await recordSignInAttempt(t.db, key, address, false, tenMinutesAgo);
    const error = await assertSignInAllowed(t.db, key, address, now).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(RateLimitedError);
    expect((error as RateLimitedError).retryAfterSeconds).toBeCloseTo(5 * 60, -1);
    expect((error as RateLimitedError).message).toBe("Too many failed sign-ins for this email. Try again in 5 minutes.");
    expect((error as RateLimitedError).status).toBe(429);
  });

  it(`caps failures per email across addresses at ${MAX_FAILURES_PER_EMAIL}, against forged X-Forwarded-For`, async () => {
    const key = "spread@example.org";
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) await recordSignInAttempt(t.db, key, `192.0.2.${i}`, false);
    await expect(assertSignInAllowed(t.db, key, "198.51.100.7")).rejects.toBeInstanceOf(RateLimitedError);
    await expect(assertSignInAllowed(t.db, "someone-else@example.org", "198.51.100.7")).resolves.toBeUndefined();
  });

  it("stores digests, never the email or address", async () => {
    await recordSignInAttempt(t.db, "private@example.org", "203.0.113.9", false);
    const keys = attemptKeys("private@example.org", "203.0.113.9");
    const rows = await t.db.signInAttempt.findMany({ where: { key: { in: [keys.pair, keys.email] } } });
    expect(rows).toHaveLength(2);
    for (const row of rows) {
      expect(row.key).toMatch(/^(pair|email):[0-9a-f]{64}$/);
      expect(row.key).not.toContain("private");
    }
  });
});

it("reads the client address from the last X-Forwarded-For entry", () => {
  expect(clientAddressFrom({ "x-forwarded-for": "198.51.100.1, 10.1.2.3" })).toBe("10.1.2.3");
  expect(clientAddressFrom({ "x-real-ip": "10.9.9.9" })).toBe("10.9.9.9");
  expect(clientAddressFrom({})).toBe("unknown");
});
