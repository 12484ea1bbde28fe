/**
 * Numeric form of the mixture's components for one simulation: acid and base dissociation constants, log K of
 * the neutral form in each organic solvent the work-up uses, Setschenow and cosolvency constants. Rebuilt on
 * every simulate call (Monte-Carlo draws change log P and pKa), over the compiled library's solvents, which are
 * only those the work-up uses.
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

interface ComponentEntry {
  acidKa: Float64Array;
  baseKa: Float64Array;
  setschenow: number;
  logK: Float64Array;
  sigma: Float64Array;
}

/** Per-component constants cached by component object and compiled library: Monte-Carlo draws rebuild only the
 * components they perturb, so the rest are compiled once. */
const cache = new WeakMap<Component, WeakMap<CompiledLibrary, ComponentEntry>>();

function componentEntry(c: Component, lib: CompiledLibrary): ComponentEntry {
  let byLib = cache.get(c);
  const hit = byLib?.get(lib);
  if (hit) return hit;
  const ns = lib.solventKeys.length;
  const logP = effectiveLogP(c, lib.lib.solvents)?.value ?? 0;
  const entry: ComponentEntry = {
    acidKa: Float64Array.from(c.pKas.filter((p) => p.kind === "acid"), (p) => 10 ** -p.value),
    baseKa: Float64Array.from(c.pKas.filter((p) => p.kind === "base"), (p) => 10 ** -p.value),
    setschenow: c.setschenowK ?? setschenowConstant(logP),
    logK: new Float64Array(ns).fill(Number.NaN),
    sigma: new Float64Array(ns),
  };
  for (let i = 1; i < ns; i++) {
    const s = lib.solvents[i];
    if (!s) continue;
    if (s.waterMiscible) entry.sigma[i] = cosolvencyPower(logP, s);
    else entry.logK[i] = solventLogK(c, s, lib.lib.solvents)?.value ?? logP;
  }
  if (!byLib) { byLib = new WeakMap(); cache.set(c, byLib); }
  byLib.set(lib, entry);
  return entry;
}

export function compileComponents(components: readonly Component[], lib: CompiledLibrary): CompiledComponents {
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
    logK: new Float64Array(n * ns),
    sigma: new Float64Array(n * ns),
    setschenow: new Float64Array(n),
    ionOffset: new Float64Array(n),
    lipophilicCounterIon: new Uint8Array(n),
  };
  components.forEach((c, ci) => {
    const e = componentEntry(c, lib);
    out.startMmol[ci] = c.amountMmol;
    out.molarMass[ci] = c.molarMass;
    out.acidKa.push(e.acidKa);
    out.baseKa.push(e.baseKa);
    out.fixedCharge[ci] = c.fixedCharge;
    out.setschenow[ci] = e.setschenow;
    out.ionOffset[ci] = c.ionLogKOffset ?? Number.NaN;
    out.lipophilicCounterIon[ci] = c.counterIon === "lipophilic" ? 1 : 0;
    out.logK.set(e.logK, ci * ns);
    out.sigma.set(e.sigma, ci * ns);
  });
  return out;
}
