"use client";
// Calibration of the predictive intervals (workup-practice §6 view 11): at each nominal level, the share of the
// group's outcomes that fell inside the central interval. Points on the diagonal: intervals mean what they say.
import { ChartFrame } from "@/components/charts/chart-frame";
import { calibrationSummary } from "@/components/charts/summaries";
import { type CalibrationPoint } from "@/lib/review/aggregate";

const SIZE = 220;
const PAD = 32;
const at = (v: number) => PAD + v * (SIZE - 2 * PAD);

export function CalibrationView({ levels }: { levels: CalibrationPoint[] }) {
  const n = levels[0]?.n ?? 0;
  const shown = levels.filter((l): l is CalibrationPoint & { share: number } => l.share !== null);
  return (
    <ChartFrame title="Do the intervals hold?" className="review-view review-break" fileBase="calibration"
      description="For each interval level, the share of reported outcomes that fell inside the predicted interval. Near the diagonal, the intervals can be trusted; far below it, the model is over-confident (or many workups really failed); above it, it is too cautious."
      csv={[["level", "outcomes", "inside", "share_inside"], ...levels.map((l) => [l.level, l.n, l.inside, l.share])]} image={shown.length > 0}
      summary={calibrationSummary(levels)}
      legend={[{ label: "Share inside the interval", color: "#0f766e", mark: "dot" }, { label: "Intervals that mean what they say", color: "#78716c", mark: "dash" }]}>
      {shown.length === 0 ? <p className="text-sm text-stone-500">No outcome in this selection was judged against a predictive distribution yet.</p> : (
        <div className="flex flex-wrap items-start gap-6">
          <svg viewBox={`0 0 ${SIZE} ${SIZE}`} width={SIZE} height={SIZE} role="img" aria-label="Share of outcomes inside the interval against the interval level" data-testid="calibration-plot" data-chart-surface>
            <rect x={at(0)} y={SIZE - at(1)} width={at(1) - at(0)} height={at(1) - at(0)} fill="none" stroke="#d6d3d1" />
            <line x1={at(0)} y1={SIZE - at(0)} x2={at(1)} y2={SIZE - at(1)} stroke="#78716c" strokeDasharray="4 3" />
            {[0, 0.5, 1].map((t) => (
              <g key={t} fontSize="9" fill="#57534e">
                <text x={at(t)} y={SIZE - PAD + 12} textAnchor="middle">{t * 100} %</text>
                <text x={PAD - 4} y={SIZE - at(t) + 3} textAnchor="end">{t * 100} %</text>
              </g>
            ))}
            <text x={SIZE / 2} y={SIZE - 4} fontSize="9" textAnchor="middle" fill="#57534e">interval level</text>
            <polyline fill="none" stroke="#0f766e" strokeWidth="1.5" points={shown.map((l) => `${at(l.level)},${SIZE - at(l.share)}`).join(" ")} />
            {shown.map((l) => <circle key={l.level} cx={at(l.level)} cy={SIZE - at(l.share)} r="3" fill="#0f766e"><title>{`${l.level * 100} % interval: ${l.inside} of ${l.n} inside`}</title></circle>)}
          </svg>
          <table className="text-sm" data-testid="calibration-table">
            <caption className="sr-only">Share of outcomes inside each interval</caption>
            <thead className="text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
              <tr><th className="px-2 py-1">Interval</th><th className="px-2 py-1 text-right">Inside</th><th className="px-2 py-1 text-right">Share</th></tr>
            </thead>
            <tbody>
              {levels.map((l) => (
                <tr key={l.level} className="border-t border-stone-100">
                  <td className="px-2 py-1 tabular-nums">{(l.level * 100).toFixed(0)} %</td>
                  <td className="px-2 py-1 text-right tabular-nums">{l.inside} of {l.n}</td>
                  <td className="px-2 py-1 text-right tabular-nums">{l.share === null ? "—" : `${(l.share * 100).toFixed(0)} %`}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {n < 20 ? <p className="w-full text-xs text-stone-500">Fewer than twenty outcomes: the shares can sit well off the diagonal by chance alone.</p> : null}
        </div>
      )}
    </ChartFrame>
  );
}
