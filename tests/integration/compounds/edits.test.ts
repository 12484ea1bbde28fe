// Replacing estimates with measured or literature values, and undoing that, on a real database: an edit names the
// value it replaces and is refused if the row changed meanwhile; the audit log keeps old and new values.
import { beforeAll, expect, it } from "vitest";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { clearLogP, deleteCompound, revertPKa, setLogP, setPKa } from "@/lib/compounds/edits";
import { parseLogPSource } from "@/lib/compounds/provenance";
import { getCompound } from "@/lib/compounds/queries";
import { registerCompounds, type CompoundActor } from "@/lib/compounds/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeActor, makeWorkupUsing } from "./fixtures";

describeEachDatabase("compound edits", (t) => {
  let actor: CompoundActor;
  let benzoicId: string;
  beforeAll(async () => {
    actor = await makeActor(t.db, "Edit lab");
    const { created } = await registerCompounds(t.db, actor, { format: "smiles", text: "OC(=O)c1ccccc1 benzoic acid", tags: [], onDuplicate: "reject" });
    benzoicId = created[0]!.id;
  });

  it("sets a literature log P over none, refuses a stale edit, and clears it again", async () => {
    // Benzoic acid log Kow 1.87 (PhysProp experimental value, as in the project's reference data).
    await setLogP(t.db, actor, { compoundId: benzoicId, value: 1.87, provenance: "literature", source: "PhysProp", expected: null });
    let compound = await getCompound(t.db, actor.groupId, benzoicId);
    expect(compound.logP).toBe(1.87);
    expect(parseLogPSource(compound.logPSource)).toEqual({ provenance: "literature", source: "PhysProp" });

    const stale = setLogP(t.db, actor, { compoundId: benzoicId, value: 1.9, provenance: "measured", source: "notebook EL-3 p. 12", expected: null });
    await expect(stale).rejects.toBeInstanceOf(ConflictError);
    await expect(stale).rejects.toThrow("The log P changed to 1.87 since you opened this page");

    await clearLogP(t.db, actor, benzoicId, 1.87);
    compound = await getCompound(t.db, actor.groupId, benzoicId);
    expect(compound.logP).toBeNull();
    expect(compound.crippenLogP).not.toBeNull();
    const audit = await t.db.auditEvent.findMany({ where: { groupId: actor.groupId, entityId: benzoicId }, orderBy: { createdAt: "asc" }, select: { action: true, details: true } });
    expect(audit.map((a) => a.action)).toEqual(["compound.logP.set", "compound.logP.clear"]);
    expect(audit[1]!.details).toMatchObject({ old: { value: 1.87, source: "literature: PhysProp" }, new: null });
  });

  it("replaces an estimated pKa, keeps the estimate beside it, and puts it back", async () => {
    const before = (await getCompound(t.db, actor.groupId, benzoicId)).pKas;
    expect(before).toHaveLength(1);
    const estimate = before[0]!;
    expect(estimate.provenance).toBe("estimated");
    // Benzoic acid pKa 4.204 at 25 °C (IUPAC digitized pKa dataset, entry B91).
    await setPKa(t.db, actor, { compoundId: benzoicId, index: 0, value: 4.204, kind: "acid", provenance: "literature", source: "IUPAC B91", se: 0.01, expected: estimate.value });
    const replaced = (await getCompound(t.db, actor.groupId, benzoicId)).pKas[0]!;
    expect(replaced).toMatchObject({ value: 4.204, provenance: "literature", source: "IUPAC B91", site: estimate.site, atoms: estimate.atoms });
    expect(replaced.estimate).toEqual({ value: estimate.value, source: estimate.source, se: estimate.se });

    await expect(revertPKa(t.db, actor, benzoicId, 0, estimate.value)).rejects.toBeInstanceOf(ConflictError);
    await revertPKa(t.db, actor, benzoicId, 0, 4.204);
    expect((await getCompound(t.db, actor.groupId, benzoicId)).pKas).toEqual(before);
  });

  it("adds a site by hand and removes it again", async () => {
    await setPKa(t.db, actor, { compoundId: benzoicId, index: 1, value: -7.2, kind: "base", provenance: "measured", source: "notebook EL-3 p. 14", expected: null });
    const pKas = (await getCompound(t.db, actor.groupId, benzoicId)).pKas;
    expect(pKas[1]).toMatchObject({ value: -7.2, kind: "base", site: "added by hand", provenance: "measured" });
    await revertPKa(t.db, actor, benzoicId, 1, -7.2);
    expect((await getCompound(t.db, actor.groupId, benzoicId)).pKas).toHaveLength(1);
  });

  it("answers another group's compound as not found, for reads and edits alike", async () => {
    const other = await makeActor(t.db, "Other edit lab");
    await expect(getCompound(t.db, other.groupId, benzoicId)).rejects.toBeInstanceOf(NotFoundError);
    await expect(setLogP(t.db, other, { compoundId: benzoicId, value: 2, provenance: "measured", source: "nowhere", expected: null })).rejects.toBeInstanceOf(NotFoundError);
    await expect(deleteCompound(t.db, other, benzoicId)).rejects.toBeInstanceOf(NotFoundError);
  });

  it("refuses to delete a compound a workup used, and deletes an unused one leaving a tombstone", async () => {
    await makeWorkupUsing(t.db, actor, benzoicId, "Benzoic acid recovery by acidification");
    await expect(deleteCompound(t.db, actor, benzoicId)).rejects.toThrow("“benzoic acid” is used in 1 workup component and 0 partition observations");
    const { created } = await registerCompounds(t.db, actor, { format: "smiles", text: "Cc1ccccc1 toluene", tags: [], onDuplicate: "reject" });
    await deleteCompound(t.db, actor, created[0]!.id);
    expect(await t.db.compound.count({ where: { id: created[0]!.id } })).toBe(0);
    expect(await t.db.auditEvent.count({ where: { groupId: actor.groupId, action: "compound.delete", entityId: created[0]!.id } })).toBe(1);
  });
});
