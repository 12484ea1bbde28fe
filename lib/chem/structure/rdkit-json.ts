/**
 * Reader for RDKit's JSON molecule format (`mol.get_json()`, "rdkitjson" version 11+, a CommonChem dialect). Only
 * the fields Layerwise uses are typed; attribute defaults come from the document's own "defaults" block.
 */
export interface JsonAtom {
  z: number;
  /** Hydrogens not present as atoms (implicit plus explicit-H property). */
  impHs: number;
  chg: number;
  isotope: number;
  nRad: number;
}

export interface JsonBond {
  /** Kekulé bond order; aromatic bonds are listed separately. */
  bo: number;
  atoms: [number, number];
}

export interface JsonQueryNode {
  descr: string;
  tag?: number;
  val?: number;
  negated?: boolean;
  children?: JsonQueryNode[];
  subquery?: unknown;
  [key: string]: unknown;
}

export interface JsonMolecule {
  atoms: JsonAtom[];
  bonds: JsonBond[];
  aromaticAtoms: Set<number>;
  aromaticBonds: Set<number>;
  atomRings: number[][];
  atomQueries?: JsonQueryNode[];
  bondQueries?: JsonQueryNode[];
}

type Raw = Record<string, unknown>;
const isRecord = (v: unknown): v is Raw => typeof v === "object" && v !== null && !Array.isArray(v);
const num = (v: unknown, fallback: number): number => (typeof v === "number" ? v : fallback);
const numbers = (v: unknown): number[] => (Array.isArray(v) ? v.filter((x): x is number => typeof x === "number") : []);

export function parseRDKitJson(json: string): JsonMolecule {
  const doc: unknown = JSON.parse(json);
  if (!isRecord(doc) || !Array.isArray(doc.molecules) || !isRecord(doc.molecules[0])) throw new Error("RDKit JSON without a molecule");
  const defaults = isRecord(doc.defaults) ? doc.defaults : {};
  return parseMolecule(doc.molecules[0], isRecord(defaults.atom) ? defaults.atom : {}, isRecord(defaults.bond) ? defaults.bond : {});
}

/** Also used for recursive-SMARTS subqueries, which are embedded molecule objects sharing the outer defaults. */
export function parseMolecule(raw: Raw, atomDefaults: Raw = {}, bondDefaults: Raw = {}): JsonMolecule {
  const atoms = (Array.isArray(raw.atoms) ? raw.atoms : []).map((a: unknown): JsonAtom => {
    const r = isRecord(a) ? a : {};
    const d = (key: string, fallback: number) => num(r[key], num(atomDefaults[key], fallback));
    return { z: d("z", 6), impHs: d("impHs", 0), chg: d("chg", 0), isotope: d("isotope", 0), nRad: d("nRad", 0) };
  });
  const bonds = (Array.isArray(raw.bonds) ? raw.bonds : []).map((b: unknown): JsonBond => {
    const r = isRecord(b) ? b : {};
    const [x, y] = numbers(r.atoms);
    return { bo: num(r.bo, num(bondDefaults.bo, 1)), atoms: [x ?? 0, y ?? 0] };
  });
  const extensions = Array.isArray(raw.extensions) ? raw.extensions.filter(isRecord) : [];
  const representation = extensions.find((e) => e.name === "rdkitRepresentation") ?? {};
  const queries = extensions.find((e) => e.name === "rdkitQueries");
  const molecule: JsonMolecule = {
    atoms,
    bonds,
    aromaticAtoms: new Set(numbers(representation.aromaticAtoms)),
    aromaticBonds: new Set(numbers(representation.aromaticBonds)),
    atomRings: (Array.isArray(representation.atomRings) ? representation.atomRings : []).map(numbers),
  };
  if (queries) {
    molecule.atomQueries = (Array.isArray(queries.atomQueries) ? queries.atomQueries : []) as JsonQueryNode[];
    molecule.bondQueries = (Array.isArray(queries.bondQueries) ? queries.bondQueries : []) as JsonQueryNode[];
  }
  return molecule;
}
