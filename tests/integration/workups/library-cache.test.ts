// The group library is kept per instance and checked against Group.libraryVersion, which a database trigger raises
// on every change to the group's rows. A change made outside this process's code (another instance, an import, SQL by
// hand) must show on the next read; an unchanged library costs one small statement.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resolveLibrary } from "@/lib/chem/library";
import { type Db } from "@/lib/db/client";
import { groupLibrary } from "@/lib/workups/library";
import { makeGroup } from "@/tests/integration/auth/fixtures";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { createCountingDb, type CountingDb } from "@/tests/integration/helpers/counting-db";

/** Toluene, 0.867 g/mL at 20 °C (CRC Handbook of Chemistry and Physics, from memory); only the value's path matters. */
const toluene = { key: "toluene", name: "Toluene", density: 0.867, waterMiscible: false };

const stamp = async (db: Db, groupId: string) =>
  (await db.$queryRaw<{ libraryVersion: number }[]>`SELECT "libraryVersion" FROM "Group" WHERE "id" = ${groupId}`)[0]?.libraryVersion;

describeEachDatabase("group library cache", (t) => {
  it("raises the group's stamp on insert, update and delete of its rows, and only its own", async () => {
    const group = await makeGroup(t.db, "Stamp Lab");
    const other = await makeGroup(t.db, "Other Lab");
    const v0 = await stamp(t.db, group.id);
    await t.db.solvent.create({ data: { groupId: group.id, key: "toluene", name: "Toluene", props: toluene } });
    const v1 = await stamp(t.db, group.id);
    await t.db.solvent.updateMany({ where: { groupId: group.id, key: "toluene" }, data: { props: { ...toluene, density: 0.8669 } } });
    const v2 = await stamp(t.db, group.id);
    await t.db.solvent.deleteMany({ where: { groupId: group.id, key: "toluene" } });
    const v3 = await stamp(t.db, group.id);
    await t.db.aqueousReagent.create({ data: { groupId: group.id, key: "brine", name: "Brine", props: { key: "brine", name: "Brine" } } });
    const v4 = await stamp(t.db, group.id);
    expect([v1! > v0!, v2! > v1!, v3! > v2!, v4! > v3!]).toEqual([true, true, true, true]);
    expect(await stamp(t.db, other.id)).toBe(0);
  });

  it("shows a change written by SQL outside this process's code on the next read", async () => {
    const group = await makeGroup(t.db, "Outside Lab");
    await t.db.solvent.create({ data: { groupId: group.id, key: "toluene", name: "Toluene", props: toluene } });
    expect(resolveLibrary(await groupLibrary(t.db, group.id)).solvents["toluene"]?.density).toBe(0.867);
    await t.db.$executeRaw`UPDATE "Solvent" SET "props" = jsonb_set("props", '{density}', '0.9') WHERE "groupId" = ${group.id} AND "key" = 'toluene'`;
    expect(resolveLibrary(await groupLibrary(t.db, group.id)).solvents["toluene"]?.density).toBe(0.9);
  });

  it("does not keep what a transaction read before it rolled back", async () => {
    const group = await makeGroup(t.db, "Rollback Lab");
    await t.db.solvent.create({ data: { groupId: group.id, key: "toluene", name: "Toluene", props: toluene } });
    await groupLibrary(t.db, group.id);
    await expect(t.db.$transaction(async (tx) => {
      await tx.solvent.updateMany({ where: { groupId: group.id, key: "toluene" }, data: { props: { ...toluene, density: 5 } } });
      expect(resolveLibrary(await groupLibrary(tx, group.id)).solvents["toluene"]?.density).toBe(5);
      throw new Error("roll back");
    })).rejects.toThrow("roll back");
    // The next committed change reaches the stamp the rolled-back one had: what the transaction read must not be served.
    await t.db.solvent.updateMany({ where: { groupId: group.id, key: "toluene" }, data: { props: { ...toluene, density: 0.87 } } });
    expect(resolveLibrary(await groupLibrary(t.db, group.id)).solvents["toluene"]?.density).toBe(0.87);
  });

  it("deletes a group together with its library rows", async () => {
    const group = await makeGroup(t.db, "Short-lived Lab");
    await t.db.solvent.create({ data: { groupId: group.id, key: "toluene", name: "Toluene", props: toluene } });
    await t.db.group.delete({ where: { id: group.id } });
    expect(await t.db.solvent.count({ where: { groupId: group.id } })).toBe(0);
    expect(await groupLibrary(t.db, group.id)).toEqual({});
  });
});

describe("group library cache: round trips", () => {
  let c: CountingDb;
  beforeAll(async () => {
    c = await createCountingDb();
  });
  afterAll(async () => {
    await c?.dispose();
  });

  it("reads an unchanged library with one statement, and reloads after a change", async () => {
    const group = await makeGroup(c.db, "Counted Lab");
    await c.db.solvent.createMany({ data: ["toluene", "xylene", "heptane"].map((key) => ({ groupId: group.id, key, name: key, props: { ...toluene, key } })) });
    const first = await c.count(() => groupLibrary(c.db, group.id));
    const second = await c.count(() => groupLibrary(c.db, group.id));
    expect(second.statements).toHaveLength(1);
    expect(second.result).toEqual(first.result);
    await c.db.solvent.deleteMany({ where: { groupId: group.id, key: "xylene" } });
    const third = await c.count(() => groupLibrary(c.db, group.id));
    expect(third.statements.length).toBeGreaterThan(1);
    expect(Object.keys(third.result.solvents ?? {}).sort()).toEqual(["heptane", "toluene"]);
  });
});

