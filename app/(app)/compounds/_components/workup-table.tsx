import Link from "next/link";
import { formatDate, formatNumber } from "@/components/ui/format";
import type { CompoundWorkup } from "@/lib/compounds/queries";
import { StatusBadge } from "@/app/(app)/workups/_components/status-badge";

const ROLE_LABELS: Record<string, string> = {
  product: "product", starting_material: "starting material", reagent: "reagent", byproduct: "by-product",
  impurity: "impurity", catalyst: "catalyst", other: "other",
};

function deviation(pct: number | null): string {
  if (pct === null) return "—";
  return `${pct > 0 ? "+" : ""}${formatNumber(pct, 1)} pp`;
}

/** Workups that used a compound, with their outcome against the prediction. */
export function WorkupTable({ workups, caption, compact = false }: { workups: CompoundWorkup[]; caption: string; compact?: boolean }) {
  if (workups.length === 0) return <p className="text-sm text-stone-500">No workup of the group has used it yet.</p>;
  const cell = compact ? "px-2 py-1" : "px-3 py-2";
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
          <tr>
            <th scope="col" className={cell}>Workup</th>
            <th scope="col" className={cell}>Date</th>
            <th scope="col" className={cell}>Role</th>
            <th scope="col" className={cell}>Outcome</th>
            <th scope="col" className={`${cell} text-right`}>Deviation</th>
            {compact ? null : <th scope="col" className={`${cell} text-right`}>Recovery</th>}
          </tr>
        </thead>
        <tbody className="divide-y divide-stone-100">
          {workups.map((w) => (
            <tr key={w.workupId}>
              <td className={cell}><Link href={`/workups/${w.workupId}`} className="text-teal-800 hover:underline">{w.title}</Link></td>
              <td className={`${cell} whitespace-nowrap text-stone-600`}>{formatDate(w.performedOn)}</td>
              <td className={`${cell} text-stone-600`}>{ROLE_LABELS[w.role] ?? w.role}</td>
              <td className={cell}>
                <StatusBadge status={w.status} />
                {w.flagged ? <span className="ml-1 text-xs text-amber-800">flagged</span> : null}
              </td>
              <td className={`${cell} text-right tabular-nums text-stone-700`} title="Recovered product minus the prediction, percentage points">{deviation(w.deviationPct)}</td>
              {compact ? null : <td className={`${cell} text-right tabular-nums text-stone-700`}>{w.recoveryPct === null ? "—" : `${formatNumber(w.recoveryPct, 1)} %`}</td>}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
