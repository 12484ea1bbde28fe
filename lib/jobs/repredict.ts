/**
 * Re-predicting stored workups with the group's current values, and bringing their comparison with the outcome,
 * their status, deviation and review flag up to date. The engine runs outside any transaction (it takes a few tenths
 * of a second per workup and yields to the event loop between workups, so the server keeps answering requests); the
 * writes of a batch then go in one transaction with the job's progress. Every write is compare-and-set on the stamps
 * read with the plan: the workup's version and its row stamp (updatedAt, which a reported outcome moves) and the
 * outcome's own updatedAt. A workup saved again meanwhile is left alone (its own save already predicted it with the
 * same values); one whose outcome was reported meanwhile comes back as `stale`, for the caller to plan again from
 * the new outcome, so a background pass never overwrites what a person recorded after it read the row.
 */
import { type Prisma } from "@/generated/prisma/client";
import { type Db, type DbTransaction } from "@/lib/db/client";
import { groupValuesForWorkups } from "@/lib/partition/group-values";
import { analyzeOutcome, type OutcomeAnalysis } from "@/lib/workups/analysis";
import { isFlagged, type DeviationStatus } from "@/lib/workups/deviation";
import { groupJudgementFrom, loadGroupHistory } from "@/lib/workups/group-model";
import { groupLibrary } from "@/lib/workups/library";
import { computePrediction, seedFromId, SAVE_DRAWS, type ComputedPrediction } from "@/lib/workups/prediction";
import { jobFailureMessage } from "./messages";

export interface Reprediction {
  workupId: string;
  version: number;
  computed: ComputedPrediction;
  outcomeId: string | null;
  analysis: OutcomeAnalysis | null;
  state: { flagged: boolean; status: DeviationStatus; deviationPct: number | null };
  wasFlagged: boolean;
  /** Kept as it was: "last changed" on a workup means a person's edit, not a re-validation. Also the row's stamp. */
  updatedAt: Date;
  /** The outcome's updatedAt when planned (null: no outcome then). */
  outcomeStamp: Date | null;
}

export interface RepredictionPlan {
  plans: Reprediction[];
  failures: { workupId: string; message: string }[];
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function planRepredictions(db: Db, groupId: string, workupIds: readonly string[], options: { draws?: number } = {}): Promise<RepredictionPlan> {
  const library = await groupLibrary(db, groupId);
  const workups = await db.workup.findMany({
    where: { groupId, id: { in: [...workupIds] } },
    orderBy: { id: "asc" },
    select: {
      id: true, version: true, spec: true, flagged: true, updatedAt: true, assayedProductMmol: true, expectedProductMmol: true, chemistId: true,
      components: { where: { groupId }, select: { key: true, compoundId: true } },
      outcome: { select: { id: true, isolatedMassMg: true, purityPct: true, purityMethod: true, updatedAt: true } },
    },
  });
  const values = await groupValuesForWorkups(db, groupId, workups.map((w) => ({ id: w.id, links: w.components })));
  // The same group model as the save path and the outcome report: the group's other outcomes teach the judgement.
  const history = workups.some((w) => w.outcome) ? await loadGroupHistory(db, groupId) : { rows: [] };
  const out: RepredictionPlan = { plans: [], failures: [] };
  for (const w of workups) {
    await yieldToEventLoop();
    try {
      const computed = computePrediction(w.spec, { library, seed: seedFromId(w.id), draws: options.draws ?? SAVE_DRAWS, groupValues: values.get(w.id) ?? {}, stored: true });
      const flags = computed.result.prediction.flags;
      const judgement = w.outcome ? groupJudgementFrom(history, w.id) : null;
      const analysis = w.outcome && judgement
        ? analyzeOutcome({
            outcome: w.outcome, header: w, spec: computed.parsed, library, prediction: { ...computed, workupVersion: w.version, flags },
            model: judgement.model, causeFrequencies: judgement.causeFrequencies,
          })
        : null;
      const state = analysis
        ? { flagged: analysis.flagged, status: analysis.deviation.status, deviationPct: analysis.deviation.deviationPct }
        : { flagged: isFlagged("unknown", flags), status: "unknown" as const, deviationPct: null };
      out.plans.push({
        workupId: w.id, version: w.version, computed, outcomeId: w.outcome?.id ?? null, analysis, state, wasFlagged: w.flagged, updatedAt: w.updatedAt,
        outcomeStamp: w.outcome?.updatedAt ?? null,
      });
    } catch (error) {
      out.failures.push({ workupId: w.id, message: jobFailureMessage(error, `re-predicting workup ${w.id}`) });
    }
  }
  return out;
}

function asJson(value: unknown): Prisma.InputJsonValue {
  return value as Prisma.InputJsonValue; // engine results and analyses are plain JSON
}

export interface AppliedRepredictions {
  applied: number;
  flagChanges: number;
  /** Workups whose outcome was reported (or changed) after the plan read them, at the same version: plan again. */
  stale: string[];
}

/**
 * Writes the plans, each only if the rows are as the plan read them. The workup UPDATE is conditional on the version
 * and the row stamp and takes the row lock, so an outcome report (which writes the workup row first in its own
 * transaction) either committed before, and the stamps differ, or waits until this transaction ends.
 */
export async function applyRepredictions(tx: DbTransaction, groupId: string, plans: readonly Reprediction[]): Promise<AppliedRepredictions> {
  let applied = 0;
  let flagChanges = 0;
  const stale: string[] = [];
  for (const p of plans) {
    // An outcome written without touching the workup row would slip past the row stamp: compare it too.
    const outcomeNow = await tx.outcome.findFirst({ where: { workupId: p.workupId, groupId }, select: { updatedAt: true } });
    if ((outcomeNow?.updatedAt.getTime() ?? null) !== (p.outcomeStamp?.getTime() ?? null)) {
      stale.push(p.workupId);
      continue;
    }
    const { count } = await tx.workup.updateMany({
      where: { id: p.workupId, groupId, version: p.version, updatedAt: p.updatedAt },
      data: { ...p.state, updatedAt: p.updatedAt },
    });
    if (count === 0) {
      const now = await tx.workup.findFirst({ where: { id: p.workupId, groupId }, select: { version: true } });
      if (now?.version === p.version) stale.push(p.workupId);
      continue;
    }
    applied++;
    if (p.state.flagged !== p.wasFlagged) flagChanges++;
    await tx.prediction.create({
      data: {
        groupId, workupId: p.workupId, workupVersion: p.version, engineVersion: p.computed.engineVersion, result: asJson(p.computed.result),
        productRecovery: p.computed.productRecovery, recoveryLow: p.computed.recoveryLow, recoveryHigh: p.computed.recoveryHigh,
      },
      select: { id: true },
    });
    if (p.outcomeId && p.analysis) {
      await tx.outcome.updateMany({
        where: { id: p.outcomeId, groupId, updatedAt: p.outcomeStamp ?? undefined },
        data: { analysis: asJson(p.analysis), recoveryPct: p.analysis.reported ? p.analysis.reported.recovery * 100 : null },
      });
    }
  }
  return { applied, flagChanges, stale };
}

