/**
 * Inference jobs: outcomes reported or re-judged since the last pass are fitted for the product's log K
 * (lib/partition/infer-service.ts). A scheduler finds groups with newer outcomes and queues one job per group; the
 * job walks the outcomes in (updatedAt, workupId) order with a committed cursor, and at the end queues the
 * re-validation of the compounds whose observations changed. Outcome.updatedAt is stamped by the writing instance's
 * clock, so each pass reaches back OVERLAP_MS before the previous one ended; fitting an outcome twice changes
 * nothing, so the overlap costs only time. The writes of a batch are compare-and-set on each outcome's updatedAt as
 * the batch read it (unchangedPlans), so a fit never overwrites an outcome reported while it ran.
 */
import { Prisma } from "@/generated/prisma/client";
import { type Db, type DbTransaction } from "@/lib/db/client";
import { applyInferences, dropOrphanInferences, planInferences, type InferencePlan } from "@/lib/partition/infer-service";
import { commitProgress, finishJob, LeaseLostError, type ClaimedJob } from "./queue";
import { enqueueRevalidation } from "./revalidate";

export const OVERLAP_MS = 5 * 60_000;
export const INFERENCE_BATCH = 10;
/** Any constant shared by all instances: serializes schedulers so two instances do not queue the same pass. */
const SCHEDULER_LOCK = 7_240_011;

interface InferPayload {
  /** Outcomes updated after this (ISO) are in the pass; null for the first pass. */
  since: string | null;
  /** …up to and including this, the newest outcome when the pass was queued. */
  until: string;
  cursor: { at: string; id: string } | null;
  changed: string[];
}

function readPayload(p: Record<string, unknown>): InferPayload {
  const cursor = p["cursor"] as { at?: unknown; id?: unknown } | null | undefined;
  return {
    since: typeof p["since"] === "string" ? p["since"] : null,
    until: typeof p["until"] === "string" ? p["until"] : new Date(0).toISOString(),
    cursor: cursor && typeof cursor.at === "string" && typeof cursor.id === "string" ? { at: cursor.at, id: cursor.id } : null,
    changed: Array.isArray(p["changed"]) ? p["changed"].filter((x): x is string => typeof x === "string") : [],
  };
}

/**
 * Queues an inference pass for every group with outcomes newer than its last pass, or with inferred observations
 * whose workup was deleted. Returns the number queued.
 */
export async function scheduleInference(db: Db): Promise<number> {
  return db.$transaction(async (tx) => {
    await tx.$executeRaw`SELECT pg_advisory_xact_lock(${SCHEDULER_LOCK})`;
    const due = await tx.$queryRaw<{ groupId: string; lastUntil: string | null; newest: Date | null }[]>`
      WITH last AS (
        SELECT DISTINCT ON (j."groupId") j."groupId", j.payload->>'until' AS "until" FROM "Job" j
         WHERE j.kind = 'infer' AND j.status = 'done'
         ORDER BY j."groupId", (j.payload->>'until')::timestamp DESC
      ), newest AS (
        SELECT o."groupId", max(o."updatedAt") AS newest FROM "Outcome" o GROUP BY o."groupId"
      ), orphaned AS (
        SELECT DISTINCT p."groupId" FROM "PartitionObservation" p
         WHERE p.kind = 'inferred' AND p."workupId" IS NOT NULL
           AND NOT EXISTS (SELECT 1 FROM "Workup" w WHERE w.id = p."workupId" AND w."groupId" = p."groupId")
      )
      SELECT g.id AS "groupId", last."until" AS "lastUntil", newest.newest
        FROM "Group" g
        LEFT JOIN last ON last."groupId" = g.id
        LEFT JOIN newest ON newest."groupId" = g.id
       WHERE NOT EXISTS (SELECT 1 FROM "Job" j WHERE j."groupId" = g.id AND j.kind = 'infer' AND j.status IN ('queued', 'running'))
         AND ((newest.newest IS NOT NULL AND (last."until" IS NULL OR newest.newest > (last."until")::timestamp))
              OR g.id IN (SELECT "groupId" FROM orphaned))`;
    for (const g of due) {
      const since = g.lastUntil ? new Date(new Date(g.lastUntil).getTime() - OVERLAP_MS).toISOString() : null;
      const until = g.newest && (!g.lastUntil || g.newest > new Date(g.lastUntil)) ? g.newest.toISOString() : (g.lastUntil ?? new Date(0).toISOString());
      const payload: InferPayload = { since, until, cursor: null, changed: [] };
      await tx.job.create({ data: { groupId: g.groupId, kind: "infer", payload: { ...payload } }, select: { id: true } });
    }
    return due.length;
  });
}

function rangeWhere(groupId: string, p: InferPayload) {
  return {
    groupId,
    updatedAt: { lte: new Date(p.until), ...(p.since ? { gt: new Date(p.since) } : {}) },
    ...(p.cursor
      ? { OR: [{ updatedAt: { gt: new Date(p.cursor.at) } }, { updatedAt: new Date(p.cursor.at), workupId: { gt: p.cursor.id } }] }
      : {}),
  };
}

/** A batch read and fitted outside any transaction, with the stamps its writes are compared against. */
export interface PlannedInferenceBatch {
  total: number;
  /** The outcomes of the batch as read: the workup and the outcome's updatedAt (the cursor moves past all of them). */
  batch: { workupId: string; updatedAt: Date }[];
  plans: InferencePlan[];
}

/** Reads the next batch of outcomes and fits them (the slow part, outside any transaction). */
export async function planInferenceBatch(db: Db, job: ClaimedJob): Promise<PlannedInferenceBatch> {
  const p = readPayload(job.payload);
  const total = p.cursor === null && job.done === 0 ? await db.outcome.count({ where: rangeWhere(job.groupId, { ...p, cursor: null }) }) : job.total;
  const batch = await db.outcome.findMany({
    where: rangeWhere(job.groupId, p),
    orderBy: [{ updatedAt: "asc" }, { workupId: "asc" }],
    take: INFERENCE_BATCH,
    select: { workupId: true, updatedAt: true },
  });
  const plans = batch.length > 0 ? await planInferences(db, job.groupId, batch.map((o) => o.workupId)) : [];
  return { total, batch, plans };
}

/**
 * The plans whose outcome is still as the batch read it, under the outcome rows' locks: an outcome reported or
 * re-judged meanwhile (a report, an edit of the workup, a re-prediction all stamp it) or deleted with its workup is
 * left out. Its newer stamp is past this pass's end, so the next pass fits it from what is stored then; a background
 * fit never replaces what a person recorded after the fit read it.
 */
async function unchangedPlans(tx: DbTransaction, groupId: string, planned: PlannedInferenceBatch): Promise<InferencePlan[]> {
  const ids = planned.batch.map((o) => o.workupId);
  const now = await tx.$queryRaw<{ workupId: string; updatedAt: Date }[]>`
    SELECT "workupId", "updatedAt" FROM "Outcome" WHERE "groupId" = ${groupId} AND "workupId" IN (${Prisma.join(ids)}) FOR UPDATE`;
  const stampNow = new Map(now.map((o) => [o.workupId, o.updatedAt.getTime()]));
  const read = new Map(planned.batch.map((o) => [o.workupId, o.updatedAt.getTime()]));
  return planned.plans.filter((plan) => stampNow.get(plan.workupId) !== undefined && stampNow.get(plan.workupId) === read.get(plan.workupId));
}

/** Writes a planned batch (compare-and-set on each outcome's stamp) with the job's progress. Returns true when the job is finished. */
export async function applyInferenceBatch(db: Db, job: ClaimedJob, planned: PlannedInferenceBatch): Promise<boolean> {
  const p = readPayload(job.payload);
  const { total, batch } = planned;
  if (batch.length === 0) {
    await db.$transaction(async (tx) => {
      const orphaned = await dropOrphanInferences(tx, job.groupId);
      const changed = [...new Set([...p.changed, ...orphaned])];
      if (!(await finishJob(tx, job, { status: "done", payload: { ...job.payload, ...p, changed } }))) throw new LeaseLostError(job.id);
      await enqueueRevalidation(tx, job.groupId, { compoundIds: changed, reason: "partition values inferred from reported outcomes changed" });
    });
    return true;
  }
  const last = batch[batch.length - 1] as { workupId: string; updatedAt: Date };
  const done = job.done + batch.length;
  const next: InferPayload = { ...p, cursor: { at: last.updatedAt.toISOString(), id: last.workupId } };
  await db.$transaction(async (tx) => {
    const changed = await applyInferences(tx, job.groupId, await unchangedPlans(tx, job.groupId, planned));
    next.changed = [...new Set([...p.changed, ...changed])];
    await commitProgress(tx, job, { done, total: Math.max(total, done), payload: { ...job.payload, ...next } });
  });
  job.done = done;
  job.total = Math.max(total, done);
  job.payload = { ...job.payload, ...next };
  return false;
}

/** One batch of an inference job. Returns true when the job is finished. */
export async function runInferenceBatch(db: Db, job: ClaimedJob): Promise<boolean> {
  return applyInferenceBatch(db, job, await planInferenceBatch(db, job));
}
