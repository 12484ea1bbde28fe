/**
 * Measured Abraham solute descriptors for common workup compounds, keyed by RDKit canonical SMILES (the identity
 * a registered compound carries), so the engine can look them up without RDKit.
 *  - E, S, A, B: Bradley, Acree & Lang 2014 (source key "Bradley-2014"; the median where the compilation lists
 *    several entries). N-methyl-2-pyrrolidone's are from memory.
 *  - V: McGowan volume computed exactly from the structure (Abraham & McGowan 1987; lib/chem/structure/mcgowan.ts),
 *    which also corrects a few compilation entries (styrene, fluorobenzene, 2-chlorobiphenyl, hexachlorobenzene).
 *  - L (log gas–hexadecane partition): Abraham et al. 1994 where listed, else from memory as marked; needed only
 *    for the gas→solvent equations of Chung et al. 2022.
 *  - Further rows at the end: Abraham et al. 1994 or Abraham's database as published with RMG-database (see there).
 * Left out on purpose: caffeine and acetanilide, whose compiled entries disagree by more than 2 units in S.
 * A test (tests/unit/structure/abraham.test.ts) checks every key is canonical and every V exact.
 */
export interface AbrahamDescriptors {
  E: number;
  S: number;
  A: number;
  B: number;
  /** McGowan volume, (cm³/mol)/100. */
  V: number;
  /** log L16, gas–hexadecane partition at 298 K; optional. */
  L?: number;
}

export interface MeasuredDescriptors extends AbrahamDescriptors {
  name: string;
  /** "literature" for published measurements; "estimated" for the rows from memory. */
  provenance: "literature" | "estimated";
  source: string;
  lSource?: string;
}

export const MEASURED_DESCRIPTORS: ReadonlyMap<string, MeasuredDescriptors> = new Map<string, MeasuredDescriptors>([
  ["Nc1ccccc1", { name: "aniline", E: 0.955, S: 0.96, A: 0.26, B: 0.41, V: 0.8162, provenance: "literature", source: "Bradley-2014" }],
  ["Cc1ccccc1N", { name: "o-toluidine", E: 0.966, S: 0.92, A: 0.23, B: 0.45, V: 0.9571, provenance: "literature", source: "Bradley-2014" }],
  ["O=Cc1ccccc1", { name: "benzaldehyde", E: 0.82, S: 1, A: 0, B: 0.39, V: 0.873, provenance: "literature", source: "Bradley-2014" }],
  ["CC(=O)c1ccccc1", { name: "acetophenone", E: 0.818, S: 1.01, A: 0, B: 0.48, V: 1.0139, provenance: "literature", source: "Bradley-2014" }],
  ["COc1ccccc1", { name: "anisole", E: 0.708, S: 0.75, A: 0, B: 0.29, V: 0.916, provenance: "literature", source: "Bradley-2014" }],
  ["c1ccccc1", { name: "benzene", E: 0.61, S: 0.52, A: 0, B: 0.14, V: 0.7164, provenance: "literature", source: "Bradley-2014" }],
  ["Cc1ccccc1", { name: "toluene", E: 0.601, S: 0.52, A: 0, B: 0.14, V: 0.8573, provenance: "literature", source: "Bradley-2014" }],
  ["C=Cc1ccccc1", { name: "styrene", E: 0.849, S: 0.65, A: 0, B: 0.16, V: 0.9552, provenance: "literature", source: "Bradley-2014" }],
  ["O=C(O)c1ccccc1", { name: "benzoic acid", E: 0.8255, S: 0.88, A: 0.4525, B: 0.408, V: 0.9317, provenance: "literature", source: "Bradley-2014" }],
  ["O=C(O)Cc1ccccc1", { name: "phenylacetic acid", E: 0.8245, S: 0.981, A: 0.4395, B: 0.611, V: 1.0726, provenance: "literature", source: "Bradley-2014" }],
  ["O=[N+]([O-])c1ccccc1", { name: "nitrobenzene", E: 0.871, S: 1.11, A: 0, B: 0.28, V: 0.8906, provenance: "literature", source: "Bradley-2014" }],
  ["CCc1ccccc1", { name: "ethylbenzene", E: 0.613, S: 0.51, A: 0, B: 0.15, V: 0.9982, provenance: "literature", source: "Bradley-2014" }],
  ["CCCc1ccccc1", { name: "n-propylbenzene", E: 0.604, S: 0.5, A: 0, B: 0.15, V: 1.1391, provenance: "literature", source: "Bradley-2014" }],
  ["Cc1cc(C)cc(C)c1", { name: "1,3,5-trimethylbenzene", E: 0.649, S: 0.52, A: 0, B: 0.19, V: 1.1391, provenance: "literature", source: "Bradley-2014" }],
  ["CC(C)(C)c1ccccc1", { name: "tert-butylbenzene", E: 0.619, S: 0.49, A: 0, B: 0.18, V: 1.28, provenance: "literature", source: "Bradley-2014" }],
  ["Fc1ccccc1", { name: "fluorobenzene", E: 0.477, S: 0.57, A: 0, B: 0.1, V: 0.7341, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccccc1", { name: "chlorobenzene", E: 0.718, S: 0.65, A: 0, B: 0.07, V: 0.8388, provenance: "literature", source: "Bradley-2014" }],
  ["Brc1ccccc1", { name: "bromobenzene", E: 0.882, S: 0.73, A: 0, B: 0.09, V: 0.8914, provenance: "literature", source: "Bradley-2014" }],
  ["Ic1ccccc1", { name: "iodobenzene", E: 1.188, S: 0.82, A: 0, B: 0.12, V: 0.9746, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccccc1Cl", { name: "1,2-dichlorobenzene", E: 0.872, S: 0.78, A: 0, B: 0.04, V: 0.9612, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1cccc(Cl)c1", { name: "1,3-dichlorobenzene", E: 0.847, S: 0.73, A: 0, B: 0.02, V: 0.9612, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccc(Cl)cc1", { name: "1,4-dichlorobenzene", E: 0.825, S: 0.75, A: 0, B: 0.02, V: 0.9612, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccc(Cl)c(Cl)c1", { name: "1,2,4-trichlorobenzene", E: 0.98, S: 0.81, A: 0, B: 0, V: 1.0836, provenance: "literature", source: "Bradley-2014" }],
  ["c1ccc(-c2ccccc2)cc1", { name: "biphenyl", E: 1.36, S: 0.99, A: 0, B: 0.26, V: 1.3242, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccccc1-c1ccccc1", { name: "2-chlorobiphenyl", E: 1.485, S: 1.05, A: 0, B: 0.1825, V: 1.4466, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccccc1-c1ccccc1Cl", { name: "2,2'-dichlorobiphenyl", E: 1.62, S: 1.135, A: 0, B: 0.155, V: 1.569, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccc(-c2ccccc2Cl)cc1", { name: "2,4'-dichlorobiphenyl", E: 1.62, S: 1.195, A: 0, B: 0.145, V: 1.569, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccc(-c2ccc(Cl)cc2Cl)cc1", { name: "2,4,4'-trichlorobiphenyl", E: 1.755, S: 1.34, A: 0, B: 0.1025, V: 1.6914, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1c(Cl)c(Cl)c(Cl)c(Cl)c1Cl", { name: "hexachlorobenzene", E: 1.4975, S: 0.889, A: 0, B: 0.0985, V: 1.4508, provenance: "literature", source: "Bradley-2014" }],
  ["Clc1ccc(C(c2ccc(Cl)cc2)C(Cl)(Cl)Cl)cc1", { name: "p,p'-DDT", E: 1.805, S: 1.76, A: 0, B: 0.16, V: 2.218, provenance: "literature", source: "Bradley-2014" }],
  ["Oc1ccccc1", { name: "phenol", E: 0.805, S: 0.89, A: 0.6, B: 0.3, V: 0.7751, provenance: "literature", source: "Bradley-2014" }],
  ["Cc1ccc(O)cc1", { name: "p-cresol", E: 0.82, S: 0.87, A: 0.57, B: 0.31, V: 0.916, provenance: "literature", source: "Bradley-2014" }],
  ["O=[N+]([O-])c1ccc(O)cc1", { name: "4-nitrophenol", E: 1.07, S: 1.72, A: 0.82, B: 0.26, V: 0.9493, provenance: "literature", source: "Bradley-2014" }],
  ["Oc1ccc2ccccc2c1", { name: "2-naphthol", E: 1.559, S: 1.056, A: 0.581, B: 0.417, V: 1.1441, provenance: "literature", source: "Bradley-2014" }],
  ["Nc1ccc([N+](=O)[O-])cc1", { name: "4-nitroaniline", E: 1.22, S: 1.92, A: 0.46, B: 0.35, V: 0.9904, provenance: "literature", source: "Bradley-2014" }],
  ["CN(C)c1ccccc1", { name: "N,N-dimethylaniline", E: 0.957, S: 0.81, A: 0, B: 0.41, V: 1.098, provenance: "literature", source: "Bradley-2014" }],
  ["c1ccncc1", { name: "pyridine", E: 0.631, S: 0.84, A: 0, B: 0.52, V: 0.6753, provenance: "literature", source: "Bradley-2014" }],
  ["c1c[nH]cn1", { name: "imidazole", E: 0.71, S: 0.85, A: 0.42, B: 0.78, V: 0.5363, provenance: "literature", source: "Bradley-2014" }],
  ["CCN(CC)CC", { name: "triethylamine", E: 0.101, S: 0.15, A: 0, B: 0.79, V: 1.0538, provenance: "literature", source: "Bradley-2014" }],
  ["CCNCC", { name: "diethylamine", E: 0.154, S: 0.3, A: 0.08, B: 0.69, V: 0.772, provenance: "literature", source: "Bradley-2014" }],
  ["C1CCNCC1", { name: "piperidine", E: 0.422, S: 0.43, A: 0.08, B: 0.73, V: 0.8043, provenance: "literature", source: "Bradley-2014" }],
  ["CCN(CC)CC(=O)Nc1c(C)cccc1C", { name: "lidocaine", E: 1.1, S: 1.47, A: 0.06, B: 1.24, V: 2.0589, provenance: "literature", source: "Bradley-2014" }],
  ["c1ccc2ccccc2c1", { name: "naphthalene", E: 1.34, S: 0.92, A: 0, B: 0.2, V: 1.0854, provenance: "literature", source: "Bradley-2014" }],
  ["O=C(c1ccccc1)c1ccccc1", { name: "benzophenone", E: 1.3675, S: 1.5545, A: 0, B: 0.436, V: 1.4808, provenance: "literature", source: "Bradley-2014" }],
  ["OCc1ccccc1", { name: "benzyl alcohol", E: 0.803, S: 0.8705, A: 0.4, B: 0.559, V: 0.916, provenance: "literature", source: "Bradley-2014" }],
  ["COC(=O)c1ccccc1", { name: "methyl benzoate", E: 0.733, S: 0.85, A: 0, B: 0.46, V: 1.0726, provenance: "literature", source: "Bradley-2014" }],
  ["N#Cc1ccccc1", { name: "benzonitrile", E: 0.742, S: 1.11, A: 0, B: 0.33, V: 0.8711, provenance: "literature", source: "Bradley-2014" }],
  ["CC(=O)O", { name: "acetic acid", E: 0.265, S: 0.64, A: 0.62, B: 0.44, V: 0.4648, L: 1.75, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["CC(C)Cc1ccc(C(C)C(=O)O)cc1", { name: "ibuprofen", E: 0.8075, S: 0.6955, A: 0.395, B: 0.7935, V: 1.7771, provenance: "literature", source: "Bradley-2014" }],
  ["CN(C)C=O", { name: "N,N-dimethylformamide", E: 0.367, S: 1.31, A: 0, B: 0.74, V: 0.6468, L: 3.173, lSource: "memory", provenance: "literature", source: "Bradley-2014" }],
  ["CC(=O)N(C)C", { name: "N,N-dimethylacetamide", E: 0.363, S: 1.38, A: 0, B: 0.8, V: 0.7877, L: 3.717, lSource: "memory", provenance: "literature", source: "Bradley-2014" }],
  ["CS(C)=O", { name: "dimethyl sulfoxide", E: 0.522, S: 1.73, A: 0, B: 0.925, V: 0.6126, L: 3.459, lSource: "memory", provenance: "literature", source: "Bradley-2014" }],
  ["CC#N", { name: "acetonitrile", E: 0.237, S: 0.9, A: 0.07, B: 0.32, V: 0.4042, L: 1.739, lSource: "memory", provenance: "literature", source: "Bradley-2014" }],
  ["C1CCOC1", { name: "tetrahydrofuran", E: 0.289, S: 0.52, A: 0, B: 0.48, V: 0.6223, L: 2.636, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["C1COCCO1", { name: "1,4-dioxane", E: 0.329, S: 0.75, A: 0, B: 0.64, V: 0.681, L: 2.892, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["CO", { name: "methanol", E: 0.278, S: 0.44, A: 0.43, B: 0.47, V: 0.3082, L: 0.97, lSource: "memory", provenance: "literature", source: "Bradley-2014" }],
  ["CCO", { name: "ethanol", E: 0.246, S: 0.42, A: 0.37, B: 0.48, V: 0.4491, L: 1.485, lSource: "memory", provenance: "literature", source: "Bradley-2014" }],
  ["CC(C)O", { name: "2-propanol", E: 0.212, S: 0.36, A: 0.33, B: 0.56, V: 0.59, L: 1.764, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["CC(C)=O", { name: "acetone", E: 0.179, S: 0.7, A: 0.04, B: 0.49, V: 0.547, L: 1.696, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["CCOC(C)=O", { name: "ethyl acetate", E: 0.106, S: 0.62, A: 0, B: 0.45, V: 0.7466, L: 2.314, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["CCOCC", { name: "diethyl ether", E: 0.041, S: 0.25, A: 0, B: 0.45, V: 0.7309, L: 2.015, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["COC(C)(C)C", { name: "tert-butyl methyl ether", E: 0.024, S: 0.22, A: 0, B: 0.55, V: 0.8718, provenance: "literature", source: "Bradley-2014" }],
  ["CC1CCCO1", { name: "2-methyltetrahydrofuran", E: 0.241, S: 0.48, A: 0, B: 0.53, V: 0.7632, L: 2.82, lSource: "Abraham-1994", provenance: "literature", source: "Bradley-2014" }],
  ["CN1CCCC1=O", { name: "N-methyl-2-pyrrolidone", E: 0.491, S: 1.5, A: 0, B: 0.95, V: 0.82, provenance: "estimated", source: "memory" }],
  // Descriptors (with L) of further solutes in the partition validation set (bench/data/partition-measured.csv):
  // Abraham, Chadha, Whiting & Mitchell, J. Chem. Soc. Perkin Trans. 2 1994, 1777 ("Abraham-1994"), or Abraham's
  // own database ("Abraham-inhouse"), both as published in RMG-database input/solvation/libraries/solute.py; V exact.
  ["CCCCCCCC", { name: "n-octane", E: 0, S: 0, A: 0, B: 0, V: 1.2358, L: 3.677, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCC(=O)O", { name: "propanoic acid", E: 0.233, S: 0.65, A: 0.6, B: 0.45, V: 0.6057, L: 2.29, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCCCO", { name: "hexan-1-ol", E: 0.21, S: 0.42, A: 0.37, B: 0.48, V: 1.0127, L: 3.61, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCCO", { name: "pentan-1-ol", E: 0.219, S: 0.42, A: 0.37, B: 0.48, V: 0.8718, L: 3.106, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCO", { name: "butan-1-ol", E: 0.224, S: 0.42, A: 0.37, B: 0.48, V: 0.7309, L: 2.601, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCO", { name: "propan-1-ol", E: 0.236, S: 0.42, A: 0.37, B: 0.48, V: 0.59, L: 2.031, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCC(=O)O", { name: "butanoic acid", E: 0.21, S: 0.62, A: 0.6, B: 0.45, V: 0.7466, L: 2.83, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["ClCCl", { name: "dichloromethane", E: 0.387, S: 0.58, A: 0.12, B: 0.05, V: 0.4943, L: 1.818, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["CCC(C)=O", { name: "butanone", E: 0.166, S: 0.7, A: 0, B: 0.51, V: 0.6879, L: 2.287, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["COC(C)=O", { name: "methyl acetate", E: 0.142, S: 0.64, A: 0, B: 0.45, V: 0.6057, L: 1.911, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCOC(C)=O", { name: "n-butyl acetate", E: 0.071, S: 0.6, A: 0, B: 0.45, V: 1.0284, L: 3.353, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCOC(C)=O", { name: "n-propyl acetate", E: 0.092, S: 0.6, A: 0, B: 0.4, V: 0.8875, L: 2.819, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCC(=O)OC", { name: "methyl pentanoate", E: 0.108, S: 0.6, A: 0, B: 0.45, V: 1.0284, L: 3.392, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCN", { name: "ethylamine", E: 0.236, S: 0.35, A: 0.16, B: 0.61, V: 0.4902, L: 1.677, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["CCC(=O)OC", { name: "methyl propanoate", E: 0.128, S: 0.6, A: 0, B: 0.45, V: 0.7466, L: 2.431, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCCOC(C)=O", { name: "n-pentyl acetate", E: 0.067, S: 0.6, A: 0, B: 0.45, V: 1.1693, L: 3.844, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCCC(=O)OC", { name: "methyl hexanoate", E: 0.08, S: 0.6, A: 0, B: 0.45, V: 1.1693, L: 3.874, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCC(=O)O", { name: "pentanoic acid", E: 0.205, S: 0.6, A: 0.6, B: 0.45, V: 0.8875, L: 3.38, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCCC(=O)O", { name: "hexanoic acid", E: 0.174, S: 0.6, A: 0.6, B: 0.45, V: 1.0284, L: 3.92, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CN", { name: "methylamine", E: 0.25, S: 0.35, A: 0.16, B: 0.58, V: 0.3493, L: 1.3, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["CNC", { name: "dimethylamine", E: 0.189, S: 0.3, A: 0.08, B: 0.66, V: 0.4902, L: 1.6, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["CC(C)(C)O", { name: "2-methylpropan-2-ol", E: 0.18, S: 0.3, A: 0.31, B: 0.6, V: 0.7309, L: 1.963, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["C1CCCCC1", { name: "cyclohexane", E: 0.305, S: 0.1, A: 0, B: 0, V: 0.8454, L: 2.964, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["C1CCOCC1", { name: "tetrahydropyran", E: 0.275, S: 0.47, A: 0, B: 0.55, V: 0.7632, L: 3.057, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["OCC(F)(F)F", { name: "2,2,2-trifluoroethanol", E: 0.015, S: 0.6, A: 0.57, B: 0.25, V: 0.5022, L: 1.224, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["FC(Cl)(Cl)Cl", { name: "fluorotrichloromethane", E: 0.318, S: 0.23, A: 0, B: 0.05, V: 0.6344, L: 1.9168, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["CC=O", { name: "acetaldehyde", E: 0.208, S: 0.67, A: 0, B: 0.45, V: 0.4061, L: 1.23, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CC(C)OC(C)C", { name: "diisopropyl ether", E: 0, S: 0.19, A: 0, B: 0.45, V: 1.0127, L: 2.482, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["FC(F)(Cl)Cl", { name: "difluorodichloromethane", E: 0.071, S: 0.09, A: 0, B: 0.02, V: 0.5297, L: 1.112, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["CCC=O", { name: "propionaldehyde", E: 0.196, S: 0.65, A: 0, B: 0.45, V: 0.547, L: 1.815, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CI", { name: "iodomethane", E: 0.676, S: 0.43, A: 0, B: 0.12, V: 0.5077, L: 2.106, lSource: "Abraham-inhouse", provenance: "literature", source: "Abraham-inhouse" }],
  ["CCCCC(C)=O", { name: "hexan-2-one", E: 0.136, S: 0.68, A: 0, B: 0.51, V: 0.9697, L: 3.262, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCC(C)=O", { name: "pentan-2-one", E: 0.143, S: 0.68, A: 0, B: 0.51, V: 0.8288, L: 2.755, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCCC(C)=O", { name: "heptan-2-one", E: 0.123, S: 0.68, A: 0, B: 0.51, V: 1.1106, L: 3.76, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
  ["CCCCCC", { name: "n-hexane", E: 0, S: 0, A: 0, B: 0, V: 0.954, L: 2.668, lSource: "Abraham-1994", provenance: "literature", source: "Abraham-1994" }],
]);

/** Canonical SMILES of the library's solvents, so a water-miscible solvent can be treated as a solute. */
export const SOLVENT_SMILES: Readonly<Record<string, string>> = {
  water: "O", etoac: "CCOC(C)=O", et2o: "CCOCC", mtbe: "COC(C)(C)C", "2-methf": "CC1CCCO1", thf: "C1CCOC1", dioxane: "C1COCCO1",
  meoh: "CO", etoh: "CCO", ipa: "CC(C)O", mecn: "CC#N", acetone: "CC(C)=O", dmf: "CN(C)C=O", dmac: "CC(=O)N(C)C",
  nmp: "CN1CCCC1=O", dmso: "CS(C)=O",
};
