/**
 * Percentiles of a Monte-Carlo sample without sorting it: quickselect (Hoare, "Algorithm 65: Find", Comm. ACM 4
 * (1961) 321) puts each needed order statistic in place in linear time, several times faster than sorting the
 * 1,000 draws. Interpolation between order statistics as in sortedPercentile (distributions.ts).
 */
import { sortedPercentile } from "./distributions";

/** Moves the k-th smallest of a[left..right] to a[k], smaller ones before it and larger ones after it. */
function select(a: Float64Array, k: number, left: number, right: number): void {
  while (right > left) {
    const mid = (left + right) >> 1;
    const pivot = median3(a[left] as number, a[mid] as number, a[right] as number);
    let i = left, j = right;
    while (i <= j) {
      while ((a[i] as number) < pivot) i++;
      while ((a[j] as number) > pivot) j--;
      if (i <= j) {
        const t = a[i] as number;
        a[i++] = a[j] as number;
        a[j--] = t;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return;
  }
}

function median3(x: number, y: number, z: number): number {
  return x < y ? (y < z ? y : x < z ? z : x) : (x < z ? x : y < z ? z : y);
}

/**
 * The percentiles `ps` (ascending, 0–1) of `work`, which is reordered. Falls back to a sort when a value is NaN
 * (comparisons cannot place it).
 */
export function percentiles(work: Float64Array, ps: readonly number[]): number[] {
  const n = work.length;
  if (n === 0) return ps.map(() => Number.NaN);
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(work[i])) {
      work.sort();
      return ps.map((p) => sortedPercentile(work, p));
    }
  }
  let left = 0;
  return ps.map((p) => {
    const h = (n - 1) * p;
    const lo = Math.floor(h);
    select(work, lo, left, n - 1);
    left = lo;
    const a = work[lo] as number;
    if (lo + 1 >= n) return a;
    let b = Infinity;
    for (let i = lo + 1; i < n; i++) if ((work[i] as number) < b) b = work[i] as number;
    return a + (h - lo) * (b - a);
  });
}
