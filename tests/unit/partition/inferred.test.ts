import { describe, expect, it } from "vitest";
import { simulateWorkup } from "@/lib/chem/predict";
import { inferFromOutcome, INFERRED_WEIGHT, type InferenceInput } from "@/lib/partition/inferred";
import { extraction, PRODUCT, recoveryAt } from "./synthetic";

const spec = extraction(60, 10, 2);
const base = (recovery: number, extra: Partial<InferenceInput> = {}): InferenceInput => ({
  spec, productKey: PRODUCT, recovery, basis: "assayed", purityMethod: "qnmr", flags: [], ...extra,
});

describe("which outcomes may teach the group a partition coefficient", () => {
  const mid = recoveryAt(spec, 0.6);

  it("fits a value, at half a measurement's weight, from an assayed recovery in the informative range", () => {
    const r = inferFromOutcome(base(mid), simulateWorkup);
    expect(r).toMatchObject({ use: true, bound: "value", solvent: "etoac", weight: INFERRED_WEIGHT });
    if (r.use) expect(r.logK).toBeCloseTo(0.6, 5);
  });

  it("gives only a lower bound when the recovery is within the noise of what any large K gives", () => {
    const r = inferFromOutcome(base(recoveryAt(spec, 6)), simulateWorkup);
    expect(r).toMatchObject({ use: true, bound: "lower", se: null });
    if (r.use) expect(r.logK).toBeGreaterThan(1);
  });

  it("without an in-process assay, bounds K from below at the low end of the interval", () => {
    const fitted = inferFromOutcome(base(mid), simulateWorkup);
    const bounded = inferFromOutcome(base(mid, { basis: "expected" }), simulateWorkup);
    expect(bounded).toMatchObject({ use: true, bound: "lower", se: null });
    if (fitted.use && bounded.use) {
      expect(bounded.logK).toBeLessThan(fitted.logK);
      expect(bounded.logK).toBeCloseTo(fitted.fit.interval?.[0] ?? NaN, 9);
    }
    expect(inferFromOutcome(base(0.001, { basis: "expected" }), simulateWorkup)).toMatchObject({ use: false });
  });

  it("leaves out weight-only outcomes, unclosed mass balances and records whose prediction warns of other losses", () => {
    expect(inferFromOutcome(base(mid, { purityMethod: "weight_only" }), simulateWorkup)).toEqual({ use: false, reason: "purity was not measured, so the isolated mass is not the product's alone" });
    expect(inferFromOutcome(base(1.2), simulateWorkup)).toEqual({ use: false, reason: "the reported recovery of 120 % does not close the mass balance" });
    expect(inferFromOutcome(base(mid, { flags: [{ code: "F10" }, { code: "F5", component: PRODUCT }] }), simulateWorkup))
      .toEqual({ use: false, reason: "the prediction warns of losses other than partition (F10)" });
    // A warning about another component does not count against the product.
    expect(inferFromOutcome(base(mid, { flags: [{ code: "F14", component: "solvent_impurity" }] }), simulateWorkup).use).toBe(true);
  });
});
