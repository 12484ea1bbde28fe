import { describe, expect, it } from "vitest";
import { poolLogK, type LogKObservation } from "@/lib/chem/pool";
import { createRng } from "@/lib/chem/random";

describe("poolLogK: weighted mean", () => {
  it("reproduces the textbook weighted average of three resistance readings", () => {
    // J. R. Taylor, An Introduction to Error Analysis, 2nd ed. (1997), ch. 7 (weighted averages):
    // 11 ± 1, 12 ± 1, 10 ± 3 ohm → 11.4 ± 0.7 (exactly 217/19 and 3/√19; the arithmetic is
    // reproduced on macosa.dima.unige.it/om/esr/pro/6a_19s.htm).
    const pooled = poolLogK([
      { id: "a", logK: 11, se: 1 },
      { id: "b", logK: 12, se: 1 },
      { id: "c", logK: 10, se: 3 },
    ]);
    expect(pooled.estimate).toBeCloseTo(217 / 19, 10);
    expect(pooled.seInternal).toBeCloseTo(3 / Math.sqrt(19), 10);
    expect(pooled.nUsed).toBe(3);
    expect(pooled.outliers).toEqual([]);
    // Knapp–Hartung dispersion: Σw(y − ȳ)²/(n − 1).
    const ybar = 217 / 19;
    const q = ((11 - ybar) ** 2 + (12 - ybar) ** 2 + (10 - ybar) ** 2 / 9) / 2;
    expect(pooled.dispersion).toBeCloseTo(q, 10);
    expect(pooled.se).toBeCloseTo((3 / Math.sqrt(19)) * Math.sqrt(q), 10);
    expect(pooled.df).toBe(2);
  });

  it("uses the stated error and the normal quantile for a single observation", () => {
    const pooled = poolLogK([{ id: "only", logK: 1.2, se: 0.2 }]);
    expect(pooled.estimate).toBe(1.2);
    expect(pooled.se).toBeCloseTo(0.2, 12);
    // 1.959964: NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.1 (normal critical values).
    expect(pooled.interval?.[1]).toBeCloseTo(1.2 + 1.959964 * 0.2, 5);
  });

  it("counts an inferred observation half as much as a measured one with the same stated error", () => {
    const pooled = poolLogK([
      { id: "m", logK: 2.0, se: 0.2, source: "measured" },
      { id: "i", logK: 3.0, se: 0.2, source: "inferred" },
    ]);
    expect(pooled.estimate).toBeCloseTo((2.0 * 1 + 3.0 * 0.5) / 1.5, 10);
  });

  it("recovers a known log K from synthetic data", () => {
    const rng = createRng(7);
    const truth = 2.35;
    const obs: LogKObservation[] = Array.from({ length: 25 }, (_, i) => {
      const se = 0.1 + 0.2 * rng.uniform();
      return { id: `r${i}`, logK: truth + se * rng.normal(), se };
    });
    const pooled = poolLogK(obs);
    expect(pooled.estimate).not.toBeNull();
    expect(Math.abs((pooled.estimate ?? 0) - truth)).toBeLessThan(3 * (pooled.se ?? 0));
    expect(pooled.se).toBeLessThan(0.06);
  });
});

describe("poolLogK: outliers and bounds", () => {
  it("marks a gross outlier and leaves it out", () => {
    const obs: LogKObservation[] = [1.78, 1.85, 1.71, 1.9, 1.8, 1.83].map((y, i) => ({ id: `ok${i}`, logK: y, se: 0.1 }));
    obs.push({ id: "typo", logK: 4.8, se: 0.1 });
    const pooled = poolLogK(obs);
    expect(pooled.outliers).toEqual(["typo"]);
    expect(pooled.nUsed).toBe(6);
    expect(pooled.n).toBe(7);
    expect(pooled.estimate).toBeCloseTo((1.78 + 1.85 + 1.71 + 1.9 + 1.8 + 1.83) / 6, 10);
  });

  it("rarely marks ordinary observations as outliers", () => {
    const rng = createRng(99);
    let runsWithOutlier = 0;
    for (let r = 0; r < 500; r++) {
      const obs = Array.from({ length: 8 }, (_, i) => ({ id: `${i}`, logK: 1 + 0.2 * rng.normal(), se: 0.2 }));
      if (poolLogK(obs).outliers.length > 0) runsWithOutlier++;
    }
    expect(runsWithOutlier / 500).toBeLessThan(0.03);
  });

  it("reports bounds separately and says when only bounds exist", () => {
    const pooled = poolLogK([
      { id: "b1", logK: 2.0, kind: "lower_bound" },
      { id: "b2", logK: 2.6, kind: "lower_bound" },
      { id: "b3", logK: 4.0, kind: "upper_bound" },
    ]);
    expect(pooled.estimate).toBeNull();
    expect(pooled.interval).toBeNull();
    expect(pooled.lowerBound).toBe(2.6);
    expect(pooled.upperBound).toBe(4.0);
    expect(pooled.n).toBe(3);
    expect(pooled.nUsed).toBe(0);
    expect(pooled.method).toBe("bounds only");
  });

  it("states a conflict between the estimate and a bound", () => {
    const pooled = poolLogK([
      { id: "v1", logK: 1.0, se: 0.1 },
      { id: "v2", logK: 1.1, se: 0.1 },
      { id: "v3", logK: 0.95, se: 0.1 },
      { id: "lb", logK: 3.0, kind: "lower_bound" },
    ]);
    expect(pooled.lowerBound).toBe(3.0);
    expect(pooled.boundConflict).toMatch(/below the lower bound/);
  });

  it("names the observation when an input is invalid", () => {
    expect(() => poolLogK([{ id: "bad", logK: 1, se: 0 }])).toThrow(/bad.*se/);
    expect(() => poolLogK([{ id: "nan", logK: Number.NaN }])).toThrow(/nan.*logK/);
  });
});

/**
 * Coverage study: repeats with a known log K, 1–10 observations each, 60 % measured
 * (se 0.1–0.3) and 40 % inferred from recoveries (stated se 0.3–0.6, true scatter √2 larger, which
 * is what the half weight of inferred observations assumes). The 95 % interval must cover the truth
 * in 93–97 % of repeats. Also with stated errors twice too small in variance, and with 10 % gross
 * outliers (±1.5–3 log units).
 */
function coverage(seed: number, repeats: number, dispersion: number, contamination: number): number {
  const rng = createRng(seed);
  let covered = 0;
  for (let r = 0; r < repeats; r++) {
    const truth = 4 * rng.uniform();
    const n = 1 + Math.floor(10 * rng.uniform());
    const obs: LogKObservation[] = [];
    for (let i = 0; i < n; i++) {
      const inferred = rng.uniform() < 0.4;
      const se = inferred ? 0.3 + 0.3 * rng.uniform() : 0.1 + 0.2 * rng.uniform();
      const sd = (inferred ? se * Math.SQRT2 : se) * Math.sqrt(dispersion);
      let y = truth + sd * rng.normal();
      if (rng.uniform() < contamination) y += (rng.uniform() < 0.5 ? -1 : 1) * (1.5 + 1.5 * rng.uniform());
      obs.push({ id: `o${i}`, logK: y, se, source: inferred ? "inferred" : "measured" });
    }
    const interval = poolLogK(obs).interval;
    if (interval && interval[0] <= truth && truth <= interval[1]) covered++;
  }
  return covered / repeats;
}

describe("poolLogK: coverage of the 95 % interval", () => {
  it("covers the truth in 93–97 % of repeats when stated errors are right", () => {
    const c = coverage(20261201, 4000, 1, 0);
    expect(c).toBeGreaterThanOrEqual(0.93);
    expect(c).toBeLessThanOrEqual(0.97);
  });

  it("holds coverage when stated errors are too small or some records are gross outliers", () => {
    expect(coverage(31, 3000, 2, 0)).toBeGreaterThanOrEqual(0.92);
    expect(coverage(32, 3000, 1, 0.1)).toBeGreaterThanOrEqual(0.92);
  });
});
