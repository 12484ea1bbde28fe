// The engine's work per request is bounded: a prediction beyond the budget is refused with 422 before any of it runs
// (the shapes that held the whole server for minutes: 50 components × 200 washes × 50 portions with 2,000 draws on
// /predict, the same spec saved, a two-row CSV import of it), one user's concurrent heavy requests beyond the limit
// answer 429 with Retry-After, and the work that is accepted runs on engine threads, so the event loop keeps
// answering light requests meanwhile (measured as event-loop delay, not wall-clock time).
import "./next-runtime";
import { monitorEventLoopDelay, performance } from "node:perf_hooks";
import { beforeAll, describe, expect, it } from "vitest";
import * as me from "@/app/api/v1/me/route";
import * as predict from "@/app/api/v1/predict/route";
import * as workups from "@/app/api/v1/workups/route";
import * as csvImport from "@/app/api/v1/workups/import/route";
import * as compounds from "@/app/api/v1/compounds/route";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { engineCost, MAX_ENGINE_UNITS, MAX_RESULT_CELLS } from "@/lib/workers/cost";
import { acquireHeavySlot, MAX_HEAVY_PER_USER } from "@/lib/workers/limits";
import { enginePool } from "@/lib/workers/pool";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { makeMember } from "@/tests/integration/auth/fixtures";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

type ErrorJson = { error: { code: string; message: string; fields?: Record<string, string[]> } };

/** `components` copies of the example's product under new keys, and `washes` water washes of `portions` portions each. */
function largeSpec(components: number, washes: number, portions: number): WorkupInputRaw {
  const base = exampleSpec();
  const product = base.components[0]!;
  return {
    ...base,
    components: Array.from({ length: components }, (_, i) => ({ ...product, key: `c${i}`, name: `Component ${i}`, role: i === 0 ? "product" : "impurity" })),
    operations: Array.from({ length: washes }, () => ({ type: "wash", reagent: "water", volume: { value: 10, unit: "mL" }, portions })),
  };
}

/**
 * The example workup with its washes and extractions repeated in more portions, as heavy as the budget accepts with
 * 2,000 draws: with a faster engine the plain example finished its draws before a light request could come back,
 * and the window measured was mostly the requests' own set-up.
 */
function heaviestAccepted(): WorkupInputRaw {
  const withPortions = (k: number): WorkupInputRaw => {
    const spec = exampleSpec();
    spec.operations = spec.operations.map((op) => ("portions" in op && typeof op.portions === "number" ? { ...op, portions: op.portions * k } : op));
    return spec;
  };
  let k = 1;
  while (engineCost(withPortions(k + 1), 2000).units <= MAX_ENGINE_UNITS && engineCost(withPortions(k + 1), 2000).cells <= MAX_RESULT_CELLS) k++;
  return withPortions(k);
}

async function until(condition: () => boolean): Promise<void> {
  while (!condition()) await new Promise((resolve) => setImmediate(resolve));
}

describeWithAppDatabase("engine budget per request", (t) => {
  let lab: Lab;
  const tokens = { member: "", viewer: "", lead: "", other: "" };

  beforeAll(async () => {
    lab = await makeLab(t.db, "Budget Lab");
    tokens.member = await tokenFor(t.db, lab.groupId, lab.member.userId);
    tokens.viewer = await tokenFor(t.db, lab.groupId, lab.viewer.userId);
    tokens.lead = await tokenFor(t.db, lab.groupId, lab.lead.userId);
    const { user } = await makeMember(t.db, lab.groupId, "member", "Budget Lab Second Chemist");
    tokens.other = await tokenFor(t.db, lab.groupId, user.id);
    // Start the engine thread (its first task loads the engine) before anything is measured.
    const warm = await callRoute(predict.POST, "POST", "/api/v1/predict", { token: tokens.viewer, body: { spec: exampleSpec(), draws: 0 } });
    expect(warm.status).toBe(200);
  }, 120_000);

  describe("refused beyond the budget, with the limit stated, before any engine work", () => {
    it("POST /predict: 50 components × 200 washes × 50 portions with 2,000 draws is 422 on the spec", async () => {
      const body = { spec: largeSpec(50, 200, 50), draws: 2000 };
      expect(JSON.stringify(body).length).toBeGreaterThan(25_000);
      const res = await callRoute(predict.POST, "POST", "/api/v1/predict", { token: tokens.viewer, body });
      expect(res.status).toBe(422);
      const error = (await json<ErrorJson>(res)).error;
      expect(error.code).toBe("validation");
      expect(error.fields?.["spec"]).toEqual([
        "This workup is too large to predict on the server: 10,000 steps (counting each portion) × 50 components = 500,000 results; " +
          "the limit is 20,000. Use fewer portions, steps or components.",
      ]);
    });

    it("POST /predict: a spec whose point prediction fits but whose 2,000 draws do not is 422 on draws", async () => {
      const res = await callRoute(predict.POST, "POST", "/api/v1/predict", { token: tokens.viewer, body: { spec: largeSpec(20, 20, 2), draws: 2000 } });
      expect(res.status).toBe(422);
      const error = (await json<ErrorJson>(res)).error;
      expect(error.fields?.["draws"]).toEqual([
        "This prediction is too large to run on the server: 40 steps (counting each portion) × (20 components + 4) × (2,000 draws + 1) = " +
          "1,920,960 work units; the limit is 600,000. Use fewer draws, portions, steps or components.",
      ]);
      const fewer = await callRoute(predict.POST, "POST", "/api/v1/predict", { token: tokens.viewer, body: { spec: largeSpec(20, 20, 2), draws: 100 } });
      expect(fewer.status).toBe(200);
    }, 60_000);

    it("POST /workups: saving the large spec is 422 and writes nothing", async () => {
      const before = await footprint(t.db);
      const res = await callRoute(workups.POST, "POST", "/api/v1/workups", { token: tokens.member, body: { header: header(), spec: largeSpec(50, 200, 50) } });
      expect(res.status).toBe(422);
      expect((await json<ErrorJson>(res)).error.fields?.["spec"]?.[0]).toMatch(/^This workup is too large to predict on the server: .* the limit is 20,000\./);
      expect(await footprint(t.db)).toEqual(before);
    });

    it("POST /workups/import: two rows of the large spec are refused row by row and nothing is written", async () => {
      const cell = `"${JSON.stringify(largeSpec(50, 200, 50)).replaceAll('"', '""')}"`;
      const csv = `title,performed_on,spec_json\nFirst large,2026-11-21,${cell}\nSecond large,2026-11-22,${cell}\n`;
      const before = await footprint(t.db);
      const res = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { token: tokens.member, rawBody: csv, headers: { "content-type": "text/csv" } });
      expect(res.status).toBe(422);
      const body = await json<{ error: { message: string; rows: { row: number; column: string; message: string }[] } }>(res);
      expect(body.error.message).toBe("2 problems in 2 rows; nothing was imported.");
      expect(body.error.rows.map((r) => [r.row, r.column])).toEqual([[1, "spec_json"], [2, "spec_json"]]);
      expect(body.error.rows[0]?.message).toMatch(/the limit is 20,000/);
      expect(await footprint(t.db)).toEqual(before);
    });
  });

  it(`one user's heavy requests beyond ${MAX_HEAVY_PER_USER} at once answer 429 with Retry-After; another user is not held back`, async () => {
    const heavy = (token: string) => callRoute(predict.POST, "POST", "/api/v1/predict", { token, body: { spec: exampleSpec(), draws: 2000 } });
    const own = await Promise.all(Array.from({ length: MAX_HEAVY_PER_USER + 1 }, () => heavy(tokens.member)));
    const statuses = own.map((r) => r.status).sort();
    expect(statuses).toEqual([...Array<number>(MAX_HEAVY_PER_USER).fill(200), 429]);
    const refused = own.find((r) => r.status === 429)!;
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
    expect((await json<ErrorJson>(refused)).error.message).toBe(
      `You already have ${MAX_HEAVY_PER_USER} heavy requests (predictions, imports or registrations) running; the limit is ${MAX_HEAVY_PER_USER} at once. Try again when one has finished.`,
    );
    // The slots are given back: the same user may run one again, and another user was never affected.
    const [again, other] = await Promise.all([heavy(tokens.member), heavy(tokens.other)]);
    expect([again.status, other.status]).toEqual([200, 200]);
  }, 120_000);

  it("bulk compound registration and CSV import take one of the user's heavy slots: 429 with Retry-After while all are taken, nothing written", async () => {
    const held = Array.from({ length: MAX_HEAVY_PER_USER }, () => acquireHeavySlot(lab.member.userId));
    const before = await footprint(t.db);
    try {
      const register = await callRoute(compounds.POST, "POST", "/api/v1/compounds", { token: tokens.member, body: { format: "smiles", text: "CC(=O)Nc1ccccc1 acetanilide" } });
      expect(register.status).toBe(429);
      expect(Number(register.headers.get("retry-after"))).toBeGreaterThan(0);
      const csv = `title,performed_on,spec_json\nSmall,2026-11-21,"${JSON.stringify(exampleSpec()).replaceAll('"', '""')}"\n`;
      const imported = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { token: tokens.member, rawBody: csv, headers: { "content-type": "text/csv" } });
      expect(imported.status).toBe(429);
      expect(await footprint(t.db)).toEqual(before);
    } finally {
      held.forEach((release) => release());
    }
    const register = await callRoute(compounds.POST, "POST", "/api/v1/compounds", { token: tokens.member, body: { format: "smiles", text: "CC(=O)Nc1ccccc1 acetanilide" } });
    expect(register.status).toBe(201);
  }, 120_000);

  it("accepted heavy work runs off the event loop: light requests are answered meanwhile and the loop stays idle", async () => {
    // Event-loop utilisation (the share of wall time the loop spends running code rather than waiting for I/O) is
    // what tells the two apart on a busy machine: a loop that computes is near 1 however the OS schedules it.
    const elu = performance.eventLoopUtilization();
    const delay = monitorEventLoopDelay({ resolution: 10 });
    delay.enable();
    // Each: the heaviest accepted variant of the example workup with 2,000 draws, a second or more of engine time;
    // three users at once.
    const spec = heaviestAccepted();
    const started = [tokens.member, tokens.lead, tokens.other].map((token) =>
      callRoute(predict.POST, "POST", "/api/v1/predict", { token, body: { spec, draws: 2000 } }).then((r) => ({ status: r.status, at: performance.now() })),
    );
    await until(() => enginePool().load.running > 0);
    const light = await callRoute(me.GET, "GET", "/api/v1/me", { token: tokens.viewer });
    const lightAt = performance.now();
    expect(light.status).toBe(200);
    const heavy = await Promise.all(started);
    await new Promise((resolve) => setTimeout(resolve, 50)); // one more turn, so a stall at the very end is counted too
    delay.disable();
    const used = performance.eventLoopUtilization(elu);
    expect(heavy.map((h) => h.status)).toEqual([200, 200, 200]);
    // The light request came back while the heavy ones were still running…
    expect(Math.min(...heavy.map((h) => h.at))).toBeGreaterThan(lightAt);
    // …the loop mostly waited (on the event loop the engine keeps it busy nearly all the time)…
    expect(used.utilization).toBeLessThan(0.5);
    // …and no single turn of the loop was held anywhere near a second.
    expect(delay.max / 1e6).toBeLessThan(1000);
  }, 120_000);
});
