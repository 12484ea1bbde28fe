/**
 * The invented demo scenario: a small synthetic-methods group and a second group (to show that groups never see
 * each other's records). People, groups and notebook numbers are made up; the molecules and their properties are
 * real (seed/compounds.ts). Work-ups are generated deterministically from a handful of families, each the kind of
 * work-up a group runs every week, with variants that go wrong in the ways work-ups usually go wrong.
 *
 * Outcomes follow the story, not the judgement: what the chemist isolates is the product the reaction gave (each
 * family's reaction yield), carried through the written procedure (its physics: the engine re-run on the literature
 * values the scenario states), less ordinary handling (2–6 %) and less whatever the story says was lost (an emulsion,
 * a rag layer). A poor procedure therefore reports a poor outcome because its chemistry loses the product, and a
 * mishap reports the loss the note describes.
 */
import type { OperationRaw } from "@/lib/chem/schema";
import type { CauseCode } from "@/lib/workups/causes";

export const DEMO_PASSWORD = "layerwise-demo";

export interface SeedPerson {
  email: string;
  name: string;
  role: "lead" | "member" | "viewer";
}

export const demoGroup = {
  name: "Holloway group: synthetic methods",
  slug: "holloway",
  people: [
    { email: "maren.holloway@example.org", name: "Maren Holloway", role: "lead" },
    { email: "tomas.ferreira@example.org", name: "Tomás Ferreira", role: "member" },
    { email: "aiko.brandt@example.org", name: "Aiko Brandt", role: "member" },
    { email: "jonah.mercer@example.org", name: "Jonah Mercer", role: "member" },
    { email: "ruth.okafor@example.org", name: "Ruth Okafor", role: "viewer" },
  ] as const satisfies readonly SeedPerson[],
};

export const otherGroup = {
  name: "Quayle process group",
  slug: "quayle",
  people: [{ email: "ines.quayle@example.org", name: "Inès Quayle", role: "lead" }] as const satisfies readonly SeedPerson[],
};

export interface SeedComponentRef {
  compound: string;
  role: "product" | "starting_material" | "reagent" | "byproduct" | "impurity" | "catalyst" | "other";
  mmol: number;
}

/**
 * How the scenario writes a workup as a poor one, and what the review should name: a procedure whose written chemistry
 * loses the product (the engine's danger-level risk it earns, known before any outcome), or a mishap at the bench
 * that loses product the procedure itself would have kept (the likely cause the outcome should point to).
 */
export type WrittenPoor =
  | { kind: "procedure"; risk: string; words: string }
  | { kind: "mishap"; cause: CauseCode; loss: number; words: string };

export interface WorkupFamily {
  key: string;
  title: string;
  components: SeedComponentRef[];
  solvents: { solvent: string; ml: number }[];
  /** Aqueous reagents already in the reaction mixture (the base of a saponification). */
  reagents?: { reagent: string; ml: number }[];
  operations: OperationRaw[];
  /**
   * Share of the expected product the reaction really gave, in the crude before the workup (common practice: a
   * reaction run as planned gives 90–100 % of what the chemist expected).
   */
  reactionYield: number;
  purityPct: number;
  /** Set when the scenario writes the family as a poor one. */
  poor?: WrittenPoor;
  note?: string;
}

const mL = (value: number) => ({ value, unit: "mL" as const });
const g = (value: number) => ({ value, unit: "g" as const });

const washes = {
  acid: (ml: number, n = 2): OperationRaw => ({ type: "wash", reagent: "hcl_1m", volume: mL(ml), portions: n, label: "1 M HCl" }),
  bicarb: (ml: number, n = 2): OperationRaw => ({ type: "wash", reagent: "nahco3_sat", volume: mL(ml), portions: n, label: "sat. NaHCO₃" }),
  brine: (ml: number): OperationRaw => ({ type: "wash", reagent: "brine", volume: mL(ml), portions: 1, label: "brine" }),
  water: (ml: number, n = 1): OperationRaw => ({ type: "wash", reagent: "water", volume: mL(ml), portions: n, label: "water" }),
  licl: (ml: number, n = 3): OperationRaw => ({ type: "wash", reagent: "licl_5pct", volume: mL(ml), portions: n, label: "5% LiCl" }),
};
const dryAndStrip = (agent = "mgso4", grams = 3): OperationRaw[] => [
  { type: "dry", agent, mass: g(grams) },
  { type: "concentrate", method: "rotavap", bath: { value: 40, unit: "°C" } },
];

/** Work-up families; the generator varies scale, volumes and dates around them. */
export const families: WorkupFamily[] = [
  {
    key: "amide-dcm", title: "N-Benzylbenzamide (benzoyl chloride, benzylamine, Et₃N, DCM)",
    components: [
      { compound: "n-benzylbenzamide", role: "product", mmol: 10 },
      { compound: "benzylamine", role: "starting_material", mmol: 1 },
      { compound: "triethylamine", role: "reagent", mmol: 5 },
      { compound: "benzoic-acid", role: "byproduct", mmol: 0.8 },
    ],
    solvents: [{ solvent: "dcm", ml: 40 }],
    operations: [washes.acid(20), washes.bicarb(20), washes.brine(20), ...dryAndStrip()],
    reactionYield: 0.97, purityPct: 97,
  },
  {
    key: "acetanilide-etoac", title: "Acetanilide (aniline, acetic anhydride, EtOAc)",
    components: [
      { compound: "acetanilide", role: "product", mmol: 8 },
      { compound: "aniline", role: "starting_material", mmol: 0.6 },
      { compound: "acetic-acid", role: "byproduct", mmol: 9 },
    ],
    solvents: [{ solvent: "etoac", ml: 40 }],
    operations: [washes.acid(15), washes.bicarb(20, 3), washes.brine(15), ...dryAndStrip()],
    reactionYield: 0.95, purityPct: 96,
  },
  {
    key: "lidocaine-swing", title: "Lidocaine by pH swing (toluene, 3 M HCl, NaOH, hexane)",
    components: [
      { compound: "lidocaine", role: "product", mmol: 4 },
      { compound: "diethylamine", role: "reagent", mmol: 6 },
      { compound: "2-6-dimethylaniline", role: "impurity", mmol: 0.3 },
    ],
    solvents: [{ solvent: "toluene", ml: 25 }],
    operations: [
      { type: "back_extract", reagent: "hcl_3m", volume: mL(10), portions: 2, keep: "aqueous", label: "amines into 3 M HCl" },
      { type: "adjust_ph", reagent: "naoh_10pct", targetPh: 12.5, label: "basify" },
      { type: "extract", solvent: "hexane", volume: mL(15), portions: 3, keep: "organic", label: "free base into hexane" },
      ...dryAndStrip("na2so4", 3),
    ],
    reactionYield: 0.94, purityPct: 95,
  },
  {
    key: "lidocaine-low-ph", title: "Lidocaine by pH swing, basified only to pH 8",
    components: [
      { compound: "lidocaine", role: "product", mmol: 4 },
      { compound: "diethylamine", role: "reagent", mmol: 6 },
    ],
    solvents: [{ solvent: "toluene", ml: 25 }],
    operations: [
      { type: "back_extract", reagent: "hcl_3m", volume: mL(10), portions: 2, keep: "aqueous" },
      { type: "adjust_ph", reagent: "nahco3_sat", targetPh: 8, label: "basify with bicarbonate" },
      { type: "extract", solvent: "hexane", volume: mL(15), portions: 1, keep: "organic" },
      ...dryAndStrip("na2so4", 3),
    ],
    reactionYield: 0.95, purityPct: 93,
    poor: { kind: "procedure", risk: "F3", words: "basified only to pH 8, about lidocaine's pKa (7.9): half of it stays protonated in the water" },
    note: "Aqueous layer still cloudy after the extraction.",
  },
  {
    key: "ibuprofen-saponification", title: "Ibuprofen from its ethyl ester (NaOH, THF/water), acidify and extract",
    components: [
      { compound: "ibuprofen", role: "product", mmol: 6 },
      { compound: "ethyl-benzoate", role: "impurity", mmol: 0.3 },
    ],
    solvents: [{ solvent: "thf", ml: 20 }],
    reagents: [{ reagent: "naoh_1m", ml: 20 }],
    operations: [
      { type: "remove_cosolvent", solvent: "thf", fractionRemoved: 0.95 },
      { type: "extract", solvent: "mtbe", volume: mL(15), portions: 1, keep: "aqueous", label: "wash out neutrals with MTBE" },
      { type: "adjust_ph", reagent: "hcl_3m", targetPh: 2, label: "acidify" },
      { type: "extract", solvent: "etoac", volume: mL(20), portions: 3, keep: "organic" },
      washes.brine(15),
      ...dryAndStrip("na2so4", 4),
    ],
    reactionYield: 0.97, purityPct: 98,
  },
  {
    key: "ibuprofen-thf-left", title: "Ibuprofen from its ethyl ester, THF not removed before extraction",
    components: [{ compound: "ibuprofen", role: "product", mmol: 6 }],
    solvents: [{ solvent: "thf", ml: 20 }],
    reagents: [{ reagent: "naoh_1m", ml: 20 }],
    operations: [
      { type: "adjust_ph", reagent: "hcl_3m", targetPh: 2 },
      { type: "extract", solvent: "etoac", volume: mL(20), portions: 2, keep: "organic", observed: { interface: "rag" } },
      ...dryAndStrip("na2so4", 4),
    ],
    reactionYield: 0.97, purityPct: 94,
    poor: { kind: "mishap", cause: "emulsion_loss", loss: 0.25, words: "THF left in: the layers were slow to separate and a rag layer holding about a quarter of the product was left behind" },
    note: "Layers slow to separate; a rag layer was left behind.",
  },
  {
    key: "ester-etoh-stripped", title: "Ethyl benzoate (Fischer esterification, ethanol stripped first)",
    components: [
      { compound: "ethyl-benzoate", role: "product", mmol: 12 },
      { compound: "benzoic-acid", role: "starting_material", mmol: 1.5 },
    ],
    solvents: [{ solvent: "etoh", ml: 30 }],
    operations: [
      { type: "remove_cosolvent", solvent: "etoh", fractionRemoved: 0.97 },
      { type: "charge", solvent: "etoac", volume: mL(40) },
      washes.bicarb(20, 2), washes.brine(20), ...dryAndStrip(),
    ],
    reactionYield: 0.94, purityPct: 97,
  },
  {
    key: "caffeine-dcm", title: "Caffeine from theobromine (MeI, K₂CO₃, DMF), DCM extraction from brine",
    components: [{ compound: "caffeine", role: "product", mmol: 5 }],
    solvents: [{ solvent: "dmf", ml: 10 }, { solvent: "water", ml: 40 }],
    operations: [
      { type: "add_salt", salt: "nacl", saturate: true, label: "saturate with NaCl" },
      { type: "extract", solvent: "dcm", volume: mL(20), portions: 4, keep: "organic" },
      washes.licl(10, 2), ...dryAndStrip("na2so4", 3),
    ],
    reactionYield: 0.93, purityPct: 95,
  },
  {
    key: "caffeine-etoac", title: "Caffeine from theobromine, one EtOAc extraction",
    components: [{ compound: "caffeine", role: "product", mmol: 5 }],
    solvents: [{ solvent: "dmf", ml: 10 }, { solvent: "water", ml: 40 }],
    operations: [
      { type: "extract", solvent: "etoac", volume: mL(30), portions: 1, keep: "organic" },
      washes.water(20, 2), ...dryAndStrip("mgso4", 2),
    ],
    reactionYield: 0.93, purityPct: 88,
    poor: { kind: "procedure", risk: "F5", words: "one EtOAc extraction of a product that hardly partitions out of water (caffeine log P −0.07)" },
  },
  {
    key: "benzophenone-ether", title: "Benzophenone (Grignard addition and oxidation), NH₄Cl quench, ether extraction",
    components: [
      { compound: "benzophenone", role: "product", mmol: 7 },
      { compound: "naphthalene", role: "impurity", mmol: 0.2 },
    ],
    solvents: [{ solvent: "thf", ml: 15 }],
    operations: [
      { type: "quench", reagent: "nh4cl_sat", volume: mL(20), mode: "normal" },
      { type: "charge", solvent: "et2o", volume: mL(30) },
      { type: "separate", keep: "organic", saveAs: "aq1" },
      { type: "combine", streams: ["aq1"] },
      { type: "extract", solvent: "et2o", volume: mL(20), portions: 2, keep: "organic" },
      washes.brine(20), ...dryAndStrip(),
    ],
    reactionYield: 0.97, purityPct: 94,
  },
  {
    key: "phenol-swing", title: "p-Cresol recovered from a naphthalene mixture by NaOH back-extraction",
    components: [
      { compound: "p-cresol", role: "product", mmol: 5 },
      { compound: "naphthalene", role: "impurity", mmol: 3 },
    ],
    solvents: [{ solvent: "mtbe", ml: 30 }],
    operations: [
      { type: "back_extract", reagent: "naoh_1m", volume: mL(15), portions: 2, keep: "aqueous" },
      { type: "adjust_ph", reagent: "hcl_3m", targetPh: 2 },
      { type: "extract", solvent: "mtbe", volume: mL(20), portions: 3, keep: "organic" },
      washes.brine(15), ...dryAndStrip("na2so4", 3),
    ],
    reactionYield: 0.96, purityPct: 96,
  },
  {
    key: "phenol-bicarb", title: "p-Cresol from a naphthalene mixture, bicarbonate instead of NaOH",
    components: [
      { compound: "p-cresol", role: "product", mmol: 5 },
      { compound: "naphthalene", role: "impurity", mmol: 3 },
    ],
    solvents: [{ solvent: "mtbe", ml: 30 }],
    operations: [
      { type: "back_extract", reagent: "nahco3_sat", volume: mL(15), portions: 2, keep: "aqueous" },
      { type: "adjust_ph", reagent: "hcl_3m", targetPh: 2 },
      { type: "extract", solvent: "mtbe", volume: mL(20), portions: 3, keep: "organic" },
      ...dryAndStrip("na2so4", 3),
    ],
    reactionYield: 0.96, purityPct: 80,
    poor: { kind: "procedure", risk: "F12", words: "bicarbonate (pH 8–9) does not deprotonate p-cresol (pKa 10.27): it stays in the MTBE, which goes to waste" },
  },
  {
    key: "acetylation-dmap", title: "Acetanilide with DMAP/pyridine, CuSO₄ and HCl washes",
    components: [
      { compound: "acetanilide", role: "product", mmol: 6 },
      { compound: "pyridine", role: "reagent", mmol: 12 },
      { compound: "dmap", role: "catalyst", mmol: 0.6 },
      { compound: "acetic-acid", role: "byproduct", mmol: 6 },
    ],
    solvents: [{ solvent: "etoac", ml: 40 }],
    operations: [washes.acid(20, 3), washes.bicarb(20, 2), washes.brine(20), ...dryAndStrip()],
    reactionYield: 0.96, purityPct: 97,
  },
  {
    key: "lidocaine-acid-wash", title: "Lidocaine amide coupling washed with 1 M HCl like a neutral amide",
    components: [
      { compound: "lidocaine", role: "product", mmol: 5 },
      { compound: "triethylamine", role: "reagent", mmol: 4 },
    ],
    solvents: [{ solvent: "etoac", ml: 40 }],
    operations: [washes.acid(20, 2), washes.brine(20), ...dryAndStrip()],
    reactionYield: 0.95, purityPct: 90,
    poor: { kind: "procedure", risk: "F2", words: "1 M HCl washes protonate the amine (pKa 7.9) and carry it into the discarded water" },
    note: "Almost nothing left after evaporation; the acid washes were discarded.",
  },
];

/**
 * A mishap the group meeting should see, on workups whose procedure is sound: an emulsion at a separation that took
 * about a third of the organic layer (and so of the product) with it. The record notes the emulsion at that step.
 */
export const emulsionMishap = {
  cause: "emulsion_loss" as const,
  loss: 1 / 3,
  note: (step: number) => `Heavy emulsion at step ${step}; about a third of the organic layer was lost with it.`,
};
/** Ordinary handling losses of a careful bench workup, beyond what the procedure's chemistry loses (common practice). */
export const HANDLING_LOSS = { low: 0.02, high: 0.06 };
