/**
 * Structural checks on MDL MOL blocks before RDKit parses them. RDKit refuses a malformed block silently (no log
 * line), so these checks say which line is wrong. Column layout: BIOVIA "CTfile Formats" (2020), V2000 counts, atom
 * and bond blocks at fixed columns; V3000 "M  V30" lines.
 */
import { atomicNumber } from "./elements";
import { StructureError } from "./errors";

/** Pseudo-atom symbols the CTfile format allows; A, Q, L, * and R# are query or R-group atoms, D and T are hydrogens. */
const HYDROGEN_ISOTOPES = new Set(["D", "T"]);
const QUERY_ATOMS = new Set(["A", "Q", "L", "LP", "*", "R#", "R", "X", "M", "AH", "QH", "XH", "MH"]);

export interface MolBlockCheckOptions {
  maxAtoms: number;
  allowQueryAtoms: boolean;
  /** Added to reported line numbers (the record's first line in an SD file, minus one). */
  lineOffset?: number;
}

export function looksLikeMolBlock(text: string): boolean {
  return text.includes("\n") && (/V[23]000/.test(text) || /^M {2}END/m.test(text));
}

export function checkMolBlock(block: string, options: MolBlockCheckOptions): void {
  const lines = block.replace(/\r\n?/g, "\n").split("\n");
  while (lines.length > 0 && lines[lines.length - 1]?.trim() === "") lines.pop();
  const offset = options.lineOffset ?? 0;
  const fail = (code: "mol_block_header" | "mol_block_counts" | "mol_block_atom" | "mol_block_bond" | "mol_block_truncated", line: number, message: string) =>
    new StructureError(code, `Line ${line + offset}: ${message}`, { line: line + offset });

  if (lines.length < 4) throw fail("mol_block_header", lines.length, "a MOL block starts with three header lines and a counts line.");
  const counts = lines[3] ?? "";
  const version = /V3000/.test(counts) ? "V3000" : "V2000";
  if (/V\d{4}/.test(counts) && !/V[23]000/.test(counts)) throw fail("mol_block_counts", 4, `unknown CTfile version '${/V\d{4}/.exec(counts)?.[0] ?? ""}' (expected V2000 or V3000).`);
  if (!lines.some((l) => /^M {2}END\s*$/.test(l))) throw fail("mol_block_truncated", lines.length, "the MOL block ends without an 'M  END' line; it looks truncated.");
  if (version === "V3000") return checkV3000(lines, options, fail);

  const atomCount = Number(counts.slice(0, 3));
  const bondCount = Number(counts.slice(3, 6));
  if (!/^[ \d]{6}/.test(counts) || !Number.isInteger(atomCount) || !Number.isInteger(bondCount) || counts.slice(0, 3).trim() === "") {
    throw fail("mol_block_counts", 4, `the counts line must start with the atom and bond counts in columns 1–3 and 4–6 (found '${counts.slice(0, 12)}').`);
  }
  if (atomCount > options.maxAtoms) throw new StructureError("too_many_atoms", `The MOL block declares ${atomCount} atoms; the limit is ${options.maxAtoms}.`, { line: 4 + offset });
  const end = lines.findIndex((l) => /^M {2}END\s*$/.test(l));
  if (4 + atomCount + bondCount > end) {
    throw fail("mol_block_truncated", end + 1, `the counts line declares ${atomCount} atoms and ${bondCount} bonds, but only ${Math.max(0, end - 4)} lines come before 'M  END'.`);
  }
  for (let i = 0; i < atomCount; i++) checkAtomLine(lines[4 + i] ?? "", 5 + i, options, fail);
  const seen = new Set<string>();
  for (let i = 0; i < bondCount; i++) checkBondLine(lines[4 + atomCount + i] ?? "", 5 + atomCount + i, atomCount, seen, fail);
}

type Fail = (code: "mol_block_header" | "mol_block_counts" | "mol_block_atom" | "mol_block_bond" | "mol_block_truncated", line: number, message: string) => StructureError;

function checkAtomLine(line: string, lineNo: number, options: MolBlockCheckOptions, fail: Fail): void {
  const coords = [line.slice(0, 10), line.slice(10, 20), line.slice(20, 30)];
  if (line.length < 32 || coords.some((c) => c.trim() === "" || !Number.isFinite(Number(c)))) {
    throw fail("mol_block_atom", lineNo, `expected an atom line with x, y, z in columns 1–30 and the element symbol from column 32 (found '${line.slice(0, 40)}').`);
  }
  checkSymbol(line.slice(31, 34).trim(), lineNo, options);
}

function checkSymbol(symbol: string, rawLine: number, options: MolBlockCheckOptions): void {
  const lineNo = rawLine + (options.lineOffset ?? 0);
  if (atomicNumber(symbol) !== undefined || HYDROGEN_ISOTOPES.has(symbol)) return;
  if (QUERY_ATOMS.has(symbol)) {
    if (options.allowQueryAtoms) return;
    throw new StructureError("unspecified_atom", `Line ${lineNo}: atom '${symbol}' is a query or R-group atom; a compound needs every element specified.`, { line: lineNo });
  }
  throw new StructureError("unknown_element", `Line ${lineNo}: '${symbol}' is not an element symbol.`, { line: lineNo });
}

function checkBondLine(line: string, lineNo: number, atomCount: number, seen: Set<string>, fail: Fail): void {
  const a = Number(line.slice(0, 3));
  const b = Number(line.slice(3, 6));
  const type = Number(line.slice(6, 9));
  if (line.length < 9 || [line.slice(0, 3), line.slice(3, 6), line.slice(6, 9)].some((f) => f.trim() === "") || ![a, b, type].every(Number.isInteger)) {
    throw fail("mol_block_bond", lineNo, `expected a bond line with two atom numbers and a bond type in columns 1–9 (found '${line.slice(0, 20)}').`);
  }
  if (a < 1 || b < 1 || a > atomCount || b > atomCount) throw fail("mol_block_bond", lineNo, `bond between atoms ${a} and ${b}, but the block has ${atomCount} atoms.`);
  if (a === b) throw fail("mol_block_bond", lineNo, `bond from atom ${a} to itself.`);
  if (type < 1 || type > 8) throw fail("mol_block_bond", lineNo, `bond type ${type} is not defined (1 single, 2 double, 3 triple, 4 aromatic, 5–8 query types).`);
  const key = a < b ? `${a}-${b}` : `${b}-${a}`;
  if (seen.has(key)) throw fail("mol_block_bond", lineNo, `atoms ${a} and ${b} are bonded twice.`);
  seen.add(key);
}

function checkV3000(lines: string[], options: MolBlockCheckOptions, fail: Fail): void {
  const v30 = lines.map((l, i) => ({ text: l, no: i + 1 })).filter((l) => l.text.startsWith("M  V30 "));
  const find = (re: RegExp) => v30.find((l) => re.test(l.text.slice(7)));
  const countsLine = find(/^COUNTS\s/);
  const beginCtab = find(/^BEGIN CTAB/);
  const endCtab = find(/^END CTAB/);
  if (!beginCtab || !endCtab) throw fail("mol_block_truncated", lines.length, "a V3000 block needs 'M  V30 BEGIN CTAB' and 'M  V30 END CTAB'.");
  const counts = countsLine ? /^COUNTS\s+(\d+)\s+(\d+)/.exec(countsLine.text.slice(7)) : null;
  if (!countsLine || !counts) throw fail("mol_block_counts", countsLine?.no ?? beginCtab.no + 1, "a V3000 block needs 'M  V30 COUNTS <atoms> <bonds> ...'.");
  const atomCount = Number(counts[1]);
  const bondCount = Number(counts[2]);
  if (atomCount > options.maxAtoms) throw new StructureError("too_many_atoms", `The MOL block declares ${atomCount} atoms; the limit is ${options.maxAtoms}.`, { line: countsLine.no + (options.lineOffset ?? 0) });
  const section = (name: string) => {
    const begin = v30.findIndex((l) => l.text.slice(7).startsWith(`BEGIN ${name}`));
    const end = v30.findIndex((l) => l.text.slice(7).startsWith(`END ${name}`));
    return begin < 0 ? [] : v30.slice(begin + 1, end < 0 ? undefined : end);
  };
  const atoms = section("ATOM");
  if (atoms.length !== atomCount) throw fail("mol_block_truncated", countsLine.no, `COUNTS declares ${atomCount} atoms but the ATOM section has ${atoms.length} lines.`);
  const ids = new Set<number>();
  for (const atom of atoms) {
    const fields = atom.text.slice(7).trim().split(/\s+/);
    if (fields.length < 5 || !fields.slice(2, 5).every((f) => Number.isFinite(Number(f)))) throw fail("mol_block_atom", atom.no, "expected 'index type x y z aamap'.");
    ids.add(Number(fields[0]));
    const symbol = fields[1] ?? "";
    if (!symbol.startsWith("[")) checkSymbol(symbol, atom.no, options);
  }
  const bonds = section("BOND");
  if (bonds.length !== bondCount) throw fail("mol_block_truncated", countsLine.no, `COUNTS declares ${bondCount} bonds but the BOND section has ${bonds.length} lines.`);
  for (const bond of bonds) {
    const [, type, a, b] = bond.text.slice(7).trim().split(/\s+/).map(Number);
    if (![type, a, b].every((n) => Number.isInteger(n))) throw fail("mol_block_bond", bond.no, "expected 'index type atom1 atom2'.");
    if (!ids.has(a ?? -1) || !ids.has(b ?? -1)) throw fail("mol_block_bond", bond.no, `bond refers to atom ${ids.has(a ?? -1) ? b : a}, which is not in the ATOM section.`);
  }
}
