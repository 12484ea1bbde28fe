"use client";
// The ordered steps and the control that adds one (choose a type, Enter or the button). The new step takes the
// usual bench values (lib/workups-client/operation-forms.ts) and receives focus.
import { useState } from "react";
import { type OperationType } from "@/lib/chem/schema";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { insertOperation } from "@/lib/workups-client/editor-actions";
import { parseNumber, specInput } from "@/lib/workups-client/to-spec";
import { describeOperation } from "@/lib/workups-client/describe";
import { OPERATION_TYPES, newOperation } from "@/lib/workups-client/operation-forms";
import { drawingCapacityMl } from "@/lib/workups-client/funnel-geometry";
import { type ComponentName } from "@/components/workup/prediction/phase-bars";
import { OperationCard, stepElementId } from "./operation-card";
import { fieldId } from "./controls";
import { useEditor } from "./editor-context";
import { ProcedurePaste } from "./procedure-paste";

export function focusFirstField(opId: string): void {
  requestAnimationFrame(() => {
    document.getElementById(stepElementId(opId))?.querySelector<HTMLElement>("[data-step-fields] input, [data-step-fields] select")?.focus();
  });
}

export function OperationsSection({ announce }: { announce: (text: string) => void }) {
  const { state, apply, live, library, messages } = useEditor();
  const [type, setType] = useState<OperationType>("wash");
  const [folded, setFolded] = useState<ReadonlySet<string>>(new Set());
  const fold = (id: string, on: boolean) => setFolded((f) => { const next = new Set(f); if (on) next.add(id); else next.delete(id); return next; });
  const specOps = specInput(state).operations;
  const words = (i: number) => (Array.isArray(specOps) && specOps[i] !== undefined ? describeOperation(specOps[i], library) : "");
  const prediction = live.prediction;
  const funnel = parseNumber(state.settings.funnel.value);
  const capacityMl = prediction ? drawingCapacityMl(prediction.steps, state.settings.funnel.unit === "mL" ? funnel : undefined) : 100;
  const components: ComponentName[] = prediction?.components.map((c) => ({ key: c.key, name: c.name, isProduct: c.key === prediction.productKey })) ?? [];
  const startMmol = Object.fromEntries(prediction?.components.map((c) => [c.key, c.startMmol]) ?? []);
  const add = () => {
    const op = newOperation(type, { mixture: state.mixture.solvents, before: state.operations, library });
    apply((s) => insertOperation(s, op), null);
    announce(`Added step ${state.operations.length + 1}: ${OPERATION_TYPES.find((t) => t.type === type)?.label ?? type}.`);
    focusFirstField(op.id);
  };
  return (
    <div className="space-y-3">
      <div id={fieldId("operations")} tabIndex={-1}>{messages("operations").map((m) => <p key={m} className="text-xs text-red-700">{m}</p>)}</div>
      {state.operations.length === 0 ? <p className="text-sm text-stone-500">No steps yet. Add them in the order they were done.</p> : (
        <>
          <div className="flex justify-end gap-2 text-xs">
            <button type="button" className="text-teal-800 underline" onClick={() => setFolded(new Set(state.operations.map((o) => o.id)))}>Fold all steps</button>
            <button type="button" className="text-teal-800 underline" onClick={() => setFolded(new Set())}>Unfold all</button>
          </div>
          <ol className="space-y-3" aria-label="Steps of the workup">
            {state.operations.map((op, i) => (
              <OperationCard key={op.id} op={op} index={i} count={state.operations.length} capacityMl={capacityMl} components={components} startMmol={startMmol} announce={announce}
                folded={folded.has(op.id)} onFold={(on) => fold(op.id, on)} summary={words(i)} />
            ))}
          </ol>
        </>
      )}
      <div className="flex flex-wrap items-end gap-2 rounded-md border border-dashed border-stone-300 bg-stone-50/60 p-3">
        <div>
          <label htmlFor="add-step-type" className="block text-xs font-medium text-stone-700">Add a step</label>
          <select id="add-step-type" value={type} onChange={(e) => setType(e.target.value as OperationType)} className={`${inputClass} mt-0.5 py-1.5`}
            onKeyDown={(e) => { if (e.key === "Enter") { e.preventDefault(); add(); } }} aria-describedby="add-step-hint">
            {OPERATION_TYPES.map((t) => <option key={t.type} value={t.type}>{t.label}</option>)}
          </select>
        </div>
        <Button variant="secondary" onClick={add}>Add step</Button>
        <p id="add-step-hint" className="w-full text-xs text-stone-500">Enter adds the chosen step at the end; Alt+↑/↓ inside a step moves it.</p>
        <ProcedurePaste announce={announce} />
      </div>
    </div>
  );
}
