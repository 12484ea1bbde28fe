import { beforeAll, expect, it } from "vitest";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { scheduleInference } from "@/lib/jobs/infer";
import { drainQueue } from "@/lib/jobs/worker";
import { groupPartitionValues, pooledValues } from "@/lib/partition/group-values";
import { INFERRED_METHOD } from "@/lib/partition/infer-service";
import { addMeasurement, setExclusion } from "@/lib/partition/service";
import { deleteWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { makeAcetanilide, TEST_DRAWS, workupWithOutcome } from "@/tests/integration/jobs/fixtures";

const measurement = (compoundId: string, extra: Record<string, unknown> = {}) => ({
  compoundId, solventKey: "etoac", method: "layer_assay", aqueousPh: 7, basis: "amount", organic: 3, aqueous: 1, organicVolumeMl: 10, aqueousVolumeMl: 10, ...extra,
});

async function fieldErrors(promise: Promise<unknown>) {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ValidationError) return error.fieldErrors;
    throw error;
  }
  return null;
}

describeEachDatabase("partition observations", (t) => {
  let lab: Lab;
  let rival: Lab;
  let compoundId: string;
  beforeAll(async () => {
    lab = await makeLab(t.db, "Bunsen Lab");
    rival = await makeLab(t.db, "Kekulé Lab");
    compoundId = (await makeAcetanilide(t.db, lab.groupId)).id;
  });

  it("stores a layer assay as neutral log K with its se, audits it and pools it into the group value", async () => {
    const added = await addMeasurement(t.db, lab.member, measurement(compoundId, { notes: "both layers by qNMR" }));
    expect(added.logD).toBeCloseTo(Math.log10(3), 12);
    const row = await t.db.partitionObservation.findUniqueOrThrow({ where: { id: added.id } });
    expect(row).toMatchObject({ groupId: lab.groupId, kind: "measured", bound: "value", method: "Layer assay", weight: 1, excluded: false, createdById: lab.member.userId });
    expect(row.logKSe).toBeCloseTo(0.25, 12);
    expect(row.details).toMatchObject({ basis: "amount", organic: 3, aqueous: 1, notes: "both layers by qNMR" });
    expect(await t.db.auditEvent.count({ where: { entityId: added.id, action: "partition.measure", actorId: lab.member.userId } })).toBe(1);
    const values = await groupPartitionValues(t.db, lab.groupId, [compoundId]);
    expect(values.get(compoundId)?.["etoac"]).toMatchObject({ provenance: "group", n: 1, source: "group data, n = 1, ±0.25" });
    await drainQueue(t.db, { kinds: ["revalidate"], schedule: false, draws: TEST_DRAWS });
  });

  it("refuses another group's compound, an unknown solvent and a water-miscible one, naming the field", async () => {
    expect(await fieldErrors(addMeasurement(t.db, rival.member, measurement(compoundId)))).toEqual({ compoundId: ["no such compound in this group"] });
    expect(await fieldErrors(addMeasurement(t.db, lab.member, measurement(compoundId, { solventKey: "unobtainium" })))).toEqual({ solventKey: ["unknown solvent 'unobtainium'"] });
    expect(await fieldErrors(addMeasurement(t.db, lab.member, measurement(compoundId, { solventKey: "meoh" })))).toEqual({ solventKey: ["Methanol mixes with water and forms no second layer"] });
    expect(await fieldErrors(addMeasurement(t.db, lab.member, measurement(compoundId, { totalAmount: 8 })))).toEqual({
      totalAmount: ["the layers account for 50 % of the amount added; outside 90–110 % a measurement should not be used (common practice)"],
    });
  });

  it("lets an exclusion be undone, answers 404 across groups, and does nothing when nothing changes", async () => {
    const added = await addMeasurement(t.db, lab.member, measurement(compoundId, { organic: 50, aqueous: 1 }));
    await expect(setExclusion(t.db, rival.lead, { observationId: added.id, excluded: true })).rejects.toBeInstanceOf(NotFoundError);
    const excluded = await setExclusion(t.db, lab.lead, { observationId: added.id, excluded: true, reason: "emulsion in the layer" });
    expect(excluded.jobId).not.toBeNull();
    expect(await setExclusion(t.db, lab.lead, { observationId: added.id, excluded: true })).toEqual({ jobId: null });
    expect((await pooledValues(t.db, lab.groupId, [compoundId])).get(compoundId)?.get("etoac")?.nTotal).toBe(1);
    await setExclusion(t.db, lab.lead, { observationId: added.id, excluded: false });
    expect((await pooledValues(t.db, lab.groupId, [compoundId])).get(compoundId)?.get("etoac")?.nTotal).toBe(2);
    expect(await t.db.auditEvent.findMany({ where: { entityId: added.id }, orderBy: { createdAt: "asc" }, select: { action: true } }))
      .toEqual([{ action: "partition.measure" }, { action: "partition.exclude" }, { action: "partition.include" }]);
    await drainQueue(t.db, { kinds: ["revalidate"], schedule: false, draws: TEST_DRAWS });
  });

  it("learns from a reported outcome: infers log K, re-validates, and settles without further passes", async () => {
    const kolbe = await makeLab(t.db, "Kolbe Lab");
    const compound = (await makeAcetanilide(t.db, kolbe.groupId)).id;
    const w = await workupWithOutcome(t.db, kolbe, compound, 0.5);
    expect(await scheduleInference(t.db)).toBeGreaterThanOrEqual(1);
    await drainQueue(t.db, { draws: TEST_DRAWS });
    const inferred = await t.db.partitionObservation.findMany({ where: { groupId: kolbe.groupId, kind: "inferred" } });
    expect(inferred).toHaveLength(1);
    expect(inferred[0]).toMatchObject({ compoundId: compound, workupId: w.id, solventKey: "etoac", bound: "value", weight: 0.5, method: INFERRED_METHOD });
    // The reported recovery was made at log K 0.5; qNMR ±3 % and ±5 % volumes give roughly ±0.1.
    expect(Math.abs(inferred[0]!.logK - 0.5)).toBeLessThan(0.02);
    expect(inferred[0]!.logKSe).toBeGreaterThan(0.03);
    expect(inferred[0]!.logKSe).toBeLessThan(0.3);
    const revalidations = await t.db.job.findMany({ where: { groupId: kolbe.groupId, kind: "revalidate" } });
    expect(revalidations.map((j) => j.status)).toEqual(["done"]);
    const row = await t.db.workup.findUniqueOrThrow({ where: { id: w.id } });
    expect(row).toMatchObject({ status: "as_expected", flagged: false });

    // The pass that re-judged the outcome is seen by the next scheduling, re-fits to the same value and stops there.
    await drainQueue(t.db, { draws: TEST_DRAWS });
    expect(await t.db.partitionObservation.findMany({ where: { groupId: kolbe.groupId, kind: "inferred" }, select: { id: true } })).toEqual([{ id: inferred[0]!.id }]);
    expect(await t.db.job.count({ where: { groupId: kolbe.groupId, kind: "revalidate" } })).toBe(1);
    expect(await scheduleInference(t.db)).toBe(0);

    // Deleting the workup drops what was learned from it.
    await deleteWorkup(t.db, kolbe.member, w.id);
    await drainQueue(t.db, { draws: TEST_DRAWS });
    expect(await t.db.partitionObservation.count({ where: { groupId: kolbe.groupId, kind: "inferred" } })).toBe(0);
  });
});
