// The inference job against a colleague reporting at the same time, on the real databases: a fit planned from an
// outcome that is corrected before the fit is written must not be written (it would replace the group's value with
// one from a report that no longer stands); the next pass fits the corrected report.
import { beforeAll, expect, it } from "vitest";
import { applyInferenceBatch, planInferenceBatch, scheduleInference } from "@/lib/jobs/infer";
import { claimJob } from "@/lib/jobs/queue";
import { drainQueue } from "@/lib/jobs/worker";
import { planInferences, type InferencePlan } from "@/lib/partition/infer-service";
import { reportOutcome } from "@/lib/workups/outcome";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { ACETANILIDE, makeAcetanilide, recoveryAt, workupWithOutcome } from "./fixtures";

/** The qNMR report of a run whose recovery is what the engine gives at log K `logK` (5 mmol assayed, 99 % pure). */
const reportAt = (logK: number) => ({ isolatedMassMg: (recoveryAt(logK) * 5 * ACETANILIDE.molarMass) / 0.99, purityPct: 99, purityMethod: "qnmr" as const });

const fitOf = (plan: InferencePlan | undefined): number => (plan?.inference?.use ? plan.inference.logK : NaN);

describeEachDatabase("inference never writes a fit of a report that changed meanwhile", (t) => {
  let lab: Lab;
  let compoundId = "";
  beforeAll(async () => {
    lab = await makeLab(t.db, "Liebig Lab");
    compoundId = (await makeAcetanilide(t.db, lab.groupId)).id;
  });

  it("skips the outcome corrected between the fit and its write, then fits the correction in the next pass", async () => {
    // Reported as log K 0.4 gives (well below the stated 1.3); the pass reads it and fits …
    const w = await workupWithOutcome(t.db, lab, compoundId, 0.4);
    expect(await scheduleInference(t.db)).toBe(1);
    const job = (await claimJob(t.db, "infer-race", { kinds: ["infer"] }))!;
    const planned = await planInferenceBatch(t.db, job);
    expect(planned.plans.map((p) => [p.workupId, p.inference?.use])).toEqual([[w.id, true]]);
    expect(fitOf(planned.plans[0])).toBeCloseTo(0.4, 1);

    // … while a colleague corrects the report: the run gave what log K 1.0 gives.
    await reportOutcome(t.db, lab.member, w.id, reportAt(1.0));
    expect(await applyInferenceBatch(t.db, job, planned)).toBe(false);
    expect(await t.db.partitionObservation.count({ where: { groupId: lab.groupId, workupId: w.id } })).toBe(0);

    // The pass ends; the next one fits the corrected report.
    expect(await applyInferenceBatch(t.db, job, await planInferenceBatch(t.db, job))).toBe(true);
    await drainQueue(t.db, { kinds: ["infer"] });
    const stored = await t.db.partitionObservation.findMany({ where: { groupId: lab.groupId, workupId: w.id }, select: { logK: true, kind: true } });
    expect(stored).toHaveLength(1);
    expect(stored[0]?.kind).toBe("inferred");
    // The fit of the report as it now stands, well away from the stale one.
    const current = fitOf((await planInferences(t.db, lab.groupId, [w.id]))[0]);
    expect(stored[0]?.logK).toBeCloseTo(current, 9);
    expect(Math.abs(current - fitOf(planned.plans[0]))).toBeGreaterThan(0.2);
  });
});
