// A fingerprint of every table (row count and a digest of the rows), taken straight from the database, to tell
// whether requests that were all refused left anything behind. Columns that reads or the job worker legitimately
// touch are left out of the digest (the row count still covers those tables).
import { type Db } from "@/lib/db/client";

/** table -> columns whose changes are not writes by a request under test. */
const VOLATILE: Record<string, string[]> = {
  ApiToken: ["lastUsedAt"],
  Job: ["status", "total", "done", "payload", "error", "lockedBy", "lockedAt", "updatedAt"],
};

export type Snapshot = Record<string, { rows: number; digest: string }>;

export async function snapshot(db: Db): Promise<Snapshot> {
  const tables = await db.$queryRawUnsafe<{ table_name: string }[]>(
    "SELECT table_name FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE' AND table_name NOT LIKE '\\_%' ORDER BY table_name",
  );
  const out: Snapshot = {};
  for (const { table_name: table } of tables) {
    const columns = await db.$queryRawUnsafe<{ column_name: string }[]>(
      "SELECT column_name FROM information_schema.columns WHERE table_schema = current_schema() AND table_name = $1 ORDER BY ordinal_position",
      table,
    );
    const kept = columns.map((c) => c.column_name).filter((c) => !(VOLATILE[table] ?? []).includes(c));
    const row = kept.map((c) => `coalesce("${c}"::text, '<null>')`).join(" || '|' || ");
    const [result] = await db.$queryRawUnsafe<{ rows: bigint | number; digest: string | null }[]>(
      `SELECT count(*) AS rows, md5(coalesce(string_agg(r, E'\\n' ORDER BY r), '')) AS digest FROM (SELECT ${row || "''"} AS r FROM "${table}") t`,
    );
    out[table] = { rows: Number(result?.rows ?? 0), digest: result?.digest ?? "" };
  }
  return out;
}

/** Tables whose rows or contents differ between two snapshots. */
export function changedTables(before: Snapshot, after: Snapshot): string[] {
  const names = new Set([...Object.keys(before), ...Object.keys(after)]);
  return [...names].filter((t) => before[t]?.rows !== after[t]?.rows || before[t]?.digest !== after[t]?.digest).sort()
    .map((t) => `${t} (${before[t]?.rows ?? 0} → ${after[t]?.rows ?? 0} rows)`);
}
