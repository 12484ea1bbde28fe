/**
 * Substructure search must return exactly the compounds RDKit's own matcher accepts (get_substruct_match), in id
 * order, for SMARTS and SMILES queries, including queries the graph matcher hands back to RDKit.
 * Structures are drugs, reagents and building blocks chosen to exercise rings, charges, isotopes and salts.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { loadRDKit, type RDKitModule, searchKeys } from "@/lib/chem/structure";
import { CompoundSearchIndex, compileSubstructureQuery } from "@/lib/search";
import { randomId, seeded } from "./random-fingerprints";

const MOLECULES = [
  "CC(=O)Oc1ccccc1C(=O)O", "Cn1cnc2c1c(=O)n(C)c(=O)n2C", "CC(C)Cc1ccc(cc1)C(C)C(=O)O", "CCN(CC)CC(=O)Nc1c(C)cccc1C",
  "CC(=O)Nc1ccc(O)cc1", "OC(=O)c1ccccc1", "c1ccc2[nH]ccc2c1", "c1ccc2ncccc2c1", "C1CCNCC1", "C1COCCN1", "c1ccc(cc1)N1CCNCC1",
  "CC(C)(C)OC(=O)NCC(=O)O", "Brc1ccc(cc1)C#N", "O=[N+]([O-])c1ccc(Cl)cc1", "OB(O)c1ccccc1", "FC(F)(F)c1ccc(cc1)S(N)(=O)=O",
  "CC[NH+](CC)CC.[Cl-]", "CC(=O)[O-].[Na+]", "[2H]C([2H])([2H])Oc1ccccc1", "[13CH3]C(=O)O", "C1CCCCCCCCCCC1", "C1CC2CCC1CC2",
  "c1ccc2cc3ccccc3cc2c1", "O=C1CCC(=O)N1", "NC(=N)c1ccccc1", "NC(N)=N", "c1nn[nH]n1", "c1cscn1", "c1cncnc1", "C=CC(=O)OC",
  "CCOC(=O)C=C", "C#CCO", "CS(C)=O", "ClCCl", "OCC(O)CO", "NCC(=O)O", "[NH3+]CC(=O)[O-]", "CC1=CC(=O)C=CC1=O",
  "O=C(O)CCC(=O)O", "CN1CCN(C)CC1", "C1=CC=CC=C1", "c1ccc(cc1)-c1ccccc1", "CC(C)N", "CCCCCCCCCCCCCCCC(=O)O",
  "C[Si](C)(C)OC", "CP(=O)(O)O", "O=S(=O)(O)c1ccc(C)cc1", "[O-][n+]1ccccc1", "C1CC1", "C1CCC2(CC1)CCCC2",
  "N#Cc1ccncc1", "Clc1ncccn1", "OC1CCCCC1", "CC(C)(C)c1ccc(O)cc1", "c1ccc2c(c1)oc1ccccc12", "C[C@H](N)C(=O)O",
];

// SMARTS: atom primitives (element, aromaticity, H count, degree, connectivity, charge, isotope, ring membership,
// ring size, ring connectivity), bond primitives, logic and recursion; the last three need RDKit's own evaluation.
const SMARTS = [
  "c1ccncc1", "C(=O)O", "NC(=O)", "c1ccccc1", "C(F)(F)F", "S(=O)(=O)N", "N1CCNCC1", "[#7;R]", "[C;R2]", "[C;!R]", "[c;x3]",
  "[C;r6]", "[C;r3]", "[N;H2]", "[N;D3]", "[C;X4]", "[N+]", "[O-]", "[2H]", "[13C]", "[Cl,Br]", "[$(C(=O)[OH])]",
  "[$([NX3][CX3]=O)]", "C@C", "C!@C", "C~N", "c:n", "[!#6;!#1]", "[A;R]", "[a;!c]", "C-,=C", "[R0;O]", "[n;H1]",
  "[N;!$(N-C=O)]", "*~*~*~*", "[C;^2]", "[O;h1]", "[N;v3]",
];
const SMILES_QUERIES = ["c1ccncc1", "C(=O)O", "NC=O", "c1ccccc1", "CC(C)(C)OC(=O)N", "C1CCCCC1", "[N+](=O)[O-]", "[13CH3]", "C#N", "CN(C)C"];

let rdkit: RDKitModule;
let index: CompoundSearchIndex<{ smiles: string }>;
let ids: string[];

beforeAll(async () => {
  rdkit = await loadRDKit();
  index = new CompoundSearchIndex();
  const random = seeded(42);
  ids = MOLECULES.map(() => randomId(random));
  MOLECULES.forEach((smiles, i) => {
    const keys = searchKeys(rdkit, smiles);
    index.upsert({ id: ids[i] ?? "", groupId: "g", morganFingerprint: keys.morganFingerprint, searchGraph: keys.searchGraph, canonicalSmiles: smiles }, { smiles });
  });
});

function rdkitHits(text: string, mode: "smarts" | "smiles"): string[] {
  const query = mode === "smarts" ? rdkit.get_qmol(text) : rdkit.get_mol(text);
  if (!query) throw new Error(`query ${text} does not parse`);
  try {
    return MOLECULES.flatMap((smiles, i) => {
      const mol = rdkit.get_mol(smiles);
      if (!mol) return [];
      try {
        return mol.get_substruct_match(query) !== "{}" ? [ids[i] ?? ""] : [];
      } finally {
        mol.delete();
      }
    }).sort();
  } finally {
    query.delete();
  }
}

describe("substructure search equals RDKit", () => {
  it.each(SMARTS)("SMARTS %s", (text) => {
    const query = compileSubstructureQuery(rdkit, text, "smarts");
    try {
      expect(index.substructure("g", query).hits.map((h) => h.id)).toEqual(rdkitHits(text, "smarts"));
    } finally {
      query.dispose();
    }
  });

  it.each(SMILES_QUERIES)("SMILES %s (molecule as query)", (text) => {
    const query = compileSubstructureQuery(rdkit, text, "smiles");
    try {
      expect(query.exact).toBe(true);
      expect(index.substructure("g", query).hits.map((h) => h.id)).toEqual(rdkitHits(text, "smiles"));
    } finally {
      query.dispose();
    }
  });

  it("lets RDKit confirm queries with hybridization, implicit-H or valence primitives", () => {
    for (const text of ["[C;^2]", "[O;h1]", "[N;v3]"]) {
      const query = compileSubstructureQuery(rdkit, text, "smarts");
      expect(query.exact).toBe(false);
      expect(query.unsupportedReason).toMatch(/Hybridization|ImplicitHCount|TotalValence/);
      query.dispose();
    }
  });

  it("returns the first hits in id order and says when more exist", () => {
    const query = compileSubstructureQuery(rdkit, "[#6]", "smarts");
    const all = index.substructure("g", query).hits.map((h) => h.id);
    const page = index.substructure("g", query, { limit: 5 });
    expect(page.hits.map((h) => h.id)).toEqual(all.slice(0, 5));
    expect(page.more).toBe(true);
    expect(index.substructure("g", query, { limit: all.length }).more).toBe(false);
    expect(index.substructure("other-group", query).hits).toEqual([]);
    query.dispose();
  });

  it("rejects a malformed query with a StructureError", () => {
    expect(() => compileSubstructureQuery(rdkit, "C(", "smarts")).toThrow(/SMARTS/);
    expect(() => compileSubstructureQuery(rdkit, "C1CC", "smiles")).toThrow(/never closed/);
  });
});

describe("id-ordered storage", () => {
  it("keeps hits in id order through random inserts, replacements and removals across many leaves", () => {
    const store = new CompoundSearchIndex<null>();
    const keys = searchKeys(rdkit, "c1ccncc1");
    const other = searchKeys(rdkit, "CCCC");
    const random = seeded(5);
    const live = new Map<string, boolean>();
    for (let i = 0; i < 700; i++) {
      const id = randomId(random);
      const pyridine = random() < 0.6;
      const k = pyridine ? keys : other;
      store.upsert({ id, groupId: "g", morganFingerprint: k.morganFingerprint, searchGraph: k.searchGraph }, null);
      live.set(id, pyridine);
    }
    for (const id of [...live.keys()]) {
      const dice = random();
      if (dice < 0.3) {
        store.remove(id);
        live.delete(id);
      } else if (dice < 0.4) {
        const pyridine = !live.get(id);
        const k = pyridine ? keys : other;
        store.upsert({ id, groupId: "g", morganFingerprint: k.morganFingerprint, searchGraph: k.searchGraph }, null);
        live.set(id, pyridine);
      }
    }
    const query = compileSubstructureQuery(rdkit, "c1ccncc1", "smarts");
    const expected = [...live.entries()].filter(([, p]) => p).map(([id]) => id).sort();
    expect(store.substructure("g", query).hits.map((h) => h.id)).toEqual(expected);
    expect(store.substructure("g", query, { limit: 17 }).hits.map((h) => h.id)).toEqual(expected.slice(0, 17));
    query.dispose();
  });
});
