import { beforeAll, expect, it } from "vitest";
import { planRepredictions } from "@/lib/jobs/repredict";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { makeAcetanilide, TEST_DRAWS, workupWithOutcome } from "./fixtures";

describeEachDatabase("the background re-prediction judges with the group's history", (t) => {
  let lab: Lab;
  beforeAll(async () => {
    lab = await makeLab(t.db, "Hofmann Lab");
  });

  it("re-judges an outcome with the same group model as the outcome report, not the priors alone", async () => {
    const { id: compoundId } = await makeAcetanilide(t.db, lab.groupId);
    // A group whose extractions of this compound consistently give what a log K of 0.6 would (the spec states 1.3):
    // the first outcomes, judged on the priors alone, fall under the interval; the group's own outcomes then teach
    // the model the repeated error of this family of workups, so the later ones are as expected.
    const workups = [];
    for (let i = 0; i < 8; i++) workups.push(await workupWithOutcome(t.db, lab, compoundId, 0.6, `Acetanilide into EtOAc #${i + 1}`));
    const last = workups.at(-1)!;
    const stored = await t.db.workup.findUniqueOrThrow({ where: { id: last.id }, include: { outcome: true } });
    const reported = stored.outcome!.analysis as unknown as OutcomeAnalysis;
    expect(reported.predictive?.historyN).toBe(7);
    const first = await t.db.workup.findUniqueOrThrow({ where: { id: workups[0]!.id } });
    expect(first.status).toBe("inconclusive");
    expect(stored.status).toBe("as_expected");

    const { plans, failures } = await planRepredictions(t.db, lab.groupId, [last.id], { draws: TEST_DRAWS });
    expect(failures).toEqual([]);
    const plan = plans[0]!;
    // Nothing changed in the group's values: the re-judgement is the report's own, history and all.
    expect(plan.analysis?.predictive?.historyN).toBe(7);
    expect(plan.analysis?.predictive?.case.assay).toBe("qnmr");
    expect(plan.analysis?.predictive?.logMean).toBeCloseTo(reported.predictive!.logMean, 9);
    expect(plan.analysis?.predictive?.logSd).toBeCloseTo(reported.predictive!.logSd, 9);
    expect(plan.state).toEqual({ flagged: stored.flagged, status: "as_expected", deviationPct: stored.deviationPct });

    // The first workup, re-judged now, learns from the seven that came after it.
    const again = (await planRepredictions(t.db, lab.groupId, [workups[0]!.id], { draws: TEST_DRAWS })).plans[0]!;
    expect(again.analysis?.predictive?.historyN).toBe(7);
    expect(again.state.status).toBe("as_expected");
  });
});
