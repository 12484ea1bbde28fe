import { describe, expect, it } from "vitest";
import { createRng } from "@/lib/chem/random";
import {
  FLAG_PROBABILITY, fitGroupModel, insideAt, judgeOutcome, predictiveOf, recoveryInterval, shortfallProbability,
  type HistoryCase, type PredictiveCase,
} from "@/lib/chem/predictive";

// A wash–dry–concentrate workup: 4 separation cuts, one drying, one concentration, one transfer into the funnel.
const typical: PredictiveCase = {
  engine: { recovery: 0.98, low: 0.97, high: 0.99 },
  handling: { transfer: 1, separation: 4, drying: 1, concentration: 1 },
  assay: "qnmr", crudeAssayed: true,
};

function history(n: number, separationLoss: number, seed = 7, shortfalls = 0): HistoryCase[] {
  const rng = createRng(seed);
  return Array.from({ length: n }, (_, i) => {
    const handling = -(4 * separationLoss + 0.005 + 0.005 + 0.01) + 0.02 * rng.normal();
    const failure = i < shortfalls ? Math.log(0.5) : 0;
    return { ...typical, observedLog: Math.log(0.98) + handling + 0.015 * rng.normal() + failure };
  });
}

describe("predictive distribution of the reported recovery", () => {
  it("expects the few percent a wash-dry-concentrate sequence ordinarily loses (common practice: 3–8 %)", () => {
    const p = predictiveOf(fitGroupModel([]), typical);
    const interval = recoveryInterval(p);
    expect(interval.median / typical.engine.recovery).toBeGreaterThan(0.92);
    expect(interval.median / typical.engine.recovery).toBeLessThan(0.97);
    // Never a "96–96 %" interval: the assay and handling scatter alone are a few percent wide.
    expect(interval.high - interval.low).toBeGreaterThan(0.04);
  });

  it("is wider without an assay of the crude (the reaction's own scatter) and reads high on a weight alone", () => {
    const m = fitGroupModel([]);
    const assayed = predictiveOf(m, typical);
    const unassayed = predictiveOf(m, { ...typical, crudeAssayed: false });
    expect(unassayed.logSd).toBeGreaterThan(assayed.logSd * 1.5);
    const weighed = predictiveOf(m, { ...typical, assay: "weight_only" });
    expect(weighed.logMean).toBeGreaterThan(assayed.logMean);
  });

  it("pools partially: a few outcomes barely move the group's loss per separation, many pull it to the group's figure", () => {
    const prior = fitGroupModel([]).means["loss.separation"]!;
    const few = fitGroupModel(history(3, 0.03)).means["loss.separation"]!;
    const many = fitGroupModel(history(200, 0.03)).means["loss.separation"]!;
    expect(few).toBeGreaterThan(prior);
    expect(many).toBeGreaterThan(few);
    expect(Math.abs(many - 0.03)).toBeLessThan(Math.abs(few - 0.03));
  });

  it("does not learn shortfalls as ordinary losses", () => {
    const clean = fitGroupModel(history(100, 0.005));
    const withFailures = fitGroupModel(history(100, 0.005, 7, 10));
    const loss = (m: typeof clean) => predictiveOf(m, typical).logMean;
    expect(Math.abs(loss(withFailures) - loss(clean))).toBeLessThan(0.01);
    expect(withFailures.shortfallShare).toBeGreaterThan(clean.shortfallShare);
  });

  it("covers about 95 % of clean outcomes drawn with skewed (gamma-like) handling losses", () => {
    const rng = createRng(11);
    const draw = (): number => {
      // Sum of four exponential cut losses of mean 0.5 % plus the rest: skewed, unlike the model's normal terms.
      let loss = 0.02;
      for (let k = 0; k < 4; k++) loss += -0.005 * Math.log(1 - rng.uniform());
      return Math.log(0.98) - loss + 0.015 * rng.normal() + 0.02 * rng.normal();
    };
    const past: HistoryCase[] = Array.from({ length: 150 }, () => ({ ...typical, observedLog: draw() }));
    const model = fitGroupModel(past);
    const p = predictiveOf(model, typical);
    let inside = 0;
    const n = 4000;
    for (let i = 0; i < n; i++) if (insideAt(judgeOutcome(model, p, draw()).quantile, 0.95)) inside++;
    expect(inside / n).toBeGreaterThan(0.93);
    expect(inside / n).toBeLessThan(0.99);
  });
});

describe("outcome status", () => {
  it("calls a shortfall 'below' only with posterior probability ≥ 0.95, and just under the interval 'inconclusive'", () => {
    const model = fitGroupModel([]);
    const p = predictiveOf(model, typical);
    expect(judgeOutcome(model, p, p.logMean).status).toBe("as_expected");
    expect(judgeOutcome(model, p, p.logMean - 2.3 * p.logSd).status).toBe("inconclusive");
    const far = judgeOutcome(model, p, p.logMean + Math.log(0.6));
    expect(far.status).toBe("below");
    expect(far.shortfallProbability).toBeGreaterThanOrEqual(FLAG_PROBABILITY);
    expect(judgeOutcome(model, p, p.logMean + 3 * p.logSd).status).toBe("above");
  });

  it("grows the shortfall probability with the gap", () => {
    let last = 0;
    for (const gap of [-0.1, 0, 0.05, 0.1, 0.2, 0.4, 0.8]) {
      const p = shortfallProbability(gap, 0.05, 0.1);
      expect(p).toBeGreaterThanOrEqual(last);
      last = p;
    }
    expect(shortfallProbability(0, 0.05, 0.1)).toBeLessThan(0.1);
    expect(shortfallProbability(0.8, 0.05, 0.1)).toBeGreaterThan(0.999);
  });
});
