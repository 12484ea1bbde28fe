/**
 * Likely causes of a shortfall (the failure modes the engine's flags describe). Each candidate cause is a change to
 * the workup or to the reaction with a size (fraction lost in an emulsion, pH error, co-solvent left behind, …).
 * The model is re-run across a prior over that size; the cause's plausibility is its prior frequency × how likely
 * the reported value is under it (averaged over the size prior) × what the chemist recorded (an emulsion seen or
 * not), normalised over the candidates. Each cause is shown at its most plausible size, with the share of the gap
 * it then closes, capped at 100 %. A cause that can only over-explain (a wrong layer when most product arrived) has
 * next to no likelihood and is dropped. Pure: the engine is passed in.
 */
import { simulateWorkup, type PredictOptions } from "@/lib/chem/predict";
import { type Operation, type WorkupInput } from "@/lib/chem/schema";
import { type LibraryOverrides } from "@/lib/chem/library";
import { normalCdf } from "@/lib/chem/distributions";
import { causeSpace, type CauseCandidate } from "./cause-space";

export type CauseCode =
  | "reaction_shortfall" | "emulsion_loss" | "wrong_ph" | "product_logp_lower" | "cosolvent_not_removed" | "one_fewer_extraction" | "wrong_layer";

export interface LikelyCause {
  code: CauseCode;
  title: string;
  /** The change at its most plausible size, in words. */
  change: string;
  step?: number;
  /** Predicted recovery (relative to the product in the crude) with the change, fraction. */
  recovery: number;
  /** Share of the gap (predicted − reported) the change closes at its most plausible size, 0–1. */
  fractionOfGap: number;
  /** Posterior plausibility among the candidates, 0–1. */
  score: number;
  /** False for causes computed in closed form (emulsion loss, reaction shortfall) rather than by an engine re-run. */
  simulated: boolean;
}

/**
 * How often each cause is behind a shortfall a group reviews (common practice, rough figures; the group's own
 * reviewed shortfalls update them): reactions falling short are the most common reason for little product,
 * emulsions and hold-up next; procedural slips (pH, co-solvent, an extraction skipped, a layer discarded) after.
 */
export const CAUSE_PRIOR: Record<CauseCode, number> = {
  reaction_shortfall: 0.3, emulsion_loss: 0.2, wrong_ph: 0.12, product_logp_lower: 0.1,
  cosolvent_not_removed: 0.1, one_fewer_extraction: 0.1, wrong_layer: 0.08,
};
/** Weight of the common-practice frequencies against the group's own reviewed shortfalls (pseudo-counts). */
export const CAUSE_PRIOR_WEIGHT = 20;
/** An emulsion or rag is noted at the separation in most workups that lost product to one (common practice). */
const EMULSION_NOTED = { ifEmulsion: 0.8, otherwise: 0.1 };
/**
 * Absolute error of an isolated amount, as a fraction of the reference amount (common practice: the residue of a
 * near-empty flask still weighs a few mg of grease, solvent and impurities, about 1 % of a typical batch). Near zero
 * recovery it dominates the multiplicative scatter, so that "almost nothing" is compared as almost nothing: 0.2 %
 * and 0.01 % are the same outcome to a balance, not a factor of twenty apart.
 */
export const ABSOLUTE_FLOOR = 0.01;
/** Causes below this posterior plausibility, or closing less than this share of the gap, are not listed. */
const MIN_PLAUSIBILITY = 0.02;
const MIN_SHARE = 0.05;

export interface CauseQuestion {
  input: WorkupInput;
  productKey: string;
  /** The engine's recovery of the product for the workup as recorded. */
  engineRecovery: number;
  /** Predictive distribution of log(reported amount / reference amount) and the reported value on that scale. */
  logMean: number;
  logSd: number;
  observedLog: number;
  /** log(product in the crude / reference amount) the model assumed; 0 when assayed. */
  crudeLog: number;
  crudeAssayed: boolean;
  /** Cause frequencies of the group (defaults to CAUSE_PRIOR). */
  frequencies?: Partial<Record<CauseCode, number>>;
  /**
   * How much of the engine's parameter error for this product and procedure is still open: the posterior sd of the
   * family term over its prior sd (1 without history of the family). A parameter error the group's own outcomes of
   * the same family have pinned down is already in the prediction, so it can no longer explain this one's shortfall.
   */
  parameterOpen?: number;
}

export type Simulator = (input: WorkupInput) => number | null;

export function engineRecoveryOf(library: LibraryOverrides, productKey: string): Simulator {
  const engine: PredictOptions = { ...library, steps: false, flags: false };
  return (input) => {
    try {
      const r = simulateWorkup(input, engine).recovery[productKey];
      return r !== undefined && Number.isFinite(r) ? r : null;
    } catch {
      return null; // a variant the engine cannot run (e.g. no layer left to keep) explains nothing
    }
  };
}

const logNormalDensity = (x: number, mean: number, sd: number) => -0.5 * ((x - mean) / sd) ** 2 - Math.log(sd);

interface Scored {
  candidate: CauseCandidate;
  logEvidence: number;
  best: { effect: number; words: string };
}

/** log Σ exp. */
function logSum(values: readonly number[]): number {
  const max = Math.max(...values);
  return max === -Infinity ? -Infinity : max + Math.log(values.reduce((s, v) => s + Math.exp(v - max), 0));
}

/**
 * The likelihood's scale: log(amount + floor) relative to the median, with the multiplicative scatter and the absolute
 * floor combined. For ordinary recoveries this is the log scale of the predictive distribution.
 */
function likelihoodScale(q: CauseQuestion) {
  const median = Math.exp(q.logMean);
  const at = (effect: number) => {
    const r = median * Math.exp(effect);
    return { x: Math.log(r + ABSOLUTE_FLOOR) - Math.log(median + ABSOLUTE_FLOOR), sd: Math.hypot((q.logSd * r) / (r + ABSOLUTE_FLOOR), ABSOLUTE_FLOOR / (r + ABSOLUTE_FLOOR)) };
  };
  return { at, target: Math.log(Math.exp(q.observedLog) + ABSOLUTE_FLOOR) - Math.log(median + ABSOLUTE_FLOOR) };
}

/** Grid over the partition's spread, in standard deviations, with normal weights summing to 1. */
const PARTITION_GRID = (() => {
  const zs = Array.from({ length: 33 }, (_, i) => -4 + i * 0.25);
  const ws = zs.map((z) => Math.exp(-0.5 * z * z));
  const total = ws.reduce((a, b) => a + b, 0);
  return zs.map((z, i) => ({ z, weight: (ws[i] as number) / total }));
})();

/** Piecewise-linear interpolation through the nodes (ascending z), held at the end values beyond them. */
function interpolate(nodes: readonly { z: number; effect: number }[], z: number): number {
  const first = nodes[0]!;
  const last = nodes.at(-1)!;
  if (z <= first.z) return first.effect;
  if (z >= last.z) return last.effect;
  const i = nodes.findIndex((n) => n.z >= z);
  const a = nodes[i - 1]!;
  const b = nodes[i]!;
  return a.effect + ((z - a.z) / (b.z - a.z)) * (b.effect - a.effect);
}

/**
 * A change whose effect depends on the product's partition: at each size, the effect at the nodes (re-runs at shifted
 * log P) is interpolated over a normal spread of the partition and the likelihood averaged over it; the sizes are
 * then averaged by their prior weights. The most plausible point (size and partition) gives the change shown.
 */
function scoreAcross(candidate: CauseCandidate, q: CauseQuestion, simulate: Simulator): Scored | null {
  const scale = likelihoodScale(q);
  const perSize: { logWeight: number; logEvidence: number }[] = [];
  let best: { logPost: number; effect: number; words: string } | null = null;
  for (const size of candidate.sizes) {
    const nodes = (size.across ?? []).flatMap((n) => {
      const effect = effectOf(n.input, simulate, baselineOf(n.baseline, simulate));
      return effect === null ? [] : [{ z: n.z, effect }];
    });
    if (!nodes.some((n) => n.z === 0)) continue;
    const terms = PARTITION_GRID.map(({ z, weight }) => {
      const effect = interpolate(nodes, z);
      const at = scale.at(effect);
      return { effect, logTerm: Math.log(weight) + logNormalDensity(scale.target, at.x, at.sd) };
    });
    const logEvidence = logSum(terms.map((t) => t.logTerm));
    const logWeight = Math.log(size.weight) + Math.log(size.evidence ?? 1);
    perSize.push({ logWeight, logEvidence });
    for (const t of terms) {
      if (!best || logWeight + t.logTerm > best.logPost) best = { logPost: logWeight + t.logTerm, effect: t.effect, words: size.words };
    }
  }
  if (perSize.length === 0 || !best) return null;
  const totalWeight = logSum(perSize.map((p) => p.logWeight));
  return { candidate, logEvidence: logSum(perSize.map((p) => p.logWeight - totalWeight + p.logEvidence)), best: { effect: best.effect, words: best.words } };
}

function score(candidate: CauseCandidate, q: CauseQuestion, simulate: Simulator): Scored | null {
  if (candidate.sizes.some((s) => s.across)) return scoreAcross(candidate, q, simulate);
  const target = q.observedLog - q.logMean;
  const logR0 = Math.log(Math.max(q.engineRecovery, 1e-12));
  const scale = likelihoodScale(q);
  const points: { effect: number; x: number; sd: number; logWeight: number; words: string }[] = [];
  let totalWeight = -Infinity;
  for (const size of candidate.sizes) {
    const effect = size.effect ?? effectOf(size.input, simulate, size.baseline ? baselineOf(size.baseline, simulate) : logR0);
    if (effect === null) continue;
    totalWeight = logSum([totalWeight, Math.log(size.weight)]);
    points.push({ effect, ...scale.at(effect), logWeight: Math.log(size.weight) + Math.log(size.evidence ?? 1), words: size.words });
  }
  if (points.length === 0) return null;
  const terms = points.map((p) => p.logWeight - totalWeight + logNormalDensity(scale.target, p.x, p.sd));
  // Evidence: the size prior spread evenly between neighbouring sizes, the effect linear in between, so that a
  // steep effect curve is not missed between two grid points (the normal density integrated over each segment).
  const segments = points.slice(1).map((b, i) => {
    const a = points[i]!;
    const mass = (Math.exp(a.logWeight - totalWeight) + Math.exp(b.logWeight - totalWeight)) / 2;
    const width = Math.abs(b.x - a.x);
    const sd = (a.sd + b.sd) / 2;
    const density = width < 1e-3 * sd
      ? Math.exp(logNormalDensity(scale.target, a.x, sd))
      : (Math.abs(normalCdf((b.x - scale.target) / sd) - normalCdf((a.x - scale.target) / sd)) / width) * Math.sqrt(2 * Math.PI);
    return Math.log(mass * density + 1e-300);
  });
  let bestIndex = 0;
  terms.forEach((t, i) => { if (t > (terms[bestIndex] as number)) bestIndex = i; });
  let best = points[bestIndex]!;
  // Between two sizes that bracket the reported value, the most plausible size is the one that matches it.
  const refine = candidate.refine;
  if (refine) {
    const bracket = points.findIndex((p, i) => i > 0 && (points[i - 1]!.effect - target) * (p.effect - target) <= 0);
    if (bracket > 0) {
      const a = points[bracket - 1]!;
      const b = points[bracket]!;
      const t = a.effect === b.effect ? 0.5 : (target - a.effect) / (b.effect - a.effect);
      const refined = refine(t, bracket - 1);
      const effect = refined.effect ?? effectOf(refined.input, simulate, logR0);
      if (effect !== null && Math.abs(effect - target) < Math.abs(best.effect - target)) best = { ...best, effect, logWeight: 0, words: refined.words };
    }
  }
  return { candidate, logEvidence: segments.length > 0 ? logSum(segments) : logSum(terms), best: { effect: best.effect, words: best.words } };
}

function baselineOf(input: WorkupInput, simulate: Simulator): number | null {
  const r = simulate(input);
  return r === null ? null : Math.log(Math.max(r, 1e-6));
}

function effectOf(input: WorkupInput | undefined, simulate: Simulator, logR0: number | null): number | null {
  if (!input || logR0 === null) return null;
  const r = simulate(input);
  return r === null ? null : Math.log(Math.max(r, 1e-6)) - logR0;
}

function emulsionNoted(operations: readonly Operation[]): boolean {
  return operations.some((op) => op.observed?.interface === "emulsion" || op.observed?.interface === "rag");
}

/** Ranks the candidate causes of a reported value below the predictive median; empty otherwise. */
export function rankCauses(q: CauseQuestion, simulate: Simulator): LikelyCause[] {
  if (!(q.observedLog < q.logMean)) return [];
  const candidates = causeSpace(q.input, q.productKey, q.crudeAssayed);
  const noted = emulsionNoted(q.input.operations);
  const frequencies = { ...CAUSE_PRIOR, ...q.frequencies };
  const scored = candidates.map((c) => score(c, q, simulate)).filter((s): s is Scored => s !== null);
  const logPosts = scored.map((s) => {
    const seen = s.candidate.code === "emulsion_loss"
      ? (noted ? EMULSION_NOTED.ifEmulsion : 1 - EMULSION_NOTED.ifEmulsion)
      : (noted ? EMULSION_NOTED.otherwise : 1 - EMULSION_NOTED.otherwise);
    const open = s.candidate.code === "product_logp_lower" ? Math.min(1, Math.max(1e-3, q.parameterOpen ?? 1)) : 1;
    return Math.log(frequencies[s.candidate.code] * s.candidate.share * open) + Math.log(seen) + s.logEvidence;
  });
  const total = logSum(logPosts);
  const median = Math.exp(q.logMean - q.crudeLog);
  const reported = Math.exp(q.observedLog - q.crudeLog);
  const gap = median - reported;
  const causes: LikelyCause[] = scored.map((s, i) => {
    const recovery = median * Math.exp(s.best.effect);
    return {
      code: s.candidate.code, title: s.candidate.title, change: s.best.words,
      ...(s.candidate.step !== undefined ? { step: s.candidate.step } : {}),
      recovery, fractionOfGap: gapShare(median, reported, recovery), score: Math.exp((logPosts[i] as number) - total),
      simulated: s.candidate.simulated,
    };
  });
  // One entry per kind of cause (e.g. the most plausible layer), then the plausible ones that close part of the gap.
  const best = new Map<CauseCode, LikelyCause>();
  const summed = new Map<CauseCode, number>();
  for (const c of causes) {
    const kept = best.get(c.code);
    if (!kept || c.score > kept.score) best.set(c.code, c);
    summed.set(c.code, (summed.get(c.code) ?? 0) + c.score);
  }
  return [...best.values()]
    .map((c) => ({ ...c, score: summed.get(c.code) ?? c.score }))
    .filter((c) => c.score >= MIN_PLAUSIBILITY && c.fractionOfGap >= MIN_SHARE && gap > 0)
    .sort((a, b) => b.score - a.score);
}

/** (predicted − with the change) / (predicted − reported), clamped to 0–1: the one figure every view shows. */
export function gapShare(predicted: number, reported: number, withChange: number): number {
  const gap = predicted - reported;
  if (!(gap > 1e-9)) return 0;
  return Math.min(1, Math.max(0, (predicted - withChange) / gap));
}

/** The words every view uses for a cause's share of the gap. */
export function gapShareWords(fractionOfGap: number): string {
  return `explains ${Math.round(Math.min(1, Math.max(0, fractionOfGap)) * 100)} % of the gap`;
}
