/**
 * CO₂ solubility follows the contact's temperature: Henry's law constant 3.3–3.4·10⁻⁴ mol m⁻³ Pa⁻¹ at 298.15 K
 * with d ln k_H/d(1/T) = 2400 K (R. Sander, Atmos. Chem. Phys. 2015, 15, 4399, compilation). Check values at other
 * temperatures from R. F. Weiss, Mar. Chem. 1974, 2, 203 (pure water, S = 0):
 *   ln K₀ = −58.0931 + 90.5069·(100/T) + 22.2940·ln(T/100),  K₀ in mol kg⁻¹ atm⁻¹
 * (evaluated here: 0.0536 at 10 °C, 0.0340 at 25 °C, 0.0265 at 35 °C; mol/kg ≈ mol/L for dilute water).
 */
import { describe, expect, it } from "vitest";
import { co2SaturationM } from "@/lib/chem/aqueous";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { mL, mmol, workup } from "./fixtures";

/** Weiss (1974) K₀ for pure water at `celsius`, mol kg⁻¹ atm⁻¹. */
const weiss = (celsius: number): number => {
  const t = celsius + 273.15;
  return Math.exp(-58.0931 + 90.5069 * (100 / t) + 22.294 * Math.log(t / 100));
};

describe("CO₂ solubility with temperature", () => {
  it("matches Sander's compilation at 25 °C and Weiss's pure-water fit from 10 to 35 °C within 3 %", () => {
    // Sander 2015: 3.3·10⁻⁴ mol m⁻³ Pa⁻¹ × 101325 Pa/atm = 0.0334 mol L⁻¹ atm⁻¹ (Weiss 1974: 0.0340).
    expect(co2SaturationM(25)).toBeGreaterThan(0.0330);
    expect(co2SaturationM(25)).toBeLessThan(0.0350);
    for (const celsius of [10, 20, 35]) {
      expect(co2SaturationM(celsius) / weiss(celsius), `${celsius} °C`).toBeGreaterThan(0.97);
      expect(co2SaturationM(celsius) / weiss(celsius), `${celsius} °C`).toBeLessThan(1.03);
    }
    // Weiss's fit itself at 10 °C, as printed above.
    expect(weiss(10)).toBeCloseTo(0.0536, 3);
  });

  it("keeps more CO₂ dissolved in a cold quench: less gas at 5 °C than at 35 °C", () => {
    const acetic: WorkupInputRaw["components"][number] = { key: "acoh", name: "Acetic acid", role: "reagent", molarMass: 60.05, amount: mmol(8),
      logP: { value: -0.17, provenance: "literature" }, pKas: [{ value: 4.757, kind: "acid", provenance: "literature" }] };
    const gasMmol = (celsius: number): number => {
      const p = predictWorkup(workup([acetic], [["water", 20]], [{ type: "quench", reagent: "nahco3_sat", volume: mL(5), temperature: { value: celsius, unit: "°C" } }]), { flags: false });
      return p.steps[0]?.contacts?.[0]?.co2Mmol ?? Number.NaN;
    };
    const aqueousMl = 25;
    const cold = gasMmol(5), warm = gasMmol(35);
    // The difference is the extra CO₂ the water holds when cold: (k_H(5 °C) − k_H(35 °C))·V at 1 atm, with the
    // constants of Weiss (1974); bicarbonate left at pH ≈ 5 adds a little on top.
    const extraHeld = (weiss(5) - weiss(35)) * aqueousMl;
    expect(warm - cold).toBeGreaterThan(0.8 * extraHeld);
    expect(warm - cold).toBeLessThan(1.5 * extraHeld);
  });
});
