// Loaders of the list page beyond the list itself: choices for the filters and the flagged strip. Scoped by group.
import { type Db } from "@/lib/db/client";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { gapShareWords } from "@/lib/workups/causes";
import { type WorkupPrediction } from "@/lib/chem/types";

/** Compound filter choices: only compounds some workup uses, by name (a group's registry can be far larger). */
const COMPOUND_CHOICES = 500;
/** Flagged workups shown above the list. */
const FLAGGED_SHOWN = 4;

export async function compoundChoices(db: Db, groupId: string): Promise<{ id: string; name: string }[]> {
  return db.compound.findMany({
    where: { groupId, components: { some: { groupId } } },
    orderBy: [{ name: "asc" }, { id: "asc" }],
    take: COMPOUND_CHOICES,
    select: { id: true, name: true },
  });
}

export interface FlaggedItem {
  id: string;
  title: string;
  performedOn: Date;
  deviationPct: number | null;
  /** Likely causes (ranked) when an outcome fell below; otherwise the danger flags that flag it. */
  reasons: { title: string; detail: string }[];
}

type FlaggedRow = {
  id: string; title: string; performedOn: Date; deviationPct: number | null;
  causes: OutcomeAnalysis["causes"] | null; flags: WorkupPrediction["flags"] | null; total: bigint | number;
};

/**
 * The newest flagged workups with their reasons, and how many there are, in one statement: only the causes of the
 * outcome analysis and the flags of the latest prediction are read, not the stored prediction (tens of kB each).
 */
export async function flaggedWorkups(db: Db, groupId: string): Promise<{ items: FlaggedItem[]; total: number }> {
  const rows = await db.$queryRaw<FlaggedRow[]>`
    SELECT w."id", w."title", w."performedOn", w."deviationPct",
           (SELECT o."analysis" -> 'causes' FROM "Outcome" o WHERE o."workupId" = w."id" AND o."groupId" = w."groupId") AS "causes",
           (SELECT p."result" -> 'prediction' -> 'flags' FROM "Prediction" p WHERE p."workupId" = w."id" AND p."groupId" = w."groupId"
             ORDER BY p."workupVersion" DESC, p."createdAt" DESC LIMIT 1) AS "flags",
           count(*) OVER () AS "total"
      FROM "Workup" w
     WHERE w."groupId" = ${groupId} AND w."flagged"
     ORDER BY w."performedOn" DESC, w."id" DESC
     LIMIT ${FLAGGED_SHOWN}`;
  // causes and flags are written by lib/workups/analysis.ts and lib/workups/prediction.ts.
  const items = rows.map((r) => {
    const causes = (Array.isArray(r.causes) ? r.causes : []).slice(0, 3).map((c) => ({ title: c.title, detail: gapShareWords(c.fractionOfGap) }));
    const flags = (Array.isArray(r.flags) ? r.flags : [])
      .filter((f) => f.severity === "danger").slice(0, 2).map((f) => ({ title: f.title, detail: f.step !== undefined ? `step ${f.step}` : "" }));
    return { id: r.id, title: r.title, performedOn: r.performedOn, deviationPct: r.deviationPct, reasons: causes.length > 0 ? causes : flags };
  });
  return { items, total: Number(rows[0]?.total ?? 0) };
}
