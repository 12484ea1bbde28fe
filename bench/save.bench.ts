/**
 * What a workup save costs the request, and what its interval job costs afterwards (never a timed test). A save
 * validates, predicts the point on an engine thread and writes the version with its queued interval job; the job
 * then predicts with the Monte Carlo draws and writes the interval (lib/jobs/interval.ts). Before the interval moved
 * to the job, the request did both, so "save + job" is what one save used to hold the request for.
 *
 *   npx tsx bench/save.bench.ts [--runs 15] [--draws 300]
 *
 * On an in-memory PGlite, two cases: the three example workups in turn, and a long one (the acid-base example with
 * its three washes repeated to 96 portion-steps, about 40 % of the engine budget with 300 draws). Medians, with the
 * load average.
 */
import { loadavg } from "node:os";
import { parseArgs } from "node:util";
import fs from "node:fs";
import path from "node:path";
import { createDb } from "../lib/db/client";
import { drainQueue } from "../lib/jobs/worker";
import { closeEnginePool } from "../lib/workers/pool";
import { createWorkup, updateWorkup } from "../lib/workups/service";
import { SAVE_DRAWS } from "../lib/workups/prediction";
import { median, nowMs } from "./lib/stats";

const { values: args } = parseArgs({ options: { runs: { type: "string", default: "15" }, draws: { type: "string", default: String(SAVE_DRAWS) } } });
const RUNS = Number(args.runs);
const DRAWS = Number(args.draws);
const EXAMPLES = ["acid-base-separation", "amine-back-extraction", "saponification-ph-swing"];
const example = (name: string) => JSON.parse(fs.readFileSync(path.resolve("examples", `${name}.json`), "utf8")) as { operations: unknown[] };

/** The acid-base example with its washes (2 + 2 + 1 portions) repeated 19 times more: 96 portion-steps. */
function longWorkup(): unknown {
  const spec = example("acid-base-separation");
  const washes = spec.operations.slice(0, 3);
  const rest = spec.operations.slice(3);
  spec.operations = [...Array.from({ length: 20 }, () => structuredClone(washes)).flat(), ...rest];
  return spec;
}

const CASES: Record<string, (run: number) => unknown> = {
  examples: (run) => example(EXAMPLES[run % EXAMPLES.length]!),
  long: () => longWorkup(),
};

const { db, close } = await createDb({ url: "pglite:memory" });
try {
  const group = await db.group.create({ data: { name: "Bench Lab", slug: "bench-lab" } });
  const user = await db.user.create({ data: { name: "Bench Chemist", email: "bench.chemist@example.org" } });
  await db.membership.create({ data: { groupId: group.id, userId: user.id, role: "member" } });
  const actor = { groupId: group.id, userId: user.id };
  const header = (title: string) => ({ title, performedOn: "2026-11-03", chemistId: user.id, notebookRef: "BENCH-1" });

  const ms = (v: number) => `${v.toFixed(0)} ms`;
  console.log(`save bench: ${RUNS} runs per case, ${DRAWS} draws, load average ${loadavg().map((l) => l.toFixed(2)).join(" ")}`);
  // One unmeasured round first: engine threads start, RDKit loads, the library is read.
  await createWorkup(db, actor, { header: header("warm-up"), spec: example(EXAMPLES[0]!) }, { draws: DRAWS });
  await drainQueue(db, { kinds: ["interval"], schedule: false });
  for (const [name, specOf] of Object.entries(CASES)) {
    const timing = { create: [] as number[], update: [] as number[], job: [] as number[] };
    for (let run = 0; run < RUNS; run++) {
      let t0 = nowMs();
      const saved = await createWorkup(db, actor, { header: header(`${name} ${run}`), spec: specOf(run) }, { draws: DRAWS });
      timing.create.push(nowMs() - t0);
      t0 = nowMs();
      await drainQueue(db, { kinds: ["interval"], schedule: false });
      timing.job.push(nowMs() - t0);
      t0 = nowMs();
      await updateWorkup(db, actor, saved.id, { header: header(`${name} ${run} (rev.)`), spec: specOf(run), baseVersion: 1 }, { draws: DRAWS });
      timing.update.push(nowMs() - t0);
      await drainQueue(db, { kinds: ["interval"], schedule: false });
    }
    console.log(`${name}:`);
    console.log(`  create request (point prediction, write, job queued)  median ${ms(median(timing.create))}`);
    console.log(`  update request                                          median ${ms(median(timing.update))}`);
    console.log(`  interval job (draws, write, judgement)                  median ${ms(median(timing.job))}`);
  }
  console.log(`load average at the end ${loadavg().map((l) => l.toFixed(2)).join(" ")}`);
} finally {
  await closeEnginePool();
  await close();
}
