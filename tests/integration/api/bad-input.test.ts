// Every bad input is answered 4xx with a message, and writes nothing: NUL characters and broken UTF-16 in any text,
// filter or id; numbers beyond what the database holds; a streamed CSV whose filter is bad; bodies over the stated
// limit; a body that stops arriving. Through the real guard with an API token, on each database.
import "./next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as workups from "@/app/api/v1/workups/route";
import * as workup from "@/app/api/v1/workups/[id]/route";
import * as diff from "@/app/api/v1/workups/[id]/diff/route";
import * as csv from "@/app/api/v1/workups.csv/route";
import * as compounds from "@/app/api/v1/compounds/route";
import { readJsonBody } from "@/lib/api/body";
import { RequestTimeoutError } from "@/lib/errors";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

type ErrorJson = { error: { code: string; message: string; fields?: Record<string, string[]> } };

describeWithAppDatabase("bad input is a 4xx and writes nothing", (t) => {
  let lab: Lab;
  let token = "";
  let id = "";

  beforeAll(async () => {
    lab = await makeLab(t.db, "Hantzsch Lab");
    token = await tokenFor(t.db, lab.groupId, lab.member.userId);
    const res = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, body: { header: header(), spec: exampleSpec() } });
    id = (await json<{ id: string }>(res)).id;
  });

  it("refuses a NUL character or a lone surrogate in any text field with 422 naming the field", async () => {
    const before = await footprint(t.db);
    const nul = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, body: { header: header({ title: "Wash\u0000" }), spec: exampleSpec() } });
    expect(nul.status).toBe(422);
    expect((await json<ErrorJson>(nul)).error.fields?.["header.title"]).toEqual(["must not contain a NUL character (U+0000)"]);
    const spec = exampleSpec() as unknown as { components: { name: string }[] };
    spec.components[0]!.name = "Aniline \uD800";
    const lone = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, body: { header: header(), spec } });
    expect(lone.status).toBe(422);
    expect(Object.keys((await json<ErrorJson>(lone)).error.fields ?? {})).toEqual(["spec.components.0.name"]);
    expect(await footprint(t.db)).toEqual(before);
  });

  it("refuses such text in a filter and in a path id with 422", async () => {
    expect((await callRoute(workups.GET, "GET", "/api/v1/workups", { token, query: { q: "brine\u0000" } })).status).toBe(422);
    // A lone surrogate cannot survive URL encoding (it arrives as U+FFFD), so in a query it is harmless text.
    expect((await callRoute(workups.GET, "GET", "/api/v1/workups", { token, query: { q: "\uDC00" } })).status).toBe(200);
    expect((await callRoute(workup.GET, "GET", "/api/v1/workups/x", { token, params: { id: "c\u0000" } })).status).toBe(422);
  });

  it("answers a bad CSV filter with 422 before any header is sent", async () => {
    const res = await callRoute(csv.GET, "GET", "/api/v1/workups.csv", { token, query: { q: "x\u0000" } });
    expect(res.status).toBe(422);
    expect(res.headers.get("content-disposition")).toBeNull();
    const ok = await callRoute(csv.GET, "GET", "/api/v1/workups.csv", { token });
    expect(ok.status).toBe(200);
    expect((await ok.text()).split("\n").filter((l) => l !== "")).toHaveLength(2);
  });

  it("refuses numbers and dates the database cannot hold with 422, not 500", async () => {
    const far = await callRoute(diff.GET, "GET", `/api/v1/workups/${id}/diff`, { token, params: { id }, query: { from: "1", to: "99999999999" } });
    expect(far.status).toBe(422);
    expect((await json<ErrorJson>(far)).error.fields?.["to"]).toEqual(["to is larger than any version"]);
    const yearZero = Buffer.from(`0000-01-01T00:00:00.000Z|${id}`).toString("base64url");
    expect((await callRoute(workups.GET, "GET", "/api/v1/workups", { token, query: { cursor: yearZero } })).status).toBe(422);
    const from = await callRoute(workups.GET, "GET", "/api/v1/workups", { token, query: { from: "0000-01-01" } });
    expect(from.status).toBe(422);
    expect((await json<ErrorJson>(from)).error.fields?.["from"]).toEqual(["from must be between 1800-01-01 and 9999-12-31"]);
  });

  it("enforces the README's 10 MB for compound registration (413)", async () => {
    const text = "C".repeat(10 * 1024 * 1024 + 100 * 1024);
    const res = await callRoute(compounds.POST, "POST", "/api/v1/compounds", { token, body: { format: "smiles", text } });
    expect(res.status).toBe(413);
  });

  it("drops a body that stops arriving with 408", async () => {
    const stalled = new ReadableStream<Uint8Array>({ start(controller) { controller.enqueue(new TextEncoder().encode('{"header":')); } });
    const request = new Request("http://localhost/api/v1/workups", { method: "POST", body: stalled, duplex: "half" } as RequestInit);
    await expect(readJsonBody(request, 1024 * 1024, { idleTimeoutMs: 50 })).rejects.toBeInstanceOf(RequestTimeoutError);
  });
});
