/** Pasted SMILES lists: one structure per line, the SMILES first and an optional name after whitespace. */
import { type DescribedStructure, describeMol } from "./describe";
import { StructureError } from "./errors";
import { type RDKitModule, usingMol } from "./rdkit";
import { type ReadOptions, readSmiles } from "./read";

export interface SmilesLine {
  /** 1-based line number in the pasted text. */
  line: number;
  smiles: string;
  name: string;
}

export type SmilesLineResult = SmilesLine & ({ ok: true; structure: DescribedStructure } | { ok: false; error: StructureError });

export function splitSmilesLines(text: string, maxLines = 10_000): SmilesLine[] {
  const entries = text
    .replace(/\r\n?/g, "\n")
    .split("\n")
    .map((raw, i) => ({ raw: raw.trim(), line: i + 1 }))
    .filter((l) => l.raw !== "" && !l.raw.startsWith("#"));
  if (entries.length === 0) throw new StructureError("empty_input", "No SMILES found; paste one structure per line.");
  if (entries.length > maxLines) throw new StructureError("too_many_records", `At most ${maxLines.toLocaleString("en")} structures at once.`);
  return entries.map(({ raw, line }) => {
    const [smiles = "", ...rest] = raw.split(/\s+/);
    return { line, smiles, name: rest.join(" ") };
  });
}

export function readSmilesLines(rdkit: RDKitModule, text: string, options: ReadOptions = {}): SmilesLineResult[] {
  return splitSmilesLines(text).map((entry): SmilesLineResult => {
    try {
      return { ...entry, ok: true, structure: usingMol(readSmiles(rdkit, entry.smiles, options), describeMol) };
    } catch (error) {
      if (!(error instanceof StructureError)) throw error;
      return { ...entry, ok: false, error };
    }
  });
}
