// SIGTERM to a real `npm start` (node scripts/start.mjs: the production build this suite's web server made, its own
// embedded database in a temp folder, a free port): a request whose body is still arriving when the signal comes is
// answered, the process exits within the grace period, and the database was shut down cleanly, so the next start is
// not a crash recovery. In the browser project because it needs the production build.
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import { createServer } from "node:net";
import os from "node:os";
import path from "node:path";
import { expect, test } from "@playwright/test";

// PostgreSQL's src/include/catalog/pg_control.h: ControlFileData starts with system_identifier (uint64),
// pg_control_version and catalog_version_no (uint32 each), then `DBState state`, where DB_SHUTDOWNED = 1. Anything else
// at start makes PostgreSQL (and so PGlite) run crash recovery.
const DB_SHUTDOWNED = 1;
const controlState = (dataDir: string) => fs.readFileSync(path.join(dataDir, "global", "pg_control")).readInt32LE(16);

/** LAYERWISE_SHUTDOWN_GRACE_SECONDS for the started server; the exit must come within it plus closing time. */
const GRACE_SECONDS = 5;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

function npmStart(dataDir: string, port: number): { child: ChildProcess; listening: Promise<void>; exited: Promise<number | null> } {
  const env = {
    ...process.env, LAYERWISE_DATA_DIR: dataDir, DATABASE_URL: "", PORT: String(port), HOST: "127.0.0.1", NEXTAUTH_URL: `http://127.0.0.1:${port}`,
    AUTH_SECRET: "e2e-only-secret-not-for-production-0123", LAYERWISE_SEED_ON_EMPTY: "false", LAYERWISE_SHUTDOWN_GRACE_SECONDS: String(GRACE_SECONDS),
  };
  const child = spawn(process.execPath, ["scripts/start.mjs"], { env, stdio: ["ignore", "pipe", "pipe"] });
  let out = "";
  const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
  const listening = new Promise<void>((resolve, reject) => {
    const read = (c: Buffer) => {
      out += c.toString();
      if (/listening on http:\/\//.test(out)) resolve();
    };
    child.stdout?.on("data", read);
    child.stderr?.on("data", read);
    void exited.then((code) => reject(new Error(`npm start exited before listening (${code}): ${out}`)));
  });
  return { child, listening, exited };
}

function get(port: number, pathname: string): Promise<number> {
  return new Promise((resolve, reject) => {
    http.get({ host: "127.0.0.1", port, path: pathname, agent: false }, (res) => {
      res.resume();
      res.on("end", () => resolve(res.statusCode ?? 0));
    }).on("error", reject);
  });
}

test("SIGTERM to npm start answers the request in flight, exits within the grace period and leaves a clean database", async () => {
  test.setTimeout(10 * 60_000);
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "lw-npm-start-"));
  try {
    const port = await freePort();
    const first = npmStart(dataDir, port);
    await first.listening;
    expect(await get(port, "/sign-in")).toBe(200);

    // A sign-in whose form body is only half sent when the signal arrives: the server must wait for the rest and answer.
    const form = "email=nobody%40example.org&password=not-the-password&csrfToken=x&json=true";
    const inFlight = new Promise<number>((resolve, reject) => {
      const req = http.request({
        host: "127.0.0.1", port, path: "/api/auth/callback/credentials", method: "POST", agent: false,
        headers: { "content-type": "application/x-www-form-urlencoded", "content-length": Buffer.byteLength(form), origin: `http://127.0.0.1:${port}` },
      }, (res) => {
        res.resume();
        res.on("end", () => resolve(res.statusCode ?? 0));
      });
      req.on("error", reject);
      req.write(form.slice(0, 20));
      setTimeout(() => {
        first.child.kill("SIGTERM");
        setTimeout(() => req.end(form.slice(20)), 500);
      }, 300);
    });
    const signalled = Date.now();
    const status = await inFlight;
    expect(status).toBeGreaterThanOrEqual(200);
    expect(status).toBeLessThan(500);
    expect(await first.exited).toBe(0);
    expect(Date.now() - signalled).toBeLessThan((GRACE_SECONDS + 20) * 1000);
    expect(controlState(dataDir)).toBe(DB_SHUTDOWNED);

    // The next start opens the same folder without recovery and serves; stopped again, it is clean again.
    const second = npmStart(dataDir, port);
    await second.listening;
    expect(await get(port, "/sign-in")).toBe(200);
    second.child.kill("SIGTERM");
    expect(await second.exited).toBe(0);
    expect(controlState(dataDir)).toBe(DB_SHUTDOWNED);
  } finally {
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
});
