/**
 * Partition by the Abraham solvation model against measured solvent/water partition coefficients.
 * Check values:
 *  - heptane–water log K of substituted benzenes: Chiou & Block 1986, as printed in C. T. Chiou, Partition and
 *    Adsorption of Organic Contaminants in Environmental Systems (Wiley 2002), Table 5.2 (the same table gives the
 *    octanol–water log P used as input, from Leo, Hansch & Elkins 1971 and Chiou et al. 1982);
 *  - octanol–water log P of DMF, −1.01: CRC Handbook "Octanol–water partition coefficients" (Hansch, Leo & Hoekman
 *    1995);
 *  - DMF removal: common practice — DMF is washed out of ethyl acetate with repeated water (or 5 % LiCl) washes,
 *    about 10 mL of water per mL of DMF in five portions, and a crude from ~15 mL DMF still holds tens of mg.
 */
import { describe, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { compileComponents } from "@/lib/chem/components";
import { compileLibrary, DEFAULT_LIBRARY } from "@/lib/chem/library";
import { cosolventLogK, solventLogK } from "@/lib/chem/partition";
import { predictWorkup } from "@/lib/chem/predict";
import { componentSchema, type Component } from "@/lib/chem/schema";
import { naphthalene, wash, workup } from "./fixtures";

const component = (key: string, smiles: string | undefined, logP: number | null, extra: Record<string, unknown> = {}): Component =>
  componentSchema.parse({ key, name: key, role: "product", molarMass: 100, amount: { value: 1, unit: "mmol" }, smiles,
    ...(logP === null ? {} : { logP: { value: logP, provenance: "literature" } }), ...extra });

// [compound, SMILES, log K heptane/water, log P octanol/water] — Chiou Table 5.2 (Chiou & Block 1986).
const HEPTANE: [string, string, number, number][] = [
  ["benzene", "c1ccccc1", 2.26, 2.13],
  ["toluene", "Cc1ccccc1", 2.85, 2.69],
  ["ethylbenzene", "CCc1ccccc1", 3.43, 3.15],
  ["chlorobenzene", "Clc1ccccc1", 2.95, 2.84],
  ["bromobenzene", "Brc1ccccc1", 3.1, 2.99],
  ["anisole", "COc1ccccc1", 2.1, 2.11],
  ["1,2-dichlorobenzene", "Clc1ccccc1Cl", 3.45, 3.38],
  ["biphenyl", "c1ccc(-c2ccccc2)cc1", 4.21, 4.09],
];

describe("heptane–water partition of aromatics (measured defect: the alkane line was 0.9–1.0 too low)", () => {
  const heptane = SOLVENTS.heptane!;
  it.each(HEPTANE)("%s within 0.35 log units of the measured value", (_name, smiles, measured, logP) => {
    const k = solventLogK(component("x", smiles, logP), heptane, SOLVENTS);
    expect(k?.origin).toBe("abraham");
    expect(Math.abs((k?.value ?? Number.NaN) - measured)).toBeLessThan(0.35);
  });
  it("has no systematic bias over the set, and the engine uses the same values", () => {
    const errors = HEPTANE.map(([, smiles, measured, logP]) => (solventLogK(component("x", smiles, logP), heptane, SOLVENTS)?.value ?? Number.NaN) - measured);
    expect(Math.abs(errors.reduce((a, b) => a + b, 0) / errors.length)).toBeLessThan(0.2);
    const comps = HEPTANE.map(([, smiles, , logP], i) => component(`c${i}`, smiles, logP));
    const lib = compileLibrary(DEFAULT_LIBRARY, ["heptane"]);
    const compiled = compileComponents(comps, lib);
    const col = lib.solventIndex.get("heptane") as number;
    comps.forEach((c, i) => {
      expect(compiled.logK[i * lib.solventKeys.length + col]).toBeCloseTo(solventLogK(c, heptane, SOLVENTS)?.value ?? Number.NaN, 10);
    });
  });
  it("keeps the log P line for a structure without descriptors and the group's own value above all", () => {
    const unlisted = component("u", "CCCCCCCCCCCCCCCCCC(=O)N1CCOCC1", 6);
    expect(solventLogK(unlisted, heptane, SOLVENTS)?.origin).toBe("collander");
    const own = component("o", "c1ccccc1", 2.13, { logK: { heptane: { value: 1.5, provenance: "group" } } });
    expect(solventLogK(own, heptane, SOLVENTS)).toMatchObject({ value: 1.5, origin: "component" });
  });
  it("uses descriptors given with the component before the table", () => {
    // Benzene's structure with toluene's descriptors (Bradley 2014) must give toluene's heptane value.
    const given = component("g", "c1ccccc1", 2.69, { abraham: { E: 0.601, S: 0.52, A: 0, B: 0.14, V: 0.8573, provenance: "literature" } });
    const toluene = component("t", "Cc1ccccc1", 2.69);
    expect(solventLogK(given, heptane, SOLVENTS)?.value).toBeCloseTo(solventLogK(toluene, heptane, SOLVENTS)?.value ?? Number.NaN, 10);
  });
});

describe("water-miscible reaction solvents between an organic layer and water", () => {
  it("DMF's octanol–water log P from its descriptors matches the measured −1.01 within 0.2", () => {
    const dmf = component("dmf", "CN(C)C=O", null);
    expect(Math.abs((solventLogK(dmf, SOLVENTS.octanol!, SOLVENTS)?.value ?? Number.NaN) + 1.01)).toBeLessThan(0.2);
  });
  it("ranks the dipolar aprotic solvents as their descriptors say: DMSO stays in water more than DMF, DMF more than MeCN", () => {
    const k = (s: string) => cosolventLogK(SOLVENTS[s]!, SOLVENTS.etoac!);
    expect(k("dmso")).toBeLessThan(k("dmf"));
    expect(k("dmf")).toBeLessThan(k("mecn"));
  });
  it("five water washes of a 14.2 g DMF crude from EtOAc leave tens of mg of DMF (common practice), not < 1 mg", () => {
    // 14.2 g DMF (15.0 mL at 0.9445 g/mL, CRC), 75 mL EtOAc, 5 × 30 mL water: about 10 mL water per mL DMF.
    const r = predictWorkup(workup([naphthalene()], [["etoac", 75], ["dmf", 14.2 / 0.9445]], [wash("water", 30, 5), { type: "concentrate" }]));
    expect(r.residualSolventsMg.dmf).toBeGreaterThan(10);
    expect(r.residualSolventsMg.dmf).toBeLessThan(100);
  });
});
