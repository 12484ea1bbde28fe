// Membership changes. A group must keep at least one lead: the check runs inside the transaction with the group row
// locked, so two leads demoting each other at the same moment cannot both succeed.
import { endSessions } from "@/lib/auth/sessions";
import { getDb } from "@/lib/db/client";
import { type MemberContext } from "@/lib/authz/guard";
import { found } from "@/lib/authz/guard";
import { assertRoleCan, type RoleName } from "@/lib/authz/permissions";
import { ConflictError } from "@/lib/errors";
import { type Db } from "@/lib/db/client";

export const LAST_LEAD_MESSAGE = "A group needs at least one lead. Make another member lead first.";

type Tx = Pick<Db, "membership" | "auditEvent" | "apiToken" | "$queryRaw">;

async function lockGroup(tx: Tx, groupId: string): Promise<void> {
  await tx.$queryRaw`SELECT "id" FROM "Group" WHERE "id" = ${groupId} FOR UPDATE`;
}

/** The group's membership `membershipId`, read after taking the group's lock (404 when it is not in this group). */
async function lockedMembership(tx: Tx, groupId: string, membershipId: string) {
  await lockGroup(tx, groupId);
  return found(
    await tx.membership.findFirst({ where: { id: membershipId, groupId }, select: { id: true, role: true, userId: true } }),
    "member",
  );
}

async function assertAnotherLead(tx: Tx, groupId: string, membershipId: string): Promise<void> {
  const otherLeads = await tx.membership.count({ where: { groupId, role: "lead", id: { not: membershipId } } });
  if (otherLeads === 0) throw new ConflictError(LAST_LEAD_MESSAGE);
}

export interface MemberRow {
  membershipId: string;
  userId: string;
  name: string;
  email: string;
  role: RoleName;
  joinedAt: Date;
}

export async function listMembers(member: MemberContext): Promise<MemberRow[]> {
  assertRoleCan(member.role, "data:read");
  const db = await getDb();
  const rows = await db.membership.findMany({
    where: { groupId: member.group.id },
    orderBy: [{ role: "asc" }, { createdAt: "asc" }],
    select: { id: true, role: true, createdAt: true, user: { select: { id: true, name: true, email: true } } },
  });
  return rows.map((r) => ({
    membershipId: r.id,
    userId: r.user.id,
    name: r.user.name,
    email: r.user.email,
    role: r.role,
    joinedAt: r.createdAt,
  }));
}

export async function changeRole(member: MemberContext, membershipId: string, role: RoleName): Promise<void> {
  assertRoleCan(member.role, "members:manage");
  const db = await getDb();
  await db.$transaction(async (tx) => {
    const target = await lockedMembership(tx, member.group.id, membershipId);
    if (target.role === role) return;
    if (target.role === "lead") await assertAnotherLead(tx, member.group.id, target.id);
    await tx.membership.update({ where: { id: target.id }, data: { role }, select: { id: true } });
    await tx.auditEvent.create({
      data: {
        groupId: member.group.id,
        actorId: member.user.id,
        action: "member.role_changed",
        entity: "Membership",
        entityId: target.id,
        details: { userId: target.userId, from: target.role, to: role },
      },
    });
  });
}

export async function removeMember(member: MemberContext, membershipId: string): Promise<void> {
  assertRoleCan(member.role, "members:manage");
  const db = await getDb();
  await db.$transaction(async (tx) => {
    const target = await lockedMembership(tx, member.group.id, membershipId);
    if (target.role === "lead") await assertAnotherLead(tx, member.group.id, target.id);
    await tx.membership.delete({ where: { id: target.id }, select: { id: true } });
    // A removed person's open sessions end too (signing in again lands them in their remaining groups, if any).
    if (target.userId !== member.user.id) await endSessions(target.userId, tx);
    // The guard already refuses tokens of non-members; revoking them too keeps the tokens page truthful.
    await tx.apiToken.updateMany({
      where: { groupId: member.group.id, userId: target.userId, revokedAt: null },
      data: { revokedAt: new Date() },
    });
    await tx.auditEvent.create({
      data: {
        groupId: member.group.id,
        actorId: member.user.id,
        action: "member.removed",
        entity: "Membership",
        entityId: target.id,
        details: { userId: target.userId, role: target.role },
      },
    });
  });
}
