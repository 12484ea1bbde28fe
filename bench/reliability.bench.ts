/**
 * Reliability figures against a real production server (never a timed test):
 *   1. the authorization matrix: every route handler and page (read from app/) × anonymous, viewer, member, lead,
 *      another group's lead, revoked/expired tokens and a signed-out session; and every server action (read from the
 *      build's manifest) × the same people, invoked over HTTP as a browser does; violations counted;
 *   2. malformed requests (≥ 2,000) over HTTP against the write and search routes: 5xx, broken connections,
 *      stack traces or internal messages in bodies, and partial writes (rows that no acknowledged write explains);
 *   3. kill -9 of the server under concurrent writers, several rounds: acknowledged writes missing after restart.
 * While 1 and 2 run, heavy requests (the largest prediction the budget allows, a 1,000-record SD file, a 200-workup
 * group import) are sent beside them and the server's event loop is measured (loop-probe.mjs, loaded with
 * `node --import`), with a prober asking a trivial route every 50 ms.
 *
 *   npm run bench:reliability -- --backend pglite|postgres [--parts authz,fuzz,kill] [--fuzz 2400] [--rounds 5]
 *                                [--writers 16] [--admin-url postgresql://postgres@127.0.0.1:5432/postgres]
 *                                [--no-heavy] [--no-write] [--out file.json]   (--no-write: keep bench/results as it is)
 *
 * Needs a production build (built here if missing or stale, scripts/ensure-build.mjs). Each run gets a database of
 * its own (a temp PGlite folder, or a PostgreSQL database created and dropped) and a server on a free port on
 * 127.0.0.1. The figures go to bench/results/reliability-<backend>.json (and the summary to reliability.md).
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import { loadavg } from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import { enumerateActions, runActionMatrix, type ActionMatrixReport } from "./lib/reliability/actions";
import { runMatrix, type MatrixReport } from "./lib/reliability/authz";
import { makePeople, makeRecords } from "./lib/reliability/fixtures";
import { buildCases, runFuzz, type FuzzResult } from "./lib/reliability/fuzz";
import { bearer, ask } from "./lib/reliability/http";
import { killRounds, type KillResult } from "./lib/reliability/kill";
import { enumerateEndpoints } from "./lib/reliability/routes";
import { makeHeavyPayloads, makeHeavyPeople, phaseReport, readLoopFile, startHeavyLoad, type HeavyPayloads, type HeavyPeople, type PhaseLoopReport } from "./lib/reliability/heavy";
import { attributeChanges, snapshot, type PartialWriteReport, type Snapshot } from "./lib/reliability/snapshot";
import { type Backend, createInstance, disposeInstance, type Instance, openDatabase, startServer, stopServer } from "./lib/reliability/server";
import { writeSummary } from "./lib/reliability/summary";

const { values: args } = parseArgs({
  options: {
    backend: { type: "string", default: "pglite" },
    parts: { type: "string", default: "authz,fuzz,kill" },
    fuzz: { type: "string", default: "2400" },
    rounds: { type: "string", default: "5" },
    writers: { type: "string", default: "16" },
    "admin-url": { type: "string", default: "postgresql://postgres@127.0.0.1:5432/postgres" },
    "no-write": { type: "boolean", default: false },
    "no-heavy": { type: "boolean", default: false },
    out: { type: "string" },
  },
});

const backend = args.backend === "postgres" || args.backend === "postgresql" ? "postgres" : args.backend === "pglite" ? "pglite" : null;
if (!backend) throw new Error(`--backend must be pglite or postgres, not ${args.backend}`);
const parts = new Set(args.parts.split(","));
const root = process.cwd();
const adminUrl = args["admin-url"];

async function withDb<T>(instance: Instance, fn: (db: Awaited<ReturnType<typeof openDatabase>>["db"]) => Promise<T>): Promise<T> {
  // PGlite is single-process: the server must be stopped while the bench reads the folder.
  const wasRunning = instance.child !== null;
  if (instance.backend === "pglite" && wasRunning) await stopServer(instance);
  const database = await openDatabase(instance);
  try {
    return await fn(database.db);
  } finally {
    await database.close();
    if (instance.backend === "pglite" && wasRunning) await startServer(instance);
  }
}

/** Waits until the group's background jobs are idle, so a snapshot does not catch one half-way. */
async function jobsIdle(instance: Instance, token: string): Promise<void> {
  for (let i = 0; i < 240; i++) {
    const res = await ask(instance.base, "/api/v1/jobs", { headers: bearer(token) });
    if (res.status === 200 && (JSON.parse(res.body) as { active: unknown[] }).active.length === 0) return;
    await new Promise((r) => setTimeout(r, 500));
  }
}

async function main(): Promise<void> {
  const built = spawnSync(process.execPath, ["scripts/ensure-build.mjs"], { stdio: "inherit", cwd: root });
  if (built.status !== 0) throw new Error("the production build failed");
  const startedAt = new Date().toISOString();
  const load0 = loadavg();
  const instance = await createInstance(backend as Backend, root, adminUrl);
  let matrix: MatrixReport | null = null;
  let actions: ActionMatrixReport | null = null;
  let fuzz: (FuzzResult & PartialWriteReport) | null = null;
  let kill: KillResult | null = null;
  const loop: PhaseLoopReport[] = [];
  try {
    const { people, heavyPeople } = await withDb(instance, async (db) => {
      const made = await makePeople(db);
      return { people: made, heavyPeople: await makeHeavyPeople(db, made.groupB, 40) };
    });
    await startServer(instance);
    const recordsA = await makeRecords(instance.base, root, people.lead.token, `Group ${people.marker}`);
    const recordsB = await makeRecords(instance.base, root, people.otherLead.token, "Group B");
    const context = { base: instance.base, root, people, recordsA, recordsB };
    const payloads: HeavyPayloads | null = args["no-heavy"] ? null : await makeHeavyPayloads(instance.base, root, heavyPeople.sender);
    const nextImporter = { i: 0 };
    /** Runs a part with the heavy requests and the prober beside it, and notes the event loop's figures. */
    const underHeavyLoad = async <T>(phase: string, heavy: HeavyPeople, fn: () => Promise<T>): Promise<T> => {
      if (!payloads) return fn();
      const from = Date.now();
      const load = startHeavyLoad(instance.base, heavy, payloads, nextImporter);
      try {
        return await fn();
      } finally {
        const seen = await load.stop();
        const report = phaseReport(phase, from, Date.now(), readLoopFile(instance.env["LAYERWISE_LOOP_FILE"] ?? ""), seen);
        loop.push(report);
        const h = report.heavy;
        if (Object.keys(report.openDuringLongHolds).length > 0) console.log(`  requests open during holds over 1 s: ${JSON.stringify(report.openDuringLongHolds)}`);
        console.log(`  event loop during ${phase}: held at most ${report.maxLoopHeldMs} ms (${report.heldOver1s} holds over 1 s), max delay ${report.maxLoopDelayMs} ms; prober max ${report.probe.maxMs} ms (p99 ${report.probe.p99Ms} ms); heavy: ${Object.entries(h).map(([k, v]) => `${k} ${v.requests} (${JSON.stringify(v.statuses)}, median ${v.medianMs} ms)`).join(", ")}`);
      }
    };

    if (parts.has("authz")) {
      const endpoints = enumerateEndpoints(root);
      const serverActions = enumerateActions(root);
      console.log(`authorization matrix: ${endpoints.length} endpoints, ${serverActions.length} server actions...`);
      await underHeavyLoad("authorization matrix", heavyPeople, async () => {
        matrix = await runMatrix(context, endpoints);
        actions = await runActionMatrix(context, serverActions);
      });
      const m = matrix as MatrixReport | null;
      const a = actions as ActionMatrixReport | null;
      if (m) {
        console.log(`  routes and pages: ${m.cells} cells, ${m.violations} violations, ${m.unexpected} unexpected, ${m.uncovered.length} uncovered`);
        for (const p of m.problems.slice(0, 40)) console.log(`  ${p.verdict}: ${p.endpoint} as ${p.principal}: ${p.why ?? ""}`);
      }
      if (a) {
        console.log(`  server actions: ${a.cells} cells, ${a.violations} violations, ${a.unexpected} unexpected, ${a.uncovered.length} uncovered`);
        for (const p of a.problems.slice(0, 40)) console.log(`  ${p.verdict}: ${p.action} as ${p.principal}: ${p.why ?? ""}`);
      }
    }

    if (parts.has("fuzz")) {
      const cases = await buildCases(context, Number(args.fuzz));
      console.log(`malformed requests: ${cases.length}...`);
      const snap = (): Promise<Snapshot> => withDb(instance, (db) => snapshot(db));
      await jobsIdle(instance, people.lead.token);
      const before = await snap();
      const result = await underHeavyLoad("malformed requests", heavyPeople, () => runFuzz(context, cases));
      await jobsIdle(instance, people.lead.token);
      const after = await snap();
      // A partial write is a row of group A that no acknowledged write explains (snapshot.ts), so writes that were
      // valid after all and accepted, and the background jobs that follow them, are not counted as partial.
      const attributed = attributeChanges(before, after, people.groupA, new Set(result.acknowledgedIds), result.acceptedWrites > 0);
      fuzz = { ...result, ...attributed };
      console.log(`  ${result.requests} requests: ${result.serverErrors} 5xx, ${result.brokenConnections} broken connections, ${result.leaks} leaks, ${attributed.partialWrites} partial writes (${result.acceptedWrites} accepted writes; rows explained ${JSON.stringify(attributed.explained)}, follow-ups ${JSON.stringify(attributed.followUps)}); slowest ${(result.slowestMs / 1000).toFixed(1)} s (${result.slowest})`);
      for (const r of attributed.partialWriteRows) console.log(`  partial write: ${r}`);
      for (const p of result.problems.slice(0, 40)) console.log(`  ${p.target} / ${p.mutation}: ${p.why}: ${p.body.slice(0, 160)}`);
    }

    if (parts.has("kill")) {
      console.log(`kill -9 under ${args.writers} writers, ${args.rounds} rounds...`);
      kill = await killRounds(instance, root, people, { rounds: Number(args.rounds), writers: Number(args.writers), minMs: 2000, maxMs: 8000 });
      console.log(`  ${kill.acknowledged} acknowledged writes, ${kill.lost} lost`);
    }
  } finally {
    const errorsInLog = instance.log.filter((l) => /request handler failed|Unexpected error|\[layerwise\]/.test(l)).length;
    if (errorsInLog > 0) console.log(`server log: ${errorsInLog} error lines; last: ${instance.log.filter((l) => /\[layerwise\]|Error/.test(l)).slice(-5).join(" | ")}`);
    await disposeInstance(instance, adminUrl);
  }
  const report = {
    backend, startedAt, finishedAt: new Date().toISOString(), loadavg: { before: load0, after: loadavg() },
    command: `npm run bench:reliability -- --backend ${backend}${args.parts !== "authz,fuzz,kill" ? ` --parts ${args.parts}` : ""}`,
    matrix, actions, fuzz, kill, loop,
  };
  if (args.out) fs.writeFileSync(args.out, `${JSON.stringify(report, null, 2)}\n`);
  if (!args["no-write"]) {
    const dir = path.join(root, "bench", "results");
    fs.mkdirSync(dir, { recursive: true });
    fs.writeFileSync(path.join(dir, `reliability-${backend}.json`), `${JSON.stringify(report, null, 2)}\n`);
    writeSummary(dir);
  }
  const m = matrix as MatrixReport | null;
  const a = actions as ActionMatrixReport | null;
  const f = fuzz;
  const failed = (m ? m.violations + m.uncovered.length : 0) + (a ? a.violations + a.uncovered.length : 0) +
    (f ? f.serverErrors + f.brokenConnections + f.leaks + f.partialWrites : 0) + (kill?.lost ?? 0) +
    loop.reduce((s, l) => s + l.heldOver1s, 0);
  console.log(failed === 0 ? "reliability: all targets met (0 / 0 / 0)" : `reliability: ${failed} failures against the targets`);
  process.exit(failed === 0 ? 0 : 1);
}

await main();
