/**
 * A stream: the contents of one vessel or layer. Solvent volumes (water included, index 0), the aqueous solutes
 * reduced to what the pH solver needs (net strong-ion charge, Σz²·n, Σn, acid–base system totals), the mass of
 * dissolved salts beyond water (for density), and every component's total amount. Streams are taken from the
 * simulator's pool and cleared rather than allocated at every contact.
 */
import { N_SYSTEMS, type CompiledReagent } from "./library";

export class Stream {
  readonly solv: Float64Array;
  readonly sys: Float64Array;
  readonly comp: Float64Array;
  /** mmol of net strong-ion charge, Σz²·n and Σn. */
  strongCharge = 0;
  strongZ2 = 0;
  osmoles = 0;
  /** Solution mass of the aqueous part beyond water at its density, g. */
  extraMassG = 0;
  /** pH when last equilibrated (NaN if unknown or no water). */
  lastPh = NaN;
  /** Solid (filter cake or precipitate) rather than liquid. */
  solid = false;
  /** False while every acid–base system total is zero (organic layers, most streams): their loops are skipped. */
  hasSystems = false;

  constructor(nSolvents: number, nComponents: number) {
    this.solv = new Float64Array(nSolvents);
    this.sys = new Float64Array(N_SYSTEMS);
    this.comp = new Float64Array(nComponents);
  }

  static like(s: Stream): Stream {
    return new Stream(s.solv.length, s.comp.length);
  }

  clone(): Stream {
    const c = Stream.like(this);
    c.addFrom(this, 1);
    c.lastPh = this.lastPh;
    c.solid = this.solid;
    return c;
  }

  /** Adds `fraction` of another stream's contents. */
  addFrom(o: Stream, fraction: number): void {
    for (let i = 0; i < this.solv.length; i++) this.solv[i] = (this.solv[i] as number) + (o.solv[i] as number) * fraction;
    if (o.hasSystems) this.addSystems(o.sys, fraction);
    for (let i = 0; i < this.comp.length; i++) this.comp[i] = (this.comp[i] as number) + (o.comp[i] as number) * fraction;
    this.strongCharge += o.strongCharge * fraction;
    this.strongZ2 += o.strongZ2 * fraction;
    this.osmoles += o.osmoles * fraction;
    this.extraMassG += o.extraMassG * fraction;
  }

  /** Adds a volume (mL) of a reagent solution, or an amount (mmol) of a solid reagent. */
  addReagent(r: CompiledReagent, quantity: number, waterDensity: number): void {
    if (r.hasSystems) this.addSystems(r.systems, quantity);
    this.strongCharge += r.strongCharge * quantity;
    this.strongZ2 += r.strongZ2 * quantity;
    this.osmoles += r.osmoles * quantity;
    if (r.solid) {
      this.extraMassG += (r.molarMass * quantity) / 1000;
    } else {
      this.solv[0] = (this.solv[0] as number) + quantity;
      this.extraMassG += (r.density - waterDensity) * quantity;
    }
  }

  totalVolume(): number {
    let v = 0;
    for (let i = 0; i < this.solv.length; i++) v += this.solv[i] as number;
    return v;
  }

  /** Adds `factor` times the system totals `sys`. */
  addSystems(sys: Float64Array, factor: number): void {
    for (let i = 0; i < this.sys.length; i++) this.sys[i] = (this.sys[i] as number) + (sys[i] as number) * factor;
    this.hasSystems = true;
  }

  clear(): void {
    // Element loops: fill() costs more than the few elements these arrays hold.
    for (let i = 0; i < this.solv.length; i++) this.solv[i] = 0;
    if (this.hasSystems) {
      for (let i = 0; i < this.sys.length; i++) this.sys[i] = 0;
      this.hasSystems = false;
    }
    for (let i = 0; i < this.comp.length; i++) this.comp[i] = 0;
    this.strongCharge = this.strongZ2 = this.osmoles = this.extraMassG = 0;
    this.lastPh = NaN;
    this.solid = false;
  }

  /** Moves the aqueous solutes (not solvents or components) of `o` into this stream. */
  takeAqueousSolutes(o: Stream): void {
    if (o.hasSystems) this.addSystems(o.sys, 1);
    this.strongCharge += o.strongCharge;
    this.strongZ2 += o.strongZ2;
    this.osmoles += o.osmoles;
    this.extraMassG += o.extraMassG;
  }
}

/** Copies `src` into `dst` element by element. */
export function copyInto(dst: Float64Array, src: Float64Array): void {
  for (let i = 0; i < dst.length; i++) dst[i] = src[i] as number;
}

/** arr[i] += v under noUncheckedIndexedAccess. */
export function addAt(arr: Float64Array, i: number, v: number): void {
  arr[i] = (arr[i] as number) + v;
}
