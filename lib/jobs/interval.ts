/**
 * The Monte Carlo interval of a saved version, computed after the save. A save (lib/workups/service.ts) validates,
 * stores the point prediction and queues one interval job for the version it wrote, in the same transaction, with
 * the workup's intervalState "pending". The job predicts the workup again with its draws (repredict.ts, the path of
 * the re-validation) and writes the prediction, the judgement of any outcome and intervalState "ready" together,
 * compare-and-set on the version and row stamp it read:
 *  - the workup saved again meanwhile: the write is discarded, and the newer version's own job does the work;
 *  - an outcome reported meanwhile at the same version: planned again from the new outcome;
 *  - a version that already has its interval (a re-validation wrote one first): nothing to do.
 * After MAX_BATCH_ATTEMPTS failed tries (worker.ts) the version's intervalState becomes "failed".
 */
import { type Db, type DbTransaction } from "@/lib/db/client";
import { commitProgress, finishJob, LeaseLostError, type ClaimedJob } from "./queue";
import { applyRepredictions, planRepredictions } from "./repredict";
import { type BatchOptions } from "./revalidate";

type Client = Db | DbTransaction;

export interface IntervalPayload {
  workupId: string;
  version: number;
  draws: number;
  /** How the job ended: written, or nothing to do (a newer version, or the interval already there). */
  result?: "written" | "superseded" | "already_ready";
}

export function readIntervalPayload(payload: Record<string, unknown>): IntervalPayload | null {
  const { workupId, version, draws } = payload;
  if (typeof workupId !== "string" || typeof version !== "number" || typeof draws !== "number") return null;
  return { workupId, version, draws };
}

/** Queues the interval of `version` (call it inside the transaction that writes the version). Returns the job id. */
export async function enqueueInterval(tx: Client, groupId: string, target: { workupId: string; version: number; draws: number }): Promise<string> {
  const payload: IntervalPayload = { workupId: target.workupId, version: target.version, draws: target.draws };
  const job = await tx.job.create({ data: { groupId, kind: "interval", total: 1, payload: { ...payload } }, select: { id: true } });
  return job.id;
}

async function finish(db: Db, job: ClaimedJob, payload: IntervalPayload): Promise<true> {
  if (!(await finishJob(db, job, { status: "done", payload: { ...payload } }))) throw new LeaseLostError(job.id);
  return true;
}

/** One try at an interval job: returns true when it is finished, false to be called again (the outcome changed under it). */
export async function runIntervalBatch(db: Db, job: ClaimedJob, options: BatchOptions = {}): Promise<boolean> {
  const payload = readIntervalPayload(job.payload);
  if (!payload) {
    await finishJob(db, job, { status: "failed", error: "interval job without a workup and version" });
    return true;
  }
  const now = await db.workup.findFirst({ where: { id: payload.workupId, groupId: job.groupId }, select: { version: true, intervalState: true } });
  if (!now || now.version !== payload.version) return finish(db, job, { ...payload, result: "superseded" });
  if (now.intervalState === "ready") return finish(db, job, { ...payload, result: "already_ready" });

  const { plans, failures } = await planRepredictions(db, job.groupId, [payload.workupId], { draws: payload.draws, predict: options.predict });
  const failure = failures[0];
  // The engine failed (or its thread died): retried with backoff by the worker, then the interval is marked failed.
  if (failure) throw new Error(`interval of workup ${failure.workupId}: ${failure.message}`);
  const plan = plans[0];
  if (!plan) return finish(db, job, { ...payload, result: "superseded" }); // deleted meanwhile
  if (plan.version !== payload.version) return finish(db, job, { ...payload, result: "superseded" });

  return db.$transaction(async (tx) => {
    const applied = await applyRepredictions(tx, job.groupId, [plan]);
    if (applied.stale.length > 0) {
      // An outcome was reported while the draws ran: keep the lease, plan again from the new outcome.
      await commitProgress(tx, job, { done: 0, payload: { ...payload } });
      return false;
    }
    const result = applied.applied > 0 ? "written" : "superseded";
    if (!(await finishJob(tx, job, { status: "done", payload: { ...payload, result } }))) throw new LeaseLostError(job.id);
    return true;
  });
}

/** After the job gave up: the version's interval is "failed" (only if that version is still current and pending). */
export async function markIntervalFailed(db: Db, job: Pick<ClaimedJob, "groupId" | "payload">): Promise<void> {
  const payload = readIntervalPayload(job.payload);
  if (!payload) return;
  // Raw, so the row's updatedAt stays the person's last edit.
  await db.$executeRaw`
    UPDATE "Workup" SET "intervalState" = 'failed'
     WHERE id = ${payload.workupId} AND "groupId" = ${job.groupId} AND version = ${payload.version} AND "intervalState" = 'pending'`;
}
