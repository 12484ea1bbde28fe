// The instance under test: a database of its own (a temp PGlite folder, or a PostgreSQL database created for the run
// and dropped after it) and the production server (scripts/serve.mjs, as `npm start` runs it) in a child process,
// so the bench can stop it cleanly, kill it with SIGKILL and start it again on the same data.
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { createDb, type Database } from "@/lib/db/client";

export type Backend = "pglite" | "postgres";

export interface Instance {
  backend: Backend;
  /** pglite:<dir> or the postgresql:// URL of the run's own database. */
  url: string;
  env: Record<string, string>;
  base: string;
  root: string;
  child: ChildProcess | null;
  /** Server log lines (stdout and stderr), kept for the report and for leak checks. */
  log: string[];
}

export const AUTH_SECRET = randomBytes(32).toString("base64url");

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

async function withAdmin<T>(adminUrl: string, fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** A fresh, migrated database for the run. */
export async function createInstance(backend: Backend, root: string, adminUrl: string): Promise<Instance> {
  let url: string;
  if (backend === "pglite") {
    url = `pglite:${fs.mkdtempSync(path.join(os.tmpdir(), "lw-reliability-"))}`;
  } else {
    const name = `lw_reliability_${randomBytes(4).toString("hex")}`;
    await withAdmin(adminUrl, (c) => c.query(`CREATE DATABASE ${name}`));
    const u = new URL(adminUrl);
    u.pathname = `/${name}`;
    url = u.toString();
  }
  const database = await createDb({ url });
  await database.close();
  const port = await freePort();
  const env: Record<string, string> = {
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    HOST: "127.0.0.1",
    PORT: String(port),
    AUTH_SECRET,
    LAYERWISE_SEED_ON_EMPTY: "false",
    LAYERWISE_SHUTDOWN_GRACE_SECONDS: "5",
    LAYERWISE_LOOP_FILE: path.join(os.tmpdir(), `lw-reliability-loop-${randomBytes(4).toString("hex")}.jsonl`),
    ...(backend === "pglite" ? { LAYERWISE_DATA_DIR: url.slice("pglite:".length) } : { DATABASE_URL: url }),
  };
  return { backend, url, env, base: `http://127.0.0.1:${port}`, root, child: null, log: [] };
}

/** Opens the run's database from the bench process (PGlite: only while the server is stopped). */
export function openDatabase(instance: Instance): Promise<Database> {
  return createDb({ url: instance.url, migrate: false });
}

export async function startServer(instance: Instance, timeoutMs = 120_000): Promise<void> {
  const childEnv: NodeJS.ProcessEnv = { ...process.env, ...instance.env };
  if (instance.backend === "pglite") delete childEnv["DATABASE_URL"];
  // The event-loop probe (loop-probe.mjs) is loaded into the server process only when the run asks for it.
  const probe = instance.env["LAYERWISE_LOOP_FILE"] ? ["--import", path.join(instance.root, "bench", "lib", "reliability", "loop-probe.mjs")] : [];
  const child = spawn(process.execPath, [...probe, "scripts/serve.mjs"], { cwd: instance.root, env: childEnv, stdio: ["ignore", "pipe", "pipe"] });
  instance.child = child;
  const keep = (chunk: Buffer) => {
    for (const line of chunk.toString("utf8").split("\n")) if (line.trim() !== "") instance.log.push(line);
    if (instance.log.length > 20_000) instance.log.splice(0, instance.log.length - 20_000);
  };
  child.stdout?.on("data", keep);
  child.stderr?.on("data", keep);
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode}:\n${instance.log.slice(-20).join("\n")}`);
    try {
      const res = await fetch(`${instance.base}/api/v1/me`, { signal: AbortSignal.timeout(5000) });
      await res.arrayBuffer();
      if (res.status === 401) return; // up, and the guard answers (the database opened on the first request)
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the server did not come up within ${timeoutMs / 1000} s`);
}

function exited(child: ChildProcess): Promise<void> {
  return child.exitCode !== null || child.signalCode !== null ? Promise.resolve() : new Promise((r) => child.once("exit", () => r()));
}

/** SIGTERM: the server drains, closes the database and exits. */
export async function stopServer(instance: Instance): Promise<void> {
  const child = instance.child;
  if (!child) return;
  child.kill("SIGTERM");
  await Promise.race([exited(child), new Promise((r) => setTimeout(r, 30_000))]);
  if (child.exitCode === null && child.signalCode === null) {
    child.kill("SIGKILL");
    await exited(child);
  }
  instance.child = null;
}

/** SIGKILL: no drain, no close; whatever the database had not made durable is lost. */
export async function killServer(instance: Instance): Promise<void> {
  const child = instance.child;
  if (!child) return;
  child.kill("SIGKILL");
  await exited(child);
  instance.child = null;
}

export async function disposeInstance(instance: Instance, adminUrl: string): Promise<void> {
  await stopServer(instance);
  if (instance.backend === "pglite") {
    fs.rmSync(instance.url.slice("pglite:".length), { recursive: true, force: true });
  } else {
    const name = new URL(instance.url).pathname.slice(1);
    await withAdmin(adminUrl, (c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
  }
}
