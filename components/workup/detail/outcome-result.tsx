// The comparison stored with an outcome: reported recovery (and what it was measured against), the prediction with
// its interval, the deviation and status, and the likely causes of a shortfall ranked by how much of the gap each
// explains (the model re-run with one suspect parameter changed).
import { formatNumber } from "@/components/ui/format";
import type { OutcomeAnalysis } from "@/lib/workups/analysis";
import { RecoveryInterval } from "@/components/workup/prediction/recovery-interval";
import { pct } from "@/components/workup/prediction/format";
import { StatusBadge } from "./status-badge";
import { gapShareWords } from "@/lib/workups/causes";

const BASIS: Record<string, string> = {
  assayed: "of the product assayed in the crude before the workup",
  expected: "of the product estimated in the crude (expected amount × the group's reaction-yield figure)",
  spec: "of the product estimated in the crude (the workup's product amount × the group's reaction-yield figure)",
};

/** `intervalPending`: the workup's current version is still waiting for its interval (Workup.intervalState). */
export function OutcomeResult({ analysis, intervalPending = false }: { analysis: OutcomeAnalysis; intervalPending?: boolean }) {
  const { reported, predicted, deviation, causes } = analysis;
  const waiting = analysis.intervalPending === true;
  return (
    <div className="space-y-3 text-sm" data-testid="outcome-result">
      <div className="flex flex-wrap items-center gap-2">
        <StatusBadge status={deviation.status} intervalPending={waiting && intervalPending} />
        {analysis.flagged ? <span className="text-xs font-medium text-amber-800">Flagged for review</span> : null}
      </div>
      {waiting ? (
        <p className="text-xs text-stone-600" data-testid="judgement-pending">
          Not judged yet: the outcome is compared with the prediction once the version&apos;s Monte Carlo interval has been computed.
        </p>
      ) : null}
      {reported ? (
        <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
          <dt className="text-stone-500">Reported recovery</dt>
          <dd><span className="font-semibold tabular-nums" data-testid="reported-recovery">{pct(reported.recovery)}</span> <span className="text-xs text-stone-500">{BASIS[reported.basis]}</span>
            {reported.purityAssumed ? <p className="text-xs text-amber-800">Purity not measured: the mass was taken as pure product, so this is an upper bound.</p> : null}</dd>
          {predicted ? (
            <>
              <dt className="text-stone-500">Predicted</dt>
              <dd className="tabular-nums">{pct(predicted.recovery)}{deviation.low !== null && deviation.high !== null ? <span className="text-xs text-stone-500"> (judged against {pct(deviation.low)} – {pct(deviation.high)}{deviation.fallbackBand ? ", ±10 points: no interval was stored" : ""})</span> : null}</dd>
              <dt className="text-stone-500">Deviation</dt>
              <dd className="tabular-nums" data-testid="deviation">{deviation.deviationPct !== null ? `${deviation.deviationPct > 0 ? "+" : ""}${formatNumber(deviation.deviationPct, 1)} percentage points` : "—"}</dd>
            </>
          ) : null}
        </dl>
      ) : <p className="text-stone-600">No recovery could be computed: the workup names no product amount to compare with.</p>}
      {predicted && reported ? <RecoveryInterval predicted={predicted.recovery} low={deviation.low} high={deviation.high} reported={reported.recovery} /> : null}
      {causes.length > 0 ? (
        <div>
          <p className="text-xs font-medium uppercase tracking-wide text-stone-500">Likely causes, most plausible first</p>
          <ol className="mt-1 space-y-1.5" data-testid="likely-causes">
            {causes.map((c, i) => (
              <li key={`${c.code}-${c.step ?? 0}`} className="rounded border border-stone-200 p-2">
                <p className="font-medium">{i + 1}. {c.title}{c.step !== undefined ? <span className="ml-1 font-normal text-stone-500">(step {c.step})</span> : null}</p>
                <p className="text-xs text-stone-600">Most plausible size: {c.change}. The model then predicts {pct(c.recovery)}; this {gapShareWords(c.fractionOfGap)}. Plausibility {formatNumber(c.score * 100, 0)} %.</p>
                <div className="mt-1 h-1.5 w-full rounded bg-stone-100" aria-hidden><div className="h-1.5 rounded bg-amber-500" style={{ width: `${Math.round(c.score * 100)}%` }} /></div>
              </li>
            ))}
          </ol>
          <p className="mt-1 text-xs text-stone-500">Each cause is a prompt to look, not a verdict: the model was re-run with one cause at a time, at the size that best fits the outcome; plausibility weighs how often the cause occurs against how well it fits.</p>
        </div>
      ) : deviation.status === "below" ? <p className="text-xs text-stone-600">No single change the model tries explains the gap; look at handling losses and the measurement itself.</p> : null}
      {analysis.predictive ? (
        <p className="text-xs text-stone-500" data-testid="judgement-basis">
          Judged against the predictive distribution: the engine&apos;s spread, ordinary handling losses, the {analysis.predictive.case.assay.replace("_", " ")} assay&apos;s error{analysis.predictive.case.crudeAssayed ? "" : " and the reaction's own scatter (no assay of the crude)"}, learned from {analysis.predictive.historyN} earlier outcome{analysis.predictive.historyN === 1 ? "" : "s"} of the group.
          Probability of a real shortfall: {formatNumber(analysis.predictive.shortfallProbability * 100, 0)} % (flagged from {formatNumber(analysis.predictive.threshold * 100, 0)} %).
          {deviation.status === "inconclusive" ? " Below the interval, but not clearly enough to flag." : ""}
        </p>
      ) : null}
    </div>
  );
}
