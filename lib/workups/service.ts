/**
 * Saving workups. The server validates with the same schemas as the editor, checks the engine budget of the whole
 * prediction, draws included (lib/workers/engine.ts), recomputes the point prediction on an engine thread, and keeps
 * every edit as a version. The Monte Carlo interval (seeded from the workup id) is left to a background job queued
 * in the save's own transaction (lib/jobs/interval.ts): the saved version's intervalState is "pending" until the job
 * has written it, and an outcome judged meanwhile says so rather than being judged without its interval.
 * An update names the version it was based on; the check and the write are one conditional UPDATE inside one
 * transaction, so two people saving at once cannot both win, and the loser is told who changed the record and when.
 */
import { type Db } from "@/lib/db/client";
import { NotFoundError, parseInput } from "@/lib/errors";
import { type Caution, type Flag } from "@/lib/chem/types";
import { enqueueInterval } from "@/lib/jobs/interval";
import { groupValuesForLinks } from "@/lib/partition/group-values";
import { audit } from "./audit";
import { analyzeOutcome } from "./analysis";
import { loadGroupJudgement } from "./group-model";
import { staleVersionError } from "./conflict";
import { type Actor, type Tx } from "./context";
import { isFlagged, type DeviationStatus } from "./deviation";
import { type IntervalState } from "./interval-state";
import { newRecordId } from "./ids";
import { groupLibrary } from "./library";
import { asJson, checkReferences, writeVersion } from "./persist";
import { seedFromId, SAVE_DRAWS, type ComputedPrediction } from "./prediction";
import { assertEngineBudget, predictOffThread } from "@/lib/workers/engine";
import { wakeJobWorker } from "@/lib/jobs/wake";
import { siteFlags } from "./site-flags";
import { headerColumns, plainJson, searchTextOf, snapshotHeader, solventKeysOf, type WorkupSnapshot } from "./record";
import { createWorkupSchema, updateWorkupSchema, type CreateWorkup } from "./schemas";

export interface PredictionSummary {
  engineVersion: string;
  productKey: string | null;
  /** Fractions 0–1. */
  productRecovery: number | null;
  recoveryLow: number | null;
  recoveryHigh: number | null;
  flags: Flag[];
  cautions: Caution[];
}

export interface SavedWorkup {
  id: string;
  version: number;
  flagged: boolean;
  status: DeviationStatus;
  deviationPct: number | null;
  /** "pending": the interval (recoveryLow/High) is being computed in the background; the workup's own reads show it when done. */
  intervalState: IntervalState;
  prediction: PredictionSummary;
}

export interface SaveOptions {
  /** Monte Carlo draws for the interval computed after the save (default SAVE_DRAWS; 0: no interval). */
  draws?: number;
}

function summary(p: ComputedPrediction): PredictionSummary {
  const { flags, cautions } = p.result.prediction;
  return { engineVersion: p.engineVersion, productKey: p.productKey, productRecovery: p.productRecovery, recoveryLow: p.recoveryLow, recoveryHigh: p.recoveryHigh, flags, cautions };
}

function rawSpecOf(input: unknown) {
  return plainJson((input as { spec?: unknown }).spec);
}

function derived(parsed: CreateWorkup, prediction: ComputedPrediction, compoundNames: string[]) {
  return {
    ...headerColumns(parsed.header),
    searchText: searchTextOf(parsed.header, prediction.parsed, compoundNames),
    solventKeys: solventKeysOf(prediction.parsed),
  };
}

function snapshotOf(parsed: CreateWorkup, input: unknown): WorkupSnapshot {
  return { header: snapshotHeader(parsed.header), spec: rawSpecOf(input), links: parsed.links };
}

/** Creates a workup at version 1 with its prediction. Throws ValidationError (422) for any field problem. */
export async function createWorkup(db: Db, actor: Actor, input: unknown, options: SaveOptions = {}): Promise<SavedWorkup> {
  const parsed = parseInput(createWorkupSchema, input);
  const library = await groupLibrary(db, actor.groupId);
  const id = newRecordId();
  const draws = options.draws ?? SAVE_DRAWS;
  assertEngineBudget(rawSpecOf(input), draws);
  const prediction = await pointPrediction(db, actor, id, input, parsed, library);
  const flagged = isFlagged("unknown", prediction.result.prediction.flags);
  const intervalState: IntervalState = draws > 0 ? "pending" : "ready";
  await db.$transaction(async (tx) => {
    const compoundNames = await checkReferences(tx, actor.groupId, parsed.header, parsed.links);
    await tx.workup.create({
      data: {
        id, groupId: actor.groupId, ...derived(parsed, prediction, compoundNames), spec: asJson(rawSpecOf(input)),
        version: 1, flagged, intervalState, createdById: actor.userId, updatedById: actor.userId,
      },
      select: { id: true },
    });
    await writeVersion(tx, actor, { workupId: id, version: 1, snapshot: snapshotOf(parsed, input), prediction, links: parsed.links });
    if (draws > 0) await enqueueInterval(tx, actor.groupId, { workupId: id, version: 1, draws });
    await audit(tx, actor, "workup.create", id, { title: parsed.header.title, version: 1 });
  });
  wakeJobWorker();
  return { id, version: 1, flagged, status: "unknown", deviationPct: null, intervalState, prediction: summary(prediction) };
}

/** The point prediction (steps, recoveries, flags) on an engine thread, without draws: the interval comes later. */
async function pointPrediction(
  db: Db, actor: Actor, id: string, input: unknown, parsed: CreateWorkup, library: Awaited<ReturnType<typeof groupLibrary>>,
): Promise<ComputedPrediction> {
  return predictOffThread(actor.userId, rawSpecOf(input), {
    library, seed: seedFromId(id), draws: 0, groupValues: await groupValuesForLinks(db, actor.groupId, parsed.links),
    extraFlags: await siteFlags(rawSpecOf(input)),
  });
}

/**
 * Saves a new version. `input.baseVersion` must be the current version; otherwise StaleVersionError (409) names who
 * saved the newer one and when, and nothing is written. Another group's id answers NotFoundError (404).
 */
export async function updateWorkup(db: Db, actor: Actor, id: string, input: unknown, options: SaveOptions = {}): Promise<SavedWorkup> {
  const parsed = parseInput(updateWorkupSchema, input);
  const current = await db.workup.findFirst({ where: { id, groupId: actor.groupId }, select: { version: true } });
  if (!current) throw new NotFoundError("workup");
  if (current.version !== parsed.baseVersion) throw await staleVersionError(db, id, current.version, parsed.baseVersion);
  const draws = options.draws ?? SAVE_DRAWS;
  assertEngineBudget(rawSpecOf(input), draws);
  const library = await groupLibrary(db, actor.groupId);
  const prediction = await pointPrediction(db, actor, id, input, parsed, library);
  const version = parsed.baseVersion + 1;
  const intervalState: IntervalState = draws > 0 ? "pending" : "ready";
  const saved = await db.$transaction(async (tx) => {
    const compoundNames = await checkReferences(tx, actor.groupId, parsed.header, parsed.links);
    const { count } = await tx.workup.updateMany({
      where: { id, groupId: actor.groupId, version: parsed.baseVersion },
      data: { ...derived(parsed, prediction, compoundNames), spec: asJson(rawSpecOf(input)), version, intervalState, updatedById: actor.userId },
    });
    if (count === 0) throw await refusal(tx, actor, id, parsed.baseVersion);
    await writeVersion(tx, actor, { workupId: id, version, snapshot: snapshotOf(parsed, input), prediction, links: parsed.links });
    const state = await refreshOutcome(tx, actor, id, version, parsed, prediction, library, intervalState === "pending");
    if (draws > 0) await enqueueInterval(tx, actor.groupId, { workupId: id, version, draws });
    await audit(tx, actor, "workup.update", id, { title: parsed.header.title, fromVersion: parsed.baseVersion, version });
    return { id, version, ...state, intervalState, prediction: summary(prediction) };
  });
  wakeJobWorker();
  return saved;
}

/** Why a conditional update touched nothing: the record is gone (404) or someone saved first (409). */
async function refusal(tx: Tx, actor: Actor, id: string, baseVersion: number): Promise<Error> {
  const now = await tx.workup.findFirst({ where: { id, groupId: actor.groupId }, select: { version: true } });
  return now ? staleVersionError(tx, id, now.version, baseVersion) : new NotFoundError("workup");
}

/**
 * A reported outcome is compared again with the new version's prediction; the row's status follows. Without its
 * interval yet, the outcome is not judged: "inconclusive" with the analysis marked as waiting for the interval, until
 * the interval job judges it.
 */
async function refreshOutcome(
  tx: Tx, actor: Actor, id: string, version: number, parsed: CreateWorkup, prediction: ComputedPrediction,
  library: Awaited<ReturnType<typeof groupLibrary>>, intervalPending: boolean,
): Promise<{ flagged: boolean; status: DeviationStatus; deviationPct: number | null }> {
  const outcome = await tx.outcome.findFirst({ where: { workupId: id, groupId: actor.groupId }, select: { id: true, isolatedMassMg: true, purityPct: true, purityMethod: true } });
  const flags = prediction.result.prediction.flags;
  let state: { flagged: boolean; status: DeviationStatus; deviationPct: number | null } = { flagged: isFlagged("unknown", flags), status: "unknown", deviationPct: null };
  if (outcome) {
    // Loaded even while the interval is pending: the reported recovery's basis uses the group's reaction-yield figure.
    const judgement = await loadGroupJudgement(tx, actor.groupId, id);
    const analysis = analyzeOutcome({
      outcome, spec: prediction.parsed, library, model: judgement.model, causeFrequencies: judgement.causeFrequencies, intervalPending,
      header: {
        assayedProductMmol: parsed.header.assayedProductMmol ?? null, expectedProductMmol: parsed.header.expectedProductMmol ?? null,
        chemistId: parsed.header.chemistId ?? null,
      },
      prediction: { ...prediction, workupVersion: version, flags },
    });
    await tx.outcome.update({
      where: { id: outcome.id },
      data: { analysis: asJson(analysis), recoveryPct: analysis.reported ? analysis.reported.recovery * 100 : null },
      select: { id: true },
    });
    state = { flagged: analysis.flagged, status: analysis.deviation.status, deviationPct: analysis.deviation.deviationPct };
  }
  await tx.workup.update({ where: { id }, data: state, select: { id: true } });
  return state;
}

/** Deletes a workup with its versions, predictions and outcome; the audit trail keeps its title and last version. */
export async function deleteWorkup(db: Db, actor: Actor, id: string): Promise<void> {
  await db.$transaction(async (tx) => {
    const workup = await tx.workup.findFirst({ where: { id, groupId: actor.groupId }, select: { title: true, version: true } });
    if (!workup) throw new NotFoundError("workup");
    await tx.workup.deleteMany({ where: { id, groupId: actor.groupId } });
    await audit(tx, actor, "workup.delete", id, { title: workup.title, version: workup.version });
  });
}
