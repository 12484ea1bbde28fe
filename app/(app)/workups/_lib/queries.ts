// Read-only workup queries for the list and detail pages. Every one is scoped by the guard's group inside its
// `where`; a workup of another group is simply not found. (The editor, filters and REST API come with the
// workup-records feature and may replace these.)
import { getDb } from "@/lib/db/client";
import { found, type MemberContext } from "@/lib/authz";

export const WORKUPS_PAGE_SIZE = 25;

export interface WorkupListCursor {
  performedOn: Date;
  id: string;
}

export function encodeCursor(c: WorkupListCursor): string {
  return `${c.performedOn.toISOString()}_${c.id}`;
}

export function decodeCursor(raw: string | undefined): WorkupListCursor | null {
  const match = raw ? /^(\d{4}-\d{2}-\d{2}T[\d:.]+Z)_([A-Za-z0-9_-]{1,64})$/.exec(raw) : null;
  if (!match?.[1] || !match[2]) return null;
  const performedOn = new Date(match[1]);
  return Number.isNaN(performedOn.getTime()) ? null : { performedOn, id: match[2] };
}

/** Newest first, keyset-paginated on (performedOn, id) so later pages cost the same as the first. */
export async function listWorkups(member: MemberContext, after: WorkupListCursor | null) {
  const db = await getDb();
  const rows = await db.workup.findMany({
    where: {
      groupId: member.group.id,
      ...(after
        ? { OR: [{ performedOn: { lt: after.performedOn } }, { performedOn: after.performedOn, id: { lt: after.id } }] }
        : {}),
    },
    orderBy: [{ performedOn: "desc" }, { id: "desc" }],
    take: WORKUPS_PAGE_SIZE + 1,
    select: {
      id: true, title: true, performedOn: true, chemistId: true, notebookRef: true, status: true, flagged: true, deviationPct: true,
    },
  });
  const page = rows.slice(0, WORKUPS_PAGE_SIZE);
  const last = page.at(-1);
  const next = rows.length > WORKUPS_PAGE_SIZE && last ? encodeCursor(last) : null;
  return { rows: page, next, chemists: await chemistNames(page.map((r) => r.chemistId)) };
}

async function chemistNames(ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((id): id is string => id !== null))];
  if (wanted.length === 0) return new Map();
  const db = await getDb();
  const users = await db.user.findMany({ where: { id: { in: wanted } }, select: { id: true, name: true } });
  return new Map(users.map((u) => [u.id, u.name]));
}

export async function getWorkup(member: MemberContext, id: string) {
  const db = await getDb();
  const workup = found(
    await db.workup.findFirst({
      where: { id, groupId: member.group.id },
      select: {
        id: true, title: true, performedOn: true, chemistId: true, notebookRef: true, scaleMmol: true, expectedProductMmol: true,
        assayedProductMmol: true, spec: true, version: true, status: true, flagged: true, deviationPct: true, updatedAt: true,
        components: {
          where: { groupId: member.group.id },
          orderBy: { key: "asc" },
          select: { id: true, key: true, name: true, role: true, amountMmol: true, compoundId: true },
        },
        outcome: { select: { isolatedMassMg: true, purityPct: true, purityMethod: true, recoveryPct: true, notes: true } },
        predictions: {
          where: { groupId: member.group.id },
          orderBy: { createdAt: "desc" },
          take: 1,
          select: { productRecovery: true, recoveryLow: true, recoveryHigh: true, engineVersion: true, workupVersion: true },
        },
      },
    }),
    "workup",
  );
  const chemists = await chemistNames([workup.chemistId]);
  return { ...workup, chemistName: workup.chemistId ? (chemists.get(workup.chemistId) ?? null) : null };
}
