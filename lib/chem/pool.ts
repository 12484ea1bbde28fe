/**
 * Pool several observations of one compound's log K (or log D) in one solvent into a group
 * estimate with a standard error, so that one noisy record does not overwrite a well-established
 * value (inverse-variance pooling with an outlier screen, common practice).
 *
 * Model: y_i = μ + e_i with e_i ~ N(0, φ·v_i), v_i the stated variance of each observation and φ an
 * unknown dispersion (stated errors are often too small or too large by a common factor).
 *  1. Location by a Huber M-estimator (Huber, Ann. Math. Stat. 35 (1964) 73; k = 1.345 gives 95 %
 *     efficiency for normal data) by iterated reweighting, scale from the median absolute
 *     standardized residual, floored at 1 so that points that agree by chance do not make
 *     ordinary points look like outliers.
 *  2. Observations more than `outlierZ` robust standard errors from the Huber location are marked
 *     outliers and left out.
 *  3. The rest are combined by the inverse-variance weighted mean. φ is estimated from their scatter
 *     (the Knapp–Hartung variance, Stat. Med. 22 (2003) 2693) and the interval uses Student's t with
 *     m − 1 degrees of freedom (m kept observations); with one observation its stated error and the
 *     normal quantile are used. Optionally the scatter is pooled with a prior that stated errors are
 *     right (`priorDf`, the conjugate scaled-inverse-χ² update). The coverage study in
 *     tests/unit/chem/pool.test.ts chose priorDf = 0: a prior of 4 df over-covered (97.5 %).
 * Bounds (a recovery near 100 % or near 0 only bounds K) are kept apart: the tightest lower and
 * upper bounds are reported beside the estimate, and a conflict with the estimate is stated.
 */
import { studentTQuantile } from "./distributions";

export type LogKObservationKind = "value" | "lower_bound" | "upper_bound";
/** measured: a dedicated partition measurement; literature: a published value; inferred: fitted from a workup's recovery. */
export type LogKObservationSource = "measured" | "literature" | "inferred";

export interface LogKObservation {
  /** Record id, returned in `outliers` when the observation is left out. */
  id: string;
  /** log10 K (or log10 D); for a bound, the bound itself. */
  logK: number;
  /** Default "value". */
  kind?: LogKObservationKind;
  /** Standard error in log units. Default by source: measured 0.15, literature 0.2, inferred 0.4 (from memory; OECD TG 107 asks replicates to agree within ±0.3). */
  se?: number;
  /** Default "measured". */
  source?: LogKObservationSource;
  /** Relative weight in (0, 1]; the variance is divided by it. Default 1, or 0.5 for inferred observations. */
  weight?: number;
}

export interface PoolOptions {
  /** Huber tuning constant in robust standard errors. Default 1.345. */
  huberK?: number;
  /** Residual, in robust standard errors, beyond which an observation is an outlier. Default 3.5. */
  outlierZ?: number;
  /** Degrees of freedom of a prior belief that stated errors are right. Default 0 (none). */
  priorDf?: number;
  /** Two-sided confidence level of `interval`. Default 0.95. */
  confidence?: number;
}

export interface PooledLogK {
  /** Pooled log K; null when there is no value observation (bounds only). */
  estimate: number | null;
  /** Standard error of `estimate`, including the dispersion. */
  se: number | null;
  /** 1/√Σw: the standard error if the stated errors were exactly right. */
  seInternal: number | null;
  /** Confidence interval at `confidence`. */
  interval: [number, number] | null;
  confidence: number;
  /** Degrees of freedom of the t quantile used for `interval`. */
  df: number | null;
  /** Dispersion φ used (1 = stated errors fit the scatter). */
  dispersion: number | null;
  /** All observations, bounds included. */
  n: number;
  /** Value observations kept in the estimate. */
  nUsed: number;
  outliers: string[];
  /** Tightest lower bound from bound observations. */
  lowerBound?: number;
  /** Tightest upper bound from bound observations. */
  upperBound?: number;
  /** Set when the interval lies wholly outside a bound. */
  boundConflict?: string;
  method: string;
}

const DEFAULT_SE: Record<LogKObservationSource, number> = { measured: 0.15, literature: 0.2, inferred: 0.4 };
const DEFAULT_WEIGHT: Record<LogKObservationSource, number> = { measured: 1, literature: 1, inferred: 0.5 };

interface Point { id: string; y: number; v: number }

function weightedMedian(points: Point[]): number {
  const sorted = [...points].sort((a, b) => a.y - b.y);
  const total = sorted.reduce((s, p) => s + 1 / p.v, 0);
  let running = 0;
  for (const p of sorted) {
    running += 1 / p.v;
    if (running >= total / 2) return p.y;
  }
  return sorted[sorted.length - 1]?.y ?? Number.NaN;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 === 1 ? (s[mid] ?? Number.NaN) : ((s[mid - 1] ?? 0) + (s[mid] ?? 0)) / 2;
}

/** Huber location by iterated reweighting; returns the location and the robust scale used. */
function huberLocation(points: Point[], k: number): { location: number; scale: number } {
  let location = weightedMedian(points);
  const scale = Math.max(1, 1.4826 * median(points.map((p) => Math.abs(p.y - location) / Math.sqrt(p.v))));
  for (let iter = 0; iter < 100; iter++) {
    let sw = 0;
    let swy = 0;
    for (const p of points) {
      const r = Math.abs(p.y - location) / (Math.sqrt(p.v) * scale);
      const w = (r <= k ? 1 : k / r) / p.v;
      sw += w;
      swy += w * p.y;
    }
    const next = swy / sw;
    if (Math.abs(next - location) < 1e-12) return { location: next, scale };
    location = next;
  }
  return { location, scale };
}

function validate(o: LogKObservation): void {
  if (!Number.isFinite(o.logK)) throw new RangeError(`observation ${o.id}: logK must be finite`);
  if (o.se !== undefined && !(o.se > 0)) throw new RangeError(`observation ${o.id}: se must be positive`);
  if (o.weight !== undefined && !(o.weight > 0 && o.weight <= 1)) throw new RangeError(`observation ${o.id}: weight must lie in (0, 1]`);
}

export function poolLogK(observations: readonly LogKObservation[], options: PoolOptions = {}): PooledLogK {
  const huberK = options.huberK ?? 1.345;
  const outlierZ = options.outlierZ ?? 3.5;
  const priorDf = options.priorDf ?? 0;
  const confidence = options.confidence ?? 0.95;
  observations.forEach(validate);

  const values: Point[] = [];
  const lowers: number[] = [];
  const uppers: number[] = [];
  for (const o of observations) {
    const kind = o.kind ?? "value";
    if (kind === "lower_bound") lowers.push(o.logK);
    else if (kind === "upper_bound") uppers.push(o.logK);
    else {
      const source = o.source ?? "measured";
      const se = o.se ?? DEFAULT_SE[source];
      values.push({ id: o.id, y: o.logK, v: (se * se) / (o.weight ?? DEFAULT_WEIGHT[source]) });
    }
  }
  const bounds = {
    ...(lowers.length > 0 ? { lowerBound: Math.max(...lowers) } : {}),
    ...(uppers.length > 0 ? { upperBound: Math.min(...uppers) } : {}),
  };
  const empty = { estimate: null, se: null, seInternal: null, interval: null, df: null, dispersion: null };
  if (values.length === 0) {
    return { ...empty, confidence, n: observations.length, nUsed: 0, outliers: [], ...bounds, method: "bounds only" };
  }

  const outliers: string[] = [];
  let kept = values;
  if (values.length >= 3) {
    const { location, scale } = huberLocation(values, huberK);
    kept = values.filter((p) => {
      const isOutlier = Math.abs(p.y - location) / (Math.sqrt(p.v) * scale) > outlierZ;
      if (isOutlier) outliers.push(p.id);
      return !isOutlier;
    });
  }

  let sw = 0;
  let swy = 0;
  for (const p of kept) {
    sw += 1 / p.v;
    swy += p.y / p.v;
  }
  const estimate = swy / sw;
  const residualSq = kept.reduce((s, p) => s + (p.y - estimate) ** 2 / p.v, 0);
  const df = priorDf + kept.length - 1;
  const dispersion = df > 0 ? (priorDf + residualSq) / df : 1;
  const seInternal = 1 / Math.sqrt(sw);
  const se = seInternal * Math.sqrt(dispersion);
  const half = studentTQuantile(0.5 + confidence / 2, df > 0 ? df : Infinity) * se;
  const interval: [number, number] = [estimate - half, estimate + half];

  let boundConflict: string | undefined;
  if (bounds.lowerBound !== undefined && interval[1] < bounds.lowerBound) {
    boundConflict = `the interval lies below the lower bound ${bounds.lowerBound.toFixed(2)} from other records`;
  } else if (bounds.upperBound !== undefined && interval[0] > bounds.upperBound) {
    boundConflict = `the interval lies above the upper bound ${bounds.upperBound.toFixed(2)} from other records`;
  }

  return {
    estimate, se, seInternal, interval, confidence, df: df > 0 ? df : Infinity, dispersion,
    n: observations.length, nUsed: kept.length, outliers, ...bounds,
    ...(boundConflict ? { boundConflict } : {}),
    method: `inverse-variance mean after Huber screening (k=${huberK}, outliers beyond ${outlierZ}); ${
      df > 0 ? `dispersion from scatter${priorDf > 0 ? ` with ${priorDf} prior df` : ""}, Student t (${df} df)` : "stated error, normal quantile"
    }`,
  };
}
