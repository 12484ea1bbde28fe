import { describe, expect, it } from "vitest";
import { validateWorkup } from "@/lib/chem/predict";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { applyGroupValues, partitionSources } from "@/lib/partition/overlay";
import { groupLabel, poolHistory, poolObservations, type ObservationForPool } from "@/lib/partition/pooled";

const obs = (id: string, logK: number, extra: Partial<ObservationForPool> = {}): ObservationForPool => ({
  id, logK, logKSe: 0.1, kind: "measured", bound: "value", weight: 1, excluded: false, createdAt: new Date(Date.UTC(2026, 9, Number(id.slice(1)))), ...extra,
});

describe("the group's pooled value", () => {
  it("is the mean with the standard error of the mean when stated errors are equal (textbook s/√n)", () => {
    const values = [1.1, 1.3, 1.2, 1.4];
    const p = poolObservations(values.map((v, i) => obs(`o${i + 1}`, v)));
    const mean = 1.25;
    const s = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / 3);
    expect(p.estimate).toBeCloseTo(mean, 12);
    expect(p.se).toBeCloseTo(s / 2, 12);
    expect(p.n).toBe(4);
    expect(p.label).toBe(`group data, n = 4, ±${(s / 2).toFixed(2)}`);
    expect(groupLabel(4, 0.1234)).toBe("group data, n = 4, ±0.12");
  });

  it("leaves excluded observations out and marks a gross outlier", () => {
    const p = poolObservations([obs("o1", 1.0), obs("o2", 1.05), obs("o3", 0.95), obs("o4", 1.02), obs("o5", 4.0), obs("o6", -3, { excluded: true })]);
    expect(p.nTotal).toBe(5);
    expect(p.outliers).toEqual(["o5"]);
    expect(p.n).toBe(4);
    expect(p.estimate).toBeCloseTo(1.005, 9);
  });

  it("reports bounds apart, and describes a bounds-only pair without an estimate", () => {
    const p = poolObservations([obs("o1", 2.1, { bound: "lower", logKSe: null, kind: "inferred", weight: 0.5 }), obs("o2", 2.5, { bound: "lower", logKSe: null })]);
    expect(p).toMatchObject({ estimate: null, lowerBound: 2.5, label: "group data: bounds only (log K ≥ 2.50, n = 2)" });
    expect(poolObservations([]).label).toBeNull();
  });

  it("weighs an inferred observation by its stored weight", () => {
    const p = poolObservations([obs("o1", 1.0), obs("o2", 2.0, { kind: "inferred", weight: 0.25 })]);
    // Variances 0.01 and 0.04: weights 100 and 25.
    expect(p.estimate).toBeCloseTo((100 * 1 + 25 * 2) / 125, 12);
  });

  it("traces the estimate as observations arrive, one point per value observation", () => {
    const history = poolHistory([obs("o3", 1.4), obs("o1", 1.0), obs("o2", 1.2), obs("o4", 9, { excluded: true })]);
    expect(history.map((h) => h.n)).toEqual([1, 2, 3]);
    expect(history.map((h) => h.observationId)).toEqual(["o1", "o2", "o3"]);
    expect(history[2]?.estimate).toBeCloseTo(1.2, 12);
    for (const h of history) expect(h.low).toBeLessThan(h.high);
  });
});

function parsed(raw: WorkupInputRaw) {
  const checked = validateWorkup(raw);
  if (!checked.success) throw new Error(JSON.stringify(checked.issues));
  return checked.data;
}

// Acetanilide: log P 1.16 (PhysProp experimental log Kow, from memory); no site ionizes near pH 7.
const spec: WorkupInputRaw = {
  components: [{
    key: "p", name: "Acetanilide", role: "product", molarMass: 135.17, amount: { value: 5, unit: "mmol" },
    logP: { value: 1.16, provenance: "literature", se: 0.1 },
    pKas: [{ value: 0.5, kind: "base", provenance: "estimated" }],
  }],
  mixture: { solvents: [{ solvent: "water", volume: { value: 60, unit: "mL" } }] },
  operations: [{ type: "extract", solvent: "etoac", volume: { value: 20, unit: "mL" }, portions: 2, keep: "organic" }, { type: "concentrate" }],
};

describe("laying group values over a spec", () => {
  const group = { value: 0.8, se: 0.12, n: 4, provenance: "group" as const, source: "group data, n = 4, ±0.12" };

  it("uses the group's log K and says so; without it the value comes from log P", () => {
    const before = partitionSources(parsed(spec), SOLVENTS);
    expect(before).toEqual([expect.objectContaining({ component: "p", solvent: "etoac", origin: "log_p", label: "from literature log P via the solvent's Collander line" })]);
    const after = applyGroupValues(parsed(spec), { p: { compoundId: "c1", logK: { etoac: group } } });
    expect(after.components[0]?.logK["etoac"]).toEqual(group);
    expect(partitionSources(after, SOLVENTS)).toEqual([{ component: "p", solvent: "etoac", logK: 0.8, se: 0.12, origin: "group", label: "group data, n = 4, ±0.12" }]);
  });

  it("takes the registry's log P and sites only where they differ from the spec's copy", () => {
    const same = applyGroupValues(parsed(spec), {
      p: { compoundId: "c1", logK: {}, logP: { value: 1.16, provenance: "literature" }, pKas: [{ value: 0.5, kind: "base", provenance: "estimated" }] },
    });
    expect(same.components[0]?.logP).toEqual({ value: 1.16, provenance: "literature", se: 0.1 }); // the spec's own se survives
    expect(same.components[0]?.pKas).toEqual([{ value: 0.5, kind: "base", provenance: "estimated" }]);
    const changed = applyGroupValues(parsed(spec), {
      p: { compoundId: "c1", logK: {}, logP: { value: 1.3, provenance: "measured" }, pKas: [{ value: 0.4, kind: "base", provenance: "measured" }] },
    });
    expect(changed.components[0]?.logP).toEqual({ value: 1.3, provenance: "measured" });
    expect(changed.components[0]?.pKas).toEqual([{ value: 0.4, kind: "base", provenance: "measured" }]);
  });

  it("labels a structure-only estimate as such", () => {
    const estimated = parsed({ ...spec, components: [{ ...spec.components[0]!, logP: { value: 1.2, provenance: "estimated" } }] });
    expect(partitionSources(estimated, SOLVENTS)[0]?.label).toBe("estimated from structure");
  });
});
