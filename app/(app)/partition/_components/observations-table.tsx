import Link from "next/link";
import { Badge } from "@/components/ui/badge";
import { formatDate } from "@/components/ui/format";
import { ExclusionButton } from "@/lib/partition/components/exclusion-button";
import { type ObservationRow } from "@/lib/partition/queries";
import { solventName } from "@/components/ui/solvent-name";

const BOUND = { value: "", lower: "≥ ", upper: "≤ " } as const;

export function ObservationsTable({ observations, compoundId, canExclude }: { observations: ObservationRow[]; compoundId: string; canExclude: boolean }) {
  if (observations.length === 0) return <p className="text-sm text-stone-500">None yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full text-sm">
        <caption className="sr-only">Partition observations</caption>
        <thead className="text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
          <tr>
            <th scope="col" className="px-3 py-2">Solvent</th>
            <th scope="col" className="px-3 py-2 text-right">log K</th>
            <th scope="col" className="px-3 py-2 text-right">pH</th>
            <th scope="col" className="px-3 py-2 text-right">°C</th>
            <th scope="col" className="px-3 py-2">Source</th>
            <th scope="col" className="px-3 py-2">Recorded</th>
            {canExclude ? <th scope="col" className="px-3 py-2"><span className="sr-only">Exclude or include</span></th> : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-stone-100">
          {observations.map((o) => (
            <tr key={o.id} data-testid="observation-row" className={o.excluded ? "text-stone-400" : ""}>
              <td className="px-3 py-2">{solventName(o.solventKey)}</td>
              <td className={`px-3 py-2 text-right tabular-nums ${o.excluded ? "line-through" : ""}`}>
                {BOUND[o.bound]}{o.logK.toFixed(2)}{o.logKSe !== null ? ` ± ${o.logKSe.toFixed(2)}` : ""}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">{o.aqueousPh === null ? "—" : o.aqueousPh.toFixed(1)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{o.temperatureC.toFixed(0)}</td>
              <td className="px-3 py-2">
                <span className="mr-1"><Badge tone={o.kind === "measured" ? "good" : "neutral"}>{o.kind === "measured" ? o.method : "inferred"}</Badge></span>
                {o.outlier ? <span className="mr-1"><Badge tone="low">outlier</Badge></span> : null}
                {o.excluded ? <span className="mr-1"><Badge tone="neutral">excluded</Badge></span> : null}
                {o.workup ? <Link href={`/workups/${o.workup.id}`} className="text-teal-800 hover:underline">{o.workup.title}</Link> : null}
                {o.kind === "inferred" && typeof o.details["reason"] === "string" ? <p className="mt-0.5 max-w-md text-xs text-stone-500">{o.details["reason"]}</p> : null}
              </td>
              <td className="whitespace-nowrap px-3 py-2 text-stone-600">{formatDate(o.createdAt)}{o.createdBy ? ` · ${o.createdBy}` : ""}</td>
              {canExclude ? <td className="px-3 py-2"><ExclusionButton observationId={o.id} compoundId={compoundId} excluded={o.excluded} /></td> : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
