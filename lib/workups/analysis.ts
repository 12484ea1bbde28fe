// The comparison stored with an outcome (Outcome.analysis) and mirrored on the Workup row (status, deviationPct,
// flagged): reported recovery against the predictive distribution (engine + handling + assay + reaction yield, the
// group's history folded in), the outcome status, and the likely causes of a shortfall. Two signals stay apart:
// procedure risk (the engine's flags, known before any outcome) and outcome status.
import { type LibraryOverrides } from "@/lib/chem/library";
import { handlingEvents } from "@/lib/chem/handling";
import {
  FLAG_PROBABILITY, INTERVAL_LEVEL, fitGroupModel, judgeOutcome, parameterErrorOpen, predictiveOf, recoveryInterval,
  type AssayMethod, type GroupModel, type PredictiveCase,
} from "@/lib/chem/predictive";
import { type WorkupInput } from "@/lib/chem/schema";
import { type Flag } from "@/lib/chem/types";
import { engineRecoveryOf, rankCauses, type CauseCode, type LikelyCause, type Simulator } from "./causes";
import { isFlagged, reportedRecovery, type Deviation, type ReportedRecovery } from "./deviation";
import { productOf } from "./record";

export interface PredictiveSummary {
  /** Mean and sd of log(isolated / reference amount). */
  logMean: number;
  logSd: number;
  /** log(product in the crude / reference amount): 0 when assayed. */
  crudeLog: number;
  observedLog: number;
  /** log(assayed crude / expected amount) when both were recorded. */
  yieldLog: number | null;
  /** Predictive CDF at the reported value, and the posterior probability of a real shortfall. */
  quantile: number;
  shortfallProbability: number;
  /** Flag threshold on shortfallProbability. */
  threshold: number;
  level: number;
  /** What the model was given, kept so that later judgements can learn from this outcome. */
  case: PredictiveCase;
  /** Outcomes of the group the model learned from. */
  historyN: number;
}

export interface OutcomeAnalysis {
  workupVersion: number;
  engineVersion: string | null;
  productKey: string | null;
  /** Reported recovery relative to the product in the crude before the workup. */
  reported: ReportedRecovery | null;
  /** Predictive median and 95 % interval on the same basis; `engine` is the engine's own point prediction. */
  predicted: { recovery: number; low: number | null; high: number | null; engine?: number } | null;
  predictive?: PredictiveSummary | null;
  deviation: Deviation;
  flagged: boolean;
  /** Codes of the engine's danger flags, which flag a workup whatever its outcome. */
  dangerFlags: string[];
  causes: LikelyCause[];
  /**
   * True while the version's Monte Carlo interval is being computed (lib/jobs/interval.ts): the outcome is not judged
   * yet (status "inconclusive", no deviation, no causes); the interval job writes the judgement.
   */
  intervalPending?: boolean;
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
  outcome: { isolatedMassMg: number; purityPct?: number | null; purityMethod?: AssayMethod | null };
  header: { assayedProductMmol: number | null; expectedProductMmol: number | null; chemistId?: string | null };
  spec: WorkupInput;
  prediction: PredictionFacts | null;
  library: LibraryOverrides;
  /** The group's model (lib/workups/group-model.ts); the common-practice priors alone when omitted. */
  model?: GroupModel;
  causeFrequencies?: Partial<Record<CauseCode, number>>;
  /** The engine re-run for causes (defaults to the engine with the group's library). */
  simulate?: Simulator;
  /** The prediction's interval is still being computed: record the reported recovery, judge nothing yet. */
  intervalPending?: boolean;
}

const PRIORS_ONLY = fitGroupModel([]);

/** The same product worked up by the same kinds of operation, in order: the engine's parameter error repeats. */
function familyOf(product: { name: string; smiles?: string | undefined }, spec: WorkupInput): string {
  return `${(product.smiles ?? product.name).trim().toLowerCase()}|${spec.operations.map((op) => op.type).join(",")}`;
}

/**
 * The analysis while the interval is being computed: what was reported, the procedure's danger flags, and an honest
 * "inconclusive" in place of a judgement made without the engine's spread (the fallback band is for predictions
 * that will never have an interval). Nothing here teaches the group model (no predictive case, no causes).
 */
function awaitingInterval(prediction: PredictionFacts | null, productKey: string | null, reported: ReportedRecovery | null, flags: readonly Flag[]): OutcomeAnalysis {
  return {
    workupVersion: prediction?.workupVersion ?? 0,
    engineVersion: prediction?.engineVersion ?? null,
    productKey,
    reported,
    predicted: null,
    predictive: null,
    deviation: { status: "inconclusive", deviationPct: null, low: null, high: null, fallbackBand: false },
    flagged: isFlagged("inconclusive", flags),
    dangerFlags: flags.filter((f) => f.severity === "danger").map((f) => f.code),
    causes: [],
    intervalPending: true,
  };
}

export function analyzeOutcome(inputs: AnalysisInputs): OutcomeAnalysis {
  const { outcome, header, spec, prediction, library } = inputs;
  const model = inputs.model ?? PRIORS_ONLY;
  const product = productOf(spec, prediction?.productKey ?? null);
  const assayed = header.assayedProductMmol !== null && header.assayedProductMmol > 0;
  const method: AssayMethod = outcome.purityMethod ?? (outcome.purityPct === null || outcome.purityPct === undefined ? "weight_only" : "hplc");
  const engine = prediction && prediction.productRecovery !== null
    ? { recovery: prediction.productRecovery, low: prediction.recoveryLow, high: prediction.recoveryHigh }
    : null;
  const predictiveCase: PredictiveCase | null = engine
    ? {
        engine, handling: handlingEvents(spec.operations), assay: method, crudeAssayed: assayed, chemist: header.chemistId ?? null,
        family: product ? familyOf(product, spec) : null,
      }
    : null;
  const predictive = predictiveCase ? predictiveOf(model, predictiveCase) : null;
  const reported = product
    ? reportedRecovery({
        isolatedMassMg: outcome.isolatedMassMg, purityPct: outcome.purityPct, molarMass: product.molarMass,
        assayedProductMmol: header.assayedProductMmol, expectedProductMmol: header.expectedProductMmol, specProductMmol: product.amountMmol,
        yieldFactor: Math.exp(predictive?.crudeLog ?? model.means["yield"] ?? 0),
      })
    : null;
  const interval = predictive ? recoveryInterval(predictive) : null;
  const predicted = interval && engine ? { recovery: interval.median, low: interval.low, high: interval.high, engine: engine.recovery } : null;
  const flags = prediction?.flags ?? [];
  if (inputs.intervalPending) return awaitingInterval(prediction, product?.key ?? null, reported, flags);
  let deviation: Deviation = { status: "unknown", deviationPct: null, low: predicted?.low ?? null, high: predicted?.high ?? null, fallbackBand: false };
  let summary: PredictiveSummary | null = null;
  let causes: LikelyCause[] = [];
  if (reported && predicted && predictive && predictiveCase && reported.productMmol > 0) {
    const observedLog = Math.log(reported.productMmol / reported.referenceMmol);
    const judged = judgeOutcome(model, predictive, observedLog);
    deviation = {
      status: judged.status, deviationPct: (reported.recovery - predicted.recovery) * 100,
      low: predicted.low, high: predicted.high, fallbackBand: engine?.low === null || engine?.high === null,
    };
    summary = {
      ...predictive, observedLog, quantile: judged.quantile, shortfallProbability: judged.shortfallProbability,
      yieldLog: assayed && header.expectedProductMmol ? Math.log((header.assayedProductMmol as number) / header.expectedProductMmol) : null,
      threshold: FLAG_PROBABILITY, level: INTERVAL_LEVEL, case: predictiveCase, historyN: model.n,
    };
    if ((judged.status === "below" || judged.status === "inconclusive") && product) {
      causes = rankCauses({
        input: spec, productKey: product.key, engineRecovery: predictiveCase.engine.recovery,
        logMean: predictive.logMean, logSd: predictive.logSd, observedLog, crudeLog: predictive.crudeLog, crudeAssayed: assayed,
        ...(inputs.causeFrequencies ? { frequencies: inputs.causeFrequencies } : {}),
        parameterOpen: parameterErrorOpen(model, predictiveCase),
      }, inputs.simulate ?? engineRecoveryOf(library, product.key));
    }
  } else if (reported && reported.productMmol === 0 && predicted) {
    deviation = { status: "below", deviationPct: (0 - predicted.recovery) * 100, low: predicted.low, high: predicted.high, fallbackBand: false };
  }
  return {
    workupVersion: prediction?.workupVersion ?? 0,
    engineVersion: prediction?.engineVersion ?? null,
    productKey: product?.key ?? null,
    reported,
    predicted,
    predictive: summary,
    deviation,
    flagged: isFlagged(deviation.status, flags),
    dangerFlags: flags.filter((f) => f.severity === "danger").map((f) => f.code),
    causes,
  };
}
