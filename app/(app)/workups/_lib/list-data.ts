// Loaders of the list page beyond the list itself: choices for the filters and the flagged strip. Scoped by group.
import { type Db } from "@/lib/db/client";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { gapShareWords } from "@/lib/workups/causes";
import { type StoredPredictionResult } from "@/lib/workups/prediction";

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

export async function flaggedWorkups(db: Db, groupId: string): Promise<{ items: FlaggedItem[]; total: number }> {
  const where = { groupId, flagged: true };
  const [rows, total] = await Promise.all([
    db.workup.findMany({
      where,
      orderBy: [{ performedOn: "desc" }, { id: "desc" }],
      take: FLAGGED_SHOWN,
      select: {
        id: true, title: true, performedOn: true, deviationPct: true,
        outcome: { select: { analysis: true } },
        predictions: { orderBy: [{ workupVersion: "desc" }, { createdAt: "desc" }], take: 1, select: { result: true } },
      },
    }),
    db.workup.count({ where }),
  ]);
  const items = rows.map((r) => {
    const analysis = r.outcome?.analysis as unknown as Partial<OutcomeAnalysis> | null; // written by lib/workups/analysis.ts
    const causes = (analysis?.causes ?? []).slice(0, 3).map((c) => ({ title: c.title, detail: gapShareWords(c.fractionOfGap) }));
    const flags = ((r.predictions[0]?.result as unknown as Partial<StoredPredictionResult> | null)?.prediction?.flags ?? [])
      .filter((f) => f.severity === "danger").slice(0, 2).map((f) => ({ title: f.title, detail: f.step !== undefined ? `step ${f.step}` : "" }));
    return { id: r.id, title: r.title, performedOn: r.performedOn, deviationPct: r.deviationPct, reasons: causes.length > 0 ? causes : flags };
  });
  return { items, total };
}
