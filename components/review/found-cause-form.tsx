"use client";
// The cause a group meeting found for a flagged workup: one choice and a note, saved per workup. Viewers see the
// finding without the form. What is found teaches the group's later judgements (lib/workups/found-cause.ts).
import { useRouter } from "next/navigation";
import { useId, useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { ErrorSummary } from "@/components/ui/error-summary";
import { inputClass } from "@/components/ui/field";
import { recordFoundCauseAction } from "@/lib/workups/actions";
import { FOUND_CAUSES, FOUND_CAUSE_LABELS, foundCauseInputSchema, type FoundCause } from "@/lib/workups/found-cause-schema";

export interface FoundCauseValue {
  cause: FoundCause;
  note: string;
}

export function FoundCauseForm({ workupId, found, canRecord }: { workupId: string; found: FoundCauseValue | null; canRecord: boolean }) {
  const router = useRouter();
  const id = useId();
  const [cause, setCause] = useState<string>(found?.cause ?? "");
  const [note, setNote] = useState(found?.note ?? "");
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [attempt, setAttempt] = useState(0);
  const [pending, startTransition] = useTransition();
  const causeId = `${id}-cause`;
  const noteId = `${id}-note`;

  if (!canRecord) {
    return found ? <p className="text-xs text-stone-600">Cause found at review: {FOUND_CAUSE_LABELS[found.cause]}{found.note ? ` (${found.note})` : ""}</p> : null;
  }

  const submit = () => {
    setDone(null);
    setFailure(null);
    const checked = foundCauseInputSchema.safeParse({ cause: cause === "" ? null : cause, note });
    if (!checked.success) {
      const out: Record<string, string[]> = {};
      for (const i of checked.error.issues) (out[i.path.map(String).join(".") || "cause"] ??= []).push(i.message);
      setErrors(out);
      setAttempt((n) => n + 1);
      return;
    }
    setErrors({});
    startTransition(async () => {
      const result = await recordFoundCauseAction(workupId, checked.data);
      if (result.ok) {
        setDone(result.data.cause === null ? "Cleared." : "Saved.");
        router.refresh();
      } else {
        setErrors(result.fieldErrors ?? {});
        setFailure(result.fieldErrors ? null : result.message);
        if (result.fieldErrors) setAttempt((n) => n + 1);
      }
    });
  };

  const items = Object.entries(errors).flatMap(([path, messages]) =>
    messages.map((text) => ({ targetId: path.startsWith("note") || path.endsWith("note") ? noteId : causeId, text })));
  return (
    <form className="mt-1 flex flex-wrap items-end gap-2 text-xs print:hidden" data-testid="found-cause-form"
      onSubmit={(e) => { e.preventDefault(); submit(); }}>
      {items.length > 0 ? <div className="basis-full"><ErrorSummary id={`${id}-errors`} items={items} attempt={attempt} title="The finding was not saved" /></div> : null}
      <label className="flex flex-col gap-0.5" htmlFor={causeId}>
        <span className="font-medium text-stone-700">Cause found at review</span>
        <select id={causeId} value={cause} onChange={(e) => setCause(e.target.value)} className={`${inputClass} py-1 text-xs`}
          aria-invalid={items.some((i) => i.targetId === causeId) || undefined}>
          <option value="">Not found yet</option>
          {FOUND_CAUSES.map((c) => <option key={c} value={c}>{FOUND_CAUSE_LABELS[c]}</option>)}
        </select>
      </label>
      <label className="flex min-w-48 flex-1 flex-col gap-0.5" htmlFor={noteId}>
        <span className="font-medium text-stone-700">Finding note (optional; required for “something else”)</span>
        <input id={noteId} value={note} onChange={(e) => setNote(e.target.value)} maxLength={1000} className={`${inputClass} py-1 text-xs`}
          aria-invalid={items.some((i) => i.targetId === noteId) || undefined} />
      </label>
      <Button type="submit" variant="secondary" disabled={pending} className="text-xs">{pending ? "Saving…" : "Save finding"}</Button>
      <span role="status" className="text-stone-600">{done ?? ""}</span>
      {failure ? <p role="alert" className="basis-full text-red-800">{failure}</p> : null}
    </form>
  );
}
