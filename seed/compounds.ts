/**
 * Compounds of the demo scenario: real molecules with literature properties.
 * Sources (keys as in the project's reference data):
 *  CRC-logP  CRC Handbook of Chemistry and Physics, 95th ed., "Octanol-water partition coefficients".
 *  PhysProp  Syracuse Research Corp. experimental log Kow (KOWWIN SrcKowData2, 2006).
 *  IUPAC-pKa IUPAC Digitized pKa Dataset v1.0 (Perrin 1965/1972; Serjeant & Dempsey 1979).
 *  lido      "Lidocaine for neural blockade", Cambridge University Press book chapter.
 * Values marked "from memory" were not checked against a retrieved source; the app shows them as literature
 * values with a wider uncertainty, and a group measurement replaces them.
 */
export interface SeedPka {
  value: number;
  kind: "acid" | "base";
  source: string;
}

export interface SeedCompound {
  key: string;
  name: string;
  smiles: string;
  synonyms?: string[];
  tags: string[];
  logP?: { value: number; source: string };
  pKas: SeedPka[];
  bpC?: number;
}

export const seedCompounds: SeedCompound[] = [
  // Acids
  { key: "benzoic-acid", name: "Benzoic acid", smiles: "OC(=O)c1ccccc1", tags: ["acid", "reagent"],
    logP: { value: 1.87, source: "PhysProp" }, pKas: [{ value: 4.20, kind: "acid", source: "IUPAC-pKa B91" }] },
  { key: "acetic-acid", name: "Acetic acid", smiles: "CC(=O)O", synonyms: ["AcOH"], tags: ["acid", "solvent"],
    logP: { value: -0.17, source: "CRC-logP" }, pKas: [{ value: 4.76, kind: "acid", source: "IUPAC-pKa W29" }], bpC: 118 },
  { key: "phenylacetic-acid", name: "Phenylacetic acid", smiles: "OC(=O)Cc1ccccc1", tags: ["acid"],
    logP: { value: 1.41, source: "CRC-logP" }, pKas: [{ value: 4.31, kind: "acid", source: "IUPAC-pKa K30" }] },
  { key: "ibuprofen", name: "Ibuprofen", smiles: "CC(C)Cc1ccc(cc1)C(C)C(=O)O", tags: ["acid", "product"],
    logP: { value: 3.97, source: "PhysProp" }, pKas: [{ value: 4.45, kind: "acid", source: "from memory" }] },
  { key: "phenol", name: "Phenol", smiles: "Oc1ccccc1", tags: ["phenol"],
    logP: { value: 1.46, source: "PhysProp" }, pKas: [{ value: 9.99, kind: "acid", source: "IUPAC-pKa F12" }] },
  { key: "4-nitrophenol", name: "4-Nitrophenol", smiles: "Oc1ccc(cc1)[N+](=O)[O-]", tags: ["phenol"],
    logP: { value: 1.91, source: "PhysProp" }, pKas: [{ value: 7.15, kind: "acid", source: "IUPAC-pKa A47" }] },
  { key: "p-cresol", name: "p-Cresol", smiles: "Cc1ccc(O)cc1", synonyms: ["4-methylphenol"], tags: ["phenol"],
    logP: { value: 1.94, source: "PhysProp" }, pKas: [{ value: 10.27, kind: "acid", source: "IUPAC-pKa C40" }] },
  // Bases
  { key: "triethylamine", name: "Triethylamine", smiles: "CCN(CC)CC", synonyms: ["TEA", "Et3N"], tags: ["base", "reagent"],
    logP: { value: 1.45, source: "CRC-logP" }, pKas: [{ value: 10.72, kind: "base", source: "IUPAC-pKa C33" }], bpC: 89 },
  { key: "dipea", name: "N,N-Diisopropylethylamine", smiles: "CCN(C(C)C)C(C)C", synonyms: ["DIPEA"], tags: ["base", "reagent"],
    pKas: [{ value: 11.0, kind: "base", source: "from memory" }], bpC: 127 },
  { key: "pyridine", name: "Pyridine", smiles: "c1ccncc1", tags: ["base", "solvent"],
    logP: { value: 0.65, source: "CRC-logP" }, pKas: [{ value: 5.23, kind: "base", source: "IUPAC-pKa G30" }], bpC: 115 },
  { key: "dmap", name: "4-(Dimethylamino)pyridine", smiles: "CN(C)c1ccncc1", synonyms: ["DMAP"], tags: ["base", "catalyst"],
    logP: { value: 1.34, source: "PhysProp" }, pKas: [{ value: 9.61, kind: "base", source: "IUPAC-pKa C34" }] },
  { key: "imidazole", name: "Imidazole", smiles: "c1c[nH]cn1", tags: ["base", "byproduct"],
    logP: { value: -0.08, source: "PhysProp" }, pKas: [{ value: 6.99, kind: "base", source: "IUPAC-pKa D2" }] },
  { key: "piperidine", name: "Piperidine", smiles: "C1CCNCC1", tags: ["base", "reagent"],
    logP: { value: 0.84, source: "CRC-logP" }, pKas: [{ value: 11.12, kind: "base", source: "IUPAC-pKa B28" }], bpC: 106 },
  { key: "diethylamine", name: "Diethylamine", smiles: "CCNCC", tags: ["base", "reagent"],
    logP: { value: 0.58, source: "CRC-logP" }, pKas: [{ value: 10.98, kind: "base", source: "IUPAC-pKa (25 °C, Approx.)" }], bpC: 55 },
  { key: "aniline", name: "Aniline", smiles: "Nc1ccccc1", tags: ["base", "starting material"],
    logP: { value: 0.90, source: "CRC-logP" }, pKas: [{ value: 4.60, kind: "base", source: "IUPAC-pKa B65" }], bpC: 184 },
  { key: "4-nitroaniline", name: "4-Nitroaniline", smiles: "Nc1ccc(cc1)[N+](=O)[O-]", tags: ["base", "starting material"],
    logP: { value: 1.39, source: "PhysProp" }, pKas: [{ value: 1.02, kind: "base", source: "IUPAC-pKa B58" }] },
  { key: "2-6-dimethylaniline", name: "2,6-Dimethylaniline", smiles: "Cc1cccc(C)c1N", synonyms: ["2,6-xylidine"], tags: ["base", "starting material"],
    logP: { value: 1.84, source: "from memory" }, pKas: [{ value: 3.95, kind: "base", source: "from memory" }], bpC: 215 },
  { key: "lidocaine", name: "Lidocaine", smiles: "CCN(CC)CC(=O)Nc1c(C)cccc1C", tags: ["base", "product"],
    logP: { value: 2.44, source: "PhysProp" }, pKas: [{ value: 7.9, kind: "base", source: "lido" }] },
  { key: "glycine", name: "Glycine", smiles: "NCC(=O)O", tags: ["zwitterion"],
    logP: { value: -3.21, source: "PhysProp" },
    pKas: [{ value: 2.35, kind: "acid", source: "IUPAC-pKa K26" }, { value: 9.78, kind: "base", source: "IUPAC-pKa O11" }] },
  // Neutrals
  { key: "acetanilide", name: "Acetanilide", smiles: "CC(=O)Nc1ccccc1", tags: ["neutral", "product"],
    logP: { value: 1.16, source: "PhysProp" }, pKas: [] },
  { key: "benzophenone", name: "Benzophenone", smiles: "O=C(c1ccccc1)c1ccccc1", tags: ["neutral", "product"],
    logP: { value: 3.18, source: "CRC-logP" }, pKas: [] },
  { key: "acetophenone", name: "Acetophenone", smiles: "CC(=O)c1ccccc1", tags: ["neutral", "product"],
    logP: { value: 1.58, source: "PhysProp" }, pKas: [], bpC: 202 },
  { key: "naphthalene", name: "Naphthalene", smiles: "c1ccc2ccccc2c1", tags: ["neutral"],
    logP: { value: 3.30, source: "PhysProp" }, pKas: [], bpC: 218 },
  { key: "nitrobenzene", name: "Nitrobenzene", smiles: "[O-][N+](=O)c1ccccc1", tags: ["neutral"],
    logP: { value: 1.85, source: "CRC-logP" }, pKas: [], bpC: 211 },
  { key: "caffeine", name: "Caffeine", smiles: "Cn1cnc2c1c(=O)n(C)c(=O)n2C", tags: ["neutral", "polar"],
    logP: { value: -0.07, source: "PhysProp" }, pKas: [] },
  { key: "n-benzylbenzamide", name: "N-Benzylbenzamide", smiles: "O=C(NCc1ccccc1)c1ccccc1", tags: ["neutral", "product", "amide"],
    pKas: [] },
  { key: "ethyl-benzoate", name: "Ethyl benzoate", smiles: "CCOC(=O)c1ccccc1", tags: ["neutral", "product", "ester"],
    logP: { value: 2.64, source: "from memory" }, pKas: [], bpC: 212 },
  { key: "tppo", name: "Triphenylphosphine oxide", smiles: "O=P(c1ccccc1)(c1ccccc1)c1ccccc1", synonyms: ["TPPO", "Ph3PO"],
    tags: ["neutral", "byproduct"], logP: { value: 2.83, source: "from memory" }, pKas: [] },
  { key: "benzylamine", name: "Benzylamine", smiles: "NCc1ccccc1", tags: ["base", "starting material"],
    logP: { value: 1.09, source: "from memory" }, pKas: [{ value: 9.34, kind: "base", source: "from memory" }], bpC: 185 },
];
