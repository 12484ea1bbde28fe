/**
 * Reporting what was recovered. The outcome is compared with the prediction of the workup's current version; the
 * comparison (recovery, deviation, status, likely causes) is stored with the outcome, and status, deviation and the
 * review flag are mirrored on the Workup row for the list and the dashboard. While the version's interval is still
 * being computed (lib/jobs/interval.ts) the outcome is stored unjudged ("inconclusive", marked as waiting for the
 * interval); the interval job judges it when the interval is written.
 */
import { type Db } from "@/lib/db/client";
import { ConflictError, NotFoundError, ValidationError, parseInput, type FieldErrors } from "@/lib/errors";
import { type Flag } from "@/lib/chem/types";
import { type WorkupInput } from "@/lib/chem/schema";
import { groupValuesForLinks } from "@/lib/partition/group-values";
import { applyGroupValues } from "@/lib/partition/overlay";
import { analyzeOutcome, type OutcomeAnalysis, type PredictionFacts } from "./analysis";
import { audit } from "./audit";
import { type Actor } from "./context";
import { loadGroupJudgement } from "./group-model";
import { groupLibrary } from "./library";
import { asJson } from "./persist";
import { parseSpec, type StoredPredictionResult } from "./prediction";
import { outcomeInputSchema, type OutcomeInput } from "./schemas";

export interface OutcomeReport {
  workupId: string;
  workupVersion: number;
  /** Reported recovery, percent; null without a reference amount. */
  recoveryPct: number | null;
  analysis: OutcomeAnalysis;
}

/** Layer assays must name a step of the workup and one of its components. */
function checkAssays(outcome: OutcomeInput, spec: WorkupInput): void {
  const fields: FieldErrors = {};
  const keys = new Set(spec.components.map((c) => c.key));
  outcome.layerAssays.forEach((assay, i) => {
    if (assay.step > spec.operations.length) fields[`layerAssays.${i}.step`] = [`the workup has ${spec.operations.length} steps`];
    if (assay.compoundKey !== undefined && !keys.has(assay.compoundKey)) fields[`layerAssays.${i}.compoundKey`] = [`no component '${assay.compoundKey}' in the spec`];
  });
  if (Object.keys(fields).length > 0) throw new ValidationError(fields);
}

function flagsOf(result: unknown): Flag[] {
  const flags = (result as Partial<StoredPredictionResult> | null)?.prediction?.flags;
  return Array.isArray(flags) ? flags : [];
}

/** Upper bound on re-reads when the workup is saved again while the outcome is being compared. */
const ATTEMPTS = 3;

export async function reportOutcome(db: Db, actor: Actor, workupId: string, input: unknown): Promise<OutcomeReport> {
  const outcome = parseInput(outcomeInputSchema, input);
  for (let attempt = 0; attempt < ATTEMPTS; attempt++) {
    const workup = await db.workup.findFirst({
      where: { id: workupId, groupId: actor.groupId },
      select: {
        version: true, intervalState: true, spec: true, assayedProductMmol: true, expectedProductMmol: true, chemistId: true,
        components: { where: { groupId: actor.groupId }, select: { key: true, compoundId: true } },
        predictions: {
          orderBy: [{ workupVersion: "desc" }, { createdAt: "desc" }], take: 1,
          select: { workupVersion: true, engineVersion: true, productRecovery: true, recoveryLow: true, recoveryHigh: true, result: true },
        },
      },
    });
    if (!workup) throw new NotFoundError("workup");
    const library = await groupLibrary(db, actor.groupId);
    // The causes are re-runs of the prediction, so they start from the same input: the group's values overlaid.
    const spec = applyGroupValues(parseSpec(workup.spec, library, "spec", true), await groupValuesForLinks(db, actor.groupId, workup.components));
    checkAssays(outcome, spec);
    const stored = workup.predictions[0];
    const prediction: PredictionFacts | null = stored
      ? { ...stored, productKey: (stored.result as Partial<StoredPredictionResult> | null)?.prediction?.productKey ?? null, flags: flagsOf(stored.result) }
      : null;
    const judgement = await loadGroupJudgement(db, actor.groupId, workupId);
    const analysis = analyzeOutcome({
      outcome, header: workup, spec, prediction, library, model: judgement.model, causeFrequencies: judgement.causeFrequencies,
      intervalPending: workup.intervalState === "pending",
    });
    const recoveryPct = analysis.reported ? analysis.reported.recovery * 100 : null;
    const written = await db.$transaction(async (tx) => {
      // The interval state too: an interval written meanwhile means this judgement is out of date (read again).
      const { count } = await tx.workup.updateMany({
        where: { id: workupId, groupId: actor.groupId, version: workup.version, intervalState: workup.intervalState },
        data: { status: analysis.deviation.status, deviationPct: analysis.deviation.deviationPct, flagged: analysis.flagged },
      });
      if (count === 0) return false; // saved again or its interval written meanwhile: compare with the newer prediction
      const data = {
        isolatedMassMg: outcome.isolatedMassMg, purityPct: outcome.purityPct ?? null, purityMethod: outcome.purityMethod,
        layerAssays: asJson(outcome.layerAssays), notes: outcome.notes, recoveryPct, analysis: asJson(analysis), reportedById: actor.userId,
      };
      await tx.outcome.upsert({ where: { workupId }, create: { ...data, groupId: actor.groupId, workupId }, update: data, select: { id: true } });
      await audit(tx, actor, "workup.outcome", workupId, {
        version: workup.version, recoveryPct, status: analysis.deviation.status, deviationPct: analysis.deviation.deviationPct,
      });
      return true;
    });
    if (written) return { workupId, workupVersion: workup.version, recoveryPct, analysis };
  }
  throw new ConflictError("The workup was saved again several times while the outcome was being recorded. Try again.");
}
