// Replacing a structure's estimates with measured or literature values, undoing that, and deleting an unused
// compound. Every change names the value the editor saw; if the row changed since, nothing is written (409), so one
// chemist never silently overwrites another's value. Old and new values go to the audit log.
import { type Db, type DbTransaction as Tx } from "@/lib/db/client";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import { enqueueRevalidation } from "@/lib/jobs/revalidate";
import { databaseNow, writeTransaction } from "./clock";
import { formatLogPSource } from "./provenance";
import { readStoredPKas, type LogPEdit, type PKaEdit, type StoredPKa } from "./schemas";
import { type CompoundActor } from "./service";

const changed = (what: string, now: string) =>
  new ConflictError(`The ${what} changed to ${now} since you opened this page; nothing was saved. Reload to see the current value.`);

async function lockedRow(tx: Tx, actor: CompoundActor, id: string) {
  const row = await tx.compound.findFirst({ where: { id, groupId: actor.groupId }, select: { id: true, logP: true, logPSource: true, pKas: true, updatedAt: true } });
  if (!row) throw new NotFoundError("compound");
  return row;
}

/**
 * Writes only if nobody else wrote the row after we read it (compare-and-set on the DB-clock stamp), and queues the
 * re-prediction of the workups using the compound in the same transaction, so the edit and its job commit together.
 */
async function writeIfUnchanged(tx: Tx, actor: CompoundActor, row: { id: string; updatedAt: Date }, data: object, audit: { action: string; details: object; reason: string }) {
  const stamp = await databaseNow(tx);
  const { count } = await tx.compound.updateMany({ where: { id: row.id, groupId: actor.groupId, updatedAt: row.updatedAt }, data: { ...data, updatedAt: stamp } });
  if (count !== 1) throw new ConflictError("Someone else saved this compound at the same moment; nothing was saved. Reload and try again.");
  const { reason, ...event } = audit;
  await tx.auditEvent.create({ data: { groupId: actor.groupId, actorId: actor.userId, entity: "Compound", entityId: row.id, createdAt: stamp, ...event } });
  await enqueueRevalidation(tx, actor.groupId, { compoundIds: [row.id], reason });
}

const show = (v: number | null | undefined) => (v === null || v === undefined ? "no value" : String(v));

export async function setLogP(db: Db, actor: CompoundActor, edit: LogPEdit): Promise<void> {
  await db.$transaction(async (tx) => {
    const row = await lockedRow(tx, actor, edit.compoundId);
    if (row.logP !== edit.expected) throw changed("log P", show(row.logP));
    const logPSource = formatLogPSource(edit.provenance, edit.source);
    await writeIfUnchanged(tx, actor, row, { logP: edit.value, logPSource }, {
      action: "compound.logP.set", reason: `log P set to ${edit.value} (${logPSource})`, details: { old: { value: row.logP, source: row.logPSource }, new: { value: edit.value, source: logPSource } },
    });
  }, writeTransaction);
}

/** Removes the measured or literature log P, so the structure estimate applies again. */
export async function clearLogP(db: Db, actor: CompoundActor, compoundId: string, expected: number | null): Promise<void> {
  await db.$transaction(async (tx) => {
    const row = await lockedRow(tx, actor, compoundId);
    if (row.logP !== expected) throw changed("log P", show(row.logP));
    if (row.logP === null) return;
    await writeIfUnchanged(tx, actor, row, { logP: null, logPSource: null }, {
      action: "compound.logP.clear", reason: "log P cleared; the structure estimate applies again", details: { old: { value: row.logP, source: row.logPSource }, new: null },
    });
  }, writeTransaction);
}

export async function setPKa(db: Db, actor: CompoundActor, edit: PKaEdit): Promise<void> {
  await db.$transaction(async (tx) => {
    const row = await lockedRow(tx, actor, edit.compoundId);
    const pKas = readStoredPKas(row.pKas);
    if (edit.index > pKas.length) throw new ValidationError({ index: ["no such site"] });
    const current = pKas[edit.index];
    if ((current?.value ?? null) !== edit.expected) throw changed("pKa", show(current?.value));
    const next: StoredPKa = {
      value: edit.value, kind: edit.kind, site: current?.site ?? "added by hand", provenance: edit.provenance, source: edit.source,
      ...(edit.se !== undefined ? { se: edit.se } : {}),
      ...(current?.atoms ? { atoms: current.atoms } : {}),
      ...(current ? { estimate: current.provenance === "estimated" ? { value: current.value, source: current.source, se: current.se } : current.estimate } : {}),
    };
    const updated = [...pKas];
    updated[edit.index] = next;
    await writeIfUnchanged(tx, actor, row, { pKas: updated }, { action: "compound.pKa.set", reason: `pKa of ${next.site} set to ${edit.value}`, details: { index: edit.index, old: current ?? null, new: next } });
  }, writeTransaction);
}

/** Puts a site back to its estimate from the structure, or removes a site that was added by hand. */
export async function revertPKa(db: Db, actor: CompoundActor, compoundId: string, index: number, expected: number): Promise<void> {
  await db.$transaction(async (tx) => {
    const row = await lockedRow(tx, actor, compoundId);
    const pKas = readStoredPKas(row.pKas);
    const current = pKas[index];
    if (!current) throw new NotFoundError("site");
    if (current.value !== expected) throw changed("pKa", show(current.value));
    const updated = [...pKas];
    if (current.estimate) {
      const { estimate, ...rest } = current;
      updated[index] = { ...rest, value: estimate.value, provenance: "estimated", source: estimate.source, ...(estimate.se !== undefined ? { se: estimate.se } : {}) };
    } else {
      updated.splice(index, 1);
    }
    await writeIfUnchanged(tx, actor, row, { pKas: updated }, { action: "compound.pKa.revert", reason: `pKa of ${current.site} reverted`, details: { index, old: current, new: updated[index] ?? null } });
  }, writeTransaction);
}

/**
 * Deletes a compound no workup or partition observation refers to, leaving a tombstone in the audit log that other
 * app instances' search indexes read (search-service.ts).
 */
export async function deleteCompound(db: Db, actor: CompoundActor, compoundId: string): Promise<void> {
  await db.$transaction(async (tx) => {
    const row = await tx.compound.findFirst({ where: { id: compoundId, groupId: actor.groupId }, select: { id: true, name: true, canonicalSmiles: true } });
    if (!row) throw new NotFoundError("compound");
    const workups = await tx.workupComponent.count({ where: { groupId: actor.groupId, compoundId } });
    const observations = await tx.partitionObservation.count({ where: { groupId: actor.groupId, compoundId } });
    if (workups + observations > 0) {
      throw new ConflictError(`“${row.name}” is used in ${workups} workup component${workups === 1 ? "" : "s"} and ${observations} partition observation${observations === 1 ? "" : "s"}; it cannot be deleted.`);
    }
    const stamp = await databaseNow(tx);
    await tx.compound.deleteMany({ where: { id: row.id, groupId: actor.groupId } });
    await tx.auditEvent.create({
      data: { groupId: actor.groupId, actorId: actor.userId, action: COMPOUND_DELETED, entity: "Compound", entityId: row.id, createdAt: stamp, details: { name: row.name, canonicalSmiles: row.canonicalSmiles } },
    });
  }, writeTransaction);
}

/** The audit action that marks a deleted compound (the search index's tombstone). */
export const COMPOUND_DELETED = "compound.delete";
