/**
 * CO₂ from bicarbonate leaves until the aqueous layer is in equilibrium with a CO₂ headspace at 1 atm (an open
 * system at fixed p(CO₂): W. Stumm & J. J. Morgan, Aquatic Chemistry, 3rd ed., Wiley 1996, ch. 4), and the gas
 * is counted at the contact's temperature (ideal gas, CODATA R); pH as −log a(H⁺) with Davies coefficients
 * (C. W. Davies, Ion Association, 1962). Check values are computed here from those
 * textbook relations with the published constants: K₁, K₂ of carbonic acid 6.35, 10.33 and acetic acid 4.757
 * (Martell & Smith, Critical Stability Constants), CO₂ solubility under 1 atm at 25 °C 0.034 mol/L (Henry's law
 * constant 3.4·10⁻² mol L⁻¹ atm⁻¹, R. Sander, Atmos. Chem. Phys. 15 (2015) 4399, from memory).
 */
import { describe, expect, it } from "vitest";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { benzoicAcid, mL, mmol, naphthalene, wash, workup } from "./fixtures";

type ComponentRaw = WorkupInputRaw["components"][number];
const K1 = 10 ** -6.35, K2 = 10 ** -10.33, KA = 10 ** -4.757, KW = 1e-14, CSAT = 0.034;
/** Saturated NaHCO₃: 1.11 mol/L (9.6 g/100 g water at 20 °C, Seidell; as in the reagent table). */
const NAHCO3_SAT_M = 1.11;

/** −log γ± of a singly charged ion at ionic strength I (Davies equation, C. W. Davies, Ion Association, 1962). */
const minusLogGamma = (i: number): number => 0.509 * (Math.sqrt(i) / (1 + Math.sqrt(i)) - 0.3 * i);

/**
 * Open-system charge balance of Na⁺ + acetic acid under 1 atm CO₂ with Davies activity coefficients, the pH as
 * −log a(H⁺): bisection in pH inside a fixed-point loop on the ionic strength; then the CO₂ that left.
 */
function openSystemGas(naM: number, acetateM: number, volumeL: number): { pH: number; gasMmol: number } {
  let ionic = naM, pH = 7, hco3 = 0, co3 = 0;
  for (let round = 0; round < 50; round++) {
    const g1 = 10 ** -minusLogGamma(ionic), g2 = 10 ** (-4 * minusLogGamma(ionic));
    const species = (p: number) => {
      const a = 10 ** -p;
      return { h: a / g1, oh: KW / (a * g1), ac: (acetateM * KA) / (KA + a * g1), hco3: (CSAT * K1) / (a * g1), co3: (CSAT * K1 * K2) / (a * a * g2) };
    };
    let lo = 0, hi = 14;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      const x = species(mid);
      if (naM + x.h - x.oh - x.ac - x.hco3 - 2 * x.co3 > 0) lo = mid; else hi = mid;
    }
    pH = lo;
    const x = species(pH);
    hco3 = x.hco3;
    co3 = x.co3;
    ionic = 0.5 * (naM + x.h + x.oh + x.ac + x.hco3 + 4 * x.co3);
  }
  return { pH, gasMmol: (naM - CSAT - hco3 - co3) * volumeL * 1000 };
}

const aceticAcid = (n: number): ComponentRaw => ({ key: "acoh", name: "Acetic acid", role: "reagent", molarMass: 60.05, amount: mmol(n),
  logP: { value: -0.17, provenance: "literature" }, pKas: [{ value: 4.757, kind: "acid", provenance: "literature" }] });

describe("CO₂ degassed to equilibrium with the headspace", () => {
  it("acetic acid in water quenched with too little bicarbonate: pH and gas of the open system (Stumm & Morgan)", () => {
    // At 25 °C, where the solubility CSAT applies (the engine corrects it for temperature).
    const p = predictWorkup(workup([aceticAcid(8)], [["water", 20]], [{ type: "quench", reagent: "nahco3_sat", volume: mL(5) }],
      { temperature: { value: 25, unit: "°C" } }), { flags: false });
    const contact = p.steps[0]?.contacts?.[0];
    const aq = contact?.phases.find((x) => x.kind === "aqueous");
    const volumeL = (aq?.volumeMl ?? Number.NaN) / 1000;
    const na = (NAHCO3_SAT_M * 5) / 1000 / volumeL;
    const expected = openSystemGas(na, 8 / 1000 / volumeL, volumeL);
    expect(Math.abs((aq?.pH ?? Number.NaN) - expected.pH)).toBeLessThan(0.02);
    expect(contact?.co2Mmol).toBeGreaterThan(expected.gasMmol * 0.98);
    expect(contact?.co2Mmol).toBeLessThan(expected.gasMmol * 1.02);
  });

  it("measured defect: limiting bicarbonate against excess benzoic acid spends nearly all its capacity (was ~60 %, 36–39 mL)", () => {
    const w = workup([naphthalene(), { ...benzoicAcid(), amount: mmol(10) }], [["etoac", 30]], [wash("nahco3_sat", 4)], { funnel: mL(100) });
    const p = predictWorkup(w);
    const contact = p.steps[0]?.contacts?.[0];
    const aqMl = contact?.phases.find((x) => x.kind === "aqueous")?.volumeMl ?? Number.NaN;
    // Each mole of acid neutralized by HCO₃⁻ gives a mole of CO₂ (common practice); what stays dissolved is at
    // most saturation plus the bicarbonate left at the final pH.
    const capacity = NAHCO3_SAT_M * 4 - CSAT * aqMl;
    expect(contact?.co2Mmol).toBeGreaterThan(0.8 * capacity);
    expect(contact?.co2GasMl).toBeGreaterThan(80);
    // 100 mL funnel with about 34 mL of liquid: the gas exceeds its free volume (F13 danger, common practice).
    expect(p.flags.find((f) => f.code === "F13")?.severity).toBe("danger");
  });

  it("the gas volume is counted at the contact's temperature and 1 atm (ideal gas: RT/p, CODATA R)", () => {
    const at = (celsius: number) => {
      const p = predictWorkup(workup([aceticAcid(8)], [["water", 20]], [{ type: "quench", reagent: "nahco3_sat", volume: mL(5), temperature: { value: celsius, unit: "°C" } }]), { flags: false });
      const c = p.steps[0]?.contacts?.[0];
      return (c?.co2GasMl ?? Number.NaN) / (c?.co2Mmol ?? Number.NaN);
    };
    expect(at(25)).toBeCloseTo((8.314462618 * 298.15) / 101.325, 2);
    expect(at(0)).toBeCloseTo((8.314462618 * 273.15) / 101.325, 2);
  });
});

describe("CO₂ caution against the funnel's free volume", () => {
  it("names the free volume when the gas exceeds it (common practice: neutralize in an open flask first)", () => {
    const w = workup([naphthalene(), { ...benzoicAcid(), amount: mmol(10) }], [["etoac", 30]], [wash("nahco3_sat", 4)], { funnel: mL(100) });
    const caution = predictWorkup(w).cautions.find((c) => c.code === "gas_evolution");
    expect(caution?.text).toMatch(/more than the \d+ mL free volume of a 100 mL funnel/);
  });
});
