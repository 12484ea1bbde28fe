// Registering compounds: read and check every record first, then write the whole batch in one transaction or
// nothing at all. Functions take the database first so tests and scripts can pass their own. Reading (RDKit) runs on
// the engine threads, a slice of records per task, so a large SD file neither holds the event loop nor keeps a
// thread from other people's work for its whole length.
import { type RDKitModule } from "@/lib/chem/structure";
import { type Db } from "@/lib/db/client";
import { isUniqueViolation } from "@/lib/db/errors";
import { ConflictError, ValidationError } from "@/lib/errors";
import { nextTurn } from "@/lib/workers/next-turn";
import { enginePool } from "@/lib/workers/pool";
import { databaseNow, writeTransaction } from "./clock";
import { duplicatesInBatch, readRecords, type CandidateRecord, type ReadRecordsResult, type RecordProblem } from "./import-records";
import { type RegisterCompounds, type StoredPKa } from "./schemas";

export interface CompoundActor {
  groupId: string;
  /** The member who acts (null for scripts). */
  userId: string | null;
}

export interface RegisteredCompound {
  id: string;
  name: string;
  canonicalSmiles: string;
  /** Where it came from in the input, e.g. "Line 3 (aspirin)". */
  label: string;
  siteCount: number;
}

export interface RegistrationResult {
  created: RegisteredCompound[];
  /** Duplicates left out because the input asked to skip them (onDuplicate "skip"). */
  skipped: RecordProblem[];
}

/** Nothing was written; `problems` names every record that stopped the batch. Answered as 422. */
export class RegistrationRejected extends ValidationError {
  constructor(readonly problems: RecordProblem[], readonly recordCount: number) {
    super(
      { records: problems.map((p) => p.message) },
      `Nothing was registered: ${problems.length} of ${recordCount} record${recordCount === 1 ? "" : "s"} need${problems.length === 1 ? "s" : ""} attention.`,
    );
  }
}

/** Rows per insert, with a turn of the event loop between inserts (lib/workers/next-turn.ts). */
const INSERT_CHUNK = 100;
/** Structures per duplicate lookup, with a turn of the event loop between lookups. */
const LOOKUP_CHUNK = 250;
/** Records read per engine task: about a second of a thread for ordinary molecules. */
const READ_SLICE = 100;

/**
 * Registers the batch. With `rdkit` the records are read on the calling thread (scripts that hold a module);
 * otherwise on the engine threads.
 */
export async function registerCompounds(db: Db, actor: CompoundActor, input: RegisterCompounds, rdkit?: RDKitModule): Promise<RegistrationResult> {
  const read = rdkit ? readRecords(rdkit, input.format, input.text) : await readOffThread(input);
  const batch = duplicatesInBatch(read.candidates);
  const existing = await existingDuplicates(db, actor.groupId, batch.unique);
  const duplicates = [...batch.problems, ...existing.problems];
  const recordCount = read.candidates.length + read.problems.length;
  const blocking = [...read.problems, ...(input.onDuplicate === "reject" ? duplicates : [])].sort(byPosition);
  if (blocking.length > 0) throw new RegistrationRejected(blocking, recordCount);
  const toCreate = batch.unique.filter((c) => !existing.ids.has(c.structure.canonicalSmiles));
  if (toCreate.length === 0) return { created: [], skipped: duplicates.sort(byPosition) };

  try {
    const created = await db.$transaction(async (tx) => {
      const stamp = await databaseNow(tx);
      const rows: { id: string; canonicalSmiles: string }[] = [];
      for (let i = 0; i < toCreate.length; i += INSERT_CHUNK) {
        const chunk = toCreate.slice(i, i + INSERT_CHUNK).map((c) => compoundRow(c, actor, input.tags, stamp));
        rows.push(...(await tx.compound.createManyAndReturn({ data: chunk, select: { id: true, canonicalSmiles: true } })));
        await nextTurn();
      }
      await tx.auditEvent.create({
        data: {
          groupId: actor.groupId, actorId: actor.userId, action: "compound.register", entity: "Compound", createdAt: stamp,
          details: { count: rows.length, ids: rows.slice(0, 1000).map((r) => r.id) },
        },
      });
      return rows;
    }, writeTransaction);
    const idOf = new Map(created.map((r) => [r.canonicalSmiles, r.id]));
    return {
      created: toCreate.map((c) => ({
        id: idOf.get(c.structure.canonicalSmiles) ?? "", name: c.name, canonicalSmiles: c.structure.canonicalSmiles, label: c.label, siteCount: c.sites.length,
      })),
      skipped: duplicates.sort(byPosition),
    };
  } catch (error) {
    if (isUniqueViolation(error)) {
      throw new ConflictError("Someone registered one of these structures while this batch was being saved; nothing was saved. Submit again to see which ones are now duplicates.");
    }
    throw error;
  }
}

/** Splits the input on an engine thread (whole-input problems are a 422 on `text`), then reads it slice by slice. */
async function readOffThread(input: RegisterCompounds): Promise<ReadRecordsResult> {
  const pool = enginePool();
  const entries = await pool.run("compoundsSplit", { format: input.format, text: input.text });
  const read: ReadRecordsResult = { candidates: [], problems: [] };
  for (let i = 0; i < entries.length; i += READ_SLICE) {
    // One slice at a time: other requests' engine tasks queue between them instead of waiting for the whole file.
    const part = await pool.run("compoundsDescribe", { format: input.format, entries: entries.slice(i, i + READ_SLICE) });
    read.candidates.push(...part.candidates);
    read.problems.push(...part.problems);
  }
  return read;
}

async function existingDuplicates(db: Db, groupId: string, candidates: CandidateRecord[]) {
  const ids = new Map<string, { id: string; name: string }>();
  const smiles = candidates.map((c) => c.structure.canonicalSmiles);
  // A few hundred values per query: a thousand-value list took over a second of the event loop on PGlite (the query
  // is compiled and run within one turn).
  for (let i = 0; i < smiles.length; i += LOOKUP_CHUNK) {
    const found = await db.compound.findMany({
      where: { groupId, canonicalSmiles: { in: smiles.slice(i, i + LOOKUP_CHUNK) } },
      select: { id: true, name: true, canonicalSmiles: true },
    });
    for (const f of found) ids.set(f.canonicalSmiles, { id: f.id, name: f.name });
    await nextTurn();
  }
  const problems = candidates.flatMap((c): RecordProblem[] => {
    const hit = ids.get(c.structure.canonicalSmiles);
    if (!hit) return [];
    return [{
      line: c.line, record: c.record, label: c.label, name: c.name, code: "duplicate_of_existing",
      message: `${c.label}: already registered as “${hit.name}” (${c.structure.canonicalSmiles}).`,
      duplicateOf: { id: hit.id, name: hit.name },
    }];
  });
  return { ids, problems };
}

function compoundRow(c: CandidateRecord, actor: CompoundActor, tags: string[], stamp: Date) {
  const s = c.structure;
  const pKas: StoredPKa[] = c.sites.map((site) => ({
    value: site.value, kind: site.kind, site: site.site, provenance: "estimated", source: site.source, se: site.se, atoms: site.atoms,
  }));
  return {
    groupId: actor.groupId,
    name: c.name,
    synonyms: c.synonyms,
    tags,
    canonicalSmiles: s.canonicalSmiles,
    molfile: c.molfile,
    formula: s.formula,
    molarMass: s.molarMass,
    crippenLogP: Number.isFinite(s.crippenLogP) ? s.crippenLogP : null,
    tpsa: Number.isFinite(s.tpsa) ? s.tpsa : null,
    pKas,
    fingerprint: new Uint8Array(s.morganFingerprint),
    createdById: actor.userId,
    createdAt: stamp,
    updatedAt: stamp,
  };
}

function byPosition(a: RecordProblem, b: RecordProblem): number {
  return a.line - b.line;
}
