/**
 * Latency as a chemist sees it (never a timed test): the production server started on a fresh copy of the bench
 * database (10k compounds, bench/latency-prepare.ts) and driven in Chromium. Each figure is the time from the user's
 * action to the content being on screen:
 *
 *   cold first visit   server just started (port open), a signed-in user opens /workups → the list's heading
 *   warm navigation    nav link clicked → the next page's heading (Workups ↔ Compounds)
 *   search             "Search" clicked → first hit shown (similarity, substructure, text; 10k compounds)
 *   save               "Save changes" clicked → the record's page with the new title
 *   report outcome     "Update the outcome" clicked → "Saved" shown
 *
 * Medians over --runs server starts (each run repeats the warm actions --repeat times); the load average at start and
 * end is printed, because on a shared machine every figure is inflated by other work.
 *
 *   npm run build (or scripts/ensure-build.mjs), then: npx tsx bench/latency.bench.ts [--runs 3] [--repeat 5] [--json]
 */
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import { createServer, connect } from "node:net";
import { loadavg } from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import { chromium, type Page } from "playwright-core";
import { median, nowMs } from "./lib/stats";

const { values: args } = parseArgs({
  options: { runs: { type: "string", default: "3" }, repeat: { type: "string", default: "5" }, json: { type: "boolean", default: false } },
});
const RUNS = Number(args.runs);
const REPEAT = Number(args.repeat);
const ROOT = path.resolve(import.meta.dirname, "..");
const TEMPLATE = path.join(ROOT, ".tmp", "latency-bench-db");
const PERSON = { email: "ilse.vandermeer@example.org", password: "latency-bench-Quartz-41" };
const SECRET = "latency-bench-secret-not-for-production-0123456789";
const log = (m: string) => process.stderr.write(`${m}\n`);

/** Queries from the shared benchmark set: a drug-like SMILES, a fragment, and words of the compounds' names. */
const SEARCHES = [
  { name: "similarity", path: "/search?mode=similarity", query: "COc1ccc(NC(C)=O)cc1CC(=O)Nc1ccc2sc(Br)cc2c1" },
  { name: "substructure", path: "/search?mode=substructure", query: "c1ccc2sccc2c1" },
  { name: "text", path: "/search?mode=text", query: "C00001" },
] as const;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.listen(0, "127.0.0.1", () => {
      const a = s.address();
      s.close(() => (typeof a === "object" && a ? resolve(a.port) : reject(new Error("no port"))));
    });
  });
}

function portOpen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const c = connect(port, "127.0.0.1");
    c.once("connect", () => { c.destroy(); resolve(true); });
    c.once("error", () => resolve(false));
  });
}

async function startServer(dataDir: string, port: number): Promise<{ child: ChildProcess; readyMs: number }> {
  const t0 = nowMs();
  const child = spawn("npx", ["next", "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: ROOT, stdio: ["ignore", "ignore", "inherit"], detached: false,
    env: { ...process.env, LAYERWISE_DATA_DIR: dataDir, AUTH_SECRET: SECRET, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
  });
  while (!(await portOpen(port))) {
    if (child.exitCode !== null) throw new Error("the server exited before it listened");
    await new Promise((r) => setTimeout(r, 20));
  }
  return { child, readyMs: nowMs() - t0 };
}

async function stopServer(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return;
  const done = new Promise((r) => child.once("exit", r));
  child.kill("SIGTERM");
  await done;
}

/** Time from `act` to `until` resolving. */
async function timed(act: () => Promise<unknown>, until: () => Promise<unknown>): Promise<number> {
  const t0 = nowMs();
  await act();
  await until();
  return nowMs() - t0;
}

async function signIn(page: Page, base: string): Promise<void> {
  await page.goto(`${base}/sign-in`);
  await page.getByLabel("Email").fill(PERSON.email);
  await page.getByLabel("Password").fill(PERSON.password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await page.getByRole("heading", { name: "Workups", level: 1 }).waitFor();
}

if (!fs.existsSync(TEMPLATE)) {
  log("preparing the bench database (10k compounds)…");
  const prep = spawn("npx", ["tsx", "bench/latency-prepare.ts", TEMPLATE], { cwd: ROOT, stdio: "inherit" });
  const code = await new Promise<number | null>((r) => prep.once("exit", r));
  if (code !== 0) throw new Error("could not prepare the bench database");
}

const samples: Record<string, number[]> = {};
const add = (name: string, ms: number) => {
  (samples[name] ??= []).push(ms);
  log(`  ${name}: ${Math.round(ms)} ms`);
};
// A slow machine is measured, not failed: each wait may take up to two minutes.
const WAIT = { timeout: 120_000 };
const loadAtStart = loadavg();
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--headless", "--no-sandbox", "--disable-gpu"] });
let storage: Awaited<ReturnType<Awaited<ReturnType<typeof browser.newContext>>["storageState"]>> | undefined;

for (let run = 0; run < RUNS; run++) {
  const dataDir = path.join(ROOT, ".tmp", `latency-bench-run-${run}`);
  fs.rmSync(dataDir, { recursive: true, force: true });
  fs.cpSync(TEMPLATE, dataDir, { recursive: true });
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const { child, readyMs } = await startServer(dataDir, port);
  add("server start → port open", readyMs);
  try {
    // The session of the first run's sign-in is reused: the same secret signs it, so the cold visit is a real one.
    const context = await browser.newContext(storage ? { storageState: storage } : {});
    const page = await context.newPage();
    if (storage) {
      add("cold first visit", await timed(() => page.goto(`${base}/workups`, { waitUntil: "commit" }), () => page.getByRole("heading", { name: "Workups", level: 1 }).waitFor(WAIT)));
    } else {
      await signIn(page, base);
      storage = await context.storageState();
    }
    for (let i = 0; i < REPEAT; i++) {
      const nav = page.getByRole("navigation", { name: "Main" });
      add("warm navigation", await timed(() => nav.getByRole("link", { name: "Compounds" }).click({ noWaitAfter: true }), () => page.getByRole("heading", { name: "Compounds", level: 1 }).waitFor(WAIT)));
      add("warm navigation", await timed(() => nav.getByRole("link", { name: "Workups" }).click({ noWaitAfter: true }), () => page.getByRole("heading", { name: "Workups", level: 1 }).waitFor(WAIT)));
    }
    for (const s of SEARCHES) {
      // The first search of a kind after a start also builds that index in memory: reported on its own.
      for (let i = 0; i <= REPEAT; i++) {
        await page.goto(`${base}${s.path}`);
        await page.locator("#search-query").fill(s.query);
        const ms = await timed(() => page.getByRole("button", { name: "Search", exact: true }).click({ noWaitAfter: true }), () => page.getByTestId("search-hit").first().waitFor(WAIT));
        add(i === 0 ? `search: ${s.name} (first)` : `search: ${s.name}`, ms);
      }
    }
    await page.goto(`${base}/workups`);
    const first = page.getByRole("link", { name: /^Nitro ester washes 1/ }).first();
    await first.click();
    await page.waitForURL(/\/workups\/(?!new$)[a-z0-9]+$/);
    const detail = page.url();
    for (let i = 0; i < REPEAT; i++) {
      await page.goto(`${detail}/edit`);
      const title = `Nitro ester washes 1 (run ${run}.${i})`;
      await page.getByLabel("Title").fill(title);
      add("save", await timed(() => page.getByRole("button", { name: "Save changes" }).click({ noWaitAfter: true }), () => page.getByRole("heading", { name: title, level: 1 }).waitFor(WAIT)));
    }
    for (let i = 0; i < REPEAT; i++) {
      await page.goto(detail);
      const summary = page.locator("details summary").filter({ hasText: /the outcome$/ });
      if ((await summary.locator("..").getAttribute("open")) === null) await summary.click();
      await page.getByRole("textbox", { name: "Isolated mass" }).fill(String(800 + i));
      await page.getByLabel("Purity (mass %)").fill("97");
      add("report outcome", await timed(() => page.getByRole("button", { name: /(Report|Update) the outcome/ }).click({ noWaitAfter: true }), () => page.getByText(/^Saved(: recovery|\.)/).waitFor(WAIT)));
    }
    await context.close();
  } finally {
    await stopServer(child);
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
  log(`run ${run + 1} of ${RUNS} done`);
}
await browser.close();

const loadAtEnd = loadavg();
const rows = Object.entries(samples).map(([name, ms]) => ({ name, n: ms.length, medianMs: Math.round(median(ms)), minMs: Math.round(Math.min(...ms)), maxMs: Math.round(Math.max(...ms)) }));
if (args.json) console.log(JSON.stringify({ runs: RUNS, repeat: REPEAT, loadAtStart, loadAtEnd, rows }));
else {
  console.log(`load average at start ${loadAtStart.map((l) => l.toFixed(2)).join(" ")}, at end ${loadAtEnd.map((l) => l.toFixed(2)).join(" ")}`);
  for (const r of rows) console.log(`${r.name.padEnd(26)} n=${String(r.n).padStart(3)}  median ${String(r.medianMs).padStart(6)} ms  (min ${r.minMs}, max ${r.maxMs})`);
}
