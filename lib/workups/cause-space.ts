/**
 * The candidate causes of a shortfall and the prior over each one's size (common practice: small slips are more
 * frequent than large ones). A size either carries the changed workup to re-run, or its effect on log recovery in
 * closed form (a loss taken off the product, a reaction that gave less). Pure.
 */
import { type Operation, type WorkupInput } from "@/lib/chem/schema";
import { solventTranslationSd } from "@/lib/chem/uncertainty";
import { type CauseCode } from "./causes";

export interface CauseSize {
  /** Prior weight of this size (normalised per cause). */
  weight: number;
  /**
   * Likelihood ratio of what else the record holds (a pH reading) under this size against the workup as recorded;
   * 1 when the record says nothing. Not normalised: it is evidence, not prior.
   */
  evidence?: number;
  words: string;
  input?: WorkupInput;
  /** The workup as recorded, re-run with the same parameter shift as `input` (default: the recorded workup). */
  baseline?: WorkupInput;
  /** Closed-form change of log recovery; otherwise the input is re-run. */
  effect?: number;
  /**
   * The same change re-run with the product's partition shifted by z standard deviations (see acrossPartition): the
   * evidence then averages over the partition as well as over the size.
   */
  across?: PartitionNode[];
}

/** The change at the product's log P shifted by z σ, against the recorded workup at the same shift. */
export interface PartitionNode {
  z: number;
  input: WorkupInput;
  baseline: WorkupInput;
}

export interface CauseCandidate {
  code: CauseCode;
  title: string;
  step?: number;
  /** Share of the cause's prior frequency this variant carries (several layers could have been swapped). */
  share: number;
  simulated: boolean;
  /** Ascending in size. */
  sizes: CauseSize[];
  /** A size between sizes[i] and sizes[i + 1], at fraction t of the way. */
  refine?: (t: number, i: number) => { input?: WorkupInput; effect?: number; words: string };
}

const SEPARATIONS = new Set(["wash", "extract", "back_extract", "separate"]);
const pct = (f: number) => `${Math.round(f * 100)} %`;
const range = (from: number, to: number, step: number) => Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);
const lerp = (xs: readonly number[], i: number, t: number) => (xs[i] as number) + t * ((xs[i + 1] as number) - (xs[i] as number));

function reactionShortfall(): CauseCandidate {
  // Fraction of the estimated crude product the reaction really gave: anything from a fifth to nearly all of it.
  const ts = range(0.95, 0.15, -0.05);
  const at = (t: number) => ({ effect: Math.log(t), words: `the reaction gave about ${pct(t)} of the product the estimate of the crude assumed` });
  return {
    code: "reaction_shortfall", title: "The reaction gave less product than expected", share: 1, simulated: false,
    sizes: ts.map((t) => ({ weight: 1, ...at(t) })), refine: (t, i) => at(lerp(ts, i, t)),
  };
}

function emulsionLoss(input: WorkupInput): CauseCandidate | null {
  if (!input.operations.some((op) => SEPARATIONS.has(op.type))) return null;
  // Share of the product lost with an emulsion, a rag or a bad cut: mostly small, rarely most of it.
  const fs = range(0.03, 0.83, 0.04);
  const at = (f: number) => ({ effect: Math.log(1 - f), words: `about ${pct(f)} of the product lost with an emulsion, a rag layer or a difficult cut` });
  return {
    code: "emulsion_loss", title: "Emulsion or hold-up loss at a separation", share: 1, simulated: false,
    sizes: fs.map((f) => ({ weight: Math.exp(-f / 0.2), ...at(f) })), refine: (t, i) => at(lerp(fs, i, t)),
  };
}

function withOperations(input: WorkupInput, operations: Operation[]): WorkupInput {
  return { ...input, operations };
}

/** The product's log P and log K values shifted by d (a more or less polar product than assumed). */
function shiftProduct(input: WorkupInput, productIndex: number, d: number): WorkupInput {
  return {
    ...input,
    components: input.components.map((c, k) => (k !== productIndex ? c : {
      ...c,
      logK: Object.fromEntries(Object.entries(c.logK).map(([s, v]) => [s, { ...v, value: v.value + d }])),
      ...(c.logP ? { logP: { ...c.logP, value: c.logP.value + d } } : {}),
    })),
  };
}

/**
 * A procedural slip's effect depends on how well the product partitions, which the engine knows only to its stated
 * spread: the slip is re-run at the product's log P and at ±√3 σ around it, each against the recorded workup at the
 * same log P; the scoring interpolates the effect between these nodes and averages over a normal spread of the
 * partition (lib/workups/causes.ts). σ: the stated se of log P combined with the Collander translation error to the
 * extraction solvent, as in the engine's Monte Carlo.
 */
function acrossPartition(input: WorkupInput, productIndex: number, size: CauseSize & { input: WorkupInput }): CauseSize {
  const product = input.components[productIndex];
  const sigma = Math.hypot(product?.logP?.se ?? 0.3, solventTranslationSd(input));
  return {
    ...size,
    across: [-1, 0, 1].map((k) => {
      const z = k * Math.sqrt(3);
      return k === 0
        ? { z, input: size.input, baseline: input }
        : { z, input: shiftProduct(size.input, productIndex, z * sigma), baseline: shiftProduct(input, productIndex, z * sigma) };
    }),
  };
}

/** Reading error of pH paper or a quick meter check of a funnel layer (common practice: about half a unit). */
export const PH_READING_SD = 0.5;

/**
 * Likelihood ratio of the pH readings recorded at the adjusted steps if the pH was really off by d, against the pH
 * being as targeted (which every other cause assumes): a reading near the target speaks against a wrong pH, one far
 * from it for a wrong pH of about that size.
 */
function readingRatio(readings: readonly { target: number; read: number }[], d: number): number {
  return readings.reduce((r, { target, read }) => r * Math.exp((((read - target) ** 2) - (read - target - d) ** 2) / (2 * PH_READING_SD ** 2)), 1);
}

/**
 * Prior over the size of a pH error, in units (common practice): most slips are a short addition of acid or base or
 * a layer not mixed before reading (off by about a unit); the other kind is a reagent of the wrong strength or too
 * little of it to neutralize what the mixture holds (bicarbonate where hydroxide was needed leaves pH ≈ 8 against
 * 12–14; acid that only neutralizes leaves the carboxylate in the water), which is off by 3–5 units. Modelled as an
 * exponential (scale 1 unit) plus, with 40 % of its weight, a normal around 3.5 ± 1 units.
 */
export function wrongPhPrior(d: number): number {
  const a = Math.abs(d);
  return Math.exp(-a) + 0.4 * Math.exp(-0.5 * (a - 3.5) ** 2);
}

function wrongPh(input: WorkupInput, productIndex: number): CauseCandidate | null {
  const deltas = [...range(-6, -0.5, 0.5), ...range(0.5, 6, 0.5)];
  const prior = wrongPhPrior;
  const adjusted = input.operations.map((op, i) => ({ op, i })).filter(({ op }) => op.type === "adjust_ph" && op.targetPh !== undefined);
  const readings = adjusted.flatMap(({ op }) => (op.type === "adjust_ph" && op.targetPh !== undefined && op.observed?.pH !== undefined ? [{ target: op.targetPh, read: op.observed.pH }] : []));
  if (adjusted.length > 0) {
    const steps = adjusted.map((a) => a.i + 1).join(", ");
    const at = (d: number) => ({
      input: withOperations(input, input.operations.map((op) =>
        op.type === "adjust_ph" && op.targetPh !== undefined ? { ...op, targetPh: Math.min(14, Math.max(0, op.targetPh + d)) } : op)),
      words: `pH at step ${steps} about ${Math.abs(d).toFixed(1)} units ${d > 0 ? "higher" : "lower"} than recorded`,
    });
    return {
      code: "wrong_ph", title: "Aqueous pH off target", step: (adjusted[0]?.i ?? 0) + 1, share: 1, simulated: true,
      sizes: deltas.map((d) => ({ weight: prior(d), evidence: readingRatio(readings, d), ...at(d) })), refine: (t, i) => at(lerp(deltas, i, t)),
    };
  }
  const product = input.components[productIndex];
  if (!product || product.pKas.length === 0) return null;
  // Without a set pH the washes' pH is fixed by the reagent; a product more ionized there than assumed looks the same
  // as a wash at the wrong pH: shift its pKa values.
  const at = (d: number) => ({
    input: { ...input, components: input.components.map((c, k) => (k === productIndex ? { ...c, pKas: c.pKas.map((p) => ({ ...p, value: p.value + d })) } : c)) },
    words: `washes about ${Math.abs(d).toFixed(1)} pH units off from what ${product.name}'s pKa allows (pKa ${product.pKas.map((p) => p.value.toFixed(1)).join(", ")} → ${product.pKas.map((p) => (p.value + d).toFixed(1)).join(", ")})`,
  });
  return {
    code: "wrong_ph", title: "Product ionized at the wash pH (wrong reagent or pH)", share: 1, simulated: true,
    sizes: deltas.map((d) => ({ weight: prior(d), ...at(d) })), refine: (t, i) => at(lerp(deltas, i, t)),
  };
}

function polarProduct(input: WorkupInput, productIndex: number): CauseCandidate | null {
  const product = input.components[productIndex];
  if (!product || (!product.logP && Object.keys(product.logK).length === 0)) return null;
  const shifts = [0.25, 0.5, 0.75, 1, 1.5, 2, 2.5, 3];
  const at = (d: number) => ({
    input: {
      ...input,
      components: input.components.map((c, k) => (k !== productIndex ? c : {
        ...c,
        logK: Object.fromEntries(Object.entries(c.logK).map(([s, v]) => [s, { ...v, value: v.value - d }])),
        ...(c.logP ? { logP: { ...c.logP, value: c.logP.value - d } } : {}),
      })),
    },
    words: `log P of ${product.name} about ${d.toFixed(2)} lower than assumed${product.logP ? ` (${product.logP.value.toFixed(2)} → ${(product.logP.value - d).toFixed(2)})` : ""}`,
  });
  return {
    code: "product_logp_lower", title: "Product more polar than assumed", share: 1, simulated: true,
    sizes: shifts.map((d) => ({ weight: Math.exp(-d / 0.75), ...at(d) })), refine: (t, i) => at(lerp(shifts, i, t)),
  };
}

function cosolventLeft(input: WorkupInput, productIndex: number): CauseCandidate | null {
  const removals = input.operations.map((op, i) => ({ op, i })).filter(({ op }) => op.type === "remove_cosolvent");
  if (removals.length === 0) return null;
  const steps = removals.map((r) => r.i + 1).join(", ");
  const lefts = range(0.2, 1, 0.2);
  const at = (left: number) => ({
    input: withOperations(input, input.operations.flatMap((op): Operation[] => {
      if (op.type !== "remove_cosolvent") return [op];
      const fractionRemoved = op.fractionRemoved * (1 - left);
      return fractionRemoved > 1e-3 ? [{ ...op, fractionRemoved }] : [];
    })),
    words: `about ${pct(left)} of the co-solvent meant to be stripped at step ${steps} still present at the extraction`,
  });
  return {
    code: "cosolvent_not_removed", title: "Water-miscible co-solvent not removed before the extraction", step: (removals[0]?.i ?? 0) + 1,
    share: 1, simulated: true, sizes: lefts.map((l) => acrossPartition(input, productIndex, { weight: 1, ...at(l) })),
  };
}

function oneFewerExtraction(input: WorkupInput, productIndex: number): CauseCandidate | null {
  const ops = input.operations;
  const extractions = ops.map((op, i) => ({ op, i })).filter(({ op }) => op.type === "extract");
  const multi = extractions.filter(({ op }) => op.type === "extract" && op.portions > 1).at(-1);
  const title = "One extraction fewer than recorded";
  if (multi && multi.op.type === "extract") {
    const fewer = { ...multi.op, portions: multi.op.portions - 1 };
    return {
      code: "one_fewer_extraction", title, step: multi.i + 1, share: 1, simulated: true,
      sizes: [acrossPartition(input, productIndex, { weight: 1, words: `step ${multi.i + 1}: ${multi.op.portions} → ${multi.op.portions - 1} portions`, input: withOperations(input, ops.map((op, i) => (i === multi.i ? fewer : op))) })],
    };
  }
  const last = extractions.at(-1);
  if (extractions.length < 2 || !last) return null;
  return {
    code: "one_fewer_extraction", title, step: last.i + 1, share: 1, simulated: true,
    sizes: [acrossPartition(input, productIndex, { weight: 1, words: `step ${last.i + 1} (extraction) left out`, input: withOperations(input, ops.filter((_, i) => i !== last.i)) })],
  };
}

function wrongLayers(input: WorkupInput, productIndex: number): CauseCandidate[] {
  const ops = input.operations;
  const sites = ops.map((op, i) => ({ op, i })).filter(({ op }) => SEPARATIONS.has(op.type) && "keep" in op && (op.keep === "organic" || op.keep === "aqueous"));
  return sites.map(({ op, i }) => {
    const keep = "keep" in op ? op.keep : "organic";
    const flipped = { ...op, keep: keep === "organic" ? "aqueous" : "organic" } as Operation;
    return {
      code: "wrong_layer" as const, title: "Wrong layer kept", step: i + 1, share: 1 / sites.length, simulated: true,
      sizes: [acrossPartition(input, productIndex, { weight: 1, words: `step ${i + 1} kept the ${keep === "organic" ? "aqueous" : "organic"} layer instead of the ${keep}`, input: withOperations(input, ops.map((o, k) => (k === i ? flipped : o))) })],
    };
  });
}

export function causeSpace(input: WorkupInput, productKey: string, crudeAssayed: boolean): CauseCandidate[] {
  const productIndex = input.components.findIndex((c) => c.key === productKey);
  if (productIndex < 0) return [];
  return [
    crudeAssayed ? null : reactionShortfall(),
    emulsionLoss(input),
    wrongPh(input, productIndex),
    polarProduct(input, productIndex),
    cosolventLeft(input, productIndex),
    oneFewerExtraction(input, productIndex),
    ...wrongLayers(input, productIndex),
  ].filter((c): c is CauseCandidate => c !== null);
}
