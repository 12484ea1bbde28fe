/**
 * Substituent constants for the pKa estimators, and the reader that names the substituent a bond leads to.
 *
 * σm, σp and σp⁻ (Hammett): Hansch, Leo & Taft, "A survey of Hammett substituent constants and resonance and field
 * parameters", Chem. Rev. 1991, 91, 165–195, Table 1 (values recalled from that table: "from memory"; the σp⁻
 * column is the one used for phenols and anilinium ions when the substituent can take the ring's negative charge).
 * σ* (Taft, polar, for the group X bonded to the reaction centre) and the attenuation factor 0.4 per CH₂:
 * Perrin, Dempsey & Serjeant, "pKa Prediction for Organic Acids and Bases" (Chapman & Hall 1981), ch. 3 and its
 * Table of σ* values (from memory). Every value here is therefore "from memory" and carries the class's wide se.
 */
import { type PKaGraph, doubleO, heavy, isAromatic, others, z } from "./pka-graph";

export interface Sigma {
  m: number;
  p: number;
  /** σp⁻ where the group conjugates with a negative charge (acceptors); defaults to p. */
  pMinus?: number;
  /** Taft σ* of the group bonded directly to the reaction centre. */
  star: number;
}

/** Hansch, Leo & Taft 1991 (σ); Perrin, Dempsey & Serjeant 1981 (σ*). From memory. */
export const SIGMA: Record<string, Sigma> = {
  H: { m: 0, p: 0, star: 0.49 },
  alkyl: { m: -0.07, p: -0.17, star: -0.1 },
  CF3: { m: 0.43, p: 0.54, pMinus: 0.65, star: 2.6 },
  CCl3: { m: 0.4, p: 0.46, star: 2.65 },
  CH2X: { m: 0.1, p: 0.1, star: 1.0 },
  aryl: { m: 0.06, p: -0.01, pMinus: 0.02, star: 0.6 },
  vinyl: { m: 0.06, p: -0.04, star: 0.56 },
  ethynyl: { m: 0.21, p: 0.23, pMinus: 0.53, star: 2.18 },
  CN: { m: 0.56, p: 0.66, pMinus: 1.0, star: 3.3 },
  CHO: { m: 0.35, p: 0.42, pMinus: 1.03, star: 2.15 },
  COR: { m: 0.38, p: 0.5, pMinus: 0.84, star: 1.65 },
  COOH: { m: 0.37, p: 0.45, pMinus: 0.77, star: 2.08 },
  COOR: { m: 0.37, p: 0.45, pMinus: 0.75, star: 2.0 },
  CONR2: { m: 0.28, p: 0.36, pMinus: 0.61, star: 1.68 },
  "COO-": { m: -0.1, p: 0, pMinus: 0.31, star: -0.15 },
  NH2: { m: -0.16, p: -0.66, star: 0.62 },
  NHR: { m: -0.21, p: -0.7, star: 0.62 },
  NR2: { m: -0.16, p: -0.83, star: 0.62 },
  NHCOR: { m: 0.21, p: 0, star: 1.4 },
  NHSO2R: { m: 0.2, p: 0.03, star: 1.6 },
  NO2: { m: 0.71, p: 0.78, pMinus: 1.27, star: 4.25 },
  "NH3+": { m: 0.86, p: 0.6, star: 3.76 },
  "NR3+": { m: 0.88, p: 0.82, star: 4.36 },
  OH: { m: 0.12, p: -0.37, star: 1.34 },
  OR: { m: 0.12, p: -0.27, star: 1.81 },
  OAr: { m: 0.25, p: -0.03, star: 2.43 },
  OCOR: { m: 0.39, p: 0.31, star: 2.56 },
  "O-": { m: -0.47, p: -0.81, star: -0.3 },
  OCF3: { m: 0.38, p: 0.35, star: 2.8 },
  F: { m: 0.34, p: 0.06, star: 3.1 },
  Cl: { m: 0.37, p: 0.23, star: 2.96 },
  Br: { m: 0.39, p: 0.23, star: 2.84 },
  I: { m: 0.35, p: 0.18, star: 2.46 },
  SH: { m: 0.25, p: 0.15, star: 1.68 },
  SR: { m: 0.15, p: 0, pMinus: 0.06, star: 1.56 },
  SOR: { m: 0.52, p: 0.49, pMinus: 0.73, star: 2.88 },
  SO2R: { m: 0.6, p: 0.72, pMinus: 1.13, star: 3.68 },
  SO2NR2: { m: 0.53, p: 0.6, pMinus: 0.94, star: 3.2 },
  "SO3-": { m: 0.3, p: 0.35, star: 0.8 },
  "B(OH)2": { m: -0.01, p: 0.12, star: 0 },
  SiR3: { m: -0.04, p: -0.07, star: -0.1 },
  "PO3H-": { m: 0.2, p: 0.26, star: 0.8 },
  /** Ring nitrogen (aza) of a six-membered ring, neutral; Perrin 1981, Table 4.x (from memory). */
  aza: { m: 0.65, p: 0.93, star: 0 },
  /**
   * Protonated ring nitrogen (pyridinium) as a substituent: chosen so that the COOH of the nicotinic and isonicotinic
   * acid cations comes out at 2.07 and 1.77 (CRC, from memory); field effect only, so no σ* value.
   */
  "aza+": { m: 2.1, p: 2.4, star: 0 },
  /** A ring fused at this position (naphthalene-type); fitted by us to 1-/2-naphthol and naphthylamine pKa (from memory, CRC). */
  fused: { m: 0.1, p: 0.1, star: 0 },
};

/**
 * Names the substituent that starts at `first` seen from `from`. Unknown groups fall back to the closest generic
 * key ("alkyl" for carbon, "OR" for oxygen...), so an estimate is always produced.
 */
export function substituentKey(g: PKaGraph, from: number, first: number): string {
  const a = g.atoms[first];
  if (!a) return "H";
  const rest = others(g, first, from);
  switch (a.z) {
    case 9: return "F";
    case 17: return "Cl";
    case 35: return "Br";
    case 53: return "I";
    case 5: return "B(OH)2";
    case 14: return "SiR3";
    case 15: return "PO3H-";
    case 8: {
      if (a.chg < 0) return "O-";
      if (a.hs > 0) return "OH";
      const next = rest[0]?.atom;
      if (next === undefined) return "OR";
      if (z(g, next) === 6 && doubleO(g, next) > 0) return "OCOR";
      if (z(g, next) === 6 && heavy(g, next).filter((n) => z(g, n.atom) === 9).length === 3) return "OCF3";
      if (isAromatic(g, next)) return "OAr";
      return "OR";
    }
    case 7: {
      if (a.aromatic) return "aryl";
      if (doubleO(g, first) >= 1 && a.chg > 0) return "NO2";
      if (a.chg > 0) return a.hs > 0 ? "NH3+" : "NR3+";
      if (rest.some((n) => z(g, n.atom) === 6 && doubleO(g, n.atom) > 0)) return "NHCOR";
      if (rest.some((n) => z(g, n.atom) === 16 && doubleO(g, n.atom) >= 2)) return "NHSO2R";
      if (rest.some((n) => n.order === 2)) return "NHCOR";
      return a.hs >= 2 ? "NH2" : a.hs === 1 ? "NHR" : "NR2";
    }
    case 16: {
      const oxo = doubleO(g, first);
      if (oxo >= 2) {
        const singles = rest.filter((n) => n.order === 1);
        if (singles.some((n) => z(g, n.atom) === 8 && (g.atoms[n.atom]?.hs ?? 0) + Math.abs(g.atoms[n.atom]?.chg ?? 0) > 0)) return "SO3-";
        if (singles.some((n) => z(g, n.atom) === 7)) return "SO2NR2";
        return "SO2R";
      }
      if (oxo === 1) return "SOR";
      return a.hs > 0 ? "SH" : "SR";
    }
    case 6: {
      if (a.aromatic) return "aryl";
      if (rest.some((n) => n.order === 3 && z(g, n.atom) === 7)) return "CN";
      if (rest.some((n) => n.order === 3)) return "ethynyl";
      if (doubleO(g, first) > 0) {
        const single = rest.filter((n) => n.order === 1);
        const o = single.find((n) => z(g, n.atom) === 8);
        if (o) {
          const oa = g.atoms[o.atom];
          if (oa && oa.chg < 0) return "COO-";
          if (oa && oa.hs > 0) return "COOH";
          return "COOR";
        }
        if (single.some((n) => z(g, n.atom) === 7)) return "CONR2";
        if (single.length === 0) return "CHO";
        return "COR";
      }
      const halogens = rest.filter((n) => z(g, n.atom) === 9).length;
      if (halogens === 3) return "CF3";
      if (rest.filter((n) => z(g, n.atom) === 17).length === 3) return "CCl3";
      if (rest.some((n) => n.order === 2)) return "vinyl";
      if (rest.some((n) => z(g, n.atom) !== 6)) return "CH2X";
      return "alkyl";
    }
    default:
      return "alkyl";
  }
}

export function sigmaOf(key: string): Sigma {
  return SIGMA[key] ?? SIGMA.alkyl ?? { m: 0, p: 0, star: 0 };
}
