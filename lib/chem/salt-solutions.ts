/**
 * Volume and density of aqueous salt solutions from the CRC concentrative-property tables (data/salt-solutions.ts).
 * The tables are turned into the apparent molar volume of the salt, φV(m) = [(1000 + m·M)/ρ − 1000/ρ_w]/m
 * (mL/mol, m in mol/kg water), which says how much the volume grows as salt dissolves: saturating 100 g of water
 * with NaCl gives about 113 mL of solution at 1.20 g/mL, not 100 mL at 1.36. Beyond the last row φV is held at its
 * last value (it changes slowly at high molality; derived).
 */
import { SALT_SOLUTIONS, SOLID_SALT_TABLE, type SaltKey, type SaltSolutionTable } from "./data/salt-solutions";
import { type Stream } from "./stream";

/** Density of water at 20 °C, g/mL (the temperature of the tables; see data/solvents.ts). */
const WATER_DENSITY_20C = 0.998207;
/** Crystal density used for a solid salt without a table, g/mL (NaCl 2.165, memory): an upper bound on its volume. */
const FALLBACK_SALT_DENSITY = 2.165;

export const molalityOf = (t: SaltSolutionTable, massPct: number): number => (1000 * massPct) / ((100 - massPct) * t.molarMass);

interface Compiled { m: Float64Array; phi: Float64Array }
const compiled = new Map<SaltKey, Compiled>();

function compile(key: SaltKey): Compiled {
  const hit = compiled.get(key);
  if (hit) return hit;
  const t: SaltSolutionTable = SALT_SOLUTIONS[key];
  const m = Float64Array.from(t.rows, ([w]) => molalityOf(t, w));
  const phi = Float64Array.from(t.rows, ([, rho], i) => {
    const mi = m[i] as number;
    return ((1000 + mi * t.molarMass) / rho - 1000 / WATER_DENSITY_20C) / mi;
  });
  const out = { m, phi };
  compiled.set(key, out);
  return out;
}

/** Apparent molar volume of the salt at molality m, mL/mol (linear between rows, flat outside them). */
export function apparentMolarVolume(key: SaltKey, m: number): number {
  const { m: ms, phi } = compile(key);
  const n = ms.length;
  if (m <= (ms[0] as number)) return phi[0] as number;
  if (m >= (ms[n - 1] as number)) return phi[n - 1] as number;
  let i = 1;
  while ((ms[i] as number) < m) i++;
  const m0 = ms[i - 1] as number, m1 = ms[i] as number;
  return (phi[i - 1] as number) + (((phi[i] as number) - (phi[i - 1] as number)) * (m - m0)) / (m1 - m0);
}

/** Volume of the solution made from 1 kg of water and m mol of salt, mL. */
export function volumePerKgWater(key: SaltKey, m: number): number {
  return 1000 / WATER_DENSITY_20C + m * apparentMolarVolume(key, m);
}

/** Density of the solution at molality m, g/mL. */
export function solutionDensity(key: SaltKey, m: number): number {
  return (1000 + m * SALT_SOLUTIONS[key].molarMass) / volumePerKgWater(key, m);
}

/** Molarity (mol/L of solution) at molality m. */
export function solutionMolarity(key: SaltKey, m: number): number {
  return (1000 * m) / volumePerKgWater(key, m);
}

/**
 * Volume gained (mL) when `addedMmol` of solid salt `reagentKey` dissolves in `waterG` g of water already holding
 * `presentMmol` of it. A solid without a table adds its crystal volume (an upper bound).
 */
export function dissolutionVolumeMl(reagentKey: string, molarMass: number, waterG: number, presentMmol: number, addedMmol: number): number {
  const key = SOLID_SALT_TABLE[reagentKey];
  if (!key || waterG <= 0) return (addedMmol * molarMass) / 1000 / FALLBACK_SALT_DENSITY;
  const kg = waterG / 1000;
  const m0 = presentMmol / 1000 / kg;
  const m1 = (presentMmol + addedMmol) / 1000 / kg;
  return kg * (volumePerKgWater(key, m1) - volumePerKgWater(key, m0));
}

/**
 * Grows a stream's aqueous volume by the volume of a dissolved solid salt. The stream counts a solution's whole
 * volume as water and keeps the mass beyond water at its density in extraMassG (stream.ts), so the gain goes to
 * the water volume and its water-density mass comes off extraMassG: the layer's mass is unchanged and its density
 * becomes that of the solution. Returns the volume gained, mL.
 */
export function dissolveSolid(s: Stream, reagentKey: string, molarMass: number, waterG: number, presentMmol: number, addedMmol: number, waterDensity: number): number {
  if (!(addedMmol > 0)) return 0;
  const dv = dissolutionVolumeMl(reagentKey, molarMass, waterG, presentMmol, addedMmol);
  s.solv[0] = (s.solv[0] as number) + dv;
  s.extraMassG -= waterDensity * dv;
  return dv;
}
