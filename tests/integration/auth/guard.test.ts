import { beforeAll, describe, expect, it } from "vitest";
import { requestGuard } from "@/lib/authz";
import { found, resolveMember } from "@/lib/authz/guard";
import { newApiToken } from "@/lib/authz/api-token-format";
import { PERMISSIONS, assertRoleCan, permissionsOf, roleCan, type Permission, type RoleName } from "@/lib/authz/permissions";
import { createApiToken } from "@/lib/auth/api-tokens/tokens";
import { ForbiddenError, NoMembershipError, NotFoundError, UnauthenticatedError } from "@/lib/errors";
import { getWorkup } from "@/app/(app)/workups/_lib/queries";
import { describeWithAppDatabase } from "./app-database";
import { makeGroup, makeMember, makeUser, makeWorkup, sessionOf } from "./fixtures";

// The rule of the platform (issue 2): everyone in a group reads it, viewers cannot write, only leads manage members.
const EXPECTED: Record<RoleName, Record<"data:read" | "data:write" | "members:manage", boolean>> = {
  lead: { "data:read": true, "data:write": true, "members:manage": true },
  member: { "data:read": true, "data:write": true, "members:manage": false },
  viewer: { "data:read": true, "data:write": false, "members:manage": false },
};

describe("permissions as data", () => {
  it("refuses unknown roles, including names that exist on every JavaScript object", () => {
    for (const role of ["admin", "owner", "", "Lead", "__proto__", "constructor", "toString", "hasOwnProperty"]) {
      for (const permission of PERMISSIONS) expect(roleCan(role, permission)).toBe(false);
      expect(() => assertRoleCan(role, "data:read")).toThrow(ForbiddenError);
      expect(() => assertRoleCan(role, "data:read")).toThrow("Your membership has a role Layerwise does not recognise.");
      expect(permissionsOf(role)).toEqual([]);
    }
  });

  it("says why a viewer may not write", () => {
    expect(() => assertRoleCan("viewer", "data:write")).toThrow("Viewers can read the group's records but not change them.");
    expect(() => assertRoleCan("member", "members:manage")).toThrow("Only a group lead can manage members and invites.");
  });
});

describeWithAppDatabase("the guard", (t) => {
  let groupA = { id: "", slug: "" };
  let groupB = { id: "", slug: "" };
  const people = {} as Record<RoleName, string> & { outsider: string; both: string; leadB: string };

  beforeAll(async () => {
    groupA = await makeGroup(t.db, "Aldol Lab");
    groupB = await makeGroup(t.db, "Birch Lab");
    for (const role of ["lead", "member", "viewer"] as const) people[role] = (await makeMember(t.db, groupA.id, role)).user.id;
    people.leadB = (await makeMember(t.db, groupB.id, "lead")).user.id;
    people.outsider = (await makeUser(t.db, "No Group Yet")).id;
    const both = await makeMember(t.db, groupA.id, "viewer", "In Both");
    await t.db.membership.create({ data: { groupId: groupB.id, userId: both.user.id, role: "member" } });
    people.both = both.user.id;
  });

  describe("role × permission matrix", () => {
    for (const role of ["lead", "member", "viewer"] as const) {
      for (const permission of Object.keys(EXPECTED[role]) as Permission[]) {
        const allowed = EXPECTED[role][permission as keyof (typeof EXPECTED)[RoleName]];
        it(`${role} ${allowed ? "may" : "may not"} ${permission}`, async () => {
          const attempt = resolveMember(sessionOf(people[role], groupA.id), permission);
          if (allowed) await expect(attempt).resolves.toMatchObject({ role, group: { id: groupA.id }, user: { id: people[role] }, via: "session" });
          else await expect(attempt).rejects.toBeInstanceOf(ForbiddenError);
        });
      }
    }
  });

  it("answers another group's workup with 404, for every role, and finds its own", async () => {
    const own = await makeWorkup(t.db, groupA.id);
    const theirs = await makeWorkup(t.db, groupB.id, "Birch lab only");
    for (const role of ["lead", "member", "viewer"] as const) {
      const member = await resolveMember(sessionOf(people[role], groupA.id), "data:read");
      await expect(getWorkup(member, theirs.id)).rejects.toBeInstanceOf(NotFoundError);
      await expect(getWorkup(member, own.id)).resolves.toMatchObject({ id: own.id });
    }
    const leadB = await resolveMember(sessionOf(people.leadB, groupB.id), "data:read");
    await expect(getWorkup(leadB, own.id)).rejects.toThrow("No such workup.");
  });

  it("answers a group the user is not in with 404, whether named by id or slug", async () => {
    for (const group of [groupB.id, groupB.slug]) {
      await expect(resolveMember(sessionOf(people.lead, groupA.id), "data:read", { group })).rejects.toBeInstanceOf(NotFoundError);
    }
    await expect(resolveMember(sessionOf(people.lead, null), "data:read", { group: groupA.slug })).resolves.toMatchObject({ role: "lead" });
  });

  it("uses the role of the active group, and falls back to the first group when the session names another", async () => {
    await expect(resolveMember(sessionOf(people.both, groupB.id), "data:write")).resolves.toMatchObject({ group: { id: groupB.id }, role: "member" });
    await expect(resolveMember(sessionOf(people.both, groupA.id), "data:write")).rejects.toBeInstanceOf(ForbiddenError);
    // A session naming a group the user is not in never opens that group.
    await expect(resolveMember(sessionOf(people.lead, groupB.id), "data:read")).resolves.toMatchObject({ group: { id: groupA.id } });
  });

  it("falls back to the group joined first, and lists the user's groups by name for the switcher", async () => {
    // Joined Zymase Lab first, then Aldol and Birch: the join order is not the name order.
    const zymase = await makeGroup(t.db, "Zymase Lab");
    const { user } = await makeMember(t.db, zymase.id, "viewer", "Joined Late Elsewhere");
    await t.db.membership.create({ data: { groupId: groupA.id, userId: user.id, role: "lead", createdAt: new Date(Date.now() + 1000) } });
    await t.db.membership.create({ data: { groupId: groupB.id, userId: user.id, role: "member", createdAt: new Date(Date.now() + 2000) } });
    await expect(resolveMember(sessionOf(user.id, null), "data:read")).resolves.toMatchObject({ group: { id: zymase.id }, role: "viewer" });
    await expect(resolveMember(sessionOf(user.id, null), "data:read", { group: groupB.slug })).resolves.toMatchObject({ group: { id: groupB.id }, role: "member" });
    const guard = requestGuard(() => Promise.resolve(sessionOf(user.id, groupA.id)), () => Promise.resolve(t.db));
    await expect(guard.requireMember("members:manage")).resolves.toMatchObject({ group: { id: groupA.id }, role: "lead" });
    expect(await guard.signedInGroups()).toEqual([
      { id: groupA.id, name: "Aldol Lab", slug: groupA.slug, role: "lead" },
      { id: groupB.id, name: "Birch Lab", slug: groupB.slug, role: "member" },
      { id: zymase.id, name: "Zymase Lab", slug: zymase.slug, role: "viewer" },
    ]);
    await expect(requestGuard(() => Promise.resolve(sessionOf(people.outsider)), () => Promise.resolve(t.db)).signedInGroups()).resolves.toEqual([]);
  });

  it("refuses nobody, a deleted account, and someone in no group", async () => {
    await expect(resolveMember(null, "data:read")).rejects.toBeInstanceOf(UnauthenticatedError);
    await expect(resolveMember(sessionOf("no-such-user", null), "data:read")).rejects.toBeInstanceOf(UnauthenticatedError);
    await expect(resolveMember(sessionOf(people.outsider, null), "data:read")).rejects.toBeInstanceOf(NoMembershipError);
  });

  it("reads roles from the database on every call, so a demotion applies at once", async () => {
    const { user, membership } = await makeMember(t.db, groupA.id, "member");
    await expect(resolveMember(sessionOf(user.id, groupA.id), "data:write")).resolves.toBeDefined();
    await t.db.membership.update({ where: { id: membership.id }, data: { role: "viewer" } });
    await expect(resolveMember(sessionOf(user.id, groupA.id), "data:write")).rejects.toBeInstanceOf(ForbiddenError);
  });

  describe("API tokens", () => {
    it("act as their owner in the token's group with the owner's current role, and record their use", async () => {
      const { user, membership } = await makeMember(t.db, groupA.id, "member");
      const owner = await resolveMember(sessionOf(user.id, groupA.id), "tokens:manage");
      const { token, row } = await createApiToken(owner, "plate reader");
      expect(token).toMatch(/^lw_[A-Za-z0-9_-]{43}$/);
      const stored = await t.db.apiToken.findUniqueOrThrow({ where: { id: row.id }, omit: { tokenHash: false } });
      expect(stored.tokenHash).toMatch(/^[0-9a-f]{64}$/);
      expect(stored.tokenHash).not.toContain(token.slice(3));
      expect(stored.lastUsedAt).toBeNull();

      const viaToken = await resolveMember({ kind: "token", token }, "data:write");
      expect(viaToken).toMatchObject({ user: { id: user.id }, group: { id: groupA.id }, role: "member", via: "token" });
      expect((await t.db.apiToken.findUniqueOrThrow({ where: { id: row.id } })).lastUsedAt).not.toBeNull();
      await expect(resolveMember({ kind: "token", token }, "data:read", { group: groupB.slug })).rejects.toBeInstanceOf(NotFoundError);
      await expect(createApiToken(viaToken, "minted by a token")).rejects.toThrow("API tokens can only be managed from a signed-in browser session.");

      await t.db.membership.update({ where: { id: membership.id }, data: { role: "viewer" } });
      await expect(resolveMember({ kind: "token", token }, "data:write")).rejects.toBeInstanceOf(ForbiddenError);
      await t.db.membership.delete({ where: { id: membership.id } });
      await expect(resolveMember({ kind: "token", token }, "data:read")).rejects.toBeInstanceOf(UnauthenticatedError);
    });

    it("refuse revoked, unknown and malformed tokens", async () => {
      const owner = await resolveMember(sessionOf(people.viewer, groupA.id), "tokens:manage");
      const { token, row } = await createApiToken(owner, "to revoke");
      await expect(resolveMember({ kind: "token", token }, "data:read")).resolves.toMatchObject({ role: "viewer" });
      await t.db.apiToken.update({ where: { id: row.id }, data: { revokedAt: new Date() } });
      await expect(resolveMember({ kind: "token", token }, "data:read")).rejects.toThrow("This API token is not valid or has been revoked.");
      await expect(resolveMember({ kind: "token", token: newApiToken().token }, "data:read")).rejects.toBeInstanceOf(UnauthenticatedError);
      await expect(resolveMember({ kind: "token", token: "lw_short" }, "data:read")).rejects.toThrow("This API token is not valid.");
    });
  });

  it("found() turns an empty scoped lookup into a 404", () => {
    expect(found(0, "count")).toBe(0);
    expect(() => found(null, "compound")).toThrow("No such compound.");
  });
});
