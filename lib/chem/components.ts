/**
 * Numeric form of the mixture's components for one simulation: acid and base dissociation constants, log K of
 * the neutral form in each organic solvent the work-up uses, Setschenow and cosolvency constants, over the
 * compiled library's solvents (only those the work-up uses). Refilled in place from the work-up's parameters on
 * every run: Monte-Carlo draws change log P, log K and pKa, and the arithmetic is a few dozen operations.
 */
import { COUNTER_IONS } from "./data/counter-ions";
import { type SolventProps } from "./data/solvents";
import { pairingFactor, pairingSign } from "./ion-pair";
import { type CompiledLibrary, type Library } from "./library";
import { emptyParameters, readComponentParameters, type WorkupParameters } from "./parameters";
import { abrahamLogK, anchorLogP, collanderLogK, componentAbraham, cosolvencyPower, setschenowConstant } from "./partition";
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
  /** log K_ion − log K_neutral given by the component (used at any counter-ion concentration), or NaN for the
   * ion-pair model. */
  ionOffset: Float64Array;
  /** Flagged "lipophilic" without a named salt: the solvent's fixed ion-pair offset (class value). */
  lipophilicCounterIon: Uint8Array;
  /** 1 when the charged forms are anions (paired with the water's cations), 0 when cations. */
  pairsAsAnion: Uint8Array;
  /** Counter-ions of a weighed salt per mmol of the component that enter the strong-ion pool (signed), and
   * how much more the salt's own counter-ion extracts than the reference ion per mmol (see equilibrium.ts). */
  saltCharge: Float64Array;
  saltIons: Float64Array;
  ownPairing: Float64Array;
}

/** Allocates the arrays for `n` components over the compiled library's solvents. */
export function allocateComponents(n: number, lib: CompiledLibrary): CompiledComponents {
  const ns = lib.solventKeys.length;
  return {
    count: n, keys: [], startMmol: new Float64Array(n), molarMass: new Float64Array(n), acidKa: [], baseKa: [],
    fixedCharge: new Int8Array(n), logK: new Float64Array(n * ns), sigma: new Float64Array(n * ns),
    setschenow: new Float64Array(n), ionOffset: new Float64Array(n), lipophilicCounterIon: new Uint8Array(n),
    pairsAsAnion: new Uint8Array(n), saltCharge: new Float64Array(n), saltIons: new Float64Array(n), ownPairing: new Float64Array(n),
  };
}

/** The component's own log K for solvent `key` from the parameters, or NaN. */
function ownLogK(c: Component, key: string, p: WorkupParameters, start: number): number {
  let j = start;
  for (const k in c.logK) {
    if (!Object.hasOwn(c.logK, k)) continue;
    if (k === key) return p.logK[j] as number;
    j++;
  }
  return Number.NaN;
}

/**
 * log P from the parameters, or one back-calculated from the first own log K whose solvent has a Collander line;
 * NaN when neither exists. The same arithmetic as effectiveLogP (partition.ts), on the parameter values.
 */
function parameterLogP(c: Component, ci: number, p: WorkupParameters, solvents: Library["solvents"], donor: boolean): number {
  const logP = p.logP[ci] as number;
  if (c.logP) return logP;
  let j = p.logKStart[ci] as number;
  for (const k in c.logK) {
    if (!Object.hasOwn(c.logK, k)) continue;
    const line = solvents[k]?.partition;
    if (line) {
      const l = donor ? line.donor : line.acceptor;
      return ((p.logK[j] as number) - l.b) / l.a;
    }
    j++;
  }
  return Number.NaN;
}

/**
 * Fills every component's constants from its structure (`components`) and the numbers in `p`: acid and base
 * dissociation constants, log K of the neutral form in each immiscible solvent (own value, else the Collander
 * line from log P), cosolvency powers and Setschenow constants. No allocation once the arrays are sized.
 */
export function fillComponents(out: CompiledComponents, components: readonly Component[], p: WorkupParameters, lib: CompiledLibrary): void {
  const ns = lib.solventKeys.length;
  for (let ci = 0; ci < components.length; ci++) {
    const c = components[ci] as Component;
    if (out.keys[ci] !== c.key) out.keys[ci] = c.key;
    out.startMmol[ci] = p.amountMmol[ci] as number;
    out.molarMass[ci] = c.molarMass;
    out.fixedCharge[ci] = c.fixedCharge;
    out.ionOffset[ci] = c.ionLogKOffset ?? Number.NaN;
    out.lipophilicCounterIon[ci] = c.counterIon === "lipophilic" && !c.salt ? 1 : 0;
    out.pairsAsAnion[ci] = pairingSign(c) === "anion" ? 1 : 0;
    fillSalt(out, ci, c);
    const q0 = p.pKaStart[ci] as number;
    let nAcid = 0;
    for (const pk of c.pKas) if (pk.kind === "acid") nAcid++;
    const acid = sizedKa(out.acidKa, ci, nAcid);
    const base = sizedKa(out.baseKa, ci, c.pKas.length - nAcid);
    let a = 0, b = 0;
    for (let j = 0; j < c.pKas.length; j++) {
      const ka = Math.exp(-(p.pKa[q0 + j] as number) * Math.LN10);
      if ((c.pKas[j] as Component["pKas"][number]).kind === "acid") acid[a++] = ka; else base[b++] = ka;
    }
    const donor = nAcid > 0;
    const effective = parameterLogP(c, ci, p, lib.lib.solvents, donor);
    const octanol = componentAbraham(c, "octanol");
    const logP = !Number.isNaN(effective) ? effective : octanol ? octanol.value : 0;
    out.setschenow[ci] = c.setschenowK ?? setschenowConstant(logP);
    const k0 = p.logKStart[ci] as number;
    const row = ci * ns;
    out.logK[row] = Number.NaN;
    out.sigma[row] = 0;
    for (let i = 1; i < ns; i++) {
      const s = lib.solvents[i] as SolventProps;
      if (s.waterMiscible) {
        out.sigma[row + i] = cosolvencyPower(logP, s);
        out.logK[row + i] = Number.NaN;
        continue;
      }
      out.sigma[row + i] = 0;
      const own = ownLogK(c, s.key, p, k0);
      // Abraham estimate (cached per component and solvent), anchored on this run's log P when that is enabled.
      const ab = Number.isNaN(own) ? componentAbraham(c, s.key) : null;
      out.logK[row + i] = !Number.isNaN(own) ? own
        : ab ? abrahamLogK(ab, anchorLogP(c) === undefined ? undefined : p.logP[ci])
          : !Number.isNaN(effective) && s.partition ? collanderLogK(effective, s, donor) : logP;
    }
  }
  out.keys.length = components.length;
}

/**
 * A weighed salt's counter-ions: those of an acid or base join the strong ions of the stream (an amine
 * hydrochloride is the amine plus Cl⁻, as 1 M HCl is Cl⁻ alone in the charge balance); those of a permanently
 * charged parent balance it and stay out of the charge balance, as the parent does. Either way the salt's own
 * ion pairs with the component beyond what the reference ion of its sign would (pairing factor).
 */
function fillSalt(out: CompiledComponents, ci: number, c: Component): void {
  if (!c.salt) {
    out.saltCharge[ci] = 0;
    out.saltIons[ci] = 0;
    out.ownPairing[ci] = 0;
    return;
  }
  const n = c.salt.perParent;
  const fixed = c.fixedCharge !== 0;
  out.saltCharge[ci] = fixed ? 0 : COUNTER_IONS[c.salt.counterIon].charge * n;
  out.saltIons[ci] = fixed ? 0 : n;
  const factor = pairingFactor(c.salt.counterIon);
  out.ownPairing[ci] = n * (fixed ? factor : factor - 1);
}

function sizedKa(list: Float64Array[], i: number, n: number): Float64Array {
  const hit = list[i];
  if (hit && hit.length === n) return hit;
  const fresh = new Float64Array(n);
  list[i] = fresh;
  return fresh;
}

export function compileComponents(components: readonly Component[], lib: CompiledLibrary): CompiledComponents {
  const out = allocateComponents(components.length, lib);
  const p = emptyParameters();
  readComponentParameters(components, p);
  fillComponents(out, components, p, lib);
  return out;
}
