/**
 * Activities in the pH solve: ionic strength from every ion and Davies activity coefficients (C. W. Davies, Ion
 * Association, Butterworths 1962). Check values: the NBS/NIST primary standard buffers at 25 °C (R. G. Bates,
 * Determination of pH, 2nd ed., Wiley 1973, table of standard pH(S) values): 0.025 m KH₂PO₄ + 0.025 m Na₂HPO₄
 * 6.865, 0.01 m borax 9.180, 0.025 m NaHCO₃ + 0.025 m Na₂CO₃ 10.012, to be met within 0.05 (molal taken as molar,
 * 0.3 % apart at these strengths). The engine's own pKa values: phosphate 7.198 (Kaye & Laby, from Robinson &
 * Stokes), carbonate 10.33 (general-chemistry acid table); boric acid 9.237 (Manov, DeLollis & Acree 1944, from
 * memory).
 */
import { describe, expect, it } from "vitest";
import { type ReagentProps } from "@/lib/chem/data/reagents";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { mL, mmol } from "./fixtures";

type ComponentRaw = WorkupInputRaw["components"][number];

/** A buffer solution of the given ions and acid–base systems, mol/L. */
function buffer(key: string, ions: ReagentProps["ions"], systems: ReagentProps["systems"]): ReagentProps {
  const one = { value: 1, source: "NBS buffer recipe", confidence: "confirmed" as const };
  return { key, name: key, kind: "solution", purpose: "buffer", density: one, basis: one, ions, systems };
}

/** pH of 100 mL of the buffer (with `components` dissolved in it), read from one settling of the solution. */
function bufferPh(reagent: ReagentProps | null, components: ComponentRaw[]): { pH: number; ionicStrength: number } {
  const inert: ComponentRaw = { key: "inert", name: "inert", role: "other", molarMass: 100, amount: mmol(0.001), logP: { value: 0, provenance: "estimated" } };
  const raw: WorkupInputRaw = {
    components: components.length > 0 ? components : [inert],
    mixture: reagent ? { reagents: [{ reagent: reagent.key, volume: mL(100) }] } : { solvents: [{ solvent: "water", volume: mL(100) }] },
    operations: [{ type: "separate", keep: "aqueous" }],
  };
  const p = predictWorkup(raw, { flags: false, ...(reagent ? { reagents: { [reagent.key]: reagent } } : {}) });
  const aq = p.steps[0]?.contacts[0]?.phases.find((x) => x.kind === "aqueous");
  return { pH: aq?.pH ?? Number.NaN, ionicStrength: aq?.ionicStrength ?? Number.NaN };
}

describe("NIST standard buffers at 25 °C (Bates 1973), within 0.05", () => {
  it("phosphate 1:1 (0.025 KH₂PO₄ + 0.025 Na₂HPO₄): 6.865, at I = 0.100", () => {
    const r = bufferPh(buffer("nbs_phosphate", { K: 0.025, Na: 0.05 }, { phosphate: 0.05 }), []);
    expect(Math.abs(r.pH - 6.865)).toBeLessThan(0.05);
    // I = ½(0.025 K⁺ + 0.05 Na⁺ + 0.025 H₂PO₄⁻ + 4·0.025 HPO₄²⁻) = 0.100 (Bates).
    expect(r.ionicStrength).toBeCloseTo(0.1, 2);
  });

  it("borax 0.01 m: 9.180 (boric acid half neutralized: 0.02 M B(OH)₃ + 0.02 M B(OH)₄⁻ with Na⁺)", () => {
    const boricAcid: ComponentRaw = {
      key: "boric", name: "Boric acid (as borax)", role: "reagent", molarMass: 61.83, amount: mmol(4),
      logP: { value: -0.29, provenance: "estimated" }, pKas: [{ value: 9.237, kind: "acid", provenance: "literature" }],
      salt: { counterIon: "sodium", perParent: 0.5 },
    };
    const r = bufferPh(null, [boricAcid]);
    expect(Math.abs(r.pH - 9.18)).toBeLessThan(0.05);
  });

  it("carbonate (0.025 NaHCO₃ + 0.025 Na₂CO₃): 10.012, at I = 0.100", () => {
    const r = bufferPh(buffer("nbs_carbonate", { Na: 0.075 }, { carbonate: 0.05 }), []);
    expect(Math.abs(r.pH - 10.012)).toBeLessThan(0.05);
    expect(r.ionicStrength).toBeCloseTo(0.1, 2);
  });
});

describe("ionic strength from every ion", () => {
  it("1 M HCl and 1 M NaOH washes count both ions: I = 1.0 (½(1 + 1)), not 0.5 (measured defect)", () => {
    for (const key of ["hcl_1m", "naoh_1m"]) {
      const p = predictWorkup({
        components: [{ key: "inert", name: "inert", role: "other", molarMass: 100, amount: mmol(0.001), logP: { value: 0, provenance: "estimated" } }],
        mixture: { reagents: [{ reagent: key, volume: mL(50) }] }, operations: [{ type: "separate", keep: "aqueous" }],
      }, { flags: false });
      const aq = p.steps[0]?.contacts[0]?.phases.find((x) => x.kind === "aqueous");
      expect(aq?.ionicStrength).toBeCloseTo(1.0, 2);
    }
  });
});
