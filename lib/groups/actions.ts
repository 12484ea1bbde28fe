"use server";
// Server actions behind the members page and the invite page. Each one starts with the guard (memberAction, or
// requireUser for accepting an invite) and returns an ActionResult for the form.
import { revalidatePath } from "next/cache";
import { requireUser } from "@/lib/authz";
import { memberAction } from "@/lib/authz/action";
import { actionFailure, formFields, parseInput, type ActionResult } from "@/lib/errors";
import { actionArg, inviteTokenArg } from "@/lib/api/action-args";
import { acceptInvite, createInvite, revokeInvite } from "@/lib/groups/invites";
import { invitePath } from "@/lib/groups/invite-token";
import { changeRole, removeMember } from "@/lib/groups/members";
import { changeRoleSchema, createInviteSchema, inviteIdSchema, membershipIdSchema, newAccountSchema } from "@/lib/groups/schemas";

export interface CreatedInvite {
  path: string;
  role: string;
  expiresAt: string;
}

export async function createInviteAction(_prev: ActionResult<CreatedInvite> | null, form: FormData): Promise<ActionResult<CreatedInvite>> {
  return memberAction("members:manage", async (member) => {
    const input = parseInput(createInviteSchema, formFields(form));
    const invite = await createInvite(member, input);
    revalidatePath("/members");
    return { path: invitePath(invite.token), role: invite.role, expiresAt: invite.expiresAt.toISOString() };
  });
}

export async function revokeInviteAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  return memberAction("members:manage", async (member) => {
    const { inviteId } = parseInput(inviteIdSchema, formFields(form));
    await revokeInvite(member, inviteId);
    revalidatePath("/members");
    return undefined;
  });
}

export async function changeRoleAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  return memberAction("members:manage", async (member) => {
    const { membershipId, role } = parseInput(changeRoleSchema, formFields(form));
    await changeRole(member, membershipId, role);
    revalidatePath("/members");
    return undefined;
  });
}

export async function removeMemberAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  return memberAction("members:manage", async (member) => {
    const { membershipId } = parseInput(membershipIdSchema, formFields(form));
    await removeMember(member, membershipId);
    revalidatePath("/members");
    return undefined;
  });
}

export interface JoinedGroup {
  groupId: string;
  groupName: string;
  /** True when the action created a new account (the form then signs in with the password just typed). */
  newAccount: boolean;
}

/** Accepting as the signed-in user. */
export async function joinWithAccountAction(token: string): Promise<ActionResult<JoinedGroup>> {
  try {
    const user = await requireUser();
    const joined = await acceptInvite(actionArg("token", inviteTokenArg, token), { kind: "existing", userId: user.id });
    return { ok: true, data: { groupId: joined.groupId, groupName: joined.groupName, newAccount: false } };
  } catch (error) {
    return actionFailure(error, "accept invite (signed in)");
  }
}

/** Accepting by creating an account; nobody is signed in, the invite link itself is the authority. */
export async function joinWithNewAccountAction(token: string, _prev: ActionResult<JoinedGroup> | null, form: FormData): Promise<ActionResult<JoinedGroup>> {
  try {
    const invite = actionArg("token", inviteTokenArg, token);
    const account = parseInput(newAccountSchema, formFields(form));
    const joined = await acceptInvite(invite, { kind: "new", account });
    return { ok: true, data: { groupId: joined.groupId, groupName: joined.groupName, newAccount: true } };
  } catch (error) {
    return actionFailure(error, "accept invite (new account)");
  }
}
