/** The inverse fit through the real engine: round trips, bounds, insensitivity, and pooling of several fits. */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { fitLogK, withLogK } from "@/lib/chem/fit";
import { poolLogK } from "@/lib/chem/pool";
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import { createRng } from "@/lib/chem/random";
import type { WorkupInput } from "@/lib/chem/schema";

function example(name: string): WorkupInput {
  const v = validateWorkup(JSON.parse(readFileSync(`examples/${name}.json`, "utf8")));
  if (!v.success) throw new Error(JSON.stringify(v.issues));
  return v.data;
}

/** The example with its acid and base washes repeated `portions` times with `washMl` each. */
function washedHarder(input: WorkupInput, portions: number, washMl: number): WorkupInput {
  return { ...input, operations: input.operations.map((op) => (op.type === "wash" ? { ...op, portions, volumeMl: washMl } : op)) };
}

describe("fitLogK through the engine", () => {
  const base = example("acid-base-separation");

  it.each([0.2, 0.6, 1.0])("recovers log K(EtOAc) = %s of the product from a work-up simulated with it", (truth) => {
    const input = washedHarder(base, 3, 40);
    const observed = simulateWorkup(withLogK(input, "benzanilide", "etoac", truth)).recovery.benzanilide ?? 0;
    const fit = fitLogK(input, simulateWorkup, { component: "benzanilide", observedRecovery: observed, solvent: "etoac" });
    expect(fit.kind).toBe("value");
    expect(fit.logK).toBeCloseTo(truth, 4);
    const [lo, hi] = fit.interval ?? [null, null];
    expect((lo ?? -Infinity) < truth && truth < (hi ?? Infinity)).toBe(true);
    // The equivalent log D is reported at a real contact of the sequence, with its pH.
    expect(fit.step).toBeGreaterThanOrEqual(1);
    expect(Number.isFinite(fit.pH)).toBe(true);
  });

  it("picks the extraction solvent itself and reports only a lower bound near full recovery", () => {
    const nominal = simulateWorkup(base).recovery.benzanilide ?? 0;
    const fit = fitLogK(base, simulateWorkup, { component: "benzanilide", observedRecovery: nominal });
    expect(fit.solvent).toBe("etoac");
    expect(fit.kind).toBe("lower_bound");
    const atBound = simulateWorkup(withLogK(base, "benzanilide", "etoac", fit.logK ?? 0)).recovery.benzanilide ?? 0;
    expect(atBound).toBeCloseTo(nominal - 1.959964 * 0.03, 3);
  });

  it("says a recovery that no K can change is uninformative", () => {
    // Triethylamine (bp 89 °C) leaves on the rotary evaporator whatever its partition coefficient.
    const fit = fitLogK(base, simulateWorkup, { component: "triethylamine", observedRecovery: 0 });
    expect(fit.kind).toBe("uninformative");
    expect(fit.logK).toBeNull();
  });

  it("pools fits from several noisy work-ups into an estimate that covers the truth", () => {
    const truth = 0.7;
    const sigma = 0.02;
    const rng = createRng(11);
    const fits = [[2, 30], [3, 40], [2, 60], [4, 25], [3, 50], [2, 45]].map(([portions, ml], i) => {
      const input = washedHarder(base, portions ?? 2, ml ?? 30);
      const exact = simulateWorkup(withLogK(input, "benzanilide", "etoac", truth)).recovery.benzanilide ?? 0;
      const fit = fitLogK(input, simulateWorkup, { component: "benzanilide", observedRecovery: exact + sigma * rng.normal(), recoverySe: sigma, solvent: "etoac" });
      expect(fit.kind).toBe("value");
      return { id: `w${i}`, logK: fit.logK ?? NaN, se: fit.se ?? 1, source: "inferred" as const };
    });
    const pooled = poolLogK(fits);
    expect(pooled.nUsed).toBe(6);
    expect(pooled.interval?.[0]).toBeLessThan(truth);
    expect(pooled.interval?.[1]).toBeGreaterThan(truth);
    expect(pooled.se).toBeLessThan(0.1);
  });
});
