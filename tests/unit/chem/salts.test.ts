/**
 * Components weighed as salts: the counter-ion enters the aqueous charge balance and the mass converts through
 * the salt's molar mass. Check values: the pH of a weak acid or weak base salt solution,
 * [H⁺] = √(K_a·F) and [OH⁻] = √(K_b·F) (D. C. Harris, Quantitative Chemical Analysis, 9th ed., Freeman 2015,
 * ch. 9, "Weak acids" and "Weak bases"), with the pH read as −log a(H⁺) and γ± from the Davies equation
 * (C. W. Davies, Ion Association, 1962; A = 0.509 at 25 °C), molar masses from IUPAC standard atomic weights,
 * and what a chemist expects of an amine hydrochloride under a DCM wash (common practice).
 */
import { describe, expect, it } from "vitest";
import { predictWorkup } from "@/lib/chem/predict";
import { workupInputSchema, type WorkupInputRaw } from "@/lib/chem/schema";
import { mL, workup } from "./fixtures";

type ComponentRaw = WorkupInputRaw["components"][number];
type OperationRaw = WorkupInputRaw["operations"][number];

/** Benzylamine: pKaH 9.34 (Perrin 1965, from memory), log P 1.09 (Hansch, Leo & Hoekman 1995, from memory). */
const BENZYLAMINE_PKA = 9.34;
/** Benzylamine C₇H₉N 107.15 g/mol; its hydrochloride C₇H₁₀ClN 143.61 g/mol (IUPAC atomic weights). */
const benzylamineHcl = (form: "field" | "smiles", mg = 718.05): ComponentRaw => ({
  key: "bn", name: "Benzylamine hydrochloride", role: "product", amount: { value: mg, unit: "mg" },
  logP: { value: 1.09, provenance: "literature" }, pKas: [{ value: BENZYLAMINE_PKA, kind: "base", provenance: "literature" }],
  ...(form === "field" ? { molarMass: 107.15, salt: { counterIon: "chloride" as const } } : { molarMass: 143.61, smiles: "NCc1ccccc1.Cl" }),
});
/** Benzoic acid: pKa 4.204 (IUPAC digitized pKa set, Serjeant & Dempsey), log P 1.87 (PhysProp). Sodium
 * benzoate C₇H₅NaO₂ 144.10 g/mol. */
const sodiumBenzoate = (mmol: number): ComponentRaw => ({
  key: "bz", name: "Sodium benzoate", role: "product", molarMass: 144.1, smiles: "[O-]C(=O)c1ccccc1.[Na+]", amount: { value: (mmol * 144.1), unit: "mg" },
  logP: { value: 1.87, provenance: "literature" }, pKas: [{ value: 4.204, kind: "acid", provenance: "literature" }],
});

/** −log γ± of a singly charged ion at ionic strength I (Davies 1962). */
const minusLogGamma = (i: number): number => 0.509 * (Math.sqrt(i) / (1 + Math.sqrt(i)) - 0.3 * i);

const contactPh = (c: ComponentRaw, waterMl: number, ops: OperationRaw[]): number[] => {
  const p = predictWorkup(workup([c], [["water", waterMl]], ops), { flags: false });
  return p.steps.flatMap((s) => (s.contacts ?? []).map((x) => x.phases.find((ph) => ph.kind === "aqueous")?.pH ?? Number.NaN));
};

describe("salts: mass through the salt's molar mass", () => {
  it("718 mg of benzylamine hydrochloride is 5.00 mmol, given as parent + counter-ion or as a two-fragment SMILES", () => {
    for (const form of ["field", "smiles"] as const) {
      const parsed = workupInputSchema.parse(workup([benzylamineHcl(form)], [["water", 50]], [{ type: "charge", solvent: "water", volume: mL(10) }]));
      const c = parsed.components[0];
      expect(c?.amountMmol).toBeCloseTo(5.0, 3);
      expect(c?.molarMass).toBeCloseTo(107.15, 1);
      expect(c?.salt?.counterIon).toBe("chloride");
    }
  });
});

describe("salts: pH of a salt solution (Harris, weak acid and weak base formulas)", () => {
  it("0.0833 M benzylamine hydrochloride: pH = ½(pKa − log F) − log γ± = 5.21 + 0.10", () => {
    const f = 5 / 60;
    // a(H⁺)² = K_a·γ±²·F for BH⁺ ⇌ B + H⁺ with [B] = [H⁺]; I = F (BH⁺ and Cl⁻).
    const expected = 0.5 * (BENZYLAMINE_PKA - Math.log10(f)) + minusLogGamma(f);
    for (const form of ["field", "smiles"] as const) {
      const [pH] = contactPh(benzylamineHcl(form), 50, [{ type: "charge", solvent: "water", volume: mL(10) }]);
      expect(Math.abs((pH as number) - expected)).toBeLessThan(0.02);
    }
  });

  it("0.1 M sodium benzoate: pH = 14 − ½(pK_b − log F) + log γ± = 8.60 − 0.11", () => {
    const f = 0.1;
    const pKb = 14 - 4.204;
    // a(H⁺)² = K_a·K_w/(γ±²·F) for A⁻ + H₂O ⇌ HA + OH⁻ with [HA] = [OH⁻]; I = F (Na⁺ and A⁻).
    const expected = 14 - 0.5 * (pKb - Math.log10(f)) - minusLogGamma(f);
    const [pH] = contactPh(sodiumBenzoate(5), 40, [{ type: "charge", solvent: "water", volume: mL(10) }]);
    expect(Math.abs((pH as number) - expected)).toBeLessThan(0.02);
  });
});

describe("salts: an amine hydrochloride in a work-up (common practice)", () => {
  const dcmWash: OperationRaw = { type: "extract", solvent: "dcm", volume: mL(30), portions: 2, keep: "aqueous" };

  it("measured defect: stays in water under two DCM washes (was predicted at pH 10.6 with 99.9 % lost to DCM)", () => {
    for (const form of ["field", "smiles"] as const) {
      const p = predictWorkup(workup([benzylamineHcl(form)], [["water", 50]], [dcmWash]), { flags: false });
      expect(p.recovery.bn).toBeGreaterThan(0.99);
      const pHs = p.steps.flatMap((s) => (s.contacts ?? []).map((x) => x.phases.find((ph) => ph.kind === "aqueous")?.pH ?? Number.NaN));
      for (const pH of pHs) {
        expect(pH).toBeGreaterThan(3.5);
        expect(pH).toBeLessThan(6.5);
      }
    }
  });

  it("goes into DCM once the water is basified past its pKa (≥ 95 % in two extractions)", () => {
    const p = predictWorkup(workup([benzylamineHcl("smiles")], [["water", 50]], [
      { type: "adjust_ph", reagent: "naoh_1m", volume: mL(10) },
      { type: "extract", solvent: "dcm", volume: mL(30), portions: 2, keep: "organic" },
    ]), { flags: false });
    expect(p.recovery.bn).toBeGreaterThan(0.95);
  });

  it("a sodium carboxylate in EtOAc/water goes to the water; acidified with 1 M HCl, it comes back to EtOAc", () => {
    const toWater = predictWorkup(workup([sodiumBenzoate(5)], [["water", 40], ["etoac", 40]], [{ type: "separate", keep: "aqueous" }]), { flags: false });
    expect(toWater.recovery.bz).toBeGreaterThan(0.95);
    const back = predictWorkup(workup([sodiumBenzoate(5)], [["water", 40]], [
      { type: "adjust_ph", reagent: "hcl_1m", volume: mL(10) },
      { type: "extract", solvent: "etoac", volume: mL(40), portions: 2, keep: "organic" },
    ]), { flags: false });
    expect(back.recovery.bz).toBeGreaterThan(0.95);
  });
});
