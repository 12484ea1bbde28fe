/**
 * Loads what a judgement learns from the group's history: every other reported outcome of the group (scoped by
 * group). Per-chemist offsets are not used for the stored judgement, which every member of the group sees: a review
 * shows per-person figures only to the person and the group lead (lib/review/people.ts).
 */
import { fitGroupModel, type GroupModel } from "@/lib/chem/predictive";
import { type Db } from "@/lib/db/client";
import { type CauseCode } from "./causes";
import { causeFrequencies, historyCaseOf } from "./judgement-history";

export interface GroupJudgement {
  model: GroupModel;
  causeFrequencies: Record<CauseCode, number>;
}

/** Most past outcomes one judgement reads: the newest, plenty for means with a handful of parameters. */
const HISTORY_LIMIT = 2000;

export async function loadGroupJudgement(db: Pick<Db, "outcome">, groupId: string, excludeWorkupId?: string): Promise<GroupJudgement> {
  const rows = await db.outcome.findMany({
    where: { groupId, ...(excludeWorkupId ? { workupId: { not: excludeWorkupId } } : {}) },
    orderBy: [{ updatedAt: "desc" }, { id: "desc" }],
    take: HISTORY_LIMIT,
    select: { analysis: true },
  });
  const analyses = rows.map((r) => r.analysis as unknown);
  const history = analyses.map(historyCaseOf).filter((h) => h !== null);
  return { model: fitGroupModel(history), causeFrequencies: causeFrequencies(analyses) };
}
