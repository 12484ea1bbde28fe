/**
 * Screening fingerprints for substructure search, computed from the compact graph (no RDKit needed). A target sets
 * hashed bits for counted features: atom labels, bonds, two-bond paths, ring atoms; each with "at least t" bits for
 * count thresholds t, in exact form (element + aromaticity, bond order) and relaxed form (element only, any bond).
 *
 * A query sets only bits for features every match must have: it derives them from what its tests make certain
 * (an aromatic-carbon test fixes element and aromaticity, an element test fixes only the element, a
 * single-or-aromatic bond fixes nothing about the order, an atom on a query ring must sit on a target ring). Because
 * the atom mapping is injective, a query's feature count never exceeds the target's, so a true hit always passes the
 * screen; hash collisions only let extra candidates through to the exact matcher. This replaces RDKit's pattern
 * fingerprint, whose query form was found to drop true hits for some SMARTS (e.g. [R0;O]).
 */
import {
  ATOM_BYTES, ATOM_DEGREE, ATOM_FLAGS, ATOM_NEIGHBOUR_START, ATOM_RING_COUNT, ATOM_Z, BOND_FLAG_RING, FLAG_AROMATIC,
  HEADER_BYTES, NEIGHBOUR_BYTES,
} from "@/lib/chem/structure/search-graph";
import { type QueryNode, type QueryPlan, Test } from "./graph-match";

const BITS = 2048;
const ATOM_THRESHOLDS = [1, 2, 3, 4, 6, 8, 12, 16, 24];
const BOND_THRESHOLDS = [1, 2, 3, 4, 6, 8, 12];
const PATH_THRESHOLDS = [1, 2, 4, 8];
const ANY = 0xff;
/** Atom label: element × 2 + aromatic, or element × 2 + 512 when only the element is known. */
const elementOnly = (z: number) => z * 2 + 512;

/** Kinds of feature, mixed into the hash so different kinds never share a bit by construction. */
const ATOM = 1;
const RING_ATOM = 2;
const BOND = 3;
const RING_BOND = 4;
const PATH = 5;
const THRESHOLDS: Record<number, number[]> = { [ATOM]: ATOM_THRESHOLDS, [RING_ATOM]: ATOM_THRESHOLDS, [BOND]: BOND_THRESHOLDS, [RING_BOND]: BOND_THRESHOLDS, [PATH]: PATH_THRESHOLDS };

/** FNV-1a-style mixing of whole integers (Fowler, Noll & Vo); any collision only adds screen candidates. */
const mix = (h: number, v: number) => Math.imul(h ^ v, 0x01000193) >>> 0;
const SEED = 0x811c9dc5;

/**
 * Counts of feature keys in a reusable open-addressing table. Two features whose keys collide are counted together;
 * that only raises counts on both sides (the query's merged count never exceeds the target's), so it stays safe.
 */
class Counter {
  private keys = new Uint32Array(4096);
  private counts = new Uint16Array(4096);
  private kinds = new Uint8Array(4096);
  private readonly slots: number[] = [];

  reset(expected: number): void {
    for (const i of this.slots) this.counts[i] = 0;
    this.slots.length = 0;
    if (this.keys.length < expected * 2) {
      let size = this.keys.length;
      while (size < expected * 2) size *= 2;
      this.keys = new Uint32Array(size);
      this.counts = new Uint16Array(size);
      this.kinds = new Uint8Array(size);
    }
  }

  add(kind: number, key: number): void {
    const mask = this.keys.length - 1;
    let i = Math.imul(key, 0x9e3779b1) >>> 0 & mask;
    for (;;) {
      const c = this.counts[i] ?? 0;
      if (c === 0) {
        this.keys[i] = key;
        this.kinds[i] = kind;
        this.counts[i] = 1;
        this.slots.push(i);
        return;
      }
      if (this.keys[i] === key) {
        this.counts[i] = c + 1;
        return;
      }
      i = (i + 1) & mask;
    }
  }

  /** Targets set every threshold up to their count; queries only the largest threshold their count reaches. */
  toFingerprint(asQuery: boolean): Uint8Array {
    const fp = new Uint8Array(BITS / 8);
    for (const i of this.slots) {
      const n = this.counts[i] ?? 0;
      const key = this.keys[i] ?? 0;
      const thresholds = THRESHOLDS[this.kinds[i] ?? 0] ?? ATOM_THRESHOLDS;
      let last = -1;
      for (const t of thresholds) {
        if (t > n) break;
        if (!asQuery) setBit(fp, mix(key, t) % BITS);
        last = t;
      }
      if (asQuery && last > 0) setBit(fp, mix(key, last) % BITS);
    }
    return fp;
  }
}

function setBit(fp: Uint8Array, bit: number): void {
  fp[bit >> 3] = (fp[bit >> 3] ?? 0) | (1 << (bit & 7));
}

const counter = new Counter();

const atomKey = (kind: number, label: number) => mix(mix(SEED, kind), label);

function addBond(f: Counter, la: number, code: number, lb: number, ring: boolean): void {
  const key = la <= lb ? mix(mix(mix(SEED, la), code), lb) : mix(mix(mix(SEED, lb), code), la);
  f.add(BOND, mix(key, BOND));
  if (ring) f.add(RING_BOND, mix(key, RING_BOND));
}

/** A two-bond path l1–c1–l2–c2–l3, read from whichever end makes (l, c) smaller, so both directions agree. */
function addPath(f: Counter, l1: number, c1: number, l2: number, c2: number, l3: number): void {
  const key = l1 < l3 || (l1 === l3 && c1 <= c2)
    ? mix(mix(mix(mix(mix(mix(SEED, PATH), l1), c1), l2), c2), l3)
    : mix(mix(mix(mix(mix(mix(SEED, PATH), l3), c2), l2), c1), l1);
  f.add(PATH, key);
}

/** Screening fingerprint of a target molecule from its compact graph. */
export function targetScreen(g: Uint8Array): Uint8Array {
  const n = (g[1] ?? 0) | ((g[2] ?? 0) << 8);
  const entries = HEADER_BYTES + n * ATOM_BYTES;
  const exact = new Int32Array(n);
  const loose = new Int32Array(n);
  counter.reset(24 * n + 64);
  const f = counter;
  for (let i = 0; i < n; i++) {
    const at = HEADER_BYTES + i * ATOM_BYTES;
    const z = g[at + ATOM_Z] ?? 0;
    exact[i] = z * 2 + ((g[at + ATOM_FLAGS] ?? 0) & FLAG_AROMATIC ? 1 : 0);
    loose[i] = elementOnly(z);
    const ring = (g[at + ATOM_RING_COUNT] ?? 0) > 0;
    f.add(ATOM, atomKey(ATOM, exact[i] ?? 0));
    f.add(ATOM, atomKey(ATOM, loose[i] ?? 0));
    if (ring) {
      f.add(RING_ATOM, atomKey(RING_ATOM, exact[i] ?? 0));
      f.add(RING_ATOM, atomKey(RING_ATOM, loose[i] ?? 0));
    }
  }
  for (let i = 0; i < n; i++) {
    const at = HEADER_BYTES + i * ATOM_BYTES;
    const start = (g[at + ATOM_NEIGHBOUR_START] ?? 0) | ((g[at + ATOM_NEIGHBOUR_START + 1] ?? 0) << 8);
    const degree = g[at + ATOM_DEGREE] ?? 0;
    for (let x = 0; x < degree; x++) {
      const ex = entries + (start + x) * NEIGHBOUR_BYTES;
      const nx = (g[ex] ?? 0) | ((g[ex + 1] ?? 0) << 8);
      const cx = g[ex + 2] ?? 0;
      if (nx > i) {
        const ring = ((g[ex + 3] ?? 0) & BOND_FLAG_RING) !== 0;
        addBond(f, exact[i] ?? 0, cx, exact[nx] ?? 0, ring);
        addBond(f, exact[i] ?? 0, ANY, exact[nx] ?? 0, ring);
        addBond(f, loose[i] ?? 0, cx, loose[nx] ?? 0, ring);
        addBond(f, loose[i] ?? 0, ANY, loose[nx] ?? 0, ring);
      }
      for (let y = x + 1; y < degree; y++) {
        const ey = entries + (start + y) * NEIGHBOUR_BYTES;
        const ny = (g[ey] ?? 0) | ((g[ey + 1] ?? 0) << 8);
        const cy = g[ey + 2] ?? 0;
        addPath(f, exact[nx] ?? 0, cx, exact[i] ?? 0, cy, exact[ny] ?? 0);
        addPath(f, exact[nx] ?? 0, ANY, exact[i] ?? 0, ANY, exact[ny] ?? 0);
        addPath(f, loose[nx] ?? 0, cx, loose[i] ?? 0, cy, loose[ny] ?? 0);
        addPath(f, loose[nx] ?? 0, ANY, loose[i] ?? 0, ANY, loose[ny] ?? 0);
      }
    }
  }
  return f.toFingerprint(false);
}

/** What a query atom's test makes certain: element (or -1) and aromaticity (or -1). */
function atomCertainty(node: QueryNode): { z: number; aromatic: number } {
  if (node.negated) return { z: -1, aromatic: -1 };
  switch (node.test) {
    case Test.AtomType: return { z: node.val % 1000, aromatic: node.val >= 1000 ? 1 : 0 };
    case Test.AtomicNum: return { z: node.val, aromatic: -1 };
    case Test.MoleculeAtom: return { z: node.val, aromatic: -1 };
    case Test.Aromatic: return { z: -1, aromatic: node.val ? 1 : 0 };
    case Test.Aliphatic: return { z: -1, aromatic: node.val ? 0 : 1 };
    case Test.And: {
      let z = -1;
      let aromatic = -1;
      for (const c of node.children) {
        const k = atomCertainty(c);
        if (k.z >= 0) z = k.z;
        if (k.aromatic >= 0) aromatic = k.aromatic;
      }
      return { z, aromatic };
    }
    default: return { z: -1, aromatic: -1 };
  }
}

/** A bond test's certain order code (1–4, 12), or ANY. */
function bondCertainty(node: QueryNode | null): number {
  if (!node || node.negated) return ANY;
  if (node.test === Test.BondOrder) return node.val;
  if (node.test === Test.And) for (const c of node.children) if (bondCertainty(c) !== ANY) return bondCertainty(c);
  return ANY;
}

/** Screening fingerprint of a compiled query: only features every match must have. */
export function queryScreen(plan: QueryPlan): Uint8Array {
  const n = plan.atomCount;
  const bonds: { a: number; b: number; code: number }[] = [];
  plan.order.forEach((atom, pos) => {
    const parent = plan.parent[pos] ?? -1;
    if (parent >= 0) bonds.push({ a: parent, b: atom, code: bondCertainty(plan.parentBond[pos] ?? null) });
    for (const c of plan.closures[pos] ?? []) bonds.push({ a: c.other, b: atom, code: bondCertainty(c.bond) });
  });
  const certain = Array.from({ length: n }, (_, i) => atomCertainty(plan.atoms[i] as QueryNode));
  // An aromatic bond joins aromatic atoms only (RDKit aromaticity), which pins the atoms' aromaticity too.
  for (const { a, b, code } of bonds) {
    if (code !== 12) continue;
    for (const x of [a, b]) if (certain[x]) certain[x] = { z: certain[x]?.z ?? -1, aromatic: 1 };
  }
  const exact = (i: number) => (certain[i] && certain[i].z >= 0 && certain[i].aromatic >= 0 ? certain[i].z * 2 + certain[i].aromatic : -1);
  const loose = (i: number) => (certain[i] && certain[i].z >= 0 ? elementOnly(certain[i].z) : -1);
  const inCycle = cycleMembership(bonds);
  const f = counter;
  f.reset(24 * n + 64);
  for (let i = 0; i < n; i++) {
    for (const l of [exact(i), loose(i)]) {
      if (l < 0) continue;
      f.add(ATOM, atomKey(ATOM, l));
      if (inCycle.atoms.has(i)) f.add(RING_ATOM, atomKey(RING_ATOM, l));
    }
  }
  bonds.forEach(({ a, b, code }, k) => {
    const label = exact(a) >= 0 && exact(b) >= 0 ? [exact(a), exact(b)] : loose(a) >= 0 && loose(b) >= 0 ? [loose(a), loose(b)] : undefined;
    if (label) addBond(f, label[0] ?? 0, code, label[1] ?? 0, inCycle.bonds.has(k));
  });
  for (let centre = 0; centre < n; centre++) {
    const touching = bonds.filter((x) => x.a === centre || x.b === centre);
    for (let p = 0; p < touching.length; p++) {
      for (let q = p + 1; q < touching.length; q++) {
        const x = touching[p];
        const y = touching[q];
        if (!x || !y) continue;
        const ends = [x.a === centre ? x.b : x.a, y.a === centre ? y.b : y.a] as const;
        const all = [ends[0], centre, ends[1]];
        const labels = all.every((i) => exact(i) >= 0) ? all.map(exact) : all.every((i) => loose(i) >= 0) ? all.map(loose) : undefined;
        if (!labels) continue;
        const codes = x.code !== ANY && y.code !== ANY ? [x.code, y.code] : [ANY, ANY];
        addPath(f, labels[0] ?? 0, codes[0] ?? ANY, labels[1] ?? 0, codes[1] ?? ANY, labels[2] ?? 0);
      }
    }
  }
  return f.toFingerprint(true);
}

/** Atoms and bonds (by index in `bonds`) that lie on a cycle of the query graph: exactly the non-bridge bonds. */
function cycleMembership(bonds: { a: number; b: number }[]): { atoms: Set<number>; bonds: Set<number> } {
  const atoms = new Set<number>();
  const onCycle = new Set<number>();
  bonds.forEach((bond, k) => {
    // A bond lies on a cycle when its ends stay connected without it.
    const seen = new Set<number>([bond.a]);
    const stack = [bond.a];
    while (stack.length) {
      const x = stack.pop() as number;
      bonds.forEach((other, j) => {
        if (j === k) return;
        const y = other.a === x ? other.b : other.b === x ? other.a : -1;
        if (y >= 0 && !seen.has(y)) {
          seen.add(y);
          stack.push(y);
        }
      });
    }
    if (seen.has(bond.b)) {
      onCycle.add(k);
      atoms.add(bond.a).add(bond.b);
    }
  });
  return { atoms, bonds: onCycle };
}
