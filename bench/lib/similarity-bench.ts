/** Top-k similarity timings and exactness for one data set. */
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";
import { type KeySet } from "./dataset";
import { nowMs, passStats, round, type Timing } from "./stats";
import { CompoundSearchIndex, bruteForceSimilar } from "@/lib/search";

export interface SimilarityReport extends Timing {
  n: number;
  threshold_0_5: Timing;
  exact: boolean;
  verified_queries: number;
  build_ms: number;
  wasm_mb: number;
  heap_mb: number | null;
}

// A full collection before each heap reading makes the JavaScript-side index size measurable.
setFlagsFromString("--expose-gc");
const gc = runInNewContext("gc") as (() => void) | undefined;
const heapUsed = () => {
  gc?.();
  return process.memoryUsage().heapUsed;
};

export function buildSimilarityIndex(keys: KeySet): { index: CompoundSearchIndex; buildMs: number; heapBytes: number | null } {
  const heap0 = heapUsed();
  const t0 = nowMs();
  const index = new CompoundSearchIndex();
  keys.records.forEach((r, i) => index.upsert({ id: r.id, groupId: "bench", morganFingerprint: keys.morgan.subarray(i * 256, i * 256 + 256) }));
  const buildMs = nowMs() - t0;
  return { index, buildMs, heapBytes: gc ? heapUsed() - heap0 : null };
}

export function benchSimilarity(keys: KeySet, queries: Uint8Array[], options: { passes: number; verify: number; log: (m: string) => void }): SimilarityReport {
  const { index, buildMs, heapBytes } = buildSimilarityIndex(keys);
  const top10 = passStats(queries, (q) => index.similar("bench", q, { k: 10 }), options.passes);
  const threshold = passStats(queries, (q) => index.similar("bench", q, { k: Infinity, threshold: 0.5 }), options.passes);
  let exact = true;
  const reference = keys.records.map((r, i) => ({ id: r.id, fingerprint: keys.morgan.subarray(i * 256, i * 256 + 256) }));
  const checked = queries.slice(0, options.verify);
  for (const q of checked) {
    const same = (a: { id: string; score: number }[], b: { id: string; score: number }[]) => a.length === b.length && a.every((h, i) => h.id === b[i]?.id && h.score === b[i]?.score);
    if (!same(index.similar("bench", q, { k: 10 }), bruteForceSimilar(reference, q, 10))) exact = false;
    if (!same(index.similar("bench", q, { k: Infinity, threshold: 0.5 }), bruteForceSimilar(reference, q, Infinity, 0.5))) exact = false;
  }
  if (!exact) options.log("  MISMATCH against brute force");
  const usage = index.memoryUsage();
  return {
    n: keys.records.length,
    ...top10,
    threshold_0_5: threshold,
    exact,
    verified_queries: checked.length,
    build_ms: round(buildMs, 1),
    wasm_mb: round(usage.wasmBytes / 1e6, 1),
    heap_mb: heapBytes === null ? null : round(heapBytes / 1e6, 1),
  };
}
