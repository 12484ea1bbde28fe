// SIGTERM to the production server entry (scripts/serve.mjs, which `npm start` runs in its own process): it stops
// accepting, lets the in-flight request finish, closes the embedded database and exits, and the data folder is left
// marked as cleanly shut down. Before, `npm start` spawned `npx next start`, the signal did not reach the server,
// and PGlite was never closed (the next start ran crash recovery).
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { afterAll, expect, it } from "vitest";
import { createDb } from "@/lib/db/client";

// PostgreSQL's src/include/catalog/pg_control.h: ControlFileData starts with system_identifier (uint64),
// pg_control_version and catalog_version_no (uint32 each), then `DBState state`, where DB_SHUTDOWNED = 1 and
// DB_IN_PRODUCTION = 6. A clean shutdown writes DB_SHUTDOWNED; anything else makes the next start recover.
const DB_SHUTDOWNED = 1;
function controlState(dataDir: string): number {
  return fs.readFileSync(path.join(dataDir, "global", "pg_control")).readInt32LE(16);
}

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "lw-shutdown-"));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

function get(port: number, pathname: string, headers: Record<string, string> = {}): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = http.get({ host: "127.0.0.1", port, path: pathname, headers, agent: false }, (res) => {
      let body = "";
      res.on("data", (c: Buffer) => (body += c.toString()));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on("error", reject);
  });
}

function started(child: ChildProcess): Promise<{ host: string; port: number }> {
  return new Promise((resolve, reject) => {
    let out = "";
    child.stdout?.on("data", (c: Buffer) => {
      out += c.toString();
      const m = /listening on http:\/\/([^\s]+):(\d+)/.exec(out);
      if (m) resolve({ host: m[1]!, port: Number(m[2]) });
    });
    child.once("exit", (code) => reject(new Error(`server exited early (${code}): ${out}`)));
  });
}

it("drains, closes the database cleanly and exits on SIGTERM; it listens on 127.0.0.1 by default", async () => {
  const env = { ...process.env, PORT: "0", HOST: "" };
  const child = spawn(process.execPath, ["--import", "tsx", "tests/integration/server/serve-fixture.ts", dir], { env, stdio: ["ignore", "pipe", "inherit"] });
  const { host, port } = await started(child);
  expect(host).toBe("127.0.0.1");

  // The connecting address is appended to whatever the client claims in X-Forwarded-For.
  const forged = await get(port, "/", { "x-forwarded-for": "6.6.6.6" });
  expect(JSON.parse(forged.body)).toEqual({ forwardedFor: "6.6.6.6, 127.0.0.1" });

  const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
  const slow = get(port, "/slow");
  await new Promise((r) => setTimeout(r, 300));
  child.kill("SIGTERM");
  await new Promise((r) => setTimeout(r, 200));
  await expect(get(port, "/")).rejects.toMatchObject({ code: "ECONNREFUSED" });
  const finished = await slow;
  expect(finished.status).toBe(200);
  const { id } = JSON.parse(finished.body) as { id: string };
  expect(await exited).toBe(0);

  expect(controlState(dir)).toBe(DB_SHUTDOWNED);
  const reopened = await createDb({ url: `pglite:${dir}` });
  try {
    expect(await reopened.db.group.count({ where: { id } })).toBe(1);
  } finally {
    await reopened.close();
  }
});
