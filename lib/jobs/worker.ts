/**
 * The background worker that runs inside each app process (started from instrumentation.ts). It claims one job at a
 * time from the durable queue, runs it batch by batch, and between jobs queues inference passes for new outcomes.
 * Stopping hands an unfinished job back to the queue at once; a crash leaves its lease to expire, after which any
 * instance takes the job over and resumes from the last committed batch.
 */
import { randomBytes } from "node:crypto";
import { hostname } from "node:os";
import { type Db } from "@/lib/db/client";
import { runInferenceBatch, scheduleInference } from "./infer";
import { markIntervalFailed, runIntervalBatch } from "./interval";
import { jobFailureMessage } from "./messages";
import { claimJob, finishJob, LEASE_SECONDS, LeaseLostError, releaseJob, renewLease, type ClaimedJob, type JobKind } from "./queue";
import { runRevalidationBatch, type BatchOptions } from "./revalidate";

/** Failures of one job tolerated (each retried from its last committed batch) before it is marked failed. */
export const MAX_TAKEOVERS = 3;

export interface WorkerOptions extends BatchOptions {
  workerId?: string;
  /** Pause when the queue is empty. Default 2 s. */
  idleMs?: number;
  /** How often to look for new outcomes to fit. Default 15 s. */
  scheduleEveryMs?: number;
  leaseSeconds?: number;
  kinds?: readonly JobKind[];
  log?: (message: string) => void;
  /** Base of the retry backoff. Default 1 s. */
  retryBaseMs?: number;
  /** Called after each idle wait (tests count them). */
  onIdle?: () => void;
  onJob?: () => void;
}

export function newWorkerId(): string {
  return `${hostname()}:${process.pid}:${randomBytes(3).toString("hex")}`;
}

const BATCH: Record<JobKind, BatchRunner> = {
  revalidate: runRevalidationBatch,
  infer: (db, job) => runInferenceBatch(db, job),
  interval: runIntervalBatch,
};

/** What a kind of job leaves behind when it is given up (after finishJob marked it failed). */
const GIVEN_UP: Partial<Record<JobKind, (db: Db, job: ClaimedJob) => Promise<void>>> = {
  interval: markIntervalFailed,
};

async function giveUp(db: Db, job: ClaimedJob, error: string): Promise<void> {
  if (await finishJob(db, job, { status: "failed", error })) await GIVEN_UP[job.kind]?.(db, job);
}

export type JobRunResult = "done" | "released" | "lost" | "failed";

/** Failed attempts at one batch (database errors, a crash of the engine) before the job is marked failed. */
export const MAX_BATCH_ATTEMPTS = 4;
/** Wait before the n-th retry: 1 s, 2 s, 4 s … (doubling, capped at 30 s). */
export const retryDelayMs = (attempt: number, baseMs = 1_000) => Math.min(30_000, baseMs * 2 ** (attempt - 1));

export interface RunOptions extends BatchOptions {
  signal?: AbortSignal;
  log?: (m: string) => void;
  leaseSeconds?: number;
  /** Base of the retry backoff (tests shorten it). Default 1 s. */
  retryBaseMs?: number;
  /** Runs one batch in place of the job kind's own (tests put a failing or slow batch here). */
  batch?: BatchRunner;
}

export type BatchRunner = (db: Db, job: ClaimedJob, options: BatchOptions) => Promise<boolean>;

/**
 * Renews the job's lease every third of its length while the job runs, so a long batch (or a slow retry) never lets
 * it lapse; stops when the job ends. The timer does not keep the process alive.
 */
export function keepLease(db: Db, job: Pick<ClaimedJob, "id" | "lockedBy">, leaseSeconds: number, onLost: () => void): () => void {
  const timer = setInterval(() => {
    renewLease(db, job).then((held) => { if (!held) onLost(); }, () => { /* the next tick or the batch's own commit will tell */ });
  }, Math.max(100, (leaseSeconds * 1000) / 3));
  timer.unref();
  return () => clearInterval(timer);
}

/** Runs a claimed job to the end, or until `signal` aborts (the job goes back to the queue with its progress). */
export async function runJob(db: Db, job: ClaimedJob, options: RunOptions = {}): Promise<JobRunResult> {
  const takeovers = (typeof job.payload["takeovers"] === "number" ? job.payload["takeovers"] : 0) + (job.takenOver ? 1 : 0);
  if (job.takenOver) {
    job.payload = { ...job.payload, takeovers };
    options.log?.(`resuming ${job.kind} job ${job.id} at ${job.done}/${job.total} after its worker stopped`);
  }
  if (takeovers > MAX_TAKEOVERS) {
    await giveUp(db, job, `stopped ${takeovers} times before finishing; see the server log`);
    return "failed";
  }
  let lost = false;
  const stopLease = keepLease(db, job, options.leaseSeconds ?? LEASE_SECONDS, () => { lost = true; });
  let attempt = 0;
  try {
    for (;;) {
      if (lost) return "lost";
      if (options.signal?.aborted) {
        await releaseJob(db, job);
        return "released";
      }
      try {
        if (await (options.batch ?? BATCH[job.kind])(db, job, options)) return "done";
        attempt = 0;
      } catch (error) {
        if (error instanceof LeaseLostError) return "lost";
        attempt++;
        const message = jobFailureMessage(error, `${job.kind} job ${job.id}, attempt ${attempt}`);
        if (attempt >= MAX_BATCH_ATTEMPTS) {
          options.log?.(`job ${job.id} failed after ${attempt} attempts: ${message}`);
          await giveUp(db, job, `Stopped after ${attempt} failed attempts: ${message}`);
          return "failed";
        }
        options.log?.(`job ${job.id}: attempt ${attempt} failed (${message}); retrying from its last committed batch`);
        if (options.signal) await sleep(retryDelayMs(attempt, options.retryBaseMs), options.signal);
        else await new Promise((resolve) => setTimeout(resolve, retryDelayMs(attempt, options.retryBaseMs)));
      }
    }
  } finally {
    stopLease();
  }
}

/** Waits `ms`, or less if `signal` aborts; leaves no listener on the signal either way (an idle worker waits often). */
export function sleep(ms: number, signal: AbortSignal): Promise<void> {
  return new Promise<void>((resolve) => {
    if (signal.aborted) return resolve();
    const onAbort = () => { clearTimeout(timer); resolve(); };
    const timer = setTimeout(() => { signal.removeEventListener("abort", onAbort); resolve(); }, ms);
    signal.addEventListener("abort", onAbort, { once: true });
  });
}

export interface RunningWorker {
  id: string;
  stop: () => Promise<void>;
  /** Ends an idle wait now (a job was just queued in this process). */
  wake: () => void;
}

export function startWorker(getDb: () => Promise<Db>, options: WorkerOptions = {}): RunningWorker {
  const id = options.workerId ?? newWorkerId();
  const controller = new AbortController();
  const log = options.log ?? ((m: string) => console.info(`[layerwise jobs] ${m}`));
  let woken = false;
  let endNap: (() => void) | null = null;
  const nap = (ms: number) => new Promise<void>((resolve) => {
    if (woken) return resolve();
    endNap = resolve;
    void sleep(ms, controller.signal).then(resolve);
  }).finally(() => { endNap = null; woken = false; });
  const loop = async () => {
    let lastSchedule = 0;
    while (!controller.signal.aborted) {
      try {
        const db = await getDb();
        if (Date.now() - lastSchedule >= (options.scheduleEveryMs ?? 15_000)) {
          lastSchedule = Date.now();
          await scheduleInference(db);
        }
        woken = false;
        const job = await claimJob(db, id, { kinds: options.kinds, leaseSeconds: options.leaseSeconds });
        if (job) {
          await runJob(db, job, { ...options, signal: controller.signal, log });
          options.onJob?.();
          continue;
        }
      } catch (error) {
        log(`worker ${id}: ${error instanceof Error ? error.message : String(error)}`);
      }
      await nap(options.idleMs ?? 2_000);
      options.onIdle?.();
    }
  };
  const running = loop();
  return {
    id,
    stop: async () => {
      controller.abort();
      await running;
    },
    wake: () => {
      woken = true;
      endNap?.();
    },
  };
}

/**
 * Runs queued jobs (and inference passes for new outcomes) in this process until nothing is left; for scripts such
 * as the demo seed, and for tests. Returns the number of jobs run.
 */
export async function drainQueue(db: Db, options: BatchOptions & { workerId?: string; kinds?: readonly JobKind[]; schedule?: boolean; maxJobs?: number; retryBaseMs?: number } = {}): Promise<number> {
  const id = options.workerId ?? newWorkerId();
  let ran = 0;
  for (;;) {
    if (options.schedule !== false) await scheduleInference(db);
    const job = await claimJob(db, id, { kinds: options.kinds });
    if (!job) return ran;
    await runJob(db, job, { ...options, retryBaseMs: options.retryBaseMs ?? 0 });
    ran++;
    if (ran >= (options.maxJobs ?? 1000)) return ran;
  }
}
