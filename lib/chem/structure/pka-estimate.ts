/**
 * Refines each detected site's class value from the structure (Perrin, Dempsey & Serjeant, "pKa Prediction for
 * Organic Acids and Bases", Chapman & Hall 1981): Hammett σ for ring-bound sites (pka-hammett.ts), Taft σ* for
 * aliphatic acids and amines (pka-taft.ts), and simple additive rules for imidazoles and tetrazoles.
 *
 * Several sites in one molecule are solved as microspecies, stepwise from the fully protonated form as the book
 * does for polyfunctional compounds: at each step every remaining site is estimated with the others in their
 * current state, the most acidic gives up its proton, and later steps see it ionised (salicylic acid: COOH first,
 * then the phenol beside a carboxylate; 4-aminobenzoic acid: the anilinium first, then the COOH beside a neutral
 * NH2). Two equivalent sites get the statistical correction ∓log 2 (Perrin 1981, ch. 2). The engine then forms a
 * zwitterion only where an acid's value lies below a base's.
 */
import { type PKaGraph, aromaticRingOf, heavy, isAromatic, withAtoms, z } from "./pka-graph";
import { hammettShift } from "./pka-hammett";
import { substituentKey } from "./pka-substituents";
import { taftAcid, taftAmine } from "./pka-taft";
import { type SiteClass } from "./site-classes";

export interface SiteMatch {
  spec: SiteClass;
  /** The ionizable atom. */
  atom: number;
  /** Every atom of the class's match (the site's own group, never read as a substituent). */
  atoms: number[];
  /** Class value (or the second-proton value) before refinement. */
  value: number;
  /** True for a second proton on the same group or the second site of a ring; never refined. */
  fixed?: boolean;
}

/** Perrin, Dempsey & Serjeant 1981 parents (from memory): N-methylanilinium 4.85, N,N-dimethylanilinium 5.07. */
const ANILINE_N_ALKYL = [0, 0.25, 0.47];
/** Methanesulfonamide 10.87, methylboronic acid ≈ 10.4 (from memory; CRC Handbook). */
const ALKYL_SULFONAMIDE = 10.87;
const ALKYL_BORONIC = 10.4;
/** Acrylic acid 4.25; crotonic 4.69, methacrylic 4.66, cinnamic 4.44 (from memory; CRC Handbook). */
const ACRYLIC = { parent: 4.25, alkyl: 0.42, aryl: 0.19 };
/**
 * Imidazolium: 2-methylimidazole 7.86, 4-methylimidazole 7.52, 1-methylimidazole 7.06, 2-phenylimidazole 6.39,
 * 4-phenylimidazole 6.1 (from memory; Perrin 1965); other groups −ρσm with ρ ≈ 6 (pyridinium-like, from memory).
 */
const IMIDAZOLE = { c2: { alkyl: 0.87, aryl: -0.6 }, c45: { alkyl: 0.53, aryl: -0.9 }, n1: { alkyl: 0.07, aryl: -1.2 }, rho: 6 };
/** 5-phenyltetrazole 4.5, 5-methyltetrazole 5.5 (from memory; CRC Handbook). */
const TETRAZOLE: Record<string, number> = { aryl: 4.5, alkyl: 5.5 };

/** Benzamidine 11.6 (from memory; Perrin 1965). */
const BENZAMIDINE = 11.6;

const LOG2 = Math.log10(2);

function neighbour(g: PKaGraph, atom: number, element: number): number | undefined {
  return heavy(g, atom).find((n) => z(g, n.atom) === element)?.atom;
}

function estimateOne(g: PKaGraph, site: SiteMatch): number {
  const { spec, atom } = site;
  const base = spec.pKa;
  const skip = new Set(site.atoms.filter((a) => a !== atom));
  skip.add(atom);
  switch (spec.method) {
    case "benzoic": {
      const carbon = neighbour(g, atom, 6);
      const ipso = carbon === undefined ? undefined : heavy(g, carbon).find((n) => isAromatic(g, n.atom))?.atom;
      return ipso === undefined ? base : base + hammettShift(g, "benzoic", ipso, skip);
    }
    case "phenol": {
      const ipso = heavy(g, atom).find((n) => isAromatic(g, n.atom))?.atom;
      return ipso === undefined ? base : base + hammettShift(g, "phenol", ipso, skip);
    }
    case "aniline": {
      const ipso = heavy(g, atom).find((n) => isAromatic(g, n.atom))?.atom;
      if (ipso === undefined) return base;
      const alkyl = heavy(g, atom).filter((n) => n.atom !== ipso).length;
      const family = alkyl === 0 ? "anilinium" : alkyl === 1 ? "anilinium_n" : "anilinium_nn";
      return base + (ANILINE_N_ALKYL[alkyl] ?? 0) + hammettShift(g, family, ipso, skip);
    }
    case "pyridine":
      return base + hammettShift(g, "pyridinium", atom, new Set(site.atoms.filter((a) => a !== atom && !isAromatic(g, a))));
    case "sulfonamide": {
      const sulfur = neighbour(g, atom, 16);
      const carbon = sulfur === undefined ? undefined : heavy(g, sulfur).find((n) => z(g, n.atom) === 6)?.atom;
      if (carbon === undefined || sulfur === undefined) return base;
      return isAromatic(g, carbon) ? base + hammettShift(g, "sulfonamide", carbon, new Set([sulfur])) : ALKYL_SULFONAMIDE;
    }
    case "boronic": {
      const boron = neighbour(g, atom, 5);
      const carbon = boron === undefined ? undefined : heavy(g, boron).find((n) => z(g, n.atom) === 6)?.atom;
      if (carbon === undefined || boron === undefined) return base;
      return isAromatic(g, carbon) ? base + hammettShift(g, "boronic", carbon, new Set([boron])) : ALKYL_BORONIC;
    }
    case "taft_acid": {
      const carbon = neighbour(g, atom, 6);
      if (carbon === undefined) return base;
      const r = heavy(g, carbon).find((n) => z(g, n.atom) !== 8)?.atom;
      if (r !== undefined && substituentKey(g, carbon, r) === "vinyl") return acrylic(g, carbon, r);
      return taftAcid(g, carbon);
    }
    case "taft_amine":
      return taftAmine(g, atom);
    case "imidazole":
      return base + imidazoleShift(g, atom);
    default:
      if (spec.id === "amidine") {
        const carbon = heavy(g, atom).find((n) => z(g, n.atom) === 6 && n.order === 2)?.atom;
        return carbon !== undefined && heavy(g, carbon).some((n) => isAromatic(g, n.atom)) ? BENZAMIDINE : base;
      }
      if (spec.id === "tetrazole") {
        const ring = aromaticRingOf(g, atom);
        const c5 = ring?.find((a) => z(g, a) === 6);
        const sub = c5 === undefined ? undefined : heavy(g, c5).find((n) => !ring?.includes(n.atom));
        return sub ? TETRAZOLE[substituentKey(g, c5 ?? 0, sub.atom)] ?? base : base;
      }
      return base;
  }
}

function acrylic(g: PKaGraph, carbon: number, alpha: number): number {
  let value = ACRYLIC.parent;
  const alkene = heavy(g, alpha).filter((n) => n.atom !== carbon);
  const beta = alkene.find((n) => n.order === 2)?.atom;
  const groups = [...alkene.filter((n) => n.order !== 2).map((n) => substituentKey(g, alpha, n.atom)), ...(beta === undefined ? [] : heavy(g, beta).filter((n) => n.atom !== alpha).map((n) => substituentKey(g, beta, n.atom)))];
  for (const key of groups) value += key === "aryl" ? ACRYLIC.aryl : key === "alkyl" ? ACRYLIC.alkyl : 0;
  return value;
}

function imidazoleShift(g: PKaGraph, site: number): number {
  const ring = aromaticRingOf(g, site);
  if (!ring) return 0;
  let shift = 0;
  for (const r of ring) {
    if (r === site) continue;
    const isN = z(g, r) === 7;
    const betweenNs = !isN && heavy(g, r).filter((n) => ring.includes(n.atom) && z(g, n.atom) === 7).length === 2;
    const table = isN ? IMIDAZOLE.n1 : betweenNs ? IMIDAZOLE.c2 : IMIDAZOLE.c45;
    for (const n of heavy(g, r)) {
      if (ring.includes(n.atom)) continue;
      const key = substituentKey(g, r, n.atom);
      if (key === "alkyl" || key === "CH2X") shift += table.alkyl;
      else if (key === "aryl") shift += table.aryl;
      else if (!isN) shift -= IMIDAZOLE.rho * (SIGMA_M[key] ?? 0.3);
      else shift -= 3;
    }
  }
  return shift;
}

/** σm for the imidazole rule, a subset of Hansch, Leo & Taft 1991 (from memory). */
const SIGMA_M: Record<string, number> = { NO2: 0.71, Cl: 0.37, Br: 0.39, CF3: 0.43, COOR: 0.37, COR: 0.38, CN: 0.56, CHO: 0.35, CONR2: 0.28, "COO-": -0.1, COOH: 0.37, OR: 0.12 };

/** The fully protonated form: every acid as HA, every base as BH⁺, so salts and zwitterions are read alike. */
function protonated(g: PKaGraph, sites: SiteMatch[]): PKaGraph {
  const out = withAtoms(g);
  for (const s of sites) {
    const a = out.atoms[s.atom];
    if (!a || z(out, s.atom) === 5) continue;
    if (s.spec.kind === "acid" && a.chg < 0) {
      a.chg = 0;
      a.hs += 1;
    } else if (s.spec.kind === "base" && a.chg <= 0) {
      a.chg = 1;
      a.hs += 1;
    }
  }
  return out;
}

/** Takes the proton off site `s` in graph `g` (HA → A⁻, BH⁺ → B). */
function deprotonate(g: PKaGraph, s: SiteMatch): void {
  const a = g.atoms[s.atom];
  if (!a || z(g, s.atom) === 5) return;
  a.chg -= 1;
  a.hs = Math.max(0, a.hs - 1);
}

/**
 * Refined values, in the order of `sites`. Stepwise from the fully protonated form: every remaining site is
 * estimated in the current microstate, the most acidic one gives up its proton (its value is fixed there), and
 * the next step sees it ionised. Equivalent sites (same class, same value in the protonated form) get ∓log 2.
 */
export function refineSiteValues(g: PKaGraph, sites: SiteMatch[]): number[] {
  const state = protonated(g, sites);
  const start = sites.map((s) => (s.fixed ? s.value : round(estimateOne(state, s))));
  const values: number[] = new Array<number>(sites.length).fill(NaN);
  const order: number[] = [];
  const remaining = new Set(sites.map((_, i) => i));
  while (remaining.size > 0) {
    let best = -1;
    let bestValue = Infinity;
    for (const i of remaining) {
      const site = sites[i];
      if (!site) continue;
      const v = site.fixed ? site.value : round(estimateOne(state, site));
      if (v < bestValue - 0.005) {
        best = i;
        bestValue = v;
      }
    }
    const site = sites[best];
    if (!site) break;
    values[best] = bestValue;
    order.push(best);
    remaining.delete(best);
    deprotonate(state, site);
  }
  return statistical(sites, start, values, order);
}

function statistical(sites: SiteMatch[], start: number[], values: number[], order: number[]): number[] {
  const out = [...values];
  const rank = new Map(order.map((i, k) => [i, k]));
  sites.forEach((s, i) => {
    if (s.fixed || !s.spec.method) return;
    const twin = sites.findIndex((t, j) => j !== i && !t.fixed && t.spec.id === s.spec.id && Math.abs((start[j] ?? 0) - (start[i] ?? 0)) < 0.02);
    if (twin < 0) return;
    const sign = (rank.get(i) ?? 0) < (rank.get(twin) ?? 0) ? -1 : 1;
    out[i] = round((values[i] ?? 0) + sign * LOG2);
  });
  return out;
}

const round = (v: number) => Math.round(v * 100) / 100;
