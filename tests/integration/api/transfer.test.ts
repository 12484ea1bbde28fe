// Import/export routes and the OpenAPI document, through the real guard with API tokens.
import "./next-runtime";
import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import * as csvExport from "@/app/api/v1/workups.csv/route";
import * as csvImport from "@/app/api/v1/workups/import/route";
import * as groupExport from "@/app/api/v1/group/export/route";
import * as groupImport from "@/app/api/v1/group/import/route";
import * as openapi from "@/app/api/v1/openapi.json/route";
import { createWorkup } from "@/lib/workups/service";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

describe("OpenAPI document", () => {
  const routeFiles = (dir: string): string[] =>
    fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
      e.isDirectory() ? routeFiles(path.join(dir, e.name)) : e.name === "route.ts" ? [path.join(dir, e.name)] : []);

  it("is OpenAPI 3.1 and lists every method of every route file under app/api/v1", async () => {
    const res = openapi.GET();
    expect(res.status).toBe(200);
    const doc = await json<{ openapi: string; paths: Record<string, Record<string, { responses: Record<string, unknown> }>>; components: { schemas: Record<string, unknown> } }>(res);
    expect(doc.openapi).toBe("3.1.0");
    const expected: string[] = [];
    for (const file of routeFiles(path.resolve("app/api/v1"))) {
      const route = "/api/v1/" + path.relative(path.resolve("app/api/v1"), path.dirname(file)).replace(/\[(\w+)\]/g, "{$1}").split(path.sep).join("/");
      const source = fs.readFileSync(file, "utf8");
      for (const [, method] of source.matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)\b/g)) {
        expected.push(`${method!.toLowerCase()} ${route}`);
      }
    }
    expect(expected.length).toBeGreaterThan(15);
    const documented = Object.entries(doc.paths).flatMap(([p, item]) => Object.keys(item).map((m) => `${m} ${p}`));
    expect(documented.sort()).toEqual(expected.sort());
    expect(doc.paths["/api/v1/workups/{id}"]!["put"]!.responses).toHaveProperty("409");
    expect(Object.keys(doc.components.schemas)).toEqual(expect.arrayContaining(["WorkupSpec", "CreateWorkup", "UpdateWorkup", "OutcomeInput", "Error"]));
  });
});

describeWithAppDatabase("import and export routes", (t) => {
  let lab: Lab;
  let empty: Lab;
  const tokens = { member: "", viewer: "", emptyLead: "", emptyMember: "" };

  beforeAll(async () => {
    lab = await makeLab(t.db, "Robinson Lab");
    empty = await makeLab(t.db, "Stille Lab");
    tokens.member = await tokenFor(t.db, lab.groupId, lab.member.userId);
    tokens.viewer = await tokenFor(t.db, lab.groupId, lab.viewer.userId);
    tokens.emptyLead = await tokenFor(t.db, empty.groupId, empty.lead.userId);
    tokens.emptyMember = await tokenFor(t.db, empty.groupId, empty.member.userId);
    await createWorkup(t.db, lab.member, { header: header({ title: "Robinson benzanilide" }), spec: exampleSpec() }, { draws: 20 });
  });

  it("GET /workups.csv downloads the filtered list", async () => {
    const res = await callRoute(csvExport.GET, "GET", "/api/v1/workups.csv", { token: tokens.viewer, query: { solvent: "etoac" } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="workups-robinson-lab-.+\.csv"$/);
    const lines = (await res.text()).trimEnd().split("\r\n");
    expect(lines[0]!.split(",").slice(0, 3)).toEqual(["id", "title", "performed_on"]);
    expect(lines).toHaveLength(2);
    const bad = await callRoute(csvExport.GET, "GET", "/api/v1/workups.csv", { token: tokens.viewer, query: { from: "yesterday" } });
    expect(bad.status).toBe(422);
  });

  it("POST /workups/import streams progress as NDJSON and ends with the result", async () => {
    const csv = `title,performed_on,template\nRepeat one,2026-11-21,Robinson benzanilide\nRepeat two,2026-11-22,Robinson benzanilide\n`;
    const res = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", {
      token: tokens.member, rawBody: csv, headers: { "content-type": "text/csv", accept: "application/x-ndjson" },
    });
    expect(res.status).toBe(200);
    const lines = (await res.text()).trim().split("\n").map((l) => JSON.parse(l) as { type: string; phase?: string; done?: number; ok?: boolean });
    expect(lines.map((l) => [l.type, l.phase, l.done])).toEqual([
      ["progress", "checking", 1], ["progress", "checking", 2], ["progress", "writing", 1], ["progress", "writing", 2], ["result", undefined, undefined],
    ]);
    expect(lines.at(-1)).toMatchObject({ ok: true });
    expect(await t.db.workup.count({ where: { groupId: lab.groupId, title: { startsWith: "Repeat" } } })).toBe(2);
  });

  it("POST /workups/import answers 422 with every row's problems and writes nothing; a viewer gets 403", async () => {
    const before = await footprint(t.db);
    const res = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", {
      token: tokens.member, rawBody: "title,performed_on,template\n,2026-11-21,Robinson benzanilide\nFine,2026-13-01,Nope\n",
    });
    expect(res.status).toBe(422);
    const body = await json<{ error: { message: string; rows: { row: number; column: string }[] } }>(res);
    expect(body.error.message).toBe("3 problems in 2 rows; nothing was imported.");
    expect(body.error.rows.map((r) => [r.row, r.column])).toEqual([[1, "title"], [2, "template"], [2, "performed_on"]]);
    const viewer = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { token: tokens.viewer, rawBody: "title,performed_on,template\n" });
    expect(viewer.status).toBe(403);
    const unterminated = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { token: tokens.member, rawBody: 'title,performed_on,template\n"Open,2026-11-21,x\n' });
    expect(unterminated.status).toBe(422);
    expect((await json<{ error: { fields: Record<string, string[]> } }>(unterminated)).error.fields["csv"]).toEqual(["line 2: a quoted field is never closed"]);
    const noSpecColumn = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { token: tokens.member, rawBody: "title,performed_on\nA,2026-11-21\n" });
    expect((await json<{ error: { fields: Record<string, string[]> } }>(noSpecColumn)).error.fields["csv"]).toEqual(["the header needs a 'spec_json' or a 'template' column"]);
    const oversized = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { token: tokens.member, rawBody: "x".repeat(10 * 1024 * 1024 + 1) });
    expect(oversized.status).toBe(413);
    expect((await json<{ error: { message: string } }>(oversized)).error.message).toBe("The request body is larger than 10 MB. Send less at once.");
    expect(await footprint(t.db)).toEqual(before);
  });

  it("GET /group/export then POST /group/import into an empty group; members may not import, nor into a group with records", async () => {
    const exported = await callRoute(groupExport.GET, "GET", "/api/v1/group/export", { token: tokens.viewer });
    expect(exported.status).toBe(200);
    const document = await exported.text();
    const before = await footprint(t.db);
    const asMember = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyMember, rawBody: document });
    expect(asMember.status).toBe(403);
    const malformed = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, rawBody: document.slice(0, -2) });
    expect(malformed.status).toBe(400);
    const wrongTypes = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, body: { format: "layerwise.group-export", formatVersion: "1" } });
    expect(wrongTypes.status).toBe(422);
    expect(await footprint(t.db)).toEqual(before);
    const imported = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, rawBody: document });
    expect(imported.status).toBe(201);
    expect(await json(imported)).toMatchObject({ workups: 3 });
    const twice = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, rawBody: document });
    expect(twice.status).toBe(409);
    expect(await t.db.workup.count({ where: { groupId: empty.groupId } })).toBe(3);
  });
});
