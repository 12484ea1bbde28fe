import { createHash } from "node:crypto";
import { beforeAll, expect, it } from "vitest";
import { verifyPassword } from "@/lib/auth/password";
import { resolveMember, type MemberContext } from "@/lib/authz/guard";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { INVITE_UNUSABLE_MESSAGE, InviteUnusableError, acceptInvite, createInvite, listPendingInvites, previewInvite, revokeInvite } from "@/lib/groups/invites";
import { describeWithAppDatabase } from "./app-database";
import { makeGroup, makeMember, makeUser, sessionOf } from "./fixtures";

const DAY = 24 * 60 * 60_000;
let n = 0;
const account = (name = "Mara Lindqvist") => {
  n += 1;
  const password = "separatory-funnel-7"; // invented
  return { name, email: `newcomer${n}.${Date.now()}@example.org`, password, confirmPassword: password };
};

describeWithAppDatabase("invites", (t) => {
  let lead: MemberContext;
  let member: MemberContext;
  let otherLead: MemberContext;

  beforeAll(async () => {
    const group = await makeGroup(t.db, "Cobalt Lab");
    const other = await makeGroup(t.db, "Dune Lab");
    lead = await resolveMember(sessionOf((await makeMember(t.db, group.id, "lead")).user.id, group.id), "members:manage");
    member = await resolveMember(sessionOf((await makeMember(t.db, group.id, "member")).user.id, group.id), "data:read");
    otherLead = await resolveMember(sessionOf((await makeMember(t.db, other.id, "lead")).user.id, other.id), "members:manage");
  });

  it("are created by leads only, stored as a SHA-256 digest, and expire after the chosen days", async () => {
    await expect(createInvite(member, { role: "member", expiresInDays: 7 })).rejects.toBeInstanceOf(ForbiddenError);
    const now = new Date("2026-11-02T09:00:00Z");
    const invite = await createInvite(lead, { role: "viewer", expiresInDays: 7 }, now);
    expect(invite.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(invite.expiresAt.getTime() - now.getTime()).toBe(7 * DAY);
    const row = await t.db.invite.findFirstOrThrow({ where: { groupId: lead.group.id, createdAt: now }, omit: { tokenHash: false } });
    expect(row.tokenHash).toBe(createHash("sha256").update(invite.token).digest("hex"));
    expect(row).toMatchObject({ role: "viewer", usedAt: null, createdById: lead.user.id });
  });

  it("create an account with the invite's role, and work only once", async () => {
    const { token } = await createInvite(lead, { role: "viewer", expiresInDays: 1 });
    expect(await previewInvite(token)).toMatchObject({ groupName: "Cobalt Lab", role: "viewer" });
    const details = account();
    const joined = await acceptInvite(token, { kind: "new", account: details });
    expect(joined).toMatchObject({ groupId: lead.group.id, groupName: "Cobalt Lab", role: "viewer" });
    const user = await t.db.user.findUniqueOrThrow({ where: { email: details.email }, omit: { passwordHash: false } });
    await expect(verifyPassword(details.password, user.passwordHash)).resolves.toBe(true);
    await expect(resolveMember(sessionOf(user.id, null), "data:read")).resolves.toMatchObject({ role: "viewer", group: { id: lead.group.id } });

    expect(await previewInvite(token)).toBeNull();
    await expect(acceptInvite(token, { kind: "new", account: account("Second Person") })).rejects.toThrow(INVITE_UNUSABLE_MESSAGE);
    const someone = await makeUser(t.db, "Third Person");
    await expect(acceptInvite(token, { kind: "existing", userId: someone.id })).rejects.toBeInstanceOf(InviteUnusableError);
    expect(await t.db.membership.count({ where: { userId: someone.id } })).toBe(0);
  });

  it("add a membership to an existing account; someone already in the group leaves the link unused", async () => {
    const { token } = await createInvite(lead, { role: "member", expiresInDays: 7 });
    await expect(acceptInvite(token, { kind: "existing", userId: member.user.id })).rejects.toThrow("You are already a member of Cobalt Lab.");
    expect(await previewInvite(token)).not.toBeNull();
    const joined = await acceptInvite(token, { kind: "existing", userId: otherLead.user.id });
    expect(joined.role).toBe("member");
    // The other group's lead is now also a member here, and still lead there.
    await expect(resolveMember(sessionOf(otherLead.user.id, lead.group.id), "data:write")).resolves.toMatchObject({ role: "member" });
    await expect(resolveMember(sessionOf(otherLead.user.id, otherLead.group.id), "members:manage")).resolves.toMatchObject({ role: "lead" });
  });

  it("write nothing when the email already has an account", async () => {
    const { token } = await createInvite(lead, { role: "member", expiresInDays: 7 });
    const existing = { ...account(), email: member.user.email };
    await expect(acceptInvite(token, { kind: "new", account: existing })).rejects.toBeInstanceOf(ConflictError);
    expect(await t.db.user.count({ where: { email: member.user.email } })).toBe(1);
    expect(await previewInvite(token)).not.toBeNull();
  });

  it("stop working when they expire", async () => {
    const created = new Date("2026-11-01T12:00:00Z");
    const { token } = await createInvite(lead, { role: "member", expiresInDays: 1 }, created);
    const justBefore = new Date(created.getTime() + DAY - 1000);
    const justAfter = new Date(created.getTime() + DAY + 1000);
    expect(await previewInvite(token, justBefore)).not.toBeNull();
    expect(await previewInvite(token, justAfter)).toBeNull();
    await expect(acceptInvite(token, { kind: "new", account: account() }, justAfter)).rejects.toBeInstanceOf(InviteUnusableError);
    await expect(acceptInvite(token, { kind: "new", account: account() }, justBefore)).resolves.toMatchObject({ role: "member" });
  });

  it("can be revoked by their group's lead only, and then open nothing", async () => {
    const { token } = await createInvite(lead, { role: "lead", expiresInDays: 14 });
    const pending = await listPendingInvites(lead);
    const row = pending.find((i) => i.role === "lead");
    expect(row).toBeDefined();
    await expect(revokeInvite(otherLead, row!.id)).rejects.toBeInstanceOf(NotFoundError);
    await expect(revokeInvite(member, row!.id)).rejects.toBeInstanceOf(ForbiddenError);
    await revokeInvite(lead, row!.id);
    expect(await previewInvite(token)).toBeNull();
    await expect(acceptInvite(token, { kind: "new", account: account() })).rejects.toBeInstanceOf(InviteUnusableError);
  });

  it("let exactly one of two simultaneous openers in", async () => {
    const { token } = await createInvite(lead, { role: "member", expiresInDays: 1 });
    const [a, b] = [account("Simultaneous A"), account("Simultaneous B")];
    const results = await Promise.allSettled([acceptInvite(token, { kind: "new", account: a }), acceptInvite(token, { kind: "new", account: b })]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const rejected = results.find((r) => r.status === "rejected");
    expect(rejected?.reason).toBeInstanceOf(InviteUnusableError);
    // The loser's account was rolled back with its transaction.
    expect(await t.db.user.count({ where: { email: { in: [a.email, b.email] } } })).toBe(1);
  });

  it("refuse garbage links without touching the database", async () => {
    expect(await previewInvite("../../etc/passwd")).toBeNull();
    await expect(acceptInvite("x", { kind: "new", account: account() })).rejects.toBeInstanceOf(InviteUnusableError);
  });
});
