/** Monte Carlo uncertainty through the real engine, on the example work-ups. */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import type { WorkupInput } from "@/lib/chem/schema";
import { propagateUncertainty, solventTranslationSd } from "@/lib/chem/uncertainty";

function example(name: string): WorkupInput {
  const v = validateWorkup(JSON.parse(readFileSync(`examples/${name}.json`, "utf8")));
  if (!v.success) throw new Error(JSON.stringify(v.issues));
  return v.data;
}

describe("propagateUncertainty with simulateWorkup", () => {
  it("gives ordered, reproducible intervals that contain the nominal recovery", () => {
    const input = example("acid-base-separation");
    const nominal = simulateWorkup(input).recovery;
    const a = propagateUncertainty(input, simulateWorkup, { draws: 300, seed: 42 });
    expect(propagateUncertainty(input, simulateWorkup, { draws: 300, seed: 42 })).toEqual(a);
    expect(a.failedDraws).toBe(0);
    for (const [key, r] of Object.entries(nominal)) {
      const i = a.components[key]?.recovery;
      if (!i) throw new Error(`no interval for ${key}`);
      expect(i.p025).toBeLessThanOrEqual(r + 1e-9);
      expect(i.p975).toBeGreaterThanOrEqual(r - 1e-9);
      expect(i.p975).toBeLessThanOrEqual(1);
    }
    // The amines and the acid are removed in every draw: their intervals stay near zero.
    for (const key of ["aniline", "triethylamine"]) expect(a.components[key]?.recovery.p975).toBeLessThan(0.05);
  });

  it("widens the product's interval when its log P is only estimated", () => {
    const input = example("saponification-ph-swing");
    const withProvenance = (provenance: "estimated" | "measured"): WorkupInput => ({
      ...input,
      components: input.components.map((c) => (c.key === "benzoic-acid" && c.logP ? { ...c, logP: { ...c.logP, provenance }, pKas: c.pKas.map((p) => ({ ...p, provenance })) } : c)),
    });
    const width = (w: WorkupInput) => {
      const r = propagateUncertainty(w, simulateWorkup, { draws: 300, seed: 7 }).components["benzoic-acid"]?.recovery;
      return (r?.p975 ?? 0) - (r?.p025 ?? 0);
    };
    expect(width(withProvenance("estimated"))).toBeGreaterThan(width(withProvenance("measured")));
  });

  it("uses the engine's per-solvent partition error for log P translated to the extraction solvent", () => {
    const input = example("acid-base-separation");
    expect(solventTranslationSd(input)).toBe(SOLVENTS.etoac?.partition?.se);
    const u = propagateUncertainty(input, simulateWorkup, { draws: 20 });
    const site = u.inputs.find((s) => s.path === "components.0.logP");
    // Estimated log P (0.7, issue 3) combined with the EtOAc line's standard error.
    expect(site?.sd).toBeCloseTo(Math.hypot(0.7, SOLVENTS.etoac?.partition?.se ?? 0), 12);
    expect(u.inputs.some((s) => s.path === "operations.0.volumeMl" && s.sd === 0.05)).toBe(true);
  });
});
