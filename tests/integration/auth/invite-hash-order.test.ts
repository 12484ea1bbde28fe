// Invite sign-up checks the link before it hashes the new password: a made-up, spent or expired link costs a lookup,
// not a bcrypt run (at cost 12, a quarter of a second of CPU that anyone could otherwise ask for). Counted, not timed:
// bcryptjs's hash is wrapped to count its calls (the library, not our code or database, is observed).
import { createHash } from "node:crypto";
import type bcrypt from "bcryptjs";
import { beforeAll, expect, it, vi } from "vitest";
import { resolveMember, type MemberContext } from "@/lib/authz/guard";
import { InviteUnusableError, acceptInvite, createInvite, revokeInvite } from "@/lib/groups/invites";
import { describeWithAppDatabase } from "./app-database";
import { makeGroup, makeMember, sessionOf } from "./fixtures";

const calls = vi.hoisted(() => ({ hash: 0 }));
vi.mock("bcryptjs", async (importOriginal) => {
  const actual = await importOriginal<{ default: typeof bcrypt }>();
  const counted = { ...actual.default, hash: (...args: Parameters<typeof actual.default.hash>) => { calls.hash++; return actual.default.hash(...args); } };
  return { ...actual, default: counted };
});

let n = 0;
const account = () => {
  n += 1;
  const password = "separatory-funnel-7"; // invented
  return { name: "Ines Okafor", email: `hash-order${n}.${Date.now()}@example.org`, password, confirmPassword: password };
};

describeWithAppDatabase("invite sign-up and password hashing", (t) => {
  let lead: MemberContext;
  beforeAll(async () => {
    const group = await makeGroup(t.db, "Nickel Lab");
    lead = await resolveMember(sessionOf((await makeMember(t.db, group.id, "lead")).user.id, group.id), "members:manage");
  });

  it("hashes nothing for a made-up, revoked or expired link, and once for a good one", async () => {
    calls.hash = 0;
    await expect(acceptInvite("A".repeat(43), { kind: "new", account: account() })).rejects.toBeInstanceOf(InviteUnusableError);
    const revoked = await createInvite(lead, { role: "member", expiresInDays: 1 });
    const row = await t.db.invite.findFirstOrThrow({ where: { tokenHash: createHash("sha256").update(revoked.token).digest("hex") }, select: { id: true } });
    await revokeInvite(lead, row.id);
    await expect(acceptInvite(revoked.token, { kind: "new", account: account() })).rejects.toBeInstanceOf(InviteUnusableError);
    const expiring = await createInvite(lead, { role: "member", expiresInDays: 1 });
    await expect(acceptInvite(expiring.token, { kind: "new", account: account() }, new Date(Date.now() + 2 * 24 * 3600_000))).rejects.toBeInstanceOf(InviteUnusableError);
    expect(calls.hash).toBe(0);

    const good = await createInvite(lead, { role: "member", expiresInDays: 1 });
    await acceptInvite(good.token, { kind: "new", account: account() });
    expect(calls.hash).toBe(1);
  });
});
