/**
 * Abraham solvation model for water→solvent partition of neutral solutes:
 *   log K = c + eE + sS + aA + bB + vV                       (water→solvent equation), or
 *   log K = (c_s − c_w) + (e_s − e_w)E + … + (l_s − l_w)L    (difference of gas→solvent and gas→water equations).
 * Descriptors come as component data (component.abraham, from lib/chem/structure or typed in) or from the measured
 * table (data/abraham-solutes.ts) by the component's canonical SMILES; the engine never needs RDKit.
 */
import { ABRAHAM_SOLVENTS, WATER_GAS_EQUATION, type AbrahamSolvent } from "./data/abraham-solvents";
import { MEASURED_DESCRIPTORS, SOLVENT_SMILES, type AbrahamDescriptors } from "./data/abraham-solutes";
import { type Component, type LogValue } from "./schema";

export interface AbrahamEstimate {
  /** log K(solvent/water) of the neutral form. */
  value: number;
  route: "water" | "gas";
  /** The same descriptors' octanol–water log P by the octanol equation (for anchoring on a measured log P). */
  octanol: number;
  /** d log K_s / d log P_oct when the error sits in the size term: the solvent's size coefficient over octanol's. */
  beta: number;
  se: number;
}

export interface ComponentDescriptors extends AbrahamDescriptors {
  provenance: LogValue["provenance"];
}

/**
 * The component's own descriptors, else the measured ones for its canonical SMILES, else null. Returns the stored
 * objects themselves (no copy): callers cache on their identity.
 */
export function componentDescriptors(c: Pick<Component, "smiles" | "abraham">): ComponentDescriptors | null {
  if (c.abraham) return c.abraham;
  return c.smiles ? MEASURED_DESCRIPTORS.get(c.smiles) ?? null : null;
}

/** A library solvent's own measured descriptors (for its partition as a cosolvent), or null. */
export function solventAsSolute(solventKey: string): AbrahamDescriptors | null {
  const smiles = SOLVENT_SMILES[solventKey];
  return smiles ? MEASURED_DESCRIPTORS.get(smiles) ?? null : null;
}

function viaWater(d: AbrahamDescriptors, w: NonNullable<AbrahamSolvent["water"]>): number {
  return w.c + w.e * d.E + w.s * d.S + w.a * d.A + w.b * d.B + w.v * d.V;
}

function viaGas(d: AbrahamDescriptors & { L: number }, g: NonNullable<AbrahamSolvent["gas"]>): number {
  const w = WATER_GAS_EQUATION;
  return (g.c - w.c) + (g.e - w.e) * d.E + (g.s - w.s) * d.S + (g.a - w.a) * d.A + (g.b - w.b) * d.B + (g.l - w.l) * d.L;
}

const OCTANOL = ABRAHAM_SOLVENTS.octanol as AbrahamSolvent;
const OCTANOL_V = (OCTANOL.water as NonNullable<AbrahamSolvent["water"]>).v;
const OCTANOL_L = (OCTANOL.gas as NonNullable<AbrahamSolvent["gas"]>).l - WATER_GAS_EQUATION.l;

function hasL(d: AbrahamDescriptors): d is AbrahamDescriptors & { L: number } {
  return d.L !== undefined && Number.isFinite(d.L);
}

/**
 * Water→solvent log K from descriptors. Route: the water→solvent equation for wet solvents that prefer it
 * (octanol, butanol) or when L is unknown; else the gas→solvent difference (Chung et al. 2022), which needs L.
 */
export function abrahamEstimate(d: AbrahamDescriptors, s: AbrahamSolvent): AbrahamEstimate | null {
  const useWater = s.water && (s.preferWater || !hasL(d) || !s.gas);
  let value: number, route: AbrahamEstimate["route"], beta: number;
  if (useWater && s.water) {
    value = viaWater(d, s.water);
    route = "water";
    beta = s.water.v / OCTANOL_V;
  } else if (s.gas && hasL(d)) {
    value = viaGas(d, s.gas);
    route = "gas";
    beta = (s.gas.l - WATER_GAS_EQUATION.l) / OCTANOL_L;
  } else {
    return null;
  }
  return { value, route, octanol: viaWater(d, OCTANOL.water as NonNullable<AbrahamSolvent["water"]>), beta, se: s.se };
}
