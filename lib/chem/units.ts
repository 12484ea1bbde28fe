/**
 * The one closed set of unit names accepted at the boundary, and the one table that converts them to the
 * engine's canonical units: mL, mmol, g, mol/L, °C, mbar. Everything inside lib/chem works in canonical units.
 */

export type Dimension = "volume" | "amount" | "mass" | "concentration" | "temperature" | "pressure";

interface UnitDef {
  readonly dimension: Dimension;
  /** canonical = value · factor + offset */
  readonly factor: number;
  readonly offset: number;
}

export const UNIT_TABLE = {
  uL: { dimension: "volume", factor: 1e-3, offset: 0 },
  mL: { dimension: "volume", factor: 1, offset: 0 },
  L: { dimension: "volume", factor: 1000, offset: 0 },
  umol: { dimension: "amount", factor: 1e-3, offset: 0 },
  mmol: { dimension: "amount", factor: 1, offset: 0 },
  mol: { dimension: "amount", factor: 1000, offset: 0 },
  mg: { dimension: "mass", factor: 1e-3, offset: 0 },
  g: { dimension: "mass", factor: 1, offset: 0 },
  kg: { dimension: "mass", factor: 1000, offset: 0 },
  "mol/L": { dimension: "concentration", factor: 1, offset: 0 },
  "mmol/L": { dimension: "concentration", factor: 1e-3, offset: 0 },
  "°C": { dimension: "temperature", factor: 1, offset: 0 },
  K: { dimension: "temperature", factor: 1, offset: -273.15 },
  mbar: { dimension: "pressure", factor: 1, offset: 0 },
  Pa: { dimension: "pressure", factor: 0.01, offset: 0 },
  // 1 Torr = 101325/760 Pa (definition of the torr).
  torr: { dimension: "pressure", factor: 1.01325 * 1000 / 760, offset: 0 },
} as const satisfies Record<string, UnitDef>;

export type UnitName = keyof typeof UNIT_TABLE;
type UnitsOf<D extends Dimension> = {
  [U in UnitName]: (typeof UNIT_TABLE)[U]["dimension"] extends D ? U : never;
}[UnitName];

export type VolumeUnit = UnitsOf<"volume">;
export type AmountUnit = UnitsOf<"amount">;
export type MassUnit = UnitsOf<"mass">;
export type ConcentrationUnit = UnitsOf<"concentration">;
export type TemperatureUnit = UnitsOf<"temperature">;
export type PressureUnit = UnitsOf<"pressure">;

export const CANONICAL_UNIT: Record<Dimension, UnitName> = {
  volume: "mL",
  amount: "mmol",
  mass: "g",
  concentration: "mol/L",
  temperature: "°C",
  pressure: "mbar",
};

export function unitsOf(dimension: Dimension): UnitName[] {
  return (Object.keys(UNIT_TABLE) as UnitName[]).filter((u) => UNIT_TABLE[u].dimension === dimension);
}

/** Converts a value in `unit` to the canonical unit of its dimension. */
export function toCanonical(value: number, unit: UnitName): number {
  const def = UNIT_TABLE[unit];
  return value * def.factor + def.offset;
}

/** Converts a canonical value back to `unit` (for display). */
export function fromCanonical(value: number, unit: UnitName): number {
  const def = UNIT_TABLE[unit];
  return (value - def.offset) / def.factor;
}

/** Amount in mmol of a component given as an amount or a mass; molar mass in g/mol. */
export function toMmol(value: number, unit: AmountUnit | "mg" | "g", molarMass: number): number {
  if (unit === "mg" || unit === "g") return (toCanonical(value, unit) / molarMass) * 1000;
  return toCanonical(value, unit);
}

/** Molar volume of an ideal gas at 25 °C and 1 atm: RT/p = 8.314462618·298.15/101325 m³/mol = 24.465 L/mol (CODATA R). */
export const GAS_MOLAR_VOLUME_ML_PER_MMOL = 24.465;

/** Molar volume of an ideal gas at `temperatureC` and 1 atm, mL/mmol (RT/p, CODATA R); 25 °C when unknown. */
export function gasMolarVolumeMl(temperatureC: number): number {
  if (!Number.isFinite(temperatureC)) return GAS_MOLAR_VOLUME_ML_PER_MMOL;
  return (8.314462618 * (temperatureC + 273.15)) / 101.325;
}
