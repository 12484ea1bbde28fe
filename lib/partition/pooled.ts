/**
 * The group's value for one compound in one solvent/water system: every observation that is not excluded, pooled
 * by lib/chem/pool.ts (Huber screening, inverse-variance mean, dispersion from the scatter, Student t). Measured
 * observations count fully; inferred ones carry the lower weight stored with them. Bounds are kept apart. Pure.
 */
import { poolLogK, type LogKObservation, type PooledLogK } from "@/lib/chem/pool";

export interface ObservationForPool {
  id: string;
  logK: number;
  logKSe: number | null;
  kind: "measured" | "inferred";
  bound: "value" | "lower" | "upper";
  weight: number;
  excluded: boolean;
  createdAt: Date;
}

export interface PooledValue {
  estimate: number | null;
  se: number | null;
  interval: [number, number] | null;
  /** Value observations kept in the estimate. */
  n: number;
  /** Every observation that is not excluded, bounds included. */
  nTotal: number;
  outliers: string[];
  lowerBound: number | null;
  upperBound: number | null;
  boundConflict: string | null;
  /** "group data, n = 4, ±0.12", or a bounds-only description; null when there is nothing. */
  label: string | null;
}

const KIND_SOURCE = { measured: "measured", inferred: "inferred" } as const;

export function toPoolObservation(o: ObservationForPool): LogKObservation {
  return {
    id: o.id,
    logK: o.logK,
    kind: o.bound === "lower" ? "lower_bound" : o.bound === "upper" ? "upper_bound" : "value",
    source: KIND_SOURCE[o.kind],
    ...(o.logKSe !== null && o.logKSe > 0 ? { se: o.logKSe } : {}),
    weight: Math.min(1, Math.max(1e-3, o.weight)),
  };
}

/** The provenance label predictions and pages show beside a group value. */
export function groupLabel(n: number, se: number): string {
  return `group data, n = ${n}, ±${se.toFixed(2)}`;
}

function describe(p: PooledLogK): string | null {
  if (p.estimate !== null && p.se !== null) return groupLabel(p.nUsed, p.se);
  const parts: string[] = [];
  if (p.lowerBound !== undefined) parts.push(`log K ≥ ${p.lowerBound.toFixed(2)}`);
  if (p.upperBound !== undefined) parts.push(`log K ≤ ${p.upperBound.toFixed(2)}`);
  return parts.length > 0 ? `group data: bounds only (${parts.join(", ")}, n = ${p.n})` : null;
}

export function poolObservations(observations: readonly ObservationForPool[]): PooledValue {
  const used = observations.filter((o) => !o.excluded);
  if (used.length === 0) {
    return { estimate: null, se: null, interval: null, n: 0, nTotal: 0, outliers: [], lowerBound: null, upperBound: null, boundConflict: null, label: null };
  }
  const p = poolLogK(used.map(toPoolObservation));
  return {
    estimate: p.estimate, se: p.se, interval: p.interval, n: p.nUsed, nTotal: p.n, outliers: p.outliers,
    lowerBound: p.lowerBound ?? null, upperBound: p.upperBound ?? null, boundConflict: p.boundConflict ?? null, label: describe(p),
  };
}

export interface PooledPoint {
  /** When the observation that moved the estimate was recorded. */
  at: Date;
  observationId: string;
  estimate: number;
  low: number;
  high: number;
  n: number;
}

/** The pooled value as it stood after each observation, in the order they were recorded (excluded ones left out). */
export function poolHistory(observations: readonly ObservationForPool[]): PooledPoint[] {
  const ordered = observations.filter((o) => !o.excluded).sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || a.id.localeCompare(b.id));
  const points: PooledPoint[] = [];
  for (let i = 0; i < ordered.length; i++) {
    const current = ordered[i] as ObservationForPool;
    const p = poolObservations(ordered.slice(0, i + 1));
    if (p.estimate === null || p.interval === null) continue;
    points.push({ at: current.createdAt, observationId: current.id, estimate: p.estimate, low: p.interval[0], high: p.interval[1], n: p.n });
  }
  return points;
}
