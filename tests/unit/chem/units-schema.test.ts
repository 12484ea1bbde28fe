import { describe, expect, it } from "vitest";
import { fromCanonical, toCanonical, toMmol, unitsOf, GAS_MOLAR_VOLUME_ML_PER_MMOL } from "@/lib/chem/units";
import { workupInputSchema, type WorkupInputRaw } from "@/lib/chem/schema";
import { validateWorkup, predictWorkup, WorkupValidationError } from "@/lib/chem/predict";

const base = (): WorkupInputRaw => ({
  components: [{ key: "p", name: "Product", role: "product", molarMass: 200, amount: { value: 1000, unit: "mg" }, logP: { value: 2, provenance: "estimated" } }],
  mixture: { solvents: [{ solvent: "etoac", volume: { value: 50, unit: "mL" } }] },
  operations: [{ type: "wash", reagent: "water", volume: { value: 20, unit: "mL" } }],
});

function issues(raw: unknown): string[] {
  const r = validateWorkup(raw);
  return r.success ? [] : r.issues.map((i) => `${i.path}: ${i.message}`);
}

describe("unit table", () => {
  it("converts to canonical units", () => {
    expect(toCanonical(1.5, "L")).toBe(1500);
    expect(toCanonical(250, "uL")).toBeCloseTo(0.25, 12);
    expect(toCanonical(2, "mol")).toBe(2000);
    expect(toCanonical(500, "mg")).toBeCloseTo(0.5, 12);
    expect(toCanonical(25, "mmol/L")).toBeCloseTo(0.025, 12);
    expect(toCanonical(298.15, "K")).toBeCloseTo(25, 10);
    // 1 torr = 101325/760 Pa = 1.33322 mbar (definition of the torr)
    expect(toCanonical(760, "torr")).toBeCloseTo(1013.25, 8);
    expect(fromCanonical(toCanonical(3.3, "L"), "L")).toBeCloseTo(3.3, 12);
  });
  it("turns a mass into mmol with the molar mass", () => {
    expect(toMmol(1, "g", 200)).toBeCloseTo(5, 12);
    expect(toMmol(122.12, "mg", 122.12)).toBeCloseTo(1, 12);
  });
  it("lists a closed set per dimension", () => {
    expect(unitsOf("volume").sort()).toEqual(["L", "mL", "uL"]);
    expect(unitsOf("temperature").sort()).toEqual(["K", "°C"]);
  });
  it("uses RT/p at 25 °C for gas volume (CODATA R = 8.314462618 J/mol/K)", () => {
    expect(GAS_MOLAR_VOLUME_ML_PER_MMOL).toBeCloseTo((8.314462618 * 298.15) / 101325 * 1000, 2);
  });
});

describe("workup schema", () => {
  it("normalizes quantities once", () => {
    const w = workupInputSchema.parse({ ...base(), temperature: { value: 298.15, unit: "K" } });
    expect(w.components[0]?.amountMmol).toBeCloseTo(5, 12);
    expect(w.mixture.solvents[0]?.volumeMl).toBe(50);
    expect(w.temperatureC).toBeCloseTo(25, 10);
    const op = w.operations[0];
    expect(op?.type === "wash" && op.volumeMl === 20 && op.portions === 1 && op.keep === "organic").toBe(true);
  });

  it.each<[string, (r: WorkupInputRaw) => void, string]>([
    ["negative volume", (r) => { r.operations = [{ type: "wash", reagent: "water", volume: { value: -5, unit: "mL" } }]; }, "operations.0.volume.value: volume per portion must be > 0"],
    ["impossible volume", (r) => { r.operations = [{ type: "extract", solvent: "etoac", volume: { value: 2000, unit: "L" } }]; }, "operations.0.volume.value: volume per portion must be ≤ 1000 L"],
    ["unknown unit", (r) => { r.operations = [{ type: "charge", solvent: "etoac", volume: { value: 5, unit: "gallon" as "mL" } }]; }, "operations.0.volume.unit: unit must be one of uL, mL, L"],
    ["zero portions", (r) => { r.operations = [{ type: "wash", reagent: "water", volume: { value: 5, unit: "mL" }, portions: 0 }]; }, "operations.0.portions: portions must be ≥ 1"],
    ["fractional portions", (r) => { r.operations = [{ type: "wash", reagent: "water", volume: { value: 5, unit: "mL" }, portions: 1.5 }]; }, "operations.0.portions: portions must be a whole number"],
    ["molar mass", (r) => { (r.components[0] as { molarMass: number }).molarMass = 0; }, "components.0.molarMass: molarMass must be > 0"],
    ["pKa kind", (r) => { (r.components[0] as { pKas: unknown[] }).pKas = [{ value: 4, kind: "acidic", provenance: "literature" }]; }, "components.0.pKas.0.kind: pKa kind must be 'acid' or 'base'"],
    ["adjust_ph without quantity", (r) => { r.operations = [{ type: "adjust_ph", reagent: "hcl_1m" }]; }, "operations.0.volume: adjust_ph needs exactly one of volume, amount or targetPh"],
    ["quench without quantity", (r) => { r.operations = [{ type: "quench", reagent: "water" }]; }, "operations.0.volume: quench needs a volume or an amount of reagent"],
    ["target pH out of range", (r) => { r.operations = [{ type: "adjust_ph", reagent: "hcl_1m", targetPh: 20 }]; }, "operations.0.targetPh: targetPh must be between −2 and 16"],
    ["no operations", (r) => { r.operations = []; }, "operations: at least one operation is required"],
    ["bad temperature", (r) => { r.temperature = { value: 500, unit: "°C" }; }, "temperature.value: temperature must be between −100 °C and 250 °C"],
  ])("rejects %s with a clear message", (_name, mutate, message) => {
    const r = base();
    mutate(r);
    expect(issues(r)).toContain(message);
  });

  it("checks keys and stream names across the list", () => {
    const r = base();
    r.components.push({ ...(r.components[0] as object) } as never);
    r.operations = [
      { type: "wash", reagent: "water", volume: { value: 20, unit: "mL" }, saveAs: "aq" },
      { type: "combine", streams: ["aq", "missing"] },
    ];
    const found = issues(r);
    expect(found).toContain("components.1.key: duplicate component key 'p'");
    expect(found).toContain("operations.1.streams.1: no stream saved as 'missing' before step 2");
  });

  it("checks names against the library", () => {
    const r = base();
    r.operations = [
      { type: "wash", reagent: "unobtainium", volume: { value: 20, unit: "mL" } },
      { type: "extract", solvent: "thf", volume: { value: 20, unit: "mL" } },
      { type: "dry", agent: "sand" },
      { type: "add_salt", salt: "brine", saturate: true },
    ];
    expect(issues(r)).toEqual([
      "operations.0.reagent: unknown reagent 'unobtainium'",
      "operations.1.solvent: 'thf' is water-miscible and cannot form an extraction layer",
      "operations.2.agent: unknown drying agent 'sand'",
      "operations.3.salt: 'brine' is not a solid salt",
    ]);
  });

  it("needs a partition value for every component", () => {
    const r = base();
    delete (r.components[0] as { logP?: unknown }).logP;
    expect(issues(r)).toEqual(["components.0.logP: component 'p' needs logP or a logK for a solvent"]);
  });

  it("predictWorkup throws a typed 422 error", () => {
    const r = base();
    r.operations = [{ type: "wash", reagent: "water", volume: { value: 0, unit: "mL" } }];
    try {
      predictWorkup(r);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(WorkupValidationError);
      expect((e as WorkupValidationError).status).toBe(422);
      expect((e as WorkupValidationError).issues[0]?.message).toBe("volume per portion must be > 0");
    }
  });

  it("accepts library overrides from a group", () => {
    const r = base();
    r.operations = [{ type: "wash", reagent: "house_wash", volume: { value: 20, unit: "mL" } }];
    expect(validateWorkup(r).success).toBe(false);
    const reagents = { house_wash: { key: "house_wash", name: "House wash", kind: "solution" as const, purpose: "neutral" as const,
      density: { value: 1.0, source: "group", confidence: "assumed" as const }, basis: { value: 0, source: "group", confidence: "assumed" as const }, ions: {}, systems: {} } };
    expect(validateWorkup(r, { reagents }).success).toBe(true);
    expect(predictWorkup(r, { reagents }).recovery.p).toBeGreaterThan(0.5);
  });
});
