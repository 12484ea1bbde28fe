"use client";
// The mixture's components: each with its role, amount, molar mass and the partition data the engine uses (log P and
// pKa values), every value labelled with where it came from.
import Link from "next/link";
import { PROVENANCES, ROLES, type Provenance } from "@/lib/chem/schema";
import { unitsOf } from "@/lib/chem/units";
import { Badge } from "@/components/ui/badge";
import { newClientId } from "@/lib/workups-client/ids";
import { removeComponent, updateComponent } from "@/lib/workups-client/editor-actions";
import { type ComponentState, type PKaState } from "@/lib/workups-client/editor-types";
import { QuantityControl, SelectControl, TextControl, ToolButton, fieldId } from "./controls";
import { useEditor } from "./editor-context";
import { PROVENANCE_LABELS, roleLabel } from "./labels";

const AMOUNT_UNITS = [...unitsOf("amount"), "mg", "g"];
const provenanceChoices = PROVENANCES.map((p) => ({ value: p, label: PROVENANCE_LABELS[p] }));

export function ProvenanceBadge({ provenance }: { provenance: Provenance }) {
  const tone = provenance === "measured" ? "good" : provenance === "estimated" ? "low" : provenance === "group" ? "accent" : "high";
  return <Badge tone={tone}>{PROVENANCE_LABELS[provenance]}</Badge>;
}

export function ComponentsSection() {
  const { state } = useEditor();
  if (state.components.length === 0) {
    return <p className="text-sm text-stone-500" id={fieldId("components")}>No components yet. Add the product first, then what it must be separated from.</p>;
  }
  return (
    <ol className="space-y-3" aria-label="Components">
      {state.components.map((c, i) => <ComponentCard key={c.id} component={c} index={i} />)}
    </ol>
  );
}

function ComponentCard({ component: c, index }: { component: ComponentState; index: number }) {
  const { apply, messages, touch, problemCount } = useEditor();
  const base = `comp:${c.id}`;
  const patch = (p: Partial<ComponentState>, field: string) => apply((s) => updateComponent(s, c.id, p), `${base}.${field}`);
  const bind = (field: string) => ({ fieldKey: `${base}.${field}`, messages: messages(`${base}.${field}`), onBlur: () => touch(`${base}.${field}`) });
  const problems = problemCount(base);
  const label = c.name || `Component ${index + 1}`;
  return (
    <li className={`rounded-md border bg-white p-3 ${problems > 0 ? "border-red-200" : "border-stone-200"}`} data-testid="component-card" aria-label={label}>
      <div className="flex flex-wrap items-start gap-3">
        <TextControl {...bind("name")} label="Name" value={c.name} className="min-w-48 flex-1" onChange={(v) => patch({ name: v }, "name")} />
        <SelectControl {...bind("role")} label="Role" value={c.role} choices={ROLES.map((r) => ({ value: r, label: roleLabel(r) }))}
          onChange={(v) => patch({ role: v as ComponentState["role"] }, "role")} />
        <div className="pt-4">
          <ToolButton label={`Remove ${label}`} tone="danger" onClick={() => apply((s) => removeComponent(s, c.id), null)}>Remove</ToolButton>
        </div>
      </div>
      <div className="mt-2 flex flex-wrap items-start gap-3">
        <QuantityControl {...bind("amount")} label="Amount" quantity={c.amount} units={AMOUNT_UNITS} className="w-40" onChange={(q) => patch({ amount: q }, "amount")} />
        <TextControl {...bind("molarMass")} label="Molar mass (g/mol)" numeric value={c.molarMass} className="w-32" onChange={(v) => patch({ molarMass: v }, "molarMass")} />
        <LogPFields component={c} />
      </div>
      <div className="mt-2 border-t border-stone-100 pt-2">
        <PKaFields component={c} />
      </div>
      <p className="mt-2 text-xs text-stone-500">
        {c.compoundId ? <>Registered compound: <Link className="text-teal-800 underline" href={`/compounds/${c.compoundId}`} target="_blank">{c.name || "open"}</Link></> : "Not linked to a registered compound."}
        {c.smiles ? <span className="ml-2 font-mono break-all">{c.smiles}</span> : null}
        <span className="ml-2 text-stone-400">key {c.key}</span>
      </p>
      {messages(base).length > 0 ? <p className="mt-1 text-xs text-red-700">{messages(base).join("; ")}</p> : null}
    </li>
  );
}

function LogPFields({ component: c }: { component: ComponentState }) {
  const { apply, messages, touch } = useEditor();
  const key = `comp:${c.id}.logP`;
  const logP = c.logP ?? { value: "", provenance: "literature" as Provenance, source: "" };
  const set = (p: Partial<typeof logP>, field: string) => apply((s) => updateComponent(s, c.id, { logP: { ...logP, ...p } }), `${key}.${field}`);
  return (
    <div className="flex flex-wrap items-start gap-2">
      <TextControl fieldKey={key} label={<>log P <ProvenanceBadge provenance={logP.provenance} /></>} numeric value={logP.value} className="w-36"
        messages={messages(key)} onBlur={() => touch(key)} onChange={(v) => set({ value: v }, "value")}
        hint={logP.source || undefined} />
      <SelectControl fieldKey={`${key}.provenance`} label="log P from" value={logP.provenance} choices={provenanceChoices}
        onChange={(v) => set({ provenance: v as Provenance }, "provenance")} />
    </div>
  );
}

function PKaFields({ component: c }: { component: ComponentState }) {
  const { apply, messages, touch } = useEditor();
  const setPKas = (pKas: PKaState[], field: string | null) => apply((s) => updateComponent(s, c.id, { pKas }), field);
  const edit = (id: string, p: Partial<PKaState>, field: string) => setPKas(c.pKas.map((x) => (x.id === id ? { ...x, ...p } : x)), `pka:${id}.${field}`);
  return (
    <div>
      <p className="text-xs font-medium text-stone-700">Ionizable sites (pKa; for a base, of its conjugate acid)</p>
      {c.pKas.length === 0 ? <p className="mt-1 text-xs text-stone-500">None: the engine treats the compound as neutral at every pH.</p> : null}
      <ul className="mt-1 space-y-1">
        {c.pKas.map((p, i) => (
          <li key={p.id} className="flex flex-wrap items-start gap-2">
            <TextControl fieldKey={`pka:${p.id}.value`} label={`pKa ${i + 1} of ${c.name || "this component"}`} hideLabel numeric value={p.value} className="w-20"
              messages={messages(`pka:${p.id}.value`)} onBlur={() => touch(`pka:${p.id}.value`)} onChange={(v) => edit(p.id, { value: v }, "value")} />
            <SelectControl fieldKey={`pka:${p.id}.kind`} label={`Site ${i + 1} is an`} hideLabel value={p.kind}
              choices={[{ value: "acid", label: "acid (HA)" }, { value: "base", label: "base (BH⁺)" }]} onChange={(v) => edit(p.id, { kind: v as PKaState["kind"] }, "kind")} />
            <SelectControl fieldKey={`pka:${p.id}.provenance`} label={`Where pKa ${i + 1} comes from`} hideLabel value={p.provenance} choices={provenanceChoices}
              onChange={(v) => edit(p.id, { provenance: v as Provenance }, "provenance")} />
            <span className="pt-2"><ProvenanceBadge provenance={p.provenance} /></span>
            {p.source ? <span className="max-w-56 truncate pt-2 text-xs text-stone-500" title={p.source}>{p.source}</span> : null}
            <ToolButton label={`Remove pKa ${i + 1}`} onClick={() => setPKas(c.pKas.filter((x) => x.id !== p.id), null)}>×</ToolButton>
          </li>
        ))}
      </ul>
      <button type="button" className="mt-1 text-xs font-medium text-teal-800 hover:underline"
        onClick={() => setPKas([...c.pKas, { id: newClientId("p"), value: "", kind: "acid", provenance: "literature", source: "" }], null)}>
        Add a pKa
      </button>
    </div>
  );
}
