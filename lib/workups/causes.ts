/**
 * Likely causes of a recovery below the prediction, ranked by how much of the gap each explains: the model is
 * re-run with one suspect parameter changed (workup-practice §3 failure modes; §6 view 5, "which few causes account
 * for most lost material"). A change that explains the gap exactly scores 1; one that closes half of it, or
 * overshoots it twofold, scores 0.5; one that moves the prediction the wrong way scores 0.
 */
import { simulateWorkup, type PredictOptions } from "@/lib/chem/predict";
import { type Operation, type WorkupInput } from "@/lib/chem/schema";
import { type LibraryOverrides } from "@/lib/chem/library";

export type CauseCode = "product_logp_lower" | "product_pka_shift" | "cosolvent_not_removed" | "one_fewer_extraction" | "emulsion_loss" | "wrong_layer";

export interface LikelyCause {
  code: CauseCode;
  title: string;
  /** The parameter change that was tried, in words. */
  change: string;
  step?: number;
  /** Predicted product recovery with the change, fraction. */
  recovery: number;
  /** (predicted − recovery with the change) / (predicted − reported). */
  fractionOfGap: number;
  score: number;
  /** False for the hold-up estimate, which is a correction of the prediction rather than a re-run. */
  simulated: boolean;
}

/** Share of a layer assumed lost at a separation with an emulsion or rag, or on a difficult cut (common practice). */
export const EMULSION_LOSS_FRACTION = 0.1;
/** Causes explaining less than this share of the gap are not listed. */
const MIN_SCORE = 0.05;

const SEPARATIONS = new Set(["wash", "extract", "back_extract", "separate"]);

interface Candidate {
  code: CauseCode;
  title: string;
  change: string;
  step?: number;
  input?: WorkupInput;
  recovery?: number;
}

export function gapScore(predicted: number, reported: number, withChange: number): { fractionOfGap: number; score: number } {
  const gap = predicted - reported;
  if (!(Math.abs(gap) > 1e-9)) return { fractionOfGap: 0, score: 0 };
  const fractionOfGap = (predicted - withChange) / gap;
  const score = fractionOfGap <= 0 ? 0 : fractionOfGap <= 1 ? fractionOfGap : 1 / fractionOfGap;
  return { fractionOfGap, score };
}

function withOperations(input: WorkupInput, operations: Operation[]): WorkupInput {
  return { ...input, operations };
}

function productCandidates(input: WorkupInput, productIndex: number): Candidate[] {
  const product = input.components[productIndex];
  if (!product) return [];
  const out: Candidate[] = [];
  const replaceProduct = (next: typeof product): WorkupInput => ({
    ...input,
    components: input.components.map((c, i) => (i === productIndex ? next : c)),
  });
  if (product.logP || Object.keys(product.logK).length > 0) {
    const logK = Object.fromEntries(Object.entries(product.logK).map(([k, v]) => [k, { ...v, value: v.value - 1 }]));
    const logP = product.logP ? { ...product.logP, value: product.logP.value - 1 } : undefined;
    out.push({
      code: "product_logp_lower", title: "Product more polar than assumed",
      change: product.logP ? `log P of ${product.name} ${product.logP.value.toFixed(2)} → ${(product.logP.value - 1).toFixed(2)}` : `log K of ${product.name} 1 unit lower`,
      input: replaceProduct({ ...product, logK, ...(logP ? { logP } : {}) }),
    });
  }
  product.pKas.forEach((pKa, j) => {
    for (const shift of [-1, 1]) {
      const pKas = product.pKas.map((p, k) => (k === j ? { ...p, value: p.value + shift } : p));
      out.push({
        code: "product_pka_shift", title: "Product more ionized at the wash pH than assumed",
        change: `${pKa.kind === "acid" ? "acid" : "conjugate-acid"} pKa of ${product.name} ${pKa.value.toFixed(2)} → ${(pKa.value + shift).toFixed(2)}`,
        input: replaceProduct({ ...product, pKas }),
      });
    }
  });
  return out;
}

function operationCandidates(input: WorkupInput): Candidate[] {
  const ops = input.operations;
  const out: Candidate[] = [];
  const removals = ops.map((op, i) => ({ op, i })).filter(({ op }) => op.type === "remove_cosolvent");
  if (removals.length > 0) {
    out.push({
      code: "cosolvent_not_removed", title: "Water-miscible co-solvent not removed before the extraction",
      change: `step${removals.length > 1 ? "s" : ""} ${removals.map((r) => r.i + 1).join(", ")} (co-solvent removal) left out`,
      step: (removals[0]?.i ?? 0) + 1,
      input: withOperations(input, ops.filter((op) => op.type !== "remove_cosolvent")),
    });
  }
  const extractions = ops.map((op, i) => ({ op, i })).filter(({ op }) => op.type === "extract");
  const multi = extractions.filter(({ op }) => op.type === "extract" && op.portions > 1).at(-1);
  if (multi && multi.op.type === "extract") {
    const fewer = { ...multi.op, portions: multi.op.portions - 1 };
    out.push({
      code: "one_fewer_extraction", title: "One extraction fewer than recorded",
      change: `step ${multi.i + 1}: ${multi.op.portions} → ${multi.op.portions - 1} portions`, step: multi.i + 1,
      input: withOperations(input, ops.map((op, i) => (i === multi.i ? fewer : op))),
    });
  } else if (extractions.length > 1) {
    const last = extractions.at(-1)!;
    out.push({
      code: "one_fewer_extraction", title: "One extraction fewer than recorded",
      change: `step ${last.i + 1} (extraction) left out`, step: last.i + 1,
      input: withOperations(input, ops.filter((_, i) => i !== last.i)),
    });
  }
  ops.forEach((op, i) => {
    if (!SEPARATIONS.has(op.type) || !("keep" in op) || (op.keep !== "organic" && op.keep !== "aqueous")) return;
    const flipped = { ...op, keep: op.keep === "organic" ? "aqueous" : "organic" } as Operation;
    out.push({
      code: "wrong_layer", title: "Wrong layer kept",
      change: `step ${i + 1} kept the ${op.keep === "organic" ? "aqueous" : "organic"} layer instead of the ${op.keep}`, step: i + 1,
      input: withOperations(input, ops.map((o, k) => (k === i ? flipped : o))),
    });
  });
  return out;
}

function emulsionCandidate(input: WorkupInput, predicted: number): Candidate | null {
  const separations = input.operations.filter((op) => SEPARATIONS.has(op.type));
  if (separations.length === 0) return null;
  const observed = separations.filter((op) => op.observed?.interface === "emulsion" || op.observed?.interface === "rag").length;
  const count = Math.max(1, observed);
  return {
    code: "emulsion_loss", title: "Emulsion or hold-up loss at a separation",
    change: `${Math.round(EMULSION_LOSS_FRACTION * 100)} % of the kept layer lost at ${count} separation${count > 1 ? "s" : ""}${observed > 0 ? " where an emulsion or rag was recorded" : ""}`,
    recovery: predicted * (1 - EMULSION_LOSS_FRACTION) ** count,
  };
}

/** Ranks the candidates; empty unless the reported recovery is below the prediction. */
export function rankCauses(
  input: WorkupInput,
  productKey: string,
  predicted: number,
  reported: number,
  library: LibraryOverrides,
): LikelyCause[] {
  if (!(reported < predicted)) return [];
  const productIndex = input.components.findIndex((c) => c.key === productKey);
  if (productIndex < 0) return [];
  const engine: PredictOptions = { ...library, steps: false, flags: false };
  const candidates = [...productCandidates(input, productIndex), ...operationCandidates(input)];
  const emulsion = emulsionCandidate(input, predicted);
  if (emulsion) candidates.push(emulsion);
  const best = new Map<string, LikelyCause>();
  for (const candidate of candidates) {
    const recovery = candidate.recovery ?? simulatedRecovery(candidate.input, productKey, engine);
    if (recovery === null) continue;
    const { fractionOfGap, score } = gapScore(predicted, reported, recovery);
    if (score < MIN_SCORE) continue;
    const cause: LikelyCause = {
      code: candidate.code, title: candidate.title, change: candidate.change, recovery, fractionOfGap, score,
      simulated: candidate.recovery === undefined, ...(candidate.step !== undefined ? { step: candidate.step } : {}),
    };
    // One entry per kind of cause: the variant (pKa direction, which layer) that explains the gap best.
    const kept = best.get(cause.code);
    if (!kept || cause.score > kept.score) best.set(cause.code, cause);
  }
  return [...best.values()].sort((a, b) => b.score - a.score);
}

function simulatedRecovery(input: WorkupInput | undefined, productKey: string, engine: PredictOptions): number | null {
  if (!input) return null;
  try {
    const recovery = simulateWorkup(input, engine).recovery[productKey];
    return recovery !== undefined && Number.isFinite(recovery) ? recovery : null;
  } catch {
    return null; // a variant the engine cannot run (e.g. no layer left to keep) explains nothing
  }
}
