/**
 * Writing partition observations: a member adds a measurement; a lead excludes or restores an observation. Each
 * write, its audit event and the re-validation of the affected workups are one transaction, so a measurement never
 * exists without the job that re-predicts the workups it changes.
 */
import { type Prisma } from "@/generated/prisma/client";
import { resolveLibrary } from "@/lib/chem/library";
import { type PKa } from "@/lib/chem/schema";
import { readStoredPKas } from "@/lib/compounds/schemas";
import { type Db } from "@/lib/db/client";
import { NotFoundError, ValidationError, parseInput } from "@/lib/errors";
import { enqueueRevalidation } from "@/lib/jobs/revalidate";
import { groupLibrary } from "@/lib/workups/library";
import { measuredLogK, MeasurementRejected } from "./measured";
import { exclusionInputSchema, measurementInputSchema, METHOD_LABELS } from "./schemas";

export interface PartitionActor {
  groupId: string;
  userId: string;
}

export interface AddedObservation {
  id: string;
  logD: number;
  logK: number;
  se: number;
  bound: "value" | "lower" | "upper";
  jobId: string | null;
}

function json(value: object): Prisma.InputJsonObject {
  return JSON.parse(JSON.stringify(value)) as Prisma.InputJsonObject;
}

export async function addMeasurement(db: Db, actor: PartitionActor, input: unknown): Promise<AddedObservation> {
  const m = parseInput(measurementInputSchema, input);
  const compound = await db.compound.findFirst({ where: { id: m.compoundId, groupId: actor.groupId }, select: { id: true, name: true, pKas: true } });
  if (!compound) throw new ValidationError({ compoundId: ["no such compound in this group"] });
  const solvents = resolveLibrary(await groupLibrary(db, actor.groupId)).solvents;
  const solvent = solvents[m.solventKey];
  if (!solvent) throw new ValidationError({ solventKey: [`unknown solvent '${m.solventKey}'`] });
  if (solvent.waterMiscible || !solvent.partition) throw new ValidationError({ solventKey: [`${solvent.name} mixes with water and forms no second layer`] });

  const pKas: PKa[] = readStoredPKas(compound.pKas).map((p) => ({ value: p.value, kind: p.kind, provenance: p.provenance, ...(p.se !== undefined ? { se: p.se } : {}) }));
  let result;
  try {
    result = measuredLogK(m, pKas);
  } catch (error) {
    if (error instanceof MeasurementRejected) throw new ValidationError(error.fields, "This measurement cannot be used as it stands.");
    throw error;
  }
  const details = {
    basis: m.basis, organic: m.organic, aqueous: m.aqueous, organicVolumeMl: m.organicVolumeMl ?? null, aqueousVolumeMl: m.aqueousVolumeMl ?? null,
    totalAmount: m.totalAmount ?? null, belowDetection: m.belowDetection, logD: result.logD, fractionNeutral: result.fractionNeutral,
    correction: result.correction, massBalance: result.massBalance, seParts: result.seParts, notes: m.notes,
    sites: pKas.map((p) => ({ value: p.value, kind: p.kind, provenance: p.provenance })),
  };
  return db.$transaction(async (tx) => {
    const row = await tx.partitionObservation.create({
      data: {
        groupId: actor.groupId, compoundId: compound.id, solventKey: m.solventKey, aqueousPh: m.aqueousPh ?? null, temperatureC: m.temperatureC,
        logK: result.logK, logKSe: result.bound === "value" ? result.se : null, kind: "measured", bound: result.bound,
        method: METHOD_LABELS[m.method], weight: 1, details: json(details), createdById: actor.userId,
      },
      select: { id: true },
    });
    await tx.auditEvent.create({
      data: {
        groupId: actor.groupId, actorId: actor.userId, action: "partition.measure", entity: "PartitionObservation", entityId: row.id,
        details: json({ compound: compound.name, solventKey: m.solventKey, logK: result.logK, se: result.se, bound: result.bound, method: m.method }),
      },
      select: { id: true },
    });
    const jobId = await enqueueRevalidation(tx, actor.groupId, { compoundIds: [compound.id], reason: `new ${METHOD_LABELS[m.method].toLowerCase()} of ${compound.name} in ${solvent.name}` });
    return { id: row.id, logD: result.logD, logK: result.logK, se: result.se, bound: result.bound, jobId };
  });
}

/** Excludes an observation from the pooled value, or restores it (group leads; the guard checks the role). */
export async function setExclusion(db: Db, actor: PartitionActor, input: unknown): Promise<{ jobId: string | null }> {
  const { observationId, excluded, reason } = parseInput(exclusionInputSchema, input);
  return db.$transaction(async (tx) => {
    const row = await tx.partitionObservation.findFirst({
      where: { id: observationId, groupId: actor.groupId }, select: { id: true, compoundId: true, excluded: true, solventKey: true },
    });
    if (!row) throw new NotFoundError("observation");
    if (row.excluded === excluded) return { jobId: null };
    await tx.partitionObservation.updateMany({ where: { id: row.id, groupId: actor.groupId }, data: { excluded } });
    await tx.auditEvent.create({
      data: {
        groupId: actor.groupId, actorId: actor.userId, action: excluded ? "partition.exclude" : "partition.include",
        entity: "PartitionObservation", entityId: row.id, details: json({ solventKey: row.solventKey, reason }),
      },
      select: { id: true },
    });
    const jobId = await enqueueRevalidation(tx, actor.groupId, { compoundIds: [row.compoundId], reason: excluded ? "an observation was excluded" : "an observation was restored" });
    return { jobId };
  });
}
