// Applies the committed migrations (prisma/migrations/<name>/migration.sql) with no Prisma engine, recording them in
// `_prisma_migrations` the way Prisma's own engine does (prisma-engines, sql-schema-connector: create_migrations_table,
// apply_migrations, checksum), so `prisma migrate status|deploy` and the wasm tool accept the result as their own.
// Differences by design: each migration and its history row commit in ONE transaction, so a failing migration leaves
// no trace and no half-applied schema (Prisma records a failed row that must be resolved by hand); and an applied
// migration whose file changed, or one this checkout does not have, stops the run instead of being ignored.
import { createHash, randomUUID } from "node:crypto";
import fsp from "node:fs/promises";
import path from "node:path";
import type { SqlSession } from "./sql";

/** The key Prisma's engine locks with, so our migrator and Prisma's never run at the same time. */
export const MIGRATION_LOCK_KEY = 72707369;

const HISTORY_TABLE_DDL = `CREATE TABLE _prisma_migrations (
    id                      VARCHAR(36) PRIMARY KEY NOT NULL,
    checksum                VARCHAR(64) NOT NULL,
    finished_at             TIMESTAMPTZ,
    migration_name          VARCHAR(255) NOT NULL,
    logs                    TEXT,
    rolled_back_at          TIMESTAMPTZ,
    started_at              TIMESTAMPTZ NOT NULL DEFAULT now(),
    applied_steps_count     INTEGER NOT NULL DEFAULT 0
);`;

export interface MigrationFile {
  name: string;
  script: string;
  /** Lowercase hex SHA-256 of the file's bytes, as Prisma stores it. */
  checksum: string;
}

export interface MigrateOptions {
  /** Default: prisma/migrations under the working directory. */
  migrationsDir?: string;
  log?: (line: string) => void;
}

export interface MigrateResult {
  /** Names applied by this run, in order (empty when the database was up to date). */
  applied: string[];
  /** Number of committed migrations now recorded as applied. */
  total: number;
}

export class MigrationError extends Error {
  override name = "MigrationError";
  constructor(
    message: string,
    readonly migrationName?: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
  }
}

export const defaultMigrationsDir = () => path.resolve("prisma", "migrations");

const sha256 = (text: string | Buffer) => createHash("sha256").update(text).digest("hex");

/** Prisma accepts a file whose line endings were converted (git autocrlf) as unchanged. */
function matchesChecksum(file: MigrationFile, recorded: string): boolean {
  const lf = file.script.replace(/\r\n/g, "\n");
  return [file.checksum, sha256(lf), sha256(lf.replace(/\n/g, "\r\n"))].includes(recorded);
}

export async function readMigrations(dir: string = defaultMigrationsDir()): Promise<MigrationFile[]> {
  const lock = await fsp.readFile(/*turbopackIgnore: true*/ path.join(dir, "migration_lock.toml"), "utf8").catch(() => undefined);
  const provider = lock && /^\s*provider\s*=\s*"([^"]*)"/m.exec(lock)?.[1];
  if (provider && provider !== "postgresql") {
    throw new MigrationError(`${dir}/migration_lock.toml is for "${provider}"; Layerwise needs "postgresql" migrations.`);
  }
  const entries = await fsp.readdir(/*turbopackIgnore: true*/ dir, { withFileTypes: true }).catch((e: NodeJS.ErrnoException) => {
    throw new MigrationError(`Cannot read the migrations folder ${dir}: ${e.message}`, undefined, { cause: e });
  });
  const names = entries.filter((e) => e.isDirectory()).map((e) => e.name).sort(); // Prisma orders by folder name
  return Promise.all(
    names.map(async (name) => {
      const bytes = await fsp.readFile(/*turbopackIgnore: true*/ path.join(dir, name, "migration.sql")).catch((e: unknown) => {
        throw new MigrationError(`Migration ${name} has no readable migration.sql`, name, { cause: e });
      });
      return { name, script: bytes.toString("utf8"), checksum: sha256(bytes) };
    }),
  );
}

interface HistoryRow {
  migration_name: string;
  checksum: string;
  finished_at: Date | null;
  rolled_back_at: Date | null;
}

async function ensureHistoryTable(db: SqlSession): Promise<void> {
  const [found] = await db.query<{ exists: boolean }>(
    "SELECT to_regclass('_prisma_migrations') IS NOT NULL AS exists",
  );
  if (found?.exists) return;
  const tables = await db.query<{ table_name: string }>(
    "SELECT table_name FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE' LIMIT 3",
  );
  if (tables.length > 0) {
    // Prisma's P3005: refuse to guess what an unrelated, non-empty database contains.
    throw new MigrationError(
      `The database is not empty (tables ${tables.map((t) => t.table_name).join(", ")}) but has no migration history. ` +
        "Point DATABASE_URL at an empty database or one created by Layerwise.",
    );
  }
  await db.exec(HISTORY_TABLE_DDL);
}

function checkHistory(rows: HistoryRow[], files: MigrationFile[]): Set<string> {
  const byName = new Map(files.map((f) => [f.name, f]));
  const applied = new Set<string>();
  const live = rows.filter((row) => !row.rolled_back_at);
  const unfinished = live.find((row) => !row.finished_at);
  if (unfinished) {
    // Prisma's P3009. Our own runs never leave such a row; Prisma's engine does when a migration fails.
    const name = unfinished.migration_name;
    throw new MigrationError(
      `Migration ${name} is recorded as started but never finished (a failed run of Prisma's own tool?). ` +
        `Check the database, then mark it with "node scripts/prisma-offline.mjs resolve --rolled-back ${name}" (or --applied).`,
      name,
    );
  }
  for (const row of live) {
    const name = row.migration_name;
    const file = byName.get(name);
    if (!file) {
      throw new MigrationError(`Migration ${name} is applied to the database but missing from this checkout: the database is newer than this code.`, name);
    }
    if (!matchesChecksum(file, row.checksum)) {
      throw new MigrationError(
        `Migration ${name} was changed after it was applied (its checksum no longer matches). ` +
          "Restore the original migration.sql and put the change in a new migration.",
        name,
      );
    }
    applied.add(name);
  }
  return applied;
}

async function applyOne(db: SqlSession, file: MigrationFile): Promise<void> {
  await db.exec("BEGIN");
  try {
    await db.query(
      "INSERT INTO _prisma_migrations (id, checksum, started_at, migration_name, applied_steps_count) VALUES ($1, $2, $3, $4, 0)",
      [randomUUID(), file.checksum, new Date(), file.name],
    );
    await db.exec(file.script);
    await db.query(
      "UPDATE _prisma_migrations SET applied_steps_count = applied_steps_count + 1, finished_at = $1 WHERE migration_name = $2 AND finished_at IS NULL",
      [new Date(), file.name],
    );
    await db.exec("COMMIT");
  } catch (e) {
    await db.exec("ROLLBACK").catch(() => undefined);
    const reason = e instanceof Error ? e.message : String(e);
    throw new MigrationError(`Migration ${file.name} failed and was rolled back; nothing of it was applied: ${reason}`, file.name, { cause: e });
  }
}

/** Brings the database up to date with the migrations folder. Safe to call at every start; serialised across processes. */
export async function migrate(db: SqlSession, options: MigrateOptions = {}): Promise<MigrateResult> {
  const files = await readMigrations(options.migrationsDir);
  await db.query("SELECT pg_advisory_lock($1)", [MIGRATION_LOCK_KEY]);
  try {
    await ensureHistoryTable(db);
    const rows = await db.query<HistoryRow>(
      "SELECT migration_name, checksum, finished_at, rolled_back_at FROM _prisma_migrations ORDER BY started_at",
    );
    const done = checkHistory(rows, files);
    const applied: string[] = [];
    for (const file of files.filter((f) => !done.has(f.name))) {
      await applyOne(db, file);
      applied.push(file.name);
      options.log?.(`applied migration ${file.name}`);
    }
    return { applied, total: done.size + applied.length };
  } finally {
    // A failed unlock means the session is gone, and the lock with it; never hide the run's own error behind it.
    await db.query("SELECT pg_advisory_unlock($1)", [MIGRATION_LOCK_KEY]).catch(() => undefined);
  }
}
