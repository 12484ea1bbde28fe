// Brine and salt solutions: volume and density from the CRC concentrative-property tables, the volume growing as
// salt dissolves, and the "may not separate" warning whenever two layers are within 0.03 g/mL.
import { describe, expect, it } from "vitest";
import { REAGENTS } from "@/lib/chem/data/reagents";
import { SALT_SOLUTIONS, type SaltKey } from "@/lib/chem/data/salt-solutions";
import { predictWorkup } from "@/lib/chem/predict";
import { molalityOf, solutionDensity, solutionMolarity } from "@/lib/chem/salt-solutions";
import { mL, naphthalene, neutral, workup } from "./fixtures";

describe("CRC concentrative properties (20 °C)", () => {
  // [salt, mass %, molarity mol/L, density g/mL]: CRC Handbook 102nd ed., "Concentrative Properties of Aqueous
  // Solutions" (the molarity column is printed beside the density; the code computes it from the density).
  it.each([
    ["NaCl", 10, 1.832, 1.0707], ["NaCl", 26, 5.326, 1.1972], ["LiCl", 5, 1.211, 1.0272], ["LiCl", 20, 5.26, 1.115],
    ["Na2SO4", 10, 0.768, 1.0905], ["Na2SO4", 20, 1.677, 1.1907], ["K2CO3", 20, 1.722, 1.1898], ["K2CO3", 50, 5.573, 1.5404],
  ] as [SaltKey, number, number, number][])("%s %f wt %%: %f mol/L, %f g/mL", (key, w, c, rho) => {
    const m = molalityOf(SALT_SOLUTIONS[key], w);
    expect(solutionDensity(key, m)).toBeCloseTo(rho, 3);
    expect(solutionMolarity(key, m)).toBeCloseTo(c, 2);
  });

  it("saturated NaCl at 20 °C (6.136 mol/kg, CRC solubility table) is ≈1.20 g/mL and ≈5.42 mol/L", () => {
    expect(solutionDensity("NaCl", 6.136)).toBeCloseTo(1.2, 2);
    expect(solutionMolarity("NaCl", 6.136)).toBeCloseTo(5.42, 1);
  });

  it("the library's saturated K₂CO₃ follows the CRC tables (was 5.9 M, 1.54 g/mL from memory)", () => {
    expect(REAGENTS.k2co3_sat?.density?.value).toBeCloseTo(solutionDensity("K2CO3", 7.948), 2);
    expect(REAGENTS.k2co3_sat?.basis.value).toBeCloseTo(solutionMolarity("K2CO3", 7.948), 1);
  });
});

const aqueousOf = (p: ReturnType<typeof predictWorkup>, step: number) => p.steps[step - 1]?.contacts[0]?.phases.find((x) => x.kind === "aqueous");

describe("dissolving salt grows the volume", () => {
  it("saturating 100 mL of water with NaCl gives ≈113 mL at ≈1.20 g/mL (CRC: 135.8 g of solution per 99.8 g water at 1.2006)", () => {
    const p = predictWorkup(workup([naphthalene()], [["water", 100]], [{ type: "add_salt", salt: "nacl", saturate: true }]));
    const aq = aqueousOf(p, 1);
    expect(aq?.densityGPerMl).toBeCloseTo(1.2, 2);
    expect(aq?.volumeMl).toBeGreaterThan(112);
    expect(aq?.volumeMl).toBeLessThan(114.5);
  });

  it("NaCl-saturated DMF/water is lighter than brine and larger than before (was 1.27–1.28 g/mL at unchanged volume)", () => {
    const p = predictWorkup(workup([neutral("p", 2)], [["dmf", 20], ["water", 100]], [{ type: "add_salt", salt: "nacl", saturate: true },
      { type: "extract", solvent: "dcm", volume: mL(50) }]));
    const aq = aqueousOf(p, 1);
    // DMF 0.9445 g/mL (CRC) mixed by volume with saturated brine (1.20): at most 1.20, well below 1.27
    expect(aq?.densityGPerMl).toBeLessThan(1.2);
    expect(aq?.densityGPerMl).toBeGreaterThan(1.12);
    expect(aq?.volumeMl).toBeGreaterThan(130);
    // the DCM layer (lightened by the DMF it takes up) now sits clearly below it: not a marginal separation
    expect(Math.abs(p.steps[1]?.contacts[0]?.densityDifference ?? 0)).toBeGreaterThan(0.05);
  });
});

describe("'may not separate' whenever the layers are within 0.03 g/mL", () => {
  const f10 = (p: ReturnType<typeof predictWorkup>) => p.flags.find((f) => f.code === "F10");

  it("by a solvent mixture: DCM–hexane 1:1 against water (densities CRC: 1.3266, 0.6606; mixture ≈0.994)", () => {
    const p = predictWorkup(workup([naphthalene()], [["dcm", 25], ["hexane", 25]], [{ type: "wash", reagent: "water", volume: mL(50) }]));
    expect(f10(p)?.title).toMatch(/may not separate/);
  });

  it("by salt: DCM–EtOAc 1:1 (≈1.11) against water with NaCl to about 15 wt % (CRC 1.1085)", () => {
    const p = predictWorkup(workup([naphthalene()], [["dcm", 40], ["etoac", 40]], [{ type: "charge", solvent: "water", volume: mL(60) },
      { type: "add_salt", salt: "nacl", mass: { value: 10.6, unit: "g" } }]));
    const c = p.steps[1]?.contacts[0];
    expect(Math.abs(c?.densityDifference ?? 1)).toBeLessThan(0.03);
    expect(f10(p)?.cause).toMatch(/may not separate/);
    expect(p.flags.map((f) => f.code)).toContain("F11");
  });

  it("still reported when an earlier contact raised another emulsion cause", () => {
    const p = predictWorkup(workup([naphthalene()], [["dcm", 40], ["etoac", 40]], [{ type: "wash", reagent: "naoh_1m", volume: mL(30) },
      { type: "charge", solvent: "water", volume: mL(60) }, { type: "add_salt", salt: "nacl", mass: { value: 10.6, unit: "g" } }]));
    expect(f10(p)?.cause).toMatch(/basic aqueous layer/);
    expect(f10(p)?.cause).toMatch(/may not separate/);
  });
});
