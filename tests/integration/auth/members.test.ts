import { beforeEach, expect, it } from "vitest";
import { createApiToken } from "@/lib/auth/api-tokens/tokens";
import { SESSION_ENDED_MESSAGE, resolveMember, type MemberContext } from "@/lib/authz/guard";
import { ConflictError, ForbiddenError, NotFoundError, UnauthenticatedError } from "@/lib/errors";
import { LAST_LEAD_MESSAGE, changeRole, listMembers, removeMember } from "@/lib/groups/members";
import { describeWithAppDatabase } from "./app-database";
import { makeGroup, makeMember, sessionOf } from "./fixtures";

describeWithAppDatabase("members, roles and the last lead", (t) => {
  let lead: MemberContext;
  let leadMembershipId = "";
  let memberCtx: MemberContext;
  let memberMembershipId = "";

  beforeEach(async () => {
    const group = await makeGroup(t.db, "Ester Lab");
    const l = await makeMember(t.db, group.id, "lead", "Hana Okafor");
    const m = await makeMember(t.db, group.id, "member", "Luis Ferrand");
    lead = await resolveMember(sessionOf(l.user.id, group.id), "members:manage");
    memberCtx = await resolveMember(sessionOf(m.user.id, group.id), "data:read");
    leadMembershipId = l.membership.id;
    memberMembershipId = m.membership.id;
  });

  it("lists the group's members only", async () => {
    const other = await makeGroup(t.db, "Elsewhere");
    await makeMember(t.db, other.id, "lead", "Not Here");
    const rows = await listMembers(memberCtx);
    expect(rows.map((r) => r.name).sort()).toEqual(["Hana Okafor", "Luis Ferrand"]);
  });

  it("refuses to demote or remove the only lead, leaving the role unchanged", async () => {
    await expect(changeRole(lead, leadMembershipId, "member")).rejects.toThrow(LAST_LEAD_MESSAGE);
    await expect(changeRole(lead, leadMembershipId, "viewer")).rejects.toBeInstanceOf(ConflictError);
    await expect(removeMember(lead, leadMembershipId)).rejects.toThrow(LAST_LEAD_MESSAGE);
    expect((await t.db.membership.findUniqueOrThrow({ where: { id: leadMembershipId } })).role).toBe("lead");
  });

  it("allows it once another lead exists, then protects the remaining one", async () => {
    await changeRole(lead, memberMembershipId, "lead");
    await changeRole(lead, leadMembershipId, "member");
    const newLead = await resolveMember(sessionOf(memberCtx.user.id, memberCtx.group.id), "members:manage");
    await expect(changeRole(newLead, memberMembershipId, "viewer")).rejects.toThrow(LAST_LEAD_MESSAGE);
    await expect(removeMember(newLead, memberMembershipId)).rejects.toThrow(LAST_LEAD_MESSAGE);
    const events = await t.db.auditEvent.findMany({ where: { groupId: lead.group.id, action: "member.role_changed" } });
    expect(events).toHaveLength(2);
  });

  it("keeps a lead when two leads demote each other at the same moment", async () => {
    await changeRole(lead, memberMembershipId, "lead");
    const second = await resolveMember(sessionOf(memberCtx.user.id, memberCtx.group.id), "members:manage");
    const results = await Promise.allSettled([changeRole(lead, memberMembershipId, "member"), changeRole(second, leadMembershipId, "member")]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(await t.db.membership.count({ where: { groupId: lead.group.id, role: "lead" } })).toBe(1);
  });

  it("lets only leads change roles or remove people", async () => {
    await expect(changeRole(memberCtx, leadMembershipId, "viewer")).rejects.toBeInstanceOf(ForbiddenError);
    await expect(removeMember(memberCtx, leadMembershipId)).rejects.toBeInstanceOf(ForbiddenError);
  });

  it("answers another group's membership with 404", async () => {
    const other = await makeGroup(t.db, "Far Lab");
    const stranger = await makeMember(t.db, other.id, "member");
    await expect(changeRole(lead, stranger.membership.id, "viewer")).rejects.toBeInstanceOf(NotFoundError);
    await expect(removeMember(lead, stranger.membership.id)).rejects.toBeInstanceOf(NotFoundError);
    expect((await t.db.membership.findUniqueOrThrow({ where: { id: stranger.membership.id } })).role).toBe("member");
  });

  it("removing someone closes their access and revokes their tokens in that group", async () => {
    const asMember = await resolveMember(sessionOf(memberCtx.user.id, memberCtx.group.id), "tokens:manage");
    const { token, row } = await createApiToken(asMember, "script");
    await removeMember(lead, memberMembershipId);
    // The session they had ends (removal raises their session version); signed in afresh, they belong nowhere.
    await expect(resolveMember(sessionOf(memberCtx.user.id, memberCtx.group.id), "data:read")).rejects.toThrow(SESSION_ENDED_MESSAGE);
    await expect(resolveMember({ kind: "session", userId: memberCtx.user.id, activeGroupId: memberCtx.group.id, sessionVersion: 1 }, "data:read")).rejects.toThrow(
      "You are not a member of any group yet",
    );
    await expect(resolveMember({ kind: "token", token }, "data:read")).rejects.toBeInstanceOf(UnauthenticatedError);
    expect((await t.db.apiToken.findUniqueOrThrow({ where: { id: row.id } })).revokedAt).not.toBeNull();
  });
});
