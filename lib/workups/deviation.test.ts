import { describe, expect, it } from "vitest";
import { gapScore } from "./causes";
import { compareWithPrediction, FALLBACK_BAND, isFlagged, reportedRecovery } from "./deviation";

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

describe("comparison with the prediction", () => {
  it("is below, as expected or above against the interval, with deviation = reported − predicted in points", () => {
    expect(compareWithPrediction(0.6, 0.9, 0.8, 0.95)).toMatchObject({ status: "below", fallbackBand: false });
    expect(compareWithPrediction(0.6, 0.9, 0.8, 0.95).deviationPct).toBeCloseTo(-30, 12);
    expect(compareWithPrediction(0.85, 0.9, 0.8, 0.95).status).toBe("as_expected");
    expect(compareWithPrediction(0.97, 0.9, 0.8, 0.95).status).toBe("above");
  });

  it("widens an interval that misses its own point prediction, and falls back to ±10 points without one", () => {
    expect(compareWithPrediction(0.965, 0.96, 0.97, 0.99).status).toBe("as_expected");
    expect(compareWithPrediction(0.955, 0.96, 0.97, 0.99).status).toBe("below");
    const fallback = compareWithPrediction(0.75, 0.9, null, null);
    expect(fallback).toMatchObject({ status: "below", fallbackBand: true });
    expect(fallback.low).toBeCloseTo(0.9 - FALLBACK_BAND, 12);
    expect(compareWithPrediction(0.85, 0.9, null, null).status).toBe("as_expected");
  });

  it("is unknown without a reported or a predicted recovery", () => {
    expect(compareWithPrediction(null, 0.9, 0.8, 0.95)).toMatchObject({ status: "unknown", deviationPct: null });
    expect(compareWithPrediction(0.5, null, null, null)).toMatchObject({ status: "unknown", deviationPct: null });
  });

  it("flags a shortfall or a danger flag, nothing else", () => {
    expect(isFlagged("below", [])).toBe(true);
    expect(isFlagged("above", [{ severity: "warning" }])).toBe(false);
    expect(isFlagged("as_expected", [{ severity: "danger" }])).toBe(true);
  });
});

describe("share of the gap a cause explains", () => {
  it("scores an exact explanation 1, half of the gap or twice the gap 0.5, the wrong direction 0", () => {
    expect(gapScore(0.9, 0.5, 0.5)).toEqual({ fractionOfGap: 1, score: 1 });
    expect(gapScore(0.9, 0.5, 0.7).score).toBeCloseTo(0.5, 12);
    expect(gapScore(0.9, 0.5, 0.1).score).toBeCloseTo(0.5, 12);
    expect(gapScore(0.9, 0.5, 0.95)).toMatchObject({ score: 0 });
    expect(gapScore(0.9, 0.9, 0.5)).toEqual({ fractionOfGap: 0, score: 0 });
  });
});
