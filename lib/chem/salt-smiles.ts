/**
 * Reads the counter-ion of a salt written as a multi-fragment SMILES ("NCc1ccccc1.Cl", "CC(=O)[O-].[Na+]",
 * "CCCC[N+](CCCC)(CCCC)CCCC.[Br-]") without a structure toolkit: every fragment but one must be a counter-ion
 * written in one of its usual forms (or water of hydration), and they must all be the same ion. Anything else
 * (two organic fragments, mixed counter-ions) is left alone: the component is then taken as given.
 */
import { COUNTER_IONS, type CounterIonKey } from "./data/counter-ions";

const FORMS: Record<CounterIonKey, readonly string[]> = {
  chloride: ["Cl", "[Cl-]", "[ClH]", "[H]Cl"],
  bromide: ["Br", "[Br-]", "[BrH]", "[H]Br"],
  iodide: ["I", "[I-]", "[IH]", "[H]I"],
  nitrate: ["O[N+](=O)[O-]", "[O-][N+](=O)[O-]", "[O-][N+]([O-])=O", "ON(=O)=O", "O=[N+]([O-])O", "O=[N+]([O-])[O-]"],
  mesylate: ["CS(=O)(=O)O", "CS(O)(=O)=O", "CS(=O)(=O)[O-]", "CS([O-])(=O)=O", "OS(C)(=O)=O"],
  tosylate: ["Cc1ccc(cc1)S(=O)(=O)O", "Cc1ccc(S(=O)(=O)O)cc1", "Cc1ccc(cc1)S(=O)(=O)[O-]", "Cc1ccc(S(=O)(=O)[O-])cc1",
    "Cc1ccc(cc1)S(O)(=O)=O", "Cc1ccc(cc1)S([O-])(=O)=O", "O=S(=O)(O)c1ccc(C)cc1", "[O-]S(=O)(=O)c1ccc(C)cc1"],
  trifluoroacetate: ["OC(=O)C(F)(F)F", "O=C(O)C(F)(F)F", "FC(F)(F)C(=O)O", "FC(F)(F)C(O)=O", "[O-]C(=O)C(F)(F)F",
    "O=C([O-])C(F)(F)F", "FC(F)(F)C(=O)[O-]", "FC(F)(F)C([O-])=O"],
  triflate: ["OS(=O)(=O)C(F)(F)F", "O=S(=O)(O)C(F)(F)F", "FC(F)(F)S(=O)(=O)O", "[O-]S(=O)(=O)C(F)(F)F", "FC(F)(F)S(=O)(=O)[O-]",
    "O=S(=O)([O-])C(F)(F)F"],
  tetrafluoroborate: ["F[B-](F)(F)F", "[B-](F)(F)(F)F"],
  hexafluorophosphate: ["F[P-](F)(F)(F)(F)F", "[P-](F)(F)(F)(F)(F)F"],
  sodium: ["[Na+]", "[Na]"],
  potassium: ["[K+]", "[K]"],
  lithium: ["[Li+]", "[Li]"],
};

const BY_FORM = new Map<string, CounterIonKey>(
  (Object.entries(FORMS) as [CounterIonKey, readonly string[]][]).flatMap(([ion, forms]) => forms.map((f) => [f, ion] as const)),
);
const WATER_FORMS = new Set(["O", "[OH2]", "[H]O[H]"]);
/** Molar mass of water, g/mol (IUPAC standard atomic weights). */
const WATER_MOLAR_MASS = 18.015;

export interface SaltFromSmiles {
  counterIon: CounterIonKey;
  perParent: number;
  /** Molecules of water of hydration per parent. */
  water: number;
  parentSmiles: string;
}

export function saltFromSmiles(smiles: string): SaltFromSmiles | null {
  const fragments = smiles.split(".").map((f) => f.trim()).filter((f) => f.length > 0);
  if (fragments.length < 2) return null;
  let ion: CounterIonKey | null = null;
  let perParent = 0, water = 0;
  const parents: string[] = [];
  for (const f of fragments) {
    const hit = BY_FORM.get(f);
    if (hit) {
      if (ion !== null && ion !== hit) return null;
      ion = hit;
      perParent++;
    } else if (WATER_FORMS.has(f)) water++;
    else parents.push(f);
  }
  if (ion === null || parents.length !== 1) return null;
  return { counterIon: ion, perParent, water, parentSmiles: parents[0] as string };
}

/** The parent's molar mass from the whole salt's (as computed from the full SMILES): the counter-ions, with the
 * proton an anion brought or a cation displaced, and any water of hydration taken off. */
export function parentMolarMass(saltMolarMass: number, salt: SaltFromSmiles, fixedCharge: number): number {
  const x = COUNTER_IONS[salt.counterIon];
  const proton = fixedCharge !== 0 ? 0 : x.charge < 0 ? 1.008 : -1.008;
  return saltMolarMass - salt.perParent * (x.molarMass + proton) - salt.water * WATER_MOLAR_MASS;
}

/**
 * The permanent charge a parent SMILES shows without a structure toolkit: +1 for one quaternary nitrogen or
 * phosphorus written as a bracket atom with no hydrogen ("[N+]", "[n+]", "[P+]": a tetraalkylammonium, an
 * N-alkylpyridinium, a phosphonium) when no other atom carries a charge; 0 otherwise (a protonated amine
 * "[NH+]" is a salt of a base, a nitro group carries "[O-]" beside its "[N+]").
 */
export function permanentChargeFromSmiles(smiles: string): number {
  const charged = smiles.match(/\[[^\]]*[+-]\d*\]/g) ?? [];
  return charged.length === 1 && /^\[(?:N|n|P)\+1?\]$/.test(charged[0]) ? 1 : 0;
}

/**
 * Carbons in each chain of a symmetric tetra-n-alkylammonium ion written as a SMILES of unbranched carbon
 * chains around one "[N+]" (C[N+](C)(C)C, CCCC[N+](CCCC)(CCCC)CCCC, [N+](CC)(CC)(CC)CC), or null.
 */
export function tetraalkylammoniumChain(smiles: string): number | null {
  if (!/^[C()]*\[N\+\][C()]*$/.test(smiles)) return null;
  const chains = smiles.split(/\[N\+\]|[()]/).filter((x) => x.length > 0);
  const n = chains[0]?.length ?? 0;
  return chains.length === 4 && n > 0 && chains.every((x) => x.length === n) ? n : null;
}
