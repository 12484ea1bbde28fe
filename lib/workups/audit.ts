// Audit trail of workup records (who changed what, when). Written inside the same
// transaction as the change, so an event exists exactly when the change does.
import { type Prisma } from "@/generated/prisma/client";
import { type Actor, type Tx } from "./context";

export type WorkupAuditAction = "workup.create" | "workup.update" | "workup.outcome" | "workup.found_cause" | "workup.delete" | "workup.import" | "group.import";

export async function audit(
  tx: Tx,
  actor: Actor,
  action: WorkupAuditAction,
  entityId: string | null,
  details: Prisma.InputJsonObject = {},
): Promise<void> {
  await tx.auditEvent.create({
    data: { groupId: actor.groupId, actorId: actor.userId, action, entity: action.startsWith("group") ? "group" : "workup", entityId, details },
    select: { id: true },
  });
}
