"use client";
// One field of one step, drawn from the engine's field metadata (lib/chem/operation-types.ts): pickers for library
// entries, numbers with their units, choices, and the composite rinse and reactive-species fields.
import { type OperationFieldMeta } from "@/lib/chem/operation-types";
import { unitsOf } from "@/lib/chem/units";
import { savedStreamsBefore, setOperationList, setOperationValue } from "@/lib/workups-client/editor-actions";
import { unitKey, type OperationState } from "@/lib/workups-client/editor-types";
import { dryingAgentChoices, reagentChoices, solventChoices, withCurrent, type ChoiceGroup } from "@/lib/workups-client/library-options";
import { CheckControl, Messages, QuantityControl, SelectControl, TextControl, fieldId } from "./controls";
import { useEditor } from "./editor-context";
import { optionLabel } from "./labels";

export function OperationField({ op, field, stepNumber }: { op: OperationState; field: OperationFieldMeta; stepNumber: number }) {
  const { state, apply, messages, touch, library } = useEditor();
  const key = `op:${op.id}.${field.name}`;
  const common = { fieldKey: key, messages: messages(key), onBlur: () => touch(key), ...(field.hint ? { hint: field.hint } : {}) };
  const value = op.values[field.name] ?? "";
  const setValue = (name: string, v: string) => apply((s) => setOperationValue(s, op.id, name, v), `op:${op.id}.${name}`);
  const label = field.label;
  const pick = (groups: ChoiceGroup[]) => (
    <SelectControl {...common} label={label} value={value} groups={withCurrent(groups, value)} blank={field.required ? "Choose…" : "—"} onChange={(v) => setValue(field.name, v)} />
  );
  switch (field.kind) {
    case "solvent": return pick(solventChoices(library, op.type === "extract" ? "layer" : op.type === "remove_cosolvent" ? "miscible" : "any"));
    case "reagent": return pick(reagentChoices(library, "solution"));
    case "salt": return pick(reagentChoices(library, "solid"));
    case "agent": return pick(dryingAgentChoices(library));
    case "quantity":
      return (
        <QuantityControl {...common} label={label} units={field.units ?? []} className="w-44"
          quantity={{ value, unit: op.values[unitKey(field.name)] ?? field.units?.[0] ?? "" }}
          onChange={(q) => apply((s) => setOperationValue(setOperationValue(s, op.id, field.name, q.value), op.id, unitKey(field.name), q.unit), key)} />
      );
    case "integer": case "fraction": case "pH":
      return <TextControl {...common} label={label} numeric value={value} className="w-28" placeholder={field.default !== undefined ? String(field.default) : undefined} onChange={(v) => setValue(field.name, v)} />;
    case "layer": case "filterKeep": case "method": case "mode":
      return <SelectControl {...common} label={label} value={value} choices={(field.options ?? []).map((o) => ({ value: o, label: optionLabel(o) }))} blank={field.required ? undefined : "Default"} onChange={(v) => setValue(field.name, v)} />;
    case "streamName":
      return <TextControl {...common} label={label} value={value} className="w-48" placeholder={field.name === "saveAs" ? "e.g. first aqueous" : undefined} onChange={(v) => setValue(field.name, v)} />;
    case "boolean":
      if (field.name === "peroxideTested") {
        return <SelectControl {...common} label={label} value={value} blank="Not recorded" choices={[{ value: "true", label: "Yes, tested" }, { value: "false", label: "No" }]} onChange={(v) => setValue(field.name, v)} />;
      }
      return <CheckControl {...common} label={label} checked={value === "true"} onChange={(v) => setValue(field.name, v ? "true" : "")} />;
    case "streamNames": {
      const choices = [...new Set([...savedStreamsBefore(state, op.id), ...(op.lists[field.name] ?? [])])];
      return <CheckList fieldKey={key} legend={label} choices={choices.map((n) => ({ value: n, label: n }))} selected={op.lists[field.name] ?? []}
        empty={`No earlier step saves a layer. Give an earlier step a name under “Save the other layer as”.`}
        onChange={(list) => apply((s) => setOperationList(s, op.id, field.name, list), key)} />;
    }
    case "components":
      return <CheckList fieldKey={key} legend={label} choices={state.components.map((c) => ({ value: c.key, label: c.name || c.key }))} selected={op.lists[field.name] ?? []}
        empty="Add components first." onChange={(list) => apply((s) => setOperationList(s, op.id, field.name, list), key)} />;
    case "rinse": return <RinseField op={op} field={field} setValue={setValue} />;
    case "reactive": return <ReactiveField op={op} field={field} setValue={setValue} stepNumber={stepNumber} />;
  }
}

function CheckList({ fieldKey, legend, choices, selected, onChange, empty }: {
  fieldKey: string; legend: string; choices: { value: string; label: string }[]; selected: string[]; onChange: (l: string[]) => void; empty: string;
}) {
  const { messages } = useEditor();
  return (
    <fieldset id={fieldId(fieldKey)} className="min-w-48">
      <legend className="text-xs font-medium text-stone-700">{legend}</legend>
      {choices.length === 0 ? <p className="mt-1 text-xs text-stone-500">{empty}</p> : null}
      <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
        {choices.map((c) => (
          <label key={c.value} className="flex items-center gap-1.5 text-sm">
            <input type="checkbox" className="accent-teal-700" checked={selected.includes(c.value)}
              onChange={(e) => onChange(e.target.checked ? [...selected, c.value] : selected.filter((v) => v !== c.value))} />
            {c.label}
          </label>
        ))}
      </div>
      <Messages fieldKey={fieldKey} messages={messages(fieldKey)} />
    </fieldset>
  );
}

function RinseField({ op, field, setValue }: { op: OperationState; field: OperationFieldMeta; setValue: (name: string, v: string) => void }) {
  const { apply, messages, touch, library } = useEditor();
  const base = `op:${op.id}.${field.name}`;
  const solvent = op.values[`${field.name}.solvent`] ?? "";
  const volumePath = `${field.name}.volume`;
  return (
    <div className="flex flex-wrap gap-2">
      <SelectControl fieldKey={`${base}.solvent`} label="Rinse solvent" value={solvent} blank={op.type === "dry" ? "Default rinse" : "No rinse"} groups={withCurrent(solventChoices(library, "any"), solvent)}
        messages={[...messages(base), ...messages(`${base}.solvent`)]} onBlur={() => touch(`${base}.solvent`)} onChange={(v) => setValue(`${field.name}.solvent`, v)} />
      <QuantityControl fieldKey={`${base}.volume`} label="Rinse volume" units={unitsOf("volume")} className="w-36" messages={messages(`${base}.volume`)} onBlur={() => touch(`${base}.volume`)}
        {...(field.hint ? { hint: field.hint } : {})}
        quantity={{ value: op.values[volumePath] ?? "", unit: op.values[unitKey(volumePath)] ?? "mL" }}
        onChange={(q) => apply((s) => setOperationValue(setOperationValue(s, op.id, volumePath, q.value), op.id, unitKey(volumePath), q.unit), `${base}.volume`)} />
    </div>
  );
}

function ReactiveField({ op, field, setValue, stepNumber }: { op: OperationState; field: OperationFieldMeta; setValue: (name: string, v: string) => void; stepNumber: number }) {
  const { apply, messages, touch } = useEditor();
  const base = `op:${op.id}.${field.name}`;
  const amountPath = `${field.name}.amount`;
  return (
    <fieldset className="flex flex-wrap gap-2 rounded border border-stone-100 p-2">
      <legend className="px-1 text-xs font-medium text-stone-700">{field.label} (optional; estimates the gas released)</legend>
      <TextControl fieldKey={`${base}.name`} label="Species" value={op.values[`${field.name}.name`] ?? ""} placeholder="e.g. LiAlH₄" className="w-36"
        messages={[...messages(base), ...messages(`${base}.name`)]} onBlur={() => touch(`${base}.name`)} onChange={(v) => setValue(`${field.name}.name`, v)} />
      <QuantityControl fieldKey={`${base}.amount`} label="Amount left to quench" units={unitsOf("amount")} className="w-40" messages={messages(`${base}.amount`)} onBlur={() => touch(`${base}.amount`)}
        quantity={{ value: op.values[amountPath] ?? "", unit: op.values[unitKey(amountPath)] ?? "mmol" }}
        onChange={(q) => apply((s) => setOperationValue(setOperationValue(s, op.id, amountPath, q.value), op.id, unitKey(amountPath), q.unit), `${base}.amount`)} />
      <TextControl fieldKey={`${base}.gasPerMol`} label={`Gas (mol per mol) in step ${stepNumber}`} numeric value={op.values[`${field.name}.gasPerMol`] ?? ""} className="w-40"
        hint="H₂ per mol quenched, e.g. 4 for LiAlH₄ with water." messages={messages(`${base}.gasPerMol`)} onBlur={() => touch(`${base}.gasPerMol`)}
        onChange={(v) => setValue(`${field.name}.gasPerMol`, v)} />
    </fieldset>
  );
}
