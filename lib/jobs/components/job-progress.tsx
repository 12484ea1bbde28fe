"use client";
// Visible progress of the group's background jobs. Polls /api/v1/jobs while something is running (and slowly
// otherwise, to notice jobs others started); when the last job finishes, the page is refreshed so that its
// predictions, deviations and flags show the new values.
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import type { JobProgress, JobsStatus } from "../status";

const ACTIVE_POLL_MS = 1500;
const IDLE_POLL_MS = 15_000;

function Bar({ job }: { job: JobProgress }) {
  const known = job.status === "running" && job.total > 0;
  const percent = known ? Math.min(100, Math.round((100 * job.done) / job.total)) : 0;
  const noun = job.kind === "revalidate" ? "workups re-predicted" : "outcomes examined";
  return (
    <li className="space-y-1">
      <div className="flex flex-wrap justify-between gap-2 text-sm">
        <span className="text-stone-800">{job.label}</span>
        <span className="tabular-nums text-stone-600" data-testid="job-progress-text">
          {job.status === "queued" ? "waiting to start" : known ? `${job.done} of ${job.total} ${noun}` : "starting"}
        </span>
      </div>
      <div role="progressbar" aria-label={job.label} aria-valuemin={0} aria-valuemax={job.total || 1} aria-valuenow={job.done}
        className="h-2 overflow-hidden rounded-full bg-stone-200">
        <div className="h-full rounded-full bg-teal-600 transition-[width] duration-500" style={{ width: `${percent}%` }} />
      </div>
    </li>
  );
}

export function JobProgressPanel({ initial }: { initial: JobsStatus }) {
  const router = useRouter();
  const [status, setStatus] = useState(initial);
  const hadActive = useRef(initial.active.length > 0);
  const active = status.active.length > 0;

  useEffect(() => {
    let cancelled = false;
    const poll = async () => {
      try {
        const response = await fetch("/api/v1/jobs", { cache: "no-store" });
        if (!response.ok || cancelled) return;
        const next = (await response.json()) as JobsStatus;
        if (cancelled) return;
        if (hadActive.current && next.active.length === 0) router.refresh();
        hadActive.current = next.active.length > 0;
        setStatus(next);
      } catch {
        // The next poll tries again; a passing network error is not worth an alert.
        if (!cancelled) setStatus((s) => ({ ...s }));
      }
    };
    const timer = setTimeout(() => void poll(), active ? ACTIVE_POLL_MS : IDLE_POLL_MS);
    return () => {
      cancelled = true;
      clearTimeout(timer);
    };
  }, [status, active, router]);

  const last = status.lastFinished;
  return (
    <div aria-live="polite" className="print:hidden" data-testid="job-progress">
      {active ? (
        <ul className="space-y-3 rounded-lg border border-teal-200 bg-teal-50/60 p-4">
          {status.active.map((job) => <Bar key={job.id} job={job} />)}
        </ul>
      ) : last && last.kind === "revalidate" ? (
        <p className="text-xs text-stone-500">
          {last.status === "failed"
            ? `The last re-validation stopped: ${last.error ?? "see the server log"}.`
            : `Last re-validation: ${last.done} workup${last.done === 1 ? "" : "s"} re-predicted${last.flagChanges ? `, ${last.flagChanges} review flag${last.flagChanges === 1 ? "" : "s"} changed` : ""}.`}
        </p>
      ) : null}
    </div>
  );
}
