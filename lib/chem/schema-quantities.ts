/**
 * Zod pieces for quantities at the boundary: each is `{ value, unit }` with a unit from units.ts and is
 * normalized once to the canonical unit (mL, mmol, g, mol/L, °C, mbar). Messages name the field so a form can
 * show them beside it ("volume must be > 0").
 */
import { z } from "zod";
import { strictObject } from "./schema-strict";
import { toCanonical, unitsOf, type UnitName } from "./units";

function unitEnum(dimension: Parameters<typeof unitsOf>[0]) {
  const units = unitsOf(dimension) as [UnitName, ...UnitName[]];
  return z.enum(units, { error: () => `unit must be one of ${units.join(", ")}` });
}

const finite = (label: string) =>
  z.number({ error: `${label} must be a number` }).refine(Number.isFinite, { error: `${label} must be finite` });

function quantity(dimension: Parameters<typeof unitsOf>[0], label: string, check: (canonical: number) => string | null) {
  return strictObject({ value: finite(label), unit: unitEnum(dimension) })
    .transform((q, ctx) => {
      const canonical = toCanonical(q.value, q.unit);
      const problem = check(canonical);
      if (problem) ctx.addIssue({ code: "custom", message: problem, path: ["value"] });
      return canonical;
    });
}

/** Largest liquid volume accepted for one stream or portion: 1,000 L (pilot plant, not a bench work-up). */
export const MAX_VOLUME_ML = 1e6;

export const volumeSchema = (label = "volume") =>
  quantity("volume", label, (ml) =>
    ml <= 0 ? `${label} must be > 0` : ml > MAX_VOLUME_ML ? `${label} must be ≤ 1000 L` : null);

export const massSchema = (label = "mass") =>
  quantity("mass", label, (g) => (g <= 0 ? `${label} must be > 0` : g > 1e6 ? `${label} must be ≤ 1000 kg` : null));

export const amountSchema = (label = "amount") =>
  quantity("amount", label, (mmol) => (mmol <= 0 ? `${label} must be > 0` : mmol > 1e7 ? `${label} must be ≤ 10 kmol` : null));

export const temperatureSchema = (label = "temperature") =>
  quantity("temperature", label, (c) =>
    c < -100 || c > 250 ? `${label} must be between −100 °C and 250 °C` : null);

export const pressureSchema = (label = "pressure") =>
  quantity("pressure", label, (mbar) => (mbar <= 0 || mbar > 1100 ? `${label} must be > 0 and ≤ 1100 mbar` : null));

/** Largest component amount accepted: 10 kmol or 1,000 kg (far beyond a bench or kilo-lab work-up). */
export const MAX_COMPONENT_MMOL = 1e7;
export const MAX_COMPONENT_G = 1e6;

/** A component amount may be given as an amount (mmol, mol) or a mass (mg, g); converted with the molar mass. */
export const componentAmountSchema = strictObject({
  value: finite("amount").refine((v) => v >= 0, { error: "amount must be ≥ 0" }),
  unit: z.enum(["umol", "mmol", "mol", "mg", "g"], { error: () => "amount unit must be one of umol, mmol, mol, mg, g" }),
}).superRefine((a, ctx) => {
  const mass = a.unit === "mg" || a.unit === "g";
  const canonical = toCanonical(a.value, a.unit);
  if (mass ? canonical > MAX_COMPONENT_G : canonical > MAX_COMPONENT_MMOL) {
    ctx.addIssue({ code: "custom", path: ["value"], message: `amount must be ≤ ${mass ? "1000 kg" : "10 kmol"} (got ${a.value} ${a.unit})` });
  }
});

export const pHSchema = (label = "pH") =>
  finite(label).refine((v) => v >= -2 && v <= 16, { error: `${label} must be between −2 and 16` });

export { finite as finiteNumber };
