// Turns pasted SMILES or an uploaded MOL/SD file into checked candidate records, one per structure, each either
// described (properties, fingerprint, estimated sites) or carrying a problem that names the record and what is wrong.
// Nothing here touches the database; registration (service.ts) decides what to write. The work comes in two steps
// so that a large file can run on the engine threads in slices (lib/workers): splitting the text into entries
// (whole-input problems are thrown here), then describing a slice of entries with RDKit.
import {
  StructureError,
  describeMol,
  readMolBlock,
  readSmiles,
  splitSdf,
  splitSmilesLines,
  usingMol,
  type DescribedStructure,
  type RDKitModule,
  type SdfRecord,
  type SmilesLine,
} from "@/lib/chem/structure";
import { estimateIonizableSites, type EstimatedPKa } from "@/lib/chem/structure/sites";
import { ValidationError } from "@/lib/errors";
import { MAX_REGISTER_RECORDS, type RegisterFormat } from "./schemas";

/** Where a record sits in what the chemist gave us, for messages. */
export interface RecordPosition {
  /** 1-based line of the SMILES line, or of the SD record's first line. */
  line: number;
  /** 1-based SD record number; absent for SMILES lines. */
  record?: number;
}

/** What registration keeps of a described structure (the rest stays on the thread that read it). */
export type RegisteredStructure = Pick<DescribedStructure, "canonicalSmiles" | "formula" | "molarMass" | "crippenLogP" | "tpsa" | "morganFingerprint">;

export interface CandidateRecord extends RecordPosition {
  /** "Line 3 (aspirin)" or "Record 2 “aspirin” (line 40)". */
  label: string;
  name: string;
  synonyms: string[];
  /** The MOL block as uploaded (kept for its coordinates), null for SMILES. */
  molfile: string | null;
  structure: RegisteredStructure;
  sites: EstimatedPKa[];
}

export interface RecordProblem extends RecordPosition {
  label: string;
  name: string;
  code: StructureError["code"] | "duplicate_in_batch" | "duplicate_of_existing";
  /** Names the record and the problem, e.g. "Line 3 (aspirin): unclosed ring 1 …". */
  message: string;
  /** For duplicates: the compound already registered, or the first record in the batch with this structure. */
  duplicateOf?: { id?: string; name: string; label?: string };
}

export interface ReadRecordsResult {
  candidates: CandidateRecord[];
  problems: RecordProblem[];
}

const NAME_FIELDS = ["name", "title", "compound name", "compound"];
const SYNONYM_FIELDS = ["synonyms", "synonym", "aliases"];
const MAX_NAME = 200;

/** One structure of the input, not yet read: a SMILES line or an SD record. */
export type InputEntry = { kind: "smiles"; entry: SmilesLine } | { kind: "sdf"; entry: SdfRecord };

/**
 * Splits the input into entries. Whole-input problems (empty, too large, too many records) are a ValidationError on
 * `text` (422), before any structure is read.
 */
export function splitInput(format: RegisterFormat, text: string): InputEntry[] {
  let entries: InputEntry[];
  try {
    entries = format === "smiles"
      ? splitSmilesLines(text).map((entry) => ({ kind: "smiles", entry }))
      : splitSdf(text, { maxRecords: MAX_REGISTER_RECORDS }).map((entry) => ({ kind: "sdf", entry }));
  } catch (error) {
    if (error instanceof StructureError) throw new ValidationError({ text: [error.message] }, error.message);
    throw error;
  }
  if (entries.length > MAX_REGISTER_RECORDS) {
    throw new ValidationError({ text: [`At most ${MAX_REGISTER_RECORDS.toLocaleString("en")} structures at once; this input has ${entries.length.toLocaleString("en")}.`] });
  }
  return entries;
}

/** Reads and describes entries (any slice of splitInput's list); every record ends up a candidate or a problem. */
export function describeEntries(rdkit: RDKitModule, format: RegisterFormat, entries: InputEntry[]): ReadRecordsResult {
  const candidates: CandidateRecord[] = [];
  const problems: RecordProblem[] = [];
  for (const e of entries) {
    const result = e.kind === "smiles" ? fromSmiles(rdkit, e.entry) : fromSdf(rdkit, format === "mol" ? "mol" : "sdf", e.entry);
    if ("problem" in result) problems.push(result.problem);
    else candidates.push(result.candidate);
  }
  return { candidates, problems };
}

/** Both steps on the calling thread (scripts and tests that hold an RDKit module). */
export function readRecords(rdkit: RDKitModule, format: RegisterFormat, text: string): ReadRecordsResult {
  return describeEntries(rdkit, format, splitInput(format, text));
}

type Outcome = { candidate: CandidateRecord } | { problem: RecordProblem };

function fromSmiles(rdkit: RDKitModule, r: SmilesLine): Outcome {
  const label = r.name ? `Line ${r.line} (${r.name})` : `Line ${r.line}`;
  const position = { line: r.line };
  let structure: DescribedStructure;
  try {
    structure = usingMol(readSmiles(rdkit, r.smiles), describeMol);
  } catch (error) {
    if (!(error instanceof StructureError)) throw error;
    return { problem: problemOf(error, label, r.name, position) };
  }
  return describeCandidate(rdkit, { ...position, label, name: r.name, synonyms: [], molfile: null, structure: kept(structure) });
}

function fromSdf(rdkit: RDKitModule, format: "sdf" | "mol", r: SdfRecord): Outcome {
  const name = (dataField(r.data, NAME_FIELDS) ?? r.name).slice(0, MAX_NAME);
  const where = format === "mol" ? "The MOL file" : `Record ${r.index + 1}`;
  const label = `${where}${name ? ` “${name}”` : ""} (line ${r.line})`;
  const position = { line: r.line, record: r.index + 1 };
  let structure: DescribedStructure;
  try {
    // As readSdf (lib/chem/structure/sdf.ts) reads one record, with the record's own line numbers in messages.
    if (!r.molBlock) {
      throw new StructureError("sdf_record_without_molecule", `Record ${r.index + 1} (line ${r.line}) has no MOL block ending in 'M  END'.`, { line: r.line });
    }
    structure = usingMol(readMolBlock(rdkit, r.molBlock, { lineOffset: r.line - 1 }), describeMol);
  } catch (error) {
    if (!(error instanceof StructureError)) throw error;
    return { problem: problemOf(error, label, name, position) };
  }
  const synonyms = (dataField(r.data, SYNONYM_FIELDS) ?? "").split(/[\n;|]/).map((s) => s.trim()).filter(Boolean);
  return describeCandidate(rdkit, { ...position, label, name, synonyms, molfile: r.molBlock, structure: kept(structure) });
}

function kept(s: DescribedStructure): RegisteredStructure {
  return { canonicalSmiles: s.canonicalSmiles, formula: s.formula, molarMass: s.molarMass, crippenLogP: s.crippenLogP, tpsa: s.tpsa, morganFingerprint: s.morganFingerprint };
}

/**
 * Sites are detected on the structure as it will be stored (MOL block, else canonical SMILES), so their atom
 * indices match the depiction drawn from the stored text later.
 */
function describeCandidate(rdkit: RDKitModule, base: Omit<CandidateRecord, "sites">): Outcome {
  try {
    const sites = estimateIonizableSites(rdkit, base.molfile ?? base.structure.canonicalSmiles);
    const name = (base.name || base.structure.canonicalSmiles).slice(0, MAX_NAME);
    return { candidate: { ...base, name, sites } };
  } catch (error) {
    if (!(error instanceof StructureError)) throw error;
    return { problem: problemOf(error, base.label, base.name, { line: base.line, record: base.record }) };
  }
}

function problemOf(error: StructureError, label: string, name: string, position: RecordPosition): RecordProblem {
  return { ...position, label, name, code: error.code, message: `${label}: ${error.message}` };
}

function dataField(data: Record<string, string>, names: string[]): string | undefined {
  for (const [key, value] of Object.entries(data)) {
    if (names.includes(key.trim().toLowerCase()) && value.trim() !== "") return value.trim();
  }
  return undefined;
}

/** Later records repeating an earlier record's structure, each reported against the first. */
export function duplicatesInBatch(candidates: CandidateRecord[]): { unique: CandidateRecord[]; problems: RecordProblem[] } {
  const first = new Map<string, CandidateRecord>();
  const unique: CandidateRecord[] = [];
  const problems: RecordProblem[] = [];
  for (const c of candidates) {
    const earlier = first.get(c.structure.canonicalSmiles);
    if (!earlier) {
      first.set(c.structure.canonicalSmiles, c);
      unique.push(c);
      continue;
    }
    problems.push({
      line: c.line, record: c.record, label: c.label, name: c.name, code: "duplicate_in_batch",
      message: `${c.label}: the same structure as ${earlier.label} (${c.structure.canonicalSmiles}).`,
      duplicateOf: { name: earlier.name, label: earlier.label },
    });
  }
  return { unique, problems };
}
