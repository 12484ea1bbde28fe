// The production server (scripts/serve.mjs) sheds load instead of piling it up: with every place taken, a request
// waits at most the queue wait and is then answered 503 with Retry-After without its handler ever running; a full
// queue answers 503 at once; once a place is free, requests are served again.
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { afterAll, expect, it } from "vitest";

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "lw-overload-"));
let child: ChildProcess | undefined;
afterAll(async () => {
  if (child && child.exitCode === null) {
    const exited = new Promise((resolve) => child?.once("exit", resolve));
    child.kill("SIGTERM");
    await exited;
  }
  fs.rmSync(dir, { recursive: true, force: true });
});

interface Answer { status: number; retryAfter: string | undefined; body: string }

function get(port: number, pathname: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = http.get({ host: "127.0.0.1", port, path: pathname, agent: false }, (res) => {
      let body = "";
      res.on("data", (c: Buffer) => (body += c.toString()));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, retryAfter: res.headers["retry-after"], body }));
    });
    req.on("error", reject);
  });
}

function started(proc: ChildProcess): Promise<number> {
  return new Promise((resolve, reject) => {
    let out = "";
    proc.stdout?.on("data", (c: Buffer) => {
      out += c.toString();
      const m = /listening on http:\/\/[^\s]+:(\d+)/.exec(out);
      if (m) resolve(Number(m[1]));
    });
    proc.once("exit", (code) => reject(new Error(`server exited early (${code}): ${out}`)));
  });
}

it("answers 503 with Retry-After after the bounded wait, runs nothing of a refused request, and serves again once free", async () => {
  const env = { ...process.env, PORT: "0", HOST: "", FIXTURE_MAX_IN_FLIGHT: "1", FIXTURE_QUEUE_WAIT_MS: "300", FIXTURE_MAX_QUEUE: "1" };
  child = spawn(process.execPath, ["--import", "tsx", "tests/integration/server/serve-fixture.ts", dir], { env, stdio: ["ignore", "pipe", "inherit"] });
  const port = await started(child);

  const holding = get(port, "/hold"); // takes the one place for 1.5 s
  await new Promise((r) => setTimeout(r, 100));
  const queued = get(port, "/handled"); // waits for the place, gives up after 0.3 s
  await new Promise((r) => setTimeout(r, 50));
  const overflow = await get(port, "/handled"); // the queue (one place) is full: refused at once
  expect(overflow.status).toBe(503);
  expect(overflow.retryAfter).toBe("1");

  const waited = await queued;
  expect(waited.status).toBe(503);
  expect(waited.retryAfter).toBe("1");
  expect(JSON.parse(waited.body)).toEqual({ error: { code: "overloaded", message: "The server is busy right now; nothing was saved. Try again in 1 s." } });

  expect(JSON.parse((await holding).body)).toEqual({ handled: 1 });
  // Only the holding request reached the handler; the next one is served normally.
  const after = await get(port, "/handled");
  expect(after.status).toBe(200);
  expect(JSON.parse(after.body)).toEqual({ handled: 2 });
}, 180_000);
