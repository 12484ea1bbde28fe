import { beforeAll, expect, it } from "vitest";
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import { type WorkupInput, type WorkupInputRaw } from "@/lib/chem/schema";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { reportOutcome } from "@/lib/workups/outcome";
import { createWorkup, updateWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { acetanilideSpec, footprint, header, makeLab, type Lab } from "./fixtures";

const ACETANILIDE_G_PER_MOL = 135.17; // as written in acetanilideSpec

/**
 * Three EtOAc extractions with a measured-looking log K (value chosen for the test, not from literature): the
 * interval is narrow enough that a shortfall falls clearly below it.
 */
function measuredSpec(): WorkupInputRaw {
  const spec = acetanilideSpec(3);
  spec.components[0]!.logK = { etoac: { value: 0.9, provenance: "measured", se: 0.05, source: "test value" } };
  return spec;
}

function parsed(spec: WorkupInputRaw): WorkupInput {
  const checked = validateWorkup(spec);
  if (!checked.success) throw new Error(JSON.stringify(checked.issues));
  return checked.data;
}

/** mg of acetanilide that give `recovery` of the 5 mmol expected. */
const massFor = (recovery: number) => recovery * 5 * ACETANILIDE_G_PER_MOL;

describeEachDatabase("outcomes, deviation and likely causes", (t) => {
  let lab: Lab;
  let other: Lab;
  beforeAll(async () => {
    lab = await makeLab(t.db, "Claisen Lab");
    other = await makeLab(t.db, "Diels Lab");
  });

  async function saved(spec = measuredSpec(), overrides: Record<string, unknown> = {}) {
    return createWorkup(t.db, lab.member, { header: header({ title: "Acetanilide extraction", ...overrides }), spec });
  }

  it("computes recovery from mass × purity / (M × expected amount) and calls it as expected inside the interval", async () => {
    const w = await saved();
    const predicted = w.prediction.productRecovery!;
    const mass = massFor(predicted) / 0.98;
    const report = await reportOutcome(t.db, lab.member, w.id, { isolatedMassMg: mass, purityPct: 98, purityMethod: "qnmr" });
    expect(report.recoveryPct).toBeCloseTo((mass * 0.98) / (ACETANILIDE_G_PER_MOL * 5) * 100, 9);
    expect(report.analysis.reported).toMatchObject({ basis: "expected", referenceMmol: 5, purityAssumed: false });
    expect(report.analysis.deviation.status).toBe("as_expected");
    expect(report.analysis.deviation.deviationPct).toBeCloseTo(0, 6);
    expect(report.analysis.causes).toEqual([]);
    const row = await t.db.workup.findUniqueOrThrow({ where: { id: w.id }, include: { outcome: true } });
    expect(row).toMatchObject({ status: "as_expected", flagged: w.flagged });
    expect(row.outcome).toMatchObject({ purityMethod: "qnmr", purityPct: 98, reportedById: lab.member.userId });
    expect((row.outcome!.analysis as unknown as OutcomeAnalysis).deviation.status).toBe("as_expected");
    expect(await t.db.auditEvent.count({ where: { entityId: w.id, action: "workup.outcome" } })).toBe(1);
  });

  it("uses the assayed amount before the workup as the reference when there is one", async () => {
    const w = await saved(measuredSpec(), { assayedProductMmol: 4 });
    const report = await reportOutcome(t.db, lab.member, w.id, { isolatedMassMg: 270.34, purityPct: 100, purityMethod: "hplc" });
    expect(report.analysis.reported).toMatchObject({ basis: "assayed", referenceMmol: 4 });
    expect(report.recoveryPct).toBeCloseTo((270.34 / ACETANILIDE_G_PER_MOL / 4) * 100, 9);
  });

  it("flags a shortfall below the interval, with deviation = reported − predicted, and ranks the causes", async () => {
    const w = await saved();
    const predicted = w.prediction.productRecovery!;
    const reported = 0.5;
    expect(reported).toBeLessThan(w.prediction.recoveryLow!);
    const report = await reportOutcome(t.db, lab.member, w.id, { isolatedMassMg: massFor(reported), purityPct: null, purityMethod: "weight_only" });
    expect(report.analysis.reported?.purityAssumed).toBe(true);
    expect(report.analysis.deviation.status).toBe("below");
    expect(report.analysis.deviation.deviationPct).toBeCloseTo((reported - predicted) * 100, 6);
    expect(report.analysis.flagged).toBe(true);
    const scores = report.analysis.causes.map((c) => c.score);
    expect(scores.length).toBeGreaterThan(1);
    expect([...scores].sort((a, b) => b - a)).toEqual(scores);
    const row = await t.db.workup.findUniqueOrThrow({ where: { id: w.id } });
    expect(row).toMatchObject({ status: "below", flagged: true });
    expect(row.deviationPct).toBeCloseTo((reported - predicted) * 100, 6);
  });

  it("ranks first the cause whose parameter change reproduces the reported recovery", async () => {
    const base = parsed(measuredSpec());
    const lowerLogK = structuredClone(base);
    const product = lowerLogK.components[0]!;
    product.logP!.value -= 1;
    product.logK["etoac"]!.value -= 1;
    const fewer = structuredClone(base);
    const extract = fewer.operations[0]!;
    if (extract.type !== "extract") throw new Error("the first step is the extraction");
    extract.portions -= 1;
    for (const [variant, code] of [[lowerLogK, "product_logp_lower"], [fewer, "one_fewer_extraction"]] as const) {
      const reported = simulateWorkup(variant).recovery["acetanilide"]!;
      const w = await saved();
      const report = await reportOutcome(t.db, lab.member, w.id, { isolatedMassMg: massFor(reported), purityPct: 100, purityMethod: "qnmr" });
      expect(report.analysis.deviation.status, code).toBe("below");
      const [top] = report.analysis.causes;
      expect(top?.code).toBe(code);
      expect(top?.fractionOfGap).toBeCloseTo(1, 6);
      expect(top?.score).toBeCloseTo(1, 6);
    }
  });

  it("calls a recovery above the interval 'above' without causes, and re-judges the outcome when the workup is edited", async () => {
    const w = await saved();
    const report = await reportOutcome(t.db, lab.member, w.id, { isolatedMassMg: massFor(0.96), purityPct: 100, purityMethod: "gc" });
    expect(report.analysis.deviation.status).toBe("above");
    expect(report.analysis.causes).toEqual([]);
    // Six extractions instead of three: the prediction rises to meet the same outcome.
    const spec = measuredSpec();
    (spec.operations[0] as { portions: number }).portions = 6;
    const edited = await updateWorkup(t.db, lab.member, w.id, { header: header({ title: "Acetanilide extraction" }), spec, baseVersion: 1 });
    expect(edited.status).toBe("as_expected");
    const outcome = await t.db.outcome.findUniqueOrThrow({ where: { workupId: w.id } });
    expect((outcome.analysis as unknown as OutcomeAnalysis)).toMatchObject({ workupVersion: 2, deviation: { status: "as_expected" } });
  });

  it("refuses bad outcomes and another group's workup, writing nothing", async () => {
    const w = await saved();
    const theirs = await createWorkup(t.db, other.member, { header: header(), spec: measuredSpec() });
    const before = await footprint(t.db);
    const cases: [unknown, string, string][] = [
      [{ isolatedMassMg: -1, purityPct: 90, purityMethod: "qnmr" }, "isolatedMassMg", "isolatedMassMg must be ≥ 0 mg"],
      [{ isolatedMassMg: 100, purityMethod: "hplc" }, "purityPct", "purityPct is required when the purity was measured by hplc"],
      [{ isolatedMassMg: 100, purityPct: 101, purityMethod: "qnmr" }, "purityPct", "purityPct must be ≤ 100"],
      [{ isolatedMassMg: 100, purityPct: 90, purityMethod: "tlc" }, "purityMethod", "purityMethod must be one of qnmr, hplc, gc, weight_only"],
      [{ isolatedMassMg: 100, purityPct: 90, purityMethod: "qnmr", layerAssays: [{ step: 9, phase: "aqueous", amountMmol: 0.1 }] }, "layerAssays.0.step", "the workup has 3 steps"],
    ];
    for (const [input, field, message] of cases) {
      const error = await reportOutcome(t.db, lab.member, w.id, input).catch((e: unknown) => e);
      expect(error, field).toBeInstanceOf(ValidationError);
      expect((error as ValidationError).fieldErrors[field], field).toContain(message);
    }
    await expect(reportOutcome(t.db, lab.member, theirs.id, { isolatedMassMg: 100, purityPct: 90, purityMethod: "qnmr" })).rejects.toBeInstanceOf(NotFoundError);
    expect(await footprint(t.db)).toEqual(before);
  });
});
