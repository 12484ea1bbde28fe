/**
 * The server's prediction of a workup: the engine's point prediction plus a Monte Carlo interval for every
 * component, seeded from the workup id so that re-running the same version reproduces the stored interval.
 */
import { simulateWorkup, validateWorkup, type PredictOptions } from "@/lib/chem/predict";
import { type WorkupInput } from "@/lib/chem/schema";
import { type Flag, type WorkupPrediction } from "@/lib/chem/types";
import { engineSimulator } from "@/lib/chem/compiled";
import { propagateUncertainty, type Interval } from "@/lib/chem/uncertainty";
import { ENGINE_VERSION } from "@/lib/chem/version";
import { ValidationError, type FieldErrors } from "@/lib/errors";
import { resolveLibrary, type LibraryOverrides } from "@/lib/chem/library";
import { applyGroupValues, partitionSources, type GroupValues, type PartitionSource } from "@/lib/partition/overlay";

/**
 * 300 draws: the 2.5 % tail then holds about 7 draws, enough for a stable interval edge at the scale a deviation
 * flag needs (binomial error of the tail count sqrt(0.025·0.975/300) ≈ 0.9 % of the draws), and a save costs
 * 0.3–0.6 s of engine time on the example workups. Bulk imports use fewer (IMPORT_DRAWS) to stay interactive.
 */
export const SAVE_DRAWS = 300;
export const IMPORT_DRAWS = 200;

export interface ComponentInterval {
  recovery: Interval;
  purityPct: Interval;
  mainSources: { path: string; share: number }[];
}

/** What is stored in Prediction.result: the engine output plus its interval. Plain JSON. */
export interface StoredPredictionResult {
  prediction: WorkupPrediction;
  uncertainty: { draws: number; seed: number; failedDraws: number; components: Record<string, ComponentInterval> } | null;
  /** Where each component's log K in each organic solvent came from ("group data, n = 4, ±0.12", "estimated from structure"). */
  partition?: PartitionSource[];
}

export interface ComputedPrediction {
  engineVersion: string;
  result: StoredPredictionResult;
  productKey: string | null;
  /** Fractions 0–1 of the product's starting amount. */
  productRecovery: number | null;
  recoveryLow: number | null;
  recoveryHigh: number | null;
  parsed: WorkupInput;
}

/** FNV-1a 32-bit hash of the id, mapped to 1 … 2³¹−1 (the range the engine's seeded generator accepts). */
export function seedFromId(id: string): number {
  let hash = 0x811c9dc5;
  for (let i = 0; i < id.length; i++) {
    hash ^= id.charCodeAt(i);
    hash = Math.imul(hash, 0x01000193) >>> 0;
  }
  return (hash % 0x7ffffffe) + 1;
}

/**
 * Validates a raw spec against the schema and the group's library; problems become 422 field errors under `spec.`.
 * `stored`: the spec is one the app saved earlier, read tolerantly (validateWorkup's `stored`); input from a
 * person or a client is always read strictly.
 */
export function parseSpec(spec: unknown, library: LibraryOverrides, prefix = "spec", stored = false): WorkupInput {
  const checked = validateWorkup(spec, { ...library, stored });
  if (checked.success) return checked.data;
  const fields: FieldErrors = {};
  for (const issue of checked.issues) (fields[issue.path ? `${prefix}.${issue.path}` : prefix] ??= []).push(issue.message);
  throw new ValidationError(fields);
}

export interface PredictionOptions {
  library: LibraryOverrides;
  seed: number;
  draws?: number;
  /** The group's pooled partition values and registry properties of linked compounds (lib/partition groupValuesForLinks). */
  groupValues?: GroupValues;
  /** Flags found outside the engine (site-flags.ts: N–H/O–H groups no site class recognised), shown with the engine's. */
  extraFlags?: Flag[];
  /** The spec was stored by the app (a saved version re-predicted): read tolerantly, see parseSpec. */
  stored?: boolean;
}

/** Point prediction (with steps, flags and cautions) and, when draws > 0, the Monte Carlo interval. */
export function computePrediction(spec: unknown, options: PredictionOptions): ComputedPrediction {
  const parsed = applyGroupValues(parseSpec(spec, options.library, "spec", options.stored ?? false), options.groupValues);
  const engine: PredictOptions = { ...options.library };
  const simulated = simulateWorkup(parsed, engine);
  const prediction = options.extraFlags?.length ? { ...simulated, flags: [...simulated.flags, ...options.extraFlags] } : simulated;
  const draws = options.draws ?? SAVE_DRAWS;
  const uncertainty = draws > 0 ? intervalOf(parsed, engine, draws, options.seed) : null;
  const productKey = prediction.productKey;
  const productRecovery = productKey !== null ? (prediction.recovery[productKey] ?? null) : null;
  const band = productKey !== null ? uncertainty?.components[productKey]?.recovery : undefined;
  return {
    engineVersion: ENGINE_VERSION,
    result: { prediction, uncertainty, partition: partitionSources(parsed, resolveLibrary(options.library).solvents) },
    productKey,
    productRecovery,
    recoveryLow: band ? band.p025 : null,
    recoveryHigh: band ? band.p975 : null,
    parsed,
  };
}

function intervalOf(parsed: WorkupInput, engine: PredictOptions, draws: number, seed: number): StoredPredictionResult["uncertainty"] {
  // engineSimulator lets the uncertainty run on a compiled workup (numbers rewritten in place per draw).
  const u = propagateUncertainty(parsed, engineSimulator(engine), { draws, seed });
  return { draws: u.draws, seed: u.seed, failedDraws: u.failedDraws, components: u.components };
}
