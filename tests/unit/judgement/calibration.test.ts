import { describe, expect, it } from "vitest";
import { calibrationByLevel } from "@/lib/review/aggregate";
import { createRng } from "@/lib/chem/random";
import { normalCdf } from "@/lib/chem/distributions";

describe("calibration by interval level", () => {
  it("puts outcomes drawn from the predictive distribution itself on the diagonal", () => {
    // Probability integral transform: for a correct predictive distribution the CDF at the outcome is uniform
    // (Dawid, J. R. Stat. Soc. A 147 (1984) 278), so a central interval at level L holds a share L of outcomes.
    const rng = createRng(3);
    const rows = Array.from({ length: 5000 }, () => ({ quantile: normalCdf(rng.normal()) }));
    for (const point of calibrationByLevel(rows)) {
      expect(point.n).toBe(5000);
      expect(Math.abs((point.share as number) - point.level)).toBeLessThan(0.02);
    }
  });

  it("shows an over-confident model below the diagonal and ignores outcomes judged without a distribution", () => {
    const rng = createRng(5);
    // Outcomes scattered twice as widely as the model says.
    const rows = [...Array.from({ length: 2000 }, () => ({ quantile: normalCdf(2 * rng.normal()) })), { quantile: null }, {}];
    const at95 = calibrationByLevel(rows).find((p) => p.level === 0.95)!;
    expect(at95.n).toBe(2000);
    // P(|2Z| ≤ 1.96) = P(|Z| ≤ 0.98) ≈ 0.673 (standard normal table).
    expect(at95.share).toBeCloseTo(0.673, 1);
    expect(calibrationByLevel([])[0]).toEqual({ level: 0.5, n: 0, inside: 0, share: null });
  });
});
