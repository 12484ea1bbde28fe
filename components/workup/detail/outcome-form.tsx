"use client";
// Reporting what was isolated: mass, purity and how it was measured, and optionally assays of single layers to
// locate a loss. Checked in the browser with the server's schema; the server then compares it with the prediction.
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { reportOutcomeAction } from "@/lib/workups/actions";
import { LAYER_PHASES, outcomeInputSchema, PURITY_METHODS, type OutcomeInputRaw, type PurityMethodName } from "@/lib/workups/schemas";
import { newClientId } from "@/lib/workups-client/ids";
import { parseNumber } from "@/lib/workups-client/to-spec";
import { Messages, QuantityControl, SelectControl, TextControl } from "@/components/workup/editor/controls";

export const PURITY_METHOD_LABELS: Record<PurityMethodName, string> = {
  qnmr: "qNMR with an internal standard", hplc: "HPLC (calibrated)", gc: "GC (calibrated)", weight_only: "Weight only (purity not measured)",
};

interface AssayRow { id: string; step: string; phase: string; compoundKey: string; amountMmol: string; volumeMl: string }

export interface OutcomeDefaults {
  isolatedMassMg: number | null;
  purityPct: number | null;
  purityMethod: string;
  notes: string;
}

export function OutcomeForm({ workupId, steps, components, productKey, defaults }: {
  workupId: string; steps: string[]; components: { key: string; name: string }[]; productKey: string | null; defaults: OutcomeDefaults | null;
}) {
  const router = useRouter();
  const [mass, setMass] = useState({ value: defaults?.isolatedMassMg != null ? String(defaults.isolatedMassMg) : "", unit: "mg" });
  const [purity, setPurity] = useState(defaults?.purityPct != null ? String(defaults.purityPct) : "");
  const [method, setMethod] = useState(defaults?.purityMethod ?? "qnmr");
  const [notes, setNotes] = useState(defaults?.notes ?? "");
  const [assays, setAssays] = useState<AssayRow[]>([]);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();

  /** What was typed, for the schema to judge (a blank mass is left out so the schema names it). */
  const payload = (): Record<string, unknown> => {
    const value = parseNumber(mass.value);
    return {
      ...(value !== undefined ? { isolatedMassMg: mass.unit === "g" ? value * 1000 : value } : {}),
      purityPct: parseNumber(purity) ?? null,
      purityMethod: method,
      notes,
      layerAssays: assays.map((a) => ({
        step: parseNumber(a.step), phase: a.phase, amountMmol: parseNumber(a.amountMmol),
        ...(a.compoundKey ? { compoundKey: a.compoundKey } : {}), ...(parseNumber(a.volumeMl) !== undefined ? { volumeMl: parseNumber(a.volumeMl) } : {}),
      })),
    };
  };

  const submit = () => {
    setDone(null);
    setFailure(null);
    const checked = outcomeInputSchema.safeParse(payload());
    if (!checked.success) {
      const out: Record<string, string[]> = {};
      for (const i of checked.error.issues) (out[i.path.map(String).join(".") || "form"] ??= []).push(i.message);
      setErrors(out);
      return;
    }
    setErrors({});
    startTransition(async () => {
      const input: OutcomeInputRaw = checked.data;
      const result = await reportOutcomeAction(workupId, input);
      if (result.ok) {
        setDone(result.data.recoveryPct !== null ? `Saved: recovery ${result.data.recoveryPct.toFixed(1)} %.` : "Saved.");
        router.refresh();
      } else {
        setErrors(result.fieldErrors ?? {});
        setFailure(result.message);
      }
    });
  };

  const err = (k: string) => errors[k] ?? [];
  const setAssay = (id: string, patch: Partial<AssayRow>) => setAssays((rows) => rows.map((r) => (r.id === id ? { ...r, ...patch } : r)));
  return (
    <form className="space-y-3" aria-label="Report the outcome" onSubmit={(e) => { e.preventDefault(); submit(); }} noValidate>
      <div className="flex flex-wrap items-start gap-3">
        <QuantityControl fieldKey="outcome.isolatedMassMg" label="Isolated mass" quantity={mass} units={["mg", "g"]} className="w-40" messages={err("isolatedMassMg")} onChange={setMass} />
        <SelectControl fieldKey="outcome.purityMethod" label="Purity measured by" value={method} className="min-w-56" messages={err("purityMethod")}
          choices={PURITY_METHODS.map((m) => ({ value: m, label: PURITY_METHOD_LABELS[m] }))} onChange={setMethod} />
        <TextControl fieldKey="outcome.purityPct" label="Purity (mass %)" numeric value={purity} className="w-32" messages={err("purityPct")} onChange={setPurity}
          hint={method === "weight_only" ? "Optional: without it the mass is taken as pure product." : undefined} />
      </div>
      <fieldset className="space-y-2">
        <legend className="text-xs font-medium text-stone-700">Assays of single layers (optional: locate where product went)</legend>
        {assays.map((a, i) => (
          <div key={a.id} className="flex flex-wrap items-start gap-2">
            <SelectControl fieldKey={`outcome.assay.${i}.step`} label={`Assay ${i + 1}: step`} value={a.step} messages={err(`layerAssays.${i}.step`)}
              choices={steps.map((s, j) => ({ value: String(j + 1), label: `${j + 1}. ${s}` }))} onChange={(v) => setAssay(a.id, { step: v })} />
            <SelectControl fieldKey={`outcome.assay.${i}.phase`} label="Layer" value={a.phase} messages={err(`layerAssays.${i}.phase`)}
              choices={LAYER_PHASES.map((p) => ({ value: p, label: p }))} onChange={(v) => setAssay(a.id, { phase: v })} />
            <SelectControl fieldKey={`outcome.assay.${i}.compound`} label="Component" value={a.compoundKey} messages={err(`layerAssays.${i}.compoundKey`)}
              choices={components.map((c) => ({ value: c.key, label: c.name }))} onChange={(v) => setAssay(a.id, { compoundKey: v })} />
            <TextControl fieldKey={`outcome.assay.${i}.amount`} label="Amount (mmol)" numeric value={a.amountMmol} className="w-28" messages={err(`layerAssays.${i}.amountMmol`)} onChange={(v) => setAssay(a.id, { amountMmol: v })} />
            <TextControl fieldKey={`outcome.assay.${i}.volume`} label="Layer volume (mL)" numeric value={a.volumeMl} className="w-32" messages={err(`layerAssays.${i}.volumeMl`)} onChange={(v) => setAssay(a.id, { volumeMl: v })} />
            <button type="button" className="mt-5 text-xs text-red-700 hover:underline" onClick={() => setAssays((rows) => rows.filter((r) => r.id !== a.id))}>Remove assay {i + 1}</button>
          </div>
        ))}
        <button type="button" className="text-xs font-medium text-teal-800 hover:underline"
          onClick={() => setAssays((rows) => [...rows, { id: newClientId("a"), step: "1", phase: "aqueous", compoundKey: productKey ?? components[0]?.key ?? "", amountMmol: "", volumeMl: "" }])}>
          Add a layer assay
        </button>
      </fieldset>
      <div>
        <label htmlFor="outcome-notes" className="block text-xs font-medium text-stone-700">Notes</label>
        <textarea id="outcome-notes" rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} className={`${inputClass} mt-0.5`} placeholder="Emulsion in the second wash, solid at the interface…" />
        <Messages fieldKey="outcome.notes" messages={err("notes")} />
      </div>
      {failure ? <Notice tone="error" title="Not saved">{failure}</Notice> : null}
      {done ? <Notice tone="success">{done}</Notice> : null}
      <Button type="submit" disabled={pending}>{pending ? "Saving…" : defaults ? "Update the outcome" : "Report the outcome"}</Button>
    </form>
  );
}
