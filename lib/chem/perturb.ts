/**
 * Which inputs of a parsed work-up are uncertain, by how much, and how to draw a perturbed copy cheaply: the
 * sites are found once, and each draw rebuilds only the objects that change (no deep clone, no validation).
 *
 * Standard uncertainties (one standard deviation) when a value carries no `se` of its own:
 *  - log P / log K, and ion-pair extraction constants (log K_ex): estimated 0.7 (the figure; §2.11 gives 0.5–1 for predicted log P), literature 0.2,
 *    measured 0.1, group 0.3 (a pooled group value normally states its own se);
 *  - pKa: estimated 0.7, literature 0.1, measured 0.05, group 0.2 (§2.2: ±0.5 for predicted values;
 *    the rest from memory);
 *  - every volume ±5 % (issue 3), reagent amounts ±5 % (same figure, by analogy), and a pH set with paper or a
 *    meter ±0.3 (from memory: the resolution of wide-range pH paper);
 *  - each water-immiscible solvent's ion-pair extraction constants by the standard uncertainty their class value
 *    states (ion-pair.ts), one shift per solvent shared by its anion and cation pairs, when a component can
 *    carry a charge.
 */
import { SOLVENTS } from "./data/solvents";
import { ionPairOffset } from "./ion-pair";
import { engineSolventKeys } from "./library";
import { type WorkupParameters } from "./parameters";
import { componentTranslationSd, LOGP_SE_BY_PROVENANCE } from "./partition";
import type { Component, Operation, Provenance, WorkupInput } from "./schema";

export interface UncertaintyDefaults {
  logP: Record<Provenance, number>;
  pKa: Record<Provenance, number>;
  volumeRelative: number;
  amountRelative: number;
  targetPh: number;
  /** Multiplies the stated uncertainty of the solvents' ion-pair constants (1 as stated; 0 leaves them fixed). */
  ionPairScale: number;
}

export const DEFAULT_UNCERTAINTY: UncertaintyDefaults = {
  logP: LOGP_SE_BY_PROVENANCE,
  pKa: { estimated: 0.7, literature: 0.1, measured: 0.05, group: 0.2 },
  volumeRelative: 0.05,
  amountRelative: 0.05,
  targetPh: 0.3,
  ionPairScale: 1,
};

/** One uncertain input, as listed in the uncertainty result. */
export interface UncertainInput {
  /** Where the value sits in the parsed input, e.g. "components.2.pKas.0". */
  path: string;
  /** Standard deviation: log units, pKa units, pH units, or a fraction for "relative". */
  sd: number;
  scale: "log" | "pKa" | "pH" | "relative";
}

interface ComponentPlan {
  logP: number;
  logK: Array<[string, number]>;
  pKa: number[];
  /** The component's extraction constants for solvents the work-up uses: their index and sd. */
  ionPair: Array<[number, number]>;
}

interface OperationPlan {
  volume: number;
  amount: number;
  targetPh: number;
  rinse: number;
}

type ParameterField = "logP" | "logK" | "pKa" | "ionPairLogKex" | "mixtureSolventMl" | "mixtureReagentMl" | "volumeMl" | "operationAmountMmol" | "targetPh" | "rinseMl" | "ionPairShift";

/** Solvents whose ion-pair constants are uncertain in this work-up, with their index in the library's solvent
 * order and standard uncertainty: water-immiscible ones, when some component can carry a charge. */
function ionPairSites(input: WorkupInput, scale: number): Array<{ key: string; index: number; sd: number }> {
  if (!(scale > 0) || !input.components.some((c) => c.pKas.length > 0 || c.fixedCharge !== 0)) return [];
  return engineSolventKeys(input).flatMap((key, index) => {
    const solvent = SOLVENTS[key];
    const se = solvent && !solvent.waterMiscible ? ionPairOffset(solvent).se * scale : 0;
    return se > 0 ? [{ key, index, sd: se }] : [];
  });
}

export interface PerturbationPlan {
  sites: UncertainInput[];
  /** Builds one perturbed input; `z(i)` is the standard normal for site i. */
  draw(z: Float64Array): WorkupInput;
  /**
   * A function that writes the perturbation for `z` into `out` (laid out as readParameters(input) lays it out)
   * from the input's own values in `nominal`: the numbers draw(z) would put in its copy, without building one.
   * Only the uncertain numbers are written; `out` must hold the nominal values elsewhere, and neither may be
   * re-read into (the arrays are bound once).
   */
  parameterDrawer(nominal: WorkupParameters, out: WorkupParameters): (z: Float64Array) => void;
}

function componentPlan(c: Component, d: UncertaintyDefaults, extraLogSd: number, used: ReadonlySet<string>): ComponentPlan {
  const hasOwnLogK = Object.keys(c.logK).length > 0;
  return {
    // The solvent translation of an estimate from log P adds its own error; a solvent-specific value does not.
    logP: c.logP ? Math.hypot(c.logP.se ?? d.logP[c.logP.provenance], hasOwnLogK ? 0 : extraLogSd) : 0,
    logK: Object.entries(c.logK).map(([solvent, v]) => [solvent, v.se ?? d.logP[v.provenance]]),
    pKa: c.pKas.map((p) => p.se ?? d.pKa[p.provenance]),
    // An extraction constant is a log partition ratio: the log P figures by provenance when it states no se.
    ionPair: c.ionPairLogKex.flatMap((k, j): Array<[number, number]> => (used.has(k.solvent) ? [[j, k.se ?? d.logP[k.provenance]]] : [])),
  };
}

function operationPlan(op: Operation, d: UncertaintyDefaults): OperationPlan {
  const has = (field: string): boolean => field in op && (op as Record<string, unknown>)[field] !== undefined;
  return {
    volume: has("volumeMl") ? d.volumeRelative : 0,
    amount: has("amountMmol") ? d.amountRelative : 0,
    targetPh: has("targetPh") ? d.targetPh : 0,
    rinse: has("rinse") ? d.volumeRelative : 0,
  };
}

/** Solvents named in the work-up that are not known to be water-miscible (their partition is what log P translates into). */
function immiscibleSolvents(input: WorkupInput): string[] {
  const named = new Set<string>(input.mixture.solvents.map((s) => s.solvent));
  for (const op of input.operations) if ("solvent" in op && typeof op.solvent === "string") named.add(op.solvent);
  return [...named].filter((k) => SOLVENTS[k]?.waterMiscible !== true);
}

/**
 * The uncertain sites of `input`. `extraLogSd` adds the solvent-translation error (Collander relation) to every
 * log P that is not backed by a solvent-specific log K; a component with Abraham descriptors gets the model's own
 * validated figure instead (componentTranslationSd, partition.ts).
 */
export function planPerturbation(input: WorkupInput, defaults: UncertaintyDefaults = DEFAULT_UNCERTAINTY, extraLogSd = 0): PerturbationPlan {
  const sites: UncertainInput[] = [];
  // Where each site's number sits in a WorkupParameters (readParameters' layout), in the order of the sites.
  const slotField: ParameterField[] = [];
  const slotIndex: number[] = [];
  const site = (path: string, sd: number, scale: UncertainInput["scale"], field: ParameterField, index: number) => {
    sites.push({ path, sd, scale });
    slotField.push(field);
    slotIndex.push(index);
  };
  // The translation error per component: the Abraham model's validated figure where it applies (partition.ts).
  const immiscible = immiscibleSolvents(input);
  const used = new Set(engineSolventKeys(input));
  const comps = input.components.map((c) => componentPlan(c, defaults, componentTranslationSd(c, immiscible, extraLogSd), used));
  let logKAt = 0, pKaAt = 0;
  comps.forEach((p, i) => {
    if (p.logP > 0) site(`components.${i}.logP`, p.logP, "log", "logP", i);
    for (const [solvent, sd] of p.logK) site(`components.${i}.logK.${solvent}`, sd, "log", "logK", logKAt++);
    p.pKa.forEach((sd, j) => site(`components.${i}.pKas.${j}`, sd, "pKa", "pKa", pKaAt++));
    const pairStart = input.components.slice(0, i).reduce((n, c) => n + c.ionPairLogKex.length, 0);
    for (const [j, sd] of p.ionPair) site(`components.${i}.ionPairLogKex.${j}`, sd, "log", "ionPairLogKex", pairStart + j);
  });
  input.mixture.solvents.forEach((_, i) => site(`mixture.solvents.${i}.volumeMl`, defaults.volumeRelative, "relative", "mixtureSolventMl", i));
  input.mixture.reagents.forEach((_, i) => site(`mixture.reagents.${i}.volumeMl`, defaults.volumeRelative, "relative", "mixtureReagentMl", i));
  const ops = input.operations.map((op) => operationPlan(op, defaults));
  ops.forEach((p, i) => {
    if (p.volume > 0) site(`operations.${i}.volumeMl`, p.volume, "relative", "volumeMl", i);
    if (p.amount > 0) site(`operations.${i}.amountMmol`, p.amount, "relative", "operationAmountMmol", i);
    if (p.targetPh > 0) site(`operations.${i}.targetPh`, p.targetPh, "pH", "targetPh", i);
    if (p.rinse > 0) site(`operations.${i}.rinse.volumeMl`, p.rinse, "relative", "rinseMl", i);
  });
  const pairs = ionPairSites(input, defaults.ionPairScale);
  for (const x of pairs) site(`ionPair.${x.key}`, x.sd, "log", "ionPairShift", x.index);

  // Volumes and amounts are scaled by exp(sd·z) ≈ 1 + sd·z: positive for any draw, median unchanged.
  const scale = (value: number, sd: number, zi: number): number => value * Math.exp(sd * zi);

  return {
    sites,
    draw(z: Float64Array): WorkupInput {
      let k = 0;
      const next = (): number => z[k++] ?? 0;
      const components = input.components.map((c, i) => {
        const p = comps[i];
        if (!p) return c;
        const logP = c.logP && p.logP > 0 ? { ...c.logP, value: c.logP.value + p.logP * next() } : c.logP;
        let logK = c.logK;
        if (p.logK.length > 0) {
          logK = { ...c.logK };
          for (const [solvent, sd] of p.logK) {
            const v = c.logK[solvent];
            if (v) logK[solvent] = { ...v, value: v.value + sd * next() };
          }
        }
        const pKas = p.pKa.length > 0 ? c.pKas.map((pk, j) => ({ ...pk, value: pk.value + (p.pKa[j] ?? 0) * next() })) : c.pKas;
        let ionPairLogKex = c.ionPairLogKex;
        if (p.ionPair.length > 0) {
          ionPairLogKex = [...c.ionPairLogKex];
          for (const [j, sd] of p.ionPair) {
            const k = c.ionPairLogKex[j];
            if (k) ionPairLogKex[j] = { ...k, value: k.value + sd * next() };
          }
        }
        return { ...c, logP, logK, pKas, ionPairLogKex };
      });
      const mixture = {
        solvents: input.mixture.solvents.map((s) => ({ ...s, volumeMl: scale(s.volumeMl, defaults.volumeRelative, next()) })),
        reagents: input.mixture.reagents.map((r) => ({ ...r, volumeMl: scale(r.volumeMl, defaults.volumeRelative, next()) })),
      };
      const operations = input.operations.map((op, i): Operation => {
        const p = ops[i];
        if (!p || p.volume + p.amount + p.targetPh + p.rinse === 0) return op;
        const copy = { ...op } as Record<string, unknown>;
        if (p.volume > 0) copy.volumeMl = scale(copy.volumeMl as number, p.volume, next());
        if (p.amount > 0) copy.amountMmol = scale(copy.amountMmol as number, p.amount, next());
        if (p.targetPh > 0) copy.targetPh = (copy.targetPh as number) + p.targetPh * next();
        if (p.rinse > 0) {
          const rinse = copy.rinse as { solvent: string; volumeMl: number };
          copy.rinse = { ...rinse, volumeMl: scale(rinse.volumeMl, p.rinse, next()) };
        }
        return copy as Operation;
      });
      if (pairs.length === 0) return { ...input, components, mixture, operations };
      const ionPairShift: Record<string, number> = { ...input.ionPairShift };
      for (const x of pairs) ionPairShift[x.key] = (ionPairShift[x.key] ?? 0) + x.sd * next();
      return { ...input, components, mixture, operations, ionPairShift };
    },
    parameterDrawer(nominal: WorkupParameters, out: WorkupParameters): (z: Float64Array) => void {
      const from = slotField.map((f) => nominal[f]);
      const to = slotField.map((f) => out[f]);
      const relative = sites.map((x) => x.scale === "relative");
      const sd = Float64Array.from(sites, (x) => x.sd);
      const index = Int32Array.from(slotIndex);
      return (z) => {
        for (let k = 0; k < index.length; k++) {
          const i = index[k] as number;
          const value = (from[k] as Float64Array)[i] as number;
          const zi = z[k] ?? 0;
          (to[k] as Float64Array)[i] = relative[k] ? scale(value, sd[k] as number, zi) : value + (sd[k] as number) * zi;
        }
      };
    },
  };
}
