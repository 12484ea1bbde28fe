/**
 * Propagates input uncertainty (log P, log K, pKa, volumes, amounts, set pH) to an interval for every
 * component's recovery and purity by seeded Monte Carlo over the simulator (propagation of distributions, JCGM 101:2008).
 * The same seed gives the same draws, so a stored interval can be reproduced; deviation flags compare an
 * observed recovery with the interval (§2.11 step 5).
 */
import { compileWorkup, engineOptionsOf } from "./compiled";
import { percentiles } from "./percentiles";
import { DEFAULT_UNCERTAINTY, planPerturbation, type UncertainInput, type UncertaintyDefaults } from "./perturb";
import { createRng } from "./random";
import { SOLVENTS } from "./data/solvents";
import { partitionModelSe } from "./partition";
import type { WorkupInput } from "./schema";
import type { WorkupPrediction } from "./types";

export type { UncertainInput, UncertaintyDefaults } from "./perturb";
export { DEFAULT_UNCERTAINTY } from "./perturb";

/** The engine's fast path (simulateWorkup); called with steps and flags off, since only recoveries are read. */
export type WorkupSimulator = (input: WorkupInput, options?: { steps?: boolean; flags?: boolean }) => WorkupPrediction;

export interface UncertaintyOptions {
  /** Number of Monte Carlo draws. Default 1000. */
  draws?: number;
  /** Seed of the random stream. Default 1. */
  seed?: number;
  /** Standard uncertainties used when a value states no se of its own. */
  defaults?: Partial<UncertaintyDefaults>;
  /**
   * Extra standard deviation (log units) for translating an octanol–water log P to the extraction solvent;
   * applied to components without a solvent-specific log K. Default: the largest standard error of the
   * Collander line (data/solvents.ts `partition.se`) among the water-immiscible solvents the work-up uses.
   */
  solventTranslationSd?: number;
}

/** Summary of one output over the draws. */
export interface Interval {
  p025: number;
  p50: number;
  p975: number;
  mean: number;
  sd: number;
}

export interface ComponentUncertainty {
  /** Fraction 0–1 of the starting amount in the isolated fraction. */
  recovery: Interval;
  purityPct: Interval;
  /** Inputs that explain most of the spread in recovery: squared correlation with it, largest first (at most 3). */
  mainSources: Array<{ path: string; share: number }>;
}

export interface WorkupUncertainty {
  draws: number;
  seed: number;
  /** Draws the simulator refused (counted, left out of the intervals). */
  failedDraws: number;
  components: Record<string, ComponentUncertainty>;
  crudeMassMg: Interval;
  inputs: UncertainInput[];
}

const FAST = { steps: false, flags: false } as const;

const INTERVAL_PERCENTILES = [0.025, 0.5, 0.975] as const;

/** Mean, sd and percentiles of the first `count` values, which the percentile selection reorders. */
function summarize(values: Float64Array, count: number): Interval {
  const work = count === values.length ? values : values.subarray(0, count);
  let sum = 0;
  for (let i = 0; i < count; i++) sum += work[i] as number;
  const mean = sum / count;
  let ss = 0;
  for (let i = 0; i < count; i++) ss += ((work[i] as number) - mean) ** 2;
  const [p025, p50, p975] = percentiles(work, INTERVAL_PERCENTILES) as [number, number, number];
  return { p025, p50, p975, mean, sd: count > 1 ? Math.sqrt(ss / (count - 1)) : 0 };
}

interface Centred {
  values: Float64Array;
  mean: number;
  /** Sum of squared deviations from the mean. */
  ss: number;
}

function centred(values: Float64Array, count: number): Centred {
  let mean = 0;
  for (let i = 0; i < count; i++) mean += values[i] ?? 0;
  mean /= count;
  let ss = 0;
  for (let i = 0; i < count; i++) {
    const d = (values[i] ?? 0) - mean;
    ss += d * d;
  }
  return { values, mean, ss };
}

/** Squared correlation of two samples, each centred once rather than once per pair. */
function squaredCorrelation(x: Centred, y: Centred, count: number): number {
  if (!(x.ss > 0 && y.ss > 0)) return 0;
  let sxy = 0;
  for (let i = 0; i < count; i++) sxy += ((x.values[i] ?? 0) - x.mean) * ((y.values[i] ?? 0) - y.mean);
  return (sxy * sxy) / (x.ss * y.ss);
}

/** Largest Collander-line standard error among the solvents named in the work-up (0 if none has a line). */
export function solventTranslationSd(input: WorkupInput): number {
  const named = new Set<string>(input.mixture.solvents.map((s) => s.solvent));
  for (const op of input.operations) {
    if ("solvent" in op && typeof op.solvent === "string") named.add(op.solvent);
    if ("rinse" in op && op.rinse) named.add(op.rinse.solvent);
  }
  let sd = 0;
  for (const key of named) {
    const solvent = SOLVENTS[key];
    if (solvent && !solvent.waterMiscible) sd = Math.max(sd, partitionModelSe(solvent));
  }
  return sd;
}

/** Monte Carlo over `simulate` (the engine's fast path; the input must already be parsed). */
export function propagateUncertainty(input: WorkupInput, simulate: WorkupSimulator, options: UncertaintyOptions = {}): WorkupUncertainty {
  const draws = options.draws ?? 1000;
  const seed = options.seed ?? 1;
  if (!Number.isInteger(draws) || draws < 2 || draws > 1_000_000) throw new RangeError(`draws must be a whole number from 2 to 1000000, got ${draws}`);
  const defaults = { ...DEFAULT_UNCERTAINTY, ...options.defaults };
  const plan = planPerturbation(input, defaults, options.solventTranslationSd ?? solventTranslationSd(input));
  const rng = createRng(seed);
  const keys = input.components.map((c) => c.key);
  const recovery = keys.map(() => new Float64Array(draws));
  const purity = keys.map(() => new Float64Array(draws));
  const crude = new Float64Array(draws);
  const zBySite = plan.sites.map(() => new Float64Array(draws));
  const z = new Float64Array(plan.sites.length);

  // The engine's own simulator runs compiled: each draw rewrites the numbers in place (same values as plan.draw).
  const engine = engineOptionsOf(simulate);
  const compiled = engine ? compileWorkup(input, engine, { rememberPh: true }) : null;
  const drawInto = compiled ? plan.parameterDrawer(compiled.nominal, compiled.params) : null;
  // One run on the input's own numbers: every draw's pH searches start from its contacts' pH.
  try {
    compiled?.run();
  } catch {
    // A failing nominal run leaves the memory empty; the draws fill it and report their own failures.
  }
  let ok = 0;
  let failed = 0;
  for (let d = 0; d < draws; d++) {
    rng.normals(z);
    if (compiled && drawInto) {
      try {
        drawInto(z);
        compiled.run();
      } catch {
        failed++;
        continue;
      }
      for (let i = 0; i < keys.length; i++) {
        (recovery[i] as Float64Array)[ok] = compiled.recovery[i] as number;
        (purity[i] as Float64Array)[ok] = compiled.purityPct[i] as number;
      }
      crude[ok] = compiled.crudeMassMg;
    } else {
      let result: WorkupPrediction;
      try {
        result = simulate(plan.draw(z), FAST);
      } catch {
        failed++;
        continue;
      }
      keys.forEach((key, i) => {
        (recovery[i] as Float64Array)[ok] = result.recovery[key] ?? 0;
        (purity[i] as Float64Array)[ok] = result.purityPct[key] ?? 0;
      });
      crude[ok] = result.crudeMassMg;
    }
    for (let s = 0; s < z.length; s++) (zBySite[s] as Float64Array)[ok] = z[s] ?? 0;
    ok++;
  }
  if (ok < 2) throw new Error(`the simulator refused ${failed} of ${draws} perturbed inputs`);

  const components: Record<string, ComponentUncertainty> = {};
  const sites = zBySite.map((zs) => centred(zs, ok));
  keys.forEach((key, i) => {
    const r = recovery[i] as Float64Array;
    const recoveryCentred = centred(r, ok);
    const shares = plan.sites
      .map((site, s) => ({ path: site.path, share: squaredCorrelation(sites[s] as Centred, recoveryCentred, ok) }))
      .filter((x) => x.share >= 0.05)
      .sort((a, b) => b.share - a.share)
      .slice(0, 3);
    // After the correlations, which read the draws in order.
    components[key] = { recovery: summarize(r, ok), purityPct: summarize(purity[i] as Float64Array, ok), mainSources: shares };
  });
  return { draws, seed, failedDraws: failed, components, crudeMassMg: summarize(crude, ok), inputs: plan.sites };
}

export interface RecoveryComparison {
  /** (observed − mean)/sd of the predicted recovery; null when the prediction has no spread. */
  z: number | null;
  /** Observed recovery outside the 95 % interval. */
  outside: boolean;
  direction: "below" | "within" | "above";
}

/** Where an observed recovery (fraction 0–1) falls against the predicted interval of one component. */
export function compareRecovery(uncertainty: WorkupUncertainty, key: string, observed: number): RecoveryComparison {
  const c = uncertainty.components[key];
  if (!c) throw new RangeError(`no component '${key}' in the uncertainty result`);
  const { p025, p975, mean, sd } = c.recovery;
  const direction = observed < p025 ? "below" : observed > p975 ? "above" : "within";
  return { z: sd > 0 ? (observed - mean) / sd : null, outside: direction !== "within", direction };
}
