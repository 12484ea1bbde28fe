/** Timing helpers for benchmarks: percentiles over per-query times, medians over repeated passes. */

export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  // Nearest-rank definition (p95 of 100 values is the 95th smallest).
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return sorted[rank - 1] ?? NaN;
}

export const median = (values: readonly number[]): number => {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? (sorted[mid] ?? NaN) : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
};

export function nowMs(): number {
  return Number(process.hrtime.bigint()) / 1e6;
}

/** Times `run` once per query; returns milliseconds per query. */
export function timeEach<Q>(queries: readonly Q[], run: (q: Q) => unknown): number[] {
  return queries.map((q) => {
    const t0 = nowMs();
    run(q);
    return nowMs() - t0;
  });
}

/**
 * Runs `passes` timed passes over the queries after one warm-up pass and reports the median over passes of each
 * pass's p50 and p95 (the shared machine makes single passes noisy).
 */
export function passStats<Q>(queries: readonly Q[], run: (q: Q) => unknown, passes = 3): { p50_ms: number; p95_ms: number } {
  timeEach(queries, run);
  const p50s: number[] = [];
  const p95s: number[] = [];
  for (let i = 0; i < passes; i++) {
    const times = timeEach(queries, run);
    p50s.push(percentile(times, 50));
    p95s.push(percentile(times, 95));
  }
  return { p50_ms: round(median(p50s)), p95_ms: round(median(p95s)) };
}

export function round(x: number, digits = 3): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}
