import { beforeAll, describe, expect, it } from "vitest";
import { ENGINE_VERSION } from "@/lib/chem/version";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { StaleVersionError } from "@/lib/workups/conflict";
import { computePrediction, seedFromId, SAVE_DRAWS, type StoredPredictionResult } from "@/lib/workups/prediction";
import { getWorkupDetail } from "@/lib/workups/queries";
import { createWorkup, deleteWorkup, updateWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { exampleSpec, footprint, header, makeLab, withInterval, type Lab } from "./fixtures";

async function rejection(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (error) {
    return error;
  }
  throw new Error("expected the call to be refused");
}

describeEachDatabase("saving workups", (t) => {
  let lab: Lab;
  let other: Lab;

  beforeAll(async () => {
    lab = await makeLab(t.db, "Aldol Lab");
    other = await makeLab(t.db, "Birch Lab");
  });

  it("creates version 1 with its snapshot, components, prediction (engine version, then its interval) and an audit event", async () => {
    const spec = exampleSpec();
    const saved = await withInterval(t.db, createWorkup(t.db, lab.member, { header: header({ chemistId: lab.member.userId }), spec }));
    expect(saved.version).toBe(1);
    const row = await t.db.workup.findFirstOrThrow({ where: { id: saved.id }, include: { versions: true, predictions: true, components: true } });
    expect(row).toMatchObject({ groupId: lab.groupId, title: "Benzanilide wash sequence", notebookRef: "AB-12/041", chemistId: lab.member.userId, version: 1 });
    expect(row.solventKeys).toEqual(["etoac"]);
    expect(row.searchText).toContain("benzanilide");
    expect(row.components.map((c) => c.key).sort()).toEqual(["aniline", "benzanilide", "benzoic-acid", "triethylamine"]);
    expect(row.versions).toHaveLength(1);
    expect(row.versions[0]).toMatchObject({ version: 1, editedById: lab.member.userId });
    expect(row.spec).toEqual(spec); // stored as entered, units included
    // One prediction for the version: the save's point prediction, completed in place by its interval job.
    expect(row.predictions).toHaveLength(1);
    const [prediction] = row.predictions;
    expect(prediction).toMatchObject({ workupVersion: 1, engineVersion: ENGINE_VERSION });
    const low = prediction!.recoveryLow!;
    const high = prediction!.recoveryHigh!;
    expect(low).toBeLessThanOrEqual(high);
    expect(prediction!.productRecovery).toBeGreaterThan(0);
    expect(prediction!.productRecovery).toBeLessThanOrEqual(1);
    const result = prediction!.result as unknown as StoredPredictionResult;
    expect(result.uncertainty).toMatchObject({ draws: SAVE_DRAWS, seed: seedFromId(saved.id) });
    expect(result.prediction.productKey).toBe("benzanilide");
    const events = await t.db.auditEvent.findMany({ where: { entityId: saved.id } });
    expect(events.map((e) => e.action)).toEqual(["workup.create"]);
  });

  it("stores an interval that re-running the engine with the id's seed reproduces", async () => {
    const saved = await withInterval(t.db, createWorkup(t.db, lab.member, { header: header(), spec: exampleSpec("amine-back-extraction") }));
    const stored = await t.db.prediction.findFirstOrThrow({ where: { workupId: saved.id }, orderBy: { createdAt: "desc" } });
    const again = computePrediction(exampleSpec("amine-back-extraction"), { library: {}, seed: seedFromId(saved.id) });
    expect(again.recoveryLow).toBeCloseTo(stored.recoveryLow!, 12);
    expect(again.recoveryHigh).toBeCloseTo(stored.recoveryHigh!, 12);
  });

  it("keeps every edit as a version, and refuses a stale save naming who changed it, writing nothing", async () => {
    const saved = await createWorkup(t.db, lab.member, { header: header({ title: "Stale test" }), spec: exampleSpec() });
    const v2 = await updateWorkup(t.db, lab.lead, saved.id, { header: header({ title: "Stale test, brine twice" }), spec: exampleSpec(), baseVersion: 1 });
    expect(v2.version).toBe(2);
    const before = await footprint(t.db);
    const error = await rejection(updateWorkup(t.db, lab.member, saved.id, { header: header({ title: "My late edit" }), spec: exampleSpec(), baseVersion: 1 }));
    expect(error).toBeInstanceOf(StaleVersionError);
    expect((error as StaleVersionError).status).toBe(409);
    expect((error as Error).message).toMatch(
      new RegExp(`^This workup was changed by ${lab.lead.name} at \\d{2}:\\d{2} UTC.* \\(version 2\\) after you opened it \\(version 1\\)\\. Reload to see their changes; your edits were not saved\\.$`),
    );
    expect(await footprint(t.db)).toEqual(before);
    const versions = await t.db.workupVersion.findMany({ where: { workupId: saved.id }, orderBy: { version: "asc" } });
    expect(versions.map((v) => [v.version, v.editedById])).toEqual([[1, lab.member.userId], [2, lab.lead.userId]]);
    expect(await t.db.prediction.count({ where: { workupId: saved.id } })).toBe(2);
  });

  it("lets exactly one of two simultaneous saves on the same version win", async () => {
    const saved = await createWorkup(t.db, lab.member, { header: header({ title: "Race" }), spec: exampleSpec() });
    const attempts = await Promise.allSettled([
      updateWorkup(t.db, lab.member, saved.id, { header: header({ title: "Race A" }), spec: exampleSpec(), baseVersion: 1 }),
      updateWorkup(t.db, lab.lead, saved.id, { header: header({ title: "Race B" }), spec: exampleSpec(), baseVersion: 1 }),
    ]);
    expect(attempts.filter((a) => a.status === "fulfilled")).toHaveLength(1);
    const refused = attempts.find((a) => a.status === "rejected");
    expect(refused?.reason).toBeInstanceOf(StaleVersionError);
    const row = await t.db.workup.findUniqueOrThrow({ where: { id: saved.id } });
    expect(row.version).toBe(2);
    expect(await t.db.workupVersion.count({ where: { workupId: saved.id } })).toBe(2);
  });

  it("answers 422 with the field named for a bad spec, an unknown solvent, a foreign chemist or compound, writing nothing", async () => {
    const foreignCompound = await t.db.compound.create({
      data: { groupId: other.groupId, name: "Aniline", canonicalSmiles: "Nc1ccccc1", formula: "C6H7N", molarMass: 93.13 },
    });
    const before = await footprint(t.db);
    const badVolume = exampleSpec();
    (badVolume.operations[0] as { volume: { value: number } }).volume.value = -5;
    const unknownSolvent = exampleSpec();
    unknownSolvent.mixture.solvents![0]!.solvent = "unobtainium";
    const cases: [unknown, string, string][] = [
      [{ header: header({ title: "" }), spec: exampleSpec() }, "header.title", "Give the workup a title"],
      [{ header: header({ performedOn: "3/11/2026" }), spec: exampleSpec() }, "header.performedOn", "Date run must be a date written YYYY-MM-DD"],
      [{ header: header(), spec: badVolume }, "spec.operations.0.volume.value", "volume per portion must be > 0"],
      [{ header: header(), spec: unknownSolvent }, "spec.mixture.solvents.0.solvent", "unknown solvent 'unobtainium'"],
      [{ header: header({ chemistId: other.member.userId }), spec: exampleSpec() }, "header.chemistId", "the chemist must be a member of this group"],
      [{ header: header(), spec: exampleSpec(), links: [{ key: "aniline", compoundId: foreignCompound.id }] }, "links.0.compoundId", "no such compound in this group"],
      [{ header: header(), spec: exampleSpec(), links: [{ key: "nope", compoundId: null }] }, "links.0.key", "no component 'nope' in the spec"],
    ];
    for (const [input, field, message] of cases) {
      const error = await rejection(createWorkup(t.db, lab.member, input));
      expect(error, field).toBeInstanceOf(ValidationError);
      expect((error as ValidationError).fieldErrors[field], field).toContain(message);
    }
    expect(await footprint(t.db)).toEqual(before);
  });

  it("answers another group's workup with 404 for read, update and delete, writing nothing", async () => {
    const theirs = await createWorkup(t.db, other.member, { header: header({ title: "Birch only" }), spec: exampleSpec() });
    const before = await footprint(t.db);
    await expect(getWorkupDetail(t.db, lab.groupId, theirs.id)).rejects.toBeInstanceOf(NotFoundError);
    await expect(updateWorkup(t.db, lab.lead, theirs.id, { header: header(), spec: exampleSpec(), baseVersion: 1 })).rejects.toThrow("No such workup.");
    await expect(deleteWorkup(t.db, lab.lead, theirs.id)).rejects.toBeInstanceOf(NotFoundError);
    expect(await footprint(t.db)).toEqual(before);
  });

  describe("delete", () => {
    it("removes versions, predictions and outcome, and keeps an audit event with the title", async () => {
      const saved = await createWorkup(t.db, lab.member, { header: header({ title: "To be deleted" }), spec: exampleSpec() });
      await deleteWorkup(t.db, lab.lead, saved.id);
      expect(await t.db.workup.count({ where: { id: saved.id } })).toBe(0);
      expect(await t.db.workupVersion.count({ where: { workupId: saved.id } })).toBe(0);
      expect(await t.db.prediction.count({ where: { workupId: saved.id } })).toBe(0);
      const event = await t.db.auditEvent.findFirstOrThrow({ where: { entityId: saved.id, action: "workup.delete" } });
      expect(event.details).toMatchObject({ title: "To be deleted", version: 1 });
    });
  });
});
