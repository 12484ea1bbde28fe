/**
 * `npm run bench:chem`: timing of the work-up engine (issue 3, item 13). Not part of the test suite.
 *  1. one prediction of a 10-step, 4-component work-up (target ≤ 20 µs): on the fast path (recoveries only) for
 *     the same and for a new input object, as a re-run of a compiled work-up (compiled.ts), with full step
 *     detail and flags, and through predictWorkup (validation included);
 *  2. the same with a 1,000-draw uncertainty interval (target ≤ 10 ms);
 *  3. re-predicting 100,000 work-ups on two worker threads (target ≤ 5 s on 2 cores): recoveries only on a
 *     compiled work-up per worker (each new work-up loaded into it), and with every step, flag and caution.
 * The machine is shared: the load average (1, 5, 15 min) is printed before and after the figures, and so are
 * charge-balance evaluations per prediction and per draw, which do not depend on the load.
 * `--no-bulk` skips part 3 (the two-worker run, which occupies both cores for a while); `--out file.json` also
 * writes the summary record there.
 * Each figure is the median of several runs; the last line printed is one JSON object with every number.
 */
import { writeFileSync } from "node:fs";
import { availableParallelism, loadavg } from "node:os";
import { pathToFileURL } from "node:url";
import { Worker, isMainThread, parentPort, workerData } from "node:worker_threads";
import { compileWorkup } from "../lib/chem/compiled";
import { solverStats } from "../lib/chem/equilibrium";
import { predictWorkup, simulateWorkup } from "../lib/chem/predict";
import { workupInputSchema, type WorkupInput, type WorkupInputRaw } from "../lib/chem/schema";
import { propagateUncertainty } from "../lib/chem/uncertainty";

const mmol = (value: number) => ({ value, unit: "mmol" as const });
const mL = (value: number) => ({ value, unit: "mL" as const });

/** The benchmark work-up: an amide coupling in EtOAc quenched, washed acid/base/brine, dried, filtered, concentrated. */
export function benchWorkup(scale = 1): WorkupInputRaw {
  return {
    components: [
      { key: "amide", name: "Benzanilide", role: "product", molarMass: 197.24, amount: mmol(5 * scale), logP: { value: 2.94, provenance: "estimated" } },
      { key: "aniline", name: "Aniline", role: "starting_material", molarMass: 93.13, amount: mmol(0.5 * scale),
        logP: { value: 0.9, provenance: "literature" }, pKas: [{ value: 4.6, kind: "base", provenance: "literature" }] },
      { key: "tea", name: "Triethylamine", role: "reagent", molarMass: 101.19, amount: mmol(2 * scale),
        logP: { value: 1.45, provenance: "literature" }, pKas: [{ value: 10.72, kind: "base", provenance: "literature" }] },
      { key: "acid", name: "Benzoic acid", role: "byproduct", molarMass: 122.12, amount: mmol(1 * scale),
        logP: { value: 1.87, provenance: "literature" }, pKas: [{ value: 4.2, kind: "acid", provenance: "literature" }] },
    ],
    mixture: { solvents: [{ solvent: "etoac", volume: mL(40) }] },
    operations: [
      { type: "quench", reagent: "nh4cl_sat", volume: mL(10) },
      { type: "charge", solvent: "etoac", volume: mL(20) },
      { type: "separate", keep: "organic" },
      { type: "wash", reagent: "hcl_1m", volume: mL(20), portions: 2 },
      { type: "wash", reagent: "water", volume: mL(20) },
      { type: "wash", reagent: "nahco3_sat", volume: mL(20), portions: 2 },
      { type: "wash", reagent: "brine", volume: mL(20) },
      { type: "dry", agent: "mgso4", mass: { value: 3, unit: "g" } },
      { type: "filter", rinse: { solvent: "etoac", volume: mL(10) } },
      { type: "concentrate", method: "rotavap" },
    ],
  };
}

const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? (s[m] as number) : ((s[m - 1] as number) + (s[m] as number)) / 2;
};

/** Median over `runs` of the mean time per call (µs) over `calls` calls. */
function timePerCall(fn: () => void, calls: number, runs: number): number {
  for (let i = 0; i < Math.min(calls, 200); i++) fn();
  const perRun: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    for (let i = 0; i < calls; i++) fn();
    perRun.push(((performance.now() - t0) * 1000) / calls);
  }
  return median(perRun);
}

/** Work-ups for the bulk run: the bench work-up at different scales and volumes, parsed once up front. */
function bulkInputs(count: number, offset: number): WorkupInput[] {
  const base = workupInputSchema.parse(benchWorkup());
  return Array.from({ length: count }, (_, i) => {
    const f = 0.5 + (((i + offset) * 7919) % 1000) / 1000;
    return {
      ...base,
      components: base.components.map((c) => ({ ...c, amountMmol: c.amountMmol * f })),
      operations: base.operations.map((op) => ("volumeMl" in op && typeof op.volumeMl === "number" ? { ...op, volumeMl: op.volumeMl * (2 - f) } : op)),
    };
  });
}

interface WorkerJob { count: number; offset: number; detail: boolean }

if (!isMainThread) {
  const { count, offset, detail } = workerData as WorkerJob;
  const options = detail ? {} : { steps: false, flags: false };
  const inputs = bulkInputs(count, offset);
  parentPort?.postMessage("ready");
  parentPort?.once("message", () => {
    let checksum = 0;
    if (detail) {
      for (const input of inputs) checksum += simulateWorkup(input, options).recovery.amide ?? 0;
    } else {
      // Fastest path: one compiled work-up per worker, each stored work-up loaded into it and re-run, with each
      // contact's pH search starting from the first work-up's pH there (they share their steps).
      const compiled = compileWorkup(inputs[0] as WorkupInput, {}, { rememberPh: true });
      for (const input of inputs) {
        compiled.load(input);
        compiled.run();
        checksum += compiled.recovery[0] ?? 0;
      }
    }
    parentPort?.postMessage(checksum);
  });
}

async function bulkRun(total: number, workers: number, detail: boolean): Promise<{ seconds: number; secondsWithStartup: number; checksum: number }> {
  const t0 = performance.now();
  const per = Math.ceil(total / workers);
  // Workers do not inherit tsx's loader: each registers it, then loads this file.
  const bootstrap = `import(${JSON.stringify(import.meta.resolve("tsx/esm/api"))}).then((m) => { m.register(); return import(${JSON.stringify(import.meta.url)}); });`;
  const pool = Array.from({ length: workers }, (_, w) => new Worker(bootstrap, { eval: true, workerData: { count: Math.min(per, total - w * per), offset: w * per, detail } satisfies WorkerJob }));
  await Promise.all(pool.map((w) => new Promise<void>((resolve) => w.once("message", () => resolve()))));
  const t1 = performance.now();
  const sums = await Promise.all(pool.map((w) => new Promise<number>((resolve, reject) => {
    w.once("message", (m: number) => resolve(m));
    w.once("error", reject);
    w.postMessage("go");
  })));
  const t2 = performance.now();
  await Promise.all(pool.map((w) => w.terminate()));
  return { seconds: (t2 - t1) / 1000, secondsWithStartup: (t2 - t0) / 1000, checksum: sums.reduce((a, b) => a + b, 0) };
}

const loadLine = () => `load average ${loadavg().map((x) => x.toFixed(2)).join(", ")}`;

async function main(): Promise<void> {
  console.log(loadLine());
  const raw = benchWorkup();
  const parsed = workupInputSchema.parse(raw);
  const runs = 7;
  const fastUs = timePerCall(() => simulateWorkup(parsed, { steps: false, flags: false }), 5000, runs);
  const fullUs = timePerCall(() => simulateWorkup(parsed), 2000, runs);
  const validatedUs = timePerCall(() => predictWorkup(raw), 1000, runs);
  // The same input object again and again hits the engine's per-component cache; stored work-ups are new objects.
  const fresh = bulkInputs(4000, 0);
  let next = 0;
  const freshUs = timePerCall(() => simulateWorkup(fresh[next++ % fresh.length] as WorkupInput, { steps: false, flags: false }), 4000, runs);
  const compiled = compileWorkup(parsed);
  const compiledUs = timePerCall(() => compiled.run(), 5000, runs);
  console.log(`prediction, 10 steps × 4 components: fast path ${fastUs.toFixed(1)} µs (same input object), ${freshUs.toFixed(1)} µs (a new input each call), ${compiledUs.toFixed(1)} µs (re-run of a compiled work-up), with steps and flags ${fullUs.toFixed(1)} µs, validated ${validatedUs.toFixed(1)} µs (median of ${runs} runs; target ≤ 20 µs)`);

  const mcMs = timePerCall(() => propagateUncertainty(parsed, simulateWorkup, { draws: 1000, seed: 1 }), 5, runs) / 1000;
  console.log(`with 1,000-draw uncertainty: ${mcMs.toFixed(2)} ms (median of ${runs} runs; target ≤ 10 ms)`);

  const countEvaluations = (fn: () => void): number => {
    const before = solverStats.evaluations;
    fn();
    return solverStats.evaluations - before;
  };
  const evalsPerPrediction = countEvaluations(() => simulateWorkup(fresh[1] as WorkupInput, { steps: false, flags: false }));
  const evalsPerDraw = countEvaluations(() => propagateUncertainty(parsed, simulateWorkup, { draws: 1000, seed: 1 })) / 1001;
  console.log(`charge-balance evaluations: ${evalsPerPrediction} per prediction (new input), ${evalsPerDraw.toFixed(1)} per draw of the uncertainty run`);
  const summary = {
    bench: "chem", steps: parsed.operations.length, components: parsed.components.length, runs,
    predictionFastUs: Number(fastUs.toFixed(2)), predictionFastFreshInputUs: Number(freshUs.toFixed(2)), predictionCompiledUs: Number(compiledUs.toFixed(2)),
    predictionFullUs: Number(fullUs.toFixed(2)), predictionValidatedUs: Number(validatedUs.toFixed(2)),
    uncertainty1000Ms: Number(mcMs.toFixed(3)), evaluationsPerPrediction: evalsPerPrediction, evaluationsPerDraw: Number(evalsPerDraw.toFixed(2)),
  };
  const machine = () => ({ cores: availableParallelism(), loadAverage: loadavg().map((x) => Number(x.toFixed(2))) });
  if (process.argv.includes("--no-bulk")) {
    console.log(loadLine());
    report({ ...summary, ...machine() });
    return;
  }

  const workers = 2;
  const bulk = async (detail: boolean) => {
    const runsOf: Array<{ seconds: number; secondsWithStartup: number }> = [];
    for (let r = 0; r < 3; r++) runsOf.push(await bulkRun(100_000, workers, detail));
    return { seconds: median(runsOf.map((b) => b.seconds)), withStartup: median(runsOf.map((b) => b.secondsWithStartup)) };
  };
  const bulkFast = await bulk(false);
  console.log(`re-predicting 100,000 work-ups (recoveries only, compiled work-up per worker) on ${workers} workers: ${bulkFast.seconds.toFixed(2)} s, ${bulkFast.withStartup.toFixed(2)} s with worker start-up and input preparation (median of 3; target ≤ 5 s; ${availableParallelism()} cores here)`);
  const bulkFull = await bulk(true);
  console.log(`re-predicting 100,000 work-ups (every step, flags and cautions) on ${workers} workers: ${bulkFull.seconds.toFixed(2)} s, ${bulkFull.withStartup.toFixed(2)} s with start-up (median of 3)`);

  console.log(loadLine());
  report({
    ...summary,
    bulk100kFastSeconds: Number(bulkFast.seconds.toFixed(3)), bulk100kFullSeconds: Number(bulkFull.seconds.toFixed(3)),
    bulk100kFullWithStartupSeconds: Number(bulkFull.withStartup.toFixed(3)), workers, ...machine(),
  });
}

/** Prints the summary record, and writes it to the file after `--out` when one is given. */
function report(record: Record<string, unknown>): void {
  const line = JSON.stringify(record);
  console.log(line);
  const at = process.argv.indexOf("--out");
  const file = at >= 0 ? process.argv[at + 1] : undefined;
  if (file) writeFileSync(file, `${JSON.stringify(record, null, 2)}\n`);
}

// Run only as the entry script, so that other scripts can import benchWorkup.
if (isMainThread && process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) await main();
