// Registering compounds: read and check every record first, then write the whole batch in one transaction or
// nothing at all. Functions take the database first so tests and scripts can pass their own.
import { loadRDKit, StructureError, type RDKitModule } from "@/lib/chem/structure";
import { type Db } from "@/lib/db/client";
import { isUniqueViolation } from "@/lib/db/errors";
import { ConflictError, ValidationError } from "@/lib/errors";
import { databaseNow, writeTransaction } from "./clock";
import { duplicatesInBatch, readRecords, type CandidateRecord, type RecordProblem } from "./import-records";
import { MAX_REGISTER_RECORDS, type RegisterCompounds, type StoredPKa } from "./schemas";

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

const INSERT_CHUNK = 500;

export async function registerCompounds(db: Db, actor: CompoundActor, input: RegisterCompounds, rdkit?: RDKitModule): Promise<RegistrationResult> {
  const read = readInput(rdkit ?? (await loadRDKit()), input);
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

function readInput(rdkit: RDKitModule, input: RegisterCompounds) {
  try {
    const read = readRecords(rdkit, input.format, input.text);
    const count = read.candidates.length + read.problems.length;
    if (count > MAX_REGISTER_RECORDS) {
      throw new ValidationError({ text: [`At most ${MAX_REGISTER_RECORDS.toLocaleString("en")} structures at once; this input has ${count.toLocaleString("en")}.`] });
    }
    return read;
  } catch (error) {
    // Whole-input problems (empty, too large, too many records) concern the text field, not one record.
    if (error instanceof StructureError) throw new ValidationError({ text: [error.message] }, error.message);
    throw error;
  }
}

async function existingDuplicates(db: Db, groupId: string, candidates: CandidateRecord[]) {
  const ids = new Map<string, { id: string; name: string }>();
  const smiles = candidates.map((c) => c.structure.canonicalSmiles);
  for (let i = 0; i < smiles.length; i += 1000) {
    const found = await db.compound.findMany({
      where: { groupId, canonicalSmiles: { in: smiles.slice(i, i + 1000) } },
      select: { id: true, name: true, canonicalSmiles: true },
    });
    for (const f of found) ids.set(f.canonicalSmiles, { id: f.id, name: f.name });
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
