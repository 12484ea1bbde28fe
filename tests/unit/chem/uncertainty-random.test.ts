import { describe, expect, it } from "vitest";
import { normalQuantile, sortedPercentile, studentTCdf, studentTQuantile } from "@/lib/chem/distributions";
import { createRng } from "@/lib/chem/random";

describe("createRng", () => {
  it("gives the same stream for the same seed and a different one for another seed", () => {
    const a = createRng(42);
    const b = createRng(42);
    const c = createRng(43);
    const first = Array.from({ length: 5 }, () => a.uniform());
    expect(Array.from({ length: 5 }, () => b.uniform())).toEqual(first);
    expect(Array.from({ length: 5 }, () => c.uniform())).not.toEqual(first);
  });

  it("draws uniforms in [0, 1) and standard normals with the right moments", () => {
    const rng = createRng(1);
    const n = 200_000;
    let su = 0, sz = 0, szz = 0, tail = 0, outside = 0;
    for (let i = 0; i < n; i++) {
      const u = rng.uniform();
      if (!(u >= 0 && u < 1)) outside++;
      su += u;
      const z = rng.normal();
      sz += z;
      szz += z * z;
      if (Math.abs(z) > 1.959964) tail++;
    }
    expect(outside).toBe(0);
    expect(su / n).toBeCloseTo(0.5, 2);
    expect(sz / n).toBeCloseTo(0, 2);
    expect(szz / n).toBeCloseTo(1, 1);
    expect(tail / n).toBeCloseTo(0.05, 2);
  });

  it("refuses a non-finite seed", () => {
    expect(() => createRng(Number.NaN)).toThrow(/seed/);
  });
});

describe("distributions", () => {
  // Two-sided 95 % critical values: NIST/SEMATECH e-Handbook of Statistical Methods,
  // §1.3.6.7.2 "Critical values of the Student's t distribution" and §1.3.6.7.1 (normal).
  const table: Array<[number, number]> = [[1, 12.706], [2, 4.303], [3, 3.182], [5, 2.571], [10, 2.228], [30, 2.042], [100, 1.984], [Infinity, 1.960]];
  it.each(table)("t quantile 0.975 with %s df is %s", (df, value) => {
    expect(studentTQuantile(0.975, df)).toBeCloseTo(value, 3);
    expect(studentTQuantile(0.025, df)).toBeCloseTo(-value, 3);
  });

  it("inverts its own CDF", () => {
    for (const df of [1.5, 3, 7, 25]) {
      for (const p of [0.01, 0.2, 0.5, 0.9, 0.995]) expect(studentTCdf(studentTQuantile(p, df), df)).toBeCloseTo(p, 9);
    }
  });

  it("gives the normal quantiles of the standard table", () => {
    // NIST/SEMATECH e-Handbook §1.3.6.7.1: z(0.995) = 2.576, z(0.95) = 1.645.
    expect(normalQuantile(0.995)).toBeCloseTo(2.5758, 4);
    expect(normalQuantile(0.95)).toBeCloseTo(1.6449, 4);
    expect(normalQuantile(0.5)).toBe(0);
  });

  it("interpolates percentiles between order statistics", () => {
    // Hyndman & Fan definition 7 on 1..5: the 0.25 quantile is 2, the 0.1 quantile 1.4.
    const sorted = [1, 2, 3, 4, 5];
    expect(sortedPercentile(sorted, 0.25)).toBeCloseTo(2, 12);
    expect(sortedPercentile(sorted, 0.1)).toBeCloseTo(1.4, 12);
    expect(sortedPercentile([], 0.5)).toBeNaN();
  });
});
