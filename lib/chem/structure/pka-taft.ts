/**
 * Taft σ* estimates for aliphatic sites (Perrin, Dempsey & Serjeant, "pKa Prediction for Organic Acids and Bases",
 * Chapman & Hall 1981, ch. 3; from memory):
 *   carboxylic acids RCOOH      pKa = 4.76 − 1.62 σ*(R)          (σ*(CH₃) = 0; acetic acid 4.76)
 *   primary amines RNH₃⁺        pKa = 10.15 − 3.14 Σσ*
 *   secondary amines R₂NH₂⁺     pKa = 10.59 − 3.23 Σσ*
 *   tertiary amines R₃NH⁺       pKa = 9.61 − 3.30 Σσ*
 * σ* of a carbon group is built from its substituents with the attenuation factor 0.4 per intervening carbon
 * (Perrin 1981); several groups on one carbon add with diminishing weight (1, 0.7, 0.5) because the book's
 * σ*(CHCl₂) 1.94 and σ*(CCl₃) 2.65 fall below three times σ*(CH₂Cl) 1.05. Charged groups act by field and fall
 * off more slowly: 0.5 per carbon (chosen so that ethylenediamine's second pKa 6.85, CRC, from memory, is met).
 * A plain alkyl group counts −0.1 (σ* of ethyl, Perrin 1981), whatever its branching.
 */
import { type PKaGraph, heavy, isAromatic, z } from "./pka-graph";
import { arylSigmaSum } from "./pka-hammett";
import { sigmaOf, substituentKey } from "./pka-substituents";

export const TAFT = {
  acid: { parent: 4.76, rho: 1.62 },
  amine1: { parent: 10.15, rho: 3.14 },
  amine2: { parent: 10.59, rho: 3.23 },
  amine3: { parent: 9.61, rho: 3.3 },
} as const;

const FALL_OFF = 0.4;
const FALL_OFF_CHARGED = 0.5;
const WEIGHTS = [1, 0.7, 0.5, 0.4];
const ALKYL = -0.1;
/** Transmission of ring σ into σ*(aryl): benzylammonium ρ 1.06 / (3.14 × 0.4) ≈ phenylacetic 0.49 / (1.62 × 0.4) ≈ 0.8. */
const ARYL_TRANSMISSION = 0.8;

const CHARGED = new Set(["NH3+", "NR3+", "COO-", "O-", "SO3-", "PO3H-"]);

/** σ* of the group that starts at atom `first`, seen from the reaction centre `from`. */
export function taftSigma(g: PKaGraph, from: number, first: number, depth = 0, seen: Set<number> = new Set([from])): number {
  const key = substituentKey(g, from, first);
  if (key === "aryl") {
    return isAromatic(g, first) && z(g, first) === 6 ? sigmaOf("aryl").star + ARYL_TRANSMISSION * arylSigmaSum(g, first) : sigmaOf("aryl").star;
  }
  if (key !== "alkyl" && key !== "CH2X") return sigmaOf(key).star;
  if (depth >= 4) return 0;
  const visited = new Set(seen).add(first);
  const parts: number[] = [];
  let hasCarbon = false;
  for (const n of heavy(g, first)) {
    if (visited.has(n.atom)) continue;
    const nkey = substituentKey(g, first, n.atom);
    if (nkey === "alkyl" || nkey === "CH2X") {
      hasCarbon = true;
      const inner = taftSigma(g, first, n.atom, depth + 1, visited);
      if (inner > 0.05) parts.push(FALL_OFF * inner);
      continue;
    }
    const star = taftSigma(g, first, n.atom, depth + 1, visited);
    parts.push((CHARGED.has(nkey) ? FALL_OFF_CHARGED : FALL_OFF) * star);
  }
  const positive = parts.filter((p) => p > 0).sort((a, b) => b - a);
  const negative = parts.filter((p) => p <= 0).reduce((s, p) => s + p, 0);
  const sum = positive.reduce((s, p, i) => s + p * (WEIGHTS[i] ?? 0.4), 0) + negative;
  if (positive.length === 0) return hasCarbon ? Math.min(ALKYL, negative) : negative;
  return sum;
}

/** Carboxylic acid: `carbon` is the carboxyl C; R is its neighbour that is not an oxygen (formic acid: R = H). */
export function taftAcid(g: PKaGraph, carbon: number): number {
  const r = heavy(g, carbon).find((n) => z(g, n.atom) !== 8);
  const star = r ? taftSigma(g, carbon, r.atom) : sigmaOf("H").star;
  return TAFT.acid.parent - TAFT.acid.rho * star;
}

/** Aliphatic amine: Σσ* over the carbon groups on N. */
export function taftAmine(g: PKaGraph, nitrogen: number): number {
  const groups = heavy(g, nitrogen).filter((n) => z(g, n.atom) === 6);
  const eq = groups.length >= 3 ? TAFT.amine3 : groups.length === 2 ? TAFT.amine2 : TAFT.amine1;
  const sum = groups.reduce((s, n) => s + taftSigma(g, nitrogen, n.atom), 0);
  return eq.parent - eq.rho * sum;
}
