/**
 * Numeric form of the mixture's components for one simulation: acid and base dissociation constants, log K of
 * the neutral form in each organic solvent the work-up uses, Setschenow and cosolvency constants, over the
 * compiled library's solvents (only those the work-up uses). Refilled in place from the work-up's parameters on
 * every run: Monte-Carlo draws change log P, log K and pKa, and the arithmetic is a few dozen operations.
 */
import { COUNTER_IONS, type CounterIonKey } from "./data/counter-ions";
import { type SolventProps } from "./data/solvents";
import { pairingFactor, pairingSign } from "./ion-pair";
import { type AbrahamEstimate } from "./abraham";
import { type CompiledLibrary } from "./library";
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
  /** 1 for a component with ion-pair extraction constants of its own (schema ionPairLogKex): its charged form
   * then partitions by them, not by the solvent's class value (equilibrium.ts). */
  pairConstants: Uint8Array;
  /** log K_ex with the reference counter-ion (Cl⁻ for cations, Na⁺ for anions) and with the component's own
   * salt counter-ion, component c and solvent i at [c * nSolvents + i]; NaN where none is known. */
  pairRef: Float64Array;
  pairOwn: Float64Array;
  /** Counter-ions of a weighed salt per parent (0 without one), and log10 of how much better its own ion pairs
   * than the reference ion (data/counter-ions.ts `pairing`). */
  saltPerParent: Float64Array;
  ownPairingLog: Float64Array;
  /** The components list the structural part was filled for, and each component's plan (fillComponents). */
  plannedFor: readonly Component[] | null;
  plans: ComponentPlan[];
}

/** Allocates the arrays for `n` components over the compiled library's solvents. */
export function allocateComponents(n: number, lib: CompiledLibrary): CompiledComponents {
  const ns = lib.solventKeys.length;
  return {
    count: n, keys: [], startMmol: new Float64Array(n), molarMass: new Float64Array(n), acidKa: [], baseKa: [],
    fixedCharge: new Int8Array(n), logK: new Float64Array(n * ns), sigma: new Float64Array(n * ns),
    setschenow: new Float64Array(n), ionOffset: new Float64Array(n), lipophilicCounterIon: new Uint8Array(n),
    pairsAsAnion: new Uint8Array(n), saltCharge: new Float64Array(n), saltIons: new Float64Array(n), ownPairing: new Float64Array(n),
    pairConstants: new Uint8Array(n), pairRef: new Float64Array(n * ns), pairOwn: new Float64Array(n * ns),
    saltPerParent: new Float64Array(n), ownPairingLog: new Float64Array(n),
    plannedFor: null, plans: [],
  };
}

/**
 * What fillComponents reads from a component's structure, worked out once per components list (a Monte-Carlo run
 * refills the same list a thousand times with new numbers): which pKa values are acids, where each solvent's own
 * log K sits among the parameters, the Abraham estimates, and the Collander line a log P is read back through.
 */
interface ComponentPlan {
  acidSite: Uint8Array;
  nAcid: number;
  hasLogP: boolean;
  /** Parameter slot (from logKStart) of the first own log K whose solvent has a Collander line, and that line. */
  backSlot: number;
  backA: number;
  backB: number;
  /** Abraham octanol–water estimate, or NaN. */
  octanol: number;
  /** Abraham estimates are anchored on this run's log P (anchorLogP). */
  anchored: boolean;
  /** Per compiled solvent: the slot of the component's own log K (−1: none) and the Abraham estimate. */
  ownSlot: Int32Array;
  abraham: Array<AbrahamEstimate | null>;
  /** Per own extraction constant: its compiled solvent (−1: not in this work-up), whether its counter-ion is
   * the reference ion (bit 1) or the component's own salt ion (bit 2), and the ion's pairing (log units). */
  pairSolvent: Int32Array;
  pairRole: Uint8Array;
  pairOffset: Float64Array;
}

const NO_SLOTS = new Int32Array(0);
const NO_ROLES = new Uint8Array(0);
const NO_OFFSETS = new Float64Array(0);

/** `plan` refilled for component c (a new one if there is none): in place, since bulk re-prediction plans every
 * stored work-up it loads, and typed arrays are dear to allocate. */
function planComponent(c: Component, lib: CompiledLibrary, plan: ComponentPlan | undefined): ComponentPlan {
  const ns = lib.solventKeys.length;
  const p: ComponentPlan = plan ?? {
    acidSite: new Uint8Array(c.pKas.length), nAcid: 0, hasLogP: false, backSlot: -1, backA: Number.NaN, backB: Number.NaN,
    octanol: Number.NaN, anchored: false, ownSlot: new Int32Array(ns), abraham: [], pairSolvent: NO_SLOTS, pairRole: NO_ROLES, pairOffset: NO_OFFSETS,
  };
  if (p.acidSite.length !== c.pKas.length) p.acidSite = new Uint8Array(c.pKas.length);
  let nAcid = 0;
  for (let j = 0; j < c.pKas.length; j++) {
    const acid = (c.pKas[j] as Component["pKas"][number]).kind === "acid";
    p.acidSite[j] = acid ? 1 : 0;
    if (acid) nAcid++;
  }
  p.nAcid = nAcid;
  p.hasLogP = c.logP !== undefined;
  // Own log K values sit in the parameters in the record's key order.
  p.ownSlot.fill(-1);
  p.backSlot = -1;
  let j = 0;
  for (const key in c.logK) {
    if (!Object.hasOwn(c.logK, key)) continue;
    const i = lib.solventIndex.get(key);
    if (i !== undefined) p.ownSlot[i] = j;
    const line = p.backSlot < 0 && !c.logP ? lib.lib.solvents[key]?.partition : undefined;
    if (line) {
      const l = nAcid > 0 ? line.donor : line.acceptor;
      p.backSlot = j;
      p.backA = l.a;
      p.backB = l.b;
    }
    j++;
  }
  p.abraham.length = ns;
  for (let i = 0; i < ns; i++) {
    const s = lib.solvents[i] as SolventProps;
    p.abraham[i] = i > 0 && !s.waterMiscible && (p.ownSlot[i] as number) < 0 ? componentAbraham(c, s.key) : null;
  }
  p.octanol = componentAbraham(c, "octanol")?.value ?? Number.NaN;
  p.anchored = anchorLogP(c) !== undefined;
  const pairs = c.ionPairLogKex;
  if (pairs.length === 0) {
    p.pairSolvent = NO_SLOTS;
    p.pairRole = NO_ROLES;
    p.pairOffset = NO_OFFSETS;
    return p;
  }
  const reference: CounterIonKey = pairingSign(c) === "anion" ? "sodium" : "chloride";
  const ownIon = c.salt?.counterIon;
  p.pairSolvent = Int32Array.from(pairs, (k) => lib.solventIndex.get(k.solvent) ?? -1);
  p.pairRole = Uint8Array.from(pairs, (k) => (k.counterIon === reference ? 1 : 0) | (k.counterIon === ownIon ? 2 : 0));
  p.pairOffset = Float64Array.from(pairs, (k) => COUNTER_IONS[k.counterIon].pairing);
  return p;
}

/**
 * Fills every component's constants from its structure (`components`) and the numbers in `p`: acid and base
 * dissociation constants, log K of the neutral form in each immiscible solvent (own value, else the Abraham
 * estimate, else the Collander line from log P), cosolvency powers and Setschenow constants. The structural part
 * is done once per components list; a refill with new numbers allocates nothing.
 */
export function fillComponents(out: CompiledComponents, components: readonly Component[], p: WorkupParameters, lib: CompiledLibrary): void {
  const ns = lib.solventKeys.length;
  const same = out.plannedFor === components;
  for (let ci = 0; ci < components.length; ci++) {
    const c = components[ci] as Component;
    if (!same) {
      out.keys[ci] = c.key;
      out.molarMass[ci] = c.molarMass;
      out.fixedCharge[ci] = c.fixedCharge;
      out.ionOffset[ci] = c.ionLogKOffset ?? Number.NaN;
      out.lipophilicCounterIon[ci] = c.counterIon === "lipophilic" && !c.salt ? 1 : 0;
      out.pairsAsAnion[ci] = pairingSign(c) === "anion" ? 1 : 0;
      fillSalt(out, ci, c);
      const plan = planComponent(c, lib, out.plans[ci]);
      out.plans[ci] = plan;
      sizedKa(out.acidKa, ci, plan.nAcid);
      sizedKa(out.baseKa, ci, c.pKas.length - plan.nAcid);
    }
    const plan = out.plans[ci] as ComponentPlan;
    out.startMmol[ci] = p.amountMmol[ci] as number;
    const q0 = p.pKaStart[ci] as number;
    const acid = out.acidKa[ci] as Float64Array;
    const base = out.baseKa[ci] as Float64Array;
    let a = 0, b = 0;
    for (let j = 0; j < plan.acidSite.length; j++) {
      const ka = Math.exp(-(p.pKa[q0 + j] as number) * Math.LN10);
      if (plan.acidSite[j] === 1) acid[a++] = ka; else base[b++] = ka;
    }
    const donor = plan.nAcid > 0;
    const k0 = p.logKStart[ci] as number;
    // log P from the parameters, or read back from the first own log K with a Collander line (effectiveLogP,
    // partition.ts, on the parameter values); NaN when neither exists.
    const effective = plan.hasLogP ? (p.logP[ci] as number)
      : plan.backSlot >= 0 ? ((p.logK[k0 + plan.backSlot] as number) - plan.backB) / plan.backA : Number.NaN;
    const logP = !Number.isNaN(effective) ? effective : !Number.isNaN(plan.octanol) ? plan.octanol : 0;
    out.setschenow[ci] = c.setschenowK ?? setschenowConstant(logP);
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
      const slot = plan.ownSlot[i] as number;
      // Abraham estimate (cached per component and solvent), anchored on this run's log P when that is enabled.
      const ab = plan.abraham[i] ?? null;
      out.logK[row + i] = slot >= 0 ? (p.logK[k0 + slot] as number)
        : ab ? abrahamLogK(ab, plan.anchored ? p.logP[ci] : undefined)
          : !Number.isNaN(effective) && s.partition ? collanderLogK(effective, s, donor) : logP;
    }
    if (plan.pairSolvent.length > 0) fillPairConstants(out, ci, plan, p, ns);
  }
  out.keys.length = components.length;
  out.plannedFor = components;
}

/**
 * The component's extraction constants per solvent from the parameters: with the reference ion as stated, else
 * from its own ion's, else from another ion's, less that ion's pairing; with its own salt ion as stated, else the
 * reference one plus the own ion's pairing (the additivity of ion contributions, data/counter-ions.ts).
 */
function fillPairConstants(out: CompiledComponents, ci: number, plan: ComponentPlan, p: WorkupParameters, ns: number): void {
  const row = ci * ns;
  const e0 = p.ionPairStart[ci] as number;
  for (let i = 0; i < ns; i++) { out.pairRef[row + i] = Number.NaN; out.pairOwn[row + i] = Number.NaN; }
  for (let j = 0; j < plan.pairSolvent.length; j++) {
    const si = plan.pairSolvent[j] as number;
    if (si < 0) continue;
    const role = plan.pairRole[j] as number;
    const v = p.ionPairLogKex[e0 + j] as number;
    if ((role & 1) !== 0) out.pairRef[row + si] = v;
    if ((role & 2) !== 0) out.pairOwn[row + si] = v;
  }
  const ownLog = out.ownPairingLog[ci] as number;
  const salted = (out.saltPerParent[ci] as number) > 0;
  for (let i = 1; i < ns; i++) {
    let ref = out.pairRef[row + i] as number;
    let own = out.pairOwn[row + i] as number;
    if (Number.isNaN(ref) && !Number.isNaN(own)) ref = own - ownLog;
    for (let j = 0; j < plan.pairSolvent.length && Number.isNaN(ref); j++) {
      if (plan.pairSolvent[j] === i && plan.pairRole[j] === 0) ref = (p.ionPairLogKex[e0 + j] as number) - (plan.pairOffset[j] as number);
    }
    if (Number.isNaN(own) && salted) own = ref + ownLog;
    out.pairRef[row + i] = ref;
    out.pairOwn[row + i] = own;
  }
}

/**
 * A weighed salt's counter-ions: those of an acid or base join the strong ions of the stream (an amine
 * hydrochloride is the amine plus Cl⁻, as 1 M HCl is Cl⁻ alone in the charge balance); those of a permanently
 * charged parent balance it and stay out of the charge balance, as the parent does. Either way the salt's own
 * ion pairs with the component beyond what the reference ion of its sign would (pairing factor).
 */
function fillSalt(out: CompiledComponents, ci: number, c: Component): void {
  out.pairConstants[ci] = c.ionPairLogKex.length > 0 ? 1 : 0;
  if (!c.salt) {
    out.saltCharge[ci] = 0;
    out.saltIons[ci] = 0;
    out.ownPairing[ci] = 0;
    out.saltPerParent[ci] = 0;
    out.ownPairingLog[ci] = 0;
    return;
  }
  const n = c.salt.perParent;
  out.saltPerParent[ci] = n;
  out.ownPairingLog[ci] = COUNTER_IONS[c.salt.counterIon].pairing;
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
