/**
 * The numbers behind the group-meeting views: parity points, the spread of deviations, residuals
 * grouped by a factor with n always shown, calibration of the predicted interval, and the ranked list of flagged
 * workups. Deviations are reported − predicted recovery in percentage points. Pure.
 */
import { type FoundCause } from "@/lib/workups/found-cause-schema";

export interface ReviewRow {
  id: string;
  title: string;
  performedOn: string;
  chemistId: string | null;
  solventSystem: string | null;
  operationTypes: string[];
  status: "as_expected" | "below" | "above" | "inconclusive" | "unknown";
  flagged: boolean;
  deviationPct: number | null;
  /** Percent. */
  predicted: number | null;
  low: number | null;
  high: number | null;
  reported: number | null;
  causes: { title: string; share: number }[];
  dangerFlags: string[];
  /** Predictive CDF at the reported value (lib/chem/predictive.ts); absent for outcomes judged before it existed. */
  quantile?: number | null;
  /** The cause the group found at review, if recorded (lib/workups/found-cause.ts). */
  foundCause?: { cause: FoundCause; note: string } | null;
}

export interface GroupStat {
  key: string;
  label: string;
  n: number;
  mean: number;
  median: number;
  sd: number | null;
  /** Share of the group's workups flagged for review. */
  flaggedShare: number;
}

/** Below this many workups a group's mean says little; the page says so (§6, "small numbers say little"). */
export const FEW = 3;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? (s[mid] as number) : ((s[mid - 1] as number) + (s[mid] as number)) / 2;
}

/** Residual statistics per group; a row may fall in several groups (a workup with washes and extractions). */
export function groupStats(rows: readonly ReviewRow[], keysOf: (r: ReviewRow) => string[], labelOf: (key: string) => string = (k) => k): GroupStat[] {
  const groups = new Map<string, ReviewRow[]>();
  for (const r of rows) {
    if (r.deviationPct === null) continue;
    for (const key of keysOf(r)) groups.set(key, [...(groups.get(key) ?? []), r]);
  }
  return [...groups.entries()]
    .map(([key, members]) => {
      const d = members.map((m) => m.deviationPct as number);
      const mean = d.reduce((a, b) => a + b, 0) / d.length;
      const sd = d.length > 1 ? Math.sqrt(d.reduce((a, b) => a + (b - mean) ** 2, 0) / (d.length - 1)) : null;
      return { key, label: labelOf(key), n: d.length, mean, median: median(d), sd, flaggedShare: members.filter((m) => m.flagged).length / members.length };
    })
    .sort((a, b) => b.n - a.n || a.label.localeCompare(b.label));
}

export interface HistogramBin {
  from: number;
  to: number;
  label: string;
  count: number;
}

/** Counts of deviations in bins `width` points wide, aligned on multiples of the width, empty bins included. */
export function histogram(deviations: readonly number[], width = 5): HistogramBin[] {
  if (deviations.length === 0) return [];
  const lo = Math.floor(Math.min(...deviations) / width) * width;
  const hi = Math.max(lo + width, Math.floor(Math.max(...deviations) / width) * width + width);
  const bins: HistogramBin[] = [];
  for (let from = lo; from < hi - 1e-9; from += width) bins.push({ from, to: from + width, label: `${from} to ${from + width}`, count: 0 });
  for (const d of deviations) {
    const i = Math.min(bins.length - 1, Math.floor((d - lo) / width));
    (bins[i] as HistogramBin).count++;
  }
  return bins;
}

export interface Calibration {
  n: number;
  /** Mean absolute deviation, percentage points. */
  meanAbsoluteDeviation: number | null;
  /** Share of reported recoveries inside the predicted 95 % interval (§6 view 11). */
  withinInterval: number | null;
  flagged: number;
}

export function calibration(rows: readonly ReviewRow[]): Calibration {
  const judged = rows.filter((r) => r.deviationPct !== null);
  const withInterval = judged.filter((r) => r.low !== null && r.high !== null && r.reported !== null);
  return {
    n: judged.length,
    meanAbsoluteDeviation: judged.length ? judged.reduce((a, r) => a + Math.abs(r.deviationPct as number), 0) / judged.length : null,
    withinInterval: withInterval.length
      ? withInterval.filter((r) => (r.reported as number) >= (r.low as number) && (r.reported as number) <= (r.high as number)).length / withInterval.length
      : null,
    flagged: rows.filter((r) => r.flagged).length,
  };
}

/** Flagged workups, largest shortfall first; danger-flagged ones without a shortfall after them. */
export function rankedFlagged(rows: readonly ReviewRow[]): ReviewRow[] {
  return rows.filter((r) => r.flagged).sort((a, b) => (a.deviationPct ?? Infinity) - (b.deviationPct ?? Infinity) || a.id.localeCompare(b.id));
}

/** Interval levels the calibration view checks (a group meeting reads 50 %, 80 %, 90 %, 95 % and 99 %). */
export const CALIBRATION_LEVELS = [0.5, 0.8, 0.9, 0.95, 0.99] as const;

export interface CalibrationPoint {
  /** Nominal level of the central predictive interval. */
  level: number;
  n: number;
  /** Outcomes inside that interval. */
  inside: number;
  /** inside / n; null without outcomes. A calibrated model sits near `level`. */
  share: number | null;
}

/**
 * How often the group's central predictive intervals contained the reported outcome, at each level (workup-practice
 * §6 view 11). Reads the stored predictive CDF at the outcome: inside the central interval at level L means
 * |quantile − 0.5| ≤ L / 2.
 */
export function calibrationByLevel(rows: readonly Pick<ReviewRow, "quantile">[], levels: readonly number[] = CALIBRATION_LEVELS): CalibrationPoint[] {
  const qs = rows.flatMap((r) => (typeof r.quantile === "number" && Number.isFinite(r.quantile) ? [r.quantile] : []));
  return levels.map((level) => {
    const inside = qs.filter((q) => Math.abs(q - 0.5) <= level / 2).length;
    return { level, n: qs.length, inside, share: qs.length ? inside / qs.length : null };
  });
}
