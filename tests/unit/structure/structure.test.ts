/**
 * Parsing and derived properties. Reference values: molar masses from IUPAC standard atomic weights (C 12.011,
 * H 1.008, N 14.007, O 15.999, Na 22.990; IUPAC 2021 abridged table, common practice); TPSA contributions from Ertl,
 * Rohde & Selzer, J. Med. Chem. 2000, 43, 3714, Table 1 (carbonyl O 17.07 Å², hydroxyl O 20.23 Å²; from memory).
 */
import { beforeAll, describe, expect, it } from "vitest";
import {
  bitIsSet, createRDKitInit, depictSvg, describeStructure, FINGERPRINT_BYTES, loadRDKit, popcount, type RDKitModule,
  readSmilesLines, searchKeys, splitSdf, tanimoto, usingMol, readSmiles,
} from "@/lib/chem/structure";

let rdkit: RDKitModule;
beforeAll(async () => {
  rdkit = await loadRDKit();
});

describe("loading RDKit", () => {
  it("loads once per process and shares the instance", async () => {
    const again = await loadRDKit(createRDKitInit());
    expect(again).toBe(rdkit);
    expect(rdkit.version()).toMatch(/^20\d\d\./);
  });
});

describe("describeStructure", () => {
  it.each([
    ["benzoic acid", "OC(=O)c1ccccc1", "C7H6O2", 7 * 12.011 + 6 * 1.008 + 2 * 15.999],
    ["caffeine", "Cn1cnc2c1c(=O)n(C)c(=O)n2C", "C8H10N4O2", 8 * 12.011 + 10 * 1.008 + 4 * 14.007 + 2 * 15.999],
    ["sodium acetate", "CC(=O)[O-].[Na+]", "C2H3NaO2", 2 * 12.011 + 3 * 1.008 + 22.99 + 2 * 15.999],
    ["anilinium", "[NH3+]c1ccccc1", "C6H8N+", 6 * 12.011 + 8 * 1.008 + 14.007],
    ["acetate", "CC(=O)[O-]", "C2H3O2-", 2 * 12.011 + 3 * 1.008 + 2 * 15.999],
  ])("%s: Hill formula and molar mass", (_name, smiles, formula, mass) => {
    const d = describeStructure(rdkit, smiles);
    expect(d.formula).toBe(formula);
    expect(d.molarMass).toBeCloseTo(mass, 1);
  });

  it("gives the same canonical SMILES for different spellings of one structure", () => {
    const spellings = ["OC(=O)c1ccccc1", "c1ccc(cc1)C(O)=O", "C1=CC=C(C=C1)C(=O)O"];
    expect(new Set(spellings.map((s) => describeStructure(rdkit, s).canonicalSmiles)).size).toBe(1);
  });

  it("computes TPSA from Ertl's fragment contributions and counts fragments and charge", () => {
    const benzoic = describeStructure(rdkit, "OC(=O)c1ccccc1");
    expect(benzoic.tpsa).toBeCloseTo(17.07 + 20.23, 1);
    const salt = describeStructure(rdkit, "CC[NH+](CC)CC.[Cl-]");
    expect(salt.fragmentCount).toBe(2);
    expect(salt.netCharge).toBe(0);
    expect(describeStructure(rdkit, "C[N+](C)(C)C").netCharge).toBe(1);
  });

  it("reads a MOL block it wrote and keeps the structure", () => {
    const block = usingMol(readSmiles(rdkit, "CC(=O)Nc1ccc(O)cc1"), (m) => m.get_molblock());
    expect(describeStructure(rdkit, block).canonicalSmiles).toBe(describeStructure(rdkit, "CC(=O)Nc1ccc(O)cc1").canonicalSmiles);
  });
});

describe("fingerprints", () => {
  it("stores bit i in byte i >> 3 under mask 1 << (i & 7), matching RDKit's bit string", () => {
    const keys = searchKeys(rdkit, "CC(=O)Nc1ccc(O)cc1");
    const bits = usingMol(readSmiles(rdkit, "CC(=O)Nc1ccc(O)cc1"), (m) => m.get_morgan_fp(JSON.stringify({ radius: 2, nBits: 2048 })));
    expect(keys.morganFingerprint).toHaveLength(FINGERPRINT_BYTES);
    expect(bits).toHaveLength(2048);
    for (let i = 0; i < 2048; i++) expect(bitIsSet(keys.morganFingerprint, i)).toBe(bits[i] === "1");
    expect(popcount(keys.morganFingerprint)).toBe([...bits].filter((b) => b === "1").length);
  });

  it("scores identical structures 1 and unrelated ones low", () => {
    const a = searchKeys(rdkit, "CC(=O)Nc1ccc(O)cc1").morganFingerprint;
    const b = searchKeys(rdkit, "OC(=O)CCCCCCCCCCC").morganFingerprint;
    expect(tanimoto(a, a)).toBe(1);
    expect(tanimoto(a, b)).toBeLessThan(0.2);
  });

  it("keeps a substructure's pattern bits inside its superstructure's", () => {
    const sub = searchKeys(rdkit, "c1ccncc1").patternFingerprint;
    const sup = searchKeys(rdkit, "CN(C)c1ccncc1").patternFingerprint;
    for (let i = 0; i < FINGERPRINT_BYTES; i++) expect((sub[i] ?? 0) & ~(sup[i] ?? 0)).toBe(0);
  });
});

describe("files and depictions", () => {
  it("splits an SD file into records with names and data fields", () => {
    const block = usingMol(readSmiles(rdkit, "CCO"), (m) => m.get_molblock()).replace(/^[^\n]*/, "ethanol");
    const records = splitSdf(`${block}> <CAS>\n64-17-5\n\n> <NOTE>\nline one\nline two\n\n$$$$\n${block}$$$$\n`);
    expect(records).toHaveLength(2);
    expect(records[0]?.name).toBe("ethanol");
    expect(records[0]?.data).toEqual({ CAS: "64-17-5", NOTE: "line one\nline two" });
    expect(records[1]?.line).toBeGreaterThan(records[0]?.line ?? 0);
  });

  it("reads pasted SMILES lines with names and per-line errors", () => {
    const results = readSmilesLines(rdkit, "CCO ethanol\n# comment\n\nC1CC broken ring\nc1ccccc1 benzene");
    expect(results.map((r) => [r.line, r.name, r.ok])).toEqual([[1, "ethanol", true], [4, "broken ring", false], [5, "benzene", true]]);
  });

  it("draws an SVG and highlights atoms on request", () => {
    const plain = depictSvg(rdkit, "OC(=O)c1ccccc1");
    const highlighted = depictSvg(rdkit, "OC(=O)c1ccccc1", { highlightAtoms: [0, 1, 2], width: 200, height: 150 });
    expect(plain).toMatch(/<svg[\s\S]*<\/svg>/);
    expect(highlighted).toMatch(/width='200px'/);
    expect(highlighted).not.toBe(plain);
  });
});
