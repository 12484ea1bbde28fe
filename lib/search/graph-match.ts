/**
 * Substructure matching on the compact search graphs (lib/chem/structure/search-graph.ts): depth-first extension of
 * a partial atom mapping in a fixed query order, each query atom after a component's first reached through a bond
 * from an already-mapped atom (Ullmann, J. ACM 1976, 23, 31, with VF2-style neighbour candidates). Query tests are
 * plain node objects evaluated by one switch, and each matcher reuses its buffers, so a match allocates nothing.
 */
import {
  ATOM_BYTES, ATOM_CHARGE, ATOM_DEGREE, ATOM_FLAGS, ATOM_IMPLICIT_HS, ATOM_MIN_RING, ATOM_NEIGHBOUR_START, ATOM_RING_BONDS,
  ATOM_RING_COUNT, ATOM_RING_SIZES, ATOM_TOTAL_HS, ATOM_Z, BOND_AROMATIC, BOND_FLAG_RING, FLAG_AROMATIC, FLAG_RADICAL,
  HEADER_BYTES, NEIGHBOUR_BYTES, graphIsotope,
} from "@/lib/chem/structure/search-graph";

/** Test kinds as small integers, so evaluation is one switch on a number. */
export const Test = {
  True: 0, And: 1, Or: 2, AtomicNum: 3, AtomType: 4, Aromatic: 5, Aliphatic: 6, HCount: 7, Degree: 8, TotalDegree: 9,
  Charge: 10, Isotope: 11, InAnyRing: 12, RingCount: 13, MinRingSize: 14, RingBondCount: 15, RingSize: 16, Recursive: 17,
  MoleculeAtom: 18, BondOrder: 19, SingleOrAromatic: 20, DoubleOrAromatic: 21, SingleOrDouble: 22, BondInRing: 23,
} as const;
export type Test = (typeof Test)[keyof typeof Test];

/** One query test; a single object shape for every kind keeps evaluation monomorphic. */
export interface QueryNode {
  test: Test;
  val: number;
  negated: boolean;
  children: QueryNode[];
  /** Recursive SMARTS: matcher anchored at its atom 0. */
  sub: GraphMatcher | null;
  /** Molecule-as-query atom: ring count, charge, isotope, radical electrons (0 = unset). */
  rings: number;
  charge: number;
  isotope: number;
  radicals: number;
}

export function node(test: Test, val = 0, negated = false, children: QueryNode[] = [], sub: GraphMatcher | null = null): QueryNode {
  return { test, val, negated, children, sub, rings: 0, charge: 0, isotope: 0, radicals: 0 };
}

export interface QueryPlan {
  atomCount: number;
  /** Query atoms in matching order. */
  order: number[];
  atoms: QueryNode[];
  /** Per order position: the earlier query atom it hangs from (-1 starts a component) and that bond's test. */
  parent: number[];
  parentBond: (QueryNode | null)[];
  /** Per order position: ring-closing bonds to earlier query atoms other than the parent. */
  closures: { other: number; bond: QueryNode }[][];
}

const u16 = (g: Uint8Array, at: number) => (g[at] ?? 0) | ((g[at + 1] ?? 0) << 8);

function evalAtom(n: QueryNode, g: Uint8Array, at: number, atom: number): boolean {
  let r: boolean;
  switch (n.test) {
    case Test.True: r = true; break;
    case Test.And: r = n.children.every((c) => evalAtom(c, g, at, atom)); break;
    case Test.Or: r = n.children.some((c) => evalAtom(c, g, at, atom)); break;
    case Test.AtomicNum: r = g[at + ATOM_Z] === n.val; break;
    case Test.AtomType: r = (g[at + ATOM_Z] ?? 0) + ((g[at + ATOM_FLAGS] ?? 0) & FLAG_AROMATIC ? 1000 : 0) === n.val; break;
    case Test.Aromatic: r = ((g[at + ATOM_FLAGS] ?? 0) & FLAG_AROMATIC ? 1 : 0) === n.val; break;
    case Test.Aliphatic: r = ((g[at + ATOM_FLAGS] ?? 0) & FLAG_AROMATIC ? 0 : 1) === n.val; break;
    case Test.HCount: r = g[at + ATOM_TOTAL_HS] === n.val; break;
    case Test.Degree: r = g[at + ATOM_DEGREE] === n.val; break;
    case Test.TotalDegree: r = (g[at + ATOM_DEGREE] ?? 0) + (g[at + ATOM_IMPLICIT_HS] ?? 0) === n.val; break;
    case Test.Charge: r = ((g[at + ATOM_CHARGE] ?? 0) << 24) >> 24 === n.val; break;
    case Test.Isotope: r = graphIsotope(g, atom) === n.val; break;
    case Test.InAnyRing: r = (g[at + ATOM_RING_COUNT] ?? 0) > 0; break;
    case Test.RingCount: r = g[at + ATOM_RING_COUNT] === n.val; break;
    case Test.MinRingSize: r = g[at + ATOM_MIN_RING] === n.val; break;
    case Test.RingBondCount: r = g[at + ATOM_RING_BONDS] === n.val; break;
    case Test.RingSize: r = ((g[at + ATOM_RING_SIZES] ?? 0) & (1 << (n.val - 3))) !== 0; break;
    case Test.Recursive: r = n.sub?.matchesAt(g, atom) ?? false; break;
    case Test.MoleculeAtom:
      r = g[at + ATOM_Z] === n.val &&
        (g[at + ATOM_RING_COUNT] ?? 0) >= n.rings &&
        (n.charge === 0 || ((g[at + ATOM_CHARGE] ?? 0) << 24) >> 24 === n.charge) &&
        (n.isotope === 0 || graphIsotope(g, atom) === n.isotope) &&
        (n.radicals === 0 || ((g[at + ATOM_FLAGS] ?? 0) & FLAG_RADICAL) !== 0);
      break;
    default: r = false;
  }
  return n.negated ? !r : r;
}

function evalBond(n: QueryNode, code: number, flags: number): boolean {
  let r: boolean;
  switch (n.test) {
    case Test.True: r = true; break;
    case Test.And: r = n.children.every((c) => evalBond(c, code, flags)); break;
    case Test.Or: r = n.children.some((c) => evalBond(c, code, flags)); break;
    case Test.BondOrder: r = code === n.val; break;
    case Test.SingleOrAromatic: r = code === 1 || code === BOND_AROMATIC; break;
    case Test.DoubleOrAromatic: r = code === 2 || code === BOND_AROMATIC; break;
    case Test.SingleOrDouble: r = code === 1 || code === 2; break;
    case Test.BondInRing: r = ((flags & BOND_FLAG_RING) !== 0 ? 1 : 0) === n.val; break;
    default: r = false;
  }
  return n.negated ? !r : r;
}

export class GraphMatcher {
  private mapping: Int32Array;
  private mapped: Int32Array;
  private cursor: Int32Array;
  private used = new Uint8Array(64);
  /** Recursive-SMARTS results for the last graph seen: 0 unknown, 1 match, 2 no match. */
  private memoGraph: Uint8Array | null = null;
  private memo = new Uint8Array(64);

  constructor(readonly plan: QueryPlan) {
    this.mapping = new Int32Array(plan.atomCount).fill(-1);
    this.mapped = new Int32Array(plan.atomCount).fill(-1);
    this.cursor = new Int32Array(plan.atomCount);
  }

  /** True when the query maps into graph `g`. */
  matches(g: Uint8Array): boolean {
    return this.run(g, -1);
  }

  /** True when the query maps with its first atom on `atom` (recursive SMARTS); memoized per graph. */
  matchesAt(g: Uint8Array, atom: number): boolean {
    if (this.memoGraph !== g) {
      const n = u16(g, 1);
      if (this.memo.length < n) this.memo = new Uint8Array(n * 2);
      else this.memo.fill(0, 0, n);
      this.memoGraph = g;
    }
    const known = this.memo[atom] ?? 0;
    if (known) return known === 1;
    const r = this.run(g, atom);
    this.memo[atom] = r ? 1 : 2;
    return r;
  }

  private run(g: Uint8Array, anchor: number): boolean {
    const { plan, mapping, mapped, cursor } = this;
    const n = u16(g, 1);
    const qn = plan.atomCount;
    if (n < qn) return false;
    if (this.used.length < n) this.used = new Uint8Array(n * 2);
    const used = this.used;
    const entries = HEADER_BYTES + n * ATOM_BYTES;
    let pos = 0;
    cursor[0] = -1;
    mapped[0] = -1;
    for (;;) {
      if (pos === qn) {
        for (let i = 0; i < qn; i++) {
          used[mapped[i] ?? 0] = 0;
          mapping[plan.order[i] ?? 0] = -1;
        }
        return true;
      }
      const qa = plan.order[pos] ?? 0;
      const prev = mapped[pos] ?? -1;
      if (prev >= 0) {
        used[prev] = 0;
        mapping[qa] = -1;
        mapped[pos] = -1;
      }
      const t = this.next(g, pos, n, entries, anchor);
      if (t < 0) {
        if (pos === 0) return false;
        pos -= 1;
        continue;
      }
      if (used[t] || !evalAtom(plan.atoms[qa] as QueryNode, g, HEADER_BYTES + t * ATOM_BYTES, t) || !this.closuresHold(g, pos, t, entries)) continue;
      used[t] = 1;
      mapping[qa] = t;
      mapped[pos] = t;
      pos += 1;
      if (pos < qn) {
        cursor[pos] = -1;
        mapped[pos] = -1;
      }
    }
  }

  /** Next candidate target atom for order position `pos`, or -1; advances the position's cursor. */
  private next(g: Uint8Array, pos: number, n: number, entries: number, anchor: number): number {
    const { plan, cursor, mapping } = this;
    const p = plan.parent[pos] ?? -1;
    let k = (cursor[pos] ?? -1) + 1;
    if (p < 0) {
      if (pos === 0 && anchor >= 0) {
        cursor[pos] = k;
        return k === 0 ? anchor : -1;
      }
      cursor[pos] = k;
      return k < n ? k : -1;
    }
    const from = HEADER_BYTES + (mapping[p] ?? 0) * ATOM_BYTES;
    const start = u16(g, from + ATOM_NEIGHBOUR_START);
    const degree = g[from + ATOM_DEGREE] ?? 0;
    const bond = plan.parentBond[pos] ?? null;
    for (; k < degree; k++) {
      const e = entries + (start + k) * NEIGHBOUR_BYTES;
      if (bond && !evalBond(bond, g[e + 2] ?? 0, g[e + 3] ?? 0)) continue;
      cursor[pos] = k;
      return u16(g, e);
    }
    cursor[pos] = degree;
    return -1;
  }

  private closuresHold(g: Uint8Array, pos: number, t: number, entries: number): boolean {
    const closures = this.plan.closures[pos];
    if (!closures || closures.length === 0) return true;
    const at = HEADER_BYTES + t * ATOM_BYTES;
    const start = u16(g, at + ATOM_NEIGHBOUR_START);
    const degree = g[at + ATOM_DEGREE] ?? 0;
    for (const { other, bond } of closures) {
      const target = this.mapping[other] ?? -1;
      let found = false;
      for (let k = 0; k < degree; k++) {
        const e = entries + (start + k) * NEIGHBOUR_BYTES;
        if (u16(g, e) === target) {
          found = evalBond(bond, g[e + 2] ?? 0, g[e + 3] ?? 0);
          break;
        }
      }
      if (!found) return false;
    }
    return true;
  }
}
