/**
 * A small durable job queue on the Job table, safe with several app instances on one PostgreSQL:
 *  - claiming takes the oldest queued job, or a running one whose lease expired (its worker died), in one UPDATE
 *    whose inner SELECT locks with FOR UPDATE SKIP LOCKED, so two workers never claim the same row and never wait
 *    for each other (PGlite is one process; the same statement runs there);
 *  - progress is committed in batches inside the batch's own transaction, fenced by the lease: the write succeeds
 *    only while this worker still holds the job (lockedBy), and renews the lease; a worker that lost its lease rolls
 *    its batch back, so every batch is applied exactly once;
 *  - all lease times are the database server's clock, so instances with drifting clocks agree;
 *  - interval jobs (one workup's Monte Carlo interval after a save, a second or so) are claimed before the others,
 *    so a person waiting for their workup's interval does not wait behind a long re-validation.
 */
import { Prisma } from "@/generated/prisma/client";
import { type Db, type DbTransaction } from "@/lib/db/client";

type Client = Db | DbTransaction;

export type JobKind = "revalidate" | "infer" | "interval";
export const JOB_KINDS: readonly JobKind[] = ["revalidate", "infer", "interval"];

/** Lease length: a batch takes a few seconds, so a lease this long is renewed many times before it could lapse. */
export const LEASE_SECONDS = 60;

export interface ClaimedJob {
  id: string;
  groupId: string;
  kind: JobKind;
  total: number;
  done: number;
  payload: Record<string, unknown>;
  lockedBy: string;
  /** True when the job was taken over from a worker whose lease expired. */
  takenOver: boolean;
}

/** The worker no longer holds the job's lease; whatever it was writing must be rolled back. */
export class LeaseLostError extends Error {
  constructor(readonly jobId: string) {
    super(`lost the lease on job ${jobId}`);
    this.name = "LeaseLostError";
  }
}

interface ClaimRow {
  id: string;
  groupId: string;
  kind: string;
  total: number;
  done: number;
  payload: unknown;
  lockedBy: string;
  takenOver: boolean;
}

function asObject(value: unknown): Record<string, unknown> {
  return value !== null && typeof value === "object" && !Array.isArray(value) ? (value as Record<string, unknown>) : {};
}

export async function claimJob(db: Client, workerId: string, options: { kinds?: readonly JobKind[]; leaseSeconds?: number } = {}): Promise<ClaimedJob | null> {
  const kinds = options.kinds ?? JOB_KINDS;
  const lease = options.leaseSeconds ?? LEASE_SECONDS;
  const rows = await db.$queryRaw<ClaimRow[]>`
    UPDATE "Job" AS j
       SET status = 'running', "lockedBy" = ${workerId}, "lockedAt" = now(), "updatedAt" = now()
      FROM (
        SELECT id, status AS "previousStatus" FROM "Job"
         WHERE kind IN (${Prisma.join([...kinds])})
           AND (status = 'queued' OR (status = 'running' AND "lockedAt" < now() - make_interval(secs => ${lease})))
         ORDER BY (kind = 'interval') DESC, "createdAt", id
         LIMIT 1
           FOR UPDATE SKIP LOCKED
      ) AS picked
     WHERE j.id = picked.id
    RETURNING j.id, j."groupId", j.kind, j.total, j.done, j.payload, j."lockedBy", (picked."previousStatus" = 'running') AS "takenOver"`;
  const row = rows[0];
  if (!row) return null;
  return { ...row, kind: row.kind as JobKind, payload: asObject(row.payload) };
}

/**
 * Records progress inside the batch's transaction and renews the lease; throws LeaseLostError (rolling the batch
 * back) when another worker has taken the job over.
 */
export async function commitProgress(tx: Client, job: Pick<ClaimedJob, "id" | "lockedBy">, progress: { done: number; total?: number; payload: Record<string, unknown> }): Promise<void> {
  const payload = JSON.stringify(progress.payload);
  const count = await tx.$executeRaw`
    UPDATE "Job"
       SET done = ${progress.done}, total = COALESCE(${progress.total ?? null}::int, total), payload = ${payload}::jsonb,
           "lockedAt" = now(), "updatedAt" = now()
     WHERE id = ${job.id} AND "lockedBy" = ${job.lockedBy} AND status = 'running'`;
  if (count !== 1) throw new LeaseLostError(job.id);
}

/** Renews the lease between batches (a timer while the job runs); false when this worker no longer holds the job. */
export async function renewLease(db: Client, job: Pick<ClaimedJob, "id" | "lockedBy">): Promise<boolean> {
  const count = await db.$executeRaw`
    UPDATE "Job" SET "lockedAt" = now() WHERE id = ${job.id} AND "lockedBy" = ${job.lockedBy} AND status = 'running'`;
  return count === 1;
}

/** Marks a job done (or failed) if this worker still holds it. */
export async function finishJob(tx: Client, job: Pick<ClaimedJob, "id" | "lockedBy">, outcome: { status: "done" | "failed"; error?: string; payload?: Record<string, unknown> }): Promise<boolean> {
  const payload = outcome.payload ? JSON.stringify(outcome.payload) : null;
  const count = await tx.$executeRaw`
    UPDATE "Job"
       SET status = ${outcome.status}::"JobStatus", error = ${outcome.error ?? null}, payload = COALESCE(${payload}::jsonb, payload),
           "lockedBy" = NULL, "lockedAt" = NULL, "updatedAt" = now()
     WHERE id = ${job.id} AND "lockedBy" = ${job.lockedBy} AND status = 'running'`;
  return count === 1;
}

/** Hands a job back to the queue at once (a graceful stop), keeping its progress for the next worker. */
export async function releaseJob(db: Client, job: Pick<ClaimedJob, "id" | "lockedBy">): Promise<void> {
  await db.$executeRaw`
    UPDATE "Job" SET status = 'queued', "lockedBy" = NULL, "lockedAt" = NULL, "updatedAt" = now()
     WHERE id = ${job.id} AND "lockedBy" = ${job.lockedBy} AND status = 'running'`;
}
