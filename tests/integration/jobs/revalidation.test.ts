import { beforeAll, expect, it } from "vitest";
import { addMeasurement, setExclusion } from "@/lib/partition/service";
import { claimJob, LeaseLostError } from "@/lib/jobs/queue";
import { countAffectedWorkups, enqueueRevalidation, runRevalidationBatch } from "@/lib/jobs/revalidate";
import { drainQueue, runJob } from "@/lib/jobs/worker";
import { type StoredPredictionResult } from "@/lib/workups/prediction";
import { createWorkup } from "@/lib/workups/service";
import { NO_SITE_FLAG_CODE } from "@/lib/workups/site-flags";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { completeIntervals, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { ACETANILIDE, extractionSpec, makeAcetanilide, TEST_DRAWS, workupWithOutcome } from "./fixtures";

/** A shake-flask result whose log D (= log K, acetanilide has no site ionized near pH 7) is `logK`. */
const shakeFlask = (compoundId: string, logK: number) => ({
  compoundId, solventKey: "etoac", method: "shake_flask", aqueousPh: 7, temperatureC: 25, basis: "concentration", organic: 10 ** logK, aqueous: 1,
});

describeEachDatabase("re-validation when the group's partition data change", (t) => {
  let lab: Lab;
  beforeAll(async () => {
    lab = await makeLab(t.db, "Liebig Lab");
  });

  it("re-predicts the compound's workups with the group value, clears a flag it explains and records provenance", async () => {
    const { id: compoundId } = await makeAcetanilide(t.db, lab.groupId);
    // Reported as if log K(EtOAc) were 0.5, well below the stated 1.3: flagged as a shortfall.
    const w = await workupWithOutcome(t.db, lab, compoundId, 0.5);
    const before = await t.db.workup.findUniqueOrThrow({ where: { id: w.id } });
    expect(before).toMatchObject({ status: "below", flagged: true });
    expect(before.deviationPct).toBeLessThan(-10);
    const unrelated = await workupWithOutcome(t.db, lab, (await t.db.compound.create({
      data: { groupId: lab.groupId, name: "Unrelated", canonicalSmiles: "CCO", formula: "C2H6O", molarMass: 46.07 }, select: { id: true },
    })).id, null, "Workup of another compound");

    const added = await addMeasurement(t.db, lab.member, shakeFlask(compoundId, 0.5));
    expect(added.logK).toBeCloseTo(0.5, 9);
    expect(added.jobId).not.toBeNull();
    const queued = await t.db.job.findUniqueOrThrow({ where: { id: added.jobId! } });
    expect(queued).toMatchObject({ kind: "revalidate", status: "queued", groupId: lab.groupId });

    expect(await drainQueue(t.db, { kinds: ["revalidate"], schedule: false, draws: TEST_DRAWS })).toBe(1);
    const job = await t.db.job.findUniqueOrThrow({ where: { id: added.jobId! } });
    expect(job).toMatchObject({ status: "done", total: 1, done: 1, lockedBy: null });
    expect((job.payload as { flagChanges: number }).flagChanges).toBe(1);

    const after = await t.db.workup.findUniqueOrThrow({ where: { id: w.id }, include: { outcome: true } });
    expect(after).toMatchObject({ status: "as_expected", flagged: false, version: before.version, updatedAt: before.updatedAt });
    expect(Math.abs(after.deviationPct ?? NaN)).toBeLessThan(3);
    const predictions = await t.db.prediction.findMany({ where: { workupId: w.id }, orderBy: { createdAt: "asc" } });
    expect(predictions).toHaveLength(2);
    const latest = predictions[1]!.result as unknown as StoredPredictionResult;
    const source = latest.partition?.find((s) => s.component === "acetanilide" && s.solvent === "etoac");
    expect(source).toMatchObject({ origin: "group", label: "group data, n = 1, ±0.15" });
    expect(source?.logK).toBeCloseTo(0.5, 9);
    const firstSource = (predictions[0]!.result as unknown as StoredPredictionResult).partition?.find((s) => s.solvent === "etoac");
    expect(firstSource?.label).toBe("literature: test value");
    // The other compound's workup was not touched; the audit trail names the pass.
    expect(await t.db.prediction.count({ where: { workupId: unrelated.id } })).toBe(1);
    expect(await t.db.auditEvent.count({ where: { groupId: lab.groupId, action: "workups.revalidate", entityId: job.id } })).toBe(1);

    // A lead excludes the measurement: the structure-based value returns and the shortfall is flagged again.
    const excluded = await setExclusion(t.db, lab.lead, { observationId: added.id, excluded: true, reason: "wrong layer assayed" });
    await drainQueue(t.db, { kinds: ["revalidate"], schedule: false, draws: TEST_DRAWS });
    expect((await t.db.job.findUniqueOrThrow({ where: { id: excluded.jobId! } })).status).toBe("done");
    expect(await t.db.workup.findUniqueOrThrow({ where: { id: w.id } })).toMatchObject({ status: "below", flagged: true });
  });

  it("folds changes into a job that has not started, and counts only workups of the named compounds", async () => {
    const group = (await makeLab(t.db, "Wöhler Lab")).groupId;
    const a = await makeAcetanilide(t.db, group);
    const first = await enqueueRevalidation(t.db, group, { compoundIds: [a.id], reason: "first" });
    const second = await enqueueRevalidation(t.db, group, { compoundIds: ["c-other", a.id], reason: "second" });
    expect(second).toBe(first);
    const job = await t.db.job.findUniqueOrThrow({ where: { id: first! } });
    expect(job.payload).toMatchObject({ compoundIds: [a.id, "c-other"].sort(), reasons: ["first", "second"] });
    expect(await countAffectedWorkups(t.db, group, [a.id])).toBe(0);
    expect(await enqueueRevalidation(t.db, group, { compoundIds: [] })).toBeNull();
    await drainQueue(t.db, { kinds: ["revalidate"], schedule: false });
    expect(await t.db.job.findUniqueOrThrow({ where: { id: first! } })).toMatchObject({ status: "done", total: 0 });
  });

  it("resumes after a worker stops mid-job: the lease expires, another worker takes over and no batch is applied twice", async () => {
    const perkin = await makeLab(t.db, "Perkin Lab");
    const groupId = perkin.groupId;
    const { id: compoundId } = await makeAcetanilide(t.db, groupId);
    const ids: string[] = [];
    for (let i = 0; i < 7; i++) ids.push((await workupWithOutcome(t.db, perkin, compoundId, 0.3, `Run ${i + 1}`)).id);
    const jobId = await enqueueRevalidation(t.db, groupId, { compoundIds: [compoundId], reason: "test pass" });

    const crashed = (await claimJob(t.db, "worker-a", { kinds: ["revalidate"] }))!;
    expect(crashed.id).toBe(jobId);
    expect(await runRevalidationBatch(t.db, crashed, { draws: TEST_DRAWS, batchSize: 3 })).toBe(false);
    // worker-a stops here without releasing its lease. While the lease runs, nobody else may take the job.
    expect(await claimJob(t.db, "worker-b", { kinds: ["revalidate"] })).toBeNull();
    const midway = await t.db.job.findUniqueOrThrow({ where: { id: jobId! } });
    expect(midway).toMatchObject({ status: "running", lockedBy: "worker-a", done: 3, total: 7 });

    // Time passes beyond the lease.
    await t.db.$executeRaw`UPDATE "Job" SET "lockedAt" = now() - interval '10 minutes' WHERE id = ${jobId}`;
    const taken = (await claimJob(t.db, "worker-b", { kinds: ["revalidate"] }))!;
    expect(taken).toMatchObject({ id: jobId, takenOver: true, done: 3, total: 7 });

    // The first worker comes back to life: its next batch is refused and rolled back.
    const predictionsBefore = await t.db.prediction.count({ where: { workupId: { in: ids } } });
    await expect(runRevalidationBatch(t.db, crashed, { draws: TEST_DRAWS, batchSize: 3 })).rejects.toBeInstanceOf(LeaseLostError);
    expect(await t.db.prediction.count({ where: { workupId: { in: ids } } })).toBe(predictionsBefore);

    expect(await runJob(t.db, taken, { draws: TEST_DRAWS })).toBe("done");
    const finished = await t.db.job.findUniqueOrThrow({ where: { id: jobId! } });
    expect(finished).toMatchObject({ status: "done", done: 7, total: 7 });
    expect((finished.payload as { takeovers?: number }).takeovers).toBe(1);
    // Every workup: its save's prediction plus exactly one from the pass.
    for (const id of ids) expect(await t.db.prediction.count({ where: { workupId: id } })).toBe(2);
  });

  it("gives two workers claiming at once two different jobs (FOR UPDATE SKIP LOCKED)", async () => {
    const labX = await makeLab(t.db, "Hofmann Lab");
    const x = await t.db.job.create({ data: { groupId: labX.groupId, kind: "revalidate", payload: { compoundIds: [] } } });
    const y = await t.db.job.create({ data: { groupId: labX.groupId, kind: "revalidate", payload: { compoundIds: [] } } });
    const claims = await Promise.all([claimJob(t.db, "w1", { kinds: ["revalidate"] }), claimJob(t.db, "w2", { kinds: ["revalidate"] })]);
    expect(new Set(claims.map((c) => c?.id))).toEqual(new Set([x.id, y.id]));
    expect(await claimJob(t.db, "w3", { kinds: ["revalidate"] })).toBeNull();
    for (const c of claims) expect(await runJob(t.db, c!, { draws: TEST_DRAWS })).toBe("done");
  });

  it("keeps the flags a save finds outside the engine (an O–H no site class covers) when it predicts again", async () => {
    const own = await makeLab(t.db, "Wöhler Lab"); // a group of its own: its acetanilide is the group's only one
    const { id: compoundId } = await makeAcetanilide(t.db, own.groupId);
    // Dimethyl phosphate: a strong acid (pKa ≈ 1.3, CRC Handbook, from memory) that no site class covers, so the save
    // flags it (lib/workups/site-flags.ts). M = 126.05 g/mol for C2H7O4P (IUPAC standard atomic weights).
    const spec = extractionSpec();
    spec.components.push({
      key: "dmp", name: "Dimethyl phosphate", role: "byproduct", smiles: "COP(=O)(O)OC", molarMass: 126.05, amount: { value: 0.5, unit: "mmol" },
      logP: { value: -0.6, provenance: "estimated", source: "test value" }, pKas: [],
    });
    const saved = await createWorkup(t.db, own.member, { header: header({ title: "With an unrecognised O–H" }), spec, links: [{ key: ACETANILIDE.key, compoundId }] }, { draws: TEST_DRAWS });
    const flagCodes = async () => {
      const latest = await t.db.prediction.findFirstOrThrow({ where: { workupId: saved.id }, orderBy: { createdAt: "desc" } });
      return (latest.result as unknown as StoredPredictionResult).prediction.flags.map((f) => f.code);
    };
    expect(saved.prediction.flags.map((f) => f.code)).toContain(NO_SITE_FLAG_CODE);
    await completeIntervals(t.db); // the save's interval job predicts it again with its draws
    expect(await flagCodes()).toContain(NO_SITE_FLAG_CODE);
    await addMeasurement(t.db, own.member, shakeFlask(compoundId, 0.8));
    expect(await drainQueue(t.db, { kinds: ["revalidate"], schedule: false, draws: TEST_DRAWS })).toBe(1);
    expect(await t.db.prediction.count({ where: { workupId: saved.id } })).toBe(2);
    expect(await flagCodes()).toContain(NO_SITE_FLAG_CODE);
  });
});
