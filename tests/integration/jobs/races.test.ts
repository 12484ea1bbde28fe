// Background jobs against people working at the same time, on the real databases: a re-prediction planned before an
// outcome was reported must not write over the report; a failing batch is retried with backoff, then the job fails
// with a message fit for every member; a long batch keeps its lease.
import { beforeAll, expect, it } from "vitest";
import { claimJob } from "@/lib/jobs/queue";
import { applyRepredictions, planRepredictions } from "@/lib/jobs/repredict";
import { MAX_BATCH_ATTEMPTS, runJob } from "@/lib/jobs/worker";
import { reportOutcome } from "@/lib/workups/outcome";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { ACETANILIDE, makeAcetanilide, recoveryAt, TEST_DRAWS, workupWithOutcome } from "./fixtures";

/** The qNMR report of a run whose recovery is what the engine gives at log K `logK` (5 mmol assayed, 99 % pure). */
const reportAt = (logK: number) => ({ isolatedMassMg: (recoveryAt(logK) * 5 * ACETANILIDE.molarMass) / 0.99, purityPct: 99, purityMethod: "qnmr" as const });

describeEachDatabase("background jobs never overwrite newer data", (t) => {
  let lab: Lab;
  let compoundId = "";
  beforeAll(async () => {
    lab = await makeLab(t.db, "Bunsen Lab");
    compoundId = (await makeAcetanilide(t.db, lab.groupId)).id;
  });

  it("keeps an outcome reported while a re-prediction was being computed, and predicts again from it", async () => {
    // Reported as the stated log K predicts; the job reads the row and computes …
    const w = await workupWithOutcome(t.db, lab, compoundId, 1.3);
    const planned = await planRepredictions(t.db, lab.groupId, [w.id], { draws: TEST_DRAWS });
    expect(planned.plans).toHaveLength(1);
    // … while a colleague corrects the report to a much lower isolated amount.
    const corrected = await reportOutcome(t.db, lab.member, w.id, reportAt(0.2));
    const afterReport = await t.db.workup.findUniqueOrThrow({ where: { id: w.id }, select: { status: true, deviationPct: true, flagged: true } });
    expect(afterReport.status).toBe("below");

    const applied = await t.db.$transaction((tx) => applyRepredictions(tx, lab.groupId, planned.plans));
    expect(applied).toMatchObject({ applied: 0, stale: [w.id] });
    const row = await t.db.workup.findUniqueOrThrow({ where: { id: w.id }, select: { status: true, deviationPct: true, flagged: true } });
    expect(row).toEqual(afterReport);
    const outcome = await t.db.outcome.findUniqueOrThrow({ where: { workupId: w.id } });
    expect(outcome.recoveryPct).toBeCloseTo(corrected.recoveryPct ?? NaN, 9);

    // Planned again, the job now compares the new prediction with the corrected report.
    const again = await planRepredictions(t.db, lab.groupId, [w.id], { draws: TEST_DRAWS });
    expect(await t.db.$transaction((tx) => applyRepredictions(tx, lab.groupId, again.plans))).toMatchObject({ applied: 1, stale: [] });
    const final = await t.db.workup.findUniqueOrThrow({ where: { id: w.id }, select: { status: true } });
    expect(final.status).toBe("below");
    expect((await t.db.outcome.findUniqueOrThrow({ where: { workupId: w.id } })).recoveryPct).toBeCloseTo(corrected.recoveryPct ?? NaN, 9);
  });

  it("leaves a workup saved again meanwhile alone (not stale: its own save predicted it)", async () => {
    const w = await workupWithOutcome(t.db, lab, compoundId, null, "Saved twice");
    const planned = await planRepredictions(t.db, lab.groupId, [w.id], { draws: TEST_DRAWS });
    await t.db.workup.update({ where: { id: w.id }, data: { version: { increment: 1 } } });
    expect(await t.db.$transaction((tx) => applyRepredictions(tx, lab.groupId, planned.plans))).toMatchObject({ applied: 0, stale: [] });
  });

  it("retries a failing batch with backoff and finishes when it recovers", async () => {
    const job = await t.db.job.create({ data: { groupId: lab.groupId, kind: "revalidate", payload: { compoundIds: [] } } });
    const claimed = (await claimJob(t.db, "retry-worker", { kinds: ["revalidate"] }))!;
    expect(claimed.id).toBe(job.id);
    let calls = 0;
    const result = await runJob(t.db, claimed, {
      retryBaseMs: 1,
      batch: () => { calls++; return calls < 3 ? Promise.reject(new Error("connection terminated unexpectedly")) : Promise.resolve(true); },
    });
    expect(result).toBe("done");
    expect(calls).toBe(3);
  });

  it("fails the job after the last attempt with a message that shows no internals", async () => {
    const job = await t.db.job.create({ data: { groupId: lab.groupId, kind: "revalidate", payload: { compoundIds: [] } } });
    const claimed = (await claimJob(t.db, "failing-worker", { kinds: ["revalidate"] }))!;
    expect(claimed.id).toBe(job.id);
    let calls = 0;
    const secret = 'relation "Workup" does not exist at /srv/layerwise/lib/jobs/repredict.ts:42';
    expect(await runJob(t.db, claimed, { retryBaseMs: 1, batch: () => { calls++; return Promise.reject(new Error(secret)); } })).toBe("failed");
    expect(calls).toBe(MAX_BATCH_ATTEMPTS);
    const row = await t.db.job.findUniqueOrThrow({ where: { id: job.id } });
    expect(row.status).toBe("failed");
    expect(row.error).toMatch(/^Stopped after 4 failed attempts: an unexpected error \(logged on the server as [0-9a-f]{8}\)$/);
    expect(row.error).not.toContain("Workup");
  });

  it("renews the lease on a timer while a long batch runs, so nobody takes the job over", async () => {
    const job = await t.db.job.create({ data: { groupId: lab.groupId, kind: "revalidate", payload: { compoundIds: [] } } });
    const claimed = (await claimJob(t.db, "slow-worker", { kinds: ["revalidate"], leaseSeconds: 1 }))!;
    expect(claimed.id).toBe(job.id);
    let stolen: unknown = "not tried";
    const result = await runJob(t.db, claimed, {
      leaseSeconds: 1,
      batch: async () => {
        // Three lease lengths inside one batch; another worker looks each time a lease would have run out.
        for (let i = 0; i < 3; i++) {
          await new Promise((resolve) => setTimeout(resolve, 1_100));
          const taken = await claimJob(t.db, "thief", { kinds: ["revalidate"], leaseSeconds: 1 });
          stolen = taken?.id === job.id ? taken : null; // another group's queued job may be claimed: not ours
          if (stolen) return true;
        }
        return true;
      },
    });
    expect(stolen).toBeNull();
    expect(result).toBe("done");
  });
});
