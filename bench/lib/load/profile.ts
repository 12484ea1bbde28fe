/**
 * Where a request's time goes, per route: the route mix sent one request at a time to an instance started with the
 * probe (bench/lib/load/probe.mjs), so each request's server CPU time and its SQL statement count are its own; with a
 * V8 CPU profile of the same run, each request's samples are split by what ran (render, framework, session, ORM,
 * database engine, app code, garbage collection).
 *
 * Statement counts do not depend on the machine or on other people's load; CPU and wall times do (the machine is
 * shared), so they are medians over many requests and best compared within one run.
 */
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { median, percentile } from "../stats";
import { type Step } from "./client";

export interface ProbeLine {
  method: string; path: string; status: number; ms: number; cpuMs: number | null; queries: number; transactions: number; start: number; end: number;
  /** With --sql: the start of every statement. */
  sql?: string[];
}

export function readProbe(file: string): ProbeLine[] {
  let text = "";
  try { text = readFileSync(file, "utf8"); } catch { return []; }
  return text.split("\n").filter((l) => l.trim()).map((l) => JSON.parse(l) as ProbeLine);
}

export interface RouteProfile {
  requests: number;
  statuses: Record<string, number>;
  wallMsP50: number;
  cpuMsP50: number | null;
  cpuMsMean: number | null;
  queriesP50: number;
  queriesMax: number;
  transactionsP50: number;
  /** With --sql: the statements of the route's first request, in order. */
  statements?: string[];
  /** Share of the route's sampled CPU by kind of code (from --cpu-prof), percent. */
  cpuByKind?: Record<string, number>;
}

/**
 * Waits (at most `maxSeconds`) until the group has no background job waiting or running, so that work queued by the
 * seed or an earlier run does not land in the profiled requests' time.
 */
export async function waitForIdleJobs(base: URL, cookie: string, maxSeconds = 300): Promise<boolean> {
  const end = Date.now() + maxSeconds * 1000;
  while (Date.now() < end) {
    const res = await fetch(new URL("/api/v1/jobs", base), { headers: { cookie } });
    const status = res.ok ? ((await res.json()) as { active?: unknown[] }) : null;
    if (status && (status.active?.length ?? 0) === 0) return true;
    await new Promise((r) => setTimeout(r, 2000));
  }
  return false;
}

/** Sends `perRoute` requests of every step, one at a time, and answers the probe lines of each route. */
export async function sequentialProfile(steps: Step[], cookies: string[], perRoute: number, probeFile: string): Promise<Map<string, ProbeLine[]>> {
  await new Promise((r) => setTimeout(r, 3000)); // let start-up work settle
  const before = readProbe(probeFile).length;
  const order: string[] = [];
  // Route by route, reads first: a write queues background work (re-analysis, inference) that would otherwise run
  // inside the next reads' time windows.
  const ordered = [...steps].sort((a, b) => Number(a.write ?? false) - Number(b.write ?? false));
  for (const step of ordered) {
    for (let i = 0; i < perRoute; i++) {
      const res = await step.run(cookies[i % cookies.length] ?? "");
      await res.arrayBuffer();
      order.push(step.route);
    }
  }
  await new Promise((r) => setTimeout(r, 500)); // the probe writes its line when the response closes
  const lines = readProbe(probeFile).slice(before);
  if (lines.length !== order.length) throw new Error(`the probe saw ${lines.length} requests, ${order.length} were sent`);
  const byRoute = new Map<string, ProbeLine[]>();
  order.forEach((route, i) => byRoute.set(route, [...(byRoute.get(route) ?? []), lines[i]!]));
  return byRoute;
}

export function summarizeProfile(lines: ProbeLine[]): RouteProfile {
  const statuses: Record<string, number> = {};
  for (const l of lines) statuses[String(l.status)] = (statuses[String(l.status)] ?? 0) + 1;
  const cpu = lines.flatMap((l) => (l.cpuMs === null ? [] : [l.cpuMs]));
  return {
    requests: lines.length, statuses,
    wallMsP50: round1(median(lines.map((l) => l.ms))),
    cpuMsP50: cpu.length ? round1(median(cpu)) : null,
    cpuMsMean: cpu.length ? round1(cpu.reduce((s, x) => s + x, 0) / cpu.length) : null,
    queriesP50: median(lines.map((l) => l.queries)),
    queriesMax: Math.max(...lines.map((l) => l.queries)),
    transactionsP50: percentile(lines.map((l) => l.transactions), 50),
    ...(lines[0]?.sql ? { statements: lines[0].sql } : {}),
  };
}

const round1 = (x: number) => Math.round(x * 10) / 10;

interface CpuProfile {
  nodes: { id: number; callFrame: { functionName: string; url: string }; children?: number[] }[];
  startTime: number;
  samples: number[];
  timeDeltas: number[];
}

/** The kind of code a profile node's own time is spent in, by where the function comes from. */
export function kindOf(url: string, fn: string): string {
  if (fn === "(garbage collector)") return "garbage collection";
  if (fn === "(program)" || fn === "(idle)" || fn === "(root)") return "runtime (program)";
  // PGlite is the one WebAssembly module on the routes profiled (RDKit's serves structure searches only).
  if (/@electric-sql\/pglite/.test(url) || url.startsWith("wasm://")) return "database engine (PGlite, in process)";
  if (/node_modules\/(pg|pg-protocol|pg-pool|pg-types|@prisma\/adapter-pg)\//.test(url)) return "PostgreSQL driver";
  if (/@prisma\/client|generated\/prisma|pglite-prisma-adapter|driver-adapter-utils/.test(url)) return "ORM (Prisma)";
  if (/next-auth|jose|openid-client|bcrypt/.test(url)) return "session and sign-in";
  // Next's app-page runtime carries React's server renderer (RSC payload and HTML).
  if (/react-dom|react-server-dom|compiled\/react|app-page(-turbo)?\.runtime|\/react\//.test(url)) return "render (React, Next's page runtime)";
  if (/node_modules\/next\//.test(url)) return "Next.js framework";
  if (/\.next\/server/.test(url)) return "app code (bundled: pages, lib, components)";
  if (url.startsWith("node:") || url === "" ) return "Node.js core and native";
  return "other libraries";
}

/**
 * Splits the samples of the CPU profile(s) in `dir` between the requests of `byRoute` (a sample belongs to the
 * request whose [start, end] holds its time stamp; requests were sequential) and answers, per route, the percentage
 * of its samples in each kind of code.
 */
export function cpuByKind(dir: string, byRoute: Map<string, ProbeLine[]>): Map<string, Record<string, number>> {
  const windows = [...byRoute].flatMap(([route, lines]) => lines.map((l) => ({ route, start: l.start, end: l.end })));
  windows.sort((a, b) => a.start - b.start);
  const counts = new Map<string, Map<string, number>>();
  for (const f of readdirSync(dir).filter((n) => n.endsWith(".cpuprofile"))) {
    const profile = JSON.parse(readFileSync(path.join(dir, f), "utf8")) as CpuProfile;
    const kinds = new Map(profile.nodes.map((n) => [n.id, kindOf(n.callFrame.url, n.callFrame.functionName)]));
    let t = profile.startTime;
    let w = 0;
    profile.samples.forEach((id, i) => {
      t += profile.timeDeltas[i] ?? 0;
      while (w < windows.length && windows[w]!.end < t) w++;
      const win = windows[w];
      if (!win || t < win.start) return;
      const kind = kinds.get(id) ?? "other libraries";
      const m = counts.get(win.route) ?? new Map<string, number>();
      m.set(kind, (m.get(kind) ?? 0) + 1);
      counts.set(win.route, m);
    });
  }
  return new Map([...counts].map(([route, m]) => {
    const total = [...m.values()].reduce((s, x) => s + x, 0);
    const shares = [...m].sort((a, b) => b[1] - a[1]).map(([k, v]) => [k, Math.round((1000 * v) / total) / 10] as const);
    return [route, Object.fromEntries(shares)];
  }));
}
