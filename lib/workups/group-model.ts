/**
 * Loads what a judgement learns from the group's history: every other reported outcome of the group (scoped by
 * group), with the cause the group found where it recorded one. Per-chemist offsets are not used for the stored
 * judgement, which every member of the group sees: a review shows per-person figures only to the person and the
 * group lead (lib/review/people.ts). The save path, the outcome report, the CSV import and the background
 * re-prediction all judge with this one model.
 */
import { fitGroupModel, type GroupModel } from "@/lib/chem/predictive";
import { type Db } from "@/lib/db/client";
import { type CauseCode } from "./causes";
import { causeFrequencies, historyCaseOf } from "./judgement-history";

export interface GroupJudgement {
  model: GroupModel;
  causeFrequencies: Record<CauseCode, number>;
}

/** The group's stored outcome analyses, newest first, with the workup each belongs to. */
export interface GroupHistory {
  rows: readonly { workupId: string; analysis: unknown; foundCause: string | null }[];
}

/** Most past outcomes one judgement reads: the newest, plenty for means with a handful of parameters. */
const HISTORY_LIMIT = 2000;

/** One read of the group's history; one more row than a judgement uses, so any one workup can be left out. */
export async function loadGroupHistory(db: Pick<Db, "outcome">, groupId: string): Promise<GroupHistory> {
  const rows = await db.outcome.findMany({
    where: { groupId },
    orderBy: [{ updatedAt: "desc" }, { id: "desc" }],
    take: HISTORY_LIMIT + 1,
    select: { workupId: true, analysis: true, foundCause: true },
  });
  return { rows: rows.map((r) => ({ workupId: r.workupId, analysis: r.analysis, foundCause: r.foundCause })) };
}

/** The model fitted to the history without the judged workup's own outcome (a workup never judges itself). */
export function groupJudgementFrom(history: GroupHistory, excludeWorkupId?: string): GroupJudgement {
  const past = history.rows.filter((r) => r.workupId !== excludeWorkupId).slice(0, HISTORY_LIMIT);
  const cases = past.map((r) => historyCaseOf(r.analysis)).filter((h) => h !== null);
  return { model: fitGroupModel(cases), causeFrequencies: causeFrequencies(past) };
}

export async function loadGroupJudgement(db: Pick<Db, "outcome">, groupId: string, excludeWorkupId?: string): Promise<GroupJudgement> {
  return groupJudgementFrom(await loadGroupHistory(db, groupId), excludeWorkupId);
}
