/**
 * Saving workups. The server validates with the same schemas as the editor, recomputes the prediction (point +
 * Monte Carlo interval, seeded from the workup id) on an engine thread after checking the engine budget
 * (lib/workers/engine.ts), and keeps every edit as a version. An update names the version
 * it was based on; the check and the write are one conditional UPDATE inside one transaction, so two people saving
 * at once cannot both win, and the loser is told who changed the record and when.
 */
import { type Db } from "@/lib/db/client";
import { NotFoundError, parseInput } from "@/lib/errors";
import { type Caution, type Flag } from "@/lib/chem/types";
import { groupValuesForLinks } from "@/lib/partition/group-values";
import { audit } from "./audit";
import { analyzeOutcome } from "./analysis";
import { loadGroupJudgement } from "./group-model";
import { staleVersionError } from "./conflict";
import { type Actor, type Tx } from "./context";
import { isFlagged, type DeviationStatus } from "./deviation";
import { newRecordId } from "./ids";
import { groupLibrary } from "./library";
import { asJson, checkReferences, writeVersion } from "./persist";
import { seedFromId, SAVE_DRAWS, type ComputedPrediction } from "./prediction";
import { assertEngineBudget, predictOffThread } from "@/lib/workers/engine";
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
  prediction: PredictionSummary;
}

export interface SaveOptions {
  /** Monte Carlo draws for the interval (default SAVE_DRAWS). */
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
  assertEngineBudget(rawSpecOf(input), options.draws ?? SAVE_DRAWS);
  const prediction = await predictOffThread(actor.userId, rawSpecOf(input), {
    library, seed: seedFromId(id), draws: options.draws ?? SAVE_DRAWS, groupValues: await groupValuesForLinks(db, actor.groupId, parsed.links),
    extraFlags: await siteFlags(rawSpecOf(input)),
  });
  const flagged = isFlagged("unknown", prediction.result.prediction.flags);
  await db.$transaction(async (tx) => {
    const compoundNames = await checkReferences(tx, actor.groupId, parsed.header, parsed.links);
    await tx.workup.create({
      data: {
        id, groupId: actor.groupId, ...derived(parsed, prediction, compoundNames), spec: asJson(rawSpecOf(input)),
        version: 1, flagged, createdById: actor.userId, updatedById: actor.userId,
      },
      select: { id: true },
    });
    await writeVersion(tx, actor, { workupId: id, version: 1, snapshot: snapshotOf(parsed, input), prediction, links: parsed.links });
    await audit(tx, actor, "workup.create", id, { title: parsed.header.title, version: 1 });
  });
  return { id, version: 1, flagged, status: "unknown", deviationPct: null, prediction: summary(prediction) };
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
  assertEngineBudget(rawSpecOf(input), options.draws ?? SAVE_DRAWS);
  const library = await groupLibrary(db, actor.groupId);
  const prediction = await predictOffThread(actor.userId, rawSpecOf(input), {
    library, seed: seedFromId(id), draws: options.draws ?? SAVE_DRAWS, groupValues: await groupValuesForLinks(db, actor.groupId, parsed.links),
    extraFlags: await siteFlags(rawSpecOf(input)),
  });
  const version = parsed.baseVersion + 1;
  return db.$transaction(async (tx) => {
    const compoundNames = await checkReferences(tx, actor.groupId, parsed.header, parsed.links);
    const { count } = await tx.workup.updateMany({
      where: { id, groupId: actor.groupId, version: parsed.baseVersion },
      data: { ...derived(parsed, prediction, compoundNames), spec: asJson(rawSpecOf(input)), version, updatedById: actor.userId },
    });
    if (count === 0) throw await refusal(tx, actor, id, parsed.baseVersion);
    await writeVersion(tx, actor, { workupId: id, version, snapshot: snapshotOf(parsed, input), prediction, links: parsed.links });
    const state = await refreshOutcome(tx, actor, id, version, parsed, prediction, library);
    await audit(tx, actor, "workup.update", id, { title: parsed.header.title, fromVersion: parsed.baseVersion, version });
    return { id, version, ...state, prediction: summary(prediction) };
  });
}

/** Why a conditional update touched nothing: the record is gone (404) or someone saved first (409). */
async function refusal(tx: Tx, actor: Actor, id: string, baseVersion: number): Promise<Error> {
  const now = await tx.workup.findFirst({ where: { id, groupId: actor.groupId }, select: { version: true } });
  return now ? staleVersionError(tx, id, now.version, baseVersion) : new NotFoundError("workup");
}

/** A reported outcome is compared again with the new version's prediction; the row's status follows. */
async function refreshOutcome(
  tx: Tx, actor: Actor, id: string, version: number, parsed: CreateWorkup, prediction: ComputedPrediction,
  library: Awaited<ReturnType<typeof groupLibrary>>,
): Promise<{ flagged: boolean; status: DeviationStatus; deviationPct: number | null }> {
  const outcome = await tx.outcome.findFirst({ where: { workupId: id, groupId: actor.groupId }, select: { id: true, isolatedMassMg: true, purityPct: true, purityMethod: true } });
  const flags = prediction.result.prediction.flags;
  let state: { flagged: boolean; status: DeviationStatus; deviationPct: number | null } = { flagged: isFlagged("unknown", flags), status: "unknown", deviationPct: null };
  if (outcome) {
    const judgement = await loadGroupJudgement(tx, actor.groupId, id);
    const analysis = analyzeOutcome({
      outcome, spec: prediction.parsed, library, model: judgement.model, causeFrequencies: judgement.causeFrequencies,
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
