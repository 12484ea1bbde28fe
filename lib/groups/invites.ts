// Invite links: created by a lead for one role, shown once, stored as a digest, valid until they expire or are used
// once. Opening a link either creates the account (new people) or adds the membership (signed-in people).
import { getDb } from "@/lib/db/client";
import { hashPassword } from "@/lib/auth/password";
import { found, type MemberContext } from "@/lib/authz/guard";
import { assertRoleCan, type RoleName } from "@/lib/authz/permissions";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { hashInviteToken, looksLikeInviteToken, newInviteToken } from "@/lib/groups/invite-token";
import { type CreateInviteInput, type NewAccountInput } from "@/lib/groups/schemas";

const DAY_MS = 24 * 60 * 60_000;

export const INVITE_UNUSABLE_MESSAGE = "This invite link is not valid: it may have been used already, revoked or expired. Ask your group lead for a new one.";

export class InviteUnusableError extends NotFoundError {
  constructor() {
    super("invite");
    this.message = INVITE_UNUSABLE_MESSAGE;
  }
}

export async function createInvite(
  member: MemberContext,
  input: CreateInviteInput,
  now = new Date(),
): Promise<{ token: string; expiresAt: Date; role: RoleName }> {
  assertRoleCan(member.role, "members:manage");
  const db = await getDb();
  const { token, tokenHash } = newInviteToken();
  const expiresAt = new Date(now.getTime() + input.expiresInDays * DAY_MS);
  await db.invite.create({
    data: { groupId: member.group.id, tokenHash, role: input.role, createdById: member.user.id, expiresAt, createdAt: now },
    select: { id: true },
  });
  return { token, expiresAt, role: input.role };
}

export interface PendingInvite {
  id: string;
  role: RoleName;
  createdAt: Date;
  expiresAt: Date;
}

export async function listPendingInvites(member: MemberContext, now = new Date()): Promise<PendingInvite[]> {
  assertRoleCan(member.role, "members:manage");
  const db = await getDb();
  return db.invite.findMany({
    where: { groupId: member.group.id, usedAt: null, expiresAt: { gt: now } },
    orderBy: { createdAt: "desc" },
    select: { id: true, role: true, createdAt: true, expiresAt: true },
  });
}

/** Revoking deletes the row: an unused invite has no history worth keeping, and its link stops working at once. */
export async function revokeInvite(member: MemberContext, inviteId: string): Promise<void> {
  assertRoleCan(member.role, "members:manage");
  const db = await getDb();
  const { count } = await db.invite.deleteMany({ where: { id: inviteId, groupId: member.group.id, usedAt: null } });
  if (count === 0) throw new NotFoundError("invite");
}

export interface InvitePreview {
  groupName: string;
  role: RoleName;
  expiresAt: Date;
}

/** What the holder of a link may see before accepting it; null for any link that cannot be used. */
export async function previewInvite(token: string, now = new Date()): Promise<InvitePreview | null> {
  if (!looksLikeInviteToken(token)) return null;
  const db = await getDb();
  const invite = await db.invite.findUnique({
    where: { tokenHash: hashInviteToken(token) },
    select: { role: true, expiresAt: true, usedAt: true, group: { select: { name: true } } },
  });
  if (!invite || invite.usedAt || invite.expiresAt <= now) return null;
  return { groupName: invite.group.name, role: invite.role, expiresAt: invite.expiresAt };
}

export type InviteAcceptor = { kind: "existing"; userId: string } | { kind: "new"; account: NewAccountInput };

export interface AcceptedInvite {
  userId: string;
  groupId: string;
  groupName: string;
  role: RoleName;
}

/**
 * Uses an invite once. Everything runs in one transaction: if the account cannot be created or the person is already
 * in the group, nothing is written and the link stays usable. The `usedAt: null` condition on the claiming update
 * makes a link that two people open at the same moment work for only one of them.
 */
export async function acceptInvite(token: string, acceptor: InviteAcceptor, now = new Date()): Promise<AcceptedInvite> {
  if (!looksLikeInviteToken(token)) throw new InviteUnusableError();
  const db = await getDb();
  // The token is checked before the password is hashed: an unknown or spent link costs a lookup, not a bcrypt run.
  // (The transaction below checks it again under the claim, so a link used meanwhile is still refused.)
  if (acceptor.kind === "new") {
    const usable = await db.invite.findFirst({ where: { tokenHash: hashInviteToken(token), usedAt: null, expiresAt: { gt: now } }, select: { id: true } });
    if (!usable) throw new InviteUnusableError();
  }
  const passwordHash = acceptor.kind === "new" ? await hashPassword(acceptor.account.password) : null;
  return db.$transaction(async (tx) => {
    const invite = await tx.invite.findUnique({
      where: { tokenHash: hashInviteToken(token) },
      select: { id: true, groupId: true, role: true, expiresAt: true, usedAt: true, group: { select: { name: true } } },
    });
    if (!invite || invite.usedAt || invite.expiresAt <= now) throw new InviteUnusableError();

    let userId: string;
    if (acceptor.kind === "new") {
      const { name, email } = acceptor.account;
      const existing = await tx.user.findUnique({ where: { email }, select: { id: true } });
      if (existing) throw new ConflictError("An account with this email already exists. Sign in with it, then open this invite link again.");
      userId = (await tx.user.create({ data: { name, email, passwordHash, createdAt: now }, select: { id: true } })).id;
    } else {
      userId = found(await tx.user.findUnique({ where: { id: acceptor.userId }, select: { id: true } }), "account").id;
      const already = await tx.membership.findUnique({ where: { groupId_userId: { groupId: invite.groupId, userId } }, select: { id: true } });
      if (already) throw new ConflictError(`You are already a member of ${invite.group.name}.`);
    }

    const claimed = await tx.invite.updateMany({ where: { id: invite.id, usedAt: null }, data: { usedAt: now, usedById: userId } });
    if (claimed.count !== 1) throw new InviteUnusableError();
    await tx.membership.create({ data: { groupId: invite.groupId, userId, role: invite.role, createdAt: now }, select: { id: true } });
    await tx.auditEvent.create({
      data: { groupId: invite.groupId, actorId: userId, action: "member.joined", entity: "Invite", entityId: invite.id, details: { role: invite.role } },
    });
    return { userId, groupId: invite.groupId, groupName: invite.group.name, role: invite.role };
  });
}
