import { Badge } from "@/components/ui/badge";
import { formatDate, formatNumber } from "@/components/ui/format";
import type { ObservationRow } from "@/lib/partition/queries";
import { solventName } from "@/components/ui/solvent-name";

/** The columns of a partition observation this table shows (the partition feature owns the full row). */
export type PartitionRow = Pick<
  ObservationRow,
  "id" | "solventKey" | "aqueousPh" | "temperatureC" | "logK" | "logKSe" | "kind" | "bound" | "method" | "excluded" | "createdAt"
>;

const BOUND: Record<PartitionRow["bound"], string> = { value: "", lower: "≥ ", upper: "≤ " };

/** The group's own partition observations for one compound (log K of the neutral form, organic over water). */
export function PartitionTable({ observations }: { observations: PartitionRow[] }) {
  if (observations.length === 0) return <p className="text-sm text-stone-500">No partition data yet. Measured or inferred values appear here as the group reports workups.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full text-sm">
        <caption className="sr-only">Partition observations</caption>
        <thead className="text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
          <tr>
            <th scope="col" className="px-3 py-2">Solvent / water</th>
            <th scope="col" className="px-3 py-2 text-right">log K</th>
            <th scope="col" className="px-3 py-2 text-right">Aqueous pH</th>
            <th scope="col" className="px-3 py-2 text-right">°C</th>
            <th scope="col" className="px-3 py-2">Kind</th>
            <th scope="col" className="px-3 py-2">Method</th>
            <th scope="col" className="px-3 py-2">Recorded</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-stone-100">
          {observations.map((o) => (
            <tr key={o.id} className={o.excluded ? "text-stone-400 line-through" : ""}>
              <td className="px-3 py-2">{solventName(o.solventKey)}</td>
              <td className="px-3 py-2 text-right tabular-nums">
                {BOUND[o.bound]}{formatNumber(o.logK, 2)}{o.logKSe !== null ? ` ± ${formatNumber(o.logKSe, 2)}` : ""}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">{o.aqueousPh === null ? "—" : formatNumber(o.aqueousPh, 1)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{formatNumber(o.temperatureC, 0)}</td>
              <td className="px-3 py-2"><Badge tone={o.kind === "measured" ? "good" : "neutral"}>{o.kind}</Badge>{o.excluded ? <span className="ml-1 text-xs">excluded</span> : null}</td>
              <td className="px-3 py-2 text-stone-600">{o.method}</td>
              <td className="px-3 py-2 whitespace-nowrap text-stone-600">{formatDate(o.createdAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
