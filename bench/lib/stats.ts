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

/** Times `run` once per query: wall-clock and process CPU milliseconds per query. */
export function timeEach<Q>(queries: readonly Q[], run: (q: Q) => unknown): { wall: number[]; cpu: number[] } {
  const wall: number[] = [];
  const cpu: number[] = [];
  for (const q of queries) {
    const c0 = process.cpuUsage();
    const t0 = nowMs();
    run(q);
    wall.push(nowMs() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wall, cpu };
}

export interface Timing {
  p50_ms: number;
  p95_ms: number;
  /** Process CPU time per query: what the search itself costs when other processes take turns on the cores. */
  cpu_p50_ms: number;
  cpu_p95_ms: number;
}

/**
 * Runs `passes` timed passes over the queries after one warm-up pass and reports the median over passes of each
 * pass's p50 and p95 (the shared machine makes single passes noisy).
 */
export function passStats<Q>(queries: readonly Q[], run: (q: Q) => unknown, passes = 3): Timing {
  timeEach(queries, run);
  const stats: Record<keyof Timing, number[]> = { p50_ms: [], p95_ms: [], cpu_p50_ms: [], cpu_p95_ms: [] };
  for (let i = 0; i < passes; i++) {
    const { wall, cpu } = timeEach(queries, run);
    stats.p50_ms.push(percentile(wall, 50));
    stats.p95_ms.push(percentile(wall, 95));
    stats.cpu_p50_ms.push(percentile(cpu, 50));
    stats.cpu_p95_ms.push(percentile(cpu, 95));
  }
  return {
    p50_ms: round(median(stats.p50_ms)),
    p95_ms: round(median(stats.p95_ms)),
    cpu_p50_ms: round(median(stats.cpu_p50_ms)),
    cpu_p95_ms: round(median(stats.cpu_p95_ms)),
  };
}

export function round(x: number, digits = 3): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}
