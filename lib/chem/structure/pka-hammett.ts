/**
 * Hammett estimates for sites on (or one atom off) an aromatic ring: pKa = pKa₀ − ρ Σσ over the ring's meta and
 * para substituents, with ortho substituents taken from the measured ortho parent (ΔpKa of the 2-substituted parent
 * against the unsubstituted one), as Perrin, Dempsey & Serjeant, "pKa Prediction for Organic Acids and Bases"
 * (Chapman & Hall 1981), ch. 4, recommend. σ values: Hansch, Leo & Taft, Chem. Rev. 1991, 91, 165 (pka-substituents.ts).
 *
 * Parent pKa₀ and ρ (Perrin, Dempsey & Serjeant 1981, Table 4.1; from memory): benzoic acids 4.20, ρ 1.00;
 * phenols 9.99, ρ 2.23 (σp⁻); anilinium 4.60, ρ 2.89 (σp⁻); N-alkylanilinium 4.85, ρ 2.9; N,N-dialkylanilinium
 * 5.07, ρ 3.46; pyridinium 5.23, ρ 5.90; benzenesulfonamides 10.10, ρ 1.06; benzeneboronic acids 8.83, ρ 2.15.
 * The parent values are the measured ones of the class's parent compound (site-classes.ts names each source).
 */
import { type PKaGraph, aromaticRingOf, heavy, isAromatic, ringDistance, z } from "./pka-graph";
import { sigmaOf, substituentKey } from "./pka-substituents";

export type HammettFamily = "benzoic" | "phenol" | "anilinium" | "anilinium_n" | "anilinium_nn" | "pyridinium" | "sulfonamide" | "boronic" | "benzylic";

interface FamilyConstants {
  rho: number;
  /** Use σp⁻ for para acceptors (sites whose anion or free base conjugates with the ring). */
  minus: boolean;
  /** ΔpKa of the 2-substituted parent against the parent, by substituent key (measured values, CRC; from memory). */
  ortho: Record<string, number>;
}

/** Ortho ΔpKa values: CRC Handbook, "Dissociation constants of organic acids and bases", 2-substituted parents (from memory). */
export const HAMMETT: Record<HammettFamily, FamilyConstants> = {
  benzoic: {
    rho: 1.0, minus: false,
    // o-toluic 3.91, 2-F 3.27, 2-Cl 2.94, 2-Br 2.85, 2-I 2.86, 2-NO2 2.17, salicylic 2.98, 2-OMe 4.09, aspirin 3.49,
    // anthranilic (COOH of the neutral form) 4.95, phthalic 2.95 / 5.41, 2-phenyl 3.46, 2-CF3 3.20, 2-acetyl 4.13,
    // 1-naphthoic 3.69 (peri, with the meta junction).
    ortho: { alkyl: -0.29, F: -0.93, Cl: -1.26, Br: -1.35, I: -1.34, NO2: -2.03, OH: -1.22, OR: -0.11, OCOR: -0.71, NH2: 0.75, NHR: 0.75, NR2: 0.2, NHCOR: -0.5, COOH: -1.25, "COO-": 1.21, COOR: -0.8, aryl: -0.74, CF3: -1.0, COR: -0.07, CN: -0.8, fused: -0.41, "NH3+": -2.0, "O-": 1.0,
      // five-membered rings: furan-2-carboxylic 3.16, thiophene-2-carboxylic 3.49, pyrrole-2-carboxylic 4.45
      ring_O: -1.04, ring_S: -0.71, ring_N: 0.25 },
  },
  phenol: {
    rho: 2.23, minus: true,
    // o-cresol 10.28, 2-F 8.70, 2-Cl 8.56, 2-Br 8.42, 2-I 8.51, 2-NO2 7.23, guaiacol 9.98, catechol 9.45,
    // (catechol net of the statistical log 2 of its two OH), 2-aminophenol 9.87, salicylaldehyde 8.37, 2-hydroxyacetophenone 10.28, methyl salicylate 9.87, salicylate
    // (phenol of the anion) 13.6, 2-cyanophenol 6.97, 2-phenylphenol 9.55, 1-naphthol 9.34 (with the meta junction).
    ortho: { alkyl: 0.29, F: -1.29, Cl: -1.43, Br: -1.57, I: -1.48, NO2: -2.76, OR: 0, OH: -0.24, NH2: -0.12, NHR: -0.12, NR2: -0.12, CHO: -1.62, COR: 0.29, COOR: -0.12, COOH: -1.2, "COO-": 3.6, CONR2: -0.7, CN: -3.0, aryl: -0.44, CF3: -1.3, fused: -0.43, "NH3+": -1.3, "O-": 2.0 },
  },
  anilinium: {
    rho: 2.89, minus: true,
    // o-toluidine 4.44, 2-F 3.20, 2-Cl 2.65, 2-Br 2.53, 2-I 2.60, 2-NO2 −0.28, o-anisidine 4.53, 2-aminophenol
    // (NH3+) 4.72, o-phenylenediamine 4.47, anthranilic acid (NH3+ of the cation) 2.17, methyl anthranilate 2.23,
    // 2-aminobiphenyl 3.82, 2-aminoacetophenone 2.31, 2-CF3 1.10, 1-naphthylamine 3.92 (with the meta junction).
    ortho: { alkyl: -0.16, F: -1.4, Cl: -1.95, Br: -2.07, I: -2.0, NO2: -4.88, OR: -0.07, OH: 0.12, NH2: -0.13, NHR: -0.13, NR2: -0.13, COOH: -2.43, "COO-": -1.6, COOR: -2.37, COR: -2.29, CONR2: -2.0, aryl: -0.78, CF3: -3.5, CN: -5.4, fused: -0.39, "NH3+": -3.0 },
  },
  anilinium_n: {
    rho: 2.9, minus: true,
    ortho: { alkyl: -0.3, F: -1.4, Cl: -2.0, Br: -2.1, I: -2.0, NO2: -5.0, OR: -0.1, fused: -0.4 },
  },
  anilinium_nn: {
    // N,N-dimethyl-o-toluidine 5.86: ortho groups twist the NMe2 out of conjugation and raise the pKa.
    rho: 3.46, minus: true,
    ortho: { alkyl: 0.8, F: -1.0, Cl: -1.2, Br: -1.2, NO2: -4.0, OR: 0.9, fused: -0.4 },
  },
  pyridinium: {
    rho: 5.9, minus: false,
    // 2-picoline 5.97, 2-F −0.44, 2-Cl 0.72, 2-Br 0.90, 2-I 1.82, 2-OMe 3.28, 2-aminopyridine 6.86, 2-NMe2 6.95,
    // 2-phenyl 4.48, 2-CN −0.26, 2-acetyl 2.64, methyl picolinate 2.21, picolinamide 2.10, 2-vinyl 4.98,
    // 2-pyridylmethanol 4.90, quinoline 4.90 (ortho-fused), isoquinoline 5.40 (meta- and para-fused).
    ortho: { alkyl: 0.74, F: -5.67, Cl: -4.51, Br: -4.33, I: -3.41, OR: -1.95, NH2: 1.63, NHR: 1.9, NR2: 1.72, aryl: -0.75, CN: -5.49, COR: -2.59, COOR: -3.02, CONR2: -3.13, vinyl: -0.25, CH2X: -0.33, fused: -0.33, COOH: -4.2, "COO-": 0.1, CF3: -5.5, OH: -4.0, SR: -1.6 },
  },
  sulfonamide: { rho: 1.06, minus: false, ortho: { alkyl: 0.1, Cl: -0.3, NO2: -1.0, fused: -0.1 } },
  boronic: { rho: 2.15, minus: false, ortho: { alkyl: 0.6, F: -1.0, OR: 0.3, fused: 0 } },
  /** Sites one CH₂ from the ring (benzylamine, phenylacetic acid): the Taft estimator folds this in via σ*(aryl). */
  benzylic: { rho: 0.8, minus: false, ortho: {} },
};

/**
 * Para donors barely conjugate with a phenoxide: the phenols use "normal" σ⁰ values for them (van Bekkum,
 * Verkade & Wepster, Recl. Trav. Chim. 1959, 78, 815; from memory), not σp from benzoic acids.
 */
const PHENOL_SIGMA0: Record<string, number> = { alkyl: -0.12, OR: -0.1, OH: -0.07, NH2: -0.13, NHR: -0.15, NR2: -0.2, "O-": -0.3, aryl: 0.05 };

/** A heteroatom of a five-membered aromatic ring, read as a substituent of the site's ring position. */
const RING5: Record<number, string> = { 8: "ring_O", 16: "ring_S", 7: "ring_N" };

/** Fused-ring junctions seen from a pyridine N: meta/para junctions raise the pKa slightly (isoquinoline 5.40). */
const PYRIDINE_FUSED_MP = 0.08;

export interface RingSubstituent {
  key: string;
  position: "o" | "m" | "p";
  atom: number;
}

/** Substituents of the aromatic ring of `ipso` relative to it, skipping atoms in `skip` (the site's own group). */
export function ringSubstituents(g: PKaGraph, ipso: number, skip: ReadonlySet<number>): RingSubstituent[] {
  const ring = aromaticRingOf(g, ipso);
  if (!ring) return [];
  const out: RingSubstituent[] = [];
  for (const r of ring) {
    if (r === ipso) continue;
    const d = ringDistance(ring, ipso, r);
    const position = d === 1 ? "o" : ring.length === 6 && d === 3 ? "p" : "m";
    if (z(g, r) === 7 && ring.length === 6 && !skip.has(r)) out.push({ key: (g.atoms[r]?.chg ?? 0) > 0 ? "aza+" : "aza", position, atom: r });
    if (ring.length === 5 && z(g, r) !== 6 && !skip.has(r)) out.push({ key: RING5[z(g, r)] ?? "ring_N", position, atom: r });
    let fused = false;
    for (const n of heavy(g, r)) {
      if (ring.includes(n.atom) || skip.has(n.atom)) continue;
      const sharesRing = g.rings.some((other) => other !== ring && other.includes(r) && other.includes(n.atom));
      if (sharesRing && isAromatic(g, n.atom) && n.aromatic) {
        fused = true;
        continue;
      }
      out.push({ key: substituentKey(g, r, n.atom), position, atom: n.atom });
    }
    if (fused) out.push({ key: "fused", position, atom: r });
  }
  return out;
}

/** ΔpKa for the substituents of a ring-bound site; `ipso` is the ring atom bearing (or being) the site. */
export function hammettShift(g: PKaGraph, family: HammettFamily, ipso: number, skip: ReadonlySet<number>): number {
  const f = HAMMETT[family];
  let shift = 0;
  for (const s of ringSubstituents(g, ipso, skip)) {
    const sigma = sigmaOf(s.key);
    if (family === "pyridinium" && s.key === "fused") {
      shift += s.position === "o" ? (f.ortho.fused ?? 0) : PYRIDINE_FUSED_MP;
      continue;
    }
    if (s.position === "o") {
      shift += f.ortho[s.key] ?? -f.rho * sigma.p;
      continue;
    }
    const para = family === "phenol" && sigma.p < 0 ? (PHENOL_SIGMA0[s.key] ?? sigma.p) : sigma.p;
    const value = s.position === "m" ? sigma.m : f.minus ? (sigma.pMinus ?? para) : para;
    shift -= f.rho * value;
  }
  return shift;
}

/** Σσ (meta/para; ortho counted as para) of an aryl group's ring seen from its ipso atom: for σ*(aryl) in Taft sums. */
export function arylSigmaSum(g: PKaGraph, ipso: number): number {
  return ringSubstituents(g, ipso, new Set()).reduce((sum, s) => {
    const sigma = sigmaOf(s.key);
    return sum + (s.position === "m" ? sigma.m : sigma.p);
  }, 0);
}
