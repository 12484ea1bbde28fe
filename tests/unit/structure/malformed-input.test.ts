/**
 * Malformed SMILES and MOL input, generated systematically from valid structures: every case must raise a
 * StructureError with the specific code for its defect and a message that says what is wrong (never a crash,
 * never RDKit's generic failure). Structures are common reagents and drugs (common practice, no values involved).
 */
import { beforeAll, describe, expect, it } from "vitest";
import {
  describeStructure, loadRDKit, type RDKitModule, readMolBlock, type ReadOptions, readSdf, StructureError, type StructureErrorCode, usingMol,
} from "@/lib/chem/structure";

const VALID = [
  "CC(=O)Oc1ccccc1C(=O)O", "CN1C=NC2=C1C(=O)N(C(=O)N2C)C", "CC(C)Cc1ccc(cc1)C(C)C(=O)O", "O=C(O)c1ccccc1",
  "CCN(CC)CC(=O)Nc1c(C)cccc1C", "c1ccc2c(c1)cccc2O", "C1CCNCC1", "CC(C)(C)OC(=O)NCC(=O)O", "Clc1ccc(cc1)C(=O)N",
  "OCC1OC(O)C(O)C(O)C1O",
];

type Case = [label: string, input: string, code: StructureErrorCode];
const cases: Case[] = [];
const add = (label: string, input: string, code: StructureErrorCode) => cases.push([label, input, code]);

// Parentheses: drop the first ')' or add a stray one.
VALID.filter((s) => s.includes(")")).forEach((s, i) => {
  add(`unclosed ( #${i}`, s.replace(")", ""), "unbalanced_parentheses");
  add(`stray ) #${i}`, `C)${s}`, "unbalanced_parentheses");
});
// Brackets.
["[NH4+", "C[C@@H(O)N", "CC(=O)[O-", "[Na+].[Cl-", "C]C", "[C[N]]", "[[C]]"].forEach((s, i) => add(`bracket #${i}`, s, "unbalanced_brackets"));
// Ring closures: remove the last ring digit of a ring-containing SMILES.
VALID.filter((s) => /\d/.test(s)).forEach((s, i) => {
  const at = s.search(/\d(?!.*\d)/);
  add(`unclosed ring #${i}`, s.slice(0, at) + s.slice(at + 1), "unclosed_ring");
});
["C%1CC%1", "C%C", "C%", "c1ccccc%1"].forEach((s, i) => add(`bad %label #${i}`, s, "bad_ring_closure"));
["C11", "C1C1", "CC11C"].forEach((s, i) => add(`ring onto itself #${i}`, s, "bad_ring_closure"));
// Valence.
["C(C)(C)(C)(C)C", "CC(C)(C)(C)(C)C", "N(C)(C)(C)C", "O(C)(C)C", "FC(F)(F)(F)F", "C=C(C)(C)C", "CC(=O)(=O)C", "ClCl(Cl)Cl", "B(C)(C)(C)C", "S(=O)(=O)(=O)(=O)C", "C#C#C", "[NH4](C)", "O=C=O=C", "F(F)F"]
  .forEach((s, i) => add(`valence #${i}`, s, "valence"));
// Aromaticity that cannot be kekulized.
["c1cccc1", "c1ccccc1c", "n1cccc1", "c1ccc2cccc2c1", "c1cc1", "o1cccc1c"].forEach((s, i) => add(`kekulize #${i}`, s, "aromaticity"));
// Unknown elements, in and out of brackets.
["[Xx]", "C[Qq]C", "[Zz+]", "[J]", "CC[Ab]", "[13Xy]", "X", "CCE", "Cj", "CCq"].forEach((s, i) => add(`unknown element #${i}`, s, "unknown_element"));
// Real elements outside the organic subset must be bracketed.
["NaCl", "CC(=O)ONa", "[Na+].[Cl-]K", "CSi(C)(C)C", "Xe", "CHg"].forEach((s, i) => add(`needs brackets #${i}`, s, "smiles_syntax"));
// Characters that never occur in SMILES, and whitespace inside one.
["C{C}", "C<C", "C;C", "C,C", "C'C", 'C"C', "C&C", "C^C", "C!C", "C|C", "C_C", "C?C", "CC`"].forEach((s, i) => add(`bad character #${i}`, s, "invalid_character"));
["CC O", "C\tC", "CCO ethanol"].forEach((s, i) => add(`whitespace #${i}`, s, "whitespace_in_smiles"));
// Syntax errors RDKit reports with a position.
["C==C", "C=#C", "(C)C", "C()C", "=C", "C=", "C..C", "C(=)C"].forEach((s, i) => add(`syntax #${i}`, s, "smiles_syntax"));
["1CC1", "C.1CC1", "C(1CC1)"].forEach((s, i) => add(`ring digit without atom #${i}`, s, "bad_ring_closure"));
// Garbage and empties.
[["", "empty_input"], ["   ", "empty_input"], ["hello", "unknown_element"], ["12345", "bad_ring_closure"], ["{}", "invalid_character"], ["<xml/>", "invalid_character"]]
  .forEach(([s, code], i) => add(`garbage #${i}`, s ?? "", code as StructureErrorCode));
// Unspecified atoms are not compounds.
["*C", "C*C", "[*]CC", "[1*]C"].forEach((s, i) => add(`dummy #${i}`, s, "unspecified_atom"));
add("oversize", "C".repeat(100_001), "input_too_large");
add("too many atoms", "C".repeat(2500), "too_many_atoms");

// MOL blocks: a valid V2000 block for acetic acid, then defects.
const atomLine = (x: number, symbol: string) => `${x.toFixed(4).padStart(10)}    0.0000    0.0000 ${symbol.padEnd(3)} 0  0  0  0  0  0  0  0  0  0  0  0`;
const bondLine = (a: number, b: number, t: number) => `${String(a).padStart(3)}${String(b).padStart(3)}${String(t).padStart(3)}  0`;
const mol = (atoms: string[], bonds: [number, number, number][], counts?: string) =>
  ["acetic acid", "  Layerwise", "", counts ?? `${String(atoms.length).padStart(3)}${String(bonds.length).padStart(3)}  0  0  0  0  0  0  0  0999 V2000`,
    ...atoms.map((s, i) => atomLine(i * 1.3, s)), ...bonds.map(([a, b, t]) => bondLine(a, b, t)), "M  END", ""].join("\n");
const ATOMS = ["C", "C", "O", "O"];
const BONDS: [number, number, number][] = [[1, 2, 1], [2, 3, 2], [2, 4, 1]];
const GOOD = mol(ATOMS, BONDS);
const goodLines = GOOD.split("\n");
const molCases: [string, string, StructureErrorCode, ReadOptions][] = [];
const addMol = (label: string, block: string, code: StructureErrorCode, options: ReadOptions = {}) => molCases.push([label, block, code, options]);
for (let keep = 1; keep <= 3; keep++) addMol(`header only (${keep} lines)`, goodLines.slice(0, keep).join("\n") + "\n", "mol_block_header");
for (let keep = 4; keep < goodLines.length - 2; keep++) addMol(`truncated after line ${keep}`, goodLines.slice(0, keep).join("\n") + "\n", "mol_block_truncated");
addMol("counts: letters", mol(ATOMS, BONDS, "  a  b  0  0  0  0  0  0  0  0999 V2000"), "mol_block_counts");
addMol("counts: blank", mol(ATOMS, BONDS, "      "), "mol_block_counts");
addMol("counts: version V4000", mol(ATOMS, BONDS, "  4  3  0  0  0  0  0  0  0  0999 V4000"), "mol_block_counts");
addMol("counts: too many atoms declared", mol(ATOMS, BONDS, "  9  3  0  0  0  0  0  0  0  0999 V2000"), "mol_block_truncated");
addMol("counts: too many bonds declared", mol(ATOMS, BONDS, "  4  7  0  0  0  0  0  0  0  0999 V2000"), "mol_block_truncated");
addMol("counts: over the atom limit", mol(ATOMS, BONDS, "999  3  0  0  0  0  0  0  0  0999 V2000"), "too_many_atoms", { maxAtoms: 100 });
addMol("atom: unknown element", mol(["C", "Xx", "O", "O"], BONDS), "unknown_element");
addMol("atom: query atom Q", mol(["C", "Q", "O", "O"], BONDS), "unspecified_atom");
addMol("atom: query atom A", mol(["A", "C", "O", "O"], BONDS), "unspecified_atom");
addMol("atom: R group", mol(["C", "C", "O", "R#"], BONDS), "unspecified_atom");
addMol("atom: no coordinates", GOOD.replace(atomLine(0, "C"), "C"), "mol_block_atom");
addMol("atom: text coordinates", GOOD.replace(atomLine(0, "C"), "    x.0000    0.0000    0.0000 C   0  0  0"), "mol_block_atom");
addMol("bond: atom out of range", mol(ATOMS, [[1, 2, 1], [2, 3, 2], [2, 9, 1]]), "mol_block_bond");
addMol("bond: atom zero", mol(ATOMS, [[0, 2, 1], [2, 3, 2], [2, 4, 1]]), "mol_block_bond");
addMol("bond: to itself", mol(ATOMS, [[1, 1, 1], [2, 3, 2], [2, 4, 1]]), "mol_block_bond");
addMol("bond: type 9", mol(ATOMS, [[1, 2, 9], [2, 3, 2], [2, 4, 1]]), "mol_block_bond");
addMol("bond: duplicated", mol(ATOMS, [[1, 2, 1], [2, 1, 1], [2, 4, 1]]), "mol_block_bond");
addMol("bond: letters", GOOD.replace(bondLine(1, 2, 1), "  a  b  c  0"), "mol_block_bond");
addMol("valence: pentavalent carbon", mol(["C", "C", "C", "C", "C", "C"], [[1, 2, 1], [1, 3, 1], [1, 4, 1], [1, 5, 1], [1, 6, 1]]), "valence");
addMol("valence: divalent fluorine", mol(["F", "C", "C"], [[1, 2, 1], [1, 3, 1]]), "valence");
addMol("no M  END", GOOD.replace("M  END", ""), "mol_block_truncated");
addMol("V3000 without CTAB", ["", "  Layerwise", "", "  0  0  0     0  0            999 V3000", "M  END", ""].join("\n"), "mol_block_truncated");
addMol("V3000 wrong atom count", ["", "", "", "  0  0  0     0  0            999 V3000", "M  V30 BEGIN CTAB", "M  V30 COUNTS 3 0 0 0 0", "M  V30 BEGIN ATOM", "M  V30 1 C 0 0 0 0", "M  V30 END ATOM", "M  V30 END CTAB", "M  END", ""].join("\n"), "mol_block_truncated");
addMol("V3000 bond to missing atom", ["", "", "", "  0  0  0     0  0            999 V3000", "M  V30 BEGIN CTAB", "M  V30 COUNTS 2 1 0 0 0", "M  V30 BEGIN ATOM", "M  V30 1 C 0 0 0 0", "M  V30 2 O 1 0 0 0", "M  V30 END ATOM", "M  V30 BEGIN BOND", "M  V30 1 1 1 5", "M  V30 END BOND", "M  V30 END CTAB", "M  END", ""].join("\n"), "mol_block_bond");

let rdkit: RDKitModule;
beforeAll(async () => {
  rdkit = await loadRDKit();
});

function errorOf(input: string, read: (text: string) => unknown = (text) => describeStructure(rdkit, text)): StructureError {
  try {
    read(input);
  } catch (error) {
    if (error instanceof StructureError) return error;
    throw error;
  }
  throw new Error(`accepted: ${JSON.stringify(input.slice(0, 60))}`);
}

describe("malformed structures", () => {
  it("covers at least 100 generated cases", () => {
    expect(cases.length + molCases.length).toBeGreaterThanOrEqual(100);
  });

  it("accepts the valid inputs the cases were generated from", () => {
    for (const s of [...VALID, GOOD]) expect(() => describeStructure(rdkit, s)).not.toThrow();
  });

  it.each(cases)("SMILES %s → %s", (_label, input, code) => {
    const error = errorOf(input);
    expect(error.code).toBe(code);
    expect(error.message.length).toBeGreaterThan(15);
    if (["unbalanced_parentheses", "unbalanced_brackets", "invalid_character", "whitespace_in_smiles"].includes(code)) expect(error.position).toBeGreaterThan(0);
    if (code === "valence") expect(error.atoms?.length).toBe(1);
  });

  it.each(molCases)("MOL block: %s → %s", (_label, block, code, options) => {
    // Uploaded .mol files are read as MOL blocks whatever they look like.
    const error = errorOf(block, (text) => usingMol(readMolBlock(rdkit, text, options), () => undefined));
    expect(error.code).toBe(code);
    expect(error.message).toMatch(/line|atom|limit|bond/i);
  });

  it("reports each bad SD record on its own and keeps the good ones", () => {
    const sdf = [GOOD.replace("acetic acid", "good one") + "> <SUPPLIER_ID>\nX-17\n\n$$$$", "no structure here\n\n$$$$", mol(["C", "Xx", "O", "O"], BONDS) + "$$$$", ""].join("\n");
    const results = readSdf(rdkit, sdf);
    expect(results.map((r) => r.ok)).toEqual([true, false, false]);
    expect(results[0]?.name).toBe("good one");
    expect(results[0]?.data).toEqual({ SUPPLIER_ID: "X-17" });
    expect(results.map((r) => (r.ok ? null : r.error.code))).toEqual([null, "sdf_record_without_molecule", "unknown_element"]);
    expect(results[2]?.ok === false && results[2].error.line).toBe(results[2]?.line !== undefined ? results[2].line + 5 : -1);
  });
});
