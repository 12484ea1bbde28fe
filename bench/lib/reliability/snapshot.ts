// Every row of every table (its id, a digest of its columns, and the columns that say whose it is), taken straight
// from the database before and after the malformed requests, to find partial writes: a row added, changed or removed
// that no acknowledged write explains. A row is explained when it is the record an acknowledged write named (its id
// in the answer or the path), or hangs off one (its workupId, compoundId, audit entityId or audit ids). Rows of other
// groups (the heavy load, the matrix's other group) are counted apart. The background jobs' own follow-ups (infer
// and revalidate jobs, partition values inferred from reported outcomes) are counted apart too, as follow-ups of
// acknowledged outcome writes. Columns that reads or the job worker legitimately touch are left out of the digest.
import { type Db } from "@/lib/db/client";

/** table -> columns whose changes are not writes by a request under test. */
const VOLATILE: Record<string, string[]> = {
  ApiToken: ["lastUsedAt"],
  Job: ["status", "total", "done", "payload", "error", "lockedBy", "lockedAt", "updatedAt"],
};

/** Columns read to attribute a row, where the table has them. */
const LINKS = ["groupId", "workupId", "compoundId", "entityId", "kind"] as const;

export interface RowFacts {
  digest: string;
  groupId?: string | null;
  workupId?: string | null;
  compoundId?: string | null;
  entityId?: string | null;
  kind?: string | null;
  /** AuditEvent details.ids (a bulk registration names its compounds there). */
  ids?: string[];
}

export type Snapshot = Record<string, Map<string, RowFacts>>;

export async function snapshot(db: Db): Promise<Snapshot> {
  const tables = await db.$queryRawUnsafe<{ table_name: string }[]>(
    "SELECT table_name FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE' AND table_name NOT LIKE '\\_%' ORDER BY table_name",
  );
  const out: Snapshot = {};
  for (const { table_name: table } of tables) {
    const columns = (await db.$queryRawUnsafe<{ column_name: string }[]>(
      "SELECT column_name FROM information_schema.columns WHERE table_schema = current_schema() AND table_name = $1 ORDER BY ordinal_position",
      table,
    )).map((c) => c.column_name);
    const kept = columns.filter((c) => !(VOLATILE[table] ?? []).includes(c));
    const row = kept.map((c) => `coalesce("${c}"::text, '<null>')`).join(" || '|' || ") || "''";
    const links = LINKS.filter((l) => columns.includes(l)).map((l) => `"${l}"::text AS "${l}"`);
    const ids = table === "AuditEvent" ? [`(SELECT coalesce(json_agg(x), '[]'::json)::text FROM jsonb_array_elements_text(CASE WHEN jsonb_typeof(details->'ids') = 'array' THEN details->'ids' ELSE '[]'::jsonb END) x) AS ids`] : [];
    const key = columns.includes("id") ? `"id"::text` : `md5(${row})`;
    const rows = await db.$queryRawUnsafe<Record<string, string | null>[]>(
      `SELECT ${[`${key} AS k`, `md5(${row}) AS d`, ...links, ...ids].join(", ")} FROM "${table}"`,
    );
    const map = new Map<string, RowFacts>();
    for (const r of rows) {
      const facts: RowFacts = { digest: r["d"] ?? "" };
      for (const l of LINKS) if (l in r) facts[l] = r[l] ?? null;
      if (r["ids"]) facts.ids = JSON.parse(r["ids"]) as string[];
      map.set(r["k"] ?? "", facts);
    }
    out[table] = map;
  }
  return out;
}

export interface PartialWriteReport {
  /** Rows of group A (or of no group) added, changed or removed that no acknowledged write explains. */
  partialWrites: number;
  partialWriteRows: string[];
  /** Workups an acknowledged write created that lack their version or prediction. */
  incompleteWorkups: string[];
  /** Rows explained by acknowledged writes, per table. */
  explained: Record<string, number>;
  /** Job rows and inferred partition values written by the background jobs after acknowledged outcome writes. */
  followUps: Record<string, number>;
  /** Rows of other groups (the heavy load), per table: not the malformed requests'. */
  otherGroups: Record<string, number>;
  tables: number;
}

export function attributeChanges(before: Snapshot, after: Snapshot, groupA: string, acknowledged: ReadonlySet<string>, outcomesAcknowledged: boolean): PartialWriteReport {
  const report: PartialWriteReport = { partialWrites: 0, partialWriteRows: [], incompleteWorkups: [], explained: {}, followUps: {}, otherGroups: {}, tables: Object.keys(after).length };
  const bump = (m: Record<string, number>, t: string) => (m[t] = (m[t] ?? 0) + 1);
  const addedWorkups: string[] = [];
  for (const table of new Set([...Object.keys(before), ...Object.keys(after)])) {
    const b = before[table] ?? new Map<string, RowFacts>();
    const a = after[table] ?? new Map<string, RowFacts>();
    for (const key of new Set([...b.keys(), ...a.keys()])) {
      const was = b.get(key);
      const now = a.get(key);
      if (was && now && was.digest === now.digest) continue;
      const row = (now ?? was)!;
      if (row.groupId !== undefined && row.groupId !== null && row.groupId !== groupA) {
        bump(report.otherGroups, table);
        continue;
      }
      const named = [key, row.workupId, row.compoundId, row.entityId, ...(row.ids ?? [])].some((id) => typeof id === "string" && acknowledged.has(id));
      if (named) {
        bump(report.explained, table);
        if (table === "Workup" && !was && now) addedWorkups.push(key);
        continue;
      }
      if (outcomesAcknowledged && (table === "Job" || (table === "PartitionObservation" && row.kind === "inferred"))) {
        bump(report.followUps, table);
        continue;
      }
      report.partialWrites++;
      if (report.partialWriteRows.length < 50) report.partialWriteRows.push(`${table} ${key} (${!was ? "added" : !now ? "removed" : "changed"})`);
    }
  }
  const children = (table: string, workupId: string) => [...(after[table]?.values() ?? [])].some((r) => r.workupId === workupId);
  for (const id of addedWorkups) {
    if (!children("WorkupVersion", id) || !children("Prediction", id)) report.incompleteWorkups.push(id);
  }
  report.partialWrites += report.incompleteWorkups.length;
  return report;
}
