"use client";
// Add a partition measurement: the amount (or concentration) found in each layer after equilibration, the volumes,
// the aqueous pH measured after equilibration and the temperature. The server converts it to the neutral log K.
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Field, FieldErrors, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";
import type { FieldErrors as Errors } from "@/lib/errors";
import { addMeasurementAction } from "../actions";
import { MEASUREMENT_METHODS, METHOD_LABELS } from "../schemas";

function Select({ label, name, options, defaultValue, errors, onChange }: {
  label: string; name: string; options: { value: string; label: string }[]; defaultValue?: string; errors?: string[]; onChange?: (v: string) => void;
}) {
  const id = `field-${name}`;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-stone-800">{label}</label>
      <select id={id} name={name} defaultValue={defaultValue} className={inputClass} aria-invalid={errors?.length ? true : undefined}
        onChange={(e) => onChange?.(e.target.value)}>
        {options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
      </select>
      <FieldErrors id={`${id}-errors`} errors={errors} />
    </div>
  );
}

export function MeasurementForm({ compoundId, solvents }: { compoundId: string; solvents: { key: string; name: string }[] }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [basis, setBasis] = useState("amount");
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);

  function submit(form: HTMLFormElement) {
    const data = Object.fromEntries([...new FormData(form).entries()].map(([k, v]) => [k, typeof v === "string" ? v : ""]));
    startTransition(async () => {
      const result = await addMeasurementAction({ ...data, compoundId } as Parameters<typeof addMeasurementAction>[0]);
      if (result.ok) {
        const d = result.data;
        const value = d.bound === "value" ? `${d.logK.toFixed(2)} ± ${d.se.toFixed(2)}` : `${d.bound === "lower" ? "≥" : "≤"} ${d.logK.toFixed(2)}`;
        setErrors({});
        setMessage({ tone: "success", text: `Saved: log D ${d.logD.toFixed(2)}, neutral log K ${value}. The workups that use this compound are being re-predicted.` });
        form.reset();
        setBasis("amount");
        router.refresh();
      } else {
        setErrors(result.fieldErrors ?? {});
        setMessage({ tone: "error", text: result.message });
      }
    });
  }

  return (
    <form noValidate aria-label="Add a partition measurement" className="space-y-4" onSubmit={(e) => { e.preventDefault(); submit(e.currentTarget); }}>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-3">
        <Select label="Organic solvent" name="solventKey" options={solvents.map((s) => ({ value: s.key, label: s.name }))} defaultValue="etoac" errors={errors["solventKey"]} />
        <Select label="Method" name="method" options={MEASUREMENT_METHODS.map((m) => ({ value: m, label: METHOD_LABELS[m] }))} errors={errors["method"]} />
        <Select label="Entered as" name="basis" options={[{ value: "amount", label: "Amounts and volumes" }, { value: "concentration", label: "Concentrations" }]}
          defaultValue="amount" errors={errors["basis"]} onChange={setBasis} />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label={basis === "amount" ? "Amount in the organic layer" : "Concentration in the organic layer"} name="organic" inputMode="decimal" required errors={errors["organic"]}
          hint="Any unit, the same for both layers (mg, µmol, calibrated peak area)." />
        <Field label={basis === "amount" ? "Amount in the aqueous layer" : "Concentration in the aqueous layer"} name="aqueous" inputMode="decimal" required errors={errors["aqueous"]} />
        {basis === "amount" ? (
          <>
            <Field label="Organic layer volume (mL)" name="organicVolumeMl" inputMode="decimal" errors={errors["organicVolumeMl"]} hint="Measured after separation." />
            <Field label="Aqueous layer volume (mL)" name="aqueousVolumeMl" inputMode="decimal" errors={errors["aqueousVolumeMl"]} />
            <Field label="Amount added (optional)" name="totalAmount" inputMode="decimal" errors={errors["totalAmount"]} hint="Same unit; checks the mass balance (90–110 %)." />
          </>
        ) : null}
        <Select label="Below detection" name="belowDetection" errors={errors["belowDetection"]}
          options={[{ value: "none", label: "Both layers quantified" }, { value: "aqueous", label: "Aqueous layer below detection (value is the limit)" }, { value: "organic", label: "Organic layer below detection (value is the limit)" }]} />
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Aqueous pH after equilibration" name="aqueousPh" inputMode="decimal" errors={errors["aqueousPh"]} />
        <Field label="Temperature (°C)" name="temperatureC" inputMode="decimal" placeholder="25" errors={errors["temperatureC"]} />
        <Field label="Standard error of log D (optional)" name="logDSe" inputMode="decimal" errors={errors["logDSe"]} hint="From replicates; a default per method otherwise." />
      </div>
      <div className="space-y-1">
        <label htmlFor="field-notes" className="block text-sm font-medium text-stone-800">Notes</label>
        <textarea id="field-notes" name="notes" rows={2} className={inputClass} placeholder="Assay method, internal standard, shake and settle times" />
        <FieldErrors errors={errors["notes"]} />
      </div>
      <button type="submit" disabled={pending} className={buttonClass("primary")}>{pending ? "Saving…" : "Add measurement"}</button>
    </form>
  );
}
