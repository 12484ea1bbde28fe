#!/usr/bin/env node
// The production HTTP server behind `npm start`: Next.js's request handler on a plain node:http server that this
// process owns, so that
//   - it listens on HOST (default 127.0.0.1, this machine only) and PORT (default 3000);
//   - the connecting address is appended to X-Forwarded-For as a proxy would (Next.js only fills the header when it
//     is absent), so a client cannot name its own address to the sign-in limits (lib/auth/rate-limit.ts);
//   - SIGTERM and SIGINT stop it cleanly: stop accepting, answer requests that arrive on kept-alive connections with
//     503 + Connection: close, let in-flight requests finish for up to LAYERWISE_SHUTDOWN_GRACE_SECONDS, then stop the
//     job worker and close the database (instrumentation.ts registers that hook), and exit;
//   - when it is saturated it sheds load instead of piling it up: at most LAYERWISE_MAX_IN_FLIGHT requests (default
//     64) run at once; more wait in a queue for a free place at most LAYERWISE_QUEUE_WAIT_SECONDS (default 10), and a
//     request still waiting then (or arriving to a full queue) is answered 503 with Retry-After, before any of it ran.
//     Next's static files (/_next/static/) are never held back.
// HOST, PORT and the grace period are validated by lib/env.ts when scripts/prepare-db.ts runs before this.
import http from "node:http";

const shared = globalThis;

/** Appends the socket's peer to X-Forwarded-For (RFC 7239 §5.2 describes the same "append, never replace" rule). */
export function appendPeer(req) {
  const peer = req.socket.remoteAddress ?? "unknown";
  const sent = req.headers["x-forwarded-for"];
  const chain = Array.isArray(sent) ? sent.join(", ") : sent;
  req.headers["x-forwarded-for"] = chain ? `${chain}, ${peer}` : peer;
}

/** A positive number from the environment, or the default when unset or not a positive number. */
function positive(text, fallback) {
  const value = Number(text);
  return text && Number.isFinite(value) && value > 0 ? value : fallback;
}

/**
 * True when the path's %-escapes do not decode to UTF-8 text (`%FF`, an encoded lone surrogate `%ED%A0%80`, a cut-off
 * `%2`). Next.js answers such a path with a bare 500 before any route runs; it is the client's mistake, so it is
 * answered 400 here instead. The query string is left to the routes (URLSearchParams replaces bad bytes with U+FFFD).
 */
export function undecodablePath(url) {
  try {
    decodeURIComponent((url ?? "/").split("?")[0]);
    return false;
  } catch {
    return true;
  }
}

/**
 * Serves `handler(req, res)` (Next's, unless given) and installs the signal handlers. Resolves with the server once
 * it listens. `onStopped` runs after the database is closed (default: exit the process).
 */
export async function serve({
  handler,
  host = process.env.HOST || "127.0.0.1",
  port = Number(process.env.PORT ?? 3000),
  graceMs = 1000 * Number(process.env.LAYERWISE_SHUTDOWN_GRACE_SECONDS || 10),
  onStopped = (code) => process.exit(code),
  log = (line) => console.log(line),
  maxInFlight = positive(process.env.LAYERWISE_MAX_IN_FLIGHT, 64),
  queueWaitMs = 1000 * positive(process.env.LAYERWISE_QUEUE_WAIT_SECONDS, 10),
  maxQueue = 4 * maxInFlight,
} = {}) {
  let nextApp;
  if (!handler) {
    const { default: next } = await import("next");
    nextApp = next({ dev: false, dir: process.cwd(), hostname: host, port });
    await nextApp.prepare();
    handler = nextApp.getRequestHandler();
  }
  let stopping = false;
  const inFlight = new Set();
  const server = http.createServer((req, res) => {
    if (stopping) {
      res.writeHead(503, { "content-type": "application/json", connection: "close", "retry-after": "5" });
      res.end(JSON.stringify({ error: { code: "shutting_down", message: "The server is restarting. Try again in a moment." } }));
      return;
    }
    if (undecodablePath(req.url)) {
      res.writeHead(400, { "content-type": "application/json", "x-content-type-options": "nosniff" });
      res.end(JSON.stringify({ error: { code: "bad_request", message: "The address is not valid: a %-escape in its path is not UTF-8 text." } }));
      return;
    }
    appendPeer(req);
    inFlight.add(res);
    res.on("close", () => inFlight.delete(res));
    admit(req, res, () =>
      Promise.resolve(handler(req, res)).catch((error) => {
        console.error("[layerwise] request handler failed:", error);
        if (!res.headersSent) res.writeHead(500);
        res.end();
      }),
    );
  });

  // Admission: `running` requests hold a place; the rest wait in `waiting` (first come, first served).
  let running = 0;
  const waiting = [];
  const retryAfter = String(Math.max(1, Math.ceil(queueWaitMs / 1000)));
  function overloaded(res) {
    if (res.headersSent || res.writableEnded) return;
    res.writeHead(503, { "content-type": "application/json", "retry-after": retryAfter, "cache-control": "no-store" });
    res.end(JSON.stringify({ error: { code: "overloaded", message: `The server is busy right now; nothing was saved. Try again in ${retryAfter} s.` } }));
  }
  function release() {
    running--;
    while (waiting.length > 0 && running < maxInFlight) {
      const next = waiting.shift();
      clearTimeout(next.timer);
      if (next.res.destroyed) continue; // the client gave up while waiting
      start(next.res, next.run);
    }
  }
  function start(res, run) {
    running++;
    let done = false;
    const finish = () => {
      if (done) return;
      done = true;
      release();
    };
    res.on("close", finish);
    res.on("finish", finish);
    run();
  }
  function admit(req, res, run) {
    if ((req.url ?? "").startsWith("/_next/static/")) return void run();
    if (running < maxInFlight) return start(res, run);
    if (waiting.length >= maxQueue) return overloaded(res);
    const entry = { res, run, timer: undefined };
    entry.timer = setTimeout(() => {
      const at = waiting.indexOf(entry);
      if (at >= 0) waiting.splice(at, 1);
      overloaded(res);
    }, queueWaitMs);
    waiting.push(entry);
  }

  const drained = () =>
    new Promise((resolve) => {
      const deadline = Date.now() + graceMs;
      const check = () => {
        if (inFlight.size === 0 || Date.now() >= deadline) resolve(inFlight.size);
        else setTimeout(check, 50);
      };
      check();
    });

  async function stop(signal) {
    if (stopping) return;
    stopping = true;
    log(`Layerwise: ${signal} received, finishing ${inFlight.size} request(s) (at most ${graceMs / 1000} s)...`);
    server.close();
    server.closeIdleConnections();
    const left = await drained();
    if (left > 0) log(`Layerwise: ${left} request(s) still running after the grace period; closing them.`);
    server.closeAllConnections();
    let code = 0;
    try {
      await shared.__layerwiseShutdown?.();
      await nextApp?.close?.();
    } catch (error) {
      console.error("[layerwise] shutdown failed:", error);
      code = 1;
    }
    log("Layerwise: stopped; the database was closed cleanly.");
    onStopped(code);
  }
  for (const signal of ["SIGTERM", "SIGINT"]) process.on(signal, () => void stop(signal));

  await new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => resolve());
  });
  const shown = host.includes(":") ? `[${host}]` : host;
  log(`Layerwise is listening on http://${shown}:${server.address().port}`);
  return server;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  process.env.NODE_ENV ??= "production";
  process.env.NEXT_TELEMETRY_DISABLED ??= "1";
  await serve();
}
