// The saved components with their amounts and partition data, each value labelled with where it came from.
import Link from "next/link";
import { Badge } from "@/components/ui/badge";
import { formatNumber } from "@/components/ui/format";
import type { JsonObject, JsonValue } from "@/lib/workups/record";

const asRecord = (v: JsonValue | undefined): JsonObject => (v !== null && typeof v === "object" && !Array.isArray(v) ? v : {});
const text = (v: JsonValue | undefined) => (typeof v === "string" ? v : typeof v === "number" ? formatNumber(v) : "");
const PROVENANCE: Record<string, string> = { estimated: "estimated", literature: "literature", measured: "measured", group: "group value" };

function Provenance({ value }: { value: JsonValue | undefined }) {
  const p = text(value);
  return p ? <Badge tone={p === "measured" ? "good" : p === "estimated" ? "low" : p === "group" ? "accent" : "high"}>{PROVENANCE[p] ?? p}</Badge> : null;
}

export function ComponentsView({ spec, links }: { spec: JsonObject; links: Map<string, { id: string; name: string }> }) {
  const components = Array.isArray(spec.components) ? spec.components.map(asRecord) : [];
  if (components.length === 0) return <p className="text-sm text-stone-500">No components recorded.</p>;
  return (
    <ul className="divide-y divide-stone-100">
      {components.map((c, i) => {
        const amount = asRecord(c.amount);
        const logP = asRecord(c.logP);
        const pKas = Array.isArray(c.pKas) ? c.pKas.map(asRecord) : [];
        const compound = links.get(text(c.key));
        return (
          <li key={text(c.key) || i} className="py-2 text-sm">
            <p>
              <span className="font-medium text-stone-900">{text(c.name) || text(c.key)}</span>
              <span className="ml-2 text-stone-500">{text(c.role).replace(/_/g, " ")}</span>
              {amount.value !== undefined ? <span className="ml-2 tabular-nums text-stone-700">{text(amount.value)} {text(amount.unit)}</span> : null}
              {c.molarMass !== undefined ? <span className="ml-2 text-xs text-stone-500">{text(c.molarMass)} g/mol</span> : null}
            </p>
            <p className="mt-0.5 flex flex-wrap items-center gap-x-3 gap-y-1 text-xs text-stone-600">
              {logP.value !== undefined ? <span>log P {text(logP.value)} <Provenance value={logP.provenance} /></span> : <span>no log P</span>}
              {pKas.map((p, j) => <span key={j}>pKa {text(p.value)} ({text(p.kind) === "base" ? "base" : "acid"}) <Provenance value={p.provenance} /></span>)}
              {compound ? <Link href={`/compounds/${compound.id}`} className="text-teal-800 underline">registry entry</Link> : null}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
