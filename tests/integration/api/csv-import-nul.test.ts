// A NUL character anywhere in an imported CSV is a 422 with a message, and nothing is written. An exported list
// with a NUL put into its notebook reference reached the database and answered 500. Through the real guard with an
// API token, on each database.
import "./next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as importRoute from "@/app/api/v1/workups/import/route";
import * as csvRoute from "@/app/api/v1/workups.csv/route";
import * as workups from "@/app/api/v1/workups/route";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

describeWithAppDatabase("CSV import with a NUL character", (t) => {
  let token = "";
  let exported = "";

  beforeAll(async () => {
    const lab = await makeLab(t.db, "Mannich Lab");
    token = await tokenFor(t.db, lab.groupId, lab.member.userId);
    await callRoute(workups.POST, "POST", "/api/v1/workups", { token, body: { header: header(), spec: exampleSpec() } });
    exported = await (await callRoute(csvRoute.GET, "GET", "/api/v1/workups.csv", { token })).text();
  });

  it("answers 422 naming the file and writes nothing", async () => {
    expect(exported).toContain("AB-12/041");
    const before = await footprint(t.db);
    const csv = exported.replace("AB-12/041", "\u0000");
    const res = await callRoute(importRoute.POST, "POST", "/api/v1/workups/import", { token, rawBody: csv, headers: { "content-type": "text/csv" } });
    expect(res.status).toBe(422);
    expect((await json<{ error: { fields?: Record<string, string[]> } }>(res)).error.fields?.["csv"]).toEqual(["the file contains a NUL character (U+0000); remove it and import again"]);
    expect(await footprint(t.db)).toEqual(before);
  });
});
