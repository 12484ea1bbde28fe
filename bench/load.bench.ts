/**
 * Load benchmark against a running instance (never a timed test): simulated signed-in members with think time run
 * the route mix of a group's day (workup list, workup pages, compound text search, the review page, API reads and
 * about 10 % writes) and the figures per route are printed: requests, throughput, p50/p95/p99 latency, errors by
 * status, server RSS at start and end (with --pid), and the load average.
 *
 *   npm start  (or two instances behind a load balancer), then:
 *   npm run bench:load -- --url http://127.0.0.1:3000 --users 50 --seconds 120 [--pid <server pid>] [--json]
 *
 * Users sign in through the real sign-in endpoint as the demo group's people (password from LAYERWISE_BENCH_PASSWORD,
 * default the demo's) and share those sessions. Only addresses on this machine are accepted as targets, and every
 * loop stops when the time is up.
 */
import { readFileSync } from "node:fs";
import { loadavg } from "node:os";
import { parseArgs } from "node:util";
import { percentile } from "./lib/stats";

const { values: args } = parseArgs({
  options: {
    url: { type: "string", default: "http://127.0.0.1:3000" },
    users: { type: "string", default: "50" },
    seconds: { type: "string", default: "60" },
    pid: { type: "string" },
    json: { type: "boolean", default: false },
  },
});

const base = new URL(args.url);
if (!["127.0.0.1", "localhost", "[::1]"].includes(base.hostname) && !base.hostname.startsWith("127.")) {
  throw new Error(`refusing to send load to ${base.hostname}: only addresses on this machine are benchmark targets`);
}
const USERS = Number(args.users);
const SECONDS = Number(args.seconds);
const PASSWORD = process.env["LAYERWISE_BENCH_PASSWORD"] ?? "layerwise-demo";
const PEOPLE = ["maren.holloway@example.org", "tomas.ferreira@example.org", "aiko.brandt@example.org", "jonah.mercer@example.org"];
const SEARCH_WORDS = ["amide", "ester", "acid", "amine", "wash", "bicarbonate", "benz", "extraction"];

function rssMb(pid: string | undefined): number | null {
  if (!pid) return null;
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
  return m ? Number(m[1]) / 1024 : null;
}

function cookiesOf(res: Response, jar: Map<string, string>): void {
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(";");
    const eq = pair?.indexOf("=") ?? -1;
    if (pair && eq > 0) jar.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
  }
}

const cookieHeader = (jar: Map<string, string>) => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");

async function signIn(email: string): Promise<string> {
  const jar = new Map<string, string>();
  const csrf = await fetch(new URL("/api/auth/csrf", base));
  cookiesOf(csrf, jar);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(new URL("/api/auth/callback/credentials", base), {
    method: "POST", redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookieHeader(jar), origin: base.origin },
    body: new URLSearchParams({ csrfToken, email, password: PASSWORD, json: "true" }),
  });
  cookiesOf(res, jar);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`sign-in as ${email} failed (${res.status})`);
  return cookieHeader(jar);
}

interface Sample { route: string; ms: number; status: number }

type Step = { route: string; run: (cookie: string) => Promise<Response> };

function mix(ids: string[]): { weight: number; step: Step }[] {
  const pick = <T>(xs: T[]) => xs[Math.floor(Math.random() * xs.length)] as T;
  const get = (path: string) => (cookie: string) => fetch(new URL(path, base), { headers: { cookie } });
  return [
    { weight: 20, step: { route: "page /workups", run: (c) => get("/workups")(c) } },
    { weight: 20, step: { route: "page /workups/{id}", run: (c) => get(`/workups/${pick(ids)}`)(c) } },
    { weight: 10, step: { route: "page /review", run: (c) => get("/review")(c) } },
    { weight: 15, step: { route: "api text search", run: (c) => get(`/api/v1/compounds?mode=text&query=${pick(SEARCH_WORDS)}`)(c) } },
    { weight: 15, step: { route: "api GET /workups", run: (c) => get("/api/v1/workups?limit=20")(c) } },
    { weight: 10, step: { route: "api GET /workups/{id}", run: (c) => get(`/api/v1/workups/${pick(ids)}`)(c) } },
    { weight: 10, step: {
      route: "api POST /workups/{id}/outcome",
      run: (cookie) => fetch(new URL(`/api/v1/workups/${pick(ids)}/outcome`, base), {
        method: "POST",
        headers: { cookie, "content-type": "application/json", origin: base.origin, "sec-fetch-site": "same-origin" },
        body: JSON.stringify({ isolatedMassMg: 400 + Math.round(Math.random() * 400), purityPct: 95, purityMethod: "qnmr", notes: "load benchmark" }),
      }),
    } },
  ];
}

async function main(): Promise<void> {
  const sessions = await Promise.all(PEOPLE.map(signIn));
  const list = await fetch(new URL("/api/v1/workups?limit=100", base), { headers: { cookie: sessions[0] ?? "" } });
  const ids = ((await list.json()) as { rows: { id: string }[] }).rows.map((r) => r.id);
  if (ids.length === 0) throw new Error("no workups to read: start the instance with its demo data");
  const steps = mix(ids);
  const total = steps.reduce((s, x) => s + x.weight, 0);
  const choose = () => {
    let r = Math.random() * total;
    for (const s of steps) if ((r -= s.weight) < 0) return s.step;
    return steps[0]!.step;
  };
  const samples: Sample[] = [];
  const rssStart = rssMb(args.pid);
  const load0 = loadavg();
  const t0 = Date.now();
  const end = t0 + SECONDS * 1000;
  await Promise.all(Array.from({ length: USERS }, async (_, u) => {
    const cookie = sessions[u % sessions.length] ?? "";
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
        status = -1;
      }
      samples.push({ route: step.route, ms: performance.now() - s0, status });
      await new Promise((r) => setTimeout(r, 500 + Math.random() * 1000));
    }
  }));
  const elapsed = (Date.now() - t0) / 1000;
  const byRoute = new Map<string, Sample[]>();
  for (const s of samples) byRoute.set(s.route, [...(byRoute.get(s.route) ?? []), s]);
  const summarize = (xs: Sample[]) => {
    const ms = xs.map((x) => x.ms);
    const errors: Record<string, number> = {};
    for (const x of xs) if (x.status < 200 || x.status >= 400) errors[String(x.status)] = (errors[String(x.status)] ?? 0) + 1;
    return { requests: xs.length, perSecond: xs.length / elapsed, p50: percentile(ms, 50), p95: percentile(ms, 95), p99: percentile(ms, 99), errors };
  };
  const result = {
    url: base.origin, users: USERS, seconds: elapsed, overall: summarize(samples),
    routes: Object.fromEntries([...byRoute].map(([k, v]) => [k, summarize(v)])),
    rssMb: { start: rssStart, end: rssMb(args.pid) }, loadavg: { before: load0, after: loadavg() },
  };
  if (args.json) { console.log(JSON.stringify(result)); return; }
  const row = (name: string, s: ReturnType<typeof summarize>) =>
    `${name.padEnd(32)} ${String(s.requests).padStart(6)} ${s.perSecond.toFixed(1).padStart(7)} ${s.p50.toFixed(0).padStart(6)} ${s.p95.toFixed(0).padStart(6)} ${s.p99.toFixed(0).padStart(6)}  ${JSON.stringify(s.errors)}`;
  console.log(`${USERS} users for ${elapsed.toFixed(0)} s against ${base.origin}; load average ${load0.map((x) => x.toFixed(1)).join(" ")} → ${result.loadavg.after.map((x) => x.toFixed(1)).join(" ")}`);
  console.log(`${"route".padEnd(32)} ${"n".padStart(6)} ${"req/s".padStart(7)} ${"p50".padStart(6)} ${"p95".padStart(6)} ${"p99".padStart(6)}  errors (ms)`);
  for (const [k, v] of Object.entries(result.routes)) console.log(row(k, v));
  console.log(row("all", result.overall));
  if (rssStart !== null) console.log(`server RSS ${rssStart.toFixed(0)} → ${result.rssMb.end?.toFixed(0)} MB`);
}

await main();
