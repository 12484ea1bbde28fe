// Loaded into the server under test with `node --import ./bench/lib/reliability/loop-probe.mjs` (the reliability
// bench does this); never part of the app. It measures how long the server's event loop is held. A 20 ms timer notes
// every turn that made it late by more than LAYERWISE_LOOP_MIN_MS (default 50 ms), with two figures: the lateness
// (wall time, which on a machine short of CPU also counts the time the OS did not run the thread) and the time the
// loop was busy running code since the previous tick (event-loop utilisation's active time: what the app itself held
// the loop for). Once a second the perf_hooks delay histogram's maximum is written and reset. One JSON line each to
// LAYERWISE_LOOP_FILE:
//   {"at": epoch ms, "kind": "turn", "ms": lateness, "activeMs": busy, "inFlight": ["POST /api/v1/…", …]}
//   {"at": epoch ms, "kind": "second", "max": ms, "p99": ms}
// `inFlight` (turns busy over 250 ms) names the requests open at that moment, to tell which one held the loop.
import { appendFileSync } from "node:fs";
import http from "node:http";
import { monitorEventLoopDelay, performance } from "node:perf_hooks";
import { isMainThread } from "node:worker_threads";

const file = process.env.LAYERWISE_LOOP_FILE;
const minMs = Number(process.env.LAYERWISE_LOOP_MIN_MS ?? 50);

// `--import` runs in every thread of the process, the engine threads too; only the main thread answers requests.
if (file && isMainThread) {
  const write = (line) => appendFileSync(file, `${JSON.stringify(line)}\n`);
  const open = new Map();
  let nextId = 0;
  const emit = http.Server.prototype.emit;
  http.Server.prototype.emit = function (event, req, res) {
    if (event === "request") {
      const id = nextId++;
      open.set(id, `${req.method} ${String(req.url).split("?")[0].replace(/\/c[0-9a-z]{20,30}/g, "/{id}")}`);
      res.once("close", () => open.delete(id));
    }
    return emit.apply(this, arguments);
  };
  const period = 20;
  let expected = performance.now() + period;
  let elu = performance.eventLoopUtilization();
  const tick = () => {
    const now = performance.now();
    const late = now - expected;
    const used = performance.eventLoopUtilization(elu);
    elu = performance.eventLoopUtilization();
    if (late > minMs) {
      const busy = Math.round(used.active);
      write({ at: Date.now(), kind: "turn", ms: Math.round(late), activeMs: busy, ...(busy > 250 ? { inFlight: [...new Set(open.values())].slice(0, 12) } : {}) });
    }
    expected = now + period;
    setTimeout(tick, period).unref();
  };
  setTimeout(tick, period).unref();

  const histogram = monitorEventLoopDelay({ resolution: 10 });
  histogram.enable();
  setInterval(() => {
    write({ at: Date.now(), kind: "second", max: Math.round(histogram.max / 1e6), p99: Math.round(histogram.percentile(99) / 1e6) });
    histogram.reset();
  }, 1000).unref();
}
