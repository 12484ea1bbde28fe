// The starting mixture of a saved workup: solvents and aqueous reagents with their volumes, and the shared settings.
import { type Library } from "@/lib/chem/library";
import type { JsonObject, JsonValue } from "@/lib/workups/record";
import { libraryName } from "@/lib/workups-client/library-options";

const asRecord = (v: JsonValue | undefined): JsonObject => (v !== null && typeof v === "object" && !Array.isArray(v) ? v : {});
const text = (v: JsonValue | undefined) => (typeof v === "string" ? v : typeof v === "number" ? String(v) : "");
const qty = (v: JsonValue | undefined) => `${text(asRecord(v).value)} ${text(asRecord(v).unit)}`.trim();

export function MixtureView({ spec, library }: { spec: JsonObject; library: Library }) {
  const mixture = asRecord(spec.mixture);
  const rows = [
    ...(Array.isArray(mixture.solvents) ? mixture.solvents.map(asRecord).map((s) => `${libraryName(library, text(s.solvent))}, ${qty(s.volume)}`) : []),
    ...(Array.isArray(mixture.reagents) ? mixture.reagents.map(asRecord).map((r) => `${libraryName(library, text(r.reagent))} (already added), ${qty(r.volume)}`) : []),
  ];
  const settings = [spec.temperature ? `at ${qty(spec.temperature)}` : "", spec.funnel ? `funnel ${qty(spec.funnel)}` : ""].filter(Boolean);
  return (
    <div className="text-sm">
      {rows.length === 0 ? <p className="text-stone-500">No starting mixture recorded.</p> : <p className="text-stone-800">{rows.join("; ")}</p>}
      {settings.length > 0 ? <p className="mt-1 text-xs text-stone-500">{settings.join(", ")}</p> : null}
    </div>
  );
}
