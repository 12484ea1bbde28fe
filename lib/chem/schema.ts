/**
 * The typed work-up description shared by the app's forms, the server, the CLI and the engine (one schema per
 * input). Raw input carries units at every quantity; the parsed output is in canonical units (mL, mmol, g, mol/L,
 * °C) and is what the simulator consumes without further checks.
 */
import { z } from "zod";
import { componentAmountSchema, finiteNumber, pHSchema, massSchema, temperatureSchema, volumeSchema } from "./schema-quantities";
import { operationSchema } from "./schema-operations";
import { COUNTER_ION_KEYS, COUNTER_IONS, saltMolarMass, type CounterIonKey } from "./data/counter-ions";
import { pairingSign } from "./ion-pair";
import { TETRAALKYLAMMONIUM_EXTRACTION, type ExtractionConstant } from "./data/ion-pair-constants";
import { parentMolarMass, permanentChargeFromSmiles, saltFromSmiles, tetraalkylammoniumChain } from "./salt-smiles";
import { planOptionsSchema } from "./schema-plan";
import { strictObject } from "./schema-strict";
import { toMmol } from "./units";

export const PROVENANCES = ["measured", "literature", "estimated", "group"] as const;
export const ROLES = ["product", "starting_material", "reagent", "byproduct", "impurity", "catalyst", "other"] as const;
/** Reagent and structure classes the failure-mode and safety checks look for (failure modes F16, F20, F28, F29 in flags/, and the safety cautions). */
export const COMPONENT_TAGS = [
  "oxidant", "peroxide", "cyanide", "azide", "hf_source", "hydride", "organometallic",
  "aluminium", "tin", "copper", "zinc", "boron", "titanium", "palladium", "nickel", "iron", "quaternary_ammonium",
] as const;

const provenance = z.enum(PROVENANCES, { error: () => `provenance must be one of ${PROVENANCES.join(", ")}` });
const standardError = z.number().positive({ error: "se must be > 0" }).max(5, { error: "se must be ≤ 5" });

export const logValueSchema = strictObject({
  value: finiteNumber("log value").refine((v) => v >= -15 && v <= 15, { error: "log value must be between −15 and 15" }),
  provenance,
  source: z.string().max(500).optional(),
  se: standardError.optional(),
  /** Number of observations pooled into a group value. */
  n: z.number().int().min(1).optional(),
});

export const pKaSchema = strictObject({
  value: finiteNumber("pKa").refine((v) => v >= -12 && v <= 30, { error: "pKa must be between −12 and 30" }),
  /** "acid": HA ⇌ A⁻ + H⁺. "base": the value is the pKa of the conjugate acid BH⁺. */
  kind: z.enum(["acid", "base"], { error: () => "pKa kind must be 'acid' or 'base'" }),
  provenance,
  source: z.string().max(500).optional(),
  se: standardError.optional(),
});

const descriptor = (name: string, min: number, max: number) =>
  finiteNumber(name).refine((v) => v >= min && v <= max, { error: `${name} must be between ${min} and ${max}` });
/**
 * A measured ion-pair extraction constant of the component with a counter-ion into a solvent:
 *   log K_ex = log([component⁺X⁻]org / ([component⁺]aq·[X⁻]aq)), K_ex in L/mol
 * (or with a cation for a component that pairs as an anion). It takes the place of the solvent's class value
 * (ion-pair.ts) for that solvent.
 */
export const ionPairConstantSchema = strictObject({
  solvent: z.string().trim().min(1, { error: "solvent is required" }),
  counterIon: z.enum(COUNTER_ION_KEYS, { error: () => `counterIon must be one of ${COUNTER_ION_KEYS.join(", ")}` }),
  value: finiteNumber("log K_ex").refine((v) => v >= -12 && v <= 12, { error: "log K_ex must be between −12 and 12" }),
  provenance,
  source: z.string().max(500).optional(),
  se: standardError.optional(),
});

export const abrahamDescriptorsSchema = strictObject({
  E: descriptor("E", -2, 6), S: descriptor("S", -1, 10), A: descriptor("A", 0, 3), B: descriptor("B", 0, 6),
  V: descriptor("V", 0.1, 10), L: descriptor("L", -2, 40).optional(),
  provenance,
  source: z.string().max(500).optional(),
});

export const componentSchema = strictObject({
  key: z.string().trim().regex(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$/, { error: "key must be 1–64 letters, digits, '_', '-' or '.'" }),
  name: z.string().trim().min(1, { error: "name is required" }).max(200),
  role: z.enum(ROLES, { error: () => `role must be one of ${ROLES.join(", ")}` }),
  molarMass: z.number({ error: "molarMass must be a number" }).positive({ error: "molarMass must be > 0" }).max(1e5, { error: "molarMass must be ≤ 100000 g/mol" }),
  amount: componentAmountSchema,
  smiles: z.string().max(2000).optional(),
  logP: logValueSchema.optional(),
  /**
   * Abraham solute descriptors (E, S, A, B, McGowan V, optionally L) with their provenance; when given they
   * replace the measured table and the log P line for every solvent that has published coefficients.
   */
  abraham: abrahamDescriptorsSchema.optional(),
  /** Partition coefficient for a named solvent (group or literature value); overrides the estimate from log P. */
  logK: z.record(z.string(), logValueSchema).default({}),
  pKas: z.array(pKaSchema).max(12, { error: "at most 12 pKa values" }).default([]),
  /** Permanent charge of every form (quaternary ammonium +1); paired with an inert counter-ion. Default: +1 when
   * the SMILES shows one quaternary N or P and no other charged atom (salt-smiles.ts), else 0. */
  fixedCharge: z.number().int().min(-4).max(4).optional(),
  /** Counter-ion of the charged form: lipophilic ions (TFA, OTf, OTs, BF₄, PF₆, I⁻) pair into chlorinated solvents. */
  counterIon: z.enum(["hydrophilic", "lipophilic"]).optional(),
  /** log K_ion − log K_neutral when known, used as is at every counter-ion concentration; default: the
   * ion-pair model (ion-pair.ts). */
  ionLogKOffset: z.number().min(-12).max(2).optional(),
  /** Measured ion-pair extraction constants (log K_ex for a solvent and a counter-ion), used in place of the
   * solvent's class value; a symmetric tetra-n-alkylammonium ion recognised from its SMILES gets the published
   * ones it does not state itself (data/ion-pair-constants.ts). */
  ionPairLogKex: z.array(ionPairConstantSchema).max(40, { error: "at most 40 ion-pair constants" }).default([]),
  /** Weighed as a salt: `molarMass` is then the parent's (neutral molecule as drawn, or the cation of a
   * quaternary ammonium) and a mass amount converts through the salt's molar mass; the counter-ion enters the
   * aqueous charge balance and the ion-pair extraction (e.g. { counterIon: "chloride" } for an amine
   * hydrochloride, { counterIon: "sodium" } for a sodium carboxylate, perParent 2 for a dihydrochloride).
   * Without it, a multi-fragment `smiles` naming a known counter-ion ("NCc1ccccc1.Cl") sets it, and `molarMass`
   * is then read as the whole salt's (salt-smiles.ts). */
  salt: strictObject({
    counterIon: z.enum(COUNTER_ION_KEYS, { error: () => `counterIon must be one of ${COUNTER_ION_KEYS.join(", ")}` }),
    perParent: z.number().positive({ error: "perParent must be > 0" }).max(4, { error: "perParent must be ≤ 4" }).default(1),
  }).optional(),
  /** Setschenow constant in NaCl, L/mol; default from log P. */
  setschenowK: z.number().min(-0.5).max(1).optional(),
  bpC: z.number().min(-200).max(800).optional(),
  /** Intrinsic solubility of the neutral form in water, and solubility in the organic solvent, mg/mL. */
  solubility: strictObject({ water: z.number().positive().optional(), organic: z.number().positive().optional() }).optional(),
  labile: z.array(z.enum(["acid", "base"])).default([]),
  chelating: z.boolean().default(false),
  surfactant: z.boolean().default(false),
  tags: z.array(z.enum(COMPONENT_TAGS)).default([]),
  waterSoluble: z.boolean().optional(),
  notes: z.string().max(5000).optional(),
}).transform(({ amount, fixedCharge: givenCharge, ionPairLogKex: given, ...raw }) => {
  const drawn = raw.smiles ? saltFromSmiles(raw.smiles) : null;
  const parentSmiles = drawn?.parentSmiles ?? raw.smiles;
  const fixedCharge = givenCharge ?? (parentSmiles ? permanentChargeFromSmiles(parentSmiles) : 0);
  const c = { ...raw, fixedCharge, ionPairLogKex: withPublishedConstants(given, parentSmiles, fixedCharge) };
  if (c.salt) return { ...c, amountMmol: toMmol(amount.value, amount.unit, saltMolarMass(c.molarMass, c.salt.counterIon, c.salt.perParent, c.fixedCharge)) };
  // A salt drawn as a multi-fragment SMILES: molarMass is the whole salt's (as computed from that SMILES).
  if (!drawn) return { ...c, amountMmol: toMmol(amount.value, amount.unit, c.molarMass) };
  return {
    ...c,
    molarMass: parentMolarMass(c.molarMass, drawn, c.fixedCharge),
    salt: { counterIon: drawn.counterIon, perParent: drawn.perParent },
    amountMmol: toMmol(amount.value, amount.unit, c.molarMass),
  };
});

/** The component's own constants, then the published ones of a symmetric tetra-n-alkylammonium ion for the
 * solvent and counter-ion pairs it does not state. */
function withPublishedConstants(given: z.output<typeof ionPairConstantSchema>[], parentSmiles: string | undefined, fixedCharge: number): z.output<typeof ionPairConstantSchema>[] {
  const chain = fixedCharge === 1 && parentSmiles ? tetraalkylammoniumChain(parentSmiles) : null;
  const table = chain === null ? undefined : TETRAALKYLAMMONIUM_EXTRACTION[chain];
  if (!table) return given;
  const out = [...given];
  for (const [solvent, byIon] of Object.entries(table)) {
    for (const [counterIon, k] of Object.entries(byIon) as [CounterIonKey, ExtractionConstant][]) {
      if (given.some((x) => x.solvent === solvent && x.counterIon === counterIon)) continue;
      out.push({ solvent, counterIon, value: k.logKex, provenance: "literature", source: k.source, se: k.se });
    }
  }
  return out;
}

const mixtureSchema = strictObject({
  /** Reaction solvents (and water) present at the start of the work-up. */
  solvents: z.array(strictObject({ solvent: z.string().trim().min(1, { error: "solvent is required" }), volume: volumeSchema() })
    .transform(({ solvent, volume }) => ({ solvent, volumeMl: volume }))).default([]),
  /** Aqueous reagents already in the mixture (e.g. the base of a saponification). */
  reagents: z.array(strictObject({ reagent: z.string().trim().min(1), volume: volumeSchema() })
    .transform(({ reagent, volume }) => ({ reagent, volumeMl: volume }))).default([]),
});

const outcomeSchema = strictObject({
  crudeMass: massSchema("crude mass").optional(),
  purityPct: z.number().min(0).max(100, { error: "purityPct must be ≤ 100" }).optional(),
  purityMethod: z.enum(["qnmr_internal_standard", "hplc_calibrated", "hplc_area", "nmr_no_standard", "none"]).optional(),
  /** A quantitative in-process assay of the product was taken before the quench. */
  inProcessAssay: z.boolean().optional(),
  observedPh: pHSchema().optional(),
}).transform(({ crudeMass, ...o }) => ({ ...o, crudeMassG: crudeMass }));

/**
 * Idealisations for comparisons with textbook arithmetic; every default is the full model.
 * - idealPhases: solvent and water mutually insoluble (no volume change, no solvent carried across).
 * - noSaltingOut: salts leave every component's partition coefficient unchanged (Setschenow constant 0).
 * - noIonPartition: charged forms stay in the water (only the neutral form partitions).
 */
export const idealisationsSchema = strictObject({
  idealPhases: z.boolean({ error: "idealPhases must be true or false" }).default(false),
  noSaltingOut: z.boolean({ error: "noSaltingOut must be true or false" }).default(false),
  noIonPartition: z.boolean({ error: "noIonPartition must be true or false" }).default(false),
});

export type Idealisations = z.output<typeof idealisationsSchema>;

export const workupInputSchema = strictObject({
  name: z.string().max(200).optional(),
  temperature: temperatureSchema().optional(),
  components: z.array(componentSchema).min(1, { error: "at least one component is required" }).max(50),
  mixture: mixtureSchema,
  operations: z.array(operationSchema).min(1, { error: "at least one operation is required" }).max(200),
  /** Separatory funnel capacity, for the gas-headspace check (F13). */
  funnel: volumeSchema("funnel volume").optional(),
  outcome: outcomeSchema.optional(),
  /** Options for the planner (`layerwise plan`); kept with the spec, not used by a prediction. */
  plan: planOptionsSchema.optional(),
  options: idealisationsSchema.optional(),
}).superRefine((w, ctx) => {
  const seen = new Set<string>();
  w.components.forEach((c, i) => {
    if (seen.has(c.key)) ctx.addIssue({ code: "custom", path: ["components", i, "key"], message: `duplicate component key '${c.key}'` });
    seen.add(c.key);
    checkIonPairConstants(c, i, ctx);
  });
  const saved = new Set<string>();
  w.operations.forEach((op, i) => {
    if (op.type === "combine") {
      op.streams.forEach((s, j) => {
        if (!saved.has(s)) ctx.addIssue({ code: "custom", path: ["operations", i, "streams", j], message: `no stream saved as '${s}' before step ${i + 1}` });
        saved.delete(s);
      });
    }
    if (op.type === "filter") {
      op.solidComponents.forEach((k, j) => {
        if (!seen.has(k)) ctx.addIssue({ code: "custom", path: ["operations", i, "solidComponents", j], message: `unknown component '${k}'` });
      });
    }
    if ("saveAs" in op && op.saveAs !== undefined) {
      if (saved.has(op.saveAs)) ctx.addIssue({ code: "custom", path: ["operations", i, "saveAs"], message: `a stream named '${op.saveAs}' is already saved` });
      saved.add(op.saveAs);
    }
  });
  if (w.mixture.solvents.length === 0 && w.mixture.reagents.length === 0 && w.operations[0]?.type !== "charge") {
    ctx.addIssue({ code: "custom", path: ["mixture", "solvents"], message: "the mixture needs a solvent, or the first operation must charge one" });
  }
}).transform(({ temperature, funnel, options, ...w }) => {
  const o = options ?? { idealPhases: false, noSaltingOut: false, noIonPartition: false };
  // Applied here, once, so the simulator and the Monte-Carlo draws compute on the idealised components as given:
  // a Setschenow constant of 0 removes salting out; an ion offset of −∞ gives the charged forms K = 0.
  const components = o.noSaltingOut || o.noIonPartition
    ? w.components.map((c) => ({ ...c, ...(o.noSaltingOut ? { setschenowK: 0 } : {}), ...(o.noIonPartition ? { ionLogKOffset: -Infinity } : {}) }))
    : w.components;
  return { ...w, components, options: o, temperatureC: temperature ?? 20, funnelMl: funnel };
});

/** A component's own extraction constants: a counter-ion of the opposite sign to its charged form, one value per
 * solvent and counter-ion. */
function checkIonPairConstants(c: z.output<typeof componentSchema>, i: number, ctx: z.RefinementCtx): void {
  const sign = pairingSign(c);
  const seenPairs = new Set<string>();
  c.ionPairLogKex.forEach((k, j) => {
    const path = ["components", i, "ionPairLogKex", j];
    const ion = COUNTER_IONS[k.counterIon];
    if ((ion.charge < 0) !== (sign === "cation")) {
      const wanted = sign === "cation" ? "an anion (chloride, bromide, iodide, …)" : "a cation (sodium, potassium, lithium)";
      ctx.addIssue({ code: "custom", path: [...path, "counterIon"], message: `${k.counterIon} cannot pair with '${c.key}', whose charged form is ${sign === "cation" ? "a cation" : "an anion"}: give ${wanted}` });
    }
    const pair = `${k.solvent}\u0000${k.counterIon}`;
    if (seenPairs.has(pair)) ctx.addIssue({ code: "custom", path, message: `a second log K_ex for ${k.counterIon} in '${k.solvent}'` });
    seenPairs.add(pair);
  });
}

export type WorkupInputRaw = z.input<typeof workupInputSchema>;
export type WorkupInput = z.output<typeof workupInputSchema> & {
  /** Shift (log units) of each solvent's ion-pair extraction constants, by solvent key: set only by the
   * uncertainty engine's perturbed copies (perturb.ts), never by the input schema. */
  ionPairShift?: Readonly<Record<string, number>>;
};
export type Component = WorkupInput["components"][number];
export type PKa = Component["pKas"][number];
export type LogValue = z.output<typeof logValueSchema>;
export type Provenance = (typeof PROVENANCES)[number];
export type ComponentRole = (typeof ROLES)[number];
export type ComponentTag = (typeof COMPONENT_TAGS)[number];

export * from "./schema-operations";
