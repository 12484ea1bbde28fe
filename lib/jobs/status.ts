// What the progress bars show: the group's background jobs that are waiting or running, and the last re-validation
// finished. A save's interval job is not among them: it belongs to one workup, whose own page and list row say
// "interval being computed".
import { type Db } from "@/lib/db/client";
import { readRevalidationPayload } from "./revalidate";

export interface JobProgress {
  id: string;
  kind: string;
  status: "queued" | "running" | "done" | "failed";
  total: number;
  done: number;
  /** What the job is for, in words. */
  label: string;
  flagChanges: number | null;
  error: string | null;
  updatedAt: string;
}

export interface JobsStatus {
  active: JobProgress[];
  lastFinished: JobProgress | null;
}

const select = { id: true, kind: true, status: true, total: true, done: true, payload: true, error: true, updatedAt: true } as const;

type Row = { id: string; kind: string; status: JobProgress["status"]; total: number; done: number; payload: unknown; error: string | null; updatedAt: Date };

/**
 * What members and viewers are told about a failed job. The stored error can be raw exception text (SQL, file paths,
 * stack frames), which only the server log should hold; the job id lets a lead find it there.
 */
export function publicJobError(jobId: string): string {
  return `The background job stopped with an error (reference ${jobId.slice(-8)}). The server log has the details; editing the group's data again queues a new run.`;
}

function progress(row: Row): JobProgress {
  const payload = (row.payload ?? {}) as Record<string, unknown>;
  const revalidation = row.kind === "revalidate" ? readRevalidationPayload(payload) : null;
  const label = revalidation
    ? `Re-predicting workups: ${revalidation.reasons.slice(-1)[0] ?? "group data changed"}`
    : "Learning partition values from reported outcomes";
  return {
    id: row.id, kind: row.kind, status: row.status, total: row.total, done: row.done, label,
    flagChanges: revalidation ? revalidation.flagChanges : null, error: row.error === null ? null : publicJobError(row.id), updatedAt: row.updatedAt.toISOString(),
  };
}

export async function jobsStatus(db: Db, groupId: string): Promise<JobsStatus> {
  const [active, last] = await Promise.all([
    db.job.findMany({ where: { groupId, kind: { in: ["revalidate", "infer"] }, status: { in: ["queued", "running"] } }, orderBy: [{ createdAt: "asc" }, { id: "asc" }], take: 10, select }),
    db.job.findFirst({ where: { groupId, kind: "revalidate", status: { in: ["done", "failed"] } }, orderBy: [{ updatedAt: "desc" }, { id: "desc" }], select }),
  ]);
  return { active: active.map(progress), lastFinished: last ? progress(last) : null };
}
