// Per-user concurrency of heavy work in this process: a person (or a script with their token) may have only a few
// engine tasks, imports or bulk registrations running at once; more answer 429 with Retry-After at once instead of
// queueing behind their own work and crowding everyone else out of the engine threads.
import { RateLimitedError } from "@/lib/errors";

/** Heavy requests one user may have running at once in one instance. */
export const MAX_HEAVY_PER_USER = 2;
/** What a refused client is told to wait: about one heavy request's time. */
export const HEAVY_RETRY_AFTER_SECONDS = 5;

const shared = globalThis as typeof globalThis & { __layerwiseHeavyRunning?: Map<string, number> };
const running = (shared.__layerwiseHeavyRunning ??= new Map<string, number>());

/** Heavy tasks `userKey` has running now. */
export function heavyRunning(userKey: string): number {
  return running.get(userKey) ?? 0;
}

/**
 * Takes one of the user's heavy slots, or throws RateLimitedError (429) when all of them are taken. Returns the
 * release; call it exactly once (a second call does nothing).
 */
export function acquireHeavySlot(userKey: string, limit = MAX_HEAVY_PER_USER): () => void {
  const now = heavyRunning(userKey);
  if (now >= limit) {
    throw new RateLimitedError(
      `You already have ${now} heavy request${now === 1 ? "" : "s"} (predictions, imports or registrations) running; ` +
        `the limit is ${limit} at once. Try again when one has finished.`,
      HEAVY_RETRY_AFTER_SECONDS,
    );
  }
  running.set(userKey, now + 1);
  let released = false;
  return () => {
    if (released) return;
    released = true;
    const left = heavyRunning(userKey) - 1;
    if (left > 0) running.set(userKey, left);
    else running.delete(userKey);
  };
}

/** Runs `fn` in one of the user's heavy slots (acquireHeavySlot). */
export async function withHeavySlot<T>(userKey: string, fn: () => Promise<T>, limit = MAX_HEAVY_PER_USER): Promise<T> {
  const release = acquireHeavySlot(userKey, limit);
  try {
    return await fn();
  } finally {
    release();
  }
}
