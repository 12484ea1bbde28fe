/**
 * Numeric form of the mixture's components for one simulation: acid and base dissociation constants, log K of
 * the neutral form in each organic solvent the work-up uses, Setschenow and cosolvency constants. Rebuilt on
 * every simulate call (Monte-Carlo draws change log P and pKa) but only for the solvents actually used.
 */
import { type CompiledLibrary } from "./library";
import { cosolvencyPower, effectiveLogP, setschenowConstant, solventLogK } from "./partition";
import { type Component } from "./schema";

export interface CompiledComponents {
  count: number;
  keys: string[];
  startMmol: Float64Array;
  molarMass: Float64Array;
  acidKa: Float64Array[];
  baseKa: Float64Array[];
  /** Net permanent charge; such components have no neutral form and stay out of the charge balance. */
  fixedCharge: Int8Array;
  /** log K of the neutral form, component c and solvent i at [c * nSolvents + i]; NaN if unknown. */
  logK: Float64Array;
  /** Cosolvency power σ of component c in water-miscible solvent j at [c * nSolvents + j]. */
  sigma: Float64Array;
  setschenow: Float64Array;
  /** log K_ion − log K_neutral given by the component, or NaN for the solvent default. */
  ionOffset: Float64Array;
  lipophilicCounterIon: Uint8Array;
}

export function compileComponents(components: readonly Component[], lib: CompiledLibrary, usedSolvents: readonly number[]): CompiledComponents {
  const n = components.length;
  const ns = lib.solventKeys.length;
  const out: CompiledComponents = {
    count: n,
    keys: components.map((c) => c.key),
    startMmol: new Float64Array(n),
    molarMass: new Float64Array(n),
    acidKa: [],
    baseKa: [],
    fixedCharge: new Int8Array(n),
    logK: new Float64Array(n * ns).fill(Number.NaN),
    sigma: new Float64Array(n * ns),
    setschenow: new Float64Array(n),
    ionOffset: new Float64Array(n),
    lipophilicCounterIon: new Uint8Array(n),
  };
  components.forEach((c, ci) => {
    out.startMmol[ci] = c.amountMmol;
    out.molarMass[ci] = c.molarMass;
    out.acidKa.push(Float64Array.from(c.pKas.filter((p) => p.kind === "acid"), (p) => 10 ** -p.value));
    out.baseKa.push(Float64Array.from(c.pKas.filter((p) => p.kind === "base"), (p) => 10 ** -p.value));
    out.fixedCharge[ci] = c.fixedCharge;
    const logP = effectiveLogP(c, lib.lib.solvents)?.value ?? 0;
    out.setschenow[ci] = c.setschenowK ?? setschenowConstant(logP);
    out.ionOffset[ci] = c.ionLogKOffset ?? Number.NaN;
    out.lipophilicCounterIon[ci] = c.counterIon === "lipophilic" ? 1 : 0;
    for (const i of usedSolvents) {
      const s = lib.solvents[i];
      if (!s || i === 0) continue;
      if (s.waterMiscible) out.sigma[ci * ns + i] = cosolvencyPower(logP, s);
      else out.logK[ci * ns + i] = solventLogK(c, s, lib.lib.solvents)?.value ?? logP;
    }
  });
  return out;
}
