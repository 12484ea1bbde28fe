/**
 * Loads a group export into a group that holds no compounds, workups or partition data yet, in one transaction:
 * every record gets a new id, references are rewritten, people are matched by email to the group's members, and the
 * group's solvent and reagent library is replaced by the exported one. Exporting the result gives the same document
 * apart from the refs (and people the importing group does not have).
 *
 * Parsing, checking and building the rows (group-import-plan.ts) run on an engine thread for a request's body; the
 * event loop only writes, one chunk of rows per statement, so a large export never holds it for long.
 */
import { type Prisma } from "@/generated/prisma/client";
import { type Db } from "@/lib/db/client";
import { ConflictError } from "@/lib/errors";
import { nextTurn } from "@/lib/workers/next-turn";
import { enginePool } from "@/lib/workers/pool";
import { audit } from "./audit";
import { LONG_TRANSACTION, type Actor, type Tx } from "./context";
import { chunkRows, PERSON_FIELDS, planGroupImport, type GroupImportPlan, type ImportCounts, type PlanTable } from "./group-import-plan";

export { type ImportCounts } from "./group-import-plan";

/** Imports a parsed export document, planned on the calling thread (scripts and tests). */
export async function importGroup(db: Db, actor: Actor, body: unknown): Promise<ImportCounts> {
  return writeGroupImport(db, actor, planGroupImport(body, actor.groupId));
}

/** Imports a request body (UTF-8 JSON bytes), planned on an engine thread; the bytes move there and are unusable after. */
export async function importGroupFile(db: Db, actor: Actor, bytes: Uint8Array): Promise<ImportCounts> {
  const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
  const plan = await enginePool().run("groupImportPlan", { bytes: own, groupId: actor.groupId }, [own.buffer as ArrayBuffer]);
  return writeGroupImport(db, actor, plan);
}

type Row = Record<string, unknown>;

/** Inserts one chunk; rows were built from a document that passed the export schema. */
function insert(tx: Tx, table: PlanTable, rows: Row[]): Promise<unknown> {
  switch (table) {
    case "solvent": return tx.solvent.createMany({ data: rows as unknown as Prisma.SolventCreateManyInput[] });
    case "aqueousReagent": return tx.aqueousReagent.createMany({ data: rows as unknown as Prisma.AqueousReagentCreateManyInput[] });
    case "compound": return tx.compound.createMany({ data: rows as unknown as Prisma.CompoundCreateManyInput[] });
    case "workup": return tx.workup.createMany({ data: rows as unknown as Prisma.WorkupCreateManyInput[] });
    case "workupComponent": return tx.workupComponent.createMany({ data: rows as unknown as Prisma.WorkupComponentCreateManyInput[] });
    case "workupVersion": return tx.workupVersion.createMany({ data: rows as unknown as Prisma.WorkupVersionCreateManyInput[] });
    case "prediction": return tx.prediction.createMany({ data: rows as unknown as Prisma.PredictionCreateManyInput[] });
    case "outcome": return tx.outcome.createMany({ data: rows as unknown as Prisma.OutcomeCreateManyInput[] });
    case "attachment": return tx.attachment.createMany({ data: rows as unknown as Prisma.AttachmentCreateManyInput[] });
    case "partitionObservation": return tx.partitionObservation.createMany({ data: rows as unknown as Prisma.PartitionObservationCreateManyInput[] });
  }
}

async function writeGroupImport(db: Db, actor: Actor, plan: GroupImportPlan): Promise<ImportCounts> {
  const { groupId } = actor;
  return db.$transaction(async (tx) => {
    const [hasCompounds, hasWorkups, hasObservations] = await Promise.all([
      tx.compound.count({ where: { groupId } }), tx.workup.count({ where: { groupId } }), tx.partitionObservation.count({ where: { groupId } }),
    ]);
    if (hasCompounds + hasWorkups + hasObservations > 0) {
      throw new ConflictError(
        `An import needs a group with no records; this one has ${hasCompounds} compounds, ${hasWorkups} workups and ${hasObservations} partition observations.`,
      );
    }
    const members = await tx.membership.findMany({ where: { groupId }, select: { user: { select: { id: true, email: true } } } });
    const byEmail = new Map(members.map((m) => [m.user.email.toLowerCase(), m.user.id]));
    const personId = new Map(plan.people.map((p) => [p.ref, byEmail.get(p.email.toLowerCase()) ?? null]));
    const person = (ref: unknown) => (typeof ref === "string" ? (personId.get(ref) ?? null) : null);
    const unmatchedPeople = plan.people.filter((p) => !personId.get(p.ref)).map((p) => p.email);

    await tx.solvent.deleteMany({ where: { groupId } });
    await tx.aqueousReagent.deleteMany({ where: { groupId } });
    for (const chunk of plan.chunks) {
      const rows = chunkRows(chunk);
      for (const row of rows) {
        for (const field of PERSON_FIELDS[chunk.table]) row[field] = person(row[field]);
        const header = chunk.table === "workupVersion" ? (row["snapshot"] as { header?: Record<string, unknown> }).header : undefined;
        if (header && "chemistId" in header) header["chemistId"] = person(header["chemistId"] ?? null);
      }
      await insert(tx, chunk.table, rows);
      await nextTurn();
    }
    const counts: ImportCounts = { ...plan.counts, unmatchedPeople };
    await audit(tx, actor, "group.import", groupId, { ...counts, exportedAt: plan.exportedAt, fromGroup: plan.fromGroup });
    return counts;
  }, LONG_TRANSACTION);
}
