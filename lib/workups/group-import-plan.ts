/**
 * The CPU-heavy half of a group import (group-import.ts): the export document is parsed, checked against its schema
 * and for consistency, every record gets a new id, references are rewritten and attachments are decoded and checked,
 * giving the rows to insert. Pure (no database), so an engine thread runs it (lib/workers) and the event loop only
 * writes. Rows travel in chunks of at most CHUNK_ROWS rows or about CHUNK_BYTES bytes, each row serialized on its
 * own (node:v8), so the event loop never decodes or inserts more than one chunk at a time.
 *
 * People are matched to the importing group's members inside the write transaction, so person fields still hold the
 * export's person refs here (PERSON_FIELDS says which).
 */
import { createHash } from "node:crypto";
import v8 from "node:v8";
import { bodyJson, bodyText } from "@/lib/api/body";
import { isThumbnail, sniffType } from "@/lib/attachments/content";
import { workupInputSchema } from "@/lib/chem/schema";
import { withoutUnknownKeys } from "@/lib/chem/schema-strict";
import { ValidationError, parseInput, type FieldErrors } from "@/lib/errors";
import { groupExportSchema, type ExportedWorkup, type GroupExport } from "./export-format";
import { newRecordId } from "./ids";

export interface ImportCounts {
  solvents: number;
  reagents: number;
  compounds: number;
  observations: number;
  workups: number;
  versions: number;
  predictions: number;
  outcomes: number;
  attachments: number;
  /** Emails of exported people who are not members of this group; their references were left empty. */
  unmatchedPeople: string[];
}

/** Tables in the order they are written (each row's references are written before it). */
export const PLAN_TABLES = [
  "solvent", "aqueousReagent", "compound", "workup", "workupComponent", "workupVersion", "prediction", "outcome", "attachment", "partitionObservation",
] as const;
export type PlanTable = (typeof PLAN_TABLES)[number];

/** Columns holding an export person ref until the write maps it to a member's id (or null). */
export const PERSON_FIELDS: Record<PlanTable, string[]> = {
  solvent: [], aqueousReagent: [], compound: ["createdById"], workup: ["chemistId", "createdById", "updatedById"], workupComponent: [],
  workupVersion: ["editedById"], prediction: [], outcome: ["reportedById"], attachment: ["createdById"], partitionObservation: ["createdById"],
};

export interface PlanChunk {
  table: PlanTable;
  /** End offset in `data` of each row's serialized bytes. */
  ends: number[];
  data: Uint8Array;
}

export interface GroupImportPlan {
  counts: Omit<ImportCounts, "unmatchedPeople">;
  people: { ref: string; email: string }[];
  exportedAt: string;
  fromGroup: string;
  chunks: PlanChunk[];
}

const CHUNK_ROWS = 200;
const CHUNK_BYTES = 256 * 1024;

/** Every ref must point at a record of the document; specs must still pass the engine's schema. */
function checkConsistency(doc: GroupExport): void {
  const fields: FieldErrors = {};
  const compounds = new Set(doc.compounds.map((c) => c.ref));
  const workups = new Set(doc.workups.map((w) => w.ref));
  const complain = (path: string, message: string) => (fields[path] ??= []).push(message);
  if (compounds.size !== doc.compounds.length) complain("compounds", "two compounds share a ref");
  if (workups.size !== doc.workups.length) complain("workups", "two workups share a ref");
  doc.observations.forEach((o, i) => {
    if (!compounds.has(o.compound)) complain(`observations.${i}.compound`, `no compound with ref '${o.compound}'`);
    if (o.workup !== null && !workups.has(o.workup)) complain(`observations.${i}.workup`, `no workup with ref '${o.workup}'`);
  });
  doc.workups.forEach((w, i) => {
    w.components.forEach((c, j) => {
      if (c.compound !== null && !compounds.has(c.compound)) complain(`workups.${i}.components.${j}.compound`, `no compound with ref '${c.compound}'`);
    });
    // The specs are the exporting app's stored records: keys an older version accepted are dropped, as on every
    // re-read of stored data (validateWorkup's `stored`), not refused.
    const spec = workupInputSchema.safeParse(withoutUnknownKeys(workupInputSchema, w.spec).value);
    if (!spec.success) for (const issue of spec.error.issues) complain(`workups.${i}.spec.${issue.path.join(".")}`, issue.message);
    if (!w.versions.some((v) => v.version === w.version)) complain(`workups.${i}.versions`, `no snapshot of the current version ${w.version}`);
  });
  if (Object.keys(fields).length > 0) throw new ValidationError(fields, "The export document is not consistent.");
}

/** A stored file as the import writes it: its type is decided again from its bytes, and its checksum must match. */
function attachmentRow(a: ExportedWorkup["attachments"][number], groupId: string, workupId: string) {
  const data = Uint8Array.from(Buffer.from(a.data, "base64"));
  const type = sniffType(data);
  if (!type || createHash("sha256").update(data).digest("hex") !== a.sha256) {
    throw new ValidationError({ attachments: [`${a.fileName}: its content does not match its checksum or is not a kind of file kept here`] });
  }
  const thumbnail = a.thumbnail === null ? null : Uint8Array.from(Buffer.from(a.thumbnail, "base64"));
  return {
    groupId, workupId, target: a.target, fileName: a.fileName, mediaType: type.mediaType, sizeBytes: data.byteLength, sha256: a.sha256, data,
    thumbnail: thumbnail && isThumbnail(thumbnail) ? thumbnail : null, createdById: a.createdBy, createdAt: new Date(a.createdAt),
  };
}

function workupRow(w: ExportedWorkup, id: string, groupId: string) {
  return {
    id, groupId, title: w.title, performedOn: new Date(w.performedOn), chemistId: w.chemist, notebookRef: w.notebookRef, notebookUrl: w.notebookUrl,
    scaleMmol: w.scaleMmol, expectedProductMmol: w.expectedProductMmol, assayedProductMmol: w.assayedProductMmol, spec: w.spec,
    version: w.version, searchText: w.searchText, solventKeys: w.solventKeys, flagged: w.flagged, deviationPct: w.deviationPct,
    status: w.status, createdById: w.createdBy, updatedById: w.updatedBy,
    createdAt: new Date(w.createdAt), updatedAt: new Date(w.updatedAt),
  };
}

type Snapshot = { header?: { chemistId?: string | null }; links?: { key: string; compoundId: string | null }[] };

/** Serializes rows into chunks bounded by CHUNK_ROWS and CHUNK_BYTES (a larger single row is a chunk of its own). */
class Chunker {
  readonly chunks: PlanChunk[] = [];
  private table: PlanTable | null = null;
  private parts: Buffer[] = [];
  private size = 0;

  add(table: PlanTable, rows: Iterable<unknown>): number {
    let n = 0;
    for (const row of rows) {
      const bytes = v8.serialize(row);
      if (this.table !== table || this.parts.length >= CHUNK_ROWS || (this.size > 0 && this.size + bytes.byteLength > CHUNK_BYTES)) this.flush();
      this.table = table;
      this.parts.push(bytes);
      this.size += bytes.byteLength;
      n++;
    }
    return n;
  }

  flush(): void {
    if (this.table === null || this.parts.length === 0) return;
    // A buffer of its own (not a slice of Node's pool), so it can be transferred to another thread.
    const data = new Uint8Array(this.size);
    const ends: number[] = [];
    let at = 0;
    for (const part of this.parts) {
      data.set(part, at);
      at += part.byteLength;
      ends.push(at);
    }
    this.chunks.push({ table: this.table, ends, data });
    this.parts = [];
    this.size = 0;
  }
}

/** The rows of a chunk, in order. */
export function chunkRows(chunk: PlanChunk): Record<string, unknown>[] {
  let start = 0;
  return chunk.ends.map((end) => {
    const row = v8.deserialize(chunk.data.subarray(start, end)) as Record<string, unknown>;
    start = end;
    return row;
  });
}

/** A request body's bytes (UTF-8 JSON) as a plan: 400 for a body that is not JSON, 422 for a document that does not fit. */
export function planGroupImportBytes(bytes: Uint8Array, groupId: string): GroupImportPlan {
  return planGroupImport(bodyJson(bodyText(bytes)), groupId);
}

export function planGroupImport(body: unknown, groupId: string): GroupImportPlan {
  const doc = parseInput(groupExportSchema, body);
  checkConsistency(doc);
  const compoundId = new Map(doc.compounds.map((c) => [c.ref, newRecordId()]));
  const workupId = new Map(doc.workups.map((w) => [w.ref, newRecordId()]));
  const mapCompound = (ref: string | null) => (ref === null ? null : (compoundId.get(ref) ?? null));
  const each = function* <T>(pick: (w: ExportedWorkup, id: string) => T[]) {
    for (const w of doc.workups) yield* pick(w, workupId.get(w.ref)!);
  };
  const out = new Chunker();
  const library = (rows: GroupExport["solvents"]) =>
    rows.map((r) => ({ groupId, key: r.key, name: r.name, props: r.props, builtin: r.builtin, updatedAt: new Date(r.updatedAt) }));
  out.add("solvent", library(doc.solvents));
  out.add("aqueousReagent", library(doc.reagents));
  out.add("compound", doc.compounds.map(({ ref, fingerprint, createdBy, createdAt, updatedAt, pKas, ...c }) => ({
    ...c, id: compoundId.get(ref)!, groupId, pKas, createdById: createdBy,
    fingerprint: fingerprint === null ? null : new Uint8Array(Buffer.from(fingerprint, "base64")),
    createdAt: new Date(createdAt), updatedAt: new Date(updatedAt),
  })));
  out.add("workup", doc.workups.map((w) => workupRow(w, workupId.get(w.ref)!, groupId)));
  out.add("workupComponent", each((w, id) => w.components.map(({ compound, ...c }) => ({ ...c, groupId, workupId: id, compoundId: mapCompound(compound) }))));
  const versions = out.add("workupVersion", each((w, id) => w.versions.map((v) => {
    const snapshot = structuredClone(v.snapshot) as Snapshot;
    if (Array.isArray(snapshot.links)) snapshot.links = snapshot.links.map((l) => ({ ...l, compoundId: mapCompound(l.compoundId) }));
    return { groupId, workupId: id, version: v.version, snapshot, editedById: v.editedBy, createdAt: new Date(v.createdAt) };
  })));
  const predictions = out.add("prediction", each((w, id) => w.predictions.map((p) => ({ ...p, groupId, workupId: id, createdAt: new Date(p.createdAt) }))));
  const outcomes = out.add("outcome", each((w, id) => (w.outcome ? [w.outcome] : []).map(({ reportedBy, createdAt, updatedAt, ...o }) => ({
    ...o, groupId, workupId: id, reportedById: reportedBy, createdAt: new Date(createdAt), updatedAt: new Date(updatedAt),
  }))));
  const attachments = out.add("attachment", each((w, id) => w.attachments.map((a) => attachmentRow(a, groupId, id))));
  out.add("partitionObservation", doc.observations.map(({ ref: _ref, compound, workup, createdBy, createdAt, ...o }) => ({
    ...o, groupId, id: newRecordId(), compoundId: compoundId.get(compound)!, workupId: workup === null ? null : (workupId.get(workup) ?? null),
    createdById: createdBy, createdAt: new Date(createdAt),
  })));
  out.flush();
  return {
    counts: {
      solvents: doc.solvents.length, reagents: doc.reagents.length, compounds: doc.compounds.length, observations: doc.observations.length,
      workups: doc.workups.length, versions, predictions, outcomes, attachments,
    },
    people: doc.people.map((p) => ({ ref: p.ref, email: p.email })),
    exportedAt: doc.exportedAt,
    fromGroup: doc.group.name,
    chunks: out.chunks,
  };
}
