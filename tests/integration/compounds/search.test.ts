// Search on a real database (PGlite, and PostgreSQL when configured): every structure search must equal a brute-force
// scan of the group's own compounds, text search must equal a plain filter, and another group's rows never appear.
import { beforeAll, expect, it } from "vitest";
import { describeStructure, loadRDKit, type RDKitModule } from "@/lib/chem/structure";
import { bruteForceSimilar } from "@/lib/search";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { getCompound } from "@/lib/compounds/queries";
import { searchSchema, type SearchInput } from "@/lib/compounds/schemas";
import { CompoundSearchService } from "@/lib/compounds/search-service";
import { registerCompounds, type CompoundActor } from "@/lib/compounds/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeActor, makeWorkupUsing } from "./fixtures";
import { GROUP_A_SMILES, GROUP_B_SMILES, SIMILARITY_QUERIES, SUBSTRUCTURE_QUERIES } from "./molecules";

let rdkit: RDKitModule;
beforeAll(async () => {
  rdkit = await loadRDKit();
});

const q = (input: SearchInput) => searchSchema.parse(input);

/** RDKit's own answer for one compound, with the query read the way the index reads it. */
function rdkitMatches(smiles: string, query: string, type: "smiles" | "smarts"): boolean {
  const target = rdkit.get_mol(smiles);
  const pattern = type === "smarts" ? rdkit.get_qmol(query) : rdkit.get_mol(query);
  try {
    return target!.get_substruct_match(pattern!) !== "{}";
  } finally {
    target?.delete();
    pattern?.delete();
  }
}

describeEachDatabase("compound search", (t) => {
  let a: CompoundActor;
  let b: CompoundActor;
  let service: CompoundSearchService;
  const rowsOf = (actor: CompoundActor) => t.db.compound.findMany({ where: { groupId: actor.groupId }, select: { id: true, name: true, synonyms: true, tags: true, canonicalSmiles: true, fingerprint: true } });

  beforeAll(async () => {
    a = await makeActor(t.db, "Search lab A");
    b = await makeActor(t.db, "Search lab B");
    await registerCompounds(t.db, a, { format: "smiles", text: GROUP_A_SMILES, tags: ["series a"], onDuplicate: "reject" });
    await registerCompounds(t.db, b, { format: "smiles", text: GROUP_B_SMILES, tags: ["series b"], onDuplicate: "reject" });
    await t.db.compound.updateMany({ where: { groupId: a.groupId, name: { in: ["triethylamine", "diethylamine", "benzylamine"] } }, data: { tags: ["series a", "amine base"] } });
    await t.db.compound.updateMany({ where: { groupId: a.groupId, name: "paracetamol" }, data: { synonyms: ["acetaminophen"] } });
    service = new CompoundSearchService();
  });

  it("similarity: exactly the brute-force top k over the group's stored fingerprints, at several thresholds", async () => {
    const reference = (await rowsOf(a)).map((r) => ({ id: r.id, fingerprint: new Uint8Array(r.fingerprint!) }));
    for (const query of SIMILARITY_QUERIES) {
      const fp = describeStructure(rdkit, query).morganFingerprint;
      for (const [threshold, topK] of [[0, 10], [0.2, 100], [0.5, 3]] as const) {
        const got = await service.searchIds(t.db, a.groupId, q({ mode: "similarity", query, threshold, topK }));
        const want = bruteForceSimilar(reference, fp, topK, threshold);
        expect(got.ids.map((h) => h.id), `${query} ≥${threshold} top ${topK}`).toEqual(want.map((h) => h.id));
        got.ids.forEach((h, i) => expect(h.similarity).toBeCloseTo(want[i]!.score, 12));
      }
    }
  });

  it("substructure: exactly RDKit's matches among the group's compounds, for SMILES and SMARTS fragments", async () => {
    const rows = await rowsOf(a);
    for (const [query, queryType] of SUBSTRUCTURE_QUERIES) {
      const got = await service.searchIds(t.db, a.groupId, q({ mode: "substructure", query, queryType, limit: 1000 }));
      const want = rows.filter((r) => rdkitMatches(r.canonicalSmiles, query, queryType)).map((r) => r.id).sort();
      expect(got.ids.map((h) => h.id).sort(), `${queryType} ${query}`).toEqual(want);
      expect(got.more).toBe(false);
    }
  });

  it("substructure with a limit returns a prefix of the full answer and says more exist", async () => {
    const all = await service.searchIds(t.db, a.groupId, q({ mode: "substructure", query: "c1ccccc1", limit: 1000 }));
    const page = await service.searchIds(t.db, a.groupId, q({ mode: "substructure", query: "c1ccccc1", limit: 3 }));
    expect(page.ids).toEqual(all.ids.slice(0, 3));
    expect(page.more).toBe(all.ids.length > 3);
  });

  it("text: name, synonym or tag containing the text, case-insensitive, exact name first", async () => {
    const rows = await rowsOf(a);
    for (const text of ["amine", "ACETAMINOPHEN", "acid", "Series", "benz"]) {
      const got = await service.searchIds(t.db, a.groupId, q({ mode: "text", query: text, limit: 1000 }));
      const needle = text.toLowerCase();
      const want = rows.filter((r) => [r.name, ...r.synonyms, ...r.tags].some((s) => s.toLowerCase().includes(needle))).map((r) => r.id).sort();
      expect(got.ids.map((h) => h.id).sort(), text).toEqual(want);
    }
    const exact = await service.search(t.db, a.groupId, q({ mode: "text", query: "aniline" }));
    expect(exact.hits[0]?.name).toBe("aniline");
    const literal = await service.searchIds(t.db, a.groupId, q({ mode: "text", query: "%" }));
    expect(literal.ids).toEqual([]);
  });

  it("never shows another group's compound, even one with the same structure", async () => {
    const ownIds = new Set((await rowsOf(a)).map((r) => r.id));
    const queries: SearchInput[] = [
      { mode: "similarity", query: "CC(=O)Oc1ccccc1C(=O)O", threshold: 0, topK: 200 },
      { mode: "substructure", query: "c1ccccc1", limit: 1000 },
      { mode: "text", query: "a", limit: 1000 },
    ];
    for (const input of queries) {
      const result = await service.search(t.db, a.groupId, q(input));
      expect(result.hits.length).toBeGreaterThan(0);
      for (const hit of result.hits) expect(ownIds.has(hit.id), `${input.mode} ${hit.name}`).toBe(true);
    }
    const [otherAspirin] = await t.db.compound.findMany({ where: { groupId: b.groupId, name: { startsWith: "aspirin" } } });
    await expect(getCompound(t.db, a.groupId, otherAspirin!.id)).rejects.toBeInstanceOf(NotFoundError);
    const bHits = await service.search(t.db, b.groupId, q({ mode: "similarity", query: "CC(=O)Oc1ccccc1C(=O)O", threshold: 0.99, topK: 10 }));
    expect(bHits.hits.map((h) => h.id)).toEqual([otherAspirin!.id]);
  });

  it("shows each hit's workups with outcome and deviation", async () => {
    const lidocaine = await t.db.compound.findFirstOrThrow({ where: { groupId: a.groupId, name: "lidocaine" } });
    await makeWorkupUsing(t.db, a, lidocaine.id, "Lidocaine free base, acid–base extraction", { status: "below", deviationPct: -12.5 });
    const result = await service.search(t.db, a.groupId, q({ mode: "similarity", query: "CCN(CC)CC(=O)Nc1c(C)cccc1C", threshold: 0.9, topK: 5 }));
    expect(result.hits[0]).toMatchObject({ id: lidocaine.id, similarity: 1, workupCount: 1 });
    expect(result.hits[0]!.workups[0]).toMatchObject({ title: "Lidocaine free base, acid–base extraction", status: "below", deviationPct: -12.5, role: "product" });
  });

  it("answers an unreadable query as a validation error naming the problem", async () => {
    const error = await service.search(t.db, a.groupId, q({ mode: "similarity", query: "C1CC(" })).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ValidationError);
    expect((error as ValidationError).fieldErrors["query"]?.[0]).toBeTruthy();
    const smarts = await service.search(t.db, a.groupId, q({ mode: "substructure", query: "[C;", queryType: "smarts" })).catch((e: unknown) => e);
    expect(smarts).toBeInstanceOf(ValidationError);
  });
});
