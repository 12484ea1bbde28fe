// Turns pasted SMILES or an uploaded MOL/SD file into checked candidate records, one per structure, each either
// described (properties, fingerprint, estimated sites) or carrying a problem that names the record and what is wrong.
// Nothing here touches the database; registration (service.ts) decides what to write.
import {
  StructureError,
  readSdf,
  readSmilesLines,
  type DescribedStructure,
  type RDKitModule,
  type SdfResult,
  type SmilesLineResult,
} from "@/lib/chem/structure";
import { estimateIonizableSites, type EstimatedPKa } from "@/lib/chem/structure/sites";
import { MAX_REGISTER_RECORDS, type RegisterFormat } from "./schemas";

/** Where a record sits in what the chemist gave us, for messages. */
export interface RecordPosition {
  /** 1-based line of the SMILES line, or of the SD record's first line. */
  line: number;
  /** 1-based SD record number; absent for SMILES lines. */
  record?: number;
}

export interface CandidateRecord extends RecordPosition {
  /** "Line 3 (aspirin)" or "Record 2 “aspirin” (line 40)". */
  label: string;
  name: string;
  synonyms: string[];
  /** The MOL block as uploaded (kept for its coordinates), null for SMILES. */
  molfile: string | null;
  structure: DescribedStructure;
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

export function readRecords(rdkit: RDKitModule, format: RegisterFormat, text: string): ReadRecordsResult {
  const results = format === "smiles" ? fromSmiles(rdkit, text) : fromSdf(rdkit, format, text);
  const candidates: CandidateRecord[] = [];
  const problems: RecordProblem[] = [];
  for (const result of results) {
    if ("problem" in result) problems.push(result.problem);
    else candidates.push(result.candidate);
  }
  return { candidates, problems };
}

type Outcome = { candidate: CandidateRecord } | { problem: RecordProblem };

function fromSmiles(rdkit: RDKitModule, text: string): Outcome[] {
  return readSmilesLines(rdkit, text).map((r: SmilesLineResult): Outcome => {
    const label = r.name ? `Line ${r.line} (${r.name})` : `Line ${r.line}`;
    const position = { line: r.line };
    if (!r.ok) return { problem: problemOf(r.error, label, r.name, position) };
    return describeCandidate(rdkit, { ...position, label, name: r.name, synonyms: [], molfile: null, structure: r.structure });
  });
}

function fromSdf(rdkit: RDKitModule, format: "sdf" | "mol", text: string): Outcome[] {
  return readSdf(rdkit, text, { maxRecords: MAX_REGISTER_RECORDS }).map((r: SdfResult): Outcome => {
    const name = (dataField(r.data, NAME_FIELDS) ?? r.name).slice(0, MAX_NAME);
    const where = format === "mol" ? "The MOL file" : `Record ${r.index + 1}`;
    const label = `${where}${name ? ` “${name}”` : ""} (line ${r.line})`;
    const position = { line: r.line, record: r.index + 1 };
    if (!r.ok) return { problem: problemOf(r.error, label, name, position) };
    const synonyms = (dataField(r.data, SYNONYM_FIELDS) ?? "").split(/[\n;|]/).map((s) => s.trim()).filter(Boolean);
    return describeCandidate(rdkit, { ...position, label, name, synonyms, molfile: r.molBlock, structure: r.structure });
  });
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
