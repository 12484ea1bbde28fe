// Heavy parsing runs on the engine threads, not on the event loop that answers everyone: while a large SD file is
// read (RDKit) or a large group export is parsed and checked, a light request sent meanwhile comes back before the
// heavy one, and no turn of the loop is held for more than a small part of the heavy request's own time. Compared
// with the heavy request itself, never with a fixed time (the machine is shared). Bad input keeps its message
// (naming the record in a late slice of the file, or what is wrong with the body) and writes nothing.
import "./next-runtime";
import { performance } from "node:perf_hooks";
import { beforeAll, expect, it } from "vitest";
import * as me from "@/app/api/v1/me/route";
import * as compounds from "@/app/api/v1/compounds/route";
import * as groupExport from "@/app/api/v1/group/export/route";
import * as groupImport from "@/app/api/v1/group/import/route";
import { loadRDKit, usingMol } from "@/lib/chem/structure";
import { heavyRunning } from "@/lib/workers/limits";
import { createWorkup } from "@/lib/workups/service";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

type ErrorJson = { error: { code: string; message: string; fields?: Record<string, string[]>; records?: { message: string; line: number; record?: number }[] } };

/** Distinct real molecules: ring systems with a straight alkyl chain of 1 to `chains` carbons. */
function series(chains: number): string[] {
  const heads = ["c1ccccc1", "Oc1ccc(cc1)", "Nc1ccc(cc1)", "OC(=O)c1ccc(cc1)", "C1CCN(CC1)", "c1ccncc1", "OC(=O)", "NC", "OC", "Clc1ccc(cc1)"];
  return heads.flatMap((head) => Array.from({ length: chains }, (_, i) => `${head}${"C".repeat(i + 1)}`));
}

interface SdBuild {
  text: string;
  /** 1-based first line of each record. */
  lines: number[];
}

/** An SD file of the molecules, record i titled "Series member i+1"; `broken` (0-based) gets an atom of no element. */
async function sdFile(smiles: string[], broken?: number): Promise<SdBuild> {
  const rdkit = await loadRDKit();
  const lines: number[] = [];
  let line = 1;
  const records = smiles.map((s, i) => {
    const block = usingMol(rdkit.get_mol(s)!, (m) => m.get_molblock()).split("\n");
    block[0] = `Series member ${i + 1}`;
    if (i === broken) block[4] = `${block[4]!.slice(0, 31)}Xx ${block[4]!.slice(34)}`;
    const record = `${block.join("\n").replace(/\n*$/, "\n")}$$$$\n`;
    lines.push(line);
    line += record.split("\n").length - 1;
    return record;
  });
  return { text: records.join(""), lines };
}

async function until(condition: () => boolean): Promise<void> {
  while (!condition()) await new Promise((resolve) => setImmediate(resolve));
}

interface Race {
  heavy: Response;
  heavyMs: number;
  light: Response;
  lightMs: number;
  /** Light request answered before the heavy one. */
  lightFirst: boolean;
  /** Longest turn of the event loop while the heavy request ran, ms. */
  longestTurnMs: number;
}

/** The longest turn of the event loop while it runs, ms: the largest lateness of a 10 ms timer. */
function turnGauge(): { stop: () => number } {
  let last = performance.now();
  let longest = 0;
  const tick = () => {
    const now = performance.now();
    longest = Math.max(longest, now - last - 10);
    last = now;
  };
  const timer = setInterval(tick, 10);
  return { stop: () => (tick(), clearInterval(timer), longest) };
}

/** Sends the heavy request, then the light one as soon as `started` says the heavy one is under way. */
async function race(heavy: () => Promise<Response>, light: () => Promise<Response>, started: () => boolean): Promise<Race> {
  const gauge = turnGauge();
  const t0 = performance.now();
  let settled = false;
  const heavyDone = heavy().then((res) => {
    settled = true;
    return { res, at: performance.now() };
  });
  // A heavy request that ran on the loop may have finished before `started` was ever seen true.
  await until(() => started() || settled);
  const lightStart = performance.now();
  const lightRes = await light();
  const lightAt = performance.now();
  const done = await heavyDone;
  const longestTurnMs = gauge.stop();
  return { heavy: done.res, heavyMs: done.at - t0, light: lightRes, lightMs: lightAt - lightStart, lightFirst: lightAt < done.at, longestTurnMs };
}

describeWithAppDatabase("heavy parsing off the event loop", (t) => {
  let lab: Lab;
  let empty: Lab;
  const tokens = { member: "", viewer: "", lead: "", emptyLead: "" };
  const molecules = series(40); // 400 records

  beforeAll(async () => {
    lab = await makeLab(t.db, "Offloop Lab");
    empty = await makeLab(t.db, "Offloop Empty Lab");
    tokens.member = await tokenFor(t.db, lab.groupId, lab.member.userId);
    tokens.viewer = await tokenFor(t.db, lab.groupId, lab.viewer.userId);
    tokens.lead = await tokenFor(t.db, lab.groupId, lab.lead.userId);
    tokens.emptyLead = await tokenFor(t.db, empty.groupId, empty.lead.userId);
    // Start an engine thread and its structure toolkit before anything is compared.
    const warm = await callRoute(compounds.POST, "POST", "/api/v1/compounds", { token: tokens.lead, body: { format: "smiles", text: "CC(=O)Nc1ccccc1 acetanilide" } });
    expect(warm.status).toBe(201);
  }, 120_000);

  it("an SD file with a bad record in a late slice: 422 naming that record and its line, nothing written", async () => {
    const sdf = await sdFile(molecules, 349);
    const before = await footprint(t.db);
    const res = await callRoute(compounds.POST, "POST", "/api/v1/compounds", { token: tokens.member, body: { format: "sdf", text: sdf.text } });
    expect(res.status).toBe(422);
    const body = await json<ErrorJson>(res);
    expect(body.error.message).toBe("Nothing was registered: 1 of 400 records needs attention.");
    expect(body.error.records).toHaveLength(1);
    expect(body.error.records![0]).toMatchObject({ record: 350, line: sdf.lines[349] });
    expect(body.error.records![0]!.message).toMatch(new RegExp(`^Record 350 “Series member 350” \\(line ${sdf.lines[349]}\\): Line ${sdf.lines[349]! + 4}: 'Xx' is not an element symbol\\.$`));
    expect(await footprint(t.db)).toEqual(before);
  }, 300_000);

  it("GET /me is answered while 400 SD records are read and registered", async () => {
    const sdf = await sdFile(molecules);
    const result = await race(
      () => callRoute(compounds.POST, "POST", "/api/v1/compounds", { token: tokens.member, body: { format: "sdf", text: sdf.text } }),
      () => callRoute(me.GET, "GET", "/api/v1/me", { token: tokens.viewer }),
      () => heavyRunning(lab.member.userId) > 0,
    );
    expect(result.heavy.status).toBe(201);
    expect((await json<{ created: unknown[] }>(result.heavy)).created).toHaveLength(400);
    expect(result.light.status).toBe(200);
    expect(result.lightFirst).toBe(true);
    // Reading the structures (nearly all of the request's time) ran elsewhere: no single turn of the loop took a
    // sizeable part of it.
    expect(result.longestTurnMs).toBeLessThan(result.heavyMs / 4);
  }, 300_000);

  it("a large group export: bad JSON and an inconsistent document keep their messages and write nothing; GET /me is answered while a good one is parsed", async () => {
    await createWorkup(t.db, lab.member, { header: header({ title: "Offloop benzanilide" }), spec: exampleSpec() }, { draws: 20 });
    const exported = await callRoute(groupExport.GET, "GET", "/api/v1/group/export", { token: tokens.viewer });
    expect(exported.status).toBe(200);
    const doc = await json<{ workups: { ref: string }[] }>(exported);
    const [first] = doc.workups;
    // 600 copies of the workup under new refs: an export of a busy group's few years.
    doc.workups = Array.from({ length: 600 }, (_, i) => ({ ...structuredClone(first!), ref: `${first!.ref}-${i}` }));
    const document = JSON.stringify(doc);
    const before = await footprint(t.db);

    const malformed = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, rawBody: document.slice(0, -2) });
    expect(malformed.status).toBe(400);
    expect((await json<ErrorJson>(malformed)).error.message).toMatch(/^The request body is not valid JSON \(.+\)\.$/);
    const inconsistent = structuredClone(doc) as unknown as { workups: { version: number }[] };
    inconsistent.workups[599]!.version = 99;
    const refused = await callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, rawBody: JSON.stringify(inconsistent) });
    expect(refused.status).toBe(422);
    const refusal = await json<ErrorJson>(refused);
    expect(refusal.error.message).toBe("The export document is not consistent.");
    expect(refusal.error.fields?.["workups.599.versions"]).toEqual(["no snapshot of the current version 99"]);
    expect(await footprint(t.db)).toEqual(before);

    const result = await race(
      () => callRoute(groupImport.POST, "POST", "/api/v1/group/import", { token: tokens.emptyLead, rawBody: document }),
      () => callRoute(me.GET, "GET", "/api/v1/me", { token: tokens.viewer }),
      () => true,
    );
    expect(result.heavy.status).toBe(201);
    expect(await json(result.heavy)).toMatchObject({ workups: 600 });
    expect(result.light.status).toBe(200);
    expect(result.lightFirst).toBe(true);
    expect(result.longestTurnMs).toBeLessThan(result.heavyMs / 4);
    expect(await t.db.workup.count({ where: { groupId: empty.groupId } })).toBe(600);
  }, 600_000);
});
