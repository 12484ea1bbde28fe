/**
 * Predictive distribution of a reported recovery, and the judgement of an outcome against it. Pure math, no I/O.
 *
 * On the log scale the reported amount is the sum of independent terms:
 *   log(isolated / basis) = log(engine recovery)              the engine's prediction, with its Monte Carlo spread
 *                         − Σ handling losses                  per transfer, separation cut, drying, filtration, concentration
 *                         + assay bias                          by purity method (weight only reads high)
 *                         + log(crude product / expected)       only when the product in the crude was not assayed
 *                         + noise
 * Each loss, bias and the reaction-yield ratio has a group-level mean with a common-practice prior; the group's own
 * history updates those means by a Bayesian linear model (partial pooling: few outcomes barely move a mean, many
 * outcomes pull it to the group's own figure). Outcomes that look like real shortfalls are down-weighted by an EM
 * over a two-part mixture (ordinary scatter, or a shortfall of exponential size), so that failures do not teach
 * the model that failures are normal. An overall variance scale is learned with a conjugate prior.
 */
import { normalCdf, normalQuantile } from "./distributions";

export const HANDLING_STEPS = ["transfer", "separation", "drying", "filtration", "concentration"] as const;
export type HandlingStep = (typeof HANDLING_STEPS)[number];
export const ASSAY_METHODS = ["weight_only", "qnmr", "hplc", "gc"] as const;
export type AssayMethod = (typeof ASSAY_METHODS)[number];

/** A group-level mean with its common-practice prior; all in natural-log units (≈ fractions for small values). */
export interface TermPrior {
  /** Prior mean of the group's typical value. */
  mean: number;
  /** Scatter from one event (or one workup) to the next around the group's mean. */
  sd: number;
  /** How far a group's own mean may sit from the prior mean (the hierarchical level). */
  groupSd: number;
}

/**
 * Handling loss per event, beyond what the engine models (the engine already keeps the solution held up on a drying
 * agent or filter cake). Common practice: a careful bench workup loses a few percent in all, about half a percent
 * per separation cut (interface and funnel walls) or transfer with rinsing, about one percent on concentrating and
 * moving the residue to a tared vial; 3–8 % for a whole wash-dry-concentrate sequence.
 */
export const HANDLING_PRIOR: Record<HandlingStep, TermPrior> = {
  transfer: { mean: 0.005, sd: 0.004, groupSd: 0.005 },
  separation: { mean: 0.005, sd: 0.005, groupSd: 0.005 },
  drying: { mean: 0.005, sd: 0.005, groupSd: 0.005 },
  filtration: { mean: 0.005, sd: 0.005, groupSd: 0.005 },
  concentration: { mean: 0.01, sd: 0.01, groupSd: 0.01 },
};

/**
 * Assay error by purity method (common practice): qNMR against an internal standard is good to 1–2 % relative;
 * HPLC or GC area % without response factors to 2–3 %; a weight alone counts residual solvent and impurities as
 * product, so it reads a few percent high with a similar scatter.
 */
export const ASSAY_PRIOR: Record<AssayMethod, TermPrior> = {
  weight_only: { mean: 0.03, sd: 0.03, groupSd: 0.03 },
  qnmr: { mean: 0, sd: 0.015, groupSd: 0.005 },
  hplc: { mean: 0, sd: 0.025, groupSd: 0.01 },
  gc: { mean: 0, sd: 0.025, groupSd: 0.01 },
};

/**
 * Product in the crude relative to the expected amount when it was not assayed (common practice: a reaction run as
 * planned gives 90–100 % of what the chemist expected; log 0.95 ± 0.06). Assayed workups teach the group's figure.
 */
export const YIELD_PRIOR: TermPrior = { mean: Math.log(0.95), sd: 0.06, groupSd: 0.05 };
/** Scatter of an in-process assay of the crude (common practice, about 2 % relative). */
export const CRUDE_ASSAY_SD = 0.02;
/** Model error beyond the engine's parameter spread (from memory: a few percent for a calibrated partition model). */
export const MODEL_SD = 0.02;
/** Engine spread used when no Monte Carlo interval was stored (from memory, deliberately wide). */
export const FALLBACK_ENGINE_SD = 0.1;
/** Per-chemist offset prior: hands differ by about a percent in typical loss (common practice). */
export const CHEMIST_SD = 0.015;
/** Shortfalls: prior share of workups with a real shortfall (common practice, about one in ten) and its mean size. */
export const SHORTFALL_PRIOR = { share: 0.1, weight: 20, meanLogLoss: 0.3 };
/** Prior pseudo-observations of the variance scale (it starts at 1, the priors' own scatter). */
const SCALE_PRIOR_WEIGHT = 10;
/** A workup is "below" (and flagged for review) when P(real shortfall | outcome) reaches this. */
export const FLAG_PROBABILITY = 0.95;
/** Central predictive interval used for "as expected" / "above" and for the interval shown. */
export const INTERVAL_LEVEL = 0.95;
const LOG_FLOOR = Math.log(1e-4);

export interface PredictiveCase {
  /** The engine's recovery of the product (fraction of the product in the crude) and its Monte Carlo interval. */
  engine: { recovery: number; low: number | null; high: number | null };
  /** Handling events by kind (a wash of three portions is three separation cuts). */
  handling: Partial<Record<HandlingStep, number>>;
  assay: AssayMethod;
  /** True when the product in the crude was assayed: no reaction-yield term. */
  crudeAssayed: boolean;
  chemist?: string | null;
  /**
   * The same product worked up the same way (product identity + kinds of operation). The engine's parameter error
   * (log K, pKa, the solvent translation) is the same every time such a workup is run, so once the group has reported
   * a few, its own outcomes pin that error down: a family term with the engine's spread as its prior.
   */
  family?: string | null;
}

export interface HistoryCase extends PredictiveCase {
  /** log(isolated product / reference amount): the assayed crude, or the expected amount. */
  observedLog: number;
  /** log(assayed crude / expected) when both were recorded: a direct reading of the reaction yield. */
  yieldLog?: number | null;
}

export interface GroupModel {
  /** Posterior means of the parameters, by name. */
  means: Record<string, number>;
  /** Posterior covariance, in `names` order. */
  cov: number[][];
  names: string[];
  variance: number;
  shortfallShare: number;
  /** Outcomes the model learned from (weighted count of ordinary ones). */
  n: number;
  effectiveN: number;
  byChemist: boolean;
}

function engineLog(engine: PredictiveCase["engine"]): { mean: number; variance: number } {
  const mean = Math.max(LOG_FLOOR, Math.log(Math.max(engine.recovery, 1e-12)));
  if (engine.low === null || engine.high === null || !(engine.high > 0)) return { mean, variance: FALLBACK_ENGINE_SD ** 2 };
  const lo = Math.max(LOG_FLOOR, Math.log(Math.max(engine.low, 1e-12)));
  const hi = Math.max(LOG_FLOOR, Math.log(engine.high));
  const sd = (hi - lo) / (2 * normalQuantile(0.975));
  return { mean, variance: sd * sd };
}

const baseNames = (): string[] => [...HANDLING_STEPS.map((s) => `loss.${s}`), ...ASSAY_METHODS.map((m) => `assay.${m}`), "yield"];

function priorOf(name: string, familyVariance?: ReadonlyMap<string, number>): TermPrior {
  if (name.startsWith("family.")) return { mean: 0, sd: 0, groupSd: Math.sqrt(familyVariance?.get(name) ?? FALLBACK_ENGINE_SD ** 2) };
  if (name.startsWith("loss.")) return HANDLING_PRIOR[name.slice(5) as HandlingStep];
  if (name.startsWith("assay.")) return ASSAY_PRIOR[name.slice(6) as AssayMethod];
  if (name === "yield") return YIELD_PRIOR;
  return { mean: 0, sd: 0, groupSd: CHEMIST_SD };
}

/** Design row (coefficients on the parameters), fixed offset and the known per-workup variance. */
function rowOf(c: PredictiveCase, names: readonly string[]): { x: number[]; offset: number; variance: number; engineVariance: number } {
  const engine = engineLog(c.engine);
  const x = names.map(() => 0);
  const familyIndex = c.family ? names.indexOf(`family.${c.family}`) : -1;
  // With a family term the engine's spread is carried by that term (shared across the family), not by the row.
  let variance = (familyIndex >= 0 ? 0 : engine.variance) + MODEL_SD ** 2;
  if (familyIndex >= 0) x[familyIndex] = 1;
  for (const step of HANDLING_STEPS) {
    const n = c.handling[step] ?? 0;
    x[names.indexOf(`loss.${step}`)] = -n;
    variance += n * HANDLING_PRIOR[step].sd ** 2;
  }
  x[names.indexOf(`assay.${c.assay}`)] = 1;
  variance += ASSAY_PRIOR[c.assay].sd ** 2;
  if (!c.crudeAssayed) {
    x[names.indexOf("yield")] = 1;
    variance += YIELD_PRIOR.sd ** 2;
  }
  const chemistIndex = c.chemist ? names.indexOf(`chemist.${c.chemist}`) : -1;
  if (chemistIndex >= 0) x[chemistIndex] = 1;
  return { x, offset: engine.mean, variance, engineVariance: engine.variance };
}

/** Density of ordinary scatter N(0, s²) and of a shortfall (exponential loss of mean λ blurred by the same scatter). */
export function shortfallProbability(gap: number, sd: number, share: number, meanLoss = SHORTFALL_PRIOR.meanLogLoss): number {
  const clean = Math.exp(-0.5 * (gap / sd) ** 2) / (sd * Math.sqrt(2 * Math.PI));
  const lambda = meanLoss;
  const fail = (1 / lambda) * Math.exp((sd * sd) / (2 * lambda * lambda) - gap / lambda) * normalCdf(gap / sd - sd / lambda);
  const a = share * fail;
  const b = (1 - share) * clean;
  return a + b > 0 ? a / (a + b) : gap > 0 ? 1 : 0;
}

function solve(a: number[][], b: number[]): { x: number[]; inverse: number[][] } {
  const n = b.length;
  const m = a.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)), b[i] as number]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r]![col]!) > Math.abs(m[pivot]![col]!)) pivot = r;
    [m[col], m[pivot]] = [m[pivot]!, m[col]!];
    const p = m[col]![col]!;
    for (let k = 0; k < 2 * n + 1; k++) m[col]![k]! /= p;
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const f = m[r]![col]!;
      if (f !== 0) for (let k = 0; k < 2 * n + 1; k++) m[r]![k]! -= f * m[col]![k]!;
    }
  }
  return { x: m.map((row) => row[2 * n]!), inverse: m.map((row) => row.slice(n, 2 * n)) };
}

/** The group's model: common-practice priors updated by its history. An empty history gives the priors. */
export function fitGroupModel(history: readonly HistoryCase[], options: { byChemist?: boolean } = {}): GroupModel {
  const chemists = options.byChemist ? [...new Set(history.map((h) => h.chemist).filter((c): c is string => !!c))].sort() : [];
  const families = [...new Set(history.map((h) => h.family).filter((f): f is string => !!f))].sort();
  const names = [...baseNames(), ...chemists.map((c) => `chemist.${c}`), ...families.map((f) => `family.${f}`)];
  const rows = history.map((h) => ({ ...rowOf(h, names), y: h.observedLog }));
  const familyVariance = new Map<string, number>();
  for (const f of families) {
    const members = history.filter((h) => h.family === f).map((h) => engineLog(h.engine).variance);
    familyVariance.set(`family.${f}`, members.reduce((s, v) => s + v, 0) / members.length);
  }
  const prior = (n: string) => priorOf(n, familyVariance);
  const yieldRows = history.filter((h) => h.yieldLog !== null && h.yieldLog !== undefined && Number.isFinite(h.yieldLog));
  let weights = rows.map(() => 1);
  let variance = 1;
  let share = SHORTFALL_PRIOR.share;
  let fit = { x: names.map((n) => prior(n).mean), inverse: names.map((n, i) => names.map((_, j) => (i === j ? prior(n).groupSd ** 2 : 0))) };
  for (let iteration = 0; iteration < 4 && rows.length + yieldRows.length > 0; iteration++) {
    const a = names.map((n, i) => names.map((_, j) => (i === j ? 1 / prior(n).groupSd ** 2 : 0)));
    const b = names.map((n) => prior(n).mean / prior(n).groupSd ** 2);
    const add = (x: readonly number[], target: number, precision: number) => {
      for (let i = 0; i < names.length; i++) {
        const xi = x[i] as number;
        if (xi === 0) continue;
        b[i]! += xi * target * precision;
        for (let j = 0; j < names.length; j++) a[i]![j]! += xi * (x[j] as number) * precision;
      }
    };
    rows.forEach((r, i) => add(r.x, r.y - r.offset, (weights[i] as number) / (variance * r.variance)));
    const yieldIndex = names.indexOf("yield");
    for (const h of yieldRows) {
      const x = names.map((_, i) => (i === yieldIndex ? 1 : 0));
      add(x, h.yieldLog as number, 1 / (YIELD_PRIOR.sd ** 2 + CRUDE_ASSAY_SD ** 2));
    }
    fit = solve(a, b);
    // E step: how likely each outcome is an ordinary one; M step: variance scale and shortfall share.
    let sumZ2 = 0;
    let sumW = 0;
    weights = rows.map((r) => {
      const mean = r.offset + dot(r.x, fit.x);
      const sd = Math.sqrt(variance * r.variance + quad(r.x, fit.inverse));
      const p = shortfallProbability(mean - r.y, sd, share);
      const w = 1 - p;
      sumZ2 += (w * (r.y - mean) ** 2) / r.variance;
      sumW += w;
      return w;
    });
    variance = (SCALE_PRIOR_WEIGHT + sumZ2) / (SCALE_PRIOR_WEIGHT + sumW);
    share = (SHORTFALL_PRIOR.share * SHORTFALL_PRIOR.weight + (rows.length - sumW)) / (SHORTFALL_PRIOR.weight + rows.length);
  }
  return {
    names, cov: fit.inverse, variance, shortfallShare: share, n: rows.length, byChemist: chemists.length > 0,
    effectiveN: weights.reduce((s, w) => s + w, 0),
    means: Object.fromEntries(names.map((n, i) => [n, fit.x[i] as number])),
  };
}

const dot = (x: readonly number[], y: readonly number[]) => x.reduce((s, v, i) => s + v * (y[i] as number), 0);
const quad = (x: readonly number[], m: readonly (readonly number[])[]) => x.reduce((s, xi, i) => (xi === 0 ? s : s + xi * dot(x, m[i] as number[])), 0);

export interface Predictive {
  /** Mean and sd of log(isolated / reference amount), reference = assayed crude or expected amount. */
  logMean: number;
  logSd: number;
  /** log(product in the crude / reference amount) the model expects: 0 when assayed, the yield term otherwise. */
  crudeLog: number;
}

export function predictiveOf(model: GroupModel, c: PredictiveCase): Predictive {
  const { x, offset, variance } = rowOf(model.byChemist ? c : { ...c, chemist: null }, model.names);
  const yieldIndex = model.names.indexOf("yield");
  return {
    logMean: offset + dot(x, model.names.map((n) => model.means[n] as number)),
    logSd: Math.sqrt(model.variance * variance + quad(x, model.cov)),
    crudeLog: c.crudeAssayed ? 0 : (model.means[model.names[yieldIndex] as string] as number),
  };
}

/**
 * How much of the engine's parameter error for this case's family is still open: the family term's posterior sd over
 * the engine's own spread (1 when the group has no outcome of the family yet, towards 0 as its outcomes pin it down).
 */
export function parameterErrorOpen(model: GroupModel, c: PredictiveCase): number {
  const i = c.family ? model.names.indexOf(`family.${c.family}`) : -1;
  const prior = Math.sqrt(engineLog(c.engine).variance);
  if (i < 0 || !(prior > 0)) return 1;
  return Math.min(1, Math.sqrt(Math.max(0, model.cov[i]?.[i] ?? 0)) / prior);
}

export type OutcomeStatusCode = "as_expected" | "below" | "above" | "inconclusive";

export interface Judgement {
  status: OutcomeStatusCode;
  /** Predictive CDF at the reported value (0.5 = exactly the median). */
  quantile: number;
  /** Posterior probability of a real shortfall. */
  shortfallProbability: number;
}

/**
 * "below": a real shortfall with posterior probability ≥ FLAG_PROBABILITY; "inconclusive": under the 95 % interval
 * but not that sure; "above": over the interval; otherwise "as_expected".
 */
export function judgeOutcome(model: GroupModel, predictive: Predictive, observedLog: number): Judgement {
  const z = (observedLog - predictive.logMean) / predictive.logSd;
  const quantile = normalCdf(z);
  const p = shortfallProbability(predictive.logMean - observedLog, predictive.logSd, model.shortfallShare);
  const tail = (1 - INTERVAL_LEVEL) / 2;
  const status: OutcomeStatusCode = p >= FLAG_PROBABILITY ? "below" : quantile < tail ? "inconclusive" : quantile > 1 - tail ? "above" : "as_expected";
  return { status, quantile, shortfallProbability: p };
}

/** Central interval at `level` of the recovery relative to the product in the crude (fractions). */
export function recoveryInterval(predictive: Predictive, level = INTERVAL_LEVEL): { median: number; low: number; high: number } {
  const z = normalQuantile(0.5 + level / 2);
  const centre = predictive.logMean - predictive.crudeLog;
  return { median: Math.exp(centre), low: Math.exp(centre - z * predictive.logSd), high: Math.exp(centre + z * predictive.logSd) };
}

/** Whether the reported value fell inside the central interval at each level (calibration). */
export function insideAt(quantile: number, level: number): boolean {
  return Math.abs(quantile - 0.5) <= level / 2;
}
