// Failed sign-ins are counted in the SignInAttempt table, so the limit holds across server instances and restarts.
// Two keys per attempt: the email with the client address (the usual lock-out), and the email alone with a higher
// ceiling, because a client talking to `next start` directly can put any address in X-Forwarded-For.
// Keys are SHA-256 digests so the table never holds addresses or emails in clear.
import { createHash } from "node:crypto";
import { type PrismaClient } from "@/generated/prisma/client";
import { RateLimitedError } from "@/lib/errors";

type Db = Pick<PrismaClient, "signInAttempt">;

export const SIGN_IN_WINDOW_MS = 15 * 60_000;
export const MAX_FAILURES_PER_ADDRESS = 5;
export const MAX_FAILURES_PER_EMAIL = 30;
/** Rows older than this are deleted when the same key fails again. */
const KEEP_MS = 24 * 60 * 60_000;

function digest(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}

export function attemptKeys(email: string, clientAddress: string): { pair: string; email: string } {
  return { pair: `pair:${digest(`${email}\n${clientAddress}`)}`, email: `email:${digest(email)}` };
}

/** Failures for a key inside the window that came after its last success. */
async function recentFailures(db: Db, key: string, now: Date): Promise<{ count: number; oldest: Date | null }> {
  const windowStart = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
  const lastSuccess = await db.signInAttempt.findFirst({
    where: { key, succeeded: true, createdAt: { gte: windowStart } },
    orderBy: { createdAt: "desc" },
    select: { createdAt: true },
  });
  const since = lastSuccess ? lastSuccess.createdAt : windowStart;
  const where = { key, succeeded: false, createdAt: { gt: since } };
  const [count, oldest] = await Promise.all([
    db.signInAttempt.count({ where }),
    db.signInAttempt.findFirst({ where, orderBy: { createdAt: "asc" }, select: { createdAt: true } }),
  ]);
  return { count, oldest: oldest?.createdAt ?? null };
}

/** Throws RateLimitedError when this email (from this address, or overall) has failed too often recently. */
export async function assertSignInAllowed(db: Db, email: string, clientAddress: string, now = new Date()): Promise<void> {
  const keys = attemptKeys(email, clientAddress);
  const checks = [
    { key: keys.pair, max: MAX_FAILURES_PER_ADDRESS },
    { key: keys.email, max: MAX_FAILURES_PER_EMAIL },
  ];
  for (const { key, max } of checks) {
    const { count, oldest } = await recentFailures(db, key, now);
    if (count >= max) {
      const freeAt = (oldest ?? now).getTime() + SIGN_IN_WINDOW_MS;
      const retryAfterSeconds = Math.max(1, Math.ceil((freeAt - now.getTime()) / 1000));
      const minutes = Math.ceil(retryAfterSeconds / 60);
      throw new RateLimitedError(
        `Too many failed sign-ins for this email. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`,
        retryAfterSeconds,
      );
    }
  }
}

export async function recordSignInAttempt(
  db: Db,
  email: string,
  clientAddress: string,
  succeeded: boolean,
  now = new Date(),
): Promise<void> {
  const keys = attemptKeys(email, clientAddress);
  await db.signInAttempt.createMany({
    data: [
      { key: keys.pair, succeeded, createdAt: now },
      { key: keys.email, succeeded, createdAt: now },
    ],
  });
  if (!succeeded) {
    const cutoff = new Date(now.getTime() - KEEP_MS);
    await db.signInAttempt.deleteMany({ where: { key: { in: [keys.pair, keys.email] }, createdAt: { lt: cutoff } } });
  }
}

/**
 * The client address as the nearest proxy reports it: the last X-Forwarded-For entry (Next.js fills the header
 * from the socket when it is absent). Behind several proxies that is the outermost proxy's view, which is the
 * conservative choice; the per-email ceiling above covers clients that forge the header.
 */
export function clientAddressFrom(headers: Record<string, string | string[] | undefined>): string {
  const raw = headers["x-forwarded-for"] ?? headers["x-real-ip"];
  const value = Array.isArray(raw) ? raw.join(",") : raw;
  const last = value?.split(",").map((s) => s.trim()).filter(Boolean).pop();
  return last ?? "unknown";
}
