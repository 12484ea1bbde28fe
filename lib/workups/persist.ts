// Writes shared by create, update and import, always inside the caller's transaction: reference checks, the
// component rows, the version snapshot and the stored prediction of one version.
import { type Prisma } from "@/generated/prisma/client";
import { ValidationError, type FieldErrors } from "@/lib/errors";
import { type Actor, type Tx } from "./context";
import { type ComputedPrediction } from "./prediction";
import { componentRows, type WorkupSnapshot } from "./record";
import { type ComponentLink, type WorkupHeader } from "./schemas";

/**
 * The chemist must be a member of the group and every linked compound must be the group's; otherwise 422 with the
 * field named (another group's compound reads exactly like a missing one). Returns the linked compounds' names and
 * synonyms for the search text.
 */
export async function checkReferences(
  tx: Tx,
  groupId: string,
  header: Pick<WorkupHeader, "chemistId">,
  links: readonly ComponentLink[],
  prefix = "",
): Promise<string[]> {
  const fields: FieldErrors = {};
  if (header.chemistId) {
    const member = await tx.membership.findFirst({ where: { groupId, userId: header.chemistId }, select: { id: true } });
    if (!member) fields[`${prefix}header.chemistId`] = ["the chemist must be a member of this group"];
  }
  const wanted = [...new Set(links.map((l) => l.compoundId).filter((id): id is string => id !== null))];
  const compounds = wanted.length > 0
    ? await tx.compound.findMany({ where: { groupId, id: { in: wanted } }, select: { id: true, name: true, synonyms: true } })
    : [];
  const known = new Set(compounds.map((c) => c.id));
  links.forEach((link, i) => {
    if (link.compoundId !== null && !known.has(link.compoundId)) fields[`${prefix}links.${i}.compoundId`] = ["no such compound in this group"];
  });
  if (Object.keys(fields).length > 0) throw new ValidationError(fields);
  return compounds.flatMap((c) => [c.name, ...c.synonyms]);
}

export function asJson(value: unknown): Prisma.InputJsonValue {
  return value as Prisma.InputJsonValue; // plain JSON built by this feature (snapshots, engine results)
}

export interface VersionWrite {
  workupId: string;
  version: number;
  snapshot: WorkupSnapshot;
  prediction: ComputedPrediction;
  links: readonly ComponentLink[];
  createdAt?: Date;
}

/** Replaces the component rows and records the version snapshot and its prediction. */
export async function writeVersion(tx: Tx, actor: Actor, write: VersionWrite): Promise<void> {
  const { workupId, version, snapshot, prediction } = write;
  const { groupId } = actor;
  await tx.workupComponent.deleteMany({ where: { workupId, groupId } });
  await tx.workupComponent.createMany({
    data: componentRows(prediction.parsed, write.links).map((row) => ({ ...row, groupId, workupId })),
  });
  await tx.workupVersion.create({
    data: { groupId, workupId, version, snapshot: asJson(snapshot), editedById: actor.userId, ...(write.createdAt ? { createdAt: write.createdAt } : {}) },
    select: { id: true },
  });
  await tx.prediction.create({
    data: {
      groupId, workupId, workupVersion: version,
      engineVersion: prediction.engineVersion,
      result: asJson(prediction.result),
      productRecovery: prediction.productRecovery,
      recoveryLow: prediction.recoveryLow,
      recoveryHigh: prediction.recoveryHigh,
      ...(write.createdAt ? { createdAt: write.createdAt } : {}),
    },
    select: { id: true },
  });
}
