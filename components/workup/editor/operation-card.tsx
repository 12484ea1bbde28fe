"use client";
// One step of the workup: its type and fields, then what the engine predicts for it (the funnel picture, where each
// component went) with the safety cautions and flags this step triggers. Alt+↑/↓ moves the step, Alt+Shift+D
// duplicates it.
import { type KeyboardEvent } from "react";
import { type OperationType } from "@/lib/chem/schema";
import { duplicateStep, moveOperation, removeOperation, setOperationType, setOperationValue } from "@/lib/workups-client/editor-actions";
import { COMMON_FIELDS, OPERATION_TYPES, operationMeta } from "@/lib/workups-client/operation-forms";
import { CautionNotes, FlagNotes } from "@/components/workup/prediction/step-notes";
import { StepPrediction } from "@/components/workup/prediction/step-prediction";
import { type ComponentName } from "@/components/workup/prediction/phase-bars";
import { unitKey, type OperationState } from "@/lib/workups-client/editor-types";
import { OperationField } from "./operation-fields";
import { QuantityControl, SelectControl, TextControl, ToolButton, fieldId } from "./controls";
import { useEditor } from "./editor-context";

export function stepElementId(opId: string): string {
  return `step-${opId}`;
}

/** Puts focus back on the element that had it once React has moved the step's DOM node. */
function keepFocus(): void {
  const id = (document.activeElement as HTMLElement | null)?.id;
  if (id) requestAnimationFrame(() => document.getElementById(id)?.focus());
}

export function OperationCard({ op, index, count, capacityMl, components, startMmol, announce, folded = false, onFold, summary = "" }: {
  op: OperationState; index: number; count: number; capacityMl: number; components: ComponentName[]; startMmol: Record<string, number>;
  announce: (text: string) => void;
  /** Folded to its one-line summary (at the hood, on a small screen). */
  folded?: boolean;
  onFold?: (folded: boolean) => void;
  /** The step in words, shown when folded. */
  summary?: string;
}) {
  const { apply, messages, touch, problemCount, live, library } = useEditor();
  const n = index + 1;
  const meta = operationMeta(op.type);
  const base = `op:${op.id}`;
  const move = (delta: -1 | 1) => {
    if (index + delta < 0 || index + delta >= count) return;
    keepFocus();
    apply((s) => moveOperation(s, op.id, delta), null);
    announce(`Step ${n} moved to position ${n + delta}.`);
  };
  const duplicate = () => {
    apply((s) => duplicateStep(s, op.id).state, null);
    announce(`Step ${n} duplicated as step ${n + 1}.`);
  };
  const onKeyDown = (e: KeyboardEvent) => {
    if (e.altKey && !e.ctrlKey && !e.metaKey && (e.key === "ArrowUp" || e.key === "ArrowDown")) {
      e.preventDefault();
      move(e.key === "ArrowUp" ? -1 : 1);
    } else if (e.altKey && e.shiftKey && (e.key === "D" || e.key === "d")) {
      e.preventDefault();
      duplicate();
    }
  };
  const prediction = live.prediction;
  const step = prediction?.steps[index];
  const cautions = prediction?.cautions.filter((c) => c.step === n) ?? [];
  const flags = prediction?.flags.filter((f) => f.step === n) ?? [];
  const problems = problemCount(base);
  const mainFields = meta.fields;
  const label = COMMON_FIELDS.find((f) => f.name === "label");
  const temperature = COMMON_FIELDS.find((f) => f.name === "temperature");
  return (
    <li id={stepElementId(op.id)} onKeyDown={onKeyDown} data-testid="step-card" aria-label={`Step ${n}: ${meta.label}`}
      className={`scroll-mt-20 rounded-lg border bg-white shadow-xs ${problems > 0 ? "border-red-300" : "border-stone-200"}`}>
      <div className="flex flex-wrap items-end gap-2 border-b border-stone-100 px-3 py-2">
        <span className="mb-1.5 flex h-6 min-w-6 items-center justify-center rounded-full bg-stone-800 px-1.5 text-xs font-semibold text-white" aria-hidden>{n}</span>
        <SelectControl fieldKey={`${base}.type`} label={`Type of step ${n}`} hideLabel value={op.type} className="w-48"
          choices={OPERATION_TYPES.map((t) => ({ value: t.type, label: t.label }))}
          onChange={(v) => apply((s) => setOperationType(s, op.id, v as OperationType, library), null)} />
        {label ? <TextControl fieldKey={`${base}.label`} label={`Description of step ${n}`} hideLabel value={op.values.label ?? ""} className="min-w-40 flex-1"
          placeholder="Description (optional), e.g. sat. NaHCO₃ wash" messages={messages(`${base}.label`)}
          onChange={(v) => apply((s) => setOperationValue(s, op.id, "label", v), `${base}.label`)} /> : null}
        <div className="mb-1 flex gap-0.5" role="group" aria-label={`Step ${n} actions`}>
          <ToolButton id={`${fieldId(base)}-up`} label={`Move step ${n} up`} onClick={() => move(-1)} disabled={index === 0}>↑</ToolButton>
          <ToolButton id={`${fieldId(base)}-down`} label={`Move step ${n} down`} onClick={() => move(1)} disabled={index === count - 1}>↓</ToolButton>
          {onFold ? <ToolButton label={`${folded ? "Unfold" : "Fold"} step ${n}`} onClick={() => onFold(!folded)}>{folded ? "Unfold" : "Fold"}</ToolButton> : null}
          <ToolButton label={`Duplicate step ${n}`} onClick={duplicate}>Duplicate</ToolButton>
          <ToolButton label={`Remove step ${n}`} tone="danger" onClick={() => { apply((s) => removeOperation(s, op.id), null); announce(`Step ${n} removed. Ctrl+Z brings it back.`); }}>Remove</ToolButton>
        </div>
      </div>
      {folded ? (
        <p className="px-3 py-2 text-sm text-stone-700" data-testid="step-summary">
          {summary}{problems > 0 ? <span className="text-red-700"> · {problems} field{problems === 1 ? " needs" : "s need"} attention</span> : null}
          {flags.length > 0 ? <span className="text-amber-800"> · {flags.length} flag{flags.length === 1 ? "" : "s"}</span> : null}
        </p>
      ) : (
      <div className="space-y-3 px-3 py-3">
        <p className="text-xs text-stone-500">{meta.purpose}</p>
        {messages(base).map((m) => <p key={m} className="text-xs text-red-700">{m}</p>)}
        <CautionNotes cautions={cautions} />
        <div className="flex flex-wrap items-start gap-3" data-step-fields>
          {mainFields.map((f) => <OperationField key={f.name} op={op} field={f} stepNumber={n} />)}
          {temperature ? (
            <QuantityControl fieldKey={`${base}.temperature`} label="Temperature" units={temperature.units ?? []} className="w-36" placeholder="as above"
              quantity={{ value: op.values.temperature ?? "", unit: op.values[unitKey("temperature")] ?? "°C" }} messages={messages(`${base}.temperature`)}
              onBlur={() => touch(`${base}.temperature`)}
              onChange={(q) => apply((s) => setOperationValue(setOperationValue(s, op.id, "temperature", q.value), op.id, unitKey("temperature"), q.unit), `${base}.temperature`)} />
          ) : null}
        </div>
        {step ? (
          <section aria-label={`Prediction for step ${n}`} className={`rounded-md bg-stone-50 p-3 ${live.stale ? "opacity-60" : ""}`}>
            {live.stale ? <p className="mb-1 text-xs text-stone-500">From the last form the engine could read.</p> : null}
            <StepPrediction step={step} components={components} capacityMl={capacityMl} startMmol={startMmol} />
            {flags.length > 0 ? <div className="mt-2"><FlagNotes flags={flags} /></div> : null}
          </section>
        ) : null}
      </div>
      )}
    </li>
  );
}
