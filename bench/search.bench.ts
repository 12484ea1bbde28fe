/**
 * Search benchmark over the shared data sets (shared/bench/README.md): exact top-10 Tanimoto at 10k / 100k / 1M and
 * substructure search at 100k, each checked against a reference (brute-force scan; RDKit's SubstructLibrary).
 *
 *   npm run bench:search -- --json                 all sizes; the last stdout line is the JSON summary
 *   npm run bench:search -- --sizes 10k,100k       fewer sizes
 *   options: --passes N (default 3), --verify N (queries checked against brute force, default 100),
 *            --substructure 10k|100k|none (default 100k), --no-baseline (skip RDKit SubstructLibrary)
 *
 * The first run computes fingerprints with RDKit (about 4–5 minutes for the 1M set) and caches them in
 * .tmp/bench-cache; later runs start in seconds. Never part of the test suite.
 */
import { readFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { morganFingerprint } from "@/lib/chem/structure/fingerprint";
import { loadRDKit } from "@/lib/chem/structure/rdkit";
import { BENCH_DIR, datasetFile, loadKeys, readSmi } from "./lib/dataset";
import { benchSimilarity, type SimilarityReport } from "./lib/similarity-bench";
import { benchSubstructure, type SubstructureReport } from "./lib/substructure-bench";
import { nowMs, round } from "./lib/stats";

const args = process.argv.slice(2);
const flag = (name: string) => args.includes(`--${name}`);
const option = (name: string, fallback: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? (args[i + 1] ?? fallback) : fallback;
};
const json = flag("json");
const sizes = option("sizes", "10k,100k,1m").split(",") as ("10k" | "100k" | "1m")[];
const passes = Number(option("passes", "3"));
const verify = Number(option("verify", "100"));
const substructureSet = option("substructure", "100k");
const log = (m: string) => process.stderr.write(`${m}\n`);

const loadAtStart = loadavg()[0] ?? 0;
const rdkitStart = nowMs();
const rdkit = await loadRDKit();
const rdkitLoadMs = nowMs() - rdkitStart;
const queries = readSmi(`${BENCH_DIR}/queries.smi`).map((q) => {
  const mol = rdkit.get_mol(q.smiles);
  if (!mol) throw new Error(`query ${q.id} does not parse`);
  try {
    return morganFingerprint(mol);
  } finally {
    mol.delete();
  }
});

const similarity: Record<string, SimilarityReport> = {};
for (const size of sizes) {
  const records = readSmi(await datasetFile(size));
  const keys = loadKeys(rdkit, size, records, false, log);
  log(`similarity ${size}: ${records.length} compounds`);
  similarity[size] = benchSimilarity(keys, queries, { passes, verify, log });
  log(`  ${JSON.stringify(similarity[size])}`);
}

let substructure: SubstructureReport | null = null;
if (substructureSet === "10k" || substructureSet === "100k") {
  const records = readSmi(await datasetFile(substructureSet));
  const keys = loadKeys(rdkit, substructureSet, records, true, log);
  const subQueries = JSON.parse(readFileSync(`${BENCH_DIR}/substructure_queries.json`, "utf8")) as [string, string][];
  log(`substructure ${substructureSet}: ${records.length} compounds, ${subQueries.length} queries`);
  substructure = benchSubstructure(rdkit, keys, subQueries, { passes, baseline: !flag("no-baseline"), log });
  log(`  ${JSON.stringify(substructure)}`);
}

const summary = {
  sizes: Object.fromEntries(
    Object.entries(similarity).map(([size, r]) => [size, { p50_ms: r.p50_ms, p95_ms: r.p95_ms, cpu_p50_ms: r.cpu_p50_ms, cpu_p95_ms: r.cpu_p95_ms, exact: r.exact, threshold_0_5: r.threshold_0_5 }]),
  ),
  substructure,
  build: Object.fromEntries(Object.entries(similarity).map(([size, r]) => [size, { ms: r.build_ms, wasm_mb: r.wasm_mb, heap_mb: r.heap_mb }])),
  rdkit_load_ms: round(rdkitLoadMs, 1),
  // The machine is shared: a one-minute load average well above the 2 cores means timings are inflated.
  load_average: { start: round(loadAtStart, 1), end: round(loadavg()[0] ?? 0, 1), cores: cpus().length },
  passes,
  node: process.version,
};
if (json) process.stdout.write(`${JSON.stringify(summary)}\n`);
else log(JSON.stringify(summary, null, 2));
