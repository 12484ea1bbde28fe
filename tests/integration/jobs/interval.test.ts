// A save's Monte Carlo interval, computed after the save by the job queue, on the real databases: the save answers
// with the point prediction and a queued job; running the job fills the interval and judges any outcome; an edit or
// an outcome report made while the job computes is never overwritten; an engine that keeps failing leaves the
// interval "failed", not "pending" for ever.
import { beforeAll, expect, it } from "vitest";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { predictOnEngineThread } from "@/lib/jobs/engine";
import { claimJob } from "@/lib/jobs/queue";
import { predictHere, type Predictor } from "@/lib/jobs/repredict";
import { setWorkerWake } from "@/lib/jobs/wake";
import { runJob, startWorker } from "@/lib/jobs/worker";
import { closeEnginePool } from "@/lib/workers/pool";
import { computePrediction, seedFromId, type StoredPredictionResult } from "@/lib/workups/prediction";
import { reportOutcome } from "@/lib/workups/outcome";
import { getWorkupDetail, listWorkups } from "@/lib/workups/queries";
import { createWorkup, updateWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { completeIntervals, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { ACETANILIDE, extractionSpec, recoveryAt, TEST_DRAWS } from "./fixtures";

/** The qNMR report of a run whose recovery is what the engine gives at log K `logK` (5 mmol assayed, 99 % pure). */
const reportAt = (logK: number) => ({ isolatedMassMg: (recoveryAt(logK) * 5 * ACETANILIDE.molarMass) / 0.99, purityPct: 99, purityMethod: "qnmr" as const });

describeEachDatabase("a save's interval, computed in the background", (t) => {
  let lab: Lab;
  beforeAll(async () => {
    lab = await makeLab(t.db, "Hofmann Lab");
  });

  const save = (title: string) =>
    createWorkup(t.db, lab.member, { header: header({ title, assayedProductMmol: 5 }), spec: extractionSpec() }, { draws: TEST_DRAWS });
  const predictions = (workupId: string) =>
    t.db.prediction.findMany({ where: { workupId }, orderBy: [{ workupVersion: "asc" }, { createdAt: "asc" }] });
  const row = (id: string) =>
    t.db.workup.findUniqueOrThrow({ where: { id }, select: { version: true, title: true, status: true, flagged: true, deviationPct: true, intervalState: true, updatedAt: true } });

  it("answers the save with the point prediction, no interval, and the interval's job queued", async () => {
    const saved = await save("Saved, interval pending");
    expect(saved).toMatchObject({ version: 1, intervalState: "pending", prediction: { productKey: "acetanilide", recoveryLow: null, recoveryHigh: null } });
    expect(saved.prediction.productRecovery).toBeCloseTo(recoveryAt(1.3), 9);
    const [stored, ...more] = await predictions(saved.id);
    expect(more).toEqual([]);
    expect(stored).toMatchObject({ workupVersion: 1, recoveryLow: null, recoveryHigh: null });
    expect((stored!.result as unknown as StoredPredictionResult).uncertainty).toBeNull();
    const jobs = await t.db.job.findMany({ where: { groupId: lab.groupId, kind: "interval", status: "queued" } });
    expect(jobs.map((j) => j.payload)).toContainEqual({ workupId: saved.id, version: 1, draws: TEST_DRAWS });
    // Every read says so.
    expect((await getWorkupDetail(t.db, lab.groupId, saved.id)).intervalState).toBe("pending");
    const listed = (await listWorkups(t.db, lab.groupId, { q: "interval pending" })).rows;
    expect(listed).toEqual([expect.objectContaining({ id: saved.id, intervalState: "pending", predictedLowPct: null, predictedHighPct: null })]);
    await completeIntervals(t.db);
  });

  it("fills the interval when the job runs: the engine's draws with the id's seed, the row's edit stamp kept", async () => {
    const saved = await save("Interval filled");
    const before = await row(saved.id);
    expect(await completeIntervals(t.db)).toBe(1);
    const after = await row(saved.id);
    expect(after).toEqual({ ...before, intervalState: "ready" });
    // The save's own prediction row, completed in place: one prediction per saved version.
    const [full, ...more] = await predictions(saved.id);
    expect(more).toEqual([]);
    expect(full!.productRecovery).toBeCloseTo(saved.prediction.productRecovery!, 12);
    const uncertainty = (full!.result as unknown as StoredPredictionResult).uncertainty;
    expect(uncertainty).toMatchObject({ draws: TEST_DRAWS, seed: seedFromId(saved.id) });
    const again = computePrediction(extractionSpec(), { library: {}, seed: seedFromId(saved.id), draws: TEST_DRAWS });
    expect(full!.recoveryLow).toBeCloseTo(again.recoveryLow!, 12);
    expect(full!.recoveryHigh).toBeCloseTo(again.recoveryHigh!, 12);
    expect(full!.recoveryLow!).toBeLessThan(full!.recoveryHigh!);
    const detail = await getWorkupDetail(t.db, lab.groupId, saved.id);
    expect(detail).toMatchObject({ intervalState: "ready", prediction: { workupVersion: 1, recoveryLow: full!.recoveryLow, recoveryHigh: full!.recoveryHigh } });
    const job = await t.db.job.findFirstOrThrow({ where: { kind: "interval", payload: { path: ["workupId"], equals: saved.id } } });
    expect(job).toMatchObject({ status: "done", payload: { result: "written" } });
  });

  it("never overwrites an edit saved while the job was computing; the edit's own job fills the newer version", async () => {
    const v1 = await save("Edited during the draws");
    const job = (await claimJob(t.db, "racing-worker", { kinds: ["interval"] }))!;
    expect(job.payload).toMatchObject({ workupId: v1.id, version: 1 });
    let edited = false;
    // A colleague saves version 2 (four extractions) while the draws of version 1 run.
    const racing: Predictor = async (spec, options) => {
      const computed = await predictHere(spec, options);
      if (!edited) {
        edited = true;
        const spec2 = extractionSpec();
        (spec2.operations[0] as { portions: number }).portions = 4;
        await updateWorkup(t.db, lab.lead, v1.id, { header: header({ title: "Edited: four extractions", assayedProductMmol: 5 }), spec: spec2, baseVersion: 1 }, { draws: TEST_DRAWS });
      }
      return computed;
    };
    expect(await runJob(t.db, job, { predict: racing })).toBe("done");
    expect(edited).toBe(true);
    expect(await row(v1.id)).toMatchObject({ version: 2, title: "Edited: four extractions", intervalState: "pending" });
    // Version 1's interval was computed but not written; version 2 has its point prediction only.
    expect((await predictions(v1.id)).map((p) => [p.workupVersion, p.recoveryLow === null])).toEqual([[1, true], [2, true]]);
    expect((await t.db.job.findUniqueOrThrow({ where: { id: job.id } })).payload).toMatchObject({ result: "superseded" });

    await completeIntervals(t.db);
    expect(await row(v1.id)).toMatchObject({ version: 2, title: "Edited: four extractions", intervalState: "ready" });
    const last = (await predictions(v1.id)).at(-1)!;
    expect(last.workupVersion).toBe(2);
    expect(last.recoveryLow).not.toBeNull();
    expect((last.result as unknown as StoredPredictionResult).prediction.steps.length).toBe(3);
  });

  it("stores an outcome reported before the interval unjudged ('inconclusive'), and judges it when the interval arrives", async () => {
    const saved = await save("Reported while pending");
    const report = await reportOutcome(t.db, lab.member, saved.id, reportAt(0.2));
    expect(report.analysis).toMatchObject({ intervalPending: true, deviation: { status: "inconclusive", deviationPct: null }, causes: [], flagged: false, predicted: null });
    expect(report.analysis.reported?.recovery).toBeCloseTo(recoveryAt(0.2), 6);
    expect(await row(saved.id)).toMatchObject({ status: "inconclusive", flagged: false, deviationPct: null, intervalState: "pending" });

    await completeIntervals(t.db);
    // Judged against the interval: a log K of 0.2 instead of the stated 1.3 is a clear shortfall.
    expect(await row(saved.id)).toMatchObject({ status: "below", flagged: true, intervalState: "ready" });
    const outcome = await t.db.outcome.findUniqueOrThrow({ where: { workupId: saved.id } });
    const analysis = outcome.analysis as unknown as OutcomeAnalysis;
    expect(analysis.intervalPending).toBeUndefined();
    expect(analysis.deviation.status).toBe("below");
    expect(analysis.causes.length).toBeGreaterThan(0);
    expect(outcome.recoveryPct).toBeCloseTo(report.recoveryPct!, 9);
  });

  it("judges an outcome reported while the draws ran against that report, not the one the job first read", async () => {
    const saved = await save("Reported during the draws");
    await reportOutcome(t.db, lab.member, saved.id, reportAt(1.3));
    const job = (await claimJob(t.db, "racing-worker", { kinds: ["interval"] }))!;
    let corrected: Awaited<ReturnType<typeof reportOutcome>> | null = null;
    const racing: Predictor = async (spec, options) => {
      const computed = await predictHere(spec, options);
      corrected ??= await reportOutcome(t.db, lab.member, saved.id, reportAt(0.2));
      return computed;
    };
    expect(await runJob(t.db, job, { predict: racing })).toBe("done");
    expect(corrected!.analysis.intervalPending).toBe(true);
    expect(await row(saved.id)).toMatchObject({ status: "below", flagged: true, intervalState: "ready" });
    const outcome = await t.db.outcome.findUniqueOrThrow({ where: { workupId: saved.id } });
    expect(outcome.recoveryPct).toBeCloseTo(corrected!.recoveryPct!, 9);
    expect((outcome.analysis as unknown as OutcomeAnalysis).deviation.status).toBe("below");
  });

  it("marks the interval 'failed' when the engine keeps failing, keeps the edit stamp, and a new save tries again", async () => {
    const saved = await save("Engine keeps failing");
    const before = await row(saved.id);
    const job = (await claimJob(t.db, "failing-worker", { kinds: ["interval"] }))!;
    const failing: Predictor = () => Promise.reject(new Error("engine thread exited with code 1"));
    expect(await runJob(t.db, job, { predict: failing, retryBaseMs: 0 })).toBe("failed");
    expect(await row(saved.id)).toEqual({ ...before, intervalState: "failed" });
    expect((await t.db.job.findUniqueOrThrow({ where: { id: job.id } })).status).toBe("failed");
    // Judged without an interval, as for a prediction that has none: against the wide fallback band, and said so.
    const report = await reportOutcome(t.db, lab.member, saved.id, reportAt(1.3));
    expect(report.analysis.intervalPending).toBeUndefined();
    expect(report.analysis.deviation.fallbackBand).toBe(true);

    await updateWorkup(t.db, lab.member, saved.id, { header: header({ title: "Engine keeps failing, saved again", assayedProductMmol: 5 }), spec: extractionSpec(), baseVersion: 1 }, { draws: TEST_DRAWS });
    expect((await row(saved.id)).intervalState).toBe("pending");
    await completeIntervals(t.db);
    expect(await row(saved.id)).toMatchObject({ version: 2, intervalState: "ready", status: "as_expected" });
  });

  it("runs the draws on the process's engine threads in the app's worker, woken by the save", async () => {
    let onThread = 0;
    const counted: Predictor = (spec, options) => {
      onThread++;
      return predictOnEngineThread(spec, options);
    };
    const worker = startWorker(() => Promise.resolve(t.db), { predict: counted, kinds: ["interval"], idleMs: 120_000, scheduleEveryMs: 3_600_000, log: () => {} });
    setWorkerWake(worker.wake); // as lib/jobs/app-worker.ts does in the app
    try {
      // The worker is idle (two minutes between polls): only the save's wake gets the job run within the wait below.
      await new Promise((resolve) => setTimeout(resolve, 200));
      const saved = await save("On an engine thread");
      const deadline = Date.now() + 45_000;
      while ((await row(saved.id)).intervalState !== "ready" && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 100));
      expect((await row(saved.id)).intervalState).toBe("ready");
      const full = (await predictions(saved.id)).at(-1)!;
      const again = computePrediction(extractionSpec(), { library: {}, seed: seedFromId(saved.id), draws: TEST_DRAWS });
      expect(full.recoveryLow).toBeCloseTo(again.recoveryLow!, 12);
      expect(onThread).toBe(1);
    } finally {
      setWorkerWake(undefined);
      await worker.stop();
      await closeEnginePool();
    }
  });
});
