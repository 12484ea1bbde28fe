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
  /** Their version becomes the base of the next save; their changes merge into the form where it left them alone. */
  onRebase: (detail: WorkupDetail) => { taken: string[]; both: string[] };
  onTakeTheirs: (detail: WorkupDetail) => void;
}

const PART_NAMES: Record<string, string> = {
  title: "title", performedOn: "date", chemistId: "chemist", notebookRef: "notebook reference", scaleMmol: "scale", expectedProductMmol: "expected product",
  assayedProductMmol: "assayed product", components: "components", mixture: "starting mixture", operations: "steps", temperature: "temperature", funnel: "funnel size", name: "name",
};
const partName = (k: string) => PART_NAMES[k] ?? k;

export function ConflictPanel({ workupId, message, base, mine, names, onRebase, onTakeTheirs }: ConflictProps) {
  const [theirs, setTheirs] = useState<WorkupDetail | null>(null);
  const [merge, setMerge] = useState<{ taken: string[]; both: string[] }>({ taken: [], both: [] });
  const [problem, setProblem] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const load = () => startTransition(async () => {
    const result = await getWorkupAction(workupId);
    if (!result.ok) return setProblem(result.message);
    setTheirs(result.data);
    setMerge(onRebase(result.data));
  });
  return (
    <div role="alert" className="space-y-3 rounded-lg border border-amber-300 bg-amber-50 p-4 text-sm text-amber-950" data-testid="save-conflict">
      <p className="font-semibold">Not saved: someone else saved this workup first.</p>
      <p>{message}</p>
      {theirs ? (
        <>
          <p>
            Version {theirs.version} is now loaded as the base of your next save{theirs.updatedBy ? `, saved by ${theirs.updatedBy.name}` : ""} at {formatDateTime(theirs.updatedAt)}.
            Your edits are still in the form. Check both lists, then save again, or take their version instead.
          </p>
          {merge.taken.length > 0 ? <p>Taken into your form from their version (you had not changed these): <strong>{merge.taken.map(partName).join(", ")}</strong>.</p> : null}
          {merge.both.length > 0 ? <p>Changed by both of you; your version is kept: <strong>{merge.both.map(partName).join(", ")}</strong>.</p> : null}
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
