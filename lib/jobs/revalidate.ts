/**
 * Re-validation: when the group's partition data or a compound's properties change, every workup that uses one of
 * the compounds is predicted again in the background. Jobs go through the durable queue (queue.ts); a queued job
 * that has not started yet absorbs later changes, so a burst of edits costs one pass. Workups are visited in id
 * order and the cursor is committed with each batch, so a job taken over after a crash resumes where it stopped.
 */
import { type Db, type DbTransaction } from "@/lib/db/client";
import { commitProgress, finishJob, LeaseLostError, type ClaimedJob } from "./queue";
import { applyRepredictions, planRepredictions, type Predictor } from "./repredict";

type Client = Db | DbTransaction;

export interface RevalidationPayload {
  compoundIds: string[];
  reasons: string[];
  /** Id of the last workup done. */
  cursor: string | null;
  flagChanges: number;
  failures: number;
  lastFailure?: string;
}

/** Workups re-predicted per committed batch: a few seconds of engine time, far inside the lease. */
export const REVALIDATION_BATCH = 5;
const MAX_REASONS = 10;
/** Re-plans of a workup whose outcome keeps changing under the batch; after that it is left to its own report. */
const STALE_REPLANS = 2;

export function readRevalidationPayload(payload: Record<string, unknown>): RevalidationPayload {
  const strings = (v: unknown) => (Array.isArray(v) ? v.filter((x): x is string => typeof x === "string") : []);
  const num = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? v : 0);
  return {
    compoundIds: strings(payload["compoundIds"]),
    reasons: strings(payload["reasons"]),
    cursor: typeof payload["cursor"] === "string" ? payload["cursor"] : null,
    flagChanges: num(payload["flagChanges"]),
    failures: num(payload["failures"]),
    ...(typeof payload["lastFailure"] === "string" ? { lastFailure: payload["lastFailure"] } : {}),
  };
}

/**
 * Queues the re-prediction of every workup of the group that uses one of `compoundIds` (call it inside the
 * transaction that changes the data, so the change and its job commit together). Returns the job id, or null when
 * there is nothing to do.
 */
export async function enqueueRevalidation(db: Client, groupId: string, change: { compoundIds: readonly string[]; reason?: string }): Promise<string | null> {
  const compoundIds = [...new Set(change.compoundIds)].sort();
  if (compoundIds.length === 0) return null;
  const reason = change.reason ?? "group data changed";
  // Merge into a job that is still waiting, under its row lock, so two concurrent changes both land.
  const merged = await db.$queryRaw<{ id: string }[]>`
    UPDATE "Job" SET
      payload = jsonb_set(jsonb_set(payload, '{compoundIds}', (
          SELECT COALESCE(jsonb_agg(DISTINCT x ORDER BY x), '[]'::jsonb) FROM (
            SELECT jsonb_array_elements_text(COALESCE(payload->'compoundIds', '[]'::jsonb)) AS x
            UNION SELECT jsonb_array_elements_text(${JSON.stringify(compoundIds)}::jsonb)) AS ids)),
        '{reasons}', (COALESCE(payload->'reasons', '[]'::jsonb) || to_jsonb(${reason}::text))),
      "updatedAt" = now()
    WHERE id = (
      SELECT id FROM "Job" WHERE "groupId" = ${groupId} AND kind = 'revalidate' AND status = 'queued'
       ORDER BY "createdAt" LIMIT 1 FOR UPDATE
    ) AND status = 'queued'
    RETURNING id`;
  if (merged[0]) return merged[0].id;
  const payload: RevalidationPayload = { compoundIds, reasons: [reason], cursor: null, flagChanges: 0, failures: 0 };
  const job = await db.job.create({ data: { groupId, kind: "revalidate", payload: { ...payload } }, select: { id: true } });
  return job.id;
}

function affectedWhere(groupId: string, compoundIds: readonly string[]) {
  return { groupId, components: { some: { groupId, compoundId: { in: [...compoundIds] } } } };
}

export async function countAffectedWorkups(db: Client, groupId: string, compoundIds: readonly string[]): Promise<number> {
  return db.workup.count({ where: affectedWhere(groupId, compoundIds) });
}

export interface BatchOptions {
  draws?: number;
  batchSize?: number;
  /** Where the engine runs (default: in place; the app's worker passes its engine threads). */
  predict?: Predictor;
}

/** One batch of a revalidation job: predict, then write the batch and the progress together. Returns true when the job is finished. */
export async function runRevalidationBatch(db: Db, job: ClaimedJob, options: BatchOptions = {}): Promise<boolean> {
  const payload = readRevalidationPayload(job.payload);
  const total = payload.cursor === null && job.done === 0 ? await countAffectedWorkups(db, job.groupId, payload.compoundIds) : job.total;
  const batch = await db.workup.findMany({
    where: { ...affectedWhere(job.groupId, payload.compoundIds), ...(payload.cursor ? { id: { gt: payload.cursor } } : {}) },
    orderBy: { id: "asc" },
    take: options.batchSize ?? REVALIDATION_BATCH,
    select: { id: true },
  });
  if (batch.length === 0) {
    await db.$transaction(async (tx) => {
      if (!(await finishJob(tx, job, { status: "done", payload: { ...job.payload, ...payload } }))) throw new LeaseLostError(job.id);
      await tx.auditEvent.create({
        data: {
          groupId: job.groupId, actorId: null, action: "workups.revalidate", entity: "Job", entityId: job.id,
          details: { workups: job.done, flagChanges: payload.flagChanges, failures: payload.failures, reasons: payload.reasons.slice(0, MAX_REASONS) },
        },
        select: { id: true },
      });
    });
    return true;
  }
  const { plans, failures } = await planRepredictions(db, job.groupId, batch.map((w) => w.id), { draws: options.draws, predict: options.predict });
  const next: RevalidationPayload = {
    ...payload,
    cursor: batch[batch.length - 1]?.id ?? payload.cursor,
    failures: payload.failures + failures.length,
    ...(failures[0] ? { lastFailure: `${failures[0].workupId}: ${failures[0].message}` } : {}),
  };
  const done = job.done + batch.length;
  let stale = await db.$transaction(async (tx) => {
    const applied = await applyRepredictions(tx, job.groupId, plans);
    next.flagChanges += applied.flagChanges;
    await commitProgress(tx, job, { done, total: Math.max(total, done), payload: { ...job.payload, ...next } });
    return applied.stale;
  });
  // An outcome reported while the batch was being predicted: predict those workups again against the new outcome.
  for (let attempt = 0; stale.length > 0 && attempt < STALE_REPLANS; attempt++) {
    const again = await planRepredictions(db, job.groupId, stale, { draws: options.draws, predict: options.predict });
    stale = await db.$transaction(async (tx) => {
      const applied = await applyRepredictions(tx, job.groupId, again.plans);
      next.flagChanges += applied.flagChanges;
      await commitProgress(tx, job, { done, total: Math.max(total, done), payload: { ...job.payload, ...next } });
      return applied.stale;
    });
  }
  job.done = done;
  job.total = Math.max(total, done);
  job.payload = { ...job.payload, ...next };
  return false;
}
