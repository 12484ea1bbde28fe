/**
 * Compiles an RDKit query molecule (its JSON form) into a matching plan on the compact graph, reproducing RDKit's
 * rules: for SMARTS, the query tree RDKit built (atomic number, aromatic type, H count, degree, ring membership,
 * charge, isotope, recursion, and/or/not); for a molecule used as a query, RDKit's Atom::Match and Bond::Match
 * (same element; charge, isotope and radicals only when the query sets them; an atom in more rings than the target
 * atom does not match; same bond type). Anything else raises UnsupportedQuery and the caller lets RDKit decide.
 */
import { type JsonMolecule, type JsonQueryNode, parseMolecule } from "@/lib/chem/structure/rdkit-json";
import { BOND_AROMATIC } from "@/lib/chem/structure/search-graph";
import { GraphMatcher, type QueryNode, type QueryPlan, Test, node } from "./graph-match";

export class UnsupportedQuery extends Error {}

const KNOWN_KEYS = new Set(["descr", "tag", "val", "negated", "children", "subquery", "type"]);

const ATOM_LEAVES: Record<string, Test> = {
  AtomAtomicNum: Test.AtomicNum, AtomType: Test.AtomType, AtomIsAromatic: Test.Aromatic, AtomIsAliphatic: Test.Aliphatic,
  AtomHCount: Test.HCount, AtomExplicitDegree: Test.Degree, AtomTotalDegree: Test.TotalDegree, AtomFormalCharge: Test.Charge,
  AtomIsotope: Test.Isotope, AtomNull: Test.True, AtomMinRingSize: Test.MinRingSize, AtomRingBondCount: Test.RingBondCount,
};

const BOND_LEAVES: Record<string, Test> = {
  BondOrder: Test.BondOrder, SingleOrAromaticBond: Test.SingleOrAromatic, DoubleOrAromaticBond: Test.DoubleOrAromatic,
  SingleOrDoubleBond: Test.SingleOrDouble, BondNull: Test.True, BondInRing: Test.BondInRing,
};

function checkKeys(q: JsonQueryNode): void {
  if (Object.keys(q).some((k) => !KNOWN_KEYS.has(k))) throw new UnsupportedQuery(`query fields of ${q.descr}`);
}

function atomNode(q: JsonQueryNode): QueryNode {
  checkKeys(q);
  const negated = q.negated === true;
  const val = q.val ?? 0;
  if (q.descr === "AtomAnd" || q.descr === "AtomOr") {
    const children = (q.children ?? []).map(atomNode);
    if (children.length === 0) throw new UnsupportedQuery("empty atom and/or");
    return node(q.descr === "AtomAnd" ? Test.And : Test.Or, 0, negated, children);
  }
  if (q.descr === "RecursiveStructure") {
    if (typeof q.subquery !== "object" || q.subquery === null) throw new UnsupportedQuery("recursion without subquery");
    const sub = new GraphMatcher(compileQueryPlan(parseMolecule(q.subquery as Record<string, unknown>), 0));
    return node(Test.Recursive, 0, negated, [], sub);
  }
  if (q.descr === "AtomInNRings") return node(val < 0 ? Test.InAnyRing : Test.RingCount, val, negated);
  if (q.descr === "AtomRingSize") {
    if (val < 3 || val > 10) throw new UnsupportedQuery(`ring size ${val}`);
    return node(Test.RingSize, val, negated);
  }
  const test = ATOM_LEAVES[q.descr];
  if (test === undefined) throw new UnsupportedQuery(q.descr);
  return node(test, val, negated);
}

function bondNode(q: JsonQueryNode): QueryNode {
  checkKeys(q);
  const negated = q.negated === true;
  if (q.descr === "BondAnd" || q.descr === "BondOr") {
    const children = (q.children ?? []).map(bondNode);
    if (children.length === 0) throw new UnsupportedQuery("empty bond and/or");
    return node(q.descr === "BondAnd" ? Test.And : Test.Or, 0, negated, children);
  }
  const test = BOND_LEAVES[q.descr];
  if (test === undefined) throw new UnsupportedQuery(q.descr);
  return node(test, q.val ?? 0, negated);
}

/** RDKit Atom::Match for a plain (non-query) atom. */
function moleculeAtomNode(m: JsonMolecule, index: number): QueryNode {
  const a = m.atoms[index];
  if (!a || a.z === 0) throw new UnsupportedQuery("dummy atom in a molecule query");
  if (a.nRad > 1) throw new UnsupportedQuery("radical count");
  const n = node(Test.MoleculeAtom, a.z);
  n.rings = Math.min(255, m.atomRings.filter((r) => r.includes(index)).length);
  n.charge = a.chg;
  n.isotope = a.isotope;
  n.radicals = a.nRad;
  return n;
}

function moleculeBondNode(m: JsonMolecule, index: number): QueryNode {
  const bond = m.bonds[index];
  const code = m.aromaticBonds.has(index) ? BOND_AROMATIC : bond && bond.bo >= 1 && bond.bo <= 4 ? bond.bo : undefined;
  if (code === undefined) throw new UnsupportedQuery("unusual bond type in a molecule query");
  return node(Test.BondOrder, code);
}

/** Builds the matching plan; `root` forces the first atom (recursive SMARTS anchor at atom 0). */
export function compileQueryPlan(m: JsonMolecule, root?: number): QueryPlan {
  const n = m.atoms.length;
  if (n === 0) throw new UnsupportedQuery("empty query");
  const queryMode = m.atomQueries !== undefined;
  if (queryMode && (m.atomQueries?.length !== n || m.bondQueries?.length !== m.bonds.length)) throw new UnsupportedQuery("partial query");
  const atoms = m.atoms.map((_, i) => (queryMode ? atomNode(m.atomQueries?.[i] as JsonQueryNode) : moleculeAtomNode(m, i)));
  const bonds = m.bonds.map((_, i) => (queryMode ? bondNode(m.bondQueries?.[i] as JsonQueryNode) : moleculeBondNode(m, i)));
  const adjacency: { nbr: number; bond: number }[][] = m.atoms.map(() => []);
  m.bonds.forEach((b, i) => {
    adjacency[b.atoms[0]]?.push({ nbr: b.atoms[1], bond: i });
    adjacency[b.atoms[1]]?.push({ nbr: b.atoms[0], bond: i });
  });
  // Heteroatoms and busier atoms first: fewer candidates near the top of the search.
  const rank = (i: number) => ((m.atoms[i]?.z ?? 6) !== 6 ? 100 : 0) + (adjacency[i]?.length ?? 0);
  const plan: QueryPlan = { atomCount: n, order: [], atoms, parent: [], parentBond: [], closures: [] };
  const placed = new Set<number>();
  const seenBonds = new Set<number>();
  // Greedy order: always extend with the best-ranked atom bonded to the placed ones, so selective atoms are tried
  // early and interchangeable ones (a t-butyl's methyls) last.
  let frontier: { atom: number; from: number; bond: number }[] = [];
  while (plan.order.length < n) {
    if (frontier.length === 0) {
      const free = [...Array(n).keys()].filter((i) => !placed.has(i));
      const start = plan.order.length === 0 && root !== undefined ? root : (free.sort((x, y) => rank(y) - rank(x) || x - y)[0] ?? 0);
      frontier.push({ atom: start, from: -1, bond: -1 });
    }
    frontier.sort((x, y) => rank(y.atom) - rank(x.atom) || x.atom - y.atom);
    const { atom, from, bond } = frontier.shift() as { atom: number; from: number; bond: number };
    placed.add(atom);
    frontier = frontier.filter((f) => f.atom !== atom);
    plan.order.push(atom);
    plan.parent.push(from);
    plan.parentBond.push(bond >= 0 ? (bonds[bond] ?? null) : null);
    if (bond >= 0) seenBonds.add(bond);
    const ring: { other: number; bond: QueryNode }[] = [];
    for (const { nbr, bond: b } of adjacency[atom] ?? []) {
      if (placed.has(nbr)) {
        if (!seenBonds.has(b)) ring.push({ other: nbr, bond: bonds[b] as QueryNode });
        seenBonds.add(b);
      } else if (!frontier.some((f) => f.atom === nbr)) frontier.push({ atom: nbr, from: atom, bond: b });
    }
    plan.closures.push(ring);
  }
  return plan;
}
