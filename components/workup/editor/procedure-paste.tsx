"use client";
// Procedure text in: the chemist pastes the workup part of an experimental section, reads what each clause became
// (steps, or a reason it was not read), and only then adds the proposed steps to the form.
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { type JsonValue } from "@/lib/workups/record";
import { describeOperation } from "@/lib/workups-client/describe";
import { insertOperation } from "@/lib/workups-client/editor-actions";
import { operationOf } from "@/lib/workups-client/from-spec";
import { clausesToCheck, readProcedure, type ClauseOutcome, type ProcedureReading } from "@/lib/procedure/parse";
import { useEditor } from "./editor-context";

const OUTCOME_STYLE: Record<ClauseOutcome, string> = {
  step: "bg-emerald-100 text-emerald-950",
  context: "bg-stone-100 text-stone-800",
  outside: "bg-stone-100 text-stone-600 line-through decoration-stone-400",
  incomplete: "bg-amber-100 text-amber-950",
  unclear: "bg-red-100 text-red-950",
};

const OUTCOME_WORDS: Record<ClauseOutcome, string> = {
  step: "read as a step",
  context: "understood, no step needed",
  outside: "not a workup step, not entered",
  incomplete: "read, but a value is missing",
  unclear: "not understood, nothing entered",
};

function Highlighted({ text, reading }: { text: string; reading: ProcedureReading }) {
  const parts: React.ReactNode[] = [];
  let at = 0;
  reading.clauses.forEach((c, i) => {
    if (c.start > at) parts.push(text.slice(at, c.start));
    parts.push(
      <mark key={i} className={`rounded px-0.5 ${OUTCOME_STYLE[c.outcome]}`} title={`${OUTCOME_WORDS[c.outcome]}${c.message ? `: ${c.message}` : ""}`}>
        {text.slice(c.start, c.end)}
      </mark>,
    );
    at = c.end;
  });
  parts.push(text.slice(at));
  return <p className="whitespace-pre-wrap text-sm leading-6" data-testid="procedure-highlight">{parts}</p>;
}

export function ProcedurePaste({ announce }: { announce: (text: string) => void }) {
  const { apply, library } = useEditor();
  const [open, setOpen] = useState(false);
  const [text, setText] = useState("");
  const [reading, setReading] = useState<{ text: string; result: ProcedureReading } | null>(null);
  const id = useId();
  const toCheck = reading ? clausesToCheck(reading.result) : [];

  const confirm = () => {
    if (!reading) return;
    const ops = reading.result.steps.map((s) => operationOf(s as unknown as JsonValue)).filter((o) => o !== null);
    apply((s) => ops.reduce((acc, op) => insertOperation(acc, op), s), null);
    announce(`Added ${ops.length} steps from the procedure text.${toCheck.length ? ` ${toCheck.length} clauses need checking.` : ""}`);
    setReading(null);
    setText("");
    setOpen(false);
  };

  if (!open) {
    return <Button variant="secondary" onClick={() => setOpen(true)}>Paste procedure text…</Button>;
  }
  return (
    <section aria-labelledby={`${id}-title`} className="w-full space-y-3 rounded-md border border-stone-300 bg-white p-3">
      <h3 id={`${id}-title`} className="text-sm font-semibold text-stone-900">Steps from procedure text</h3>
      <label htmlFor={`${id}-text`} className="block text-xs font-medium text-stone-700">
        Workup part of the experimental (e.g. “The mixture was diluted with EtOAc (50 mL), washed with 1 M HCl (2 × 20 mL)…”)
      </label>
      <textarea id={`${id}-text`} value={text} onChange={(e) => { setText(e.target.value); setReading(null); }} rows={5} className={`${inputClass} w-full`}
        onKeyDown={(e) => { if (e.key === "Enter" && (e.ctrlKey || e.metaKey)) { e.preventDefault(); setReading({ text, result: readProcedure(text) }); } }} />
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" disabled={text.trim() === ""} onClick={() => setReading({ text, result: readProcedure(text) })}>Read text</Button>
        <Button variant="ghost" onClick={() => { setOpen(false); setReading(null); }}>Cancel</Button>
        <span className="self-center text-xs text-stone-500">Ctrl+Enter reads the text.</span>
      </div>
      {reading && (
        <div className="space-y-3" aria-live="polite">
          <Highlighted text={reading.text} reading={reading.result} />
          <p className="text-xs text-stone-600">
            <span className={`rounded px-1 ${OUTCOME_STYLE.step}`}>read</span>{" "}
            <span className={`rounded px-1 ${OUTCOME_STYLE.incomplete}`}>value missing</span>{" "}
            <span className={`rounded px-1 ${OUTCOME_STYLE.unclear}`}>not understood</span>{" "}
            <span className={`rounded px-1 ${OUTCOME_STYLE.outside}`}>not a workup step</span>
          </p>
          <div>
            <h4 className="text-xs font-semibold uppercase tracking-wide text-stone-600">Proposed steps ({reading.result.steps.length})</h4>
            <ol className="mt-1 list-decimal space-y-0.5 pl-5 text-sm" data-testid="procedure-steps">
              {reading.result.steps.map((s, i) => <li key={i}>{describeOperation(s as unknown as JsonValue, library)}</li>)}
            </ol>
          </div>
          {toCheck.length > 0 && (
            <div>
              <h4 className="text-xs font-semibold uppercase tracking-wide text-red-800">To check ({toCheck.length})</h4>
              <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm text-stone-800" data-testid="procedure-unclear">
                {toCheck.map((c, i) => <li key={i}><q>{c.text}</q>: {c.message ?? OUTCOME_WORDS[c.outcome]}</li>)}
              </ul>
            </div>
          )}
          <Button onClick={confirm} disabled={reading.result.steps.length === 0}>Add {reading.result.steps.length} steps to the workup</Button>
        </div>
      )}
    </section>
  );
}
