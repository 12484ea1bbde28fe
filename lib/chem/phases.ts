/**
 * Phase volumes and densities (densities and mutual solubilities from the CRC Handbook tables in data/).
 *  - Each immiscible solvent dissolves in the aqueous layer up to its saturation mass fraction (scaled by its
 *    share of the organic layer, and lowered by salt through its own Setschenow constant): solvent lost to water.
 *  - Water dissolves in the organic layer: w_sat·m_org·a_w (§2.4; linear in water activity, an approximation).
 *  - Water-miscible solvents split between the layers by their own distribution ratio (§2.8 model 1).
 *  - Densities from composition: volume-additive mixing of the solvents, dissolved salts from the reagents'
 *    solution densities, dissolved components at 1.2 g/mL (typical organic solid; assumption).
 *  - The denser layer sinks; |Δρ| < 0.03 g/mL is a slow or uncertain separation (common practice, §2.6).
 */
import { WATER, type CompiledLibrary } from "./library";
import { type Stream } from "./stream";

/** Layers closer than this in density separate slowly or unpredictably (common practice, §2.6). */
export const MARGINAL_DENSITY_DIFFERENCE = 0.03;
/** Density assumed for dissolved components when computing layer densities, g/mL (assumption). */
export const SOLUTE_DENSITY = 1.2;

/** Water activity from the osmolarity of the aqueous layer (mol/L): a_w = exp(−0.018·φ·m), φ = 1 + 0.0225·m,
 * set so saturated NaCl gives ≈0.75 (§2.4, memory). */
export function waterActivity(osmolar: number): number {
  const m = Math.max(0, osmolar);
  return Math.exp(-0.018 * (1 + 0.0225 * m) * m);
}

export interface LayerOrder {
  organicOnTop: boolean;
  densityDifference: number;
  marginal: boolean;
}

export function layerOrder(organicDensity: number, aqueousDensity: number): LayerOrder {
  const d = organicDensity - aqueousDensity;
  return { organicOnTop: d < 0, densityDifference: d, marginal: Math.abs(d) < MARGINAL_DENSITY_DIFFERENCE };
}

/** Volume-fraction density of a solvent mixture (excess volume neglected, ≲1 %, §2.6). */
export function mixtureDensity(volumes: Record<string, number>, density: (key: string) => number): number {
  let v = 0, m = 0;
  for (const [k, vol] of Object.entries(volumes)) {
    v += vol;
    m += vol * density(k);
  }
  return v > 0 ? m / v : NaN;
}

/**
 * Splits a mixed stream's solvents into an organic and an aqueous layer. Results are left in the instance's
 * fields (no allocation per call): per-solvent volumes in each layer and the totals.
 */
export class PhaseSplit {
  readonly org: Float64Array;
  readonly aq: Float64Array;
  organicVolume = 0;
  aqueousVolume = 0;
  /** Salt concentration used for salting out, mol/L: the ionic strength of the aqueous layer (estimate). */
  saltM = 0;
  osmolar = 0;
  waterActivity = 1;
  /** Volume fraction of water-miscible solvents in the aqueous layer. */
  cosolventFraction = 0;
  hasAqueous = false;
  hasOrganic = false;
  /** Volume of immiscible organic solvent left as a layer (before water and cosolvent uptake). */
  immiscibleVolume = 0;

  constructor(private readonly lib: CompiledLibrary) {
    this.org = new Float64Array(lib.solventKeys.length);
    this.aq = new Float64Array(lib.solventKeys.length);
  }

  split(s: Stream, systemZ2: number): void {
    const { lib, org, aq } = this;
    const n = org.length;
    for (let i = 0; i < n; i++) { org[i] = 0; aq[i] = 0; }
    const vw = s.solv[WATER] as number;
    const rhoW = lib.density[WATER] as number;
    let imm = 0;
    for (let i = 1; i < n; i++) if (!lib.miscible[i]) imm += s.solv[i] as number;
    // Ionic strength: the strong ions, the weak acid–base systems' ions, and the H⁺ or OH⁻ that balances whatever
    // net strong charge the systems do not (1 M HCl is H⁺ + Cl⁻, I = 1 M).
    const counterIons = Math.max(0, Math.abs(s.strongCharge) - systemZ2);
    this.saltM = vw > 0 ? (0.5 * (s.strongZ2 + systemZ2 + counterIons)) / vw : 0;
    this.osmolar = vw > 0 ? s.osmoles / vw : 0;
    this.waterActivity = waterActivity(this.osmolar);
    this.cosolventFraction = 0;
    if (vw <= 1e-12) {
      for (let i = 0; i < n; i++) org[i] = s.solv[i] as number;
      this.finish(false, true, imm);
      return;
    }
    const massWater = vw * rhoW;
    let dissolved = 0;
    for (let i = 1; i < n; i++) {
      const v = s.solv[i] as number;
      if (lib.miscible[i] || v <= 0) continue;
      const x = lib.solventInWater[i] as number;
      const salting = Math.exp(-(lib.selfSetschenow[i] as number) * Math.min(this.saltM, 6) * Math.LN10);
      const vd = Math.min(v, (((v / imm) * x) / (1 - x) * massWater * salting) / (lib.density[i] as number));
      aq[i] = vd;
      org[i] = v - vd;
      dissolved += vd;
    }
    const remaining = imm - dissolved;
    if (remaining <= 1e-9 * (imm + vw)) {
      for (let i = 0; i < n; i++) { aq[i] = s.solv[i] as number; org[i] = 0; }
      this.finish(true, false, 0);
      return;
    }
    let waterMass = 0;
    for (let i = 1; i < n; i++) {
      const v = org[i] as number;
      if (v <= 0 || lib.miscible[i]) continue;
      const w = lib.waterInSolvent[i] as number;
      waterMass += ((v * (lib.density[i] as number) * w) / (1 - w)) * this.waterActivity;
    }
    const waterOrg = Math.min(waterMass / rhoW, 0.9 * vw);
    org[WATER] = waterOrg;
    aq[WATER] = vw - waterOrg;
    const vo0 = remaining + waterOrg;
    const va0 = vw - waterOrg + dissolved;
    let cosAq = 0;
    for (let j = 1; j < n; j++) {
      const v = s.solv[j] as number;
      if (!lib.miscible[j] || v <= 0) continue;
      let logK = 0;
      for (let i = 1; i < n; i++) {
        const vi = org[i] as number;
        if (vi > 0 && !lib.miscible[i]) logK += (vi / remaining) * (lib.cosolventLogK[j * n + i] as number);
      }
      const k = 10 ** logK;
      const fo = (k * vo0) / (k * vo0 + va0);
      org[j] = v * fo;
      aq[j] = v * (1 - fo);
      cosAq += v * (1 - fo);
    }
    this.finish(true, true, remaining);
    this.cosolventFraction = this.aqueousVolume > 0 ? cosAq / this.aqueousVolume : 0;
  }

  private finish(hasAqueous: boolean, hasOrganic: boolean, immiscible: number): void {
    let vo = 0, va = 0;
    for (let i = 0; i < this.org.length; i++) { vo += this.org[i] as number; va += this.aq[i] as number; }
    this.organicVolume = vo;
    this.aqueousVolume = va;
    this.hasAqueous = hasAqueous;
    this.hasOrganic = hasOrganic;
    this.immiscibleVolume = immiscible;
  }

  /** Density of a layer from its solvent volumes, extra dissolved-salt mass and dissolved component mass. */
  density(volumes: Float64Array, extraMassG: number, soluteMassG: number): number {
    let v = 0, m = extraMassG + soluteMassG;
    for (let i = 0; i < volumes.length; i++) {
      const vi = volumes[i] as number;
      v += vi;
      m += vi * (this.lib.density[i] as number);
    }
    v += soluteMassG / SOLUTE_DENSITY;
    return v > 0 ? m / v : NaN;
  }
}
