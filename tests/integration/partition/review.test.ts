import { beforeAll, expect, it } from "vitest";
import { loadReview } from "@/lib/review/queries";
import { calibrationReport } from "@/lib/review/calibration-report";
import { ValidationError } from "@/lib/errors";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { recoveryAt, workupWithOutcome } from "@/tests/integration/jobs/fixtures";

describeEachDatabase("review queries", (t) => {
  let lab: Lab;
  let rival: Lab;
  const viewer = (who: "member" | "lead") => ({ groupId: lab.groupId, userId: lab[who].userId, isLead: who === "lead" });
  beforeAll(async () => {
    lab = await makeLab(t.db, "Sabatier Lab");
    rival = await makeLab(t.db, "Grignard Lab");
    await workupWithOutcome(t.db, lab, null, 1.3, "September run", { performedOn: "2026-09-03", chemistId: lab.member.userId });
    await workupWithOutcome(t.db, lab, null, 0.5, "October shortfall", { performedOn: "2026-10-07", chemistId: lab.member.userId });
    await workupWithOutcome(t.db, lab, null, 1.3, "Lead's run", { performedOn: "2026-10-20", chemistId: lab.lead.userId });
    await workupWithOutcome(t.db, lab, null, null, "No outcome yet", { performedOn: "2026-10-21", chemistId: lab.member.userId });
    await workupWithOutcome(t.db, rival, null, 0.5, "Another group's run", { performedOn: "2026-10-07", chemistId: rival.member.userId });
  });

  it("reads every workup of the group with an outcome, newest first, with what each view needs", async () => {
    const data = await loadReview(t.db, viewer("member"), {});
    expect(data.rows.map((r) => r.title)).toEqual(["Lead's run", "October shortfall", "September run"]);
    const shortfall = data.rows[1]!;
    expect(shortfall).toMatchObject({ solventSystem: "etoac", operationTypes: ["concentrate", "dry", "extract"], status: "below", flagged: true });
    expect(shortfall.reported).toBeCloseTo(100 * recoveryAt(0.5), 6);
    expect(shortfall.predicted! - shortfall.reported!).toBeCloseTo(-shortfall.deviationPct!, 6);
    expect(shortfall.low).toBeLessThan(shortfall.predicted!);
    expect(shortfall.causes.length).toBeGreaterThan(0);
    expect(data.solvents).toEqual([{ key: "etoac", name: "Ethyl acetate" }]);
    expect(data.truncated).toBe(false);
  });

  it("filters by dates and solvent, and lets only a lead pick out another chemist", async () => {
    expect((await loadReview(t.db, viewer("member"), { from: "2026-10-01", to: "2026-10-10" })).rows.map((r) => r.title)).toEqual(["October shortfall"]);
    expect((await loadReview(t.db, viewer("member"), { solvent: "dcm" })).rows).toEqual([]);
    const refused = await loadReview(t.db, viewer("member"), { chemist: lab.lead.userId });
    expect(refused.rows).toHaveLength(3);
    expect(refused.notice).toMatch(/^Only a group lead/);
    expect(refused.chemists).toEqual([{ id: lab.member.userId, name: lab.member.name }]);
    const lead = await loadReview(t.db, viewer("lead"), { chemist: lab.member.userId });
    expect(lead.rows.map((r) => r.title)).toEqual(["October shortfall", "September run"]);
    expect(lead.notice).toBeNull();
    expect(lead.chemists.map((c) => c.name).sort()).toEqual([lab.lead.name, lab.member.name, lab.viewer.name].sort());
  });

  it("reports how often the intervals held at each level, from the same rows the page shows, and refuses bad filters", async () => {
    const report = await calibrationReport(t.db, viewer("member"), {});
    // Three judged outcomes: the two at the stated log K sit near the predictive median, the shortfall far below it.
    expect(report.n).toBe(3);
    expect(report.levels.map((l) => l.level)).toEqual([0.5, 0.8, 0.9, 0.95, 0.99]);
    const at95 = report.levels.find((l) => l.level === 0.95)!;
    expect(at95.inside).toBe(2);
    expect(report.levels.map((l) => l.inside)).toEqual([...report.levels.map((l) => l.inside)].sort((a, b) => a - b));
    expect(report.flagged).toBe(1);
    const error = await calibrationReport(t.db, viewer("member"), { from: "yesterday" }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ValidationError);
    expect((error as ValidationError).fieldErrors["from"]).toContain("from must be a date written YYYY-MM-DD");
  });

  it("never shows another group's workups, even when asked for its chemist", async () => {
    const data = await loadReview(t.db, viewer("lead"), { chemist: rival.member.userId });
    expect(data.rows).toEqual([]);
    expect([...data.names.values()]).not.toContain(rival.member.name);
  });
});
