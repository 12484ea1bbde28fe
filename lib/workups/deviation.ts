/**
 * Reported recovery and its comparison with the prediction (workup-practice §2.11 step 5, §5.1 "Derived").
 * All recoveries are fractions 0–1 here; deviations in percentage points only where the name says Pct.
 */

export type RecoveryBasis = "assayed" | "expected" | "spec";

export interface ReportedRecovery {
  /** Product isolated over the reference amount, fraction (may exceed 1 when the material is impure or wet). */
  recovery: number;
  productMmol: number;
  referenceMmol: number;
  /** What the reference amount is: the in-process assay, the theoretical amount, or the spec's product amount. */
  basis: RecoveryBasis;
  /** Weight only: the isolated mass was taken as pure product, so the recovery is an upper bound. */
  purityAssumed: boolean;
}

export interface RecoveryInputs {
  isolatedMassMg: number;
  purityPct: number | null | undefined;
  molarMass: number;
  assayedProductMmol: number | null;
  expectedProductMmol: number | null;
  specProductMmol: number | null;
}

/**
 * recovery = mass × purity / (molar mass × reference amount). The reference is the amount assayed before the workup
 * when there is one (work-up recovery, separating reaction from work-up performance, §5.1 IPC); otherwise the
 * expected product amount, otherwise the product amount written in the spec. Null when there is no reference.
 */
export function reportedRecovery(inputs: RecoveryInputs): ReportedRecovery | null {
  const purityAssumed = inputs.purityPct === null || inputs.purityPct === undefined;
  const purity = purityAssumed ? 1 : (inputs.purityPct as number) / 100;
  const productMmol = (inputs.isolatedMassMg * purity) / inputs.molarMass;
  const reference: [RecoveryBasis, number | null][] = [
    ["assayed", inputs.assayedProductMmol],
    ["expected", inputs.expectedProductMmol],
    ["spec", inputs.specProductMmol],
  ];
  for (const [basis, mmol] of reference) {
    if (mmol !== null && mmol > 0) return { recovery: productMmol / mmol, productMmol, referenceMmol: mmol, basis, purityAssumed };
  }
  return null;
}

export type DeviationStatus = "as_expected" | "below" | "above" | "unknown";

export interface Deviation {
  status: DeviationStatus;
  /** reported − predicted, percentage points; null without a prediction. */
  deviationPct: number | null;
  /** The interval the status was judged against, fractions. */
  low: number | null;
  high: number | null;
  /** True when the Monte Carlo interval was missing and the fallback band was used. */
  fallbackBand: boolean;
}

/**
 * ±10 percentage points around the point prediction when no interval could be computed: the band a group review
 * draws around the identity line of a parity plot (workup-practice §6 view 1; common practice).
 */
export const FALLBACK_BAND = 0.1;

export function compareWithPrediction(
  reported: number | null,
  predicted: number | null,
  low: number | null,
  high: number | null,
): Deviation {
  if (reported === null || predicted === null) return { status: "unknown", deviationPct: null, low, high, fallbackBand: false };
  const fallbackBand = low === null || high === null;
  const lo = fallbackBand ? Math.max(0, predicted - FALLBACK_BAND) : Math.min(low, predicted);
  const hi = fallbackBand ? predicted + FALLBACK_BAND : Math.max(high, predicted);
  const status: DeviationStatus = reported < lo ? "below" : reported > hi ? "above" : "as_expected";
  return { status, deviationPct: (reported - predicted) * 100, low: lo, high: hi, fallbackBand };
}

/** A workup is flagged for review when the product came out below the interval or the engine raised a danger flag. */
export function isFlagged(status: DeviationStatus, flags: readonly { severity: string }[]): boolean {
  return status === "below" || flags.some((f) => f.severity === "danger");
}
