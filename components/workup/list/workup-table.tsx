// The list of workups: title, date, chemist, notebook reference, predicted recovery with its interval (or that it is
// being computed after a save), the reported recovery and the status.
import Link from "next/link";
import { Badge } from "@/components/ui/badge";
import { formatDate, formatNumber } from "@/components/ui/format";
import type { WorkupListRow } from "@/lib/workups/queries";
import { StatusBadge } from "@/components/workup/detail/status-badge";
import { RefreshWhileIntervalPending } from "@/components/workup/detail/interval-pending";
import { INTERVAL_WORDS } from "@/lib/workups/interval-state";

const pct = (v: number | null) => (v === null ? "—" : `${formatNumber(v, 0)} %`);

export function WorkupTable({ rows, caption }: { rows: WorkupListRow[]; caption: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white shadow-xs">
      {rows.some((w) => w.intervalState === "pending") ? <RefreshWhileIntervalPending /> : null}
      <table className="min-w-full divide-y divide-stone-200 text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-stone-50 text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
          <tr>
            <th scope="col" className="px-4 py-2.5">Title</th>
            <th scope="col" className="px-4 py-2.5">Date</th>
            <th scope="col" className="px-4 py-2.5">Chemist</th>
            <th scope="col" className="px-4 py-2.5">Notebook</th>
            <th scope="col" className="px-4 py-2.5 text-right">Predicted</th>
            <th scope="col" className="px-4 py-2.5 text-right">Reported</th>
            <th scope="col" className="px-4 py-2.5">Outcome</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-stone-100">
          {rows.map((w) => (
            <tr key={w.id} className="hover:bg-stone-50" data-testid="workup-row">
              <td className="px-4 py-2.5">
                <Link href={`/workups/${w.id}`} className="font-medium text-teal-800 hover:underline focus-visible:outline-2 focus-visible:outline-teal-600">{w.title}</Link>
              </td>
              <td className="whitespace-nowrap px-4 py-2.5 text-stone-600">{formatDate(w.performedOn)}</td>
              <td className="px-4 py-2.5 text-stone-600">{w.chemist?.name ?? "—"}</td>
              <td className="px-4 py-2.5 font-mono text-xs text-stone-600">{w.notebookRef || "—"}</td>
              <td className="whitespace-nowrap px-4 py-2.5 text-right tabular-nums text-stone-700">
                {pct(w.predictedRecoveryPct)}
                {w.intervalState !== "ready"
                  ? <span className="block text-xs text-stone-500" data-testid="interval-state">{INTERVAL_WORDS[w.intervalState]}</span>
                  : w.predictedLowPct !== null && w.predictedHighPct !== null ? <span className="block text-xs text-stone-500">{formatNumber(w.predictedLowPct, 0)}–{formatNumber(w.predictedHighPct, 0)} %</span> : null}
              </td>
              <td className="whitespace-nowrap px-4 py-2.5 text-right tabular-nums text-stone-700">{pct(w.reportedRecoveryPct)}</td>
              <td className="whitespace-nowrap px-4 py-2.5">
                <StatusBadge status={w.status} intervalPending={w.intervalState === "pending"} />
                {w.flagged ? <span className="ml-2"><Badge tone="low">Flagged</Badge></span> : null}
                {w.deviationPct !== null ? <span className="ml-2 text-xs text-stone-500">{w.deviationPct > 0 ? "+" : ""}{formatNumber(w.deviationPct, 1)} pts</span> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
