import { beforeAll, expect, it } from "vitest";
import { type JWT } from "next-auth/jwt";
import { authOptions } from "@/lib/auth/options";
import { describeWithAppDatabase } from "./app-database";
import { makeGroup, makeMember } from "./fixtures";

type JwtCallback = NonNullable<ReturnType<typeof authOptions>["callbacks"]>["jwt"];

describeWithAppDatabase("the session token and the active group", (t) => {
  let jwt: NonNullable<JwtCallback>;
  const ids = { user: "", first: "", second: "", foreign: "" };

  beforeAll(async () => {
    jwt = authOptions().callbacks!.jwt!;
    const first = await makeGroup(t.db, "First Lab");
    const second = await makeGroup(t.db, "Second Lab");
    const foreign = await makeGroup(t.db, "Foreign Lab");
    const { user } = await makeMember(t.db, first.id, "member", "Two Groups");
    await t.db.membership.create({ data: { groupId: second.id, userId: user.id, role: "viewer" } });
    Object.assign(ids, { user: user.id, first: first.id, second: second.id, foreign: foreign.id });
  });

  const signedIn = async (): Promise<JWT> =>
    jwt({ token: {}, user: { id: ids.user, email: "two@example.org", name: "Two Groups" }, account: { provider: "credentials", type: "credentials", providerAccountId: ids.user }, trigger: "signIn" });

  it("starts in the group joined first and carries no role", async () => {
    const token = await signedIn();
    expect(token).toMatchObject({ uid: ids.user, activeGroupId: ids.first, email: "two@example.org" });
    expect(JSON.stringify(token)).not.toMatch(/lead|member|viewer/);
  });

  it("switches only to a group the user belongs to", async () => {
    const token = await signedIn();
    const switched = await jwt({ token, trigger: "update", session: { activeGroupId: ids.second }, user: undefined as never, account: null });
    expect(switched.activeGroupId).toBe(ids.second);
    const refused = await jwt({ token: switched, trigger: "update", session: { activeGroupId: ids.foreign }, user: undefined as never, account: null });
    expect(refused.activeGroupId).toBe(ids.second);
    const junk = await jwt({ token: switched, trigger: "update", session: { activeGroupId: 42 }, user: undefined as never, account: null });
    expect(junk.activeGroupId).toBe(ids.second);
  });
});
