/**
 * A small, mutable view of a molecule's graph for the pKa estimators: element, charge, hydrogens, aromaticity,
 * neighbours with bond orders and rings. The charge/hydrogen fields may be changed on a copy to model another
 * protonation state of a site (microspecies) before substituents are read again.
 */
import { type JsonMolecule } from "./rdkit-json";

export interface PKaAtom {
  z: number;
  chg: number;
  hs: number;
  aromatic: boolean;
}

export interface PKaGraph {
  atoms: PKaAtom[];
  /** Neighbour lists: [atom, Kekulé bond order, aromatic bond]. */
  nbrs: { atom: number; order: number; aromatic: boolean }[][];
  rings: number[][];
}

export function graphOf(m: JsonMolecule): PKaGraph {
  const hNeighbours = new Array<number>(m.atoms.length).fill(0);
  const nbrs: PKaGraph["nbrs"] = m.atoms.map(() => []);
  m.bonds.forEach((bond, index) => {
    const [a, b] = bond.atoms;
    const aromatic = m.aromaticBonds.has(index);
    if (m.atoms[a]?.z === 1) hNeighbours[b] = (hNeighbours[b] ?? 0) + 1;
    if (m.atoms[b]?.z === 1) hNeighbours[a] = (hNeighbours[a] ?? 0) + 1;
    nbrs[a]?.push({ atom: b, order: bond.bo, aromatic });
    nbrs[b]?.push({ atom: a, order: bond.bo, aromatic });
  });
  return {
    atoms: m.atoms.map((a, i) => ({ z: a.z, chg: a.chg, hs: a.impHs + (hNeighbours[i] ?? 0), aromatic: m.aromaticAtoms.has(i) })),
    nbrs,
    rings: m.atomRings,
  };
}

/** A copy whose atoms can be re-protonated without touching the original. */
export function withAtoms(g: PKaGraph): PKaGraph {
  return { ...g, atoms: g.atoms.map((a) => ({ ...a })) };
}

export const z = (g: PKaGraph, a: number): number => g.atoms[a]?.z ?? 0;
export const heavy = (g: PKaGraph, a: number): { atom: number; order: number; aromatic: boolean }[] =>
  (g.nbrs[a] ?? []).filter((n) => z(g, n.atom) !== 1);
export const others = (g: PKaGraph, a: number, not: number) => heavy(g, a).filter((n) => n.atom !== not);
export const isAromatic = (g: PKaGraph, a: number): boolean => g.atoms[a]?.aromatic ?? false;

/** Double-bonded O or S neighbour (C=O, S=O, P=O, N-oxide written as N=O). */
export function doubleO(g: PKaGraph, a: number): number {
  return heavy(g, a).filter((n) => z(g, n.atom) === 8 && (n.order === 2 || (g.atoms[n.atom]?.chg === -1 && heavy(g, n.atom).length === 1 && z(g, a) === 7))).length;
}

/** Smallest aromatic ring (5 or 6 members) holding atom a. */
export function aromaticRingOf(g: PKaGraph, a: number): number[] | undefined {
  return g.rings
    .filter((r) => r.includes(a) && r.every((x) => isAromatic(g, x)) && (r.length === 5 || r.length === 6))
    .sort((x, y) => y.length - x.length)[0];
}

/** Bonds between two ring positions going round the ring the short way. */
export function ringDistance(ring: number[], a: number, b: number): number {
  const i = ring.indexOf(a);
  const j = ring.indexOf(b);
  const d = Math.abs(i - j);
  return Math.min(d, ring.length - d);
}
