"use client";
// A save refused because someone saved a newer version first. Nothing is lost: the form keeps the user's edits.
// "Load their version" fetches it and shows what they changed and how the form differs from it; the user then
// saves over it on purpose, or takes their version instead.
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { formatDateTime } from "@/components/ui/format";
import { diffSnapshots } from "@/lib/workups/diff";
import type { WorkupDetail } from "@/lib/workups/queries";
import type { WorkupSnapshot } from "@/lib/workups/record";
import { getWorkupAction } from "@/lib/workups/actions";
import { VersionDiffView } from "@/components/workup/detail/version-diff";
import { snapshotOfDetail } from "./snapshot";

export interface ConflictProps {
  workupId: string;
  message: string;
  /** What the form was opened from. */
  base: WorkupSnapshot;
  mine: WorkupSnapshot;
  names: Record<string, string>;
  /** Their version is now the base of the next save; the form keeps the user's edits. */
  onRebase: (detail: WorkupDetail) => void;
  onTakeTheirs: (detail: WorkupDetail) => void;
}

export function ConflictPanel({ workupId, message, base, mine, names, onRebase, onTakeTheirs }: ConflictProps) {
  const [theirs, setTheirs] = useState<WorkupDetail | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const load = () => startTransition(async () => {
    const result = await getWorkupAction(workupId);
    if (!result.ok) return setProblem(result.message);
    setTheirs(result.data);
    onRebase(result.data);
  });
  return (
    <div role="alert" className="space-y-3 rounded-lg border border-amber-300 bg-amber-50 p-4 text-sm text-amber-950" data-testid="save-conflict">
      <p className="font-semibold">Not saved: someone else saved this workup first.</p>
      <p>{message}</p>
      {theirs ? (
        <>
          <p>
            Version {theirs.version} is now loaded as the base of your next save{theirs.updatedBy ? `, saved by ${theirs.updatedBy.name}` : ""} at {formatDateTime(theirs.updatedAt)}.
            Your edits are still in the form. Check both lists, then save again to put your version on top, or take theirs.
          </p>
          <details open className="rounded border border-amber-200 bg-white p-3">
            <summary className="cursor-pointer font-medium">What they changed since you opened it</summary>
            <div className="mt-2"><VersionDiffView diff={diffSnapshots(base, snapshotOfDetail(theirs))} names={names} /></div>
          </details>
          <details className="rounded border border-amber-200 bg-white p-3">
            <summary className="cursor-pointer font-medium">How your form differs from their version</summary>
            <div className="mt-2"><VersionDiffView diff={diffSnapshots(snapshotOfDetail(theirs), mine)} names={names} /></div>
          </details>
          <Button variant="secondary" onClick={() => onTakeTheirs(theirs)}>Discard my edits and use version {theirs.version}</Button>
        </>
      ) : (
        <Button variant="secondary" onClick={load} disabled={pending}>{pending ? "Loading…" : "Load their version (keeps my edits)"}</Button>
      )}
      {problem ? <p className="text-red-800">{problem}</p> : null}
    </div>
  );
}
