/**
 * Starts and stops Layerwise instances for the load benchmark: `node scripts/start.mjs` (build if stale, migrate,
 * seed the demo group into an empty database, serve on 127.0.0.1:PORT) in an app directory that has a real
 * node_modules (next build does not run in a worktree with a linked one). Optionally with the request probe
 * (bench/lib/load/probe.mjs) and V8's CPU profiler.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { createWriteStream, mkdirSync, readFileSync } from "node:fs";
import path from "node:path";
import pg from "pg";

export type Backend = "pglite" | "postgres";

export interface InstanceOptions {
  appDir: string;
  backend: Backend;
  port: number;
  /** PostgreSQL: the database URL; PGlite: ignored. */
  databaseUrl?: string;
  /** PGlite data dir (default <appDir>/data/load-bench). Also where the instance's log goes. */
  dataDir: string;
  /** Shared by every instance: a session signed by one must open on the others. */
  authSecret: string;
  probeFile?: string;
  /** Requests arrive one at a time, so the probe may report per-request CPU. */
  sequential?: boolean;
  cpuProfDir?: string;
  /** The probe also records the start of every SQL statement. */
  sql?: boolean;
}

export interface Instance { url: URL; pid: number; stop: () => Promise<void>; log: string }

const probe = path.resolve(import.meta.dirname, "probe.mjs");

/** Creates the benchmark's PostgreSQL database when missing (`fresh`: drops it first). */
export async function ensurePostgresDatabase(url: string, fresh: boolean): Promise<void> {
  const target = new URL(url);
  const name = target.pathname.slice(1);
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`database name "${name}": use lower-case letters, digits and _`);
  const admin = new URL(url);
  admin.pathname = "/postgres";
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    if (fresh) await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    const found = await client.query("SELECT 1 FROM pg_database WHERE datname = $1", [name]);
    if (found.rowCount === 0) await client.query(`CREATE DATABASE ${name}`);
  } finally {
    await client.end();
  }
}

async function waitReady(url: URL, child: ChildProcess, log: string, timeoutMs: number): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    if (child.exitCode !== null) throw new Error(`the instance exited (${child.exitCode}); see ${log}`);
    try {
      const res = await fetch(new URL("/api/auth/csrf", url));
      if (res.ok) return;
    } catch { /* not listening yet */ }
    await new Promise((r) => setTimeout(r, 1000));
  }
  throw new Error(`the instance did not answer within ${timeoutMs / 1000} s; see ${log}`);
}

export async function startInstance(o: InstanceOptions): Promise<Instance> {
  mkdirSync(o.dataDir, { recursive: true });
  const log = path.join(o.dataDir, `server-${o.port}.log`);
  const out = createWriteStream(log);
  const nodeArgs = [
    ...(o.probeFile ? ["--import", probe] : []),
    ...(o.cpuProfDir ? ["--cpu-prof", `--cpu-prof-dir=${o.cpuProfDir}`] : []),
    "scripts/start.mjs",
  ];
  const child = spawn(process.execPath, nodeArgs, {
    cwd: o.appDir,
    stdio: ["ignore", "pipe", "pipe"],
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      HOST: "127.0.0.1",
      PORT: String(o.port),
      AUTH_SECRET: o.authSecret,
      LAYERWISE_DATA_DIR: o.dataDir,
      LAYERWISE_SEED_ON_EMPTY: "true",
      ...(o.backend === "postgres" ? { DATABASE_URL: o.databaseUrl } : { DATABASE_URL: "" }),
      ...(o.probeFile ? { LAYERWISE_PROBE_FILE: o.probeFile, LAYERWISE_PROBE_SEQUENTIAL: o.sequential ? "1" : "0", LAYERWISE_PROBE_SQL: o.sql ? "1" : "0" } : {}),
    },
  });
  child.stdout?.pipe(out);
  child.stderr?.pipe(out);
  const url = new URL(`http://127.0.0.1:${o.port}`);
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  try {
    await waitReady(url, child, log, 15 * 60_000);
  } catch (e) {
    child.kill("SIGTERM");
    throw e;
  }
  return {
    url, pid: child.pid ?? 0, log,
    stop: async () => {
      if (child.exitCode === null) child.kill("SIGTERM");
      await exited;
    },
  };
}

/** Resident set size of a process on this machine, in MB (null when unknown). */
export function rssMb(pid: number | undefined): number | null {
  if (!pid) return null;
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
    return m ? Number(m[1]) / 1024 : null;
  } catch {
    return null;
  }
}
