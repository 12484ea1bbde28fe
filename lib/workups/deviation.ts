/**
 * Reported recovery on one product basis, "product in the crude before the workup": the in-process assay when the chemist gave one; otherwise the expected amount (or the spec's
 * product amount) times the group's reaction-yield figure (lib/chem/predictive.ts YIELD_PRIOR, updated from the
 * group's assayed workups). The predicted recovery is the engine's fraction of whatever product entered the
 * workup, so both sit on that basis. All recoveries are fractions 0–1; deviations in points only where named Pct.
 */

export type RecoveryBasis = "assayed" | "expected" | "spec";

export interface ReportedRecovery {
  /** Product isolated over the product in the crude, fraction (may exceed 1 when impure, wet or the estimate was low). */
  recovery: number;
  productMmol: number;
  /** The amount the crude estimate starts from: the assay, the expected amount, or the spec's product amount. */
  referenceMmol: number;
  basis: RecoveryBasis;
  /** Product in the crude before the workup, mmol: the assay, or the reference × the group's reaction-yield figure. */
  crudeMmol: number;
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
  /** Product in the crude per unit of an unassayed reference amount (the yield figure); 1 when omitted. */
  yieldFactor?: number;
}

/** recovery = mass × purity / (molar mass × product in the crude). Null when there is no reference amount. */
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
    if (mmol === null || !(mmol > 0)) continue;
    const crudeMmol = basis === "assayed" ? mmol : mmol * (inputs.yieldFactor ?? 1);
    return { recovery: productMmol / crudeMmol, productMmol, referenceMmol: mmol, basis, crudeMmol, purityAssumed };
  }
  return null;
}

export type DeviationStatus = "as_expected" | "below" | "above" | "inconclusive" | "unknown";

export interface Deviation {
  status: DeviationStatus;
  /** reported − predicted (median of the predictive distribution), percentage points; null without a prediction. */
  deviationPct: number | null;
  /** The 95 % predictive interval the status was judged against, fractions. */
  low: number | null;
  high: number | null;
  /** True when the engine's Monte Carlo interval was missing and a wide fallback spread was used. */
  fallbackBand: boolean;
}

/**
 * Flagged for review: a real shortfall with posterior probability ≥ 0.95 (status "below", lib/chem/predictive.ts
 * FLAG_PROBABILITY), or a danger-level procedure risk from the engine, whatever the outcome.
 */
export function isFlagged(status: DeviationStatus, flags: readonly { severity: string }[]): boolean {
  return status === "below" || flags.some((f) => f.severity === "danger");
}
