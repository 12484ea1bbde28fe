/**
 * Loads the workups with a reported outcome for the review page, scoped by group and filtered. Everything a view
 * needs comes from the Workup row and the stored outcome analysis (predicted and reported recovery, interval,
 * causes); the spec is read only for the solvent system and the kinds of operation.
 */
import { Prisma } from "@/generated/prisma/client";
import { resolveLibrary } from "@/lib/chem/library";
import { type SolventProps } from "@/lib/chem/data/solvents";
import { type Db } from "@/lib/db/client";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { type DeviationStatus } from "@/lib/workups/deviation";
import { storedFoundCause } from "@/lib/workups/found-cause-schema";
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

/**
 * The organic solvent of the workup's main separation: the first extraction's (`extractSolvent`, read from the spec
 * by the query below), else the first water-immiscible solvent.
 */
export function solventSystemOf(extractSolvent: string | null, solventKeys: readonly string[], solvents: Readonly<Record<string, SolventProps>>): string | null {
  if (extractSolvent !== null) return extractSolvent.toLowerCase();
  return solventKeys.find((k) => solvents[k]?.waterMiscible === false && k !== "water") ?? null;
}

function percent(fraction: number | null | undefined): number | null {
  return fraction === null || fraction === undefined ? null : fraction * 100;
}

type ReviewRecord = {
  id: string; title: string; performedOn: Date; chemistId: string | null; solventKeys: string[]; status: DeviationStatus;
  flagged: boolean; deviationPct: number | null; analysis: unknown; operationTypes: string[]; extractSolvent: string | null;
  foundCause: string | null; foundCauseNote: string;
};

/**
 * The group's workups with an outcome, newest first, each with its outcome analysis, in one statement. Of the spec only
 * what the views use is read (the kinds of operation, and the first extraction's solvent), not the whole document.
 */
function reviewRows(db: Db, groupId: string, filters: ReviewFilters): Promise<ReviewRecord[]> {
  const operations = Prisma.sql`jsonb_array_elements(CASE WHEN jsonb_typeof(w."spec" -> 'operations') = 'array' THEN w."spec" -> 'operations' ELSE '[]'::jsonb END)`;
  return db.$queryRaw<ReviewRecord[]>`
    SELECT w."id", w."title", w."performedOn", w."chemistId", w."solventKeys", w."status"::text AS "status", w."flagged",
           w."deviationPct", o."analysis", o."foundCause", o."foundCauseNote",
           ARRAY(SELECT DISTINCT op ->> 'type' FROM ${operations} AS op
                  WHERE jsonb_typeof(op -> 'type') = 'string' AND op ->> 'type' <> '') AS "operationTypes",
           (SELECT e.op ->> 'solvent' FROM ${operations} WITH ORDINALITY AS e(op, n)
             WHERE e.op ->> 'type' = 'extract' AND jsonb_typeof(e.op -> 'solvent') = 'string' ORDER BY e.n LIMIT 1) AS "extractSolvent"
      FROM "Workup" w
      JOIN "Outcome" o ON o."workupId" = w."id" AND o."groupId" = w."groupId"
     WHERE w."groupId" = ${groupId}
       ${filters.from ? Prisma.sql`AND w."performedOn" >= ${new Date(`${filters.from}T00:00:00Z`)}` : Prisma.empty}
       ${filters.to ? Prisma.sql`AND w."performedOn" <= ${new Date(`${filters.to}T00:00:00Z`)}` : Prisma.empty}
       ${filters.chemist ? Prisma.sql`AND w."chemistId" = ${filters.chemist}` : Prisma.empty}
       ${filters.solvent ? Prisma.sql`AND ${filters.solvent} = ANY(w."solventKeys")` : Prisma.empty}
     ORDER BY w."performedOn" DESC, w."id" DESC
     LIMIT ${MAX_REVIEW_ROWS + 1}`;
}

function foundOf(cause: string | null, note: string): ReviewRow["foundCause"] {
  const found = storedFoundCause(cause);
  return found ? { cause: found, note } : null;
}

export async function loadReview(db: Db, viewer: Viewer, requested: ReviewFilters): Promise<ReviewData> {
  const { chemist, notice } = chemistFilterFor(viewer, requested.chemist);
  const filters = { ...requested, chemist };
  const [library, workups, members, usedSolvents] = await Promise.all([
    groupLibrary(db, viewer.groupId),
    reviewRows(db, viewer.groupId, filters),
    // Members by name in one statement (the membership as an EXISTS).
    db.user.findMany({ where: { memberships: { some: { groupId: viewer.groupId } } }, select: { id: true, name: true }, orderBy: { name: "asc" } }),
    db.$queryRaw<{ key: string }[]>`SELECT DISTINCT unnest("solventKeys") AS key FROM "Workup" WHERE "groupId" = ${viewer.groupId} ORDER BY key`,
  ]);
  const solvents = resolveLibrary(library).solvents;
  const rows: ReviewRow[] = workups.slice(0, MAX_REVIEW_ROWS).map((w) => {
    const a = (w.analysis ?? {}) as Partial<OutcomeAnalysis>;
    return {
      id: w.id, title: w.title, performedOn: w.performedOn.toISOString().slice(0, 10), chemistId: w.chemistId,
      solventSystem: solventSystemOf(w.extractSolvent, w.solventKeys, solvents),
      operationTypes: [...w.operationTypes].sort(),
      status: w.status, flagged: w.flagged, deviationPct: w.deviationPct,
      predicted: percent(a.predicted?.recovery), low: percent(a.predicted?.low), high: percent(a.predicted?.high), reported: percent(a.reported?.recovery),
      causes: (a.causes ?? []).slice(0, 3).map((c) => ({ title: c.title, share: c.fractionOfGap })),
      dangerFlags: a.dangerFlags ?? [],
      quantile: typeof a.predictive?.quantile === "number" ? a.predictive.quantile : null,
      foundCause: foundOf(w.foundCause, w.foundCauseNote),
    };
  });
  const names = new Map(members.map((m) => [m.id, m.name]));
  return {
    rows,
    truncated: workups.length > MAX_REVIEW_ROWS,
    chemists: members.filter((u) => viewer.isLead || u.id === viewer.userId),
    names,
    solvents: usedSolvents.filter((s) => solvents[s.key]?.waterMiscible === false).map((s) => ({ key: s.key, name: solvents[s.key]?.name ?? s.key })),
    notice,
  };
}
