import { describe, expect, it } from "vitest";
import { aqueousPh, reagentPh, HEAT_OF_NEUTRALIZATION_KJ_PER_MOL, CO2_SATURATION_M } from "@/lib/chem/aqueous";
import { compileLibrary, DEFAULT_LIBRARY, SYSTEM_KEYS } from "@/lib/chem/library";

const lib = compileLibrary(DEFAULT_LIBRARY);
const sys = (entries: Record<string, number>) => SYSTEM_KEYS.map((k) => entries[k] ?? 0);
const fresh = (key: string) => {
  const r = lib.reagents.get(key);
  if (!r) throw new Error(key);
  return reagentPh(r);
};

// "Ideal pH" targets: activity coefficients 1, computed from the pKa values (charge balance with the cited pKa values; derived).
describe("buffer and reagent pH by charge balance", () => {
  it.each([
    ["saturated NaHCO₃ → ½(6.35 + 10.33) = 8.34", "nahco3_sat", 8.34, 0.02],
    ["1 M HCl → 0.00", "hcl_1m", 0.0, 0.01],
    ["1 M NaOH → 14.00", "naoh_1m", 14.0, 0.01],
    ["10% citric acid (0.541 M) → 1.71", "citric_10pct", 1.71, 0.02],
    ["saturated NH₄Cl (5.45 M) → 4.25", "nh4cl_sat", 4.25, 0.02],
    ["1 M Na₂CO₃ → 12.16", "na2co3_1m", 12.16, 0.02],
    ["brine → 7 (neutral salt)", "brine", 7.0, 0.01],
    ["5% LiCl → 7", "licl_5pct", 7.0, 0.01],
    ["pH 7 phosphate buffer (Na⁺ set for pH 7.00 with pKa2 7.198, K&L)", "phosphate_ph7", 7.0, 0.01],
  ])("%s", (_n, key, expected, tol) => {
    expect(Math.abs(fresh(key) - expected)).toBeLessThan(tol);
  });

  it("saturated Na₂CO₃ (2.0 M) is near the ideal 12.29 and the vendor's pH 12 at 1 M (secondary)", () => {
    expect(fresh("na2co3_sat")).toBeGreaterThan(12.2);
    expect(fresh("na2co3_sat")).toBeLessThan(12.4);
  });

  it("equimolar H₂PO₄⁻/HPO₄²⁻ sits at pKa2 = 7.198 (Kaye & Laby from Robinson & Stokes)", () => {
    // 0.1 M NaH₂PO₄ + 0.1 M Na₂HPO₄: total phosphate 0.2 M, Na⁺ 0.3 M
    expect(aqueousPh({ strongCharge: 0.3, systems: sys({ phosphate: 0.2 }) })).toBeCloseTo(7.198, 2);
  });

  it("ammonium chloride at 0.1 M: pH = ½(9.244 − log 0.1) = 5.12 (LibreTexts E5 pKa)", () => {
    expect(aqueousPh({ strongCharge: -0.1, systems: sys({ ammonium: 0.1 }) })).toBeCloseTo(5.12, 2);
  });

  it("acetic acid 0.1 M: pH ≈ ½(4.757 + 1) = 2.88 (pKa 4.757, Martell & Smith via LibreTexts E5)", () => {
    expect(aqueousPh({ strongCharge: 0, systems: sys({ acetate: 0.1 }) })).toBeCloseTo(2.88, 2);
  });

  it("a mixture's own acid enters the balance: 0.01 M benzoic acid (pKa 4.204) gives pH 3.12", () => {
    // [H⁺]² / (C − [H⁺]) = Ka → [H⁺] = 7.6e-4 M (derived)
    const pH = aqueousPh({ strongCharge: 0, systems: sys({}), solutes: [{ concentration: 0.01, sites: [{ pKa: 4.204, kind: "acid" }] }] });
    expect(pH).toBeCloseTo(3.12, 2);
  });

  it("limits: far from every pKa the strong excess sets the pH", () => {
    expect(aqueousPh({ strongCharge: -1e-3, systems: sys({}) })).toBeCloseTo(3, 6);
    expect(aqueousPh({ strongCharge: 1e-2, systems: sys({}) })).toBeCloseTo(12, 6);
  });

  it("uses the CODATA heat of neutralization and ≈0.03 M dissolved CO₂", () => {
    expect(HEAT_OF_NEUTRALIZATION_KJ_PER_MOL).toBeCloseTo(-285.83 + 230.015, 1);
    expect(CO2_SATURATION_M).toBeGreaterThan(0.025);
    expect(CO2_SATURATION_M).toBeLessThan(0.04);
  });
});
