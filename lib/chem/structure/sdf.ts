/**
 * SD files: MOL blocks separated by "$$$$" lines, each optionally followed by data items
 * ("> <FIELD>" header, value lines, blank line), per BIOVIA "CTfile Formats" (2020), SDfile section.
 * Records are read independently so one bad record is reported without hiding the others.
 */
import { type DescribedStructure, describeMol } from "./describe";
import { StructureError } from "./errors";
import { type RDKitModule, usingMol } from "./rdkit";
import { type ReadOptions, readMolBlock } from "./read";

export interface SdfRecord {
  /** 0-based record number in the file. */
  index: number;
  /** 1-based line number of the record's first line in the file. */
  line: number;
  /** The MOL block's first line (the molecule name), trimmed; may be empty. */
  name: string;
  molBlock: string;
  data: Record<string, string>;
}

export interface SdfOptions extends ReadOptions {
  /** Largest accepted file in characters; default 20 000 000. */
  maxFileLength?: number;
  /** Most records per file; default 10 000. */
  maxRecords?: number;
}

export type SdfResult = SdfRecord & ({ ok: true; structure: DescribedStructure } | { ok: false; error: StructureError });

export function splitSdf(text: string, options: SdfOptions = {}): SdfRecord[] {
  const maxFile = options.maxFileLength ?? 20_000_000;
  const maxRecords = options.maxRecords ?? 10_000;
  if (text.length > maxFile) throw new StructureError("input_too_large", `The SD file is ${text.length.toLocaleString("en")} characters; the limit is ${maxFile.toLocaleString("en")}.`);
  const lines = text.replace(/\r\n?/g, "\n").split("\n");
  const records: SdfRecord[] = [];
  let start = 0;
  const flush = (end: number) => {
    const body = lines.slice(start, end);
    if (body.some((l) => l.trim() !== "")) {
      if (records.length >= maxRecords) throw new StructureError("too_many_records", `The SD file has more than ${maxRecords.toLocaleString("en")} records.`);
      records.push(parseRecord(body, records.length, start + 1));
    }
    start = end + 1;
  };
  lines.forEach((line, i) => {
    if (line.trimEnd() === "$$$$") flush(i);
  });
  flush(lines.length);
  if (records.length === 0) throw new StructureError("empty_input", "The SD file contains no records.");
  return records;
}

function parseRecord(body: string[], index: number, line: number): SdfRecord {
  const end = body.findIndex((l) => /^M {2}END\s*$/.test(l));
  const molLines = end < 0 ? body : body.slice(0, end + 1);
  const data: Record<string, string> = {};
  let field: string | undefined;
  let value: string[] = [];
  const close = () => {
    if (field !== undefined) data[field] = value.join("\n").trimEnd();
    field = undefined;
    value = [];
  };
  for (const l of end < 0 ? [] : body.slice(end + 1)) {
    const header = /^>.*<([^>]*)>/.exec(l);
    if (header) {
      close();
      field = (header[1] ?? "").trim();
    } else if (field !== undefined) {
      if (l.trim() === "") close();
      else value.push(l);
    }
  }
  close();
  return { index, line, name: (body[0] ?? "").trim(), molBlock: end < 0 ? "" : molLines.join("\n") + "\n", data };
}

/** Splits, checks and describes every record; a record's failure is returned beside it, never thrown. */
export function readSdf(rdkit: RDKitModule, text: string, options: SdfOptions = {}): SdfResult[] {
  return splitSdf(text, options).map((record): SdfResult => {
    try {
      if (!record.molBlock) {
        throw new StructureError("sdf_record_without_molecule", `Record ${record.index + 1} (line ${record.line}) has no MOL block ending in 'M  END'.`, { line: record.line });
      }
      const structure = usingMol(readMolBlock(rdkit, record.molBlock, { ...options, lineOffset: record.line - 1 }), describeMol);
      return { ...record, ok: true, structure };
    } catch (error) {
      if (!(error instanceof StructureError)) throw error;
      return { ...record, ok: false, error };
    }
  });
}
