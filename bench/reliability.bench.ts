/**
 * Reliability figures against a real production server (never a timed test):
 *   1. the authorization matrix: every route handler and page (read from app/) × anonymous, viewer, member, lead,
 *      another group's lead, revoked/expired tokens and a signed-out session; violations counted;
 *   2. malformed requests (≥ 2,000) over HTTP against the write and search routes: 5xx, broken connections,
 *      stack traces or internal messages in bodies, and partial writes (every table's rows and digest before/after);
 *   3. kill -9 of the server under concurrent writers, several rounds: acknowledged writes missing after restart.
 *
 *   npm run bench:reliability -- --backend pglite|postgres [--parts authz,fuzz,kill] [--fuzz 2400] [--rounds 5]
 *                                [--writers 16] [--admin-url postgresql://postgres@127.0.0.1:5432/postgres]
 *                                [--no-write] [--out file.json]   (a trial run: keep bench/results as it is)
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
import { runMatrix, type MatrixReport } from "./lib/reliability/authz";
import { makePeople, makeRecords } from "./lib/reliability/fixtures";
import { buildCases, runFuzz, type FuzzResult } from "./lib/reliability/fuzz";
import { bearer, ask } from "./lib/reliability/http";
import { killRounds, type KillResult } from "./lib/reliability/kill";
import { enumerateEndpoints } from "./lib/reliability/routes";
import { changedTables, snapshot, type Snapshot } from "./lib/reliability/snapshot";
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
  let fuzz: (FuzzResult & { partialWrites: number; changedTables: string[]; replayed: number; snapshotTables: number }) | null = null;
  let kill: KillResult | null = null;
  try {
    const people = await withDb(instance, (db) => makePeople(db));
    await startServer(instance);
    const recordsA = await makeRecords(instance.base, root, people.lead.token, `Group ${people.marker}`);
    const recordsB = await makeRecords(instance.base, root, people.otherLead.token, "Group B");
    const context = { base: instance.base, root, people, recordsA, recordsB };

    if (parts.has("authz")) {
      const endpoints = enumerateEndpoints(root);
      console.log(`authorization matrix: ${endpoints.length} endpoints...`);
      matrix = await runMatrix(context, endpoints);
      console.log(`  ${matrix.cells} cells, ${matrix.violations} violations, ${matrix.unexpected} unexpected, ${matrix.uncovered.length} uncovered`);
      for (const p of matrix.problems.slice(0, 40)) console.log(`  ${p.verdict}: ${p.endpoint} as ${p.principal}: ${p.why ?? ""}`);
    }

    if (parts.has("fuzz")) {
      const cases = await buildCases(context, Number(args.fuzz));
      console.log(`malformed requests: ${cases.length}...`);
      const snap = (): Promise<Snapshot> => withDb(instance, (db) => snapshot(db));
      await jobsIdle(instance, people.lead.token);
      const before = await snap();
      const result = await runFuzz(context, cases);
      await jobsIdle(instance, people.lead.token);
      let after = await snap();
      let changed = changedTables(before, after);
      let replayed = 0;
      if (result.acceptedWrites > 0) {
        // Some generated inputs were valid after all and were written. Replay only the refused writes between two
        // fresh snapshots (again, if some of them are accepted now, e.g. a stale version that has become current):
        // anything a refused write leaves behind is a partial write.
        // A 429 (per-user limit on heavy work) refused the request for its timing, not its input: not replayed.
        let refusedWrites = cases.filter((x, i) => x.write && (result.statuses[i] ?? 0) >= 400 && result.statuses[i] !== 429);
        for (let pass = 1; pass <= 3; pass++) {
          replayed += refusedWrites.length;
          const again = await runFuzz(context, refusedWrites, 1); // one at a time: no per-user limit comes into play
          result.serverErrors += again.serverErrors;
          result.brokenConnections += again.brokenConnections;
          result.leaks += again.leaks;
          result.problems.push(...again.problems.map((p) => ({ ...p, why: `replay: ${p.why}` })));
          await jobsIdle(instance, people.lead.token);
          const final = await snap();
          changed = changedTables(after, final);
          after = final;
          if (again.acceptedWrites === 0) break;
          changed = changed.map((t) => `${t} (replay accepted ${again.acceptedWrites})`);
          refusedWrites = refusedWrites.filter((_, i) => !((again.statuses[i] ?? 0) >= 200 && (again.statuses[i] ?? 0) < 300));
        }
      }
      fuzz = { ...result, partialWrites: changed.length, changedTables: changed, replayed, snapshotTables: Object.keys(after).length };
      console.log(`  ${result.requests} requests: ${result.serverErrors} 5xx, ${result.brokenConnections} broken connections, ${result.leaks} leaks, ${changed.length} tables changed by refused writes (${result.acceptedWrites} accepted writes${replayed ? `, ${replayed} refused writes replayed` : ""}); slowest ${(result.slowestMs / 1000).toFixed(1)} s (${result.slowest})`);
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
    matrix, fuzz, kill,
  };
  if (args.out) fs.writeFileSync(args.out, `${JSON.stringify(report, null, 2)}\n`);
  if (!args["no-write"]) {
    const dir = path.join(root, "bench", "results");
    fs.mkdirSync(dir, { recursive: true });
    fs.writeFileSync(path.join(dir, `reliability-${backend}.json`), `${JSON.stringify(report, null, 2)}\n`);
    writeSummary(dir);
  }
  const failed = (matrix ? matrix.violations + matrix.uncovered.length : 0) + (fuzz ? fuzz.serverErrors + fuzz.brokenConnections + fuzz.leaks + fuzz.partialWrites : 0) + (kill?.lost ?? 0);
  console.log(failed === 0 ? "reliability: all targets met (0 / 0 / 0)" : `reliability: ${failed} failures against the targets`);
  process.exit(failed === 0 ? 0 : 1);
}

await main();
