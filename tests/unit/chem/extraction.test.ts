import { describe, expect, it } from "vitest";
import { predictWorkup } from "@/lib/chem/predict";
import { extract, mmol, wash, workup } from "./fixtures";

const solute = (logK: number, solvent = "toluene") =>
  ({ key: "s", name: "Solute", role: "product" as const, molarMass: 100, amount: mmol(1), logK: { [solvent]: { value: logK, provenance: "literature" as const } } });

// Textbook multiple-extraction arithmetic, q_n = [V_aq/(V_aq + D·V_org)]^n (IUPAC Gold Book "fraction extracted";
// Harris, Quantitative Chemical Analysis, “Extraction efficiency”; attribution from memory). The engine is run with solvent and water mutually insoluble, as the textbook assumes.
describe("textbook extractions through the full simulator", () => {
  it.each([
    ["K = 3, 100 mL water, one 500 mL toluene portion → 6.25% remains (Harris example)", Math.log10(3), 500, 1, 0.0625],
    ["K = 3, five 100 mL portions → 0.098% remains", Math.log10(3), 100, 5, 0.25 ** 5],
    ["K = 4, one 100 mL portion → 80.0% extracted (study page)", Math.log10(4), 100, 1, 0.2],
    ["K = 4, three 33.3 mL portions → 92.1% extracted", Math.log10(4), 100 / 3, 3, (3 / 7) ** 3],
    ["K = 2, three 33.3 mL portions → 78% extracted (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”)", Math.log10(2), 100 / 3, 3, 0.6 ** 3],
  ])("%s", (_n, logK, v, n, remaining) => {
    const r = predictWorkup(workup([solute(logK)], [["water", 100]], [extract("toluene", v, n)]), { idealPhases: true });
    expect(1 - (r.recovery.s ?? 0)).toBeCloseTo(remaining, 9);
  });

  it("K = 10, four equal-volume washes keep (10/11)^4 ≈ 68% (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”)", () => {
    const r = predictWorkup(workup([solute(1, "etoac")], [["etoac", 50]], [wash("water", 50, 4)]), { idealPhases: true });
    expect(r.recovery.s).toBeCloseTo((10 / 11) ** 4, 9);
  });

  it("with real mutual solubility toluene stays within 0.2% of the textbook answer (0.067 wt% in water, Merck)", () => {
    const r = predictWorkup(workup([solute(Math.log10(3))], [["water", 100]], [extract("toluene", 500)]));
    expect(1 - (r.recovery.s ?? 0)).toBeCloseTo(0.0625, 3);
  });

  it("with EtOAc the solvent lost to water lowers recovery below the ideal figure", () => {
    const ideal = predictWorkup(workup([solute(0.3, "etoac")], [["water", 100]], [extract("etoac", 30, 3)]), { idealPhases: true });
    const real = predictWorkup(workup([solute(0.3, "etoac")], [["water", 100]], [extract("etoac", 30, 3)]));
    expect(real.recovery.s).toBeLessThan(ideal.recovery.s ?? 0);
  });
});
