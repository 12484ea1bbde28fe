/**
 * Re-predicting stored workups with the group's current values, and bringing their comparison with the outcome,
 * their status, deviation and review flag up to date. The engine runs outside any transaction (it takes a few tenths
 * of a second per workup and yields to the event loop between workups, so the server keeps answering requests); the
 * writes of a batch then go in one transaction with the job's progress. Every write is compare-and-set on the stamps
 * read with the plan: the workup's version and its row stamp (updatedAt, which a reported outcome moves) and the
 * outcome's own updatedAt. A workup saved again meanwhile is left alone (its own save already predicted it with the
 * same values); one whose outcome was reported meanwhile comes back as `stale`, for the caller to plan again from
 * the new outcome, so a background pass never overwrites what a person recorded after it read the row.
 * The same plan and write complete a save's interval (interval.ts): a prediction with its draws marks the version's
 * interval ready.
 */
import { type Prisma } from "@/generated/prisma/client";
import { type Db, type DbTransaction } from "@/lib/db/client";
import { groupValuesForWorkups } from "@/lib/partition/group-values";
import { analyzeOutcome, type OutcomeAnalysis } from "@/lib/workups/analysis";
import { isFlagged, type DeviationStatus } from "@/lib/workups/deviation";
import { groupJudgementFrom, loadGroupHistory } from "@/lib/workups/group-model";
import { groupLibrary } from "@/lib/workups/library";
import { computePrediction, seedFromId, SAVE_DRAWS, type ComputedPrediction, type PredictionOptions } from "@/lib/workups/prediction";
import { siteFlags } from "@/lib/workups/site-flags";
import { jobFailureMessage } from "./messages";

/** Runs the engine for a job: on an engine thread in the app (engine.ts), in place in scripts and tests. */
export type Predictor = (spec: unknown, options: PredictionOptions) => Promise<ComputedPrediction>;

/** The engine on this thread (planRepredictions yields to the event loop between workups). */
export const predictHere: Predictor = (spec, options) => Promise.resolve().then(() => computePrediction(spec, options));

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

export async function planRepredictions(db: Db, groupId: string, workupIds: readonly string[], options: { draws?: number; predict?: Predictor } = {}): Promise<RepredictionPlan> {
  const predict = options.predict ?? predictHere;
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
      // The flags found outside the engine too, as a save stores them (lib/workups/service.ts).
      const computed = await predict(w.spec, {
        library, seed: seedFromId(w.id), draws: options.draws ?? SAVE_DRAWS, groupValues: values.get(w.id) ?? {}, stored: true,
        extraFlags: await siteFlags(w.spec),
      });
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

/** The version's latest prediction if it was stored without its interval (uncertainty null), else null. */
async function predictionAwaitingInterval(tx: DbTransaction, groupId: string, workupId: string, version: number): Promise<string | null> {
  const rows = await tx.$queryRaw<{ id: string; awaiting: boolean }[]>`
    SELECT id, COALESCE(result->'uncertainty', 'null'::jsonb) = 'null'::jsonb AS awaiting FROM "Prediction"
     WHERE "groupId" = ${groupId} AND "workupId" = ${workupId} AND "workupVersion" = ${version}
     ORDER BY "createdAt" DESC, id DESC LIMIT 1`;
  const latest = rows[0];
  return latest?.awaiting ? latest.id : null;
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
      data: { ...p.state, ...(p.computed.result.uncertainty ? { intervalState: "ready" as const } : {}), updatedAt: p.updatedAt },
    });
    if (count === 0) {
      const now = await tx.workup.findFirst({ where: { id: p.workupId, groupId }, select: { version: true } });
      if (now?.version === p.version) stale.push(p.workupId);
      continue;
    }
    applied++;
    if (p.state.flagged !== p.wasFlagged) flagChanges++;
    const data = {
      engineVersion: p.computed.engineVersion, result: asJson(p.computed.result),
      productRecovery: p.computed.productRecovery, recoveryLow: p.computed.recoveryLow, recoveryHigh: p.computed.recoveryHigh,
    };
    // A save stores its version's point prediction and leaves the interval to a job: completed in place, so a
    // version keeps one prediction per save. Otherwise (a re-validation) the new prediction is added beside the old.
    const awaiting = p.computed.result.uncertainty ? await predictionAwaitingInterval(tx, groupId, p.workupId, p.version) : null;
    if (awaiting) await tx.prediction.update({ where: { id: awaiting }, data, select: { id: true } });
    else await tx.prediction.create({ data: { groupId, workupId: p.workupId, workupVersion: p.version, ...data }, select: { id: true } });
    if (p.outcomeId && p.analysis) {
      await tx.outcome.updateMany({
        where: { id: p.outcomeId, groupId, updatedAt: p.outcomeStamp ?? undefined },
        data: { analysis: asJson(p.analysis), recoveryPct: p.analysis.reported ? p.analysis.reported.recovery * 100 : null },
      });
    }
  }
  return { applied, flagChanges, stale };
}

