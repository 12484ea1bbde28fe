// What each chart shows, in words: the text alternative under every figure (and its accessible description). Counts
// and extremes only; the data itself is in the view's table or CSV.
import { type Bin } from "./bar-charts";
import { type ParityPoint } from "./parity-chart";
import { type PooledHistoryPoint } from "./pooled-history-chart";

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const signed = (v: number, digits = 0) => `${v > 0 ? "+" : v < 0 ? "−" : ""}${Math.abs(v).toFixed(digits)}`;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/** Parity plot: how many points sit inside, below and above the ±10-point band, and the median deviation. */
export function paritySummary(points: readonly ParityPoint[]): string {
  if (points.length === 0) return "No workups to plot.";
  const deviations = points.map((p) => p.reported - p.predicted);
  const below = deviations.filter((d) => d < -10).length;
  const above = deviations.filter((d) => d > 10).length;
  const inside = points.length - below - above;
  return `${plural(points.length, "workup")}: ${inside} within 10 points of the prediction, ${below} below (less recovered than predicted), ` +
    `${above} above. Median reported − predicted: ${signed(median(deviations), 1)} points.`;
}

/** Histogram of deviations: range, the fullest bin, and how many fell below and above zero. */
export function histogramSummary(bins: readonly Bin[]): string {
  const total = bins.reduce((n, b) => n + b.count, 0);
  if (total === 0) return "No deviations to show.";
  const filled = bins.filter((b) => b.count > 0);
  const fullest = filled.reduce((a, b) => (b.count > a.count ? b : a));
  const below = bins.filter((b) => b.to <= 0).reduce((n, b) => n + b.count, 0);
  const above = bins.filter((b) => b.from >= 0).reduce((n, b) => n + b.count, 0);
  return `${plural(total, "workup")}, from ${signed(filled[0]!.from)} to ${signed(filled.at(-1)!.to)} points. ` +
    `Most in ${fullest.label} points (${fullest.count}). ${below} below zero, ${above} above.`;
}

/** Mean deviation per group: the largest shortfall and the largest excess among groups with enough workups. */
export function groupSummary(groups: readonly { label: string; mean: number; n: number; few: boolean }[], what: string): string {
  if (groups.length === 0) return `No ${what} to compare.`;
  const judged = groups.filter((g) => !g.few);
  const parts = [`${plural(groups.length, what.replace(/s$/, ""), what)}.`];
  if (judged.length > 0) {
    const low = judged.reduce((a, b) => (b.mean < a.mean ? b : a));
    const high = judged.reduce((a, b) => (b.mean > a.mean ? b : a));
    parts.push(`Lowest mean: ${low.label}, ${signed(low.mean, 1)} points (n = ${low.n}).`);
    if (high !== low) parts.push(`Highest: ${high.label}, ${signed(high.mean, 1)} points (n = ${high.n}).`);
  }
  const few = groups.length - judged.length;
  if (few > 0) parts.push(`${plural(few, "group")} with fewer than three workups, shown in grey.`);
  return parts.join(" ");
}

/** Calibration: the share inside at each level with outcomes. */
export function calibrationSummary(levels: readonly { level: number; n: number; inside: number; share: number | null }[]): string {
  const shown = levels.filter((l) => l.share !== null);
  if (shown.length === 0) return "No outcome judged against an interval yet.";
  return `${plural(shown[0]!.n, "outcome")}. ` +
    shown.map((l) => `${(l.level * 100).toFixed(0)} % interval: ${l.inside} inside (${((l.share ?? 0) * 100).toFixed(0)} %)`).join("; ") + ".";
}

const day = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** Pooled log K over time: the first and the latest estimate with its interval. */
export function pooledSummary(points: readonly PooledHistoryPoint[]): string {
  if (points.length === 0) return "Only bounds so far: no value to plot.";
  const first = points[0]!;
  const last = points.at(-1)!;
  return `${plural(points.length, "estimate")} from ${day.format(new Date(first.at))} to ${day.format(new Date(last.at))}: ` +
    `pooled log K ${first.estimate.toFixed(2)} at first, ${last.estimate.toFixed(2)} now (95 % ${last.low.toFixed(2)} to ${last.high.toFixed(2)}, n = ${last.n}).`;
}
