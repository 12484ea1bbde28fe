// Server actions are public POST endpoints whatever their TypeScript signatures say. Arguments that are not what
// the signature promises (an object where an id is expected, a version number beyond the column's range) must be
// refused with 422 before they reach a query, and must change nothing. The actions run in the same request scope
// Next gives them, through the real guard, with a signed-in lead's session cookie (API tokens open the API only).
import "@/tests/integration/api/next-runtime";
import { beforeAll, expect, it } from "vitest";
import { type ActionResult } from "@/lib/errors";
import {
  deleteWorkupAction, diffVersionsAction, getWorkupAction, listVersionsAction, predictAction, reportOutcomeAction, updateWorkupAction,
} from "@/lib/workups/actions";
import { setExclusionAction } from "@/lib/partition/actions";
import { createWorkup } from "@/lib/workups/service";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { callRoute } from "@/tests/integration/api/call";
import { sessionCookieHeader } from "@/tests/integration/api/session-cookie";
import { currentSessionVersion } from "@/lib/auth/sessions";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";

/** Runs a server action inside a request carrying the session `cookie`, as Next would run it. */
async function asMember<T>(cookie: string, run: () => Promise<ActionResult<T>>): Promise<ActionResult<T>> {
  let result: ActionResult<T> | undefined;
  await callRoute(async () => { result = await run(); return new Response(null, { status: 204 }); }, "POST", "/workups", { headers: { cookie } });
  if (!result) throw new Error("the action did not run");
  return result;
}

const operator = { not: "x" } as unknown as string;

describeWithAppDatabase("server-action arguments are parsed before any query", (t) => {
  let lab: Lab;
  let session = "";
  let workupId = "";

  beforeAll(async () => {
    lab = await makeLab(t.db, "Ostwald Lab");
    session = await sessionCookieHeader({
      uid: lab.lead.userId, activeGroupId: lab.groupId, sv: await currentSessionVersion(lab.lead.userId), email: "lead@example.org", name: "Lead",
    });
    workupId = (await createWorkup(t.db, lab.member, { header: header({ title: "Acid-base separation" }), spec: exampleSpec() }, { draws: 0 })).id;
    await createWorkup(t.db, lab.member, { header: header({ title: "Second record" }), spec: exampleSpec() }, { draws: 0 });
  });

  it("refuses a Prisma operator object where an id is expected (422, the argument named)", async () => {
    const read = await asMember(session, () => getWorkupAction(operator));
    expect(read).toMatchObject({ ok: false, status: 422 });
    if (!read.ok) expect(read.fieldErrors?.["id"]).toEqual(["id must be an id"]);
    expect(await asMember(session, () => listVersionsAction(operator))).toMatchObject({ ok: false, status: 422 });
    expect(await asMember(session, () => predictAction(exampleSpec(), operator))).toMatchObject({ ok: false, status: 422 });
  });

  it("deletes nothing when the id of a delete is an operator object", async () => {
    const before = await footprint(t.db);
    expect(await asMember(session, () => deleteWorkupAction(operator))).toMatchObject({ ok: false, status: 422 });
    expect(await asMember(session, () => updateWorkupAction(operator, { header: header(), spec: exampleSpec(), baseVersion: 1 }))).toMatchObject({ ok: false, status: 422 });
    expect(await asMember(session, () => reportOutcomeAction(operator, { isolatedMassMg: 10, purityMethod: "weight_only" }))).toMatchObject({ ok: false, status: 422 });
    expect(await footprint(t.db)).toEqual(before);
    expect(await t.db.workup.count({ where: { groupId: lab.groupId } })).toBe(2);
  });

  it("refuses ids of the wrong shape and version numbers beyond the column's range with 422, not 500", async () => {
    const diff = await asMember(session, () => diffVersionsAction(workupId, 1, 99_999_999_999));
    expect(diff).toMatchObject({ ok: false, status: 422 });
    if (!diff.ok) expect(diff.fieldErrors?.["to"]).toEqual(["to is out of range"]);
    expect(await asMember(session, () => getWorkupAction("../../etc"))).toMatchObject({ ok: false, status: 422 });
    expect(await asMember(session, () => getWorkupAction(workupId))).toMatchObject({ ok: true });
  });

  it("parses the whole argument of an exclusion, the page to refresh included", async () => {
    const result = await asMember(session, () => setExclusionAction({ observationId: "c".padEnd(25, "0"), excluded: true, compoundId: operator }));
    expect(result).toMatchObject({ ok: false, status: 422 });
  });
});
