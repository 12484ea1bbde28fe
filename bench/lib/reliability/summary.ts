// bench/results/reliability.md: the figures of the latest run on each backend, rewritten from the JSON files.
import fs from "node:fs";
import path from "node:path";

interface Stored {
  backend: string;
  finishedAt: string;
  command: string;
  loadavg: { before: number[]; after: number[] };
  matrix: { endpoints: number; routeFiles: number; pageFiles: number; cells: number; violations: number; unexpected: number; uncovered: string[]; principals: string[] } | null;
  actions?: { actions: number; files: number; cells: number; violations: number; unexpected: number; uncovered: string[]; principals: string[] } | null;
  fuzz: {
    requests: number; serverErrors: number; brokenConnections: number; leaks: number; partialWrites: number; acceptedWrites: number; slowestMs: number; slowest: string;
    tables?: number; explained?: Record<string, number>; followUps?: Record<string, number>; incompleteWorkups?: string[];
  } | null;
  kill: { writers: number; rounds: { acknowledged: number; lost: number; cutOff: number; killedAfterMs: number }[]; acknowledged: number; lost: number } | null;
  loop?: { phase: string; seconds: number; maxLoopHeldMs: number; heldOver1s: number; heldOver250ms: number; maxLoopDelayMs: number; probe: { requests: number; maxMs: number; p99Ms: number; medianMs: number }; heavy: Record<string, { requests: number; statuses: Record<string, number>; medianMs: number; maxMs: number }> }[];
}

const sum = (m: Record<string, number> | undefined) => Object.values(m ?? {}).reduce((a, b) => a + b, 0);
const byTable = (m: Record<string, number> | undefined) => Object.entries(m ?? {}).map(([t, n]) => `${t} ${n}`).join(", ") || "none";

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
    `| **server actions** (over HTTP with Next-Action, from the build manifest) | ${col((r) => (r.actions ? `${r.actions.actions} (${r.actions.files} files)` : "not run"))} |`,
    `| cells (action × principal) | ${col((r) => String(r.actions?.cells ?? "–"))} |`,
    `| **action violations** | ${col((r) => String(r.actions?.violations ?? "–"))} |`,
    `| action answers other than the expected refusal/success (not violations) | ${col((r) => String(r.actions?.unexpected ?? "–"))} |`,
    `| **malformed requests** | ${col((r) => String(r.fuzz?.requests ?? "not run"))} |`,
    `| **5xx** | ${col((r) => String(r.fuzz?.serverErrors ?? "–"))} |`,
    `| broken connections | ${col((r) => String(r.fuzz?.brokenConnections ?? "–"))} |`,
    `| **stack traces / internal messages in bodies** | ${col((r) => String(r.fuzz?.leaks ?? "–"))} |`,
    `| **partial writes** (group A rows added, changed or removed that no acknowledged write explains, + acknowledged workups missing a version or prediction) | ${col((r) => (r.fuzz ? String(r.fuzz.partialWrites) : "–"))} |`,
    `| generated writes that were valid and accepted (2xx) | ${col((r) => (r.fuzz ? String(r.fuzz.acceptedWrites) : "–"))} |`,
    `| rows explained by those acknowledged writes | ${col((r) => (r.fuzz?.explained ? `${sum(r.fuzz.explained)} (${byTable(r.fuzz.explained)})` : "–"))} |`,
    `| background follow-ups of acknowledged writes (jobs, inferred partition values) | ${col((r) => (r.fuzz?.followUps ? `${sum(r.fuzz.followUps)} (${byTable(r.fuzz.followUps)})` : "–"))} |`,
    `| slowest malformed request | ${col((r) => (r.fuzz ? `${(r.fuzz.slowestMs / 1000).toFixed(1)} s (${r.fuzz.slowest.replace(/\|/g, "\\|")})` : "–"))} |`,
    ...["authorization matrix", "malformed requests"].flatMap((phase) => [
      `| **longest hold of the event loop** during the ${phase} (busy time between two 20 ms ticks; target < 1 s) | ${col((r) => { const l = r.loop?.find((x) => x.phase === phase); return l ? `${l.maxLoopHeldMs} ms (${l.heldOver1s} holds > 1 s, ${l.heldOver250ms} > 250 ms; ${l.seconds} s)` : "not measured"; })} |`,
      `| max event-loop delay in wall time during the ${phase} (includes time the OS did not run the thread) | ${col((r) => { const l = r.loop?.find((x) => x.phase === phase); return l ? `${l.maxLoopDelayMs} ms` : "–"; })} |`,
      `| trivial route every 50 ms during the ${phase}: median / p99 / max | ${col((r) => { const l = r.loop?.find((x) => x.phase === phase); return l ? `${l.probe.medianMs} / ${l.probe.p99Ms} / ${l.probe.maxMs} ms (${l.probe.requests})` : "–"; })} |`,
      `| heavy requests beside it: count, statuses, median time | ${col((r) => { const l = r.loop?.find((x) => x.phase === phase); return l ? Object.entries(l.heavy).map(([k, v]) => `${k} ${v.requests} ${JSON.stringify(v.statuses).replace(/"/g, "")} ${(v.medianMs / 1000).toFixed(1)} s`).join("; ") : "–"; })} |`,
    ]),
    `| **kill -9 rounds × writers** | ${col((r) => (r.kill ? `${r.kill.rounds.length} × ${r.kill.writers}` : "not run"))} |`,
    `| acknowledged writes (per round) | ${col((r) => (r.kill ? `${r.kill.acknowledged} (${r.kill.rounds.map((x) => x.acknowledged).join(", ")})` : "–"))} |`,
    `| **acknowledged writes lost** | ${col((r) => String(r.kill?.lost ?? "–"))} |`,
    `| requests cut off by the kill (unanswered, not acknowledged) | ${col((r) => (r.kill ? String(r.kill.rounds.reduce((s, x) => s + x.cutOff, 0)) : "–"))} |`,
    `| command | ${col((r) => `\`${r.command}\``)} |`,
    "",
    "How the figures are counted:",
    "",
    "- **Partial writes** are counted row by row (bench/lib/reliability/snapshot.ts): every row of group A that the malformed",
    "  requests phase added, changed or removed must be explained by a write the server acknowledged (2xx), by being the",
    "  record the answer or the path named, or by hanging off it (its workupId, compoundId, an audit event's entityId or",
    "  ids); and every workup an acknowledged write created must have its version and its prediction. Anything else is a",
    "  partial write. The background jobs' follow-ups of acknowledged outcome reports (infer and revalidate jobs,",
    "  partition values inferred from outcomes) are listed apart; rows of other groups (the heavy load) are not group A's.",
    "  The earlier figure, 6 of 18 tables on PGlite, compared whole tables after the last of three replays of the refused",
    "  writes; that last replay still had 2 writes accepted (generated inputs that had become valid: a workup saved with",
    "  its version, prediction, components, outcome and audit event), and those were the 6 tables. A Job row seen in an",
    "  earlier run was the inference job the scheduler enqueues after acknowledged outcome reports. Neither was a partial",
    "  write; the row-level count tells them apart.",
    "- **Violations** of the matrix include \"a refused write changed group A's data\": group A's data as its lead sees",
    "  them differ after a refused write. The digest is taken with group A's background jobs idle, but the scheduler can",
    "  still start a job (inference from reported outcomes) between the two digests, which changes the same answers; such",
    "  cells are listed in the JSON (`matrix.problems`) to be checked one by one, not hidden.",
    "- **Event loop** figures are measured inside the server (bench/lib/reliability/loop-probe.mjs, loaded with",
    "  `node --import`; the app has no profiling code). The hold is the loop's busy time (event-loop utilisation's active",
    "  time) between two ticks of a 20 ms timer: what the app's code held it for. The wall-time delay (perf_hooks",
    "  histogram, timer lateness) also counts the time the OS did not run the thread: on this shared two-core machine,",
    "  busy with other work (load average above), that reaches seconds while the loop itself is idle, so it is shown",
    "  beside the hold, not as the target. Heavy requests run beside both phases: the largest prediction the engine",
    "  budget allows, a 1,000-record SD file, and a 200-workup group import into an empty group (40 empty groups, used up",
    "  during the matrix). The requests open during each hold over 1 s are in the JSON (`loop[].openDuringLongHolds`).",
    "",
    "Per-cell and per-request detail: reliability-pglite.json, reliability-postgres.json.",
    "",
  ];
  fs.writeFileSync(path.join(dir, "reliability.md"), lines.join("\n"));
}
