// Real molecules for the search tests, written as SMILES lines "SMILES name" (structures: common practice; names are
// the usual trivial names). Tags are ours.
export const GROUP_A_SMILES = `
OC(=O)c1ccccc1 benzoic acid
OC(=O)c1ccc(Cl)cc1 4-chlorobenzoic acid
OC(=O)Cc1ccccc1 phenylacetic acid
CC(C)Cc1ccc(cc1)C(C)C(=O)O ibuprofen
COc1ccc2cc(ccc2c1)C(C)C(=O)O naproxen
Oc1ccccc1 phenol
Oc1ccc(cc1)[N+](=O)[O-] 4-nitrophenol
Nc1ccccc1 aniline
CC(=O)Nc1ccccc1 acetanilide
CC(=O)Nc1ccc(O)cc1 paracetamol
NCc1ccccc1 benzylamine
O=C(NCc1ccccc1)c1ccccc1 N-benzylbenzamide
CCN(CC)CC triethylamine
CCNCC diethylamine
CCN(CC)CC(=O)Nc1c(C)cccc1C lidocaine
Cc1cccc(C)c1N 2,6-dimethylaniline
c1ccncc1 pyridine
CN(C)c1ccncc1 4-dimethylaminopyridine
c1c[nH]cn1 imidazole
C1COCCN1 morpholine
CN1CCOCC1 N-methylmorpholine
C1CNCCN1 piperazine
Cn1cnc2c1c(=O)n(C)c(=O)n2C caffeine
CCOC(C)=O ethyl acetate
Cc1ccccc1 toluene
c1ccc2ccccc2c1 naphthalene
O=Cc1ccccc1 benzaldehyde
OC(=O)c1ccccc1O salicylic acid
CC(=O)Oc1ccccc1C(=O)O aspirin
COC(=O)c1ccccc1 methyl benzoate
CC(C)(C)OC(N)=O tert-butyl carbamate
Nc1ccc(cc1)S(N)(=O)=O sulfanilamide
NCC(=O)O glycine
`;

export const GROUP_B_SMILES = `
CC(=O)Oc1ccccc1C(=O)O aspirin (other group)
CC(C)(C)c1ccc(O)cc1 4-tert-butylphenol
OC1CCCCC1 cyclohexanol
CCN(CC)CC(=O)Nc1c(C)cccc1CC lidocaine homologue
`;

/** Similarity queries, none of them registered. */
export const SIMILARITY_QUERIES = ["CC(=O)Nc1ccc(OC)cc1", "OC(=O)c1ccc(C)cc1", "CCN(CC)CC(=O)Nc1ccccc1", "c1ccc2ncccc2c1", "CCO"];

/** Substructure queries as [text, "smiles" | "smarts"]. */
export const SUBSTRUCTURE_QUERIES: [string, "smiles" | "smarts"][] = [
  ["c1ccccc1", "smiles"],
  ["C(=O)O", "smiles"],
  ["NC(=O)", "smiles"],
  ["[OX2H]c", "smarts"],
  ["[NX3;H2,H1;!$(NC=O)]", "smarts"],
  ["[#7;R]", "smarts"],
];
