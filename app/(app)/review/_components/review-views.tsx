"use client";
// The group-meeting views (workup-practice §6): parity plot, spread of deviations, deviations by solvent system, by
// operation type and by chemist, and the ranked list of flagged workups. Each view exports its data and image.
import { gapShareWords } from "@/lib/workups/causes";
import Link from "next/link";
import { ChartFrame } from "@/components/charts/chart-frame";
import { DeviationHistogram, GroupMeanChart, GROUP_LEGEND, HISTOGRAM_LEGEND, type Bin } from "@/components/charts/bar-charts";
import { ParityChart, parityLegend, type ParityPoint } from "@/components/charts/parity-chart";
import { groupSummary, histogramSummary, paritySummary } from "@/components/charts/summaries";
import { FEW, type GroupStat, type ReviewRow } from "@/lib/review/aggregate";
import { FOUND_CAUSE_LABELS } from "@/lib/workups/found-cause-schema";
import { FoundCauseForm } from "@/components/review/found-cause-form";

export interface ReviewViewsProps {
  points: ParityPoint[];
  bins: Bin[];
  bySolvent: GroupStat[];
  byOperation: GroupStat[];
  byChemist: GroupStat[];
  chemistNote: string;
  flagged: ReviewRow[];
  solventNames: Record<string, string>;
  /** Members and leads record the cause a meeting found; viewers see it. */
  canRecordCause: boolean;
}

const fmt = (v: number | null, digits = 1) => (v === null ? "" : v.toFixed(digits));
const gapShare = (share: number) => gapShareWords(share);

/** What the danger flags are about, for the flagged list (the engine names them by code). */
const DANGER_WORDS: Record<string, string> = {
  F1: "basic wash too close to the product's acidic pKa", F2: "acidic wash too close to the product's basic pKa", F3: "extraction at the wrong pH",
  F5: "too few extractions", F6: "over-washing", F7: "water-miscible reaction solvent not removed", F11: "layer order may be misidentified",
  F12: "layer with product sent to waste", F13: "CO₂ foaming or ejection", F14: "volatile product lost on concentration",
  F29: "oxidant not destroyed before concentration",
};
const dangerWords = (codes: string[]) => codes.map((c) => DANGER_WORDS[c] ?? "a danger the engine flagged").join("; ");

function GroupTable({ stats, factor }: { stats: GroupStat[]; factor: string }) {
  return (
    <table className="mt-3 min-w-full text-sm">
      <caption className="sr-only">Deviations by {factor}</caption>
      <thead className="text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
        <tr>
          <th scope="col" className="px-2 py-1.5">{factor}</th>
          <th scope="col" className="px-2 py-1.5 text-right">n</th>
          <th scope="col" className="px-2 py-1.5 text-right">Mean</th>
          <th scope="col" className="px-2 py-1.5 text-right">Median</th>
          <th scope="col" className="px-2 py-1.5 text-right">Flagged</th>
        </tr>
      </thead>
      <tbody className="divide-y divide-stone-100">
        {stats.map((s) => (
          <tr key={s.key} className={s.n < FEW ? "text-stone-400" : ""}>
            <td className="px-2 py-1.5">{s.label}{s.n < FEW ? " (too few to judge)" : ""}</td>
            <td className="px-2 py-1.5 text-right tabular-nums">{s.n}</td>
            <td className="px-2 py-1.5 text-right tabular-nums">{fmt(s.mean)}</td>
            <td className="px-2 py-1.5 text-right tabular-nums">{fmt(s.median)}</td>
            <td className="px-2 py-1.5 text-right tabular-nums">{(100 * s.flaggedShare).toFixed(0)} %</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function statsCsv(factor: string, stats: GroupStat[]) {
  return [[factor, "n", "mean_deviation_points", "median_deviation_points", "sd_points", "flagged_share"],
    ...stats.map((s) => [s.label, s.n, s.mean, s.median, s.sd, s.flaggedShare])];
}

function GroupView({ title, factor, stats, description, className = "" }: { title: string; factor: string; stats: GroupStat[]; description: string; className?: string }) {
  return (
    <ChartFrame title={title} description={description} csv={statsCsv(factor, stats)} className={`review-view ${className}`} image={stats.length > 0}
      legend={GROUP_LEGEND} summary={groupSummary(stats.map((s) => ({ label: s.label, mean: s.mean, n: s.n, few: s.n < FEW })), "groups")}>
      {stats.length > 0 ? (
        <>
          <GroupMeanChart groups={stats.map((s) => ({ label: s.label, mean: s.mean, n: s.n, few: s.n < FEW }))} />
          <GroupTable stats={stats} factor={factor} />
        </>
      ) : <p className="text-sm text-stone-500">No workups with a judged outcome in this selection.</p>}
    </ChartFrame>
  );
}

export function ReviewViews(props: ReviewViewsProps) {
  const { points, bins, flagged, solventNames } = props;
  const solventLabel = (key: string) => (key === "none" ? "No organic solvent" : `${solventNames[key] ?? key} / water`);
  const parityCsv = [["workup_id", "title", "performed_on", "solvent_system", "predicted_pct", "interval_low_pct", "interval_high_pct", "reported_pct"],
    ...points.map((p) => [p.id, p.title, p.performedOn, p.series, p.predicted, p.low, p.high, p.reported])];
  return (
    <div className="space-y-6">
      <ChartFrame title="Predicted and reported recovery" className="review-view"
        description="One point per workup; the horizontal bar is the predicted 95 % interval, the solid line is perfect agreement and the dashed lines ±10 points. Points below the band recovered less than predicted. Each point opens its record."
        csv={parityCsv} fileBase="parity" image={points.length > 0} legend={parityLegend(points, solventLabel)} summary={paritySummary(points)}>
        {points.length > 0 ? <ParityChart points={points} seriesLabel={solventLabel} /> : <p className="text-sm text-stone-500">No workups with both a prediction and a reported recovery in this selection.</p>}
        {points.length > 0 ? (
          <details className="mt-2 text-sm print:hidden">
            <summary className="cursor-pointer text-stone-600">The points as a list</summary>
            <ul className="mt-2 columns-2 gap-6">
              {points.map((p) => (
                <li key={p.id}><Link href={`/workups/${p.id}`} className="text-teal-800 hover:underline">{p.title}</Link> <span className="text-stone-500">({p.performedOn}: {p.predicted.toFixed(0)} → {p.reported.toFixed(0)} %)</span></li>
              ))}
            </ul>
          </details>
        ) : null}
      </ChartFrame>

      <ChartFrame title="Spread of deviations" className="review-view review-break"
        description="Reported minus predicted recovery, in 5-point bins. A cluster left of zero is a systematic loss the model does not see."
        csv={[["from_points", "to_points", "workups"], ...bins.map((b) => [b.from, b.to, b.count])]} fileBase="deviation-histogram" image={bins.length > 0}
        legend={HISTOGRAM_LEGEND} summary={histogramSummary(bins)}>
        {bins.length > 0 ? <DeviationHistogram bins={bins} /> : <p className="text-sm text-stone-500">No deviations to show.</p>}
      </ChartFrame>

      <GroupView title="Deviations by solvent system" factor="Solvent system" stats={props.bySolvent} className="review-break"
        description="Mean reported − predicted recovery per extraction solvent. Grey groups hold fewer than three workups and say little." />
      <GroupView title="Deviations by operation type" factor="Operation" stats={props.byOperation}
        description="A workup counts under every kind of operation it contains, so the groups overlap." />
      <GroupView title="Deviations by chemist" factor="Chemist" stats={props.byChemist} className="review-break" description={props.chemistNote} />

      <ChartFrame title="Flagged workups, largest shortfall first" className="review-view review-break" image={false}
        description="Flagged when the recovery fell below the predicted interval or the engine saw a danger. Likely causes are ranked by the share of the gap each explains. Record the cause the meeting found: later judgements rank causes with the group's findings counted."
        csv={[["rank", "workup_id", "title", "performed_on", "solvent_system", "predicted_pct", "reported_pct", "deviation_points", "likely_causes", "danger_flags", "cause_found", "cause_found_note"],
          ...flagged.map((r, i) => [i + 1, r.id, r.title, r.performedOn, r.solventSystem, r.predicted, r.reported, r.deviationPct,
            r.causes.map((c) => `${c.title} (${gapShare(c.share)})`).join("; "), r.dangerFlags.join(" "),
            r.foundCause ? FOUND_CAUSE_LABELS[r.foundCause.cause] : "", r.foundCause?.note ?? ""])]}
        fileBase="flagged-workups">
        {flagged.length === 0 ? <p className="text-sm text-stone-500">Nothing flagged in this selection.</p> : (
          <ol className="divide-y divide-stone-100" data-testid="flagged-list">
            {flagged.map((r, i) => (
              <li key={r.id} className="flex gap-3 py-2 text-sm">
                <span className="w-6 shrink-0 text-right tabular-nums text-stone-500">{i + 1}.</span>
                <div>
                  <Link href={`/workups/${r.id}`} className="font-medium text-teal-800 hover:underline">{r.title}</Link>
                  <span className="ml-2 text-stone-500">{r.performedOn} · {r.solventSystem ? solventLabel(r.solventSystem) : "—"}</span>
                  <p className="text-stone-700">
                    {r.deviationPct !== null ? `Reported ${fmt(r.reported, 0)} % against ${fmt(r.predicted, 0)} % predicted (${r.deviationPct > 0 ? "+" : ""}${fmt(r.deviationPct)} points)` : "No reported recovery"}
                    {r.dangerFlags.length > 0 ? `; danger: ${dangerWords(r.dangerFlags)}` : ""}
                  </p>
                  {r.causes.length > 0 ? (
                    <p className="text-xs text-stone-500">Likely causes: {r.causes.map((c) => `${c.title} (${gapShare(c.share)})`).join("; ")}</p>
                  ) : null}
                  <FoundCauseForm workupId={r.id} found={r.foundCause ?? null} canRecord={props.canRecordCause} />
                </div>
              </li>
            ))}
          </ol>
        )}
      </ChartFrame>
    </div>
  );
}
