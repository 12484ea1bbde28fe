// Where a prediction's partition coefficients came from, for the workup page: one line per component and solvent,
// e.g. "Acetanilide in Ethyl acetate: log K 0.52 — group data, n = 4, ±0.12". Server-renderable (no hooks).
import { type PartitionSource } from "../overlay";

export function PartitionProvenance({ sources, names = {} }: { sources: readonly PartitionSource[] | undefined; names?: Readonly<Record<string, string>> }) {
  if (!sources || sources.length === 0) return null;
  return (
    <ul className="space-y-1 text-sm" aria-label="Partition coefficients used">
      {sources.map((s) => (
        <li key={`${s.component}:${s.solvent}`} className="text-stone-700">
          <span className="font-medium">{names[s.component] ?? s.component}</span> in {names[`solvent:${s.solvent}`] ?? s.solvent}: log K {s.logK.toFixed(2)}{" "}
          <span className={s.origin === "group" ? "rounded bg-teal-50 px-1.5 py-0.5 text-teal-800" : "text-stone-500"} data-provenance={s.origin}>
            {s.label}
          </span>
        </li>
      ))}
    </ul>
  );
}
