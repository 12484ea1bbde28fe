// The library editor's schemas accept every shipped entry (they describe the engine's own tables) and refuse the
// slips a form invites, with a message naming the field.
import { describe, expect, it } from "vitest";
import { REAGENTS } from "@/lib/chem/data/reagents";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { reagentPropsSchema, solventPropsSchema } from "@/lib/library/schemas";
import { fromForm, REAGENT_FIELDS, SOLVENT_FIELDS, toForm } from "@/lib/library/form-model";

describe("library schemas", () => {
  it.each(Object.keys(SOLVENTS))("shipped solvent %s fits", (key) => {
    expect(solventPropsSchema.safeParse(SOLVENTS[key]).error?.issues ?? []).toEqual([]);
  });

  it.each(Object.keys(REAGENTS))("shipped reagent %s fits", (key) => {
    expect(reagentPropsSchema.safeParse(REAGENTS[key]).error?.issues ?? []).toEqual([]);
  });

  const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
    (r.error?.issues ?? []).map((i) => `${i.path.join(".")}: ${i.message}`);

  it("refuses a density typed in kg/m³ and a layer-forming solvent without partition lines", () => {
    const etoac = SOLVENTS.etoac!;
    const r = solventPropsSchema.safeParse({ ...etoac, density: { ...etoac.density, value: 900.3 }, partition: null });
    expect(messages(r)).toEqual(expect.arrayContaining([
      "density.value: density (g/mL) must be between 0.4 and 3",
      "partition: a solvent that forms a layer needs partition lines (log K = a·log P + b)",
    ]));
  });

  it("refuses a solution without its density, and a key the records could not use", () => {
    const r = reagentPropsSchema.safeParse({ ...REAGENTS.brine!, density: null, key: "Sat. brine" });
    expect(messages(r)).toEqual(expect.arrayContaining([
      "key: key: 1–40 lower-case letters, digits, '_', '-' or '.', as used in workup records",
    ]));
    const noDensity = reagentPropsSchema.safeParse({ ...REAGENTS.brine!, density: null });
    expect(messages(noDensity)).toEqual(["density: a solution needs its density"]);
  });
});

describe("library form model", () => {
  it.each(Object.keys(SOLVENTS))("solvent %s survives a trip through the form", (key) => {
    const entry = SOLVENTS[key];
    expect(solventPropsSchema.parse(fromForm(SOLVENT_FIELDS, toForm(SOLVENT_FIELDS, entry)))).toEqual(solventPropsSchema.parse(entry));
  });

  it.each(Object.keys(REAGENTS))("reagent %s survives a trip through the form", (key) => {
    const entry = REAGENTS[key];
    expect(reagentPropsSchema.parse(fromForm(REAGENT_FIELDS, toForm(REAGENT_FIELDS, entry)))).toEqual(reagentPropsSchema.parse(entry));
  });

  it("a half-filled partition group reaches the schema, which names what is missing", () => {
    const form = toForm(SOLVENT_FIELDS, SOLVENTS.etoac);
    form["partition.se"] = "";
    const r = solventPropsSchema.safeParse(fromForm(SOLVENT_FIELDS, form));
    expect(r.error?.issues.map((i) => `${i.path.join(".")}: ${i.message}`)).toEqual(["partition.se: standard error must be a number"]);
  });
});
