/**
 * Load benchmark (never a timed test): simulated signed-in members with 0.5–1.5 s think time run the route mix of a
 * group's day (workup list and pages, the review page, compound text search, API reads, about 10 % writes), and the
 * figures are printed per route: requests, throughput, p50/p95/p99 latency, errors by status, server RSS at start
 * and end, load average before and after.
 *
 * Against a running instance (either backend; only addresses on this machine):
 *   npm run bench:load -- --url http://127.0.0.1:3000 --users 50 --seconds 120 [--pid <server pid>]
 * Starting its own instance(s) from --app-dir (a checkout with a real node_modules; it builds when stale):
 *   npm run bench:load -- --start pglite   --users 50
 *   npm run bench:load -- --start postgres --users 50          (DATABASE_URL, default postgresql://postgres@127.0.0.1:5432/layerwise_load)
 *   npm run bench:load -- --start postgres --instances 2 --users 200   (two instances behind a round-robin proxy)
 * Where the time goes, per route (requests one at a time; SQL statements, server CPU, and with --cpu-prof the kind of code;
 * --sql keeps each route's statements):
 *   npm run bench:load -- --start pglite --profile 30 --cpu-prof --sql
 * --fresh starts from an empty database (the demo is seeded again). The profile waits for background jobs to finish first.
 * --out <file.json> keeps the figures (bench/results/). Users sign in as the demo group's people (password from
 * LAYERWISE_BENCH_PASSWORD, default the demo's; --people a@x,b@y for others) and share those sessions.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import { randomBytes } from "node:crypto";
import { percentile } from "./lib/stats";
import { assertLocal, chooser, DEMO_PEOPLE, routeMix, signIn, workupIds, type Step } from "./lib/load/client";
import { ensurePostgresDatabase, rssMb, startInstance, type Backend, type Instance } from "./lib/load/instance";
import { startProxy, type RoundRobinProxy } from "./lib/load/proxy";
import { cpuByKind, waitForIdleJobs, sequentialProfile, summarizeProfile, type RouteProfile } from "./lib/load/profile";

const { values: args } = parseArgs({
  options: {
    url: { type: "string" },
    start: { type: "string" },
    instances: { type: "string", default: "1" },
    "app-dir": { type: "string", default: process.cwd() },
    "data-dir": { type: "string" },
    "database-url": { type: "string" },
    fresh: { type: "boolean", default: false },
    port: { type: "string", default: "3100" },
    users: { type: "string", default: "50" },
    seconds: { type: "string", default: "60" },
    pid: { type: "string" },
    people: { type: "string" },
    profile: { type: "string" },
    "cpu-prof": { type: "boolean", default: false },
    sql: { type: "boolean", default: false },
    out: { type: "string" },
    json: { type: "boolean", default: false },
  },
});

interface Sample { route: string; ms: number; status: number }

function summarize(xs: Sample[], elapsed: number) {
  const ms = xs.map((x) => x.ms);
  const errors: Record<string, number> = {};
  for (const x of xs) if (x.status < 200 || x.status >= 400) errors[String(x.status)] = (errors[String(x.status)] ?? 0) + 1;
  const r = (x: number) => Math.round(x);
  return { requests: xs.length, perSecond: Math.round((10 * xs.length) / elapsed) / 10, p50: r(percentile(ms, 50)), p95: r(percentile(ms, 95)), p99: r(percentile(ms, 99)), errors };
}

/** Simulated members: each picks a route of the mix, waits for the whole answer, thinks 0.5–1.5 s, until time is up. */
async function runLoad(steps: Step[], cookies: string[], users: number, seconds: number) {
  const choose = chooser(steps);
  const samples: Sample[] = [];
  const t0 = Date.now();
  const end = t0 + seconds * 1000;
  await Promise.all(Array.from({ length: users }, async (_, u) => {
    const cookie = cookies[u % cookies.length] ?? "";
    await new Promise((r) => setTimeout(r, Math.random() * 1500));
    while (Date.now() < end) {
      const step = choose();
      const s0 = performance.now();
      let status = 0;
      try {
        const res = await step.run(cookie);
        await res.arrayBuffer();
        status = res.status;
      } catch {
        status = -1; // connection refused or reset
      }
      samples.push({ route: step.route, ms: performance.now() - s0, status });
      await new Promise((r) => setTimeout(r, 500 + Math.random() * 1000));
    }
  }));
  const elapsed = (Date.now() - t0) / 1000;
  const byRoute = new Map<string, Sample[]>();
  for (const s of samples) byRoute.set(s.route, [...(byRoute.get(s.route) ?? []), s]);
  return {
    seconds: Math.round(elapsed), overall: summarize(samples, elapsed),
    routes: Object.fromEntries([...byRoute].sort().map(([k, v]) => [k, summarize(v, elapsed)])),
  };
}

function printLoad(users: number, target: string, r: Awaited<ReturnType<typeof runLoad>>, load: number[][], rss: string): void {
  const row = (name: string, s: ReturnType<typeof summarize>) =>
    `${name.padEnd(32)} ${String(s.requests).padStart(6)} ${s.perSecond.toFixed(1).padStart(7)} ${String(s.p50).padStart(6)} ${String(s.p95).padStart(6)} ${String(s.p99).padStart(6)}  ${JSON.stringify(s.errors)}`;
  console.log(`${users} users for ${r.seconds} s against ${target}; load average ${load.map((l) => l.map((x) => x.toFixed(1)).join(" ")).join(" → ")}`);
  console.log(`${"route".padEnd(32)} ${"n".padStart(6)} ${"req/s".padStart(7)} ${"p50".padStart(6)} ${"p95".padStart(6)} ${"p99".padStart(6)}  errors (ms)`);
  for (const [k, v] of Object.entries(r.routes)) console.log(row(k, v));
  console.log(row("all", r.overall));
  if (rss) console.log(`server RSS ${rss}`);
}

function printProfile(profile: Record<string, RouteProfile>): void {
  console.log(`${"route".padEnd(32)} ${"n".padStart(4)} ${"SQL".padStart(5)} ${"max".padStart(4)} ${"tx".padStart(3)} ${"cpu p50".padStart(8)} ${"cpu mean".padStart(9)} ${"wall p50".padStart(9)}  statuses`);
  for (const [k, p] of Object.entries(profile)) {
    console.log(`${k.padEnd(32)} ${String(p.requests).padStart(4)} ${String(p.queriesP50).padStart(5)} ${String(p.queriesMax).padStart(4)} ${String(p.transactionsP50).padStart(3)} ${String(p.cpuMsP50).padStart(8)} ${String(p.cpuMsMean).padStart(9)} ${String(p.wallMsP50).padStart(9)}  ${JSON.stringify(p.statuses)}`);
    if (p.cpuByKind) console.log(`${"".padEnd(34)}${Object.entries(p.cpuByKind).map(([kind, share]) => `${kind} ${share} %`).join("; ")}`);
  }
}

async function main(): Promise<void> {
  const users = Number(args.users);
  const seconds = Number(args.seconds);
  const password = process.env["LAYERWISE_BENCH_PASSWORD"] ?? "layerwise-demo";
  const people = args.people ? args.people.split(",") : DEMO_PEOPLE;
  const profileN = args.profile ? Number(args.profile) : 0;
  const started: Instance[] = [];
  let proxy: RoundRobinProxy | null = null;
  let base: URL;
  let pids: number[] = args.pid ? [Number(args.pid)] : [];
  let probeFile: string | undefined;
  let cpuProfDir: string | undefined;
  if (args.start !== undefined && args.start !== "pglite" && args.start !== "postgres") throw new Error(`--start pglite or --start postgres, not ${args.start}`);
  const backend: Backend | undefined = args.start;
  const meta: Record<string, unknown> = {};
  try {
    if (backend) {
      const instances = Number(args.instances);
      if (instances > 1 && backend !== "postgres") throw new Error("several instances share one PostgreSQL; an embedded database is one process's");
      const work = mkdtempSync(path.join(tmpdir(), "layerwise-load-"));
      const dataDir = path.resolve(args["data-dir"] ?? path.join(args["app-dir"], "data", "load-bench"));
      const databaseUrl = args["database-url"] ?? process.env["DATABASE_URL"] ?? "postgresql://postgres@127.0.0.1:5432/layerwise_load";
      if (backend === "postgres") await ensurePostgresDatabase(databaseUrl, args.fresh);
      else if (args.fresh) rmSync(dataDir, { recursive: true, force: true });
      probeFile = profileN > 0 ? path.join(work, "probe.jsonl") : undefined;
      cpuProfDir = args["cpu-prof"] ? path.join(work, "cpu") : undefined;
      const authSecret = randomBytes(32).toString("base64url");
      for (let i = 0; i < instances; i++) {
        // One after the other: the first migrates and seeds, the next find the database ready.
        started.push(await startInstance({
          appDir: path.resolve(args["app-dir"]), backend, port: Number(args.port) + 1 + i, databaseUrl, dataDir: instances > 1 ? path.join(dataDir, `i${i}`) : dataDir,
          authSecret, probeFile, sequential: profileN > 0, cpuProfDir, sql: args.sql,
        }));
      }
      pids = started.map((s) => s.pid);
      if (instances > 1) {
        proxy = await startProxy(started.map((s) => s.url), Number(args.port));
        base = proxy.url;
      } else {
        base = started[0]!.url;
      }
      Object.assign(meta, { backend, instances, appDir: path.resolve(args["app-dir"]) });
    } else {
      base = new URL(args.url ?? "http://127.0.0.1:3000");
    }
    assertLocal(base);
    const cookies = await Promise.all(people.map((p) => signIn(base, p, password)));
    const ids = await workupIds(base, cookies[0] ?? "");
    const steps = routeMix(base, ids);
    if (profileN > 0) {
      if (!probeFile) throw new Error("--profile needs --start (the instance runs with the request probe)");
      if (!(await waitForIdleJobs(base, cookies[0] ?? ""))) console.error("background jobs still running after 5 min: they share the profiled CPU");
      const byRoute = await sequentialProfile(steps, cookies, profileN, probeFile);
      for (const s of started) await s.stop();
      started.length = 0;
      const kinds = cpuProfDir ? cpuByKind(cpuProfDir, byRoute) : new Map<string, Record<string, number>>();
      const profile = Object.fromEntries([...byRoute].map(([route, lines]) => [route, { ...summarizeProfile(lines), cpuByKind: kinds.get(route) }]));
      const result = { kind: "profile", ...meta, perRoute: profileN, loadavg: loadavg(), profile, at: new Date().toISOString() };
      if (args.out) writeFileSync(args.out, `${JSON.stringify(result, null, 2)}\n`);
      if (args.json) console.log(JSON.stringify(result)); else printProfile(profile);
      return;
    }
    const rssStart = pids.map((p) => rssMb(p));
    const load0 = loadavg();
    const r = await runLoad(steps, cookies, users, seconds);
    const rssEnd = pids.map((p) => rssMb(p));
    const load1 = loadavg();
    const result = {
      kind: "load", ...meta, url: base.origin, users, ...r,
      rssMb: { start: rssStart.map((x) => (x === null ? null : Math.round(x))), end: rssEnd.map((x) => (x === null ? null : Math.round(x))) },
      loadavg: { before: load0, after: load1 }, at: new Date().toISOString(),
    };
    if (args.out) writeFileSync(args.out, `${JSON.stringify(result, null, 2)}\n`);
    if (args.json) { console.log(JSON.stringify(result)); return; }
    const rss = pids.length ? rssStart.map((s, i) => `${s?.toFixed(0)} → ${rssEnd[i]?.toFixed(0)} MB`).join(", ") : "";
    printLoad(users, base.origin, r, [load0, load1], rss);
  } finally {
    await proxy?.close();
    for (const s of started) await s.stop();
  }
}

await main();
