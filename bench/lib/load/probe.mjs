// Loaded into a benchmarked server with `node --import ./bench/lib/load/probe.mjs` (bench/load.bench.ts --profile
// does this); never part of the app. It counts the SQL statements Prisma sends through either driver adapter
// (PGlite or PostgreSQL, the same count on both) and the server CPU time, per HTTP request, and writes one JSON line
// per request to LAYERWISE_PROBE_FILE:
//   {"method","path","status","ms","cpuMs","queries","transactions","start","end"}
// Queries are attributed through AsyncLocalStorage, so the count is exact under concurrency too. CPU time is the
// process's, measured between the request's arrival and its response's end: exact only when requests do not overlap
// (the benchmark's profile mode sends them one at a time); under load it double-counts and is not written.
// `start`/`end` are process.hrtime microseconds, V8's CPU profile clock, so --cpu-prof samples can be split by request.
import { AsyncLocalStorage } from "node:async_hooks";
import { appendFileSync } from "node:fs";
import http from "node:http";
import { createRequire } from "node:module";
import path from "node:path";

const file = process.env.LAYERWISE_PROBE_FILE;
const sequential = process.env.LAYERWISE_PROBE_SEQUENTIAL === "1";
/** Also write the first words of every statement (to find repeated queries). */
const withSql = process.env.LAYERWISE_PROBE_SQL === "1";
const store = new AsyncLocalStorage();
const require = createRequire(path.join(process.cwd(), "package.json"));

const nowUs = () => Number(process.hrtime.bigint() / 1000n);

function countOn(queryable) {
  for (const method of ["queryRaw", "executeRaw"]) {
    const original = queryable[method];
    if (typeof original !== "function" || original.__probed) continue;
    const wrapped = function (...args) {
      const c = store.getStore();
      if (c) {
        c.queries += 1;
        if (withSql) c.sql.push(String(args[0]?.sql ?? "").replace(/\s+/g, " ").slice(0, 160));
      }
      return original.apply(this, args);
    };
    wrapped.__probed = true;
    queryable[method] = wrapped;
  }
  const start = queryable.startTransaction;
  if (typeof start === "function" && !start.__probed) {
    const wrapped = async function (...args) {
      const c = store.getStore();
      if (c) c.transactions += 1;
      const tx = await start.apply(this, args);
      countOn(tx);
      return tx;
    };
    wrapped.__probed = true;
    queryable.startTransaction = wrapped;
  }
}

function patchFactory(Factory) {
  const connect = Factory?.prototype?.connect;
  if (typeof connect !== "function" || connect.__probed) return;
  const wrapped = async function (...args) {
    const adapter = await connect.apply(this, args);
    countOn(adapter);
    return adapter;
  };
  wrapped.__probed = true;
  Factory.prototype.connect = wrapped;
}

// Both module formats: the server may load either copy of an external package.
for (const [pkg, name] of [["pglite-prisma-adapter", "PrismaPGlite"], ["@prisma/adapter-pg", "PrismaPg"]]) {
  try { patchFactory(require(pkg)[name]); } catch { /* not installed */ }
  try { patchFactory((await import(require.resolve(pkg).replace(/\.c?js$/, ".mjs")))[name]); } catch { /* no ESM copy */ }
}

const emit = http.Server.prototype.emit;
http.Server.prototype.emit = function (event, req, res) {
  if (event !== "request" || !file) return emit.apply(this, arguments);
  const c = { queries: 0, transactions: 0, sql: [] };
  const t0 = nowUs();
  const cpu0 = process.cpuUsage();
  res.once("close", () => {
    const cpu = process.cpuUsage(cpu0);
    const end = nowUs();
    const line = {
      method: req.method, path: req.url, status: res.statusCode, ms: (end - t0) / 1000,
      cpuMs: sequential ? (cpu.user + cpu.system) / 1000 : null, queries: c.queries, transactions: c.transactions, start: t0, end,
      ...(withSql ? { sql: c.sql } : {}),
    };
    appendFileSync(file, `${JSON.stringify(line)}\n`);
  });
  return store.run(c, () => emit.apply(this, arguments));
};
