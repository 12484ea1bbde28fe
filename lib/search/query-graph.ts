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

/**
 * Relaxed compilation replaces a test the matcher cannot evaluate by "true", which only widens the set of matches
 * (and/or are monotone) unless a negation sits above it; there the whole atom or bond test becomes "true".
 */
interface Mode {
  relax: boolean;
  negatedAbove: boolean;
}
class RelaxWhole extends Error {}

function unsupported(mode: Mode, negated: boolean, what: string): QueryNode {
  if (!mode.relax) throw new UnsupportedQuery(what);
  if (mode.negatedAbove || negated) throw new RelaxWhole(what);
  return node(Test.True);
}

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

function atomNode(q: JsonQueryNode, mode: Mode): QueryNode {
  const negated = q.negated === true;
  if (Object.keys(q).some((k) => !KNOWN_KEYS.has(k))) return unsupported(mode, negated, `query fields of ${q.descr}`);
  const val = q.val ?? 0;
  const inner: Mode = { relax: mode.relax, negatedAbove: mode.negatedAbove || negated };
  if (q.descr === "AtomAnd" || q.descr === "AtomOr") {
    const children = (q.children ?? []).map((c) => atomNode(c, inner));
    if (children.length === 0) return unsupported(mode, negated, "empty atom and/or");
    return node(q.descr === "AtomAnd" ? Test.And : Test.Or, 0, negated, children);
  }
  if (q.descr === "RecursiveStructure") {
    if (typeof q.subquery !== "object" || q.subquery === null) return unsupported(mode, negated, "recursion without subquery");
    const subMolecule = parseMolecule(q.subquery as Record<string, unknown>);
    let plan: QueryPlan;
    try {
      plan = compileQueryPlan(subMolecule, 0);
    } catch (error) {
      if (!(error instanceof UnsupportedQuery)) throw error;
      if (!mode.relax) throw error;
      if (inner.negatedAbove) throw new RelaxWhole(error.message);
      plan = compileQueryPlan(subMolecule, 0, true);
    }
    return node(Test.Recursive, 0, negated, [], new GraphMatcher(plan));
  }
  if (q.descr === "AtomInNRings") return node(val < 0 ? Test.InAnyRing : Test.RingCount, val, negated);
  if (q.descr === "AtomRingSize") {
    if (val < 3 || val > 10) return unsupported(mode, negated, `ring size ${val}`);
    return node(Test.RingSize, val, negated);
  }
  const test = ATOM_LEAVES[q.descr];
  if (test === undefined) return unsupported(mode, negated, q.descr);
  return node(test, val, negated);
}

function bondNode(q: JsonQueryNode, mode: Mode): QueryNode {
  const negated = q.negated === true;
  if (Object.keys(q).some((k) => !KNOWN_KEYS.has(k))) return unsupported(mode, negated, `query fields of ${q.descr}`);
  const inner: Mode = { relax: mode.relax, negatedAbove: mode.negatedAbove || negated };
  if (q.descr === "BondAnd" || q.descr === "BondOr") {
    const children = (q.children ?? []).map((c) => bondNode(c, inner));
    if (children.length === 0) return unsupported(mode, negated, "empty bond and/or");
    return node(q.descr === "BondAnd" ? Test.And : Test.Or, 0, negated, children);
  }
  const test = BOND_LEAVES[q.descr];
  if (test === undefined) return unsupported(mode, negated, q.descr);
  return node(test, q.val ?? 0, negated);
}

/** The whole test of one atom or bond, relaxed to "true" when an unsupported part sits under a negation. */
function whole(build: (mode: Mode) => QueryNode, relax: boolean): QueryNode {
  try {
    return build({ relax, negatedAbove: false });
  } catch (error) {
    if (error instanceof RelaxWhole) return node(Test.True);
    throw error;
  }
}

/** RDKit Atom::Match for a plain (non-query) atom. */
function moleculeAtomNode(m: JsonMolecule, index: number, relax: boolean): QueryNode {
  const a = m.atoms[index];
  if (!a || a.z === 0 || a.nRad > 1) {
    if (relax) return node(Test.True);
    throw new UnsupportedQuery(a?.z === 0 ? "dummy atom in a molecule query" : "radical count");
  }
  const n = node(Test.MoleculeAtom, a.z);
  n.rings = Math.min(255, m.atomRings.filter((r) => r.includes(index)).length);
  n.charge = a.chg;
  n.isotope = a.isotope;
  n.radicals = a.nRad;
  return n;
}

function moleculeBondNode(m: JsonMolecule, index: number, relax: boolean): QueryNode {
  const bond = m.bonds[index];
  const code = m.aromaticBonds.has(index) ? BOND_AROMATIC : bond && bond.bo >= 1 && bond.bo <= 4 ? bond.bo : undefined;
  if (code === undefined) {
    if (relax) return node(Test.True);
    throw new UnsupportedQuery("unusual bond type in a molecule query");
  }
  return node(Test.BondOrder, code);
}

/**
 * Builds the matching plan; `root` forces the first atom (recursive SMARTS anchor at atom 0). With `relax`, tests
 * the matcher cannot evaluate are widened (see Mode), giving a plan whose matches include all true matches.
 */
export function compileQueryPlan(m: JsonMolecule, root?: number, relax = false): QueryPlan {
  const n = m.atoms.length;
  if (n === 0) throw new UnsupportedQuery("empty query");
  const queryMode = m.atomQueries !== undefined;
  if (queryMode && (m.atomQueries?.length !== n || m.bondQueries?.length !== m.bonds.length)) {
    // Some atoms or bonds carry queries and some do not (a MOL block with query features): nothing certain.
    if (!relax) throw new UnsupportedQuery("partial query");
    return compileQueryPlan({ ...m, atomQueries: m.atoms.map(() => ({ descr: "AtomNull" })), bondQueries: m.bonds.map(() => ({ descr: "BondNull" })) }, root);
  }
  const atoms = m.atoms.map((_, i) => (queryMode ? whole((mode) => atomNode(m.atomQueries?.[i] as JsonQueryNode, mode), relax) : moleculeAtomNode(m, i, relax)));
  const bonds = m.bonds.map((_, i) => (queryMode ? whole((mode) => bondNode(m.bondQueries?.[i] as JsonQueryNode, mode), relax) : moleculeBondNode(m, i, relax)));
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
