import { describe, expect, it } from "vitest";
import { fitLogK, withLogK } from "@/lib/chem/fit";
import { workupInputSchema, type WorkupInput } from "@/lib/chem/schema";
import { toySimulator } from "./fit-toy-simulator";

function workup(washes: number, washMl: number, pKa?: number): WorkupInput {
  return workupInputSchema.parse({
    components: [{
      key: "p", name: "product", role: "product", molarMass: 200, amount: { value: 5, unit: "mmol" },
      logP: { value: 1.0, provenance: "estimated" },
      pKas: pKa === undefined ? [] : [{ value: pKa, kind: "acid", provenance: "literature" }],
    }],
    mixture: { solvents: [{ solvent: "etoac", volume: { value: 50, unit: "mL" } }] },
    operations: [{ type: "wash", reagent: "water", volume: { value: washMl, unit: "mL" }, portions: washes }],
  });
}

describe("fitLogK against a closed-form simulator", () => {
  const simulate = toySimulator(7);

  it.each([0.3, 1.0, 1.7])("recovers log K = %s from a recovery generated with it", (truth) => {
    const input = workup(4, 50);
    const observed = simulate(withLogK(input, "p", "etoac", truth)).recovery.p ?? 0;
    // Sanity: the textbook wash-loss formula (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”): kept = (1 + V_w/(K·V_org))^−n.
    expect(observed).toBeCloseTo((1 + 50 / (10 ** truth * 50)) ** -4, 12);
    const fit = fitLogK(input, simulate, { component: "p", observedRecovery: observed, solvent: "etoac" });
    expect(fit.kind).toBe("value");
    expect(fit.logK).toBeCloseTo(truth, 5);
    expect(fit.se).toBeGreaterThan(0);
    const [lo, hi] = fit.interval ?? [null, null];
    expect(lo).not.toBeNull();
    expect((lo ?? 0) < truth && truth < (hi ?? Infinity)).toBe(true);
    expect(fit.logD).toBeCloseTo(truth, 5);
    expect(fit.pH).toBe(7);
  });

  it("gives a standard error that shrinks where recovery is most sensitive to K", () => {
    const input = workup(4, 50);
    const fitAt = (truth: number) =>
      fitLogK(input, simulate, { component: "p", observedRecovery: simulate(withLogK(input, "p", "etoac", truth)).recovery.p ?? 0, solvent: "etoac" });
    // K = 10^0.5: about a third kept, recovery changes fast; K = 10^1.7: 87 % kept, flatter.
    expect(fitAt(0.5).se ?? 0).toBeLessThan(fitAt(1.7).se ?? 0);
  });

  it("reports only a lower bound when the recovery is within the noise of 100 %", () => {
    const input = workup(2, 25);
    const fit = fitLogK(input, simulate, { component: "p", observedRecovery: 0.99, recoverySe: 0.03, solvent: "etoac" });
    expect(fit.kind).toBe("lower_bound");
    // At the bound the predicted recovery equals the observation less 1.96 σ.
    const atBound = simulate(withLogK(input, "p", "etoac", fit.logK ?? 0)).recovery.p ?? 0;
    expect(atBound).toBeCloseTo(0.99 - 1.959964 * 0.03, 4);
    expect(fit.reason).toMatch(/only bounds K/);
  });

  it("reports only an upper bound when almost nothing is recovered", () => {
    const fit = fitLogK(workup(5, 100), simulate, { component: "p", observedRecovery: 0.01, solvent: "etoac" });
    expect(fit.kind).toBe("upper_bound");
    expect(fit.logK).toBeLessThan(1);
  });

  it("says a record is uninformative when the component is ionized at the wash pH", () => {
    // An acid of pKa 4 washed at pH 14: D ≤ 10^8/10^10, so recovery is ~0 whatever K is.
    const fit = fitLogK(workup(3, 50, 4), toySimulator(14), { component: "p", observedRecovery: 0.0, solvent: "etoac" });
    expect(fit.kind).toBe("uninformative");
    expect(fit.logK).toBeNull();
    expect(fit.reason).toMatch(/ionized/);
  });

  it("refuses an unknown component and an impossible recovery", () => {
    const input = workup(1, 10);
    expect(() => fitLogK(input, simulate, { component: "nope", observedRecovery: 0.5 })).toThrow(/nope/);
    expect(() => fitLogK(input, simulate, { component: "p", observedRecovery: -0.1 })).toThrow(/recovery/);
  });
});
