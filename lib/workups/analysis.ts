// The comparison stored with an outcome (Outcome.analysis) and mirrored on the Workup row (status, deviationPct,
// flagged): reported vs predicted recovery, the interval, and the likely causes of a shortfall.
import { type LibraryOverrides } from "@/lib/chem/library";
import { type WorkupInput } from "@/lib/chem/schema";
import { type Flag } from "@/lib/chem/types";
import { rankCauses, type LikelyCause } from "./causes";
import { compareWithPrediction, isFlagged, reportedRecovery, type Deviation, type ReportedRecovery } from "./deviation";
import { productOf } from "./record";

export interface OutcomeAnalysis {
  workupVersion: number;
  engineVersion: string | null;
  productKey: string | null;
  reported: ReportedRecovery | null;
  predicted: { recovery: number; low: number | null; high: number | null } | null;
  deviation: Deviation;
  flagged: boolean;
  /** Codes of the engine's danger flags, which flag a workup whatever its outcome. */
  dangerFlags: string[];
  causes: LikelyCause[];
}

export interface PredictionFacts {
  workupVersion: number;
  engineVersion: string | null;
  productKey: string | null;
  productRecovery: number | null;
  recoveryLow: number | null;
  recoveryHigh: number | null;
  flags: readonly Flag[];
}

export interface AnalysisInputs {
  outcome: { isolatedMassMg: number; purityPct?: number | null };
  header: { assayedProductMmol: number | null; expectedProductMmol: number | null };
  spec: WorkupInput;
  prediction: PredictionFacts | null;
  library: LibraryOverrides;
}

export function analyzeOutcome({ outcome, header, spec, prediction, library }: AnalysisInputs): OutcomeAnalysis {
  const product = productOf(spec, prediction?.productKey ?? null);
  const reported = product
    ? reportedRecovery({
        isolatedMassMg: outcome.isolatedMassMg,
        purityPct: outcome.purityPct,
        molarMass: product.molarMass,
        assayedProductMmol: header.assayedProductMmol,
        expectedProductMmol: header.expectedProductMmol,
        specProductMmol: product.amountMmol,
      })
    : null;
  const predicted =
    prediction && prediction.productRecovery !== null
      ? { recovery: prediction.productRecovery, low: prediction.recoveryLow, high: prediction.recoveryHigh }
      : null;
  const deviation = compareWithPrediction(reported?.recovery ?? null, predicted?.recovery ?? null, predicted?.low ?? null, predicted?.high ?? null);
  const flags = prediction?.flags ?? [];
  const causes =
    deviation.status === "below" && product && predicted && reported
      ? rankCauses(spec, product.key, predicted.recovery, reported.recovery, library)
      : [];
  return {
    workupVersion: prediction?.workupVersion ?? 0,
    engineVersion: prediction?.engineVersion ?? null,
    productKey: product?.key ?? null,
    reported,
    predicted,
    deviation,
    flagged: isFlagged(deviation.status, flags),
    dangerFlags: flags.filter((f) => f.severity === "danger").map((f) => f.code),
    causes,
  };
}
