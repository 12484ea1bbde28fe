import { describe, expect, it } from "vitest";
import { gapShare, gapShareWords } from "./causes";
import { isFlagged, reportedRecovery } from "./deviation";

// Benzanilide, M = 197.24 g/mol (examples/acid-base-separation.json); amounts invented for the arithmetic.
const base = { molarMass: 197.24, assayedProductMmol: null, expectedProductMmol: 5, specProductMmol: 5 };

describe("reported recovery", () => {
  it("is mass × purity / (M × reference amount)", () => {
    const r = reportedRecovery({ ...base, isolatedMassMg: 900, purityPct: 95 })!;
    expect(r.recovery).toBeCloseTo((900 * 0.95) / (197.24 * 5), 12);
    expect(r).toMatchObject({ basis: "expected", referenceMmol: 5, purityAssumed: false });
  });

  it("prefers the assayed amount, then the expected amount, then the spec's product amount", () => {
    expect(reportedRecovery({ ...base, isolatedMassMg: 500, purityPct: 100, assayedProductMmol: 4 })).toMatchObject({ basis: "assayed", referenceMmol: 4 });
    expect(reportedRecovery({ ...base, isolatedMassMg: 500, purityPct: 100, expectedProductMmol: null })).toMatchObject({ basis: "spec", referenceMmol: 5 });
    expect(reportedRecovery({ ...base, isolatedMassMg: 500, purityPct: 100, expectedProductMmol: null, specProductMmol: 0 })).toBeNull();
  });

  it("takes weight-only material as pure and says so", () => {
    const r = reportedRecovery({ ...base, isolatedMassMg: 986.2, purityPct: null })!;
    expect(r.recovery).toBeCloseTo(1, 12);
    expect(r.purityAssumed).toBe(true);
  });
});

describe("one product basis: the product in the crude before the workup", () => {
  it("uses an assay as it stands and scales an expected amount by the yield figure", () => {
    // 5.0 mmol expected, a yield figure of 0.95 (common practice: reactions give 90–100 % of what was expected).
    const r = reportedRecovery({ ...base, isolatedMassMg: 900, purityPct: 95, yieldFactor: 0.95 })!;
    expect(r.crudeMmol).toBeCloseTo(4.75, 12);
    expect(r.recovery).toBeCloseTo((900 * 0.95) / 197.24 / 4.75, 12);
    const assayed = reportedRecovery({ ...base, isolatedMassMg: 900, purityPct: 95, assayedProductMmol: 4.6, yieldFactor: 0.95 })!;
    expect(assayed).toMatchObject({ basis: "assayed", crudeMmol: 4.6 });
  });
});

describe("flag for review", () => {
  it("flags a probable shortfall or a danger flag, nothing else", () => {
    expect(isFlagged("below", [])).toBe(true);
    expect(isFlagged("inconclusive", [])).toBe(false);
    expect(isFlagged("above", [{ severity: "warning" }])).toBe(false);
    expect(isFlagged("as_expected", [{ severity: "danger" }])).toBe(true);
  });
});

describe("share of the gap a cause explains", () => {
  it("is (predicted − with the change) / (predicted − reported), never above 100 % nor below 0", () => {
    // Arithmetic on invented recoveries: 90 % predicted, 58 % reported.
    expect(gapShare(0.9, 0.58, 0.58)).toBeCloseTo(1, 12);
    expect(gapShare(0.9, 0.58, 0.74)).toBeCloseTo(0.5, 12);
    // A wrong layer predicting 5 % once read "closing 265 % of the gap"; the share is capped.
    expect(gapShare(0.9, 0.58, 0.05)).toBe(1);
    expect(gapShare(0.9, 0.58, 0.95)).toBe(0);
    expect(gapShare(0.9, 0.9, 0.5)).toBe(0);
    expect(gapShareWords(9.99)).toBe("explains 100 % of the gap");
  });
});
