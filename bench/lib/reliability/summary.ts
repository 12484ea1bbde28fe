// bench/results/reliability.md: the figures of the latest run on each backend, rewritten from the JSON files.
import fs from "node:fs";
import path from "node:path";

interface Stored {
  backend: string;
  finishedAt: string;
  command: string;
  loadavg: { before: number[]; after: number[] };
  matrix: { endpoints: number; routeFiles: number; pageFiles: number; cells: number; violations: number; unexpected: number; uncovered: string[]; principals: string[] } | null;
  fuzz: { requests: number; serverErrors: number; brokenConnections: number; leaks: number; partialWrites: number; acceptedWrites: number; replayed: number; snapshotTables: number; slowestMs: number; slowest: string } | null;
  kill: { writers: number; rounds: { acknowledged: number; lost: number; cutOff: number; killedAfterMs: number }[]; acknowledged: number; lost: number } | null;
}

export function writeSummary(dir: string): void {
  const runs = ["pglite", "postgres"].map((b) => path.join(dir, `reliability-${b}.json`)).filter((f) => fs.existsSync(f))
    .map((f) => JSON.parse(fs.readFileSync(f, "utf8")) as Stored);
  const col = (f: (r: Stored) => string) => runs.map(f).join(" | ");
  const lines = [
    "# Reliability figures",
    "",
    "Written by `npm run bench:reliability -- --backend pglite|postgres` (bench/reliability.bench.ts); targets 0 / 0 / 0.",
    "Counts, not timings: the machine's load does not change them (load average shown for context).",
    "",
    `| | ${col((r) => r.backend)} |`,
    `|---|${runs.map(() => "---").join("|")}|`,
    `| run finished (UTC) | ${col((r) => r.finishedAt.slice(0, 16).replace("T", " "))} |`,
    `| load average before → after | ${col((r) => `${r.loadavg.before[0]?.toFixed(1)} → ${r.loadavg.after[0]?.toFixed(1)}`)} |`,
    `| **authorization matrix** endpoints (route methods + pages) | ${col((r) => (r.matrix ? `${r.matrix.endpoints} (${r.matrix.routeFiles} route files, ${r.matrix.pageFiles} pages)` : "not run"))} |`,
    `| cells (endpoint × principal) | ${col((r) => String(r.matrix?.cells ?? "–"))} |`,
    `| **violations** | ${col((r) => String(r.matrix?.violations ?? "–"))} |`,
    `| answers other than the expected refusal/success (not violations) | ${col((r) => String(r.matrix?.unexpected ?? "–"))} |`,
    `| endpoints the bench could not place | ${col((r) => String(r.matrix?.uncovered.length ?? "–"))} |`,
    `| **malformed requests** | ${col((r) => String(r.fuzz?.requests ?? "not run"))} |`,
    `| **5xx** | ${col((r) => String(r.fuzz?.serverErrors ?? "–"))} |`,
    `| broken connections | ${col((r) => String(r.fuzz?.brokenConnections ?? "–"))} |`,
    `| **stack traces / internal messages in bodies** | ${col((r) => String(r.fuzz?.leaks ?? "–"))} |`,
    `| **partial writes** (tables changed by refused writes, of all tables) | ${col((r) => (r.fuzz ? `${r.fuzz.partialWrites} of ${r.fuzz.snapshotTables}` : "–"))} |`,
    `| generated writes that were valid and accepted | ${col((r) => (r.fuzz ? `${r.fuzz.acceptedWrites}${r.fuzz.replayed ? ` (refused ${r.fuzz.replayed} replayed between snapshots)` : ""}` : "–"))} |`,
    `| slowest malformed request | ${col((r) => (r.fuzz ? `${(r.fuzz.slowestMs / 1000).toFixed(1)} s (${r.fuzz.slowest.replace(/\|/g, "\\|")})` : "–"))} |`,
    `| **kill -9 rounds × writers** | ${col((r) => (r.kill ? `${r.kill.rounds.length} × ${r.kill.writers}` : "not run"))} |`,
    `| acknowledged writes (per round) | ${col((r) => (r.kill ? `${r.kill.acknowledged} (${r.kill.rounds.map((x) => x.acknowledged).join(", ")})` : "–"))} |`,
    `| **acknowledged writes lost** | ${col((r) => String(r.kill?.lost ?? "–"))} |`,
    `| requests cut off by the kill (unanswered, not acknowledged) | ${col((r) => (r.kill ? String(r.kill.rounds.reduce((s, x) => s + x.cutOff, 0)) : "–"))} |`,
    `| command | ${col((r) => `\`${r.command}\``)} |`,
    "",
    "Per-cell and per-request detail: reliability-pglite.json, reliability-postgres.json.",
    "",
  ];
  fs.writeFileSync(path.join(dir, "reliability.md"), lines.join("\n"));
}
