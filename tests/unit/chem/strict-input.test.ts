/**
 * Strict input: misspelt keys are refused with their path and the nearest allowed key, amounts beyond a stated range
 * are refused, a log K for a solvent the library lacks is refused, a step on a layer that an earlier step removed is
 * refused, and the textbook idealisations are reachable from the input's `options`. Stored records the app wrote
 * itself are read tolerantly (unknown keys dropped).
 */
import { describe, expect, it } from "vitest";
import { predictWorkup, simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import { workupInputSchema, type WorkupInputRaw } from "@/lib/chem/schema";
import { editDistance, suggestKey, withoutUnknownKeys } from "@/lib/chem/schema-strict";
import { mL, mmol, neutral, wash, workup } from "./fixtures";

function issues(raw: unknown, options: Parameters<typeof validateWorkup>[1] = {}): string[] {
  const r = validateWorkup(raw, options);
  return r.success ? [] : r.issues.map((i) => `${i.path}: ${i.message}`);
}

const base = (): WorkupInputRaw => workup([neutral("p", 2)], [["etoac", 50]], [wash("water", 20)]);

describe("edit distance and suggestions", () => {
  it("counts edits as Levenshtein does, a swap of neighbours as one (optimal string alignment)", () => {
    // kitten → sitting: 3 edits (the textbook example of Levenshtein distance; from memory)
    expect(editDistance("kitten", "sitting")).toBe(3);
    expect(editDistance("portion", "portions")).toBe(1);
    expect(editDistance("protions", "portions")).toBe(1); // one transposition
    expect(editDistance("PKA", "pKa")).toBe(0); // case-insensitive
    expect(editDistance("", "abc")).toBe(3);
  });
  it("suggests only a near key", () => {
    expect(suggestKey("portion", ["portions", "volume", "keep"])).toBe("portions");
    expect(suggestKey("molarmass", ["molarMass", "amount"])).toBe("molarMass");
    expect(suggestKey("zzzzzz", ["portions", "volume"])).toBeNull();
  });
});

describe("unknown keys are refused with their path and a suggestion", () => {
  it("a misspelt portions no longer runs one portion", () => {
    const r = base();
    (r.operations[0] as Record<string, unknown>).portion = 5;
    expect(issues(r)).toEqual(["operations.0.portion: `portion`: unknown key; did you mean `portions`?"]);
  });

  it("a misspelt pKas no longer makes the compound neutral", () => {
    const r = base();
    (r.components[0] as Record<string, unknown>).pKa = [{ value: 4.2, kind: "acid", provenance: "literature" }];
    expect(issues(r)).toEqual(["components.0.pKa: `pKa`: unknown key; did you mean `pKas`?"]);
  });

  it("every level is checked, every key reported at once", () => {
    const r = base() as unknown as Record<string, unknown> & { components: Record<string, unknown>[]; mixture: { solvents: Record<string, unknown>[] } };
    r.funnell = { value: 250, unit: "mL" };
    (r.components[0]?.logP as Record<string, unknown>).provenence = "literature";
    (r.components[0] as Record<string, unknown>).amount = { value: 5, unti: "mmol", unit: "mmol" };
    (r.mixture.solvents[0] as Record<string, unknown>).volumeMl = 50;
    const found = issues(r);
    expect(found).toContain("funnell: `funnell`: unknown key; did you mean `funnel`?");
    expect(found).toContain("components.0.logP.provenence: `provenence`: unknown key; did you mean `provenance`?");
    expect(found).toContain("components.0.amount.unti: `unti`: unknown key; did you mean `unit`?");
    expect(found).toContain("mixture.solvents.0.volumeMl: `volumeMl`: unknown key; did you mean `volume`?");
    expect(found).toHaveLength(4);
  });

  it("an unknown key far from every allowed one lists what is allowed", () => {
    const r = base();
    (r.operations[0] as Record<string, unknown>).colour = "blue";
    const [line] = issues(r);
    expect(line).toMatch(/^operations\.0\.colour: `colour`: unknown key; allowed here: `type`, `reagent`, `volume`, `portions`/);
  });

  it("unknown keys are reported beside the other problems of the same object", () => {
    const r = base();
    r.operations = [{ type: "adjust_ph", reagent: "hcl_1m", target_ph: 3 } as never];
    const found = issues(r);
    expect(found).toContain("operations.0.target_ph: `target_ph`: unknown key; did you mean `targetPh`?");
    expect(found).toContain("operations.0.volume: adjust_ph needs exactly one of volume, amount or targetPh");
  });

  it("a log K for a solvent the library does not know is refused, not ignored", () => {
    const r = base();
    (r.components[0] as Record<string, unknown>).logK = { etoc: { value: 1.5, provenance: "measured" } };
    expect(issues(r)).toEqual(["components.0.logK.etoc: log K for unknown solvent 'etoc'; did you mean 'etoac'?"]);
  });
});

describe("plausible ranges", () => {
  it.each<[string, { value: number; unit: "mmol" | "mol" | "g" | "mg" }, string]>([
    // Limits stated in lib/chem/schema-quantities.ts: 10 kmol or 1000 kg per component.
    ["20 kmol", { value: 20_000, unit: "mol" }, "components.0.amount.value: amount must be ≤ 10 kmol (got 20000 mol)"],
    ["2 t", { value: 2e6, unit: "g" }, "components.0.amount.value: amount must be ≤ 1000 kg (got 2000000 g)"],
  ])("refuses a component amount of %s", (_name, amount, message) => {
    const r = base();
    (r.components[0] as Record<string, unknown>).amount = amount;
    expect(issues(r)).toEqual([message]);
  });
  it("accepts a kilo-lab amount", () => {
    const r = base();
    (r.components[0] as Record<string, unknown>).amount = { value: 5000, unit: "g" };
    expect(issues(r)).toEqual([]);
  });
});

describe("a step on a layer that is gone is refused, naming the step", () => {
  it("a wash after the organic layer was discarded", () => {
    const r = workup([neutral("p", 2)], [["etoac", 50]], [
      { type: "back_extract", reagent: "hcl_1m", volume: mL(30) },
      wash("brine", 20),
    ]);
    expect(issues(r)).toEqual([
      "operations.1: step 2 (wash) washes the organic layer, but there is no organic layer any more: the organic layer went to waste at step 1; charge or extract with an organic solvent first, or remove the step",
    ]);
  });
  it("drying after the solvent was evaporated, and an extraction of an organic layer alone", () => {
    const r = workup([neutral("p", 2)], [["etoac", 50]], [wash("water", 20), { type: "extract", solvent: "dcm", volume: mL(20) }]);
    expect(issues(r)[0]).toMatch(/^operations\.1: step 2 \(extract\) extracts the aqueous layer, but there is no aqueous layer any more: the aqueous layer went to waste at step 1/);
    const dried = workup([neutral("p", 2)], [["etoac", 50]], [wash("water", 20), { type: "concentrate" }, { type: "dry", agent: "mgso4" }]);
    expect(issues(dried)[0]).toMatch(/^operations\.2: step 3 \(dry\) dries the organic layer, but there is no organic layer any more: the solvent was evaporated at step 2/);
  });
  it("accepts the usual acid–base swing: back-extract, basify, re-extract, combine the saved layer", () => {
    const r = workup([neutral("p", 2)], [["etoac", 50]], [
      { type: "back_extract", reagent: "hcl_1m", volume: mL(30), saveAs: "org" },
      { type: "adjust_ph", reagent: "naoh_1m", targetPh: 12 },
      { type: "extract", solvent: "etoac", volume: mL(30) },
      { type: "combine", streams: ["org"] },
      wash("brine", 20),
      { type: "dry", agent: "mgso4" },
      { type: "concentrate" },
    ]);
    expect(issues(r)).toEqual([]);
  });
});

describe("idealisations from the input's options", () => {
  // Neutral solute, K = 10 between the solvent and water; with mutually insoluble phases the fraction left in the
  // organic layer after n washes of volume V_aq is (1 + V_aq/(K·V_org))^−n (the extraction equation, e.g. Harris,
  // Quantitative Chemical Analysis, ch. "Solvent extraction").
  const solute = { key: "s", name: "s", role: "product" as const, molarMass: 150, amount: mmol(1), logK: { etoac: { value: 1, provenance: "literature" as const } } };
  const textbook = (1 / (1 + 50 / (10 * 50))) ** 2;

  it("idealPhases and noSaltingOut make a brine wash follow the extraction equation", () => {
    const ideal = workup([solute], [["etoac", 50]], [wash("brine", 50, 2)], { options: { idealPhases: true, noSaltingOut: true } });
    expect(predictWorkup(ideal).recovery.s).toBeCloseTo(textbook, 10);
    // Without noSaltingOut, salt raises K (Setschenow), so brine leaves more in the organic layer.
    const salted = workup([solute], [["etoac", 50]], [wash("brine", 50, 2)], { options: { idealPhases: true } });
    expect(predictWorkup(salted).recovery.s).toBeGreaterThan(textbook + 1e-3);
  });

  it("noIonPartition keeps every charged form in the water", () => {
    // A permanent cation (quaternary ammonium) with a lipophilic counter-ion and a large log P, which the full model
    // lets pair into DCM; the idealisation sets K_ion = 0 by definition, so none may stay in the organic layer.
    const quat = { ...neutral("q", 4), fixedCharge: 1, counterIon: "lipophilic" as const };
    const ideal = workup([quat], [["dcm", 50]], [wash("water", 50)], { options: { noIonPartition: true } });
    expect(predictWorkup(ideal).recovery.q).toBeLessThan(1e-12);
    const full = workup([quat], [["dcm", 50]], [wash("water", 50)]);
    expect(predictWorkup(full).recovery.q).toBeGreaterThan(1e-6);
  });

  it("refuses an unknown option with a suggestion", () => {
    const r = base();
    (r as Record<string, unknown>).options = { idealPhase: true };
    expect(issues(r)).toEqual(["options.idealPhase: `idealPhase`: unknown key; did you mean `idealPhases`?"]);
  });
});

describe("stored records are read tolerantly", () => {
  const withExtras = () => {
    const r = base() as unknown as Record<string, unknown> & { components: Record<string, unknown>[]; operations: Record<string, unknown>[] };
    r.legacyNote = "saved by an older version";
    (r.components[0] as Record<string, unknown>).colour = "white";
    (r.operations[0] as Record<string, unknown>).shakeSeconds = 30;
    return r;
  };
  it("drops the keys the schema does not know, and only those", () => {
    const { value, dropped } = withoutUnknownKeys(workupInputSchema, withExtras());
    expect(dropped.sort()).toEqual(["components.0.colour", "legacyNote", "operations.0.shakeSeconds"]);
    expect(value).toEqual(base());
  });
  it("validateWorkup refuses them from a person and reads them from storage with the same prediction", () => {
    expect(issues(withExtras())).toHaveLength(3);
    const stored = validateWorkup(withExtras(), { stored: true });
    if (!stored.success) throw new Error(JSON.stringify(stored.issues));
    expect(simulateWorkup(stored.data).recovery).toEqual(predictWorkup(base()).recovery);
  });
  it("a stored log K for a solvent no longer in the library is dropped, not refused", () => {
    const r = base();
    (r.components[0] as Record<string, unknown>).logK = { oldsolvent: { value: 1.5, provenance: "measured" } };
    expect(validateWorkup(r, { stored: true }).success).toBe(true);
    expect(issues(r)).toEqual(["components.0.logK.oldsolvent: log K for unknown solvent 'oldsolvent'"]);
  });
});
