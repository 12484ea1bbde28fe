// Two app instances over one database, each with its own in-memory index (a CompoundSearchService each; on
// PostgreSQL each also has its own client and connections, as separate processes would). Whatever one writes, the
// next search on the other must see. The two-process version of this is in two-processes.test.ts.
import { afterAll, beforeAll, expect, it } from "vitest";
import { describeStructure, loadRDKit } from "@/lib/chem/structure";
import { createRng } from "@/lib/chem/random";
import { createDb, type Database, type Db } from "@/lib/db/client";
import { bruteForceSimilar } from "@/lib/search";
import { deleteCompound } from "@/lib/compounds/edits";
import { searchSchema } from "@/lib/compounds/schemas";
import { CompoundSearchService } from "@/lib/compounds/search-service";
import { registerCompounds, type CompoundActor } from "@/lib/compounds/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeActor } from "./fixtures";

const similar = (query: string, threshold = 0.99) => searchSchema.parse({ mode: "similarity", query, threshold, topK: 200 });
const register = (db: Db, actor: CompoundActor, text: string) => registerCompounds(db, actor, { format: "smiles", text, tags: [], onDuplicate: "reject" });
const idsOf = async (service: CompoundSearchService, db: Db, actor: CompoundActor, query: string, threshold?: number) =>
  (await service.searchIds(db, actor.groupId, similar(query, threshold))).ids.map((h) => h.id);

/** A row written the way other code might: straight through Prisma, with a stamp of our choosing. */
async function insertDirectly(db: Db, actor: CompoundActor, smiles: string, name: string, updatedAt: Date) {
  const d = describeStructure(await loadRDKit(), smiles);
  return db.compound.create({
    data: {
      groupId: actor.groupId, name, canonicalSmiles: d.canonicalSmiles, formula: d.formula, molarMass: d.molarMass,
      fingerprint: new Uint8Array(d.morganFingerprint), createdAt: updatedAt, updatedAt,
    },
  });
}

async function databaseNow(db: Db): Promise<Date> {
  const [row] = await db.$queryRaw<{ now: Date }[]>`SELECT now() AS now`;
  return row!.now;
}

describeEachDatabase("search index sync between app instances", (t) => {
  let second: Database | undefined;
  let other: Db;
  beforeAll(async () => {
    // PGlite is single-process: both instances share the one client there.
    second = t.backend === "postgresql" ? await createDb({ url: t.url, migrate: false }) : undefined;
    other = second?.db ?? t.db;
  });
  afterAll(async () => {
    await second?.close();
  });

  it("a compound registered through one instance is found by the next search on the other", async () => {
    const actor = await makeActor(t.db);
    const one = new CompoundSearchService();
    const two = new CompoundSearchService();
    await register(t.db, actor, "CCOC(=O)c1ccccc1 ethyl benzoate");
    expect(await idsOf(two, other, actor, "CCCOC(=O)c1ccccc1")).toEqual([]); // loads the group
    expect(await idsOf(one, t.db, actor, "CCCOC(=O)c1ccccc1")).toEqual([]);
    const { created } = await register(other, actor, "CCCOC(=O)c1ccccc1 propyl benzoate");
    expect(await idsOf(one, t.db, actor, "CCCOC(=O)c1ccccc1")).toEqual([created[0]!.id]);
    expect(await idsOf(two, other, actor, "CCCOC(=O)c1ccccc1")).toEqual([created[0]!.id]);
  });

  it("a compound deleted through one instance is gone from the next search on the other", async () => {
    const actor = await makeActor(t.db);
    const one = new CompoundSearchService();
    const { created } = await register(t.db, actor, "CC(C)OC(=O)c1ccccc1 isopropyl benzoate");
    expect(await idsOf(one, t.db, actor, "CC(C)OC(=O)c1ccccc1")).toEqual([created[0]!.id]);
    await deleteCompound(other, actor, created[0]!.id);
    expect(await idsOf(one, t.db, actor, "CC(C)OC(=O)c1ccccc1")).toEqual([]);
    expect(one.indexedIds(actor.groupId)).toEqual([]);
  });

  it("finds a row that committed after the last search with an earlier stamp (a slow transaction)", async () => {
    const actor = await makeActor(t.db);
    const one = new CompoundSearchService();
    await idsOf(one, t.db, actor, "CCCCOC(=O)c1ccccc1");
    const stamp = new Date((await databaseNow(t.db)).getTime() - 15_000);
    const row = await insertDirectly(other, actor, "CCCCOC(=O)c1ccccc1", "butyl benzoate", stamp);
    expect(await idsOf(one, t.db, actor, "CCCCOC(=O)c1ccccc1")).toEqual([row.id]);
  });

  it("reloads a group when rows written or deleted outside the registry change its count", async () => {
    const actor = await makeActor(t.db);
    const one = new CompoundSearchService({ countCheckMs: 0 });
    const { created } = await register(t.db, actor, "CC(=O)c1ccccc1 acetophenone");
    await idsOf(one, t.db, actor, "CCC(=O)c1ccccc1");
    const old = await insertDirectly(other, actor, "CCC(=O)c1ccccc1", "propiophenone", new Date("2020-01-01T00:00:00Z"));
    expect(await idsOf(one, t.db, actor, "CCC(=O)c1ccccc1")).toEqual([old.id]);
    await other.compound.deleteMany({ where: { id: created[0]!.id, groupId: actor.groupId } }); // no tombstone
    expect(await idsOf(one, t.db, actor, "CC(=O)c1ccccc1")).toEqual([]);
    expect(one.indexedIds(actor.groupId)).toEqual([old.id]);
  });

  it("a search that arrives while another's read is in flight still sees a compound registered before it", async () => {
    const actor = await makeActor(t.db);
    await register(t.db, actor, "CCOC(=O)CC ethyl propanoate");
    let release = () => undefined as void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    // Holds the first read at its RDKit step, after its snapshot was taken.
    const one = new CompoundSearchService({ rdkit: () => gate.then(() => loadRDKit()) });
    const first = idsOf(one, t.db, actor, "CCCOC(=O)CC");
    await new Promise((resolve) => setTimeout(resolve, 300));
    const { created } = await register(other, actor, "CCCOC(=O)CC propyl propanoate");
    const second = idsOf(one, t.db, actor, "CCCOC(=O)CC");
    release();
    expect(await first).toEqual([]);
    expect(await second).toEqual([created[0]!.id]);
  });

  it("both instances agree with a brute-force scan after a random run of registrations and deletions", async () => {
    const actor = await makeActor(t.db);
    const instances = [{ service: new CompoundSearchService(), db: t.db }, { service: new CompoundSearchService(), db: other }];
    const pool = ["CCO", "CCCO", "CCCCO", "OCCO", "CC(C)O", "CCN", "CCCN", "c1ccccc1O", "c1ccccc1N", "c1ccccc1C", "CC(=O)O", "CCC(=O)O", "CCOC(C)=O", "C1CCCCC1", "C1CCNCC1", "C1CCOCC1"];
    const rng = createRng(4242); // seeded so a failure can be replayed
    const live = new Map<string, string>();
    const query = "CCCO";
    for (let step = 0; step < 24; step++) {
      const via = instances[Math.floor(rng.uniform() * 2)]!;
      const smiles = pool[Math.floor(rng.uniform() * pool.length)]!;
      const existing = [...live.entries()].find(([, s]) => s === smiles);
      if (existing) {
        await deleteCompound(via.db, actor, existing[0]);
        live.delete(existing[0]);
      } else {
        const { created } = await register(via.db, actor, `${smiles} step-${step}`);
        live.set(created[0]!.id, smiles);
      }
      const rows = await t.db.compound.findMany({ where: { groupId: actor.groupId }, select: { id: true, fingerprint: true } });
      const fp = describeStructure(await loadRDKit(), query).morganFingerprint;
      const want = bruteForceSimilar(rows.map((r) => ({ id: r.id, fingerprint: new Uint8Array(r.fingerprint!) })), fp, 200, 0).map((h) => h.id);
      for (const { service, db } of instances) expect(await idsOf(service, db, actor, query, 0), `step ${step}`).toEqual(want);
    }
  });
});
