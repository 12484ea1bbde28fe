/**
 * Ionizable-site detection on structures with literature pKa values. Sources per row:
 * [IUPAC code] IUPAC Digitized pKa Dataset (github.com/IUPAC/Dissociation-Constants; digitizes Perrin 1965/1972 and
 * Serjeant & Dempsey 1979), with the dataset's reference code; values at 25 °C unless noted.
 * [lido] Bekhit, "Lidocaine for neural blockade", Cambridge University Press. "from memory" rows are marked.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { type EstimatedPKa, estimateIonizableSites, loadRDKit, type RDKitModule } from "@/lib/chem/structure";

type Expected = { site: string; kind: "acid" | "base"; pKa: number; source: string };
const CASES: [string, string, Expected[]][] = [
  ["acetic acid", "CC(=O)O", [{ site: "carboxylic acid", kind: "acid", pKa: 4.757, source: "IUPAC W29" }]],
  ["benzoic acid", "OC(=O)c1ccccc1", [{ site: "carboxylic acid (aryl)", kind: "acid", pKa: 4.204, source: "IUPAC B91/F18/K30" }]],
  ["phenylacetic acid", "OC(=O)Cc1ccccc1", [{ site: "carboxylic acid", kind: "acid", pKa: 4.307, source: "IUPAC K30/S89" }]],
  ["ibuprofen", "CC(C)Cc1ccc(cc1)C(C)C(=O)O", [{ site: "carboxylic acid", kind: "acid", pKa: 4.45, source: "from memory (Avdeef)" }]],
  ["phenol", "Oc1ccccc1", [{ site: "phenol", kind: "acid", pKa: 9.994, source: "IUPAC F12" }]],
  ["4-nitrophenol", "Oc1ccc(cc1)[N+](=O)[O-]", [{ site: "phenol", kind: "acid", pKa: 7.15, source: "IUPAC A47/F12" }]],
  ["p-cresol", "Cc1ccc(O)cc1", [{ site: "phenol", kind: "acid", pKa: 10.27, source: "IUPAC C40/H32" }]],
  ["2-naphthol", "Oc1ccc2ccccc2c1", [{ site: "phenol", kind: "acid", pKa: 9.51, source: "IUPAC (Approximate)" }]],
  ["aniline", "Nc1ccccc1", [{ site: "aniline N", kind: "base", pKa: 4.6, source: "IUPAC B65/B66/P11/B56" }]],
  ["4-nitroaniline", "Nc1ccc(cc1)[N+](=O)[O-]", [{ site: "aniline N", kind: "base", pKa: 1.02, source: "IUPAC B58" }]],
  ["pyridine", "c1ccncc1", [{ site: "pyridine N", kind: "base", pKa: 5.229, source: "IUPAC G30" }]],
  ["4-dimethylaminopyridine", "CN(C)c1ccncc1", [{ site: "pyridine N (4-amino)", kind: "base", pKa: 9.61, source: "IUPAC C34" }]],
  ["imidazole", "c1c[nH]cn1", [{ site: "imidazole N", kind: "base", pKa: 6.99, source: "IUPAC D2/K32" }]],
  ["triethylamine", "CCN(CC)CC", [{ site: "aliphatic amine (tertiary)", kind: "base", pKa: 10.72, source: "IUPAC C33 (interpolated to 25 °C)" }]],
  ["diethylamine", "CCNCC", [{ site: "aliphatic amine (secondary)", kind: "base", pKa: 10.98, source: "IUPAC (25 °C, Approximate)" }]],
  ["piperidine", "C1CCNCC1", [{ site: "aliphatic amine (secondary)", kind: "base", pKa: 11.12, source: "IUPAC B28" }]],
  ["lidocaine", "CCN(CC)CC(=O)Nc1c(C)cccc1C", [{ site: "amine α to an amide or ester", kind: "base", pKa: 7.9, source: "lido" }]],
  ["glycine", "NCC(=O)O", [
    { site: "α-amino acid amine", kind: "base", pKa: 9.78, source: "IUPAC K26/O11" },
    { site: "α-amino acid carboxyl", kind: "acid", pKa: 2.35, source: "IUPAC K26/O11" },
  ]],
  ["methylamine", "CN", [{ site: "aliphatic amine (primary)", kind: "base", pKa: 10.657, source: "IUPAC H31" }]],
  ["ethylamine", "CCN", [{ site: "aliphatic amine (primary)", kind: "base", pKa: 10.67, source: "IUPAC F40 (Approximate)" }]],
  ["dimethylamine", "CNC", [{ site: "aliphatic amine (secondary)", kind: "base", pKa: 10.732, source: "IUPAC H31" }]],
  ["trimethylamine", "CN(C)C", [{ site: "aliphatic amine (tertiary)", kind: "base", pKa: 9.81, source: "IUPAC M15" }]],
  ["acetamidine", "CC(=N)N", [{ site: "amidine", kind: "base", pKa: 12.4, source: "IUPAC S29 (Uncertain)" }]],
  ["glycinamide", "NCC(N)=O", [{ site: "amine α to an amide or ester", kind: "base", pKa: 7.95, source: "IUPAC D11 (Approximate)" }]],
  ["aminoacetonitrile", "N#CCN", [{ site: "amine α to a nitrile", kind: "base", pKa: 5.34, source: "IUPAC S75 (Approximate)" }]],
  ["N-methylglycinamide dimethylamide", "CNCC(=O)N(C)C", [{ site: "amine α to an amide or ester", kind: "base", pKa: 8.82, source: "IUPAC D10 (Approximate)" }]],
  ["4-(dimethylamino)butan-2-one", "CC(=O)CCN(C)C", [{ site: "aliphatic amine (tertiary)", kind: "base", pKa: 8.37, source: "IUPAC M14 (20 °C, Uncertain)" }]],
];

// Neutral in aqueous workups: no site in the pH 0–14 window the classes cover (IUPAC T16 caffeine < 1, H11
// acetanilide ≈ 0.5; acetophenone −6 to −8; hydrocarbons and nitroarenes none).
const NEUTRAL: [string, string][] = [
  ["caffeine", "Cn1cnc2c1c(=O)n(C)c(=O)n2C"],
  ["acetanilide", "CC(=O)Nc1ccccc1"],
  ["naphthalene", "c1ccc2ccccc2c1"],
  ["toluene", "Cc1ccccc1"],
  ["nitrobenzene", "[O-][N+](=O)c1ccccc1"],
  ["acetophenone", "CC(=O)c1ccccc1"],
  ["benzophenone", "O=C(c1ccccc1)c1ccccc1"],
  ["N,N-dimethylacetamide", "CC(=O)N(C)C"],
];

let rdkit: RDKitModule;
beforeAll(async () => {
  rdkit = await loadRDKit();
});

const bySite = (sites: EstimatedPKa[]) => [...sites].sort((a, b) => a.site.localeCompare(b.site));

describe("ionizable site detection", () => {
  it("has a labelled set of at least 20 structures", () => {
    expect(CASES.length).toBeGreaterThanOrEqual(20);
  });

  it.each(CASES)("%s: finds each site once, with the right class and kind", (_name, smiles, expected) => {
    const sites = bySite(estimateIonizableSites(rdkit, smiles));
    const want = [...expected].sort((a, b) => a.site.localeCompare(b.site));
    expect(sites.map((s) => [s.site, s.kind])).toEqual(want.map((e) => [e.site, e.kind]));
    for (const s of sites) {
      expect(s.provenance).toBe("estimated");
      expect(s.se).toBeGreaterThanOrEqual(1);
      expect(s.source.length).toBeGreaterThan(10);
      expect(s.atoms.length).toBeGreaterThan(0);
    }
  });

  it("puts most default pKa values within their stated uncertainty of the literature value, and all within 3 se", () => {
    const pairs = CASES.flatMap(([, smiles, expected]) => {
      const sites = bySite(estimateIonizableSites(rdkit, smiles));
      return [...expected].sort((a, b) => a.site.localeCompare(b.site)).map((e, i) => ({ estimate: sites[i], literature: e.pKa }));
    });
    const within = pairs.filter(({ estimate, literature }) => estimate && Math.abs(estimate.value - literature) <= estimate.se);
    console.info(`site defaults within 1 se of literature: ${within.length} / ${pairs.length}`);
    expect(within.length / pairs.length).toBeGreaterThanOrEqual(0.8);
    for (const { estimate, literature } of pairs) expect(Math.abs((estimate?.value ?? Infinity) - literature)).toBeLessThanOrEqual(3 * (estimate?.se ?? 0));
  });

  it.each(NEUTRAL)("%s has no ionizable site", (_name, smiles) => {
    expect(estimateIonizableSites(rdkit, smiles)).toEqual([]);
  });

  it("does not count a carboxylic acid oxygen as a phenol, an amide N as an amine, or an aniline N as aliphatic", () => {
    const salicylic = estimateIonizableSites(rdkit, "OC(=O)c1ccccc1O").map((s) => s.site).sort();
    expect(salicylic).toEqual(["carboxylic acid (aryl)", "phenol"]);
    expect(estimateIonizableSites(rdkit, "CC(=O)NCCN(C)C").map((s) => s.site)).toEqual(["aliphatic amine (tertiary)"]);
    expect(estimateIonizableSites(rdkit, "CN(C)c1ccccc1").map((s) => s.site)).toEqual(["aniline N"]);
  });

  it("reports the ionizable atom first, and recognizes the salt forms", () => {
    const [carboxylate] = estimateIonizableSites(rdkit, "CC(=O)[O-].[Na+]");
    expect(carboxylate?.site).toBe("carboxylic acid");
    expect(carboxylate?.atoms[0]).toBe(3);
    expect(estimateIonizableSites(rdkit, "CC[NH+](CC)CC.[Cl-]").map((s) => s.site)).toEqual(["aliphatic amine (tertiary)"]);
  });

  it("gives the second nitrogen of a piperazine the second protonation constant", () => {
    const values = estimateIonizableSites(rdkit, "C1CNCCN1").map((s) => s.value).sort((a, b) => a - b);
    expect(values).toHaveLength(2);
    expect((values[1] ?? 0) - (values[0] ?? 0)).toBeGreaterThan(3);
  });
});
