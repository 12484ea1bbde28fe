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
  /**
   * How the value is refined from the structure (pka-estimate.ts): a Hammett family for ring-bound sites, Taft σ*
   * for aliphatic acids and amines; absent: the class value as it stands. `pKa` stays the parent compound's value.
   */
  method?: PKaMethod;
  /** A second proton on the same group (phosphonic acid's second OH): match position and its value. */
  second?: { site: number; pKa: number; source: string };
}

export type PKaMethod = "benzoic" | "phenol" | "aniline" | "pyridine" | "sulfonamide" | "boronic" | "taft_acid" | "taft_amine" | "imidazole";

/** Nitrogen that is neither acylated, sulfonylated, on a heteroatom, on an aromatic ring, nor part of an enamine. */
const PLAIN_N = "!$(N-a);!$(N-C=[O,S,N]);!$(N-S(=O)=O);!$(N-P=O);!$(N-[#7,#8,#16]);!$(N-C#N);!$(N-C=C)";
const AMINE_N_OF_ANILINE = "!$(N-C=[O,S,N]);!$(N-S(=O)=O);!$(N-[#7,#8]);!$(N(-a)-a)";

const ACID_O = "[OX2H1,OX1-]";

export const SITE_CLASSES: readonly SiteClass[] = [
  { id: "sulfonic_acid", label: "sulfonic acid", kind: "acid", smarts: [`[SX4](=O)(=O)${ACID_O}`], site: 3, pKa: -1.9, se: 1, source: "methanesulfonic acid ≈ −1.9 (from memory; Guthrie, Can. J. Chem. 1978, 56, 2342)" },
  { id: "phosphonic_acid", label: "phosphonic acid", kind: "acid", smarts: [`[PX4](=O)(${ACID_O})(${ACID_O})[#6]`], site: 2, claim: [0, 2, 3], pKa: 2.2, se: 1, source: "methylphosphonic acid 2.38, phenylphosphonic acid 1.83 (from memory; CRC Handbook, dissociation constants of organic acids)", second: { site: 3, pKa: 7.4, source: "methylphosphonic acid 7.74, phenylphosphonic acid 7.07, second proton (from memory; CRC Handbook)" } },
  { id: "saccharin", label: "acyl sulfonamide N–H (cyclic, saccharin-type)", kind: "acid", smarts: ["[SX4]1(=O)(=O)[NX3H1,NX2-]C(=O)c2ccccc12"], site: 3, pKa: 1.6, se: 1, source: "saccharin 1.6 (from memory; CRC Handbook)" },
  { id: "acyl_sulfonamide", label: "acyl sulfonamide N–H", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3H1,NX2-]C=O"], site: 3, pKa: 4.5, se: 1, source: "N-acylsulfonamides ≈ 4–5 (from memory; carboxylic-acid isostere values in medicinal chemistry reviews)" },
  { id: "tetrazole", label: "tetrazole N–H", kind: "acid", smarts: ["[nH1,n-]1:n:n:n:c:1", "[nH1,n-]1:n:n:c:n:1"], site: 0, pKa: 4.9, se: 1, source: "1H-tetrazole 4.90; 5-phenyltetrazole 4.5, 5-methyltetrazole 5.5 (from memory; CRC Handbook)" },
  { id: "hoat", label: "N-hydroxy azole O–H (HOAt)", kind: "acid", smarts: [`${ACID_O}n1nnc2cccnc12`, `${ACID_O}n1nnc2ncccc12`], site: 0, claim: [0, 1], pKa: 3.28, se: 1, source: "1-hydroxy-7-azabenzotriazole 3.28 (from memory; Carpino, J. Am. Chem. Soc. 1993, 115, 4397)" },
  { id: "n_hydroxy_azole", label: "N-hydroxy azole O–H (HOBt-type)", kind: "acid", smarts: [`${ACID_O}[n;r5]`], site: 0, claim: [0, 1], pKa: 4.6, se: 1, source: "1-hydroxybenzotriazole 4.60 (from memory; Carpino, J. Am. Chem. Soc. 1993, 115, 4397)" },
  { id: "n_hydroxy_imide", label: "N-hydroxy imide O–H (NHS-type)", kind: "acid", smarts: [`${ACID_O}N(C=O)C=O`], site: 0, claim: [0, 1], pKa: 6.0, se: 1, source: "N-hydroxysuccinimide 6.0, N-hydroxyphthalimide 6.3 (from memory; CRC Handbook)" },
  { id: "hydroxamic_acid", label: "hydroxamic acid O–H", kind: "acid", smarts: [`${ACID_O}[NX3]C=O`], site: 0, claim: [0, 1], pKa: 8.9, se: 1, source: "acetohydroxamic acid 8.88, benzohydroxamic acid 8.8 (from memory; CRC Handbook)" },
  { id: "amino_acid_carboxyl", label: "α-amino acid carboxyl", kind: "acid", smarts: [`[NX3+0,NX4+;!$(N-C=O);!$(N-a)][CX4][CX3](=O)${ACID_O}`], site: 4, claim: [3, 4], pKa: 2.35, se: 1, source: "glycine 2.350 [IUPAC K26/O11, Reliable]" },
  { id: "amino_acid_amine", label: "α-amino acid amine", kind: "base", smarts: [`[NX3+0,NX4+;H1,H2,H3;!$(N-C=O);!$(N-a)][CX4][CX3](=O)${ACID_O}`], site: 0, claim: [0], pKa: 9.7, se: 1, source: "glycine 9.78 [IUPAC K26/O11, Reliable]; alanine 9.87, valine 9.72, leucine 9.74 (from memory; CRC Handbook)" },
  { id: "aryl_carboxylic_acid", label: "carboxylic acid (aryl)", kind: "acid", smarts: [`[CX3](=O)(${ACID_O})a`], site: 2, pKa: 4.2, se: 1, source: "benzoic acid 4.204 [IUPAC B91/F18/K30, Reliable]; ring substituents by Hammett σ (Perrin, Dempsey & Serjeant 1981, ρ 1.00)", method: "benzoic" },
  { id: "perfluoro_acid", label: "perfluoroalkanoic acid", kind: "acid", smarts: [`[CX3](=O)(${ACID_O})C(F)(F)`], site: 2, pKa: 4.76, se: 1, source: "acetic acid 4.757 [IUPAC W29] corrected by Taft σ* (Perrin, Dempsey & Serjeant 1981, ρ* 1.62); trifluoroacetic acid ≈ 0.5 (from memory; CRC Handbook)", method: "taft_acid" },
  { id: "carboxylic_acid", label: "carboxylic acid", kind: "acid", smarts: [`[CX3](=O)${ACID_O}`], site: 2, pKa: 4.76, se: 1, source: "acetic acid 4.757 [IUPAC W29, Approximate] corrected by Taft σ* (Perrin, Dempsey & Serjeant 1981, ρ* 1.62)", method: "taft_acid" },
  { id: "meldrum", label: "Meldrum's acid C–H", kind: "acid", smarts: ["[CX4;H1,H2]1C(=O)O[CX4]OC1=O"], site: 0, claim: [0], pKa: 4.83, se: 1, source: "Meldrum's acid 4.83 (from memory; Pihlaja & Seilo, Acta Chem. Scand. 1969)" },
  { id: "barbituric", label: "barbituric acid C–H", kind: "acid", smarts: ["[CX4;H1,H2]1C(=O)NC(=O)NC1=O"], site: 0, claim: [0], pKa: 4.01, se: 1, source: "barbituric acid 4.01 (from memory; CRC Handbook)" },
  { id: "cyclic_dione", label: "1,3-dione C–H (cyclic)", kind: "acid", smarts: ["[CX4;H1,H2;R]([CX3;R](=O)[#6])[CX3;R](=O)[#6]", "[OX2H1;$(O-C=C-C=O);$(O-[C;R])]"], site: 0, claim: [0], pKa: 5.2, se: 1, source: "dimedone 5.23, cyclohexane-1,3-dione 5.26 (from memory; CRC Handbook)" },
  { id: "diketone", label: "1,3-diketone C–H", kind: "acid", smarts: ["[CX4;H1,H2]([CX3](=O)[#6])[CX3](=O)[#6]", "[OX2H1]C=CC(=O)[#6]"], site: 0, claim: [0], pKa: 8.95, se: 1, source: "pentane-2,4-dione 8.95 (from memory; CRC Handbook)" },
  { id: "ketoester", label: "β-keto ester C–H", kind: "acid", smarts: ["[CX4;H1,H2]([CX3](=O)[#6])[CX3](=O)O[#6]"], site: 0, claim: [0], pKa: 10.7, se: 1, source: "ethyl acetoacetate 10.68 (from memory; CRC Handbook)" },
  { id: "imide_aryl", label: "imide N–H (phthalimide-type)", kind: "acid", smarts: ["[CX3](=O)([NX3H1,NX2-][CX3](=O)a)a"], site: 2, pKa: 8.3, se: 1, source: "phthalimide 8.30 (from memory; CRC Handbook)" },
  { id: "imide_6", label: "imide N–H (glutarimide-type)", kind: "acid", smarts: ["[CX3;R]1(=O)[NX3H1,NX2-][CX3;R](=O)[CX4][CX4][CX4]1"], site: 1, pKa: 11.4, se: 1, source: "glutarimide 11.43 (from memory; CRC Handbook)" },
  { id: "imide", label: "imide N–H", kind: "acid", smarts: ["[CX3](=O)[NX3H1,NX2-][CX3]=O", "[#6X3](=O)[#7X3H1,#7X2-][#6X3]=O"], site: 2, pKa: 9.6, se: 1, source: "succinimide 9.62, glutarimide 11.4, maleimide 10.0, hydantoin 9.1 (from memory; CRC Handbook)" },
  { id: "triflanilide", label: "sulfonamide N–H (trifluoromethyl, N-aryl)", kind: "acid", smarts: ["[SX4](=O)(=O)([NX3H1,NX2-]a)C(F)(F)F"], site: 3, pKa: 4.45, se: 1, source: "trifluoromethanesulfonanilide 4.45 (from memory; Trepka, J. Org. Chem. 1974)" },
  { id: "triflamide", label: "sulfonamide N–H (trifluoromethyl)", kind: "acid", smarts: ["[SX4](=O)(=O)([NX3;H2,H1,X2-])C(F)(F)F"], site: 3, pKa: 6.3, se: 1, source: "trifluoromethanesulfonamide 6.33 (from memory; Trepka, J. Org. Chem. 1974)" },
  { id: "pyridyl_sulfonamide", label: "sulfonamide N–H (N-pyridyl)", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3H1,NX2-]c1ccccn1"], site: 3, pKa: 8.4, se: 1, source: "sulfapyridine 8.43 (from memory; CRC Handbook)" },
  { id: "diazinyl_sulfonamide", label: "sulfonamide N–H (N-diazinyl)", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3H1,NX2-]c(:n):n", "[SX4](=O)(=O)[NX3H1,NX2-]c1cnccn1", "[SX4](=O)(=O)[NX3H1,NX2-]c1ccc[n]n1"], site: 3, pKa: 6.5, se: 1, source: "sulfadiazine 6.48, sulfamerazine 7.0 (from memory; CRC Handbook)" },
  { id: "heteroaryl_sulfonamide", label: "sulfonamide N–H (N-heteroaryl)", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3H1,NX2-][c,n;$(a:n),$(a:a:n),$(a:o),$(a:s)]"], site: 3, pKa: 6.4, se: 1, source: "sulfamethoxazole 5.7, sulfathiazole 7.1 (from memory; CRC Handbook)" },
  { id: "aryl_sulfonamide", label: "sulfonamide N–H (N-aryl)", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3H1,NX2-]a"], site: 3, pKa: 8.3, se: 1.5, source: "benzenesulfonanilide 8.3 (from memory; N-aryl sulfonamides ≈ 7–9)" },
  { id: "sulfonamide", label: "sulfonamide N–H", kind: "acid", smarts: ["[SX4](=O)(=O)[NX3;H2,H1;!$(N-C=O)]"], site: 3, pKa: 10.1, se: 1, source: "benzenesulfonamide 10.10 (from memory; CRC Handbook); ring substituents by Hammett σ, ρ 1.06 (Perrin, Dempsey & Serjeant 1981); methanesulfonamide 10.87", method: "sulfonamide" },
  { id: "boronic_acid", label: "boronic acid", kind: "acid", smarts: [`[BX3](${ACID_O})(${ACID_O})[#6]`, "[BX4-](O)(O)(O)[#6]"], site: 1, claim: [0, 1, 2], pKa: 8.83, se: 1, source: "phenylboronic acid 8.83 (from memory; CRC Handbook); ring substituents by Hammett σ, ρ 2.15 (from memory)", method: "boronic" },
  { id: "phenol", label: "phenol", kind: "acid", smarts: [`${ACID_O}c`], site: 0, pKa: 9.99, se: 1, source: "phenol 9.994 [IUPAC F12, Reliable]; ring substituents by Hammett σ (σp⁻ for acceptors), ρ 2.23 (Perrin, Dempsey & Serjeant 1981)", method: "phenol" },
  { id: "oxime", label: "oxime O–H", kind: "acid", smarts: [`${ACID_O}N=C`], site: 0, claim: [0, 1], pKa: 11.5, se: 1.5, source: "acetoxime 12.4, benzaldoxime 10.7 (from memory; CRC Handbook)" },
  { id: "bicyclic_amidine", label: "amidine (DBU/DBN-type)", kind: "base", smarts: ["[NX2;R]1=[CX3;R2][NX3;R]CCC1", "[NX2;R]1=[CX3;R2][NX3;R]CC1"], site: 0, pKa: 13.4, se: 1.5, source: "DBU ≈ 13.4 in water (from memory; widely quoted 12–13.5)" },
  { id: "guanidine", label: "guanidine", kind: "base", smarts: [`[NX3;!$(N-C=O);!$(N-S(=O)=O)]C(=[$([NX2]),$([NX3+;!H0]);!$(N-C=O);!$(N-S(=O)=O);!$(N-[N+](=O)[O-]);!$(N-C#N)])[NX3;!$(N-C=O)]`], site: 2, pKa: 13.6, se: 1, source: "guanidine 13.6, tetramethylguanidine 13.6 (from memory; CRC Handbook)" },
  { id: "amidine", label: "amidine", kind: "base", smarts: ["[NX3;!$(N-C=O);!$(N-S(=O)=O)]-[CX3;!$(C=O)]=[$([NX2]),$([NX3+;!H0]);!$(N-C=O);!$(N-S(=O)=O);!$(N-O);!$(N-C#N)]"], site: 2, pKa: 12.4, se: 1, source: "acetamidine 12.4 [IUPAC S29, Uncertain]; benzamidine 11.6 (from memory)" },
  { id: "aminopyridine_4", label: "pyridine N (4-amino)", kind: "base", smarts: ["[nX2,nH1+]1ccc(-[NX3+0;!$(N-C=O);!$(N-S(=O)=O)])cc1"], site: 0, pKa: 9.61, se: 1, source: "4-dimethylaminopyridine 9.61 [IUPAC C34, Approximate]; 4-aminopyridine 9.17 (from memory; Perrin 1965)", method: "pyridine" },
  { id: "aminopyridine_2", label: "pyridine N (2-amino)", kind: "base", smarts: ["[nX2,nH1+]1c(-[NX3+0;!$(N-C=O);!$(N-S(=O)=O)])cccc1"], site: 0, pKa: 6.86, se: 1, source: "2-aminopyridine 6.86 (from memory; Perrin 1965)", method: "pyridine" },
  { id: "aniline", label: "aniline N", kind: "base", smarts: [`[NX3+0;${AMINE_N_OF_ANILINE};!$(N-a:n)]-c`, "[NX4+;H1,H2,H3]-c"], site: 0, pKa: 4.6, se: 1, source: "aniline 4.60 [IUPAC B65/B66/P11/B56, Reliable]; N-methylaniline 4.85, N,N-dimethylaniline 5.07 (from memory); ring substituents by Hammett σ (σp⁻ for acceptors), ρ 2.89 (Perrin, Dempsey & Serjeant 1981)", method: "aniline" },
  { id: "benzimidazole", label: "benzimidazole N", kind: "base", smarts: ["[nX2,nX3+;r5]1:c:[nX3;r5]:c2:c:1:c:c:c:c:2"], site: 0, pKa: 5.53, se: 1, source: "benzimidazole 5.53 (from memory; Perrin 1965)" },
  { id: "imidazole", label: "imidazole N", kind: "base", smarts: ["[nX2,nX3+;r5]1:c:[nX3;r5]:[c;!$(c:c=O)]:[c;!$(c:c=O)]:1"], site: 0, pKa: 6.99, se: 1, source: "imidazole 6.993 [IUPAC D2, Reliable]; 2-methylimidazole 7.86, 4-methylimidazole 7.52, 1-methylimidazole 7.06 (from memory; Perrin 1965)", method: "imidazole" },
  { id: "pyridine", label: "pyridine N", kind: "base", smarts: ["[nX2,nH1+;r6;!$(n:n);!$(n:c:n);!$(n:c:c:n);!$(n:c=O);!$(n:c:c=O)]"], site: 0, pKa: 5.23, se: 1, source: "pyridine 5.229 [IUPAC G30, Reliable]; ring substituents by Hammett σ, ρ 5.90, ortho groups from the 2-substituted pyridines (Perrin, Dempsey & Serjeant 1981)", method: "pyridine" },
  { id: "diazine", label: "diazine N (pyrimidine, pyrazine, pyridazine)", kind: "base", smarts: ["[nX2;r6;$(n:n),$(n:c:n),$(n:c:c:n);!$(n:c=O)]"], site: 0, pKa: 1.3, se: 1, source: "pyrimidine 1.3, pyrazine 0.65, pyridazine 2.3 (from memory; Perrin 1965)", perRing: "one" },
  { id: "azole", label: "azole N (thiazole, pyrazole)", kind: "base", smarts: ["[nX2;r5;$(n1:c:s:c:c:1),$(n1:[nX3]:c:c:c:1)]"], site: 0, pKa: 2.5, se: 1, source: "thiazole 2.5, pyrazole 2.5 (from memory; Perrin 1965)" },
  { id: "ammonia", label: "ammonia", kind: "base", smarts: ["[NX3H3,NX4H4+]"], site: 0, pKa: 9.25, se: 1, source: "ammonium 9.25 (from memory; CRC Handbook, dissociation constants of inorganic acids and bases)" },
  { id: "hydroxylamine", label: "hydroxylamine N", kind: "base", smarts: ["[NX3,NX4+;!H0;!$(N-C=[O,S,N]);!$(N-S(=O)=O);!$(N-a)]-[OX2H1]"], site: 0, pKa: 5.96, se: 1, source: "hydroxylamine 5.96 (from memory; CRC Handbook)" },
  { id: "hydrazine", label: "hydrazine N", kind: "base", smarts: ["[NX3,NX4+;!H0;!$(N-C=[O,S,N]);!$(N-S(=O)=O);!$(N-a)]-[NX3;!$(N-C=[O,S,N]);!$(N-S(=O)=O);!$(N-a)]"], site: 0, pKa: 8.1, se: 1, source: "hydrazine 8.10, methylhydrazine 7.87 (from memory; CRC Handbook)", perRing: "one" },
  { id: "alpha_aminonitrile", label: "amine α to a nitrile", kind: "base", smarts: [`[NX3+0;${PLAIN_N}]-[CX4]-C#N`, "[NX4+;!H0]-[CX4]-C#N"], site: 0, pKa: 5.34, se: 1, source: "aminoacetonitrile 5.34 [IUPAC S75, Approximate]; Taft σ* (Perrin, Dempsey & Serjeant 1981)", method: "taft_amine" },
  { id: "alpha_aminocarbonyl", label: "amine α to an amide or ester", kind: "base", smarts: [`[NX3+0;${PLAIN_N}]-[CX4]-C(=O)[#7,$(O[#6])]`, "[NX4+;!H0]-[CX4]-C(=O)[#7,$(O[#6])]"], site: 0, pKa: 7.9, se: 1, source: "lidocaine 7.9 (Bekhit, 'Lidocaine for neural blockade', Cambridge University Press); glycinamide 7.95 [IUPAC D11]; Taft σ* (Perrin, Dempsey & Serjeant 1981)", method: "taft_amine" },
  { id: "morpholine_nh", label: "morpholine N–H", kind: "base", smarts: [`[NX3+0;H1;${PLAIN_N};$(N1CCOCC1)]`, "[NX4+;H2;$(N1CCOCC1)]"], site: 0, pKa: 8.36, se: 1, source: "morpholine 8.36 (from memory; Perrin 1965)" },
  { id: "morpholine_n_alkyl", label: "morpholine N (N-alkyl)", kind: "base", smarts: [`[NX3+0;H0;${PLAIN_N};$(N1CCOCC1)]`, "[NX4+;H1;$(N1CCOCC1)]"], site: 0, pKa: 7.4, se: 1, source: "N-methylmorpholine 7.38 (from memory; Perrin 1965)" },
  { id: "dabco", label: "DABCO N", kind: "base", smarts: ["[NX3,NX4+;$([#7]12CC[#7](CC1)CC2)]"], site: 0, pKa: 8.82, se: 1, source: "1,4-diazabicyclo[2.2.2]octane 8.82 (from memory; Perrin 1965)", perRing: { pKa: 2.97, source: "1,4-diazabicyclo[2.2.2]octane second protonation 2.97 (from memory; Perrin 1965)" } },
  { id: "piperazine", label: "piperazine N", kind: "base", smarts: [`[NX3+0;${PLAIN_N};$(N1CCNCC1)]`, "[NX4+;!H0;$(N1CCNCC1)]"], site: 0, pKa: 9.0, se: 1, source: "1-methylpiperazine ≈ 9.0, piperazine 9.73 (from memory; Perrin 1965)", perRing: { pKa: 5.35, source: "piperazine second protonation 5.35 (from memory; Perrin 1965)" } },
  { id: "primary_amine", label: "aliphatic amine (primary)", kind: "base", smarts: [`[NX3+0;H2;${PLAIN_N}]-[CX4]`, "[NX4+;H3]-[CX4]"], site: 0, pKa: 10.66, se: 1, source: "methylamine 10.657 [IUPAC H31, Reliable]; Taft σ*: 10.15 − 3.14 Σσ* (Perrin, Dempsey & Serjeant 1981)", method: "taft_amine" },
  { id: "secondary_amine", label: "aliphatic amine (secondary)", kind: "base", smarts: [`[NX3+0;H1;${PLAIN_N}](-[CX4])-[CX4]`, "[NX4+;H2](-[CX4])-[CX4]"], site: 0, pKa: 10.73, se: 1, source: "dimethylamine 10.732 [IUPAC H31, Reliable]; Taft σ*: 10.59 − 3.23 Σσ* (Perrin, Dempsey & Serjeant 1981)", method: "taft_amine" },
  { id: "tertiary_amine", label: "aliphatic amine (tertiary)", kind: "base", smarts: [`[NX3+0;H0;${PLAIN_N}](-[CX4])(-[CX4])-[CX4]`, "[NX4+;H1](-[CX4])(-[CX4])-[CX4]"], site: 0, pKa: 9.81, se: 1, source: "trimethylamine 9.81 [IUPAC M15, Reliable]; Taft σ*: 9.61 − 3.30 Σσ* (Perrin, Dempsey & Serjeant 1981)", method: "taft_amine" },
];
