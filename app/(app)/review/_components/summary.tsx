import { type Calibration } from "@/lib/review/aggregate";
import { type ReviewFilters } from "@/lib/review/filters";

function describeSelection(filters: ReviewFilters, solventNames: Record<string, string>, chemistName: string | undefined): string {
  const parts = [
    filters.from || filters.to ? `performed ${filters.from ? `from ${filters.from}` : ""}${filters.from && filters.to ? " " : ""}${filters.to ? `to ${filters.to}` : ""}` : "all dates",
    filters.chemist ? `by ${chemistName ?? "one chemist"}` : "all chemists",
    filters.solvent ? `in ${solventNames[filters.solvent] ?? filters.solvent} / water` : "all solvent systems",
  ];
  return parts.join(", ");
}

/** The headline figures of the selection (workup-practice §6 view 11: error and interval coverage). */
export function Summary({ summary, filters, solventNames, chemistName }: { summary: Calibration; filters: ReviewFilters; solventNames: Record<string, string>; chemistName: string | undefined }) {
  const items: [string, string][] = [
    ["Workups with a judged outcome", String(summary.n)],
    ["Mean absolute deviation", summary.meanAbsoluteDeviation === null ? "—" : `${summary.meanAbsoluteDeviation.toFixed(1)} points`],
    ["Reported inside the predicted 95 % interval", summary.withinInterval === null ? "—" : `${(100 * summary.withinInterval).toFixed(0)} %`],
    ["Flagged for review", String(summary.flagged)],
  ];
  return (
    <section aria-label="Summary" className="review-view">
      <p className="mb-2 text-sm text-stone-600" data-testid="review-selection">Selection: {describeSelection(filters, solventNames, chemistName)}.</p>
      <dl className="grid gap-3 sm:grid-cols-4">
        {items.map(([label, value]) => (
          <div key={label} className="rounded-lg border border-stone-200 bg-white p-3 shadow-xs print:shadow-none">
            <dt className="text-xs text-stone-500">{label}</dt>
            <dd className="text-xl font-semibold tabular-nums text-stone-900" data-testid={`summary-${label.split(" ")[0]?.toLowerCase()}`}>{value}</dd>
          </div>
        ))}
      </dl>
      {summary.n > 0 && summary.n < 10 ? <p className="mt-2 text-xs text-stone-500">Fewer than ten workups: read the patterns below as questions, not findings.</p> : null}
    </section>
  );
}
