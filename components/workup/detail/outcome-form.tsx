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
import { fieldId, Messages, QuantityControl, SelectControl, TextControl } from "@/components/workup/editor/controls";
import { ErrorSummary } from "@/components/ui/error-summary";
import { inFormWords, summaryLine, type FieldLabel } from "@/lib/workups-client/field-labels";

export const PURITY_METHOD_LABELS: Record<PurityMethodName, string> = {
  qnmr: "qNMR with an internal standard", hplc: "HPLC (calibrated)", gc: "GC (calibrated)", weight_only: "Weight only (purity not measured)",
};

const PHASE_LABELS: Record<(typeof LAYER_PHASES)[number], string> = { organic: "Organic layer", aqueous: "Aqueous layer", emulsion: "Emulsion", solid: "Solid" };

/** A layer assay's fields: the schema's name, the control's key suffix and label. */
const ASSAY_FIELDS: Record<string, { control: string; label: string; unit: string | null }> = {
  step: { control: "step", label: "Step", unit: null }, phase: { control: "phase", label: "Layer", unit: null },
  compoundKey: { control: "compound", label: "Component", unit: null }, amountMmol: { control: "amount", label: "Amount (mmol)", unit: "mmol" },
  volumeMl: { control: "volume", label: "Layer volume (mL)", unit: "mL" }, portion: { control: "step", label: "Portion", unit: null },
};

const TOP_FIELDS: Record<string, { targetId: string; label: string }> = {
  isolatedMassMg: { targetId: fieldId("outcome.isolatedMassMg"), label: "Isolated mass" },
  purityMethod: { targetId: fieldId("outcome.purityMethod"), label: "Purity measured by" },
  purityPct: { targetId: fieldId("outcome.purityPct"), label: "Purity (mass %)" },
  notes: { targetId: "outcome-notes", label: "Notes" },
  layerAssays: { targetId: "outcome-assays", label: "Assays of single layers" },
};

/** Where a message of the outcome schema belongs: the control's id and the words to name it by. */
function placeOf(path: string): { targetId: string; name: FieldLabel; field: string } {
  const [head, index, field] = path.split(".");
  if (head === "layerAssays" && index !== undefined && field !== undefined) {
    const f = ASSAY_FIELDS[field] ?? { control: "step", label: "Assay", unit: null };
    return { targetId: fieldId(`outcome.assay.${index}.${f.control}`), name: { place: `Assay ${Number(index) + 1}`, label: f.label, unit: f.unit }, field };
  }
  const top = TOP_FIELDS[head ?? ""];
  return { targetId: top?.targetId ?? "outcome-form", name: { place: null, label: top?.label ?? null, unit: null }, field: head ?? "" };
}

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
  const [attempt, setAttempt] = useState(0);

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
      setAttempt((n) => n + 1);
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
        // Field messages go to the summary; a refusal without them (a lost connection, a stale page) is said here.
        setFailure(result.fieldErrors ? null : result.message);
        if (result.fieldErrors) setAttempt((n) => n + 1);
      }
    });
  };

  const worded = (path: string) => { const p = placeOf(path); return (errors[path] ?? []).map((m) => inFormWords(m, p.name, p.field)); };
  const err = worded;
  const summary = Object.keys(errors).flatMap((path) => {
    const p = placeOf(path);
    return worded(path).map((text) => ({ targetId: p.targetId, text: summaryLine(text, p.name) }));
  });
  const setAssay = (id: string, patch: Partial<AssayRow>) => setAssays((rows) => rows.map((r) => (r.id === id ? { ...r, ...patch } : r)));
  return (
    <form id="outcome-form" className="space-y-3" aria-label="Report the outcome" onSubmit={(e) => { e.preventDefault(); submit(); }} noValidate>
      <ErrorSummary id="outcome-errors" items={summary} attempt={attempt}
        title={`Not saved: ${summary.length} problem${summary.length === 1 ? "" : "s"} to fix`} />
      <div className="flex flex-wrap items-start gap-3">
        <QuantityControl fieldKey="outcome.isolatedMassMg" label="Isolated mass" quantity={mass} units={["mg", "g"]} className="w-40" messages={err("isolatedMassMg")} onChange={setMass} />
        <SelectControl fieldKey="outcome.purityMethod" label="Purity measured by" value={method} className="min-w-56" messages={err("purityMethod")}
          choices={PURITY_METHODS.map((m) => ({ value: m, label: PURITY_METHOD_LABELS[m] }))} onChange={setMethod} />
        <TextControl fieldKey="outcome.purityPct" label="Purity (mass %)" numeric value={purity} className="w-32" messages={err("purityPct")} onChange={setPurity}
          hint={method === "weight_only" ? "Optional: without it the mass is taken as pure product." : undefined} />
      </div>
      <fieldset id="outcome-assays" className="space-y-2">
        <legend className="text-xs font-medium text-stone-700">Assays of single layers (optional: locate where product went)</legend>
        {assays.map((a, i) => (
          <div key={a.id} className="flex flex-wrap items-start gap-2">
            <SelectControl fieldKey={`outcome.assay.${i}.step`} label={`Assay ${i + 1}: step`} value={a.step} messages={err(`layerAssays.${i}.step`)}
              choices={steps.map((s, j) => ({ value: String(j + 1), label: `${j + 1}. ${s}` }))} onChange={(v) => setAssay(a.id, { step: v })} />
            <SelectControl fieldKey={`outcome.assay.${i}.phase`} label="Layer" value={a.phase} messages={err(`layerAssays.${i}.phase`)}
              choices={LAYER_PHASES.map((p) => ({ value: p, label: PHASE_LABELS[p] }))} onChange={(v) => setAssay(a.id, { phase: v })} />
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
