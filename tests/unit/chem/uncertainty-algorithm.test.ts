import { describe, expect, it } from "vitest";
import { compareRecovery, propagateUncertainty } from "@/lib/chem/uncertainty";
import { planPerturbation } from "@/lib/chem/perturb";
import { workupInputSchema, type WorkupInput } from "@/lib/chem/schema";
import { toySimulator } from "./fit-toy-simulator";

function workup(provenance: "estimated" | "literature" | "measured", se?: number): WorkupInput {
  return workupInputSchema.parse({
    components: [
      { key: "p", name: "product", role: "product", molarMass: 200, amount: { value: 5, unit: "mmol" },
        logP: { value: 1.0, provenance, ...(se ? { se } : {}) } },
      { key: "acid", name: "acid", role: "impurity", molarMass: 122, amount: { value: 1, unit: "mmol" },
        logP: { value: 1.9, provenance: "literature" }, pKas: [{ value: 6.5, kind: "acid", provenance: "estimated" }] },
    ],
    mixture: { solvents: [{ solvent: "hexane-like", volume: { value: 50, unit: "mL" } }] },
    operations: [{ type: "wash", reagent: "water", volume: { value: 50, unit: "mL" }, portions: 3 }],
  });
}

describe("propagateUncertainty (closed-form simulator)", () => {
  const simulate = toySimulator(7);

  it("is deterministic for a seed and differs between seeds", () => {
    const input = workup("estimated");
    const a = propagateUncertainty(input, simulate, { draws: 300, seed: 5, solventTranslationSd: 0 });
    const b = propagateUncertainty(input, simulate, { draws: 300, seed: 5, solventTranslationSd: 0 });
    const c = propagateUncertainty(input, simulate, { draws: 300, seed: 6, solventTranslationSd: 0 });
    expect(b).toEqual(a);
    expect(c.components.p?.recovery.p025).not.toBe(a.components.p?.recovery.p025);
    expect(a.draws).toBe(300);
    expect(a.seed).toBe(5);
    expect(a.failedDraws).toBe(0);
  });

  it("brackets the nominal recovery, and an estimated log P gives a wider interval than a literature one", () => {
    const nominal = simulate(workup("estimated")).recovery.p ?? 0;
    const wide = propagateUncertainty(workup("estimated"), simulate, { draws: 1000, solventTranslationSd: 0 }).components.p?.recovery;
    const narrow = propagateUncertainty(workup("literature"), simulate, { draws: 1000, solventTranslationSd: 0 }).components.p?.recovery;
    if (!wide || !narrow) throw new Error("missing component");
    expect(wide.p025).toBeLessThan(nominal);
    expect(wide.p975).toBeGreaterThan(nominal);
    // Volumes enter as log-normal factors with unchanged median and log P symmetrically, so the median stays near nominal.
    expect(wide.p50).toBeCloseTo(nominal, 1);
    expect(wide.p975 - wide.p025).toBeGreaterThan(2 * (narrow.p975 - narrow.p025));
    expect(wide.p025 <= wide.p50 && wide.p50 <= wide.p975).toBe(true);
  });

  it("uses a stated se in place of the provenance default", () => {
    const plan = planPerturbation(workup("estimated", 0.05), undefined, 0);
    expect(plan.sites.find((s) => s.path === "components.0.logP")?.sd).toBe(0.05);
    expect(plan.sites.find((s) => s.path === "components.1.pKas.0")?.sd).toBe(0.7);
    expect(plan.sites.find((s) => s.path === "operations.0.volumeMl")?.sd).toBe(0.05);
  });

  it("adds the solvent-translation error only where no solvent-specific log K is given", () => {
    const plan = planPerturbation(workup("literature"), undefined, 0.6);
    expect(plan.sites.find((s) => s.path === "components.0.logP")?.sd).toBeCloseTo(Math.hypot(0.2, 0.6), 12);
  });

  it("names the input that dominates the spread", () => {
    const u = propagateUncertainty(workup("estimated"), simulate, { draws: 1000, solventTranslationSd: 0 });
    expect(u.components.p?.mainSources[0]?.path).toBe("components.0.logP");
    expect(u.components.acid?.mainSources.map((s) => s.path)).toContain("components.1.pKas.0");
  });

  it("leaves the parsed input untouched", () => {
    const input = workup("estimated");
    const before = JSON.stringify(input);
    propagateUncertainty(input, simulate, { draws: 50 });
    expect(JSON.stringify(input)).toBe(before);
  });

  it("places an observed recovery against the interval", () => {
    const u = propagateUncertainty(workup("literature"), simulate, { draws: 500, solventTranslationSd: 0 });
    const r = u.components.p?.recovery;
    if (!r) throw new Error("missing component");
    expect(compareRecovery(u, "p", r.p50).direction).toBe("within");
    const low = compareRecovery(u, "p", r.p025 - 0.05);
    expect(low.outside).toBe(true);
    expect(low.direction).toBe("below");
    expect(low.z).toBeLessThan(-1.5);
    expect(() => compareRecovery(u, "nope", 0.5)).toThrow(/nope/);
  });

  it("refuses a draw count out of range", () => {
    expect(() => propagateUncertainty(workup("literature"), simulate, { draws: 1 })).toThrow(/draws/);
  });
});
