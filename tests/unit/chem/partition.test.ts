import { describe, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { collanderLogK, cosolvencyPower, cosolvencyShift, partitionModelSe, saltingOutShift, setschenowConstant, solventLogK, MAX_SALTING_OUT_LOG_GAIN } from "@/lib/chem/partition";
import { type Component } from "@/lib/chem/schema";

const solvent = (k: string) => {
  const s = SOLVENTS[k];
  if (!s) throw new Error(k);
  return s;
};
const comp = (c: Partial<Component>): Pick<Component, "logP" | "logK" | "pKas"> => ({ logK: {}, pKas: [], ...c });

describe("Collander lines", () => {
  it("octanol is the identity line", () => {
    expect(collanderLogK(2.5, solvent("octanol"), false)).toBe(2.5);
  });
  it("uses the donor line for acids and the acceptor line for the rest (Leo, Hansch & Elkins 1971, from memory)", () => {
    // chloroform donors: 1.126·logP − 1.343; acceptors: 1.276·logP + 0.171 (Leo, Hansch & Elkins, Chem. Rev. 1971, 71, 525, Collander equations; from memory)
    expect(collanderLogK(2, solvent("chcl3"), true)).toBeCloseTo(1.126 * 2 - 1.343, 10);
    expect(collanderLogK(2, solvent("chcl3"), false)).toBeCloseTo(1.276 * 2 + 0.171, 10);
    // diethyl ether donors: 1.130·logP − 0.170 (memory, moderate)
    expect(collanderLogK(1.88, solvent("et2o"), true)).toBeCloseTo(1.13 * 1.88 - 0.17, 10);
    // n-butanol, all solutes: 0.697·logP + 0.381 (memory, moderate)
    expect(collanderLogK(-1, solvent("nbuoh"), false)).toBeCloseTo(-0.697 + 0.381, 10);
  });
  it("lines recalled from memory or assumed carry a wider standard error than the identity", () => {
    expect(partitionModelSe(solvent("octanol"))).toBeLessThan(0.1);
    for (const k of ["etoac", "dcm", "hexane", "toluene", "2-methf"]) expect(partitionModelSe(solvent(k))).toBeGreaterThanOrEqual(0.5);
    expect(partitionModelSe(solvent("hexane"))).toBeGreaterThan(partitionModelSe(solvent("chcl3")));
  });
  it("a group value for the compound and solvent overrides the estimate", () => {
    const c = comp({ logP: { value: 3, provenance: "estimated" }, logK: { etoac: { value: 1.2, provenance: "group", se: 0.1, n: 4 } } });
    expect(solventLogK(c, solvent("etoac"), SOLVENTS)).toMatchObject({ value: 1.2, se: 0.1, origin: "component" });
    const other = solventLogK(c, solvent("toluene"), SOLVENTS);
    expect(other?.origin).toBe("collander");
    expect(other?.se).toBeCloseTo(Math.hypot(0.7, partitionModelSe(solvent("toluene"))), 10);
  });
  it("back-calculates log P from a solvent value when log P is missing", () => {
    const c = comp({ logK: { chcl3: { value: 2.723, provenance: "literature" } } });
    // acceptor line inverted: (2.723 − 0.171)/1.276 = 2.0
    expect(solventLogK(c, solvent("octanol"), SOLVENTS)?.value).toBeCloseTo(2.0, 6);
  });
});

describe("salting out (Setschenow)", () => {
  it.each([
    // Ks(NaCl) = 0.04·log Kow + 0.114 (Ni & Yalkowsky, Int. J. Pharm. 2003, 254, 167; attribution from memory); worked values derived
    ["benzene, log P 2.13", 2.13, 0.199],
    ["naphthalene, log P 3.34", 3.34, 0.248],
    ["phenol, log P 1.48", 1.48, 0.173],
  ])("%s", (_n, logP, ks) => {
    expect(setschenowConstant(logP)).toBeCloseTo(ks, 3);
  });
  it("brine (≈5.4 M) with Ks 0.2 raises log K by ≈1.1 (Setschenow equation with the cited Ks; derived)", () => {
    expect(saltingOutShift(0.2, 5.42)).toBeCloseTo(1.08, 2);
  });
  it("caps the gain where the linear form is unreliable", () => {
    expect(saltingOutShift(0.35, 6)).toBe(MAX_SALTING_OUT_LOG_GAIN);
  });
});

describe("cosolvency (log-linear model)", () => {
  it("σ = 4 with 10% cosolvent in water cuts K about 2.5-fold (log-linear cosolvency model, Yalkowsky & Roseman; derived)", () => {
    expect(10 ** -cosolvencyShift(4, 0.1)).toBeCloseTo(2.51, 2);
  });
  it("σ grows with solute log P and is never negative", () => {
    const thf = solvent("thf");
    expect(cosolvencyPower(4, thf)).toBeGreaterThan(cosolvencyPower(1, thf));
    expect(cosolvencyPower(-5, thf)).toBe(0);
    // σ of 3–5 is common for lipophilic solutes (Yalkowsky, Solubility and Solubilization in Aqueous Media; from memory)
    expect(cosolvencyPower(4, thf)).toBeGreaterThan(3);
    expect(cosolvencyPower(4, thf)).toBeLessThan(5);
  });
});
