// JSON bodies shaped to break the server rather than the schema: field names that are also names of
// Object.prototype's members ("constructor", "__proto__"), and values nested thousands of levels deep. Each is a 422
// naming the field, and nothing is written.
// Through the real guard with an API token, on each database.
import "./next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as workups from "@/app/api/v1/workups/route";
import * as outcome from "@/app/api/v1/workups/[id]/outcome/route";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

type ErrorJson = { error: { code: string; fields?: Record<string, string[]> } };

describeWithAppDatabase("hostile JSON bodies are a 4xx and write nothing", (t) => {
  let token = "";
  let id = "";

  beforeAll(async () => {
    const lab = await makeLab(t.db, "Claisen Lab");
    token = await tokenFor(t.db, lab.groupId, lab.member.userId);
    const res = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, body: { header: header(), spec: exampleSpec() } });
    id = (await json<{ id: string }>(res)).id;
  });

  it("refuses a field named like a member of Object.prototype with 422 naming it", async () => {
    const before = await footprint(t.db);
    const body = JSON.stringify({ header: header(), spec: exampleSpec() }).replace(/^\{/, '{"constructor":{"prototype":{"x":1}},');
    const created = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, rawBody: body, headers: { "content-type": "application/json" } });
    expect(created.status).toBe(422);
    expect(Object.keys((await json<ErrorJson>(created)).error.fields ?? {})).toEqual(["constructor"]);
    const proto = '{"__proto__":{"role":"lead"},"isolatedMassMg":800,"purityPct":97,"purityMethod":"qnmr"}';
    const reported = await callRoute(outcome.POST, "POST", `/api/v1/workups/${id}/outcome`, { token, params: { id }, rawBody: proto, headers: { "content-type": "application/json" } });
    expect(reported.status).toBe(422);
    expect(Object.keys((await json<ErrorJson>(reported)).error.fields ?? {})).toEqual(["__proto__"]);
    expect(await footprint(t.db)).toEqual(before);
  });

  it("refuses a value nested thousands of levels deep with 422 naming the field", async () => {
    const before = await footprint(t.db);
    const deep = `${"[".repeat(5000)}${"]".repeat(5000)}`;
    const body = JSON.stringify({ header: header({ title: "@@" }), spec: exampleSpec() }).replace('"@@"', deep);
    const res = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, rawBody: body, headers: { "content-type": "application/json" } });
    expect(res.status).toBe(422);
    expect(Object.keys((await json<ErrorJson>(res)).error.fields ?? {})).toEqual(["header.title"]);
    expect(await footprint(t.db)).toEqual(before);
  });
});
