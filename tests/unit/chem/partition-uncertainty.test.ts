/**
 * The partition model's standard error in the Monte Carlo: a log P that stands in for a solvent log K carries the
 * error of the model that translates it. Check values: the validated Abraham standard error of heptane (RMSE 0.26
 * over 60 measured heptane–water values: Chiou & Block 1986 in C. T. Chiou, Partition and Adsorption of Organic
 * Contaminants in Environmental Systems, Wiley 2002, Table 5.2, and the Minnesota Solvation Database 2012) against
 * the Collander line's assumed 1.0.
 */
import { describe, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { planPerturbation, DEFAULT_UNCERTAINTY } from "@/lib/chem/perturb";
import { workupInputSchema, type WorkupInputRaw } from "@/lib/chem/schema";

const lit = (value: number) => ({ value, provenance: "literature" as const });
const input = (component: Record<string, unknown>): WorkupInputRaw => ({
  components: [{ key: "p", name: "p", role: "product", molarMass: 100, amount: { value: 1, unit: "mmol" }, logP: lit(2.69), ...component }],
  mixture: { solvents: [{ solvent: "heptane", volume: { value: 50, unit: "mL" } }] },
  operations: [{ type: "wash", reagent: "water", volume: { value: 20, unit: "mL" } }],
});
const logPSd = (raw: WorkupInputRaw): number => {
  const line = SOLVENTS.heptane!.partition!.se;
  return planPerturbation(workupInputSchema.parse(raw), DEFAULT_UNCERTAINTY, line).sites.find((s) => s.path === "components.0.logP")?.sd ?? Number.NaN;
};

describe("solvent-translation error per component", () => {
  it("no descriptors: the Collander line's error (assumed 1.0 for the alkanes) on top of log P's own 0.2", () => {
    expect(logPSd(input({}))).toBeCloseTo(Math.hypot(0.2, 1.0), 6);
  });
  it("estimated descriptors (anchored on log P): their validated 0.64 instead of the alkane line's assumed 1.0", () => {
    // 0.64: RMSE of log K from group-contribution descriptors anchored on the measured octanol log P, over the
    // validation rows of compounds without measured descriptors (MNSol, seven solvents, n = 98; bench:partition).
    const estimated = { abraham: { E: 0.601, S: 0.52, A: 0, B: 0.14, V: 0.8573, provenance: "estimated" } };
    expect(logPSd(input(estimated))).toBeCloseTo(Math.hypot(0.2, 0.64), 6);
  });
  it("measured descriptors (toluene): log P does not drive the heptane log K, so it carries only its own error", () => {
    expect(logPSd(input({ smiles: "Cc1ccccc1" }))).toBeCloseTo(0.2, 6);
  });
});
