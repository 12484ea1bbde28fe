/** The planner with its simulated check, against textbook statements. */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { planWorkup } from "@/lib/chem/planner";
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import type { WorkupInput, WorkupInputRaw } from "@/lib/chem/schema";
import type { WorkupSimulator } from "@/lib/chem/uncertainty";

function parse(raw: unknown): WorkupInput {
  const v = validateWorkup(raw);
  if (!v.success) throw new Error(JSON.stringify(v.issues));
  return v.data;
}
/** Textbook conditions: solvent and water immiscible, so volumes are as written. */
const ideal: WorkupSimulator = (input, options) => simulateWorkup(input, { ...options, idealPhases: true });

describe("planWorkup with the simulated check", () => {
  it("turns one 100 mL extraction of a K = 4 solute into several smaller ones (textbook 80 % vs 92 %)", () => {
    // workup-practice §2.3; reference-data §6a: K = 4, 100 mL water, 1 × 100 mL → 80 %, 3 × 33.3 mL → 92.1 %.
    const raw: WorkupInputRaw = {
      components: [{ key: "p", name: "Neutral product", role: "product", molarMass: 150, amount: { value: 2, unit: "mmol" },
        logK: { etoac: { value: Math.log10(4), provenance: "group" } } }],
      mixture: { solvents: [{ solvent: "water", volume: { value: 100, unit: "mL" } }] },
      operations: [{ type: "extract", solvent: "etoac", volume: { value: 100, unit: "mL" }, portions: 1 }],
    };
    const input = parse(raw);
    expect(ideal(input).recovery.p).toBeCloseTo(0.8, 2);
    const plan = planWorkup(input, { targetRecovery: 0.9 }, ideal);
    const x = plan.extraction;
    if (!x || !plan.check) throw new Error("expected an extraction plan and a check");
    // The same total volume in one portion always does worse than the recommended split.
    const total = x.volumeMl * x.portions;
    expect(x.alternatives[0]?.recovery).toBeCloseTo(1 - 1 / (1 + (4 * total) / x.aqueousMl), 6);
    expect(x.alternatives[0]?.recovery).toBeLessThan(x.recovery);
    expect(x.portions).toBeGreaterThanOrEqual(2);
    expect(plan.check.recovery.p).toBeGreaterThanOrEqual(0.9);
    expect(plan.check.meetsTargets).toBe(true);
  });

  it("keeps a procedure that already meets the target", () => {
    const raw = JSON.parse(readFileSync("examples/saponification-ph-swing.json", "utf8")) as unknown;
    const plan = planWorkup(parse(raw), { targetRecovery: 0.9 }, simulateWorkup);
    expect(plan.extraction?.reasons.join(" ")).toMatch(/already reaches the target/);
    expect(plan.changes.some((c) => c.action === "replace" && c.operation?.type === "extract" && c.step === 4)).toBe(false);
    // The neutral ester is washed out of the basic water by more ether portions (pH swing, §2.3).
    const ether = plan.aqueousWashes[0];
    expect(ether?.step).toBe(2);
    expect(ether?.portions).toBeGreaterThan(2);
    expect(plan.check?.recovery["methyl-benzoate"]).toBeLessThan(0.05);
  });

  it("separates two bases with a wash buffered between their pKaH values", () => {
    // Lidocaine pKaH 7.9 [lido] and diethylamine pKaH 10.98 [IUPAC-pKa]: a wash between them protonates the
    // stronger base and leaves most of the weaker one neutral (common practice).
    const raw = JSON.parse(readFileSync("examples/amine-back-extraction.json", "utf8")) as unknown;
    const plan = planWorkup(parse(raw), {}, simulateWorkup);
    const wash = plan.washes.find((w) => w.purpose === "remove_bases");
    if (!wash?.window || !wash.reagent) throw new Error("expected a wash");
    expect(wash.window.low).toBeGreaterThan(7.9);
    expect(wash.window.high).toBeLessThan(10.98);
    expect(wash.reagent.pH).toBeGreaterThan(7.9);
    expect(wash.reagent.pH).toBeLessThan(10.98);
    expect(plan.check?.meetsTargets).toBe(true);
  });
});
