/**
 * F4 on pH adjustments (common practice: too few equivalents of titrant, or a final pH on the wrong side of
 * the target). An adjustment that reaches its target, or that adds a stated volume with no target, has not run
 * out of acid or base even though the pH ends far from the fresh reagent's.
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { benzoicAcid, naphthalene, workup } from "./fixtures";

const f4 = (raw: WorkupInputRaw) => predictWorkup(raw).flags.filter((f) => f.code === "F4");
const aqueousPh = (raw: WorkupInputRaw, step: number) =>
  predictWorkup(raw).steps[step - 1]?.contacts[0]?.phases.find((p) => p.kind === "aqueous")?.pH ?? Number.NaN;
const adjust = (reagent: string, targetPh: number): WorkupInputRaw =>
  workup([benzoicAcid("product"), naphthalene("impurity")], [["water", 50], ["etoac", 30]], [{ type: "adjust_ph", reagent, targetPh }]);

describe("F4 on adjust_ph", () => {
  it("stays quiet when 1 M HCl by volume brings the saponification mixture to pH ≈ 1.5", () => {
    const raw = JSON.parse(readFileSync("examples/saponification-ph-swing.json", "utf8")) as WorkupInputRaw;
    const step = raw.operations.findIndex((op) => op.type === "adjust_ph") + 1;
    // The pH moved more than one unit from the fresh acid's (pH ≈ 0), the old trigger of the false alarm.
    const pH = aqueousPh(raw, step);
    expect(pH).toBeGreaterThan(1);
    expect(pH).toBeLessThan(2.5);
    expect(f4(raw)).toEqual([]);
  });

  it("stays quiet when the target pH is reached, far from the fresh reagent's pH", () => {
    const raw = adjust("hcl_1m", 2);
    expect(aqueousPh(raw, 1)).toBeCloseTo(2, 3);
    expect(predictWorkup(raw).steps[0]?.details.targetReached).toBe(true);
    expect(f4(raw)).toEqual([]);
    expect(f4(adjust("naoh_1m", 12))).toEqual([]);
  });

  it("fires when the reagent cannot reach the target: bicarbonate buffers near pH 8, not 11 (common practice)", () => {
    const flags = f4(adjust("nahco3_sat", 11));
    expect(flags).toHaveLength(1);
    expect(flags[0]?.step).toBe(1);
    expect(flags[0]?.title).toMatch(/not reached/);
  });
});
