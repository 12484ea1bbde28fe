import { describe, expect, it } from "vitest";
import { distributionRatio, fractionExtracted, fractionNeutral, isoelectricPoint, isZwitterionic, logDistributionRatio, speciate } from "@/lib/chem/speciation";

// Henderson–Hasselbalch distribution: D = P/(1 + 10^(pH−pKa)) for acids, P/(1 + 10^(pKaH−pH)) for bases, ion
// partition neglected (Scherrer & Howard, J. Med. Chem. 1977, 20, 53, via the partition-coefficient article [S19]).
const noIon = -50;

describe("distribution ratio of monoprotic acids and bases", () => {
  it.each([
    // compound, pKa (IUPAC digitized dataset / LibreTexts E5), log P (CRC logP table), pH, expected log D
    ["benzoic acid, pKa 4.204, log P 1.88, pH 7.4", 4.204, 1.88, 7.4, 1.88 - Math.log10(1 + 10 ** (7.4 - 4.204))],
    ["benzoic acid at pH = pKa: D = P/2", 4.204, 1.88, 4.204, 1.88 - Math.log10(2)],
    ["acetic acid, pKa 4.757, log P −0.17, pH 2", 4.757, -0.17, 2, -0.17 - Math.log10(1 + 10 ** (2 - 4.757))],
    ["phenol, pKa 9.994, log P 1.48, pH 8.34 (bicarbonate)", 9.994, 1.48, 8.34, 1.48 - Math.log10(1 + 10 ** (8.34 - 9.994))],
  ])("%s", (_n, pKa, logP, pH, expected) => {
    expect(logDistributionRatio(pH, [{ pKa, kind: "acid" }], logP, noIon)).toBeCloseTo(expected, 10);
  });

  it.each([
    ["aniline, pKaH 4.60, log P 0.90, pH 1", 4.6, 0.9, 1, 0.9 - Math.log10(1 + 10 ** (4.6 - 1))],
    ["triethylamine, pKaH 10.72, log P 1.45, pH 14", 10.72, 1.45, 14, 1.45 - Math.log10(1 + 10 ** (10.72 - 14))],
    ["pyridine, pKaH 5.229, log P 0.65, pH 5.229: D = P/2", 5.229, 0.65, 5.229, 0.65 - Math.log10(2)],
  ])("%s", (_n, pKa, logP, pH, expected) => {
    expect(logDistributionRatio(pH, [{ pKa, kind: "base" }], logP, noIon)).toBeCloseTo(expected, 10);
  });

  it("two units on the wrong side of the pKa costs a factor of about 100 (two-unit rule: “Strategies for optimization of LLE protocols”, LCGC N. Am. 2021, 39(4), 198)", () => {
    const at = distributionRatio(6.2, [{ pKa: 4.2, kind: "acid" }], 2, noIon);
    expect(100 / at).toBeCloseTo(101, 6);
  });

  it("ions partition 3.5 log units below the neutral by default (common practice)", () => {
    const d = distributionRatio(14, [{ pKa: 4, kind: "acid" }], 2);
    expect(Math.log10(d)).toBeCloseTo(-1.5, 6);
  });

  it("reaches 99% ionized two units past the pKa (Henderson–Hasselbalch, derived)", () => {
    expect(1 - fractionNeutral(6.2, [{ pKa: 4.2, kind: "acid" }])).toBeCloseTo(100 / 101, 12);
    expect(1 - fractionNeutral(8.72, [{ pKa: 10.72, kind: "base" }])).toBeCloseTo(100 / 101, 12);
  });
});

describe("several sites", () => {
  it("diprotic acid matches the closed form f₀ = 1/(1 + 10^(pH−pKa1) + 10^(2pH−pKa1−pKa2)) (standard speciation result, from memory)", () => {
    // independent-site form equals the closed form when the two sites do not interact
    const pK1 = 3, pK2 = 5, pH = 4;
    const independent = fractionNeutral(pH, [{ pKa: pK1, kind: "acid" }, { pKa: pK2, kind: "acid" }]);
    expect(independent).toBeCloseTo(1 / ((1 + 10 ** (pH - pK1)) * (1 + 10 ** (pH - pK2))), 12);
  });

  it("diamine neutral fraction", () => {
    const f = fractionNeutral(9, [{ pKa: 6, kind: "base" }, { pKa: 10, kind: "base" }]);
    expect(f).toBeCloseTo(1 / ((1 + 10 ** (6 - 9)) * (1 + 10 ** (10 - 9))), 12);
  });

  it("glycine (pKa 2.350 and 9.780, IUPAC dataset) is a zwitterion: charged at every pH", () => {
    const sites = [{ pKa: 2.35, kind: "acid" as const }, { pKa: 9.78, kind: "base" as const }];
    expect(isZwitterionic(sites)).toBe(true);
    // pI as the mean of the bracketing pKa values [S27]
    expect(isoelectricPoint(sites)).toBeCloseTo(6.065, 10);
    const s = speciate(6.065, sites);
    expect(s.fractionNeutral).toBeLessThan(1e-3);
    expect(s.fractionByNetCharge["0"]).toBeGreaterThan(0.999);
    expect(s.meanCharge).toBeCloseTo(0, 6);
    let maxLogD = -Infinity;
    for (let pH = 0; pH <= 14; pH += 0.1) maxLogD = Math.max(maxLogD, logDistributionRatio(pH, sites, -3.21));
    expect(maxLogD).toBeLessThan(-3);
  });

  it("an ordinary ampholyte is mostly neutral between its pKa values", () => {
    const sites = [{ pKa: 10, kind: "acid" as const }, { pKa: 5, kind: "base" as const }];
    expect(isZwitterionic(sites)).toBe(false);
    expect(fractionNeutral(7.5, sites)).toBeGreaterThan(0.99);
  });

  it("charge distribution sums to one and gives the mean charge", () => {
    const s = speciate(7, [{ pKa: 4, kind: "acid" }, { pKa: 6.5, kind: "acid" }, { pKa: 8, kind: "base" }], 1);
    const total = Object.values(s.fractionByNetCharge).reduce((a, b) => a + b, 0);
    const mean = Object.entries(s.fractionByNetCharge).reduce((a, [z, p]) => a + Number(z) * p, 0);
    expect(total).toBeCloseTo(1, 12);
    expect(mean).toBeCloseTo(s.meanCharge, 12);
    expect(s.fractionNeutral).toBe(0);
  });
});

describe("fraction extracted", () => {
  // IUPAC Gold Book "fraction extracted": E_n = 1 − (rD + 1)^−n, r = V(solvent)/V(feed) (PAC 65, 2373, 1993, p. 2384)
  it.each([
    // case, D, V_org per portion, V_aq, n, expected fraction remaining (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”; derived)
    ["K = 3, 100 mL water, one 500 mL portion (Harris example, problem page)", 3, 500, 100, 1, 0.0625],
    ["K = 3, five 100 mL portions", 3, 100, 100, 5, 0.25 ** 5],
    ["K = 4, one 100 mL portion (80.0% extracted, study page)", 4, 100, 100, 1, 0.2],
    ["K = 4, three 33.3 mL portions (92.1% extracted)", 4, 100 / 3, 100, 3, 1 - 0.921],
    ["K = 2, three 33.3 mL portions (78%, Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.5 “Extraction Theory”)", 2, 100 / 3, 100, 3, 0.22],
  ])("%s", (_n, d, vo, va, n, remaining) => {
    expect(1 - fractionExtracted(d, vo, va, n)).toBeCloseTo(remaining, 2);
  });
});
