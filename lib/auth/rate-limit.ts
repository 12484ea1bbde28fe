// Failed sign-ins slow the guesser down without locking the owner out. Attempts live in the SignInAttempt table, so
// the rule holds across server instances and restarts. Two keys per attempt:
//   - the email with the client address: after FREE_FAILURES_PER_ADDRESS failures each further try waits twice as
//     long as the last (FIRST_DELAY_MS, doubling, at most MAX_DELAY_MS);
//   - the email alone, against guessing spread over many addresses: the same doubling after
//     FREE_FAILURES_PER_ACCOUNT failures, except from an address this account signed in from recently, so the owner
//     at their usual desk is never held up by someone else's guesses. A group lead can lift the delay (liftSignInDelay).
// The attempt is RESERVED (written as a failure, under a per-account lock) before the password is hashed and settled
// afterwards, so parallel guesses cannot all pass the check while the hashes run (OWASP Authentication Cheat Sheet,
// "Protect Against Automated Attacks"; the check-then-act race is CWE-367).
// Keys are SHA-256 digests so the table never holds addresses or emails in clear.
import { createHash } from "node:crypto";
import { type Db, type DbTransaction } from "@/lib/db/client";
import { RateLimitedError } from "@/lib/errors";

export const FREE_FAILURES_PER_ADDRESS = 5;
export const FREE_FAILURES_PER_ACCOUNT = 20;
export const FIRST_DELAY_MS = 30_000;
export const MAX_DELAY_MS = 15 * 60_000;
/** Failures are counted since the last success, and over at most this long. */
export const FAILURE_MEMORY_MS = 24 * 60 * 60_000;
/** An address that signed in to the account this recently is not slowed by failures from elsewhere. */
export const KNOWN_ADDRESS_MS = 30 * 24 * 60 * 60_000;

function digest(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}

export function attemptKeys(email: string, clientAddress: string): { pair: string; account: string } {
  return { pair: `pair:${digest(`${email}\n${clientAddress}`)}`, account: `email:${digest(email)}` };
}

/** How long after the latest failure the next try may run: nothing until `free` failures, then doubling. */
export function delayAfterFailures(failures: number, free: number): number {
  if (failures < free) return 0;
  return Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 2 ** Math.min(failures - free, 30));
}

type Tx = DbTransaction;

async function failuresSinceLastSuccess(tx: Tx, key: string, now: Date): Promise<{ count: number; latest: Date | null }> {
  const memoryStart = new Date(now.getTime() - FAILURE_MEMORY_MS);
  const lastSuccess = await tx.signInAttempt.findFirst({
    where: { key, succeeded: true, createdAt: { gte: memoryStart } },
    orderBy: { createdAt: "desc" },
    select: { createdAt: true },
  });
  const where = { key, succeeded: false, createdAt: { gt: lastSuccess?.createdAt ?? memoryStart } };
  const [count, latest] = await Promise.all([
    tx.signInAttempt.count({ where }),
    tx.signInAttempt.findFirst({ where, orderBy: { createdAt: "desc" }, select: { createdAt: true } }),
  ]);
  return { count, latest: latest?.createdAt ?? null };
}

function waitMs(failures: { count: number; latest: Date | null }, free: number, now: Date): number {
  if (!failures.latest) return 0;
  return failures.latest.getTime() + delayAfterFailures(failures.count, free) - now.getTime();
}

function refusal(wait: number): RateLimitedError {
  const seconds = Math.max(1, Math.ceil(wait / 1000));
  const minutes = Math.ceil(seconds / 60);
  const when = seconds < 60 ? `${seconds} second${seconds === 1 ? "" : "s"}` : `${minutes} minute${minutes === 1 ? "" : "s"}`;
  return new RateLimitedError(`Too many failed sign-ins for this email. Try again in ${when}.`, seconds);
}

export interface SignInReservation {
  ids: string[];
  keys: { pair: string; account: string };
  now: Date;
}

/**
 * Checks the delay for this email and address and, when the attempt may run, records it as a failure at once (one
 * transaction holding a per-account advisory lock, so concurrent attempts are counted one after another).
 * Throws RateLimitedError otherwise. Settle the reservation with settleSignInAttempt after checking the password.
 */
export async function reserveSignInAttempt(db: Db, email: string, clientAddress: string, now = new Date()): Promise<SignInReservation> {
  const keys = attemptKeys(email, clientAddress);
  const ids = await db.$transaction(async (tx) => {
    await tx.$executeRaw`SELECT pg_advisory_xact_lock(hashtext(${keys.account}))`;
    const pair = await failuresSinceLastSuccess(tx, keys.pair, now);
    let wait = waitMs(pair, FREE_FAILURES_PER_ADDRESS, now);
    const knownAddress = await tx.signInAttempt.findFirst({
      where: { key: keys.pair, succeeded: true, createdAt: { gte: new Date(now.getTime() - KNOWN_ADDRESS_MS) } },
      select: { id: true },
    });
    if (!knownAddress) wait = Math.max(wait, waitMs(await failuresSinceLastSuccess(tx, keys.account, now), FREE_FAILURES_PER_ACCOUNT, now));
    if (wait > 0) throw refusal(wait);
    const rows = await tx.signInAttempt.createManyAndReturn({
      data: [
        { key: keys.pair, account: keys.account, succeeded: false, createdAt: now },
        { key: keys.account, account: keys.account, succeeded: false, createdAt: now },
      ],
      select: { id: true },
    });
    return rows.map((r) => r.id);
  });
  return { ids, keys, now };
}

/** Marks a reserved attempt as the success it turned out to be (a failure stays recorded) and prunes old rows. */
export async function settleSignInAttempt(db: Db, reservation: SignInReservation, succeeded: boolean): Promise<void> {
  if (succeeded) await db.signInAttempt.updateMany({ where: { id: { in: reservation.ids } }, data: { succeeded: true } });
  const keys = [reservation.keys.pair, reservation.keys.account];
  const t = reservation.now.getTime();
  await db.signInAttempt.deleteMany({
    where: {
      key: { in: keys },
      OR: [
        { succeeded: false, createdAt: { lt: new Date(t - FAILURE_MEMORY_MS) } },
        { succeeded: true, createdAt: { lt: new Date(t - KNOWN_ADDRESS_MS) } },
      ],
    },
  });
}

/** Forgets this account's recorded failures from every address (a lead's "let them try again"). Returns how many. */
export async function liftSignInDelay(db: Db, email: string): Promise<number> {
  const { count } = await db.signInAttempt.deleteMany({ where: { account: attemptKeys(email, "").account, succeeded: false } });
  return count;
}

function normaliseAddress(address: string): string {
  const trimmed = address.trim().toLowerCase();
  return trimmed.startsWith("::ffff:") && trimmed.includes(".") ? trimmed.slice("::ffff:".length) : trimmed;
}

/**
 * The client's address. The server entry (scripts/serve.mjs) appends the socket's peer to X-Forwarded-For the way
 * a proxy does (Next.js fills the header from the socket when it is absent), so the last entry is always the
 * machine that connected to us. Only when that machine is a configured trusted proxy (LAYERWISE_TRUSTED_PROXIES) is
 * the entry before it believed, and so on leftwards; anything a client wrote itself stays to the left, unread.
 */
export function clientAddressFrom(headers: Record<string, string | string[] | undefined>, trustedProxies: readonly string[] = []): string {
  const raw = headers["x-forwarded-for"];
  const value = Array.isArray(raw) ? raw.join(",") : raw;
  const chain = (value ?? "").split(",").map(normaliseAddress).filter(Boolean);
  const trusted = new Set(trustedProxies.map(normaliseAddress));
  for (let i = chain.length - 1; i >= 0; i--) {
    const hop = chain[i]!;
    if (i === 0 || !trusted.has(hop)) return hop;
  }
  return "unknown";
}
