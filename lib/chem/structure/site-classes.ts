/**
 * Ionizable-site classes: SMARTS patterns with a default pKa per class, taken from the parent compound of the class.
 * Order matters: an earlier class claims its atoms, so a later, more generic class cannot count them again
 * (an α-amino acid's carboxyl is not also a plain carboxylic acid; DMAP's ring nitrogen is its basic site, not the
 * dimethylamino group; an amide or sulfonamide N is never an amine; an aniline N is never an aliphatic amine).
 *
 * "base" values are the pKa of the conjugate acid (BH⁺). Every default is an estimate: `se` is wide on purpose
 * (±1 log unit, ±1.5 for heterogeneous classes) and a measured or literature value should replace it.
 *
 * Sources: [IUPAC] IUPAC Digitized pKa Dataset (github.com/IUPAC/Dissociation-Constants), which digitizes Perrin,
 * "Dissociation Constants of Organic Bases in Aqueous Solution" (1965, 1972) and Serjeant & Dempsey, "Ionisation
 * Constants of Organic Acids in Aqueous Solution" (1979); the reference code and its assessment follow.
 * "from memory" marks values not read in a retrieved source (handbook figures recalled; check before relying on them).
 */
export interface SiteClass {
  id: string;
  /** Shown to chemists as the site name. */
  label: string;
  kind: "acid" | "base";
  /** One or more SMARTS; atom `site` of each match carries the proton. */
  smarts: string[];
  site: number;
  pKa: number;
  se: number;
  source: string;
  /** Match positions this class takes for itself; default every N, O, S... of the match (never carbons). */
  claim?: number[];
  /** Several matches in one ring count once (diazines), or the second gets `second` (piperazine's two N). */
  perRing?: "one" | { pKa: number; source: string };
}

/** Nitrogen that is neither acylated, sulfonylated, on a heteroatom, on an aromatic ring, nor part of an enamine. */
const PLAIN_N = "!$(N-a);!$(N-C=[O,S,N]);!$(N-S(=O)=O);!$(N-P=O);!$(N-[#7,#8,#16]);!$(N-C#N);!$(N-C=C)";
const AMINE_N_OF_ANILINE = "!$(N-C=[O,S,N]);!$(N-S(=O)=O);!$(N-[#7,#8]);!$(N(-a)-a)";

export const SITE_CLASSES: readonly SiteClass[] = [
  { id: "sulfonic_acid", label: "sulfonic acid", kind: "acid", smarts: ["[SX4](=O)(=O)[OX2H1,OX1-]"], site: 3, pKa: -1.9, se: 1, source: "methanesulfonic acid ≈ −1.9 (from memory; Guthrie, Can. J. Chem. 1978, 56, 2342)" },
  { id: "acyl_sulfonamide", label: "acyl sulfonamide N–H", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3H1,NX2-]C=O"], site: 3, pKa: 4.5, se: 1, source: "N-acylsulfonamides ≈ 4–5 (from memory; carboxylic-acid isostere values in medicinal chemistry reviews)" },
  { id: "tetrazole", label: "tetrazole N–H", kind: "acid", smarts: ["[nH1,n-]1:n:n:n:c:1", "[nH1,n-]1:n:n:c:n:1"], site: 0, pKa: 4.9, se: 1, source: "1H-tetrazole 4.9 (from memory; CRC Handbook, dissociation constants of organic acids)" },
  { id: "amino_acid_carboxyl", label: "α-amino acid carboxyl", kind: "acid", smarts: ["[NX3+0,NX4+;!$(N-C=O);!$(N-a)][CX4][CX3](=O)[OX2H1,OX1-]"], site: 4, claim: [3, 4], pKa: 2.35, se: 1, source: "glycine 2.350 [IUPAC K26/O11, Reliable]" },
  { id: "aryl_carboxylic_acid", label: "carboxylic acid (aryl)", kind: "acid", smarts: ["[CX3](=O)([OX2H1,OX1-])a"], site: 2, pKa: 4.2, se: 1, source: "benzoic acid 4.204 [IUPAC B91/F18/K30, Reliable]" },
  { id: "carboxylic_acid", label: "carboxylic acid", kind: "acid", smarts: ["[CX3](=O)[OX2H1,OX1-]"], site: 2, pKa: 4.76, se: 1, source: "acetic acid 4.757 [IUPAC W29, Approximate]" },
  { id: "imide", label: "imide N–H", kind: "acid", smarts: ["[CX3](=O)[NX3H1,NX2-][CX3]=O"], site: 2, pKa: 9.0, se: 1, source: "midpoint of succinimide 9.6 and phthalimide 8.3 (from memory; CRC Handbook)" },
  { id: "aryl_sulfonamide", label: "sulfonamide N–H (N-aryl)", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3H1,NX2-]a"], site: 3, pKa: 8.0, se: 1.5, source: "N-aryl sulfonamides ≈ 6–9 (from memory; sulfa drugs and sulfonanilides)" },
  { id: "sulfonamide", label: "sulfonamide N–H", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3;H2,H1;!$(N-C=O)]"], site: 3, pKa: 10.1, se: 1, source: "benzenesulfonamide 10.1 (from memory; CRC Handbook)" },
  { id: "nitrophenol", label: "phenol (o- or p-nitro)", kind: "acid", smarts: ["[OX2H1,OX1-]c1ccc(cc1)[N+](=O)[O-]", "[OX2H1,OX1-]c:c[N+](=O)[O-]"], site: 0, pKa: 7.15, se: 1, source: "4-nitrophenol 7.15 [IUPAC A47 7.156 / F12 7.151, Reliable]" },
  { id: "phenol", label: "phenol", kind: "acid", smarts: ["[OX2H1,OX1-]c"], site: 0, pKa: 9.99, se: 1, source: "phenol 9.994 [IUPAC F12, Reliable]" },
  { id: "guanidine", label: "guanidine", kind: "base", smarts: [`[NX3;!$(N-C=O);!$(N-S(=O)=O)]C(=[$([NX2]),$([NX3+]);!$(N-C=O);!$(N-S(=O)=O);!$(N-[N+](=O)[O-]);!$(N-C#N)])[NX3;!$(N-C=O)]`], site: 2, pKa: 13.6, se: 1, source: "guanidine 13.6 (from memory; CRC Handbook)" },
  { id: "amidine", label: "amidine", kind: "base", smarts: ["[NX3;!$(N-C=O);!$(N-S(=O)=O)]-[CX3;!$(C=O)]=[$([NX2]),$([NX3+]);!$(N-C=O);!$(N-S(=O)=O);!$(N-O);!$(N-C#N)]"], site: 2, pKa: 12.4, se: 1, source: "acetamidine 12.4 [IUPAC S29, Uncertain]" },
  { id: "aminopyridine_4", label: "pyridine N (4-amino)", kind: "base", smarts: ["[nX2,nH1+]1ccc(-[NX3+0;!$(N-C=O);!$(N-S(=O)=O)])cc1"], site: 0, pKa: 9.61, se: 1, source: "4-dimethylaminopyridine 9.61 [IUPAC C34, Approximate]" },
  { id: "aminopyridine_2", label: "pyridine N (2-amino)", kind: "base", smarts: ["[nX2,nH1+]1c(-[NX3+0;!$(N-C=O);!$(N-S(=O)=O)])cccc1"], site: 0, pKa: 6.86, se: 1, source: "2-aminopyridine 6.86 (from memory; Perrin 1965)" },
  { id: "nitroaniline", label: "aniline N (o- or p-nitro)", kind: "base", smarts: [`[NX3+0;${AMINE_N_OF_ANILINE}]c1ccc(cc1)[N+](=O)[O-]`, `[NX3+0;${AMINE_N_OF_ANILINE}]c:c[N+](=O)[O-]`], site: 0, pKa: 1.02, se: 1, source: "4-nitroaniline 1.02 [IUPAC B58, Reliable]" },
  { id: "aniline", label: "aniline N", kind: "base", smarts: [`[NX3+0;${AMINE_N_OF_ANILINE};!$(N-a:n)]-c`, "[NX4+;H1,H2,H3]-c"], site: 0, pKa: 4.6, se: 1, source: "aniline 4.60 [IUPAC B65/B66/P11/B56, Reliable]" },
  { id: "imidazole", label: "imidazole N", kind: "base", smarts: ["[nX2,nX3+;r5]1:c:[nX3;r5]:[c;!$(c:c=O)]:[c;!$(c:c=O)]:1"], site: 0, pKa: 6.99, se: 1, source: "imidazole 6.993 [IUPAC D2, Reliable]" },
  { id: "pyridine", label: "pyridine N", kind: "base", smarts: ["[nX2,nH1+;r6;!$(n:n);!$(n:c:n);!$(n:c:c:n);!$(n:c=O);!$(n:c:c=O)]"], site: 0, pKa: 5.23, se: 1, source: "pyridine 5.229 [IUPAC G30, Reliable]" },
  { id: "diazine", label: "diazine N (pyrimidine, pyrazine, pyridazine)", kind: "base", smarts: ["[nX2;r6;$(n:n),$(n:c:n),$(n:c:c:n);!$(n:c=O)]"], site: 0, pKa: 1.3, se: 1, source: "pyrimidine 1.3, pyrazine 0.65, pyridazine 2.3 (from memory; Perrin 1965)", perRing: "one" },
  { id: "azole", label: "azole N (thiazole, pyrazole)", kind: "base", smarts: ["[nX2;r5;$(n1:c:s:c:c:1),$(n1:[nX3]:c:c:c:1)]"], site: 0, pKa: 2.5, se: 1, source: "thiazole 2.5, pyrazole 2.5 (from memory; Perrin 1965)" },
  { id: "alpha_aminonitrile", label: "amine α to a nitrile", kind: "base", smarts: [`[NX3+0;${PLAIN_N}]-[CX4]-C#N`], site: 0, pKa: 5.34, se: 1, source: "aminoacetonitrile 5.34 [IUPAC S75, Approximate]" },
  { id: "alpha_aminocarbonyl", label: "amine α to an amide or ester", kind: "base", smarts: [`[NX3+0;${PLAIN_N}]-[CX4]-C(=O)[#7,$(O[#6])]`], site: 0, pKa: 7.9, se: 1, source: "lidocaine 7.9 (Bekhit, 'Lidocaine for neural blockade', Cambridge University Press); glycinamide 7.95 [IUPAC D11, Approximate]" },
  { id: "morpholine_nh", label: "morpholine N–H", kind: "base", smarts: [`[NX3+0;H1;${PLAIN_N};$(N1CCOCC1)]`], site: 0, pKa: 8.4, se: 1, source: "morpholine 8.4 (from memory; Perrin 1965)" },
  { id: "morpholine_n_alkyl", label: "morpholine N (N-alkyl)", kind: "base", smarts: [`[NX3+0;H0;${PLAIN_N};$(N1CCOCC1)]`], site: 0, pKa: 7.4, se: 1, source: "N-methylmorpholine 7.4 (from memory; Perrin 1965)" },
  { id: "piperazine", label: "piperazine N", kind: "base", smarts: [`[NX3+0;${PLAIN_N};$(N1CCNCC1)]`], site: 0, pKa: 9.0, se: 1, source: "1-methylpiperazine ≈ 9.0, piperazine 9.73 (from memory; Perrin 1965)", perRing: { pKa: 5.35, source: "piperazine second protonation 5.35 (from memory; Perrin 1965)" } },
  { id: "primary_amine", label: "aliphatic amine (primary)", kind: "base", smarts: [`[NX3+0;H2;${PLAIN_N}]-[CX4]`, "[NX4+;H3]-[CX4]"], site: 0, pKa: 10.66, se: 1, source: "methylamine 10.657 [IUPAC H31, Reliable]" },
  { id: "secondary_amine", label: "aliphatic amine (secondary)", kind: "base", smarts: [`[NX3+0;H1;${PLAIN_N}](-[CX4])-[CX4]`, "[NX4+;H2](-[CX4])-[CX4]"], site: 0, pKa: 10.73, se: 1, source: "dimethylamine 10.732 [IUPAC H31, Reliable]" },
  { id: "tertiary_amine", label: "aliphatic amine (tertiary)", kind: "base", smarts: [`[NX3+0;H0;${PLAIN_N}](-[CX4])(-[CX4])-[CX4]`, "[NX4+;H1](-[CX4])(-[CX4])-[CX4]"], site: 0, pKa: 9.81, se: 1, source: "trimethylamine 9.81 [IUPAC M15, Reliable]" },
];
