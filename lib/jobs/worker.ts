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
import { claimJob, finishJob, LeaseLostError, releaseJob, type ClaimedJob, type JobKind } from "./queue";
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
}

export function newWorkerId(): string {
  return `${hostname()}:${process.pid}:${randomBytes(3).toString("hex")}`;
}

const BATCH: Record<JobKind, (db: Db, job: ClaimedJob, options: BatchOptions) => Promise<boolean>> = {
  revalidate: runRevalidationBatch,
  infer: (db, job) => runInferenceBatch(db, job),
};

export type JobRunResult = "done" | "released" | "lost" | "failed";

/** Runs a claimed job to the end, or until `signal` aborts (the job goes back to the queue with its progress). */
export async function runJob(db: Db, job: ClaimedJob, options: BatchOptions & { signal?: AbortSignal; log?: (m: string) => void } = {}): Promise<JobRunResult> {
  const takeovers = (typeof job.payload["takeovers"] === "number" ? job.payload["takeovers"] : 0) + (job.takenOver ? 1 : 0);
  if (job.takenOver) {
    job.payload = { ...job.payload, takeovers };
    options.log?.(`resuming ${job.kind} job ${job.id} at ${job.done}/${job.total} after its worker stopped`);
  }
  if (takeovers > MAX_TAKEOVERS) {
    await finishJob(db, job, { status: "failed", error: `stopped ${takeovers} times before finishing; see the server log` });
    return "failed";
  }
  try {
    for (;;) {
      if (options.signal?.aborted) {
        await releaseJob(db, job);
        return "released";
      }
      if (await BATCH[job.kind](db, job, options)) return "done";
    }
  } catch (error) {
    if (error instanceof LeaseLostError) return "lost";
    options.log?.(`job ${job.id} failed: ${error instanceof Error ? error.message : String(error)}`);
    await finishJob(db, job, { status: "failed", error: error instanceof Error ? error.message.slice(0, 500) : "unexpected error" });
    return "failed";
  }
}

const sleep = (ms: number, signal: AbortSignal) =>
  new Promise<void>((resolve) => {
    const timer = setTimeout(resolve, ms);
    signal.addEventListener("abort", () => { clearTimeout(timer); resolve(); }, { once: true });
  });

export interface RunningWorker {
  id: string;
  stop: () => Promise<void>;
}

export function startWorker(getDb: () => Promise<Db>, options: WorkerOptions = {}): RunningWorker {
  const id = options.workerId ?? newWorkerId();
  const controller = new AbortController();
  const log = options.log ?? ((m: string) => console.info(`[layerwise jobs] ${m}`));
  const loop = async () => {
    let lastSchedule = 0;
    while (!controller.signal.aborted) {
      try {
        const db = await getDb();
        if (Date.now() - lastSchedule >= (options.scheduleEveryMs ?? 15_000)) {
          lastSchedule = Date.now();
          await scheduleInference(db);
        }
        const job = await claimJob(db, id, { kinds: options.kinds, leaseSeconds: options.leaseSeconds });
        if (job) {
          await runJob(db, job, { ...options, signal: controller.signal, log });
          continue;
        }
      } catch (error) {
        log(`worker ${id}: ${error instanceof Error ? error.message : String(error)}`);
      }
      await sleep(options.idleMs ?? 2_000, controller.signal);
    }
  };
  const running = loop();
  return {
    id,
    stop: async () => {
      controller.abort();
      await running;
    },
  };
}

/**
 * Runs queued jobs (and inference passes for new outcomes) in this process until nothing is left; for scripts such
 * as the demo seed, and for tests. Returns the number of jobs run.
 */
export async function drainQueue(db: Db, options: BatchOptions & { workerId?: string; kinds?: readonly JobKind[]; schedule?: boolean; maxJobs?: number } = {}): Promise<number> {
  const id = options.workerId ?? newWorkerId();
  let ran = 0;
  for (;;) {
    if (options.schedule !== false) await scheduleInference(db);
    const job = await claimJob(db, id, { kinds: options.kinds });
    if (!job) return ran;
    await runJob(db, job, options);
    ran++;
    if (ran >= (options.maxJobs ?? 1000)) return ran;
  }
}
