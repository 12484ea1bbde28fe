/**
 * A partition observation inferred from one workup's reported outcome through the engine's inverse fit (lib/chem
 * fit.ts), used only where the record can carry it:
 *  - the product's purity must have been measured (weight only: the isolated mass may hold impurities or solvent);
 *  - with an in-process assay as reference, the recovery is the work-up's own and is fitted; with only the expected
 *    amount, the reaction's yield is folded in, so the work-up recovered at least what was reported and K is only
 *    bounded from one side;
 *  - a recovery within the noise of full (or no) recovery gives a bound, not a value; a recovery that K hardly moves
 *    gives nothing;
 *  - flags for loss paths the fit would wrongly blame on K (emulsion, wrong layer, ejection, volatility, degradation,
 *    solids, ion pairs, metal binding) keep the record out, as does a mass balance that does not close.
 * A fitted value carries the fit's standard error combined with the ±5 % volume uncertainty, and half the weight of
 * a measurement (lib/chem/pool.ts's default for inferred observations). Pure: the caller supplies the simulator.
 */
import { fitLogK, type LogKFit } from "@/lib/chem/fit";
import { type WorkupSimulator as Simulator } from "@/lib/chem/uncertainty";
import { type WorkupInput } from "@/lib/chem/schema";
import { type Flag } from "@/lib/chem/types";
import { DEFAULT_UNCERTAINTY } from "@/lib/chem/perturb";

export type PurityMethodName = "qnmr" | "hplc" | "gc" | "weight_only";

/** Standard uncertainty of a reported work-up recovery by purity method (from memory: qNMR with an internal standard is good to a few per cent, §5.2 "Quantitation"; calibrated chromatography a little worse). */
export const RECOVERY_SE: Record<Exclude<PurityMethodName, "weight_only">, number> = { qnmr: 0.03, hplc: 0.04, gc: 0.04 };
/** Weight of an inferred observation relative to a measurement (lib/chem/pool.ts default for inferred records). */
export const INFERRED_WEIGHT = 0.5;
/** A fitted value looser than this (log units) adds little beside a structure estimate (±0.7 or worse); judgement. */
export const MAX_INFERRED_SE = 0.6;
/** Reported recoveries above this do not close the mass balance (common practice, §5.2: 90–110 %). */
export const MAX_RECOVERY = 1.1;
/** Failure modes (§3) whose losses the fit would attribute to K. */
export const CONFOUNDING_FLAGS = new Set(["F10", "F11", "F13", "F14", "F16", "F17", "F19", "F28"]);
/**
 * log10 standard deviation of V_org/V_aq from ±5 % on each volume (lib/chem/perturb.ts): recovery depends on
 * D·V_org/V_aq, so a volume error moves the fitted log K one for one.
 */
export const VOLUME_LOGK_SE = (Math.SQRT2 * DEFAULT_UNCERTAINTY.volumeRelative) / Math.LN10;

export interface InferenceInput {
  spec: WorkupInput;
  productKey: string;
  /** Reported recovery, fraction, and what it is relative to (lib/workups/deviation.ts). */
  recovery: number;
  basis: "assayed" | "expected" | "spec";
  purityMethod: PurityMethodName;
  /** The engine's flags for this workup. */
  flags: readonly Pick<Flag, "code" | "component">[];
}

export type Inference =
  | { use: true; solvent: string; logK: number; se: number | null; bound: "value" | "lower" | "upper"; weight: number; reason: string; fit: LogKFit }
  | { use: false; reason: string; fit?: LogKFit };

export function inferFromOutcome(input: InferenceInput, simulate: Simulator): Inference {
  const { spec, productKey, recovery, basis, purityMethod } = input;
  if (purityMethod === "weight_only") return { use: false, reason: "purity was not measured, so the isolated mass is not the product's alone" };
  if (recovery > MAX_RECOVERY) return { use: false, reason: `the reported recovery of ${(100 * recovery).toFixed(0)} % does not close the mass balance` };
  const confounding = input.flags.filter((f) => CONFOUNDING_FLAGS.has(f.code) && (f.component === undefined || f.component === productKey));
  if (confounding.length > 0) {
    return { use: false, reason: `the prediction warns of losses other than partition (${[...new Set(confounding.map((f) => f.code))].join(", ")})` };
  }
  const recoverySe = RECOVERY_SE[purityMethod];
  let fit: LogKFit;
  try {
    fit = fitLogK(spec, simulate, { component: productKey, observedRecovery: Math.max(0, recovery), recoverySe });
  } catch (error) {
    return { use: false, reason: error instanceof RangeError ? error.message : "the inverse fit failed" };
  }
  if (fit.kind === "uninformative" || fit.logK === null) return { use: false, reason: fit.reason, fit };
  const rising = fit.recoveryRange.atHighK >= fit.recoveryRange.atLowK;
  const base = { use: true as const, solvent: fit.solvent, weight: INFERRED_WEIGHT, fit };

  if (basis !== "assayed") {
    // The work-up recovered at least `recovery`: only the end of the interval on the low-recovery side holds.
    if (fit.kind === "lower_bound" || fit.kind === "upper_bound") {
      const sameSide = (fit.kind === "lower_bound") === rising;
      if (!sameSide) return { use: false, reason: "near-zero recovery against the theoretical amount says nothing about the work-up alone", fit };
      return { ...base, logK: fit.logK, se: null, bound: fit.kind === "lower_bound" ? "lower" : "upper", reason: `${fit.reason}; no in-process assay, so only a bound` };
    }
    const end = rising ? fit.interval?.[0] : fit.interval?.[1];
    if (end === null || end === undefined) return { use: false, reason: "no in-process assay, and the recovery is too low to bound K", fit };
    return {
      ...base, logK: end, se: null, bound: rising ? "lower" : "upper",
      reason: `without an in-process assay the reaction's yield is unknown, so the work-up recovered at least the reported ${(100 * recovery).toFixed(1)} %: log K ${rising ? "≥" : "≤"} ${end.toFixed(2)}`,
    };
  }
  if (fit.kind === "lower_bound" || fit.kind === "upper_bound") {
    return { ...base, logK: fit.logK, se: null, bound: fit.kind === "lower_bound" ? "lower" : "upper", reason: fit.reason };
  }
  const se = Math.hypot(fit.se ?? Infinity, VOLUME_LOGK_SE);
  if (!(se <= MAX_INFERRED_SE)) return { use: false, reason: `the record pins log K only to ±${se.toFixed(2)}`, fit };
  return { ...base, logK: fit.logK, se, bound: "value", reason: fit.reason };
}
