/**
 * The Newton charge-balance solver (solvePhWithSlope) against the bracketed Brent solver (solvePh) on random
 * aqueous solutions: strong acid or base, weak acid–base systems of the reagent table, and starting guesses near,
 * far and missing. Both must find the same pH, and both clamp to [−2, 16] when the root lies beyond.
 */
import { describe, expect, it } from "vitest";
import { KW, PH_MAX, PH_MIN, solvePh, solvePhWithSlope, systemMeanCharge, type SlopedChargeBalance } from "@/lib/chem/aqueous";
import { N_SYSTEMS } from "@/lib/chem/library";
import { createRng } from "@/lib/chem/random";

/** Net charge (mol/L) of strong ions plus weak systems; slope by a central difference (accurate to ~1e-10). */
class Solution implements SlopedChargeBalance {
  slope = 0;
  rootH = Number.NaN;
  constructor(readonly strong: number, readonly systems: Float64Array) {}
  residual(pH: number): number {
    const h = 10 ** -pH;
    let f = this.strong + h - KW / h;
    for (let s = 0; s < N_SYSTEMS; s++) f += (this.systems[s] ?? 0) * systemMeanCharge(s, h);
    return f;
  }
  residualAt(pH: number): number {
    const d = 1e-6;
    this.slope = (this.residual(pH + d) - this.residual(pH - d)) / (2 * d);
    return this.residual(pH);
  }
}

describe("solvePhWithSlope", () => {
  it("finds the pH Brent's method finds, from any starting guess", () => {
    const rng = createRng(21);
    for (let t = 0; t < 400; t++) {
      const systems = Float64Array.from({ length: N_SYSTEMS }, () => (rng.uniform() < 0.3 ? rng.uniform() * 0.5 : 0));
      const strong = (rng.uniform() - 0.5) * 10 ** (rng.uniform() * 6 - 5);
      const solution = new Solution(strong, systems);
      const reference = solvePh(solution, NaN, 1e-12);
      for (const guess of [NaN, reference + 0.05, reference - 1.7, rng.uniform() * 14, 15.9, -1.9]) {
        const pH = solvePhWithSlope(solution, guess);
        expect(pH, `case ${t}, guess ${guess}`).toBeCloseTo(reference, 8);
        expect(solution.rootH / 10 ** -pH).toBeCloseTo(1, 9);
      }
    }
  });

  it("clamps to the range like solvePh when the root lies beyond it", () => {
    const none = new Float64Array(N_SYSTEMS);
    for (const strong of [-500, 500]) {
      const solution = new Solution(strong, none);
      expect(solvePh(solution)).toBe(strong < 0 ? PH_MIN : PH_MAX);
      expect(solvePhWithSlope(solution, 7)).toBe(strong < 0 ? PH_MIN : PH_MAX);
    }
  });
});
