// The engine budget holds for server actions as for the API: saving, updating or checking on the server a workup
// beyond it answers 422 with the limit stated and writes nothing (the same spec once held the server for seconds
// per save). Actions run inside the request scope Next gives them, with a signed-in member's session cookie.
import "@/tests/integration/api/next-runtime";
import { beforeAll, expect, it } from "vitest";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { currentSessionVersion } from "@/lib/auth/sessions";
import { type ActionResult } from "@/lib/errors";
import { createWorkupAction, predictAction, updateWorkupAction } from "@/lib/workups/actions";
import { createWorkup } from "@/lib/workups/service";
import { callRoute } from "@/tests/integration/api/call";
import { sessionCookieHeader } from "@/tests/integration/api/session-cookie";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";

async function asMember<T>(cookie: string, run: () => Promise<ActionResult<T>>): Promise<ActionResult<T>> {
  let result: ActionResult<T> | undefined;
  await callRoute(async () => { result = await run(); return new Response(null, { status: 204 }); }, "POST", "/workups", { headers: { cookie } });
  if (!result) throw new Error("the action did not run");
  return result;
}

/** 50 copies of the example's product and 200 water washes of 50 portions each. */
function largeSpec(): WorkupInputRaw {
  const base = exampleSpec();
  const product = base.components[0]!;
  return {
    ...base,
    components: Array.from({ length: 50 }, (_, i) => ({ ...product, key: `c${i}`, name: `Component ${i}`, role: i === 0 ? "product" : "impurity" })),
    operations: Array.from({ length: 200 }, () => ({ type: "wash", reagent: "water", volume: { value: 10, unit: "mL" }, portions: 50 })),
  };
}

describeWithAppDatabase("engine budget in server actions", (t) => {
  let lab: Lab;
  let session = "";
  let workupId = "";
  beforeAll(async () => {
    lab = await makeLab(t.db, "Haber Lab");
    session = await sessionCookieHeader({
      uid: lab.member.userId, activeGroupId: lab.groupId, sv: await currentSessionVersion(lab.member.userId), email: "member@example.org", name: "Member",
    });
    workupId = (await createWorkup(t.db, lab.member, { header: header(), spec: exampleSpec() }, { draws: 0 })).id;
  }, 120_000);

  it("create, update and the server-side check answer 422 on the spec with the limit, and write nothing", async () => {
    const before = await footprint(t.db);
    const results = [
      await asMember(session, () => createWorkupAction({ header: header({ title: "Too large" }), spec: largeSpec() })),
      await asMember(session, () => updateWorkupAction(workupId, { header: header(), spec: largeSpec(), baseVersion: 1 })),
      await asMember(session, () => predictAction(largeSpec())),
    ];
    for (const result of results) {
      expect(result).toMatchObject({ ok: false, status: 422 });
      if (!result.ok) expect(result.fieldErrors?.["spec"]?.[0]).toMatch(/= 500,000 results; the limit is 20,000\./);
    }
    expect(await footprint(t.db)).toEqual(before);
  });
});
