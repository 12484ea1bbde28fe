/**
 * adjust_ph with a target: the volume found is the least that reaches the target (within a factor 1 + 1e-6), as
 * checked by adding that volume, and a hair less, as plain volumes. Covers the charge-balance search (no
 * carbonate) and the pH search (bicarbonate, whose CO₂ leaves after mixing).
 */
import { describe, expect, it } from "vitest";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { benzoicAcid, lidocaine, mL, naphthalene } from "./fixtures";

const components = [benzoicAcid("product"), lidocaine("impurity"), naphthalene("impurity")];

function adjust(reagent: string, by: { targetPh: number } | { volume: ReturnType<typeof mL> }, acidic: boolean): WorkupInputRaw {
  return {
    components,
    mixture: { solvents: [{ solvent: "etoac", volume: mL(30) }], reagents: [{ reagent: acidic ? "hcl_1m" : "water", volume: mL(40) }] },
    operations: [{ type: "adjust_ph", reagent, ...by }],
  };
}

const stepPh = (raw: WorkupInputRaw) => predictWorkup(raw).steps[0]?.contacts[0]?.phases.find((p) => p.kind === "aqueous")?.pH ?? NaN;

describe("adjust_ph to a target pH", () => {
  const cases: Array<[string, number, boolean]> = [
    ["naoh_1m", 7.5, false], ["naoh_1m", 12, true], ["hcl_1m", 2, false], ["hcl_1m", 5, false], ["naoh_1m", 9, false], ["nahco3_sat", 6, true], ["na2co3_sat", 10, true],
  ];
  for (const [reagent, targetPh, acidic] of cases) {
    it(`${reagent} to pH ${targetPh}${acidic ? " from 1 M HCl" : ""}: the least volume that reaches it`, () => {
      const p = predictWorkup(adjust(reagent, { targetPh }, acidic));
      const details = p.steps[0]?.details;
      expect(details?.targetReached).toBe(true);
      const volume = details?.reagentVolumeMl as number;
      expect(volume).toBeGreaterThan(0);
      const raising = reagent !== "hcl_1m";
      const reached = (pH: number) => (raising ? pH >= targetPh - 1e-9 : pH <= targetPh + 1e-9);
      const at = stepPh(adjust(reagent, { volume: mL(volume) }, acidic));
      expect(at).toBeCloseTo(targetPh, 3);
      expect(reached(at)).toBe(true);
      expect(reached(stepPh(adjust(reagent, { volume: mL(volume * (1 - 3e-6)) }, acidic)))).toBe(false);
    });
  }
});
