// A lead lifts the sign-in delay on a member's account (after the member has been guessed at, or has mistyped their
// password many times): the recorded failures for that email, from every address, are forgotten.
import { getDb } from "@/lib/db/client";
import { found, type MemberContext } from "@/lib/authz/guard";
import { assertRoleCan } from "@/lib/authz/permissions";
import { liftSignInDelay } from "@/lib/auth/rate-limit";

export async function liftMemberSignInDelay(member: MemberContext, membershipId: string): Promise<number> {
  assertRoleCan(member.role, "members:manage");
  const db = await getDb();
  const target = found(
    await db.membership.findFirst({ where: { id: membershipId, groupId: member.group.id }, select: { id: true, user: { select: { email: true } } } }),
    "member",
  );
  const lifted = await liftSignInDelay(db, target.user.email);
  await db.auditEvent.create({
    data: { groupId: member.group.id, actorId: member.user.id, action: "member.sign_in_delay_lifted", entity: "Membership", entityId: target.id, details: { failuresForgotten: lifted } },
  });
  return lifted;
}
