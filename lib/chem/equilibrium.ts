/**
 * One equilibration of a mixed stream into an organic and an aqueous layer: phase volumes (phases.ts), the
 * log K of every component corrected for the organic layer's composition (log-linear mixing of the solvents'
 * values, an assumption), salting out and cosolvency (partition.ts), then the pH by charge balance with every
 * component distributing between the layers inside the residual (aqueous.ts). CO₂ above saturation leaves as
 * gas and the pH is solved again. Results stay in the instance (typed arrays reused between contacts).
 */
import { co2Excess, KW, solvePh, systemMeanCharge, type ChargeBalance } from "./aqueous";
import { type CompiledComponents } from "./components";
import { CARBONATE, N_SYSTEMS, SYSTEM_Z0, WATER, type CompiledLibrary } from "./library";
import { saltingOutShift } from "./partition";
import { PhaseSplit } from "./phases";
import { DEFAULT_ION_LOGK_OFFSET } from "./speciation";
import { copyInto, type Stream } from "./stream";

const reusable = new WeakMap<CompiledLibrary, Equilibrator>();

export class Equilibrator implements ChargeBalance {
  readonly phases: PhaseSplit;
  kNeutral: Float64Array;
  kIon: Float64Array;
  /** Distribution ratio, neutral fraction (aqueous speciation) and fraction in the aqueous layer, per component. */
  distribution: Float64Array;
  fractionNeutral: Float64Array;
  fractionAqueous: Float64Array;
  pH = NaN;
  co2Mmol = 0;
  /** Last solved pH, the starting guess for the next contact. */
  private lastSolved = NaN;
  private systemTotals = new Float64Array(N_SYSTEMS);
  /** Indices of the acid–base systems present in this contact, and how many. */
  private active = new Int32Array(N_SYSTEMS);
  private nActive = 0;
  private strongConc = 0;
  private va = 0;
  private vo = 0;
  private amounts: Float64Array;
  private comps: CompiledComponents;

  private constructor(private readonly lib: CompiledLibrary, comps: CompiledComponents) {
    this.phases = new PhaseSplit(lib);
    this.comps = comps;
    const n = comps.count;
    this.kNeutral = new Float64Array(n);
    this.kIon = new Float64Array(n);
    this.distribution = new Float64Array(n);
    this.fractionNeutral = new Float64Array(n);
    this.fractionAqueous = new Float64Array(n);
    this.amounts = new Float64Array(n);
  }

  /** An equilibrator for this library and these components; one instance is reused per compiled library
   * (simulations run synchronously, one at a time) to save allocations on the Monte-Carlo path. */
  static for(lib: CompiledLibrary, comps: CompiledComponents): Equilibrator {
    const hit = reusable.get(lib);
    if (hit && hit.amounts.length === comps.count) {
      hit.comps = comps;
      return hit;
    }
    const eq = new Equilibrator(lib, comps);
    reusable.set(lib, eq);
    return eq;
  }

  /** Equilibrates `mix` and writes the two layers into `org` and `aq`, which must be new (empty) streams. */
  equilibrate(mix: Stream, org: Stream, aq: Stream): void {
    const { phases, comps } = this;
    let sysZ2 = 0;
    for (let s = 0; s < N_SYSTEMS; s++) {
      const z0 = SYSTEM_Z0[s] as number;
      sysZ2 += (mix.sys[s] as number) * Math.max(1, z0 * z0);
    }
    phases.split(mix, sysZ2);
    copyInto(org.solv, phases.org);
    copyInto(aq.solv, phases.aq);
    this.va = phases.hasAqueous ? phases.aqueousVolume : 0;
    this.vo = phases.hasOrganic && phases.hasAqueous ? phases.organicVolume : 0;
    this.co2Mmol = 0;
    this.amounts.set(mix.comp);
    if (!phases.hasAqueous) {
      copyInto(org.comp, mix.comp);
      this.pH = NaN;
      this.fractionAqueous.fill(0);
      this.fractionNeutral.fill(1);
      this.distribution.fill(Infinity);
      return;
    }
    this.setPartition();
    this.systemTotals.set(mix.sys);
    this.nActive = 0;
    for (let sIdx = 0; sIdx < N_SYSTEMS; sIdx++) if ((mix.sys[sIdx] as number) > 0) this.active[this.nActive++] = sIdx;
    this.strongConc = mix.strongCharge / this.va;
    this.pH = solvePh(this, this.lastSolved);
    const carb = this.systemTotals[CARBONATE] as number;
    if (carb > 0) {
      const excess = co2Excess(carb, this.va, 10 ** -this.pH);
      if (excess > 1e-12) {
        this.co2Mmol = excess;
        this.systemTotals[CARBONATE] = carb - excess;
        this.pH = solvePh(this, this.pH);
      }
    }
    this.residual(this.pH);
    this.lastSolved = this.pH;
    copyInto(aq.sys, this.systemTotals);
    aq.strongCharge = mix.strongCharge;
    aq.strongZ2 = mix.strongZ2;
    aq.osmoles = mix.osmoles;
    aq.extraMassG = mix.extraMassG;
    aq.lastPh = this.pH;
    for (let c = 0; c < comps.count; c++) {
      const n = mix.comp[c] as number;
      const a = n * (this.fractionAqueous[c] as number);
      aq.comp[c] = a;
      org.comp[c] = n - a;
    }
  }

  private setPartition(): void {
    const { phases, lib, comps } = this;
    const ns = lib.solventKeys.length;
    const imm = phases.immiscibleVolume;
    const fc = phases.cosolventFraction;
    for (let c = 0; c < comps.count; c++) {
      let logK = 0, offset = 0;
      const lipophilic = comps.lipophilicCounterIon[c] === 1;
      if (imm > 0) {
        for (let i = 1; i < ns; i++) {
          const v = phases.org[i] as number;
          if (v <= 0 || lib.miscible[i]) continue;
          const w = v / imm;
          const k = comps.logK[c * ns + i] as number;
          logK += w * (Number.isNaN(k) ? 0 : k);
          offset += w * (lipophilic && lib.solvents[i]?.ionPairCapable ? (lib.ionPairLogKOffset[i] as number) : (lib.ionLogKOffset[i] as number));
        }
      } else offset = DEFAULT_ION_LOGK_OFFSET;
      logK += saltingOutShift(comps.setschenow[c] as number, phases.saltM);
      if (fc > 0) {
        for (let j = 1; j < ns; j++) {
          const v = phases.aq[j] as number;
          if (v > 0 && lib.miscible[j]) logK -= (comps.sigma[c * ns + j] as number) * (v / phases.aqueousVolume);
        }
      }
      const own = comps.ionOffset[c] as number;
      this.kNeutral[c] = Math.exp(logK * Math.LN10);
      this.kIon[c] = Math.exp((logK + (Number.isNaN(own) ? offset : own)) * Math.LN10);
    }
  }

  /** Net positive charge (mol/L) in the aqueous layer at this pH, with components distributed between layers. */
  residual(pH: number): number {
    const h = Math.exp(-pH * Math.LN10);
    let f = this.strongConc + h - KW / h;
    for (let k = 0; k < this.nActive; k++) {
      const s = this.active[k] as number;
      f += ((this.systemTotals[s] as number) / this.va) * systemMeanCharge(s, h);
    }
    const { comps, va, vo } = this;
    for (let c = 0; c < comps.count; c++) {
      const acid = comps.acidKa[c] as Float64Array;
      const base = comps.baseKa[c] as Float64Array;
      let f0 = 1, z = 0;
      for (let i = 0; i < acid.length; i++) {
        const ka = acid[i] as number;
        const charged = ka / (h + ka);
        f0 *= 1 - charged;
        z -= charged;
      }
      for (let i = 0; i < base.length; i++) {
        const ka = base[i] as number;
        const charged = h / (h + ka);
        f0 *= 1 - charged;
        z += charged;
      }
      if (comps.fixedCharge[c] !== 0) f0 = 0;
      const d = (this.kNeutral[c] as number) * f0 + (this.kIon[c] as number) * (1 - f0);
      const fa = va / (va + d * vo);
      this.fractionNeutral[c] = f0;
      this.distribution[c] = d;
      this.fractionAqueous[c] = fa;
      const n = this.amounts[c] as number;
      if (n > 0 && z !== 0) f += (n * fa * z) / va;
    }
    return f;
  }

  /** Free H⁺ and OH⁻ in the aqueous layer after the contact, mmol. */
  freeAcidBase(): { h: number; oh: number } {
    if (!this.phases.hasAqueous) return { h: 0, oh: 0 };
    const h = 10 ** -this.pH;
    return { h: h * this.va, oh: (KW / h) * this.va };
  }

  get aqueousVolume(): number { return this.va; }
  get organicVolume(): number { return this.phases.hasOrganic ? this.phases.organicVolume : 0; }
  get waterIndex(): number { return WATER; }
}
