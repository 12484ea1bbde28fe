/**
 * Synthetic study: workups are generated from a known log K with realistic noise, each is inverse-fitted the way the
 * app infers observations from outcomes, and the fits are pooled the way the app pools them. The pooled estimate
 * must recover K, and its 95 % interval must cover the truth in 93–97 % of repeats.
 * Noise: every volume off its recorded value by ±5 % (one standard deviation; the figure lib/chem/perturb.ts uses),
 * and the reported recovery off the true one by 3 percentage points (qNMR with an internal standard, the figure
 * lib/partition/inferred.ts states for it; from memory).
 */
import { describe, expect, it } from "vitest";
import { simulateWorkup } from "@/lib/chem/predict";
import { inferFromOutcome, VOLUME_LOGK_SE } from "@/lib/partition/inferred";
import { poolObservations, type ObservationForPool } from "@/lib/partition/pooled";
import { DEFAULTS_NOTE, runStudy } from "./study";
import { DESIGNS, extraction, PRODUCT, recoveryAt } from "./synthetic";

describe("synthetic study: workups from a known K, inverse-fitted, then pooled", () => {
  it(`recovers K and its 95 % interval covers the truth in 93–97 % of 400 repeats (${DEFAULTS_NOTE})`, () => {
    const result = runStudy({ seed: 20261205, repeats: 400, workupsPerRepeat: 4 });
    console.info(`[synthetic study] coverage ${(100 * result.coverage).toFixed(1)} % of ${result.pooled} pooled estimates; ` +
      `bias ${result.bias.toFixed(4)}, RMS error ${result.rmsError.toFixed(3)} log units; ${result.leftOut} of ${result.fits} records left out by the inference rules`);
    expect(result.pooled).toBeGreaterThanOrEqual(395);
    expect(result.coverage).toBeGreaterThanOrEqual(0.93);
    expect(result.coverage).toBeLessThanOrEqual(0.97);
    expect(Math.abs(result.bias)).toBeLessThan(0.02);
    expect(result.rmsError).toBeLessThan(0.15);
  }, 60_000);

  it("would reject an interval that is too narrow: at 30 % of the width, coverage falls far below 93 %", () => {
    const result = runStudy({ seed: 7, repeats: 60, workupsPerRepeat: 4, intervalScale: 0.3 });
    expect(result.coverage).toBeLessThan(0.8);
  }, 60_000);

  it("a single noiseless record is fitted back to its K", () => {
    const spec = extraction(...(DESIGNS[0] as [number, number, number]));
    const truth = 0.65;
    const inference = inferFromOutcome({ spec, productKey: PRODUCT, recovery: recoveryAt(spec, truth), basis: "assayed", purityMethod: "qnmr", flags: [] }, simulateWorkup);
    expect(inference.use).toBe(true);
    if (!inference.use) return;
    expect(inference.bound).toBe("value");
    expect(inference.logK).toBeCloseTo(truth, 5);
    const pooled = poolObservations([{ id: "w", logK: inference.logK, logKSe: inference.se, kind: "inferred", bound: "value", weight: inference.weight, excluded: false, createdAt: new Date(0) } satisfies ObservationForPool]);
    expect(pooled.estimate).toBeCloseTo(truth, 5);
    // Its standard error is the fit's (3 % recovery uncertainty through the slope) combined with the volume term.
    expect(inference.se).toBeCloseTo(Math.hypot(inference.fit.se ?? NaN, VOLUME_LOGK_SE), 12);
  });
});
