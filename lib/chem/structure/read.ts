/**
 * Parsing entry points. Each returns an RDKit molecule that the caller must free (`usingMol`), or throws a
 * StructureError naming the problem. Limits are checked before RDKit runs, so oversize input cannot stall it.
 */
import { StructureError } from "./errors";
import { checkMolBlock, looksLikeMolBlock } from "./molfile";
import { type RDKitModule, type RDKitMol, withRDKitLog } from "./rdkit";
import { errorFromRDKitLog } from "./rdkit-log";
import { checkSmilesLexically } from "./smiles-check";

export interface ReadOptions {
  /** Largest accepted input in characters; default 100 000 (100 kB of ASCII). */
  maxInputLength?: number;
  /** Most atoms (hydrogens included when drawn) a structure may have; default 1000. */
  maxAtoms?: number;
  /** Accept "*", R-group and query atoms (for search queries, not for registered compounds); default false. */
  allowDummyAtoms?: boolean;
}

const DEFAULTS: Required<ReadOptions> = { maxInputLength: 100_000, maxAtoms: 1000, allowDummyAtoms: false };

function settle(options: ReadOptions): Required<ReadOptions> {
  return { ...DEFAULTS, ...options };
}

function checkSize(text: string, what: string, limit: number): string {
  if (text.length > limit) {
    throw new StructureError("input_too_large", `The ${what} is ${text.length.toLocaleString("en")} characters long; the limit is ${limit.toLocaleString("en")}.`);
  }
  if (text.trim() === "") throw new StructureError("empty_input", `The ${what} is empty.`);
  return text;
}

export function readSmiles(rdkit: RDKitModule, smiles: string, options: ReadOptions = {}): RDKitMol {
  const o = settle(options);
  const text = checkSize(smiles, "SMILES", o.maxInputLength).trim();
  checkSmilesLexically(text);
  // Each atom needs at least one character, so the length bounds the atom count before parsing.
  const atomUpperBound = (text.match(/[A-Za-z*]/g) ?? []).length;
  if (atomUpperBound > o.maxAtoms * 2) tooManyAtoms(atomUpperBound, o.maxAtoms);
  const { result: mol, log } = withRDKitLog(rdkit, () => rdkit.get_mol(text));
  return accept(mol, log, "SMILES", o);
}

export function readMolBlock(rdkit: RDKitModule, molBlock: string, options: ReadOptions & { lineOffset?: number } = {}): RDKitMol {
  const o = settle(options);
  const text = checkSize(molBlock, "MOL block", o.maxInputLength).replace(/\r\n?/g, "\n");
  checkMolBlock(text, { maxAtoms: o.maxAtoms, allowQueryAtoms: o.allowDummyAtoms, lineOffset: options.lineOffset });
  const { result: mol, log } = withRDKitLog(rdkit, () => rdkit.get_mol(text));
  return accept(mol, log, "MOL block", o);
}

/** A pasted structure: a MOL block when it has the CTfile shape, otherwise one SMILES. */
export function readStructure(rdkit: RDKitModule, text: string, options: ReadOptions = {}): RDKitMol {
  return looksLikeMolBlock(text) ? readMolBlock(rdkit, text, options) : readSmiles(rdkit, text, options);
}

/** A SMARTS pattern, for substructure queries and site patterns. */
export function readSmarts(rdkit: RDKitModule, smarts: string, options: ReadOptions = {}): RDKitMol {
  const o = settle(options);
  const text = checkSize(smarts, "SMARTS", Math.min(o.maxInputLength, 10_000)).trim();
  if (/\s/.test(text)) throw new StructureError("whitespace_in_smiles", "A SMARTS pattern may not contain spaces or line breaks.");
  const { result: mol, log } = withRDKitLog(rdkit, () => rdkit.get_qmol(text));
  if (!mol || !mol.is_valid()) {
    mol?.delete();
    throw errorFromRDKitLog(log, "SMARTS");
  }
  return mol;
}

function accept(mol: RDKitMol | null, log: string, what: "SMILES" | "MOL block", o: Required<ReadOptions>): RDKitMol {
  if (!mol || !mol.is_valid()) {
    mol?.delete();
    throw errorFromRDKitLog(log, what);
  }
  const atoms = mol.get_num_atoms();
  if (atoms === 0) {
    mol.delete();
    throw new StructureError("empty_input", `The ${what} contains no atoms.`);
  }
  if (atoms > o.maxAtoms) {
    mol.delete();
    tooManyAtoms(atoms, o.maxAtoms);
  }
  if (!o.allowDummyAtoms && mol.get_smiles().includes("*")) {
    mol.delete();
    throw new StructureError("unspecified_atom", `The ${what} contains an unspecified atom (*, R or a query atom); a compound needs every element specified.`);
  }
  return mol;
}

function tooManyAtoms(count: number, limit: number): never {
  throw new StructureError("too_many_atoms", `The structure has ${count} atoms; the limit is ${limit}.`);
}
