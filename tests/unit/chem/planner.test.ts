import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { fractionExtractedAfter, fractionKeptAfterWashes, splitComparison } from "@/lib/chem/planner-math";
import { planWorkup } from "@/lib/chem/planner";
import { workupInputSchema, type WorkupInputRaw } from "@/lib/chem/schema";

describe("stage arithmetic the planner reasons with", () => {
  it("reproduces the textbook single versus multiple extraction (K = 4)", () => {
    // multi-portion extraction, Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”; arithmetic derived: K = 4, 100 mL aqueous; one 100 mL portion
    // extracts 80.0 %, three 33.3 mL portions 92.1 %.
    const split = splitComparison(4, 100, 100, 3);
    expect(split[0]?.recovery).toBeCloseTo(0.8, 10);
    expect(split[2]?.recovery).toBeCloseTo(0.921, 3);
    // K = 2 under the same split: 67 % versus 78 % (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”; derived).
    const k2 = splitComparison(2, 100, 100, 3);
    expect(k2[0]?.recovery).toBeCloseTo(0.667, 3);
    expect(k2[2]?.recovery).toBeCloseTo(0.78, 2);
  });

  it("reproduces the Harris extraction-efficiency example (K = 3, 100 mL water)", () => {
    // Harris, Quantitative Chemical Analysis, “Extraction efficiency” example (attribution from memory; arithmetic derived):
    // one 500 mL extraction leaves 6.25 %; five 100 mL extractions leave 0.098 %.
    expect(1 - fractionExtractedAfter(3, 100, 500, 1)).toBeCloseTo(0.0625, 10);
    expect(1 - fractionExtractedAfter(3, 100, 100, 5)).toBeCloseTo(0.000977, 6);
  });

  it("gives the wash-loss figure for a moderately polar product", () => {
    // wash-loss formula (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”), derived: K = 10, four equal-volume washes keep (10/11)^4 ≈ 68 %.
    expect(fractionKeptAfterWashes(10, 50, 50, 4)).toBeCloseTo(0.683, 3);
  });

  it("always prefers more, smaller portions for the same total volume", () => {
    for (const d of [0.3, 1, 4, 30]) {
      const r = splitComparison(d, 80, 120, 6).map((o) => o.recovery);
      for (let i = 1; i < r.length; i++) expect(r[i]).toBeGreaterThan(r[i - 1] ?? 1);
      // The limit exp(−D·V/V_aq) bounds what is left (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5).
      expect(1 - (r[5] ?? 0)).toBeGreaterThan(Math.exp(-d * 120 / 80));
    }
  });
});

const example = (name: string): { raw: WorkupInputRaw & { plan?: Record<string, unknown> } } => ({
  raw: JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as WorkupInputRaw & { plan?: Record<string, unknown> },
});

describe("planWorkup (closed form, no simulation)", () => {
  it("puts the base wash two units above the acid's pKa and the acid wash two units below the amines' pKaH", () => {
    const { raw } = example("acid-base-separation");
    const plan = planWorkup(workupInputSchema.parse(raw), { targetRecovery: 0.95, maxImpurityLeft: 0.01 });
    const acidWash = plan.washes.find((w) => w.purpose === "remove_bases");
    const baseWash = plan.washes.find((w) => w.purpose === "remove_acids");
    if (!acidWash?.window || !baseWash?.window || !acidWash.reagent || !baseWash.reagent) throw new Error("expected both washes");
    // Benzoic acid pKa 4.20 [IUPAC-pKa B91]: removal needs pH ≥ 6.2 at least (two-unit rule, LCGC N. Am. 2021, 39(4), 198).
    expect(baseWash.window.low).toBeGreaterThanOrEqual(6.2);
    expect(baseWash.reagent.pH).toBeGreaterThanOrEqual(baseWash.window.low);
    // Aniline pKaH 4.60 [IUPAC-pKa B65]: removal needs pH ≤ 2.6.
    expect(acidWash.window.high).toBeLessThanOrEqual(2.6);
    expect(acidWash.reagent.pH).toBeLessThanOrEqual(acidWash.window.high);
    expect(acidWash.impurities.sort()).toEqual(["aniline", "triethylamine"]);
    expect(acidWash.reasons.join(" ")).toMatch(/two units below its pKaH/);
    expect(baseWash.reasons.join(" ")).toMatch(/two units above its pKa/);
    for (const w of plan.washes) {
      expect(w.productKept).toBeGreaterThan(0.98);
      for (const left of Object.values(w.impurityLeft)) expect(left).toBeLessThanOrEqual(0.01);
    }
    // The old acid and base washes are replaced, the brine wash stays.
    expect(plan.changes.filter((c) => c.action === "remove").map((c) => c.step)).toEqual([1, 2]);
  });

  it("recommends several portions to reach a recovery one portion cannot", () => {
    // A neutral product with K = 4 (a group value) in 100 mL of water, extracted once with 100 mL EtOAc
    // in the procedure: one portion gives 80 %, so ≥ 95 % needs more, smaller portions (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5).
    const raw: WorkupInputRaw = {
      components: [{ key: "p", name: "product", role: "product", molarMass: 150, amount: { value: 2, unit: "mmol" },
        logK: { etoac: { value: Math.log10(4), provenance: "group" } } }],
      mixture: { solvents: [{ solvent: "water", volume: { value: 100, unit: "mL" } }] },
      operations: [{ type: "extract", solvent: "etoac", volume: { value: 100, unit: "mL" }, portions: 1 }],
    };
    const plan = planWorkup(workupInputSchema.parse(raw), { targetRecovery: 0.9 });
    const x = plan.extraction;
    if (!x) throw new Error("expected an extraction plan");
    expect(x.alternatives[0]?.recovery).toBeLessThan(x.recovery);
    expect(x.portions).toBeGreaterThan(1);
    expect(x.recovery).toBeGreaterThanOrEqual(0.9);
    expect(x.reasons.join(" ")).toMatch(/Several small portions beat one large one/);
    expect(plan.changes.find((c) => c.action === "replace")?.operation).toMatchObject({ type: "extract", portions: x.portions });
  });

  it("says when no pH helps a zwitterionic product", () => {
    // Glycine: pKa 2.35 (COOH) and 9.78 (NH3+) [IUPAC-pKa K26/O11]; log P −3.21 [PhysProp].
    const raw: WorkupInputRaw = {
      components: [{ key: "gly", name: "Glycine", role: "product", molarMass: 75.07, amount: { value: 1, unit: "mmol" },
        logP: { value: -3.21, provenance: "literature" },
        pKas: [{ value: 2.35, kind: "acid", provenance: "literature" }, { value: 9.78, kind: "base", provenance: "literature" }] }],
      mixture: { solvents: [{ solvent: "water", volume: { value: 20, unit: "mL" } }] },
      operations: [{ type: "extract", solvent: "etoac", volume: { value: 20, unit: "mL" }, portions: 3 }],
    };
    const plan = planWorkup(workupInputSchema.parse(raw));
    expect(plan.extraction?.reasons.join(" ")).toMatch(/zwitterionic.*F18/);
    expect(plan.extraction?.recovery).toBeLessThan(0.5);
  });

  it("explains that neutral impurities need another method", () => {
    const raw: WorkupInputRaw = {
      components: [
        { key: "ketone", name: "Benzophenone", role: "product", molarMass: 182.22, amount: { value: 2, unit: "mmol" }, logP: { value: 3.18, provenance: "literature" } },
        { key: "naph", name: "Naphthalene", role: "impurity", molarMass: 128.17, amount: { value: 0.2, unit: "mmol" }, logP: { value: 3.30, provenance: "literature" } },
      ],
      mixture: { solvents: [{ solvent: "etoac", volume: { value: 40, unit: "mL" } }] },
      operations: [{ type: "concentrate" }],
    };
    const plan = planWorkup(workupInputSchema.parse(raw));
    expect(plan.washes).toEqual([]);
    expect(plan.neutralImpurities[0]?.reason).toMatch(/chromatography/);
  });

  it("refuses an unknown product and a bad target", () => {
    const input = workupInputSchema.parse(example("acid-base-separation").raw);
    expect(() => planWorkup(input, { product: "nope" })).toThrow(/nope/);
    expect(() => planWorkup(input, { targetRecovery: 1.5 })).toThrow(/targetRecovery/);
  });
});
