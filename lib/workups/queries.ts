/**
 * Reading workups: the filtered list with keyset pagination on (performedOn desc, id asc), the order of the
 * (groupId, performedOn desc, id) indexes, so a deep page costs what the first does; and the detail the editor
 * opens. Every query is scoped by group inside its `where`.
 */
import { type Prisma } from "@/generated/prisma/client";
import { type Db } from "@/lib/db/client";
import { NotFoundError, ValidationError, parseInput } from "@/lib/errors";
import { type OutcomeAnalysis } from "./analysis";
import { type DeviationStatus } from "./deviation";
import { storedFoundCause, type FoundCause } from "./found-cause-schema";
import { type IntervalState } from "./interval-state";
import { type StoredPredictionResult } from "./prediction";
import { dayOf, type JsonObject, type SnapshotHeader } from "./record";
import { EARLIEST_DAY, LATEST_DAY, workupListFilterSchema, type WorkupListFilter } from "./schemas";

export interface ListCursor {
  performedOn: Date;
  id: string;
}

export function encodeCursor(c: ListCursor): string {
  return Buffer.from(`${c.performedOn.toISOString()}|${c.id}`).toString("base64url");
}

export function decodeCursor(raw: string): ListCursor {
  const match = /^(\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z)\|([A-Za-z0-9_-]{1,64})$/.exec(Buffer.from(raw, "base64url").toString());
  const performedOn = match?.[1] ? new Date(match[1]) : null;
  const day = match?.[1]?.slice(0, 10) ?? "";
  if (!match?.[2] || !performedOn || Number.isNaN(performedOn.getTime()) || day < EARLIEST_DAY || day > LATEST_DAY) {
    throw new ValidationError({ cursor: ["this page link is not valid; start again from the first page"] });
  }
  return { performedOn, id: match[2] };
}

/** The filter part of the list query (also used by the CSV export). */
export function workupWhere(groupId: string, filter: Omit<WorkupListFilter, "cursor" | "limit">): Prisma.WorkupWhereInput {
  const words = (filter.q ?? "").toLowerCase().split(/\s+/).filter((w) => w.length > 0).slice(0, 8);
  const performedOn: Prisma.DateTimeFilter = {};
  if (filter.from) performedOn.gte = filter.from;
  if (filter.to) performedOn.lte = filter.to;
  return {
    groupId,
    ...(words.length > 0 ? { AND: words.map((w) => ({ searchText: { contains: w } })) } : {}),
    ...(filter.compoundId ? { components: { some: { groupId, compoundId: filter.compoundId } } } : {}),
    ...(filter.solvent ? { solventKeys: { has: filter.solvent } } : {}),
    ...(filter.chemistId ? { chemistId: filter.chemistId } : {}),
    ...(filter.from || filter.to ? { performedOn } : {}),
    ...(filter.flagged !== undefined ? { flagged: filter.flagged } : {}),
    ...(filter.status ? { status: filter.status } : {}),
  };
}

/** List order; keyset conditions below must match it. */
export const LIST_ORDER = [{ performedOn: "desc" }, { id: "asc" }] as const satisfies Prisma.WorkupOrderByWithRelationInput[];

/**
 * Rows after the cursor in LIST_ORDER. The leading `performedOn <= X` gives PostgreSQL an index range to start
 * from; with the OR alone it walks the index from the top and filters (a page 50,000 rows deep took 50 ms instead
 * of 0.1 ms on PostgreSQL 15 in bench/workups-list.bench.ts).
 */
export function afterCursor(after: ListCursor): Prisma.WorkupWhereInput {
  return {
    performedOn: { lte: after.performedOn },
    OR: [{ performedOn: { lt: after.performedOn } }, { id: { gt: after.id } }],
  };
}

/**
 * A compound used in few workups is filtered through its component rows (an id list, found by the (groupId,
 * compoundId) index); one used in many keeps the EXISTS, which then finds its first page quickly in index order.
 * PostgreSQL otherwise probes the component table once per workup walked (300 ms for a compound in 1.5 % of
 * 100,000 workups in the benchmark).
 */
const COMPOUND_ID_LIST_MAX = 2000;

/** workupWhere, with the compound filter turned into an id list when that is cheaper. */
export async function resolveWhere(db: Db, groupId: string, filter: Omit<WorkupListFilter, "cursor" | "limit">): Promise<Prisma.WorkupWhereInput> {
  const where = workupWhere(groupId, filter);
  if (!filter.compoundId) return where;
  const uses = await db.workupComponent.findMany({
    where: { groupId, compoundId: filter.compoundId }, select: { workupId: true }, take: COMPOUND_ID_LIST_MAX + 1,
  });
  if (uses.length > COMPOUND_ID_LIST_MAX) return where;
  const { components: _components, ...rest } = where;
  return { ...rest, id: { in: [...new Set(uses.map((u) => u.workupId))] } };
}

export const listSelect = {
  id: true, title: true, performedOn: true, chemistId: true, notebookRef: true, version: true, status: true, flagged: true,
  deviationPct: true, intervalState: true, updatedAt: true,
  outcome: { select: { recoveryPct: true, purityMethod: true } },
  predictions: {
    orderBy: [{ workupVersion: "desc" }, { createdAt: "desc" }], take: 1,
    select: { productRecovery: true, recoveryLow: true, recoveryHigh: true, engineVersion: true },
  },
} as const satisfies Prisma.WorkupSelect;

export interface WorkupListRow {
  id: string;
  title: string;
  performedOn: string;
  chemist: { id: string; name: string } | null;
  notebookRef: string;
  version: number;
  status: DeviationStatus;
  flagged: boolean;
  deviationPct: number | null;
  /** Percent. */
  reportedRecoveryPct: number | null;
  predictedRecoveryPct: number | null;
  predictedLowPct: number | null;
  predictedHighPct: number | null;
  /** "pending": the interval (predictedLowPct/HighPct) and the judgement of any outcome are being computed. */
  intervalState: IntervalState;
  updatedAt: string;
}

export interface WorkupListPage {
  rows: WorkupListRow[];
  /** Cursor of the next page, or null on the last page. */
  next: string | null;
}

type ListRecord = Prisma.WorkupGetPayload<{ select: typeof listSelect }>;

const pct = (fraction: number | null | undefined) => (fraction === null || fraction === undefined ? null : fraction * 100);

export async function chemistNames(db: Db, ids: (string | null)[]): Promise<Map<string, { id: string; name: string }>> {
  const wanted = [...new Set(ids.filter((id): id is string => id !== null))];
  if (wanted.length === 0) return new Map();
  const users = await db.user.findMany({ where: { id: { in: wanted } }, select: { id: true, name: true } });
  return new Map(users.map((u) => [u.id, u]));
}

export async function toListRows(db: Db, records: ListRecord[]): Promise<WorkupListRow[]> {
  const chemists = await chemistNames(db, records.map((r) => r.chemistId));
  return records.map((r) => {
    const p = r.predictions[0];
    return {
      id: r.id, title: r.title, performedOn: dayOf(r.performedOn), notebookRef: r.notebookRef, version: r.version,
      chemist: r.chemistId ? (chemists.get(r.chemistId) ?? null) : null,
      status: r.status, flagged: r.flagged, deviationPct: r.deviationPct,
      reportedRecoveryPct: r.outcome?.recoveryPct ?? null,
      predictedRecoveryPct: pct(p?.productRecovery), predictedLowPct: pct(p?.recoveryLow), predictedHighPct: pct(p?.recoveryHigh),
      intervalState: r.intervalState, updatedAt: r.updatedAt.toISOString(),
    };
  });
}

/** One page of the group's workups, newest first. `input` is a WorkupListFilterInput (strings from a query are fine). */
export async function listWorkups(db: Db, groupId: string, input: unknown): Promise<WorkupListPage> {
  const filter = parseInput(workupListFilterSchema, input);
  const after = filter.cursor ? decodeCursor(filter.cursor) : null;
  const where = await resolveWhere(db, groupId, filter);
  const records = await db.workup.findMany({
    where: after ? { AND: [where, afterCursor(after)] } : where,
    orderBy: LIST_ORDER,
    take: filter.limit + 1,
    select: listSelect,
  });
  const page = records.slice(0, filter.limit);
  const last = page.at(-1);
  return { rows: await toListRows(db, page), next: records.length > filter.limit && last ? encodeCursor(last) : null };
}

export interface WorkupDetail {
  id: string;
  version: number;
  /** The current header always has a notebook address ("" when none). */
  header: SnapshotHeader & { notebookUrl: string };
  chemistName: string | null;
  /** The spec exactly as saved (units included): what the editor loads. */
  spec: JsonObject;
  components: { key: string; name: string; role: string; amountMmol: number; compound: { id: string; name: string } | null }[];
  status: DeviationStatus;
  flagged: boolean;
  deviationPct: number | null;
  /** "pending": the prediction's interval and the judgement of any outcome are being computed in the background. */
  intervalState: IntervalState;
  createdAt: string;
  updatedAt: string;
  updatedBy: { id: string; name: string } | null;
  prediction: {
    workupVersion: number; engineVersion: string; productRecovery: number | null; recoveryLow: number | null; recoveryHigh: number | null;
    result: StoredPredictionResult; createdAt: string;
  } | null;
  outcome: {
    isolatedMassMg: number; purityPct: number | null; purityMethod: string; layerAssays: unknown; notes: string;
    recoveryPct: number | null; analysis: OutcomeAnalysis | null; reportedBy: { id: string; name: string } | null; updatedAt: string;
    /** The cause the group found at review (lib/workups/found-cause.ts), or null. */
    foundCause: { cause: FoundCause; note: string; by: { id: string; name: string } | null; at: string | null } | null;
  } | null;
}

export async function getWorkupDetail(db: Db, groupId: string, id: string): Promise<WorkupDetail> {
  const w = await db.workup.findFirst({
    where: { id, groupId },
    include: {
      components: { where: { groupId }, orderBy: { key: "asc" }, include: { compound: { select: { id: true, name: true } } } },
      outcome: true,
      predictions: { orderBy: [{ workupVersion: "desc" }, { createdAt: "desc" }], take: 1 },
    },
  });
  if (!w) throw new NotFoundError("workup");
  const people = await chemistNames(db, [w.chemistId, w.updatedById, w.outcome?.reportedById ?? null, w.outcome?.foundCauseById ?? null]);
  const foundCause = storedFoundCause(w.outcome?.foundCause);
  const p = w.predictions[0];
  const analysis = w.outcome?.analysis as unknown as OutcomeAnalysis | undefined; // written by analysis.ts
  return {
    id: w.id, version: w.version,
    header: {
      title: w.title, performedOn: dayOf(w.performedOn), chemistId: w.chemistId, notebookRef: w.notebookRef, notebookUrl: w.notebookUrl,
      scaleMmol: w.scaleMmol, expectedProductMmol: w.expectedProductMmol, assayedProductMmol: w.assayedProductMmol,
    },
    chemistName: w.chemistId ? (people.get(w.chemistId)?.name ?? null) : null,
    spec: w.spec as JsonObject,
    components: w.components.map((c) => ({ key: c.key, name: c.name, role: c.role, amountMmol: c.amountMmol, compound: c.compound })),
    status: w.status, flagged: w.flagged, deviationPct: w.deviationPct, intervalState: w.intervalState,
    createdAt: w.createdAt.toISOString(), updatedAt: w.updatedAt.toISOString(),
    updatedBy: w.updatedById ? (people.get(w.updatedById) ?? null) : null,
    prediction: p
      ? {
          workupVersion: p.workupVersion, engineVersion: p.engineVersion, productRecovery: p.productRecovery,
          recoveryLow: p.recoveryLow, recoveryHigh: p.recoveryHigh, result: p.result as unknown as StoredPredictionResult,
          createdAt: p.createdAt.toISOString(),
        }
      : null,
    outcome: w.outcome
      ? {
          isolatedMassMg: w.outcome.isolatedMassMg, purityPct: w.outcome.purityPct, purityMethod: w.outcome.purityMethod,
          layerAssays: w.outcome.layerAssays, notes: w.outcome.notes, recoveryPct: w.outcome.recoveryPct,
          analysis: analysis && "deviation" in analysis ? analysis : null,
          reportedBy: w.outcome.reportedById ? (people.get(w.outcome.reportedById) ?? null) : null,
          updatedAt: w.outcome.updatedAt.toISOString(),
          foundCause: foundCause
            ? {
                cause: foundCause, note: w.outcome.foundCauseNote,
                by: w.outcome.foundCauseById ? (people.get(w.outcome.foundCauseById) ?? null) : null, at: w.outcome.foundCauseAt?.toISOString() ?? null,
              }
            : null,
        }
      : null,
  };
}
