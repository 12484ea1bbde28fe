"use client";
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { ErrorSummary, type ErrorSummaryItem } from "@/components/ui/error-summary";

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
  const [problems, setProblems] = useState<{ items: ErrorSummaryItem[]; attempt: number }>({ items: [], attempt: 0 });
  const set = <K extends keyof ValueDraft>(key: K, value: ValueDraft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  return (
    <form
      className="grid gap-3 rounded-md border border-stone-200 bg-stone-50 p-3 text-sm sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        const value = Number(draft.value);
        const items: ErrorSummaryItem[] = [];
        if (draft.value.trim() === "" || !Number.isFinite(value)) items.push({ targetId: `${id}-value`, text: `${label} must be a number.` });
        if (draft.source.trim().length < 3) items.push({ targetId: `${id}-source`, text: "Source: name a notebook page, a paper or a handbook table." });
        setProblems((p) => ({ items, attempt: items.length > 0 ? p.attempt + 1 : p.attempt }));
        if (items.length === 0) onReview(draft);
      }}
    >
      <div className="sm:col-span-2"><ErrorSummary id={`${id}-errors`} items={problems.items} attempt={problems.attempt} title="Not ready to review: fix these first" /></div>
      <label className="space-y-1">
        <span className="block font-medium text-stone-800">{label}</span>
        <input id={`${id}-value`} inputMode="decimal" value={draft.value} onChange={(e) => set("value", e.target.value)} className={inputClass} aria-label={`New ${label}`} aria-invalid={problems.items.some((i) => i.targetId === `${id}-value`) || undefined} />
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
        <input id={`${id}-source`} value={draft.source} onChange={(e) => set("source", e.target.value)} placeholder="e.g. notebook HG-2-0113 p. 4, or a handbook table" className={inputClass} aria-label="Source" aria-invalid={problems.items.some((i) => i.targetId === `${id}-source`) || undefined} />
      </label>
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit">Review the change</Button>
        <Button variant="ghost" onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
