/**
 * The words of a written workup, mapped to the engine's library keys: solvents, aqueous reagents and drying agents,
 * in the spellings journals and notebooks use (formulas, common names, abbreviations). Matching is done on text
 * normalised by `normalise` (lower case, subscript digits as digits, "saturated" as "sat.", "aqueous" as "aq.").
 * A reagent is a species plus a strength ("1 M", "10%", "sat."); a strength the library has no solution for is
 * reported, never rounded to one it has.
 */

/** Lower case, digits for subscripts, one spelling for the common abbreviations, single spaces. */
export function normalise(text: string): string {
  return text
    .replace(/[₀-₉]/g, (d) => String(d.charCodeAt(0) - 0x2080))
    .toLowerCase()
    .replace(/[‐‑–—]/g, "-")
    .replace(/\bsat(?:urated|'d|d)?\.?(?=\s|$)/g, "sat.")
    .replace(/\baq(?:ueous)?\.?(?=\s|$)/g, "aq.")
    .replace(/\banhyd(?:rous|\.)?(?=\s|$)/g, "")
    .replace(/\s+/g, " ")
    .trim();
}

/** Organic solvents (and water) by library key, each with the names it is written under. */
export const SOLVENT_NAMES: Readonly<Record<string, readonly string[]>> = {
  etoac: ["EtOAc", "ethyl acetate", "AcOEt"],
  dcm: ["CH₂Cl₂", "DCM", "dichloromethane", "methylene chloride"],
  et2o: ["Et₂O", "diethyl ether", "ether"],
  mtbe: ["MTBE", "TBME", "tert-butyl methyl ether", "methyl tert-butyl ether", "t-butyl methyl ether"],
  "2-methf": ["2-MeTHF", "2-methyltetrahydrofuran"],
  cpme: ["CPME", "cyclopentyl methyl ether"],
  chcl3: ["CHCl₃", "chloroform"],
  dce: ["1,2-dichloroethane", "DCE"],
  toluene: ["toluene", "PhMe"],
  hexane: ["hexane", "hexanes", "n-hexane"],
  heptane: ["heptane", "n-heptane", "heptanes"],
  cyclohexane: ["cyclohexane"],
  ipac: ["iPrOAc", "isopropyl acetate", "IPAc"],
  nbuoh: ["n-BuOH", "1-butanol", "n-butanol"],
  water: ["water", "H₂O", "deionised water", "deionized water", "distilled water"],
};

/** Water-miscible reaction solvents, for "the THF was removed under reduced pressure". */
export const COSOLVENT_NAMES: Readonly<Record<string, readonly string[]>> = {
  thf: ["THF", "tetrahydrofuran"],
  dioxane: ["1,4-dioxane", "dioxane"],
  meoh: ["MeOH", "methanol"],
  etoh: ["EtOH", "ethanol"],
  ipa: ["iPrOH", "2-propanol", "isopropanol"],
  mecn: ["MeCN", "acetonitrile", "CH₃CN"],
  acetone: ["acetone"],
  dmf: ["DMF", "N,N-dimethylformamide", "dimethylformamide"],
  dmac: ["DMAc", "N,N-dimethylacetamide", "dimethylacetamide"],
  nmp: ["NMP", "N-methyl-2-pyrrolidone", "N-methylpyrrolidone"],
  dmso: ["DMSO", "dimethyl sulfoxide", "dimethyl sulphoxide"],
};

/** Names that are solvents but not in the library: recognised so that they are reported, not misread as another. */
export const UNLISTED_SOLVENTS: readonly string[] = ["petroleum ether", "pentane", "benzene", "carbon tetrachloride", "CCl₄", "light petroleum"];

export const DRYING_AGENT_NAMES: Readonly<Record<string, readonly string[]>> = {
  mgso4: ["MgSO₄", "magnesium sulfate", "magnesium sulphate"],
  na2so4: ["Na₂SO₄", "sodium sulfate", "sodium sulphate"],
  cacl2: ["CaCl₂", "calcium chloride"],
  caso4: ["CaSO₄", "calcium sulfate", "calcium sulphate"],
  k2co3: ["K₂CO₃", "potassium carbonate"],
  sieves_4a: ["4 Å molecular sieves", "4 Å MS", "molecular sieves"],
};

/** Dissolved species of the aqueous reagents, with the names they are written under. The first name is the display. */
export const SPECIES_NAMES: Readonly<Record<string, readonly string[]>> = {
  hcl: ["HCl", "hydrochloric acid"],
  naoh: ["NaOH", "sodium hydroxide"],
  koh: ["KOH", "potassium hydroxide"],
  lioh: ["LiOH", "lithium hydroxide"],
  nahco3: ["NaHCO₃", "sodium bicarbonate", "sodium hydrogen carbonate", "sodium hydrogencarbonate", "bicarbonate"],
  na2co3: ["Na₂CO₃", "sodium carbonate"],
  k2co3: ["K₂CO₃", "potassium carbonate"],
  nh4cl: ["NH₄Cl", "ammonium chloride"],
  nacl: ["NaCl", "sodium chloride"],
  licl: ["LiCl", "lithium chloride"],
  citric: ["citric acid"],
  khso4: ["KHSO₄", "potassium hydrogen sulfate", "potassium bisulfate"],
  nahso4: ["NaHSO₄", "sodium hydrogen sulfate", "sodium bisulfate"],
  cuso4: ["CuSO₄", "copper(II) sulfate", "copper sulfate"],
  na2s2o3: ["Na₂S₂O₃", "sodium thiosulfate"],
  kf: ["KF", "potassium fluoride"],
  rochelle: ["Rochelle salt", "potassium sodium tartrate", "sodium potassium tartrate"],
  acoh: ["AcOH", "acetic acid"],
};

export type Strength = { kind: "molar"; value: number } | { kind: "percent"; value: number } | { kind: "saturated" } | { kind: "half-saturated" };

/** The library's solutions by species and strength (molar and normal are the same for these monoprotic ones). */
const SOLUTIONS: Readonly<Record<string, { molar?: Record<number, string>; percent?: Record<number, string>; saturated?: string; half?: string }>> = {
  hcl: { molar: { 1: "hcl_1m", 2: "hcl_2m", 3: "hcl_3m", 6: "hcl_6m" } },
  naoh: { molar: { 1: "naoh_1m" }, percent: { 10: "naoh_10pct" } },
  koh: { molar: { 1: "koh_1m" } },
  lioh: { molar: { 1: "lioh_1m" } },
  nahco3: { saturated: "nahco3_sat", percent: { 5: "nahco3_5pct" } },
  na2co3: { saturated: "na2co3_sat", molar: { 1: "na2co3_1m" } },
  k2co3: { saturated: "k2co3_sat" },
  nh4cl: { saturated: "nh4cl_sat" },
  nacl: { saturated: "brine", half: "brine_half" },
  licl: { percent: { 5: "licl_5pct" } },
  citric: { percent: { 10: "citric_10pct" } },
  khso4: { molar: { 1: "khso4_1m" } },
  nahso4: { molar: { 1: "nahso4_1m" } },
  cuso4: { percent: { 10: "cuso4_10pct" } },
  na2s2o3: { percent: { 10: "na2s2o3_10pct" } },
  kf: { molar: { 1: "kf_1m" } },
  rochelle: { saturated: "rochelle_sat" },
  acoh: { molar: { 1: "acoh_1m" } },
};

/** Reagents written without a strength: the name alone is the solution. */
export const PLAIN_REAGENT_NAMES: Readonly<Record<string, readonly string[]>> = {
  brine: ["brine"],
  brine_half: ["half-sat. brine", "half-saturated brine", "half brine"],
  water: ["water", "H₂O", "deionised water", "deionized water", "distilled water"],
  phosphate_ph7: ["pH 7 phosphate buffer", "phosphate buffer (pH 7)", "pH 7 buffer"],
};

export function solutionKey(species: string, strength: Strength): string | null {
  const s = SOLUTIONS[species];
  if (!s) return null;
  switch (strength.kind) {
    case "molar": return s.molar?.[strength.value] ?? null;
    case "percent": return s.percent?.[strength.value] ?? null;
    case "saturated": return s.saturated ?? null;
    case "half-saturated": return s.half ?? null;
  }
}

/** How a library reagent is written back in a paragraph. */
export function reagentDisplay(key: string): string {
  for (const [species, s] of Object.entries(SOLUTIONS)) {
    const name = SPECIES_NAMES[species]?.[0] ?? species;
    if (s.saturated === key) return species === "nacl" ? "brine" : `sat. aq. ${name}`;
    if (s.half === key) return "half-saturated brine";
    for (const [v, k] of Object.entries(s.molar ?? {})) if (k === key) return `${v} M ${name}`;
    for (const [v, k] of Object.entries(s.percent ?? {})) if (k === key) return `${v}% aq. ${name}`;
  }
  return PLAIN_REAGENT_NAMES[key]?.[0] ?? key;
}

export function solventDisplay(key: string): string {
  return SOLVENT_NAMES[key]?.[0] ?? COSOLVENT_NAMES[key]?.[0] ?? key;
}

export function dryingAgentDisplay(key: string): string {
  return DRYING_AGENT_NAMES[key]?.[0] ?? key;
}

/** Every key this lexicon can produce, for a check against the engine's library. */
export function lexiconKeys(): { solvents: string[]; cosolvents: string[]; reagents: string[]; agents: string[] } {
  const reagents = new Set<string>(Object.keys(PLAIN_REAGENT_NAMES));
  for (const s of Object.values(SOLUTIONS)) {
    for (const k of [s.saturated, s.half, ...Object.values(s.molar ?? {}), ...Object.values(s.percent ?? {})]) if (k) reagents.add(k);
  }
  return { solvents: Object.keys(SOLVENT_NAMES), cosolvents: Object.keys(COSOLVENT_NAMES), reagents: [...reagents], agents: Object.keys(DRYING_AGENT_NAMES) };
}
