import bcrypt from "bcryptjs";
import { beforeAll, expect, it } from "vitest";
import { BCRYPT_COST, DUMMY_HASH, hashPassword } from "@/lib/auth/password";
import {
  FIRST_DELAY_MS,
  FREE_FAILURES_PER_ACCOUNT,
  FREE_FAILURES_PER_ADDRESS,
  MAX_DELAY_MS,
  attemptKeys,
  clientAddressFrom,
  delayAfterFailures,
  liftSignInDelay,
  reserveSignInAttempt,
  settleSignInAttempt,
} from "@/lib/auth/rate-limit";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { type Db } from "@/lib/db/client";
import { RateLimitedError } from "@/lib/errors";
import { describeWithAppDatabase } from "./app-database";
import { makeUser } from "./fixtures";

const PASSWORD = "titration-curve-42"; // invented

/** One attempt at a chosen moment, through the same reserve/settle pair signInWithPassword uses. */
async function attempt(db: Db, email: string, address: string, at: Date, succeeded = false): Promise<void> {
  await settleSignInAttempt(db, await reserveSignInAttempt(db, email, address, at), succeeded);
}

describeWithAppDatabase("password sign-in and its delays", (t) => {
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

  it(`holds back the try after ${FREE_FAILURES_PER_ADDRESS} failures from one address, even with the right password, for that pair only`, async () => {
    const address = "10.0.0.2";
    for (let i = 0; i < FREE_FAILURES_PER_ADDRESS; i++) {
      expect(await signInWithPassword({ email: otherEmail, password: `guess-${i}-xxxxx` }, address)).toBeNull();
    }
    await expect(signInWithPassword({ email: otherEmail, password: PASSWORD }, address)).rejects.toThrow(
      /^Too many failed sign-ins for this email\. Try again in [1-3]?[0-9] seconds\.$/,
    );
    // The same person from another address, and another person from this address, go on as usual.
    expect(await signInWithPassword({ email: otherEmail, password: PASSWORD }, "10.0.0.3")).toMatchObject({ email: otherEmail });
    expect(await signInWithPassword({ email, password: PASSWORD }, address)).toMatchObject({ email });
  });

  // The defect: the count was read, bcrypt ran (~250 ms), then the attempt was written, so 10 of 20 parallel wrong
  // passwords were checked against a limit of 5.
  it(`checks at most ${FREE_FAILURES_PER_ADDRESS} of 50 parallel wrong passwords; the rest are held back unhashed`, async () => {
    const victim = (await makeUser(t.db, "Parallel Target", await hashPassword(PASSWORD))).email;
    const results = await Promise.allSettled(
      Array.from({ length: 50 }, (_, i) => signInWithPassword({ email: victim, password: `parallel-guess-${i}` }, "10.0.9.9")),
    );
    const checked = results.filter((r) => r.status === "fulfilled");
    const held = results.filter((r) => r.status === "rejected" && r.reason instanceof RateLimitedError);
    expect(checked.length).toBeLessThanOrEqual(FREE_FAILURES_PER_ADDRESS);
    expect(checked.length + held.length).toBe(50);
    const keys = attemptKeys(victim, "10.0.9.9");
    expect(await t.db.signInAttempt.count({ where: { key: keys.pair } })).toBe(checked.length);
  });

  it("doubles the wait after each further failure, up to the ceiling", async () => {
    expect(delayAfterFailures(FREE_FAILURES_PER_ADDRESS - 1, FREE_FAILURES_PER_ADDRESS)).toBe(0);
    expect(delayAfterFailures(FREE_FAILURES_PER_ADDRESS, FREE_FAILURES_PER_ADDRESS)).toBe(FIRST_DELAY_MS);
    expect(delayAfterFailures(FREE_FAILURES_PER_ADDRESS + 1, FREE_FAILURES_PER_ADDRESS)).toBe(2 * FIRST_DELAY_MS);
    expect(delayAfterFailures(FREE_FAILURES_PER_ADDRESS + 3, FREE_FAILURES_PER_ADDRESS)).toBe(8 * FIRST_DELAY_MS);
    expect(delayAfterFailures(1000, FREE_FAILURES_PER_ADDRESS)).toBe(MAX_DELAY_MS);

    const key = "doubling@example.org";
    const address = "10.0.3.1";
    const t0 = Date.now() - 60 * 60_000;
    for (let i = 0; i < FREE_FAILURES_PER_ADDRESS; i++) await attempt(t.db, key, address, new Date(t0 + i));
    const last = t0 + FREE_FAILURES_PER_ADDRESS - 1;
    await expect(reserveSignInAttempt(t.db, key, address, new Date(last + FIRST_DELAY_MS - 1000))).rejects.toBeInstanceOf(RateLimitedError);
    await attempt(t.db, key, address, new Date(last + FIRST_DELAY_MS + 1)); // the sixth failure, after the first wait
    const sixth = last + FIRST_DELAY_MS + 1;
    const early = await reserveSignInAttempt(t.db, key, address, new Date(sixth + 2 * FIRST_DELAY_MS - 1000)).catch((e: unknown) => e);
    expect(early).toBeInstanceOf(RateLimitedError);
    expect((early as RateLimitedError).retryAfterSeconds).toBe(1);
    await expect(reserveSignInAttempt(t.db, key, address, new Date(sixth + 2 * FIRST_DELAY_MS + 1))).resolves.toBeDefined();
  });

  it("forgets failures before a successful sign-in", async () => {
    const key = "window@example.org";
    const address = "10.0.1.1";
    const t0 = Date.now() - 60 * 60_000;
    for (let i = 0; i < FREE_FAILURES_PER_ADDRESS - 1; i++) await attempt(t.db, key, address, new Date(t0 + i));
    await attempt(t.db, key, address, new Date(t0 + 100), true);
    for (let i = 0; i < FREE_FAILURES_PER_ADDRESS - 1; i++) await attempt(t.db, key, address, new Date(t0 + 200 + i));
    await expect(reserveSignInAttempt(t.db, key, address, new Date(t0 + 300))).resolves.toBeDefined();
  });

  // The defect: with a forged X-Forwarded-For per guess, 30 guesses locked the real owner out from every address for
  // 15 minutes, repeatable by anyone.
  it("slows guessing spread over many addresses, but not the owner at an address they signed in from, and a lead can lift it", async () => {
    const owner = "spread@example.org";
    const home = "198.51.100.20";
    const t0 = Date.now() - 60 * 60_000;
    await attempt(t.db, owner, home, new Date(t0), true);
    for (let i = 0; i < FREE_FAILURES_PER_ACCOUNT; i++) await attempt(t.db, owner, `192.0.2.${i}`, new Date(t0 + 1000 + i));
    const soon = new Date(t0 + 2000);
    await expect(reserveSignInAttempt(t.db, owner, "203.0.113.77", soon)).rejects.toBeInstanceOf(RateLimitedError);
    await expect(reserveSignInAttempt(t.db, owner, home, soon)).resolves.toBeDefined();
    await expect(reserveSignInAttempt(t.db, "someone-else@example.org", "203.0.113.77", soon)).resolves.toBeDefined();
    expect(await liftSignInDelay(t.db, owner)).toBeGreaterThanOrEqual(FREE_FAILURES_PER_ACCOUNT);
    await expect(reserveSignInAttempt(t.db, owner, "203.0.113.77", new Date(t0 + 3000))).resolves.toBeDefined();
  });

  it("stores digests, never the email or address", async () => {
    await attempt(t.db, "private@example.org", "203.0.113.9", new Date());
    const keys = attemptKeys("private@example.org", "203.0.113.9");
    const rows = await t.db.signInAttempt.findMany({ where: { key: { in: [keys.pair, keys.account] } } });
    expect(rows).toHaveLength(2);
    for (const row of rows) {
      expect(row.key).toMatch(/^(pair|email):[0-9a-f]{64}$/);
      expect(`${row.key} ${row.account}`).not.toContain("private");
    }
  });
});

it("compares an unknown email against a hash of the same bcrypt cost as real ones", () => {
  expect(bcrypt.getRounds(DUMMY_HASH)).toBe(BCRYPT_COST);
});

// Before: the last X-Forwarded-For entry was taken as sent by the client, so a forged header named any address.
// The server entry appends the connecting address (as a proxy would), so only entries right of a trusted proxy count.
it("reads the client address from X-Forwarded-For only through configured trusted proxies", () => {
  expect(clientAddressFrom({ "x-forwarded-for": "198.51.100.1, 10.1.2.3" })).toBe("10.1.2.3");
  expect(clientAddressFrom({ "x-forwarded-for": "198.51.100.1, 10.1.2.3" }, ["127.0.0.1"])).toBe("10.1.2.3");
  expect(clientAddressFrom({ "x-forwarded-for": "6.6.6.6, 198.51.100.1, 127.0.0.1" }, ["127.0.0.1"])).toBe("198.51.100.1");
  expect(clientAddressFrom({ "x-forwarded-for": "6.6.6.6, 198.51.100.1, 10.0.0.5, ::ffff:127.0.0.1" }, ["127.0.0.1", "10.0.0.5"])).toBe("198.51.100.1");
  expect(clientAddressFrom({ "x-forwarded-for": "127.0.0.1" }, ["127.0.0.1"])).toBe("127.0.0.1");
  expect(clientAddressFrom({ "x-real-ip": "10.9.9.9" })).toBe("unknown");
  expect(clientAddressFrom({})).toBe("unknown");
});
