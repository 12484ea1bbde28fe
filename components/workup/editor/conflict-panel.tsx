"use client";
// A save refused because someone saved a newer version first. Nothing is lost: their version is merged into the
// form step by step and field by field (lib/workups-client/merge.ts). The panel lists what they changed and what
// the form changed since the version it was opened from, and each place both changed differently with both values,
// for the user to choose; the form's value stands until they do. Then the user saves again, or takes their version.
import { Button } from "@/components/ui/button";
import { formatDateTime } from "@/components/ui/format";
import { jsonText } from "@/components/workup/detail/version-diff";
import type { Choice, MergeChange, MergeResult, Slot } from "@/lib/workups-client/merge";

export interface TheirVersion {
  version: number;
  by: string | null;
  /** ISO time. */
  at: string;
}

export interface ConflictProps {
  message: string;
  /** null until their version is loaded. */
  theirs: TheirVersion | null;
  result: MergeResult | null;
  choices: Readonly<Record<string, Choice>>;
  names: Record<string, string>;
  pending: boolean;
  problem: string | null;
  onLoad: () => void;
  onChoose: (conflictId: string, choice: Choice) => void;
  onTakeTheirs: () => void;
}

/** Orders are lists of step ids, which mean nothing to a reader: say whose order it is. */
const ORDER_WORDS = (v: Slot) => (Array.isArray(v) ? `moved (${v.length} kept in a new order)` : "—");

function show(v: Slot, names: Record<string, string>, field: string | null): string {
  if (v === undefined) return field === null ? "removed" : "not set";
  if ((field === "chemistId" || field === "compoundId") && typeof v === "string") return names[v] ?? v;
  return jsonText(v);
}

function fieldOf(c: { path: MergeChange["path"] }): string | null {
  return c.path.part === "order" ? null : c.path.field;
}

function ChangeList({ title, changes, names, testId }: { title: string; changes: MergeChange[]; names: Record<string, string>; testId: string }) {
  return (
    <details open className="rounded border border-amber-200 bg-white p-3" data-testid={testId}>
      <summary className="cursor-pointer font-medium">{title} ({changes.length})</summary>
      {changes.length === 0 ? <p className="mt-2 text-stone-600">Nothing.</p> : (
        <ul className="mt-2 ml-4 list-disc space-y-0.5">
          {changes.map((c) => (
            <li key={`${c.label}:${JSON.stringify(c.path)}`}>
              <span className="text-stone-600">{c.label}:</span>{" "}
              {c.path.part === "order" ? ORDER_WORDS(c.to) : (
                <><del className="text-red-800">{show(c.from, names, fieldOf(c))}</del> → <ins className="text-emerald-800 no-underline">{show(c.to, names, fieldOf(c))}</ins></>
              )}
            </li>
          ))}
        </ul>
      )}
    </details>
  );
}

export function ConflictPanel({ message, theirs, result, choices, names, pending, problem, onLoad, onChoose, onTakeTheirs }: ConflictProps) {
  return (
    <div role="alert" className="space-y-3 rounded-lg border border-amber-300 bg-amber-50 p-4 text-sm text-amber-950" data-testid="save-conflict">
      <p className="font-semibold">Not saved: someone else saved this workup first.</p>
      <p>{message}</p>
      {theirs && result ? (
        <>
          <p>
            Version {theirs.version}{theirs.by ? `, saved by ${theirs.by}` : ""} at {formatDateTime(new Date(theirs.at))}, is merged into your form
            and is the base of your next save. Your edits are kept. Check the lists, choose where you both changed the same thing, then save again.
          </p>
          <ChangeList title="What they changed since you opened it" changes={result.theirChanges} names={names} testId="their-changes" />
          <ChangeList title="What you changed" changes={result.myChanges} names={names} testId="my-changes" />
          {result.conflicts.length > 0 ? (
            <fieldset className="space-y-2 rounded border border-amber-300 bg-white p-3" data-testid="merge-conflicts">
              <legend className="px-1 font-medium">Changed by both of you ({result.conflicts.length}): choose which to keep</legend>
              {result.conflicts.map((c) => {
                const chosen = choices[c.id] ?? "mine";
                const field = fieldOf(c);
                const value = (v: Slot, whose = "") => (c.path.part === "order" ? (whose ? `${whose} order` : "the order you both opened") : show(v, names, field));
                return (
                  <div key={c.id} className="space-y-1">
                    <p className="text-stone-700">{c.label} <span className="text-stone-500">(was {value(c.base)})</span></p>
                    <label className="mr-4 inline-flex items-center gap-1">
                      <input type="radio" name={`merge-${c.id}`} checked={chosen === "mine"} onChange={() => onChoose(c.id, "mine")} />
                      Mine: <strong>{value(c.mine, "my")}</strong>
                    </label>
                    <label className="inline-flex items-center gap-1">
                      <input type="radio" name={`merge-${c.id}`} checked={chosen === "theirs"} onChange={() => onChoose(c.id, "theirs")} />
                      Theirs: <strong>{value(c.theirs, "their")}</strong>
                    </label>
                  </div>
                );
              })}
            </fieldset>
          ) : <p>No place was changed by both of you.</p>}
          <Button variant="secondary" onClick={onTakeTheirs}>Discard my edits and use version {theirs.version}</Button>
        </>
      ) : (
        <Button variant="secondary" onClick={onLoad} disabled={pending}>{pending ? "Loading…" : "Load their version and merge (keeps my edits)"}</Button>
      )}
      {problem ? <p className="text-red-800">{problem}</p> : null}
    </div>
  );
}
