/**
 * Inverse fit: from the observed recovery of one work-up, the neutral log K of one component in one solvent,
 * solved through the whole sequence with the same simulator. Recovery is monotone in
 * log K for a fixed sequence, so a bracketed bisection on log K finds the one value that reproduces the
 * observation. A recovery within the noise of what an infinite (or zero) K gives only bounds K, and a
 * recovery that hardly moves with K (the component ionized, or lost by another path) says nothing about it.
 */
import type { WorkupInput } from "./schema";
import type { WorkupPrediction } from "./types";
import type { WorkupSimulator } from "./uncertainty";



export interface FitOptions {
  /** Component key. */
  component: string;
  /** Observed work-up recovery, fraction of the starting amount (0–1; slightly above 1 is accepted). */
  observedRecovery: number;
  /**
   * Standard uncertainty of the observed recovery, as a fraction. Default 0.03 (from memory: qNMR with an
   * internal standard is good to a few per cent; gravimetric recoveries are worse; common practice).
   */
  recoverySe?: number;
  /** Solvent whose log K is fitted, as the engine names it. Default: the organic solvent with most volume. */
  solvent?: string;
  /** Search range of log K. Default [−4, 8]. */
  logKRange?: [number, number];
}

export type LogKFitKind = "value" | "lower_bound" | "upper_bound" | "uninformative";

export interface LogKFit {
  kind: LogKFitKind;
  component: string;
  solvent: string;
  /** The fitted value, or the bound; null when uninformative. */
  logK: number | null;
  /** Standard error of a fitted value, from the recovery uncertainty through the slope dR/dlogK. */
  se?: number;
  /** 95 % interval of a fitted value; an open end is null (the observation allows any K beyond it). */
  interval?: [number | null, number | null];
  /** log10 D of the component at the contact where most of it moved, at the fitted (or bounding) log K. */
  logD?: number;
  /** pH of that contact's aqueous phase. */
  pH?: number;
  /** 1-based step of that contact. */
  step?: number;
  /** Predicted recovery at both ends of the search range. */
  recoveryRange: { atLowK: number; atHighK: number };
  reason: string;
}

const Z95 = 1.959964;

export function withLogK(input: WorkupInput, key: string, solvent: string, logK: number): WorkupInput {
  return {
    ...input,
    components: input.components.map((c) =>
      c.key === key ? { ...c, logK: { ...c.logK, [solvent]: { value: logK, provenance: "group" as const } } } : c),
  };
}

/** The organic solvent with the largest volume over every contact the component takes part in. */
export function mainSolvent(prediction: WorkupPrediction): string | null {
  const totals = new Map<string, number>();
  for (const step of prediction.steps) {
    for (const contact of step.contacts) {
      for (const phase of contact.phases) {
        if (phase.kind !== "organic") continue;
        for (const [solvent, ml] of Object.entries(phase.solventsMl)) {
          if (solvent.toLowerCase() !== "water") totals.set(solvent, (totals.get(solvent) ?? 0) + ml);
        }
      }
    }
  }
  let best: string | null = null;
  for (const [solvent, ml] of totals) if (best === null || ml > (totals.get(best) ?? 0)) best = solvent;
  return best;
}

/** Bisection for R(logK) = target on [lo, hi], with R(lo) and R(hi) on opposite sides of target. */
function solve(recoveryAt: (logK: number) => number, target: number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  let fa = recoveryAt(a) - target;
  for (let i = 0; i < 60 && b - a > 1e-7; i++) {
    const m = (a + b) / 2;
    const fm = recoveryAt(m) - target;
    if ((fm < 0) === (fa < 0)) { a = m; fa = fm; } else b = m;
  }
  return (a + b) / 2;
}

/** Where the component moved most: the contact with the largest amount in the phase the step did not keep. */
function mainContact(prediction: WorkupPrediction, key: string): { logD: number; pH: number; step: number } | null {
  let best: { moved: number; logD: number; pH: number; step: number } | null = null;
  for (const step of prediction.steps) {
    for (const contact of step.contacts) {
      const aqueous = contact.phases.find((p) => p.kind === "aqueous");
      const d = contact.phases.find((p) => p.distributionRatio?.[key] !== undefined)?.distributionRatio?.[key];
      if (!aqueous || d === undefined || aqueous.pH === null || !(d > 0)) continue;
      const other = contact.phases.find((p) => p.kind !== step.kept.kind);
      const amounts = other?.components[key];
      const moved = amounts ? amounts.neutral + amounts.charged : 0;
      if (!best || moved > best.moved) best = { moved, logD: Math.log10(d), pH: aqueous.pH, step: step.index };
    }
  }
  return best && { logD: best.logD, pH: best.pH, step: best.step };
}

export function fitLogK(input: WorkupInput, simulate: WorkupSimulator, options: FitOptions): LogKFit {
  const { component: key, observedRecovery: observed } = options;
  const sigma = options.recoverySe ?? 0.03;
  const [lo, hi] = options.logKRange ?? [-4, 8];
  if (!input.components.some((c) => c.key === key)) throw new RangeError(`no component '${key}' in the work-up`);
  if (!(observed >= 0 && observed <= 1.5)) throw new RangeError(`observed recovery must be a fraction from 0 to 1.5, got ${observed}`);
  if (!(sigma > 0 && sigma < 1)) throw new RangeError(`recoverySe must lie between 0 and 1, got ${sigma}`);
  if (!(lo < hi)) throw new RangeError("logKRange must be [low, high] with low < high");
  const solvent = options.solvent ?? mainSolvent(simulate(input, { flags: false }));
  if (!solvent) throw new RangeError("the work-up has no organic phase, so there is no log K to fit");

  const recoveryAt = (logK: number): number => simulate(withLogK(input, key, solvent, logK), { steps: false, flags: false }).recovery[key] ?? 0;
  const predictAt = (logK: number): WorkupPrediction => simulate(withLogK(input, key, solvent, logK), { flags: false });
  const atLowK = recoveryAt(lo);
  const atHighK = recoveryAt(hi);
  const base = { component: key, solvent, recoveryRange: { atLowK, atHighK } };
  const rising = atHighK >= atLowK;
  const band = Z95 * sigma;
  const nearHigh = rising ? observed >= atHighK - band : observed <= atHighK + band;
  const nearLow = rising ? observed <= atLowK + band : observed >= atLowK - band;
  const withContact = (logK: number) => {
    const c = mainContact(predictAt(logK), key);
    return c ? { logD: c.logD, pH: c.pH, step: c.step } : {};
  };
  const pctOf = (x: number): string => `${(100 * x).toFixed(1)} %`;

  if (nearHigh && nearLow) {
    return {
      ...base, kind: "uninformative", logK: null,
      reason: `the predicted recovery moves only from ${pctOf(atLowK)} to ${pctOf(atHighK)} over log K ${lo} to ${hi}, within the noise of the observation (±${pctOf(band)}): the component is ionized at the pH used or lost by another path, so this record says nothing about its K`,
    };
  }
  const sign = rising ? 1 : -1;
  if (nearHigh) {
    const target = observed - sign * band;
    const bound = solve(recoveryAt, target, lo, hi);
    return {
      ...base, kind: rising ? "lower_bound" : "upper_bound", logK: bound, ...withContact(bound),
      reason: `the observed ${pctOf(observed)} is within the noise of the ${pctOf(atHighK)} a very large K gives; any log K above ${bound.toFixed(2)} fits (95 %), so it only bounds K. Measure with a smaller organic volume or closer to the pKa to pin it down (§5.2)`,
    };
  }
  if (nearLow) {
    const target = observed + sign * band;
    const bound = solve(recoveryAt, target, lo, hi);
    return {
      ...base, kind: rising ? "upper_bound" : "lower_bound", logK: bound, ...withContact(bound),
      reason: `the observed ${pctOf(observed)} is within the noise of the ${pctOf(atLowK)} a vanishing K gives; any log K below ${bound.toFixed(2)} fits (95 %), so it only bounds K`,
    };
  }

  const logK = solve(recoveryAt, observed, lo, hi);
  const h = 0.01;
  const slope = (recoveryAt(logK + h) - recoveryAt(logK - h)) / (2 * h);
  const se = Math.abs(sigma / slope);
  const end = (target: number): number | null => {
    const inRange = rising ? target > atLowK && target < atHighK : target < atLowK && target > atHighK;
    return inRange ? solve(recoveryAt, target, lo, hi) : null;
  };
  const a = end(observed - band);
  const b = end(observed + band);
  const interval: [number | null, number | null] = rising ? [a, b] : [b, a];
  return {
    ...base, kind: "value", logK, se, interval, ...withContact(logK),
    reason: `log K ${logK.toFixed(2)} in ${solvent} reproduces the observed ${pctOf(observed)} through the whole sequence; recovery changes by ${pctOf(Math.abs(slope))} per log unit there`,
  };
}
