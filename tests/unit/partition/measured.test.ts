import { describe, expect, it } from "vitest";
import { parseInput, ValidationError } from "@/lib/errors";
import { DEFAULT_LOGD_SE, measuredLogK, MeasurementRejected, neutralCorrection, PH_READING_SE } from "@/lib/partition/measured";
import { measurementInputSchema, type MeasurementInputRaw } from "@/lib/partition/schemas";
import { type PKa } from "@/lib/chem/schema";

const input = (overrides: Partial<MeasurementInputRaw> = {}) =>
  parseInput(measurementInputSchema, {
    compoundId: "c1", solventKey: "EtOAc", method: "shake_flask", basis: "amount", aqueousPh: 7,
    organic: 4, aqueous: 1, organicVolumeMl: 10, aqueousVolumeMl: 20, ...overrides,
  });

// Benzoic acid pKa 4.20 in water at 25 °C (CRC Handbook dissociation-constant table; value from memory).
const BENZOIC: PKa[] = [{ value: 4.2, kind: "acid", provenance: "literature" }];

describe("log D from a measurement of both layers", () => {
  it("divides the concentrations: 4 mg in 10 mL over 1 mg in 20 mL is D = 8 (definition of D, §2.1)", () => {
    const r = measuredLogK(input(), []);
    expect(r.logD).toBeCloseTo(Math.log10(8), 12);
    expect(r.logK).toBeCloseTo(Math.log10(8), 12); // a neutral compound: K = D
    expect(r.bound).toBe("value");
    expect(r.se).toBeCloseTo(DEFAULT_LOGD_SE.shake_flask, 12);
  });

  it("takes concentrations as they are, and lowercases the solvent key", () => {
    const m = input({ basis: "concentration", organic: 2.5, aqueous: 0.5, organicVolumeMl: undefined, aqueousVolumeMl: undefined, logDSe: 0.05 });
    expect(m.solventKey).toBe("etoac");
    const r = measuredLogK(m, []);
    expect(r.logD).toBeCloseTo(Math.log10(5), 12);
    expect(r.se).toBeCloseTo(0.05, 12);
  });

  it("turns a layer below detection into a bound on K", () => {
    expect(measuredLogK(input({ aqueous: 0.01, belowDetection: "aqueous" }), []).bound).toBe("lower");
    expect(measuredLogK(input({ organic: 0.01, belowDetection: "organic" }), []).bound).toBe("upper");
  });
});

describe("neutral log K from log D at the measured pH", () => {
  it("adds back the ionized share of an acid one unit above its pKa (Henderson–Hasselbalch with the engine's ion term)", () => {
    const pH = 5.2;
    const f0 = 1 / (1 + 10 ** (pH - 4.2));
    const expected = -Math.log10(f0 + (1 - f0) * 10 ** -3.5);
    expect(neutralCorrection(pH, BENZOIC)).toBeCloseTo(expected, 12);
    // With the ion term dropped this is log(1 + 10^(pH − pKa)) (Scherrer & Howard 1977, via [S19]).
    expect(neutralCorrection(pH, BENZOIC)).toBeCloseTo(Math.log10(11), 2);
    const r = measuredLogK(input({ aqueousPh: pH }), BENZOIC);
    expect(r.logK - r.logD).toBeCloseTo(expected, 12);
    expect(r.fractionNeutral).toBeCloseTo(1 / 11, 12);
  });

  it("carries pH and pKa uncertainty into the standard error where the compound is partly ionized", () => {
    const r = measuredLogK(input({ aqueousPh: 5.2 }), BENZOIC);
    // d(correction)/dpH ≈ 10/11 one unit above the pKa; the pKa moves it by the same amount the other way.
    expect(r.seParts.pH).toBeCloseTo((10 / 11) * PH_READING_SE, 2);
    expect(r.seParts.pKa).toBeCloseTo((10 / 11) * 0.1, 2); // literature pKa ±0.1 (lib/chem/perturb.ts)
    expect(r.se).toBeCloseTo(Math.hypot(DEFAULT_LOGD_SE.shake_flask, r.seParts.pH, r.seParts.pKa), 12);
    // Far from the pKa the correction is flat and adds nothing.
    expect(measuredLogK(input({ aqueousPh: 1.5 }), BENZOIC).seParts.pH).toBeLessThan(0.001);
  });

  it("refuses a measurement where almost nothing is neutral, or without the pH an ionizable compound needs", () => {
    const refusal = (m: Partial<MeasurementInputRaw>) => {
      try {
        measuredLogK(input(m), BENZOIC);
      } catch (error) {
        if (error instanceof MeasurementRejected) return error.fields;
      }
      return null;
    };
    expect(refusal({ aqueousPh: 8 })?.["aqueousPh"]?.[0]).toMatch(/^at pH 8 only 0\.016 % of the compound is neutral/);
    expect(refusal({ aqueousPh: undefined })?.["aqueousPh"]).toEqual(["the compound has ionizable sites: give the aqueous pH measured after equilibration"]);
  });

  it("refuses a mass balance outside 90–110 % (common practice, §5.2)", () => {
    expect(() => measuredLogK(input({ totalAmount: 5.6 }), [])).toThrow(/the layers account for 89 % of the amount added/);
    expect(measuredLogK(input({ totalAmount: 5.2 }), []).massBalance).toBeCloseTo(5 / 5.2, 12);
  });
});

describe("measurement input", () => {
  const fields = (raw: Record<string, unknown>) => {
    try {
      parseInput(measurementInputSchema, raw);
    } catch (error) {
      if (error instanceof ValidationError) return error.fieldErrors;
    }
    return null;
  };

  it("names every missing or impossible field", () => {
    const base = { compoundId: "c1", solventKey: "etoac", method: "shake_flask", basis: "amount", organic: 1, aqueous: 1 };
    expect(fields(base)).toEqual({
      organicVolumeMl: ["give the organic layer's volume (amounts need volumes)"],
      aqueousVolumeMl: ["give the aqueous layer's volume (amounts need volumes)"],
    });
    expect(fields({ ...base, basis: "concentration", aqueous: 0 })).toEqual({
      aqueous: ["nothing found in the aqueous layer: enter the detection limit and mark the layer as below detection"],
    });
    expect(fields({ ...base, basis: "concentration", method: "guess", aqueousPh: "16" })).toEqual({
      method: ["method must be one of shake_flask, layer_assay"],
      aqueousPh: ["aqueous pH must be ≤ 15"],
    });
    expect(fields({ ...base, basis: "concentration", totalAmount: 2 })).toEqual({ totalAmount: ["the mass balance needs amounts, not concentrations"] });
  });

  it("reads form strings, treating blanks as absent", () => {
    const m = parseInput(measurementInputSchema, {
      compoundId: "c1", solventKey: "dcm", method: "layer_assay", basis: "concentration", organic: "3", aqueous: "0.3", aqueousPh: "", temperatureC: "", belowDetection: "",
    });
    expect(m).toMatchObject({ organic: 3, aqueous: 0.3, temperatureC: 25, belowDetection: "none" });
    expect(m.aqueousPh).toBeUndefined();
  });
});
