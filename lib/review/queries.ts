/**
 * Loads the workups with a reported outcome for the review page, scoped by group and filtered. Everything a view
 * needs comes from the Workup row and the stored outcome analysis (predicted and reported recovery, interval,
 * causes); the spec is read only for the solvent system and the kinds of operation.
 */
import { resolveLibrary } from "@/lib/chem/library";
import { type SolventProps } from "@/lib/chem/data/solvents";
import { type Db } from "@/lib/db/client";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { groupLibrary } from "@/lib/workups/library";
import { type ReviewRow } from "./aggregate";
import { type ReviewFilters } from "./filters";
import { chemistFilterFor, type Viewer } from "./people";

/** Most workups one review shows; a meeting narrows the dates rather than scroll past this. */
export const MAX_REVIEW_ROWS = 2000;

export interface ReviewData {
  rows: ReviewRow[];
  truncated: boolean;
  /** Chemists this viewer may filter by (a lead: every member; anyone else: themselves). */
  chemists: { id: string; name: string }[];
  names: Map<string, string>;
  solvents: { key: string; name: string }[];
  /** Set when a filter was dropped because this viewer may not use it. */
  notice: string | null;
}

type RawOp = { type?: unknown; solvent?: unknown };

function operationsOf(spec: unknown): RawOp[] {
  const ops = (spec as { operations?: unknown } | null)?.operations;
  return Array.isArray(ops) ? (ops as RawOp[]) : [];
}

/** The organic solvent of the workup's main separation: the first extraction's, else the first water-immiscible solvent. */
export function solventSystemOf(spec: unknown, solventKeys: readonly string[], solvents: Readonly<Record<string, SolventProps>>): string | null {
  const extract = operationsOf(spec).find((op) => op.type === "extract" && typeof op.solvent === "string");
  if (extract) return String(extract.solvent).toLowerCase();
  return solventKeys.find((k) => solvents[k]?.waterMiscible === false && k !== "water") ?? null;
}

function percent(fraction: number | null | undefined): number | null {
  return fraction === null || fraction === undefined ? null : fraction * 100;
}

export async function loadReview(db: Db, viewer: Viewer, requested: ReviewFilters): Promise<ReviewData> {
  const { chemist, notice } = chemistFilterFor(viewer, requested.chemist);
  const filters = { ...requested, chemist };
  const [library, workups, members, usedSolvents] = await Promise.all([
    groupLibrary(db, viewer.groupId),
    db.workup.findMany({
      where: {
        groupId: viewer.groupId,
        outcome: { isNot: null },
        ...(filters.from || filters.to
          ? { performedOn: { ...(filters.from ? { gte: new Date(`${filters.from}T00:00:00Z`) } : {}), ...(filters.to ? { lte: new Date(`${filters.to}T00:00:00Z`) } : {}) } }
          : {}),
        ...(filters.chemist ? { chemistId: filters.chemist } : {}),
        ...(filters.solvent ? { solventKeys: { has: filters.solvent } } : {}),
      },
      orderBy: [{ performedOn: "desc" }, { id: "desc" }],
      take: MAX_REVIEW_ROWS + 1,
      select: {
        id: true, title: true, performedOn: true, chemistId: true, solventKeys: true, spec: true, status: true, flagged: true, deviationPct: true,
        outcome: { select: { analysis: true } },
      },
    }),
    db.membership.findMany({ where: { groupId: viewer.groupId }, select: { user: { select: { id: true, name: true } } }, orderBy: { user: { name: "asc" } } }),
    db.$queryRaw<{ key: string }[]>`SELECT DISTINCT unnest("solventKeys") AS key FROM "Workup" WHERE "groupId" = ${viewer.groupId} ORDER BY key`,
  ]);
  const solvents = resolveLibrary(library).solvents;
  const rows: ReviewRow[] = workups.slice(0, MAX_REVIEW_ROWS).map((w) => {
    const a = (w.outcome?.analysis ?? {}) as Partial<OutcomeAnalysis>;
    return {
      id: w.id, title: w.title, performedOn: w.performedOn.toISOString().slice(0, 10), chemistId: w.chemistId,
      solventSystem: solventSystemOf(w.spec, w.solventKeys, solvents),
      operationTypes: [...new Set(operationsOf(w.spec).map((op) => (typeof op.type === "string" ? op.type : "")).filter(Boolean))].sort(),
      status: w.status, flagged: w.flagged, deviationPct: w.deviationPct,
      predicted: percent(a.predicted?.recovery), low: percent(a.predicted?.low), high: percent(a.predicted?.high), reported: percent(a.reported?.recovery),
      causes: (a.causes ?? []).slice(0, 3).map((c) => ({ title: c.title, share: c.fractionOfGap })),
      dangerFlags: a.dangerFlags ?? [],
      quantile: typeof a.predictive?.quantile === "number" ? a.predictive.quantile : null,
    };
  });
  const names = new Map(members.map((m) => [m.user.id, m.user.name]));
  return {
    rows,
    truncated: workups.length > MAX_REVIEW_ROWS,
    chemists: members.map((m) => m.user).filter((u) => viewer.isLead || u.id === viewer.userId),
    names,
    solvents: usedSolvents.filter((s) => solvents[s.key]?.waterMiscible === false).map((s) => ({ key: s.key, name: solvents[s.key]?.name ?? s.key })),
    notice,
  };
}
