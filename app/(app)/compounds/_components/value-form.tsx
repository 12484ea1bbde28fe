"use client";
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";

export interface ValueDraft {
  value: string;
  provenance: "measured" | "literature";
  source: string;
  se: string;
  kind: "acid" | "base";
}

/** The first step of a value edit: the new value, whether it was measured or read, and where it comes from. */
export function ValueForm({ label, initial, withKind = false, withSe = false, onReview, onCancel }: {
  label: string;
  initial: ValueDraft;
  withKind?: boolean;
  withSe?: boolean;
  onReview: (draft: ValueDraft) => void;
  onCancel: () => void;
}) {
  const id = useId();
  const [draft, setDraft] = useState(initial);
  const [problem, setProblem] = useState<string | null>(null);
  const set = <K extends keyof ValueDraft>(key: K, value: ValueDraft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  return (
    <form
      className="grid gap-3 rounded-md border border-stone-200 bg-stone-50 p-3 text-sm sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        const value = Number(draft.value);
        if (draft.value.trim() === "" || !Number.isFinite(value)) return setProblem(`${label} must be a number.`);
        if (draft.source.trim().length < 3) return setProblem("Name the source: a notebook page, a paper or a handbook table.");
        setProblem(null);
        onReview(draft);
      }}
    >
      <label className="space-y-1">
        <span className="block font-medium text-stone-800">{label}</span>
        <input id={`${id}-value`} inputMode="decimal" value={draft.value} onChange={(e) => set("value", e.target.value)} className={inputClass} aria-label={`New ${label}`} />
      </label>
      {withSe ? (
        <label className="space-y-1">
          <span className="block font-medium text-stone-800">Uncertainty ± (optional)</span>
          <input inputMode="decimal" value={draft.se} onChange={(e) => set("se", e.target.value)} className={inputClass} />
        </label>
      ) : null}
      {withKind ? (
        <fieldset className="space-y-1">
          <legend className="font-medium text-stone-800">Site</legend>
          {(["acid", "base"] as const).map((k) => (
            <label key={k} className="mr-4 inline-flex items-center gap-1.5">
              <input type="radio" checked={draft.kind === k} onChange={() => set("kind", k)} /> {k === "acid" ? "acid (HA ⇌ A⁻)" : "base (pKa of BH⁺)"}
            </label>
          ))}
        </fieldset>
      ) : null}
      <fieldset className="space-y-1">
        <legend className="font-medium text-stone-800">The value was</legend>
        {(["measured", "literature"] as const).map((p) => (
          <label key={p} className="mr-4 inline-flex items-center gap-1.5">
            <input type="radio" checked={draft.provenance === p} onChange={() => set("provenance", p)} /> {p === "measured" ? "measured by the group" : "taken from the literature"}
          </label>
        ))}
      </fieldset>
      <label className="space-y-1 sm:col-span-2">
        <span className="block font-medium text-stone-800">Source</span>
        <input value={draft.source} onChange={(e) => set("source", e.target.value)} placeholder="e.g. notebook HG-2-0113 p. 4, or a handbook table" className={inputClass} aria-label="Source" />
      </label>
      {problem ? <p role="alert" className="text-red-700 sm:col-span-2">{problem}</p> : null}
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit">Review the change</Button>
        <Button variant="ghost" onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
