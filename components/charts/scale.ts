// Round axis steps and ticks, so that charts read easily and print the same every time.

/** 1, 2 or 5 times a power of ten, at least `raw`. */
export function niceStep(raw: number): number {
  if (!(raw > 0)) return 1;
  const power = 10 ** Math.floor(Math.log10(raw));
  return ([1, 2, 5, 10].find((m) => m * power >= raw - 1e-12) ?? 10) * power;
}

/** About `count` ticks on round numbers covering [lo, hi]; returns the ticks (first and last are the domain). */
export function niceTicks(lo: number, hi: number, count = 5): number[] {
  const step = niceStep((hi - lo) / Math.max(1, count));
  const start = Math.floor(lo / step) * step;
  const end = Math.ceil(hi / step) * step;
  const ticks: number[] = [];
  for (let t = start; t <= end + step / 2; t += step) ticks.push(Number(t.toFixed(10)));
  return ticks;
}
