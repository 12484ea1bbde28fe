// Strict input at the API, tolerant reading of what the app stored itself: a misspelt key is refused with its path
// and the nearest allowed key and nothing is written; a byte-order mark before the JSON is accepted; a stored spec
// that carries keys an older version accepted still predicts, takes an outcome and travels through export/import.
import "./next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as workups from "@/app/api/v1/workups/route";
import * as outcome from "@/app/api/v1/workups/[id]/outcome/route";
import * as predict from "@/app/api/v1/predict/route";
import * as groupExport from "@/app/api/v1/group/export/route";
import * as groupImport from "@/app/api/v1/group/import/route";
import { type Prisma } from "@/generated/prisma/client";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

type ErrorJson = { error: { code: string; message: string; fields?: Record<string, string[]> } };

describeWithAppDatabase("strict input", (t) => {
  let lab: Lab;
  let empty: Lab;
  const tokens = { member: "", viewer: "", emptyLead: "" };

  beforeAll(async () => {
    lab = await makeLab(t.db, "Ullmann Lab");
    empty = await makeLab(t.db, "Glaser Lab");
    tokens.member = await tokenFor(t.db, lab.groupId, lab.member.userId);
    tokens.viewer = await tokenFor(t.db, lab.groupId, lab.viewer.userId);
    tokens.emptyLead = await tokenFor(t.db, empty.groupId, empty.lead.userId);
  });

  it("POST /predict refuses a misspelt key with its path and a suggestion (it used to run one portion)", async () => {
    const spec = exampleSpec();
    (spec.operations[0] as Record<string, unknown>).portion = 3;
    const res = await callRoute(predict.POST, "POST", "/api/v1/predict", { token: tokens.member, body: { spec, draws: 0 } });
    expect(res.status).toBe(422);
    expect((await json<ErrorJson>(res)).error.fields?.["spec.operations.0.portion"]).toEqual(["`portion`: unknown key; did you mean `portions`?"]);
    const top = await callRoute(predict.POST, "POST", "/api/v1/predict", { token: tokens.member, body: { spec: exampleSpec(), draw: 0 } });
    expect((await json<ErrorJson>(top)).error.fields?.["draw"]).toEqual(["`draw`: unknown key; did you mean `draws`?"]);
  });

  it("POST /predict reads a body that starts with a UTF-8 byte-order mark", async () => {
    const body = new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode(JSON.stringify({ spec: exampleSpec(), draws: 0 }))]);
    const res = await callRoute(predict.POST, "POST", "/api/v1/predict", { token: tokens.member, rawBody: body, headers: { "content-type": "application/json" } });
    expect(res.status).toBe(200);
    expect(await json(res)).toMatchObject({ productKey: "benzanilide" });
  });

  it("POST /workups and POST /outcome refuse unknown keys and write nothing", async () => {
    const before = await footprint(t.db);
    const create = await callRoute(workups.POST, "POST", "/api/v1/workups", {
      token: tokens.member, body: { header: { ...header(), notebook: "AB-12" }, spec: exampleSpec() },
    });
    expect(create.status).toBe(422);
    expect((await json<ErrorJson>(create)).error.fields?.["header.notebook"]).toEqual(["`notebook`: unknown key; did you mean `notebookRef`?"]);
    expect(await footprint(t.db)).toEqual(before);

    const made = await callRoute(workups.POST, "POST", "/api/v1/workups", { token: tokens.member, body: { header: header(), spec: exampleSpec() } });
    const { id } = await json<{ id: string }>(made);
    const after = await footprint(t.db);
    const report = await callRoute(outcome.POST, "POST", `/api/v1/workups/${id}/outcome`, {
      token: tokens.member, params: { id }, body: { isolatedMassMg: 400, purity: 97, purityMethod: "qnmr" },
    });
    expect(report.status).toBe(422);
    expect((await json<ErrorJson>(report)).error.fields?.["purity"]).toEqual(["`purity`: unknown key; did you mean `purityPct`?"]);
    expect(await footprint(t.db)).toEqual(after);
  });

  it("a stored spec with keys an older version accepted still takes an outcome and survives export and import", async () => {
    const made = await callRoute(workups.POST, "POST", "/api/v1/workups", { token: tokens.member, body: { header: header({ title: "Stored long ago" }), spec: exampleSpec() } });
    const { id } = await json<{ id: string }>(made);
    // What an older version could have stored: keys it silently dropped on input.
    const stored = exampleSpec() as unknown as Record<string, unknown> & { operations: Record<string, unknown>[]; components: Record<string, unknown>[] };
    stored.legacyNote = "typed by hand";
    (stored.operations[0] as Record<string, unknown>).shakeSeconds = 30;
    (stored.components[0] as Record<string, unknown>).colour = "white";
    await t.db.workup.update({ where: { id }, data: { spec: stored as Prisma.InputJsonObject } });

    const report = await callRoute(outcome.POST, "POST", `/api/v1/workups/${id}/outcome`, {
      token: tokens.member, params: { id }, body: { isolatedMassMg: 400, purityPct: 97, purityMethod: "qnmr" },
    });
    expect(report.status).toBe(200);

    const exported = await callRoute(groupExport.GET, "GET", "/api/v1/group/export", { token: tokens.viewer });
    const imported = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, rawBody: await exported.text() });
    expect(imported.status).toBe(201);
    // Imported as stored: the extra keys are kept in the record and dropped only when it is read.
    const copy = await t.db.workup.findFirst({ where: { groupId: empty.groupId, title: "Stored long ago" }, select: { spec: true } });
    expect((copy?.spec as Record<string, unknown> | undefined)?.legacyNote).toBe("typed by hand");
  });
});
