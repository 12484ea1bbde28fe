"use client";
// "Scale to…": rescale every amount and volume of the workup to a new reaction scale in one undoable edit.
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { parseNumber } from "@/lib/workups-client/to-spec";
import { scaleWorkup } from "@/lib/workups-client/template";
import { useEditor } from "./editor-context";

export function ScaleControl() {
  const { state, apply } = useEditor();
  const id = useId();
  const [target, setTarget] = useState("");
  const [note, setNote] = useState("");
  const run = () => {
    const n = parseNumber(target);
    const result = n === undefined ? null : scaleWorkup(state, n);
    if (!result) {
      setNote("Enter the current reaction scale and a new scale above 0 mmol.");
      return;
    }
    apply(() => result.state, null);
    const funnel = result.overFunnel.length
      ? ` Step ${result.overFunnel.map((o) => `${o.step} (${Math.round(o.portionMl)} mL a portion)`).join(", ")} no longer fits the funnel: use a larger funnel or more, smaller portions.`
      : "";
    setNote(`Scaled by ${Number(result.factor.toPrecision(3))}×; portions, pH targets and temperatures kept.${funnel}`);
  };
  return (
    <div className="sm:col-span-6 flex flex-wrap items-end gap-2">
      <div>
        <label htmlFor={id} className="block text-xs font-medium text-stone-700">Scale the whole workup to (mmol)</label>
        <input id={id} inputMode="decimal" value={target} onChange={(e) => setTarget(e.target.value)} className={`${inputClass} mt-0.5 w-32`}
          onKeyDown={(e) => { if (e.key === "Enter") { e.preventDefault(); run(); } }} />
      </div>
      <Button variant="secondary" onClick={run} disabled={target.trim() === ""}>Scale</Button>
      <p role="status" className="w-full text-xs text-stone-600">{note}</p>
    </div>
  );
}
