// The engine-free migrator (lib/db/migrate.ts) on every configured backend. The history-table layout and row rules
// checked here are Prisma's: prisma-engines, schema-engine/connectors/sql-schema-connector (create_migrations_table,
// apply_migrations; checksum = SHA-256 of migration.sql), as recorded in shared/notes/prisma-offline.md §4.
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { MigrationError, migrate } from "@/lib/db/migrate";
import { pgSession } from "@/lib/db/sql";
import { createEmptyDatabase, tempDir, testBackends, type EmptyDatabase } from "../helpers/databases";

const committedDir = path.resolve("prisma/migrations");
const committed = fs
  .readdirSync(committedDir, { withFileTypes: true })
  .filter((e) => e.isDirectory())
  .map((e) => e.name)
  .sort();
const first = committed[0]!;

/** A scratch copy of the committed migrations, plus extra ones: { folderName: sql }. */
function migrationsCopy(extra: Record<string, string> = {}): string {
  const dir = tempDir("lw-migrations");
  fs.cpSync(committedDir, dir, { recursive: true });
  for (const [name, sql] of Object.entries(extra)) {
    fs.mkdirSync(path.join(dir, name));
    fs.writeFileSync(path.join(dir, name, "migration.sql"), sql);
  }
  return dir;
}

interface HistoryRow {
  id: string;
  checksum: string;
  finished_at: Date | null;
  migration_name: string;
  logs: string | null;
  rolled_back_at: Date | null;
  started_at: Date;
  applied_steps_count: number;
}

describe.each(testBackends())("migrate [%s]", (backend) => {
  let database: EmptyDatabase;
  beforeEach(async () => {
    database = await createEmptyDatabase(backend);
  });
  afterEach(async () => {
    await database.dispose();
  });
  const history = () => database.session.query<HistoryRow>("SELECT * FROM _prisma_migrations ORDER BY migration_name");
  const tableExists = async (name: string) =>
    (await database.session.query<{ found: boolean }>("SELECT to_regclass($1) IS NOT NULL AS found", [`"${name}"`]))[0]?.found;

  it("applies every committed migration once, recorded as Prisma records it; a second run is a no-op", async () => {
    const result = await migrate(database.session);
    expect(result).toEqual({ applied: committed, total: committed.length });
    expect(await tableExists("Workup")).toBe(true);

    const rows = await history();
    expect(rows.map((r) => r.migration_name)).toEqual(committed);
    for (const row of rows) {
      const bytes = fs.readFileSync(path.join(committedDir, row.migration_name, "migration.sql"));
      expect(row.checksum).toBe(createHash("sha256").update(bytes).digest("hex"));
      expect(row.id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
      expect(row.applied_steps_count).toBe(1);
      expect(row.logs).toBeNull();
      expect(row.rolled_back_at).toBeNull();
      expect(row.finished_at!.getTime()).toBeGreaterThanOrEqual(row.started_at.getTime());
    }

    expect(await migrate(database.session)).toEqual({ applied: [], total: committed.length });
    expect(await history()).toEqual(rows);
  });

  it("creates the history table with Prisma's exact columns", async () => {
    await migrate(database.session);
    const columns = await database.session.query<{ column_name: string; data_type: string; is_nullable: string; column_default: string | null; len: number | null }>(
      `SELECT column_name, data_type, is_nullable, column_default, character_maximum_length AS len
         FROM information_schema.columns WHERE table_name = '_prisma_migrations' ORDER BY ordinal_position`,
    );
    expect(columns).toEqual([
      { column_name: "id", data_type: "character varying", is_nullable: "NO", column_default: null, len: 36 },
      { column_name: "checksum", data_type: "character varying", is_nullable: "NO", column_default: null, len: 64 },
      { column_name: "finished_at", data_type: "timestamp with time zone", is_nullable: "YES", column_default: null, len: null },
      { column_name: "migration_name", data_type: "character varying", is_nullable: "NO", column_default: null, len: 255 },
      { column_name: "logs", data_type: "text", is_nullable: "YES", column_default: null, len: null },
      { column_name: "rolled_back_at", data_type: "timestamp with time zone", is_nullable: "YES", column_default: null, len: null },
      { column_name: "started_at", data_type: "timestamp with time zone", is_nullable: "NO", column_default: "now()", len: null },
      { column_name: "applied_steps_count", data_type: "integer", is_nullable: "NO", column_default: "0", len: null },
    ]);
  });

  it("refuses an applied migration whose file was changed, naming it, but accepts converted line endings", async () => {
    const dir = migrationsCopy();
    await migrate(database.session, { migrationsDir: dir });
    const file = path.join(dir, first, "migration.sql");
    const original = fs.readFileSync(file, "utf8");

    fs.writeFileSync(file, original.replace(/\n/g, "\r\n")); // what git autocrlf does on checkout
    expect((await migrate(database.session, { migrationsDir: dir })).applied).toEqual([]);

    fs.writeFileSync(file, original.replace('"name" TEXT NOT NULL', '"name" VARCHAR(80) NOT NULL'));
    const refused = migrate(database.session, { migrationsDir: dir });
    await expect(refused).rejects.toThrow(MigrationError);
    await expect(refused).rejects.toThrow(`Migration ${first} was changed after it was applied`);
    await expect(refused).rejects.toMatchObject({ migrationName: first });
  });

  it("rolls a failing migration back completely, reports it, and applies it once fixed", async () => {
    const broken = "29990101000000_broken";
    const dir = migrationsCopy({
      [broken]: 'CREATE TABLE "Scratch" ("id" INTEGER);\nALTER TABLE "NoSuchTable" ADD COLUMN "x" INTEGER;\n',
    });
    const failed = migrate(database.session, { migrationsDir: dir });
    await expect(failed).rejects.toThrow(new RegExp(`Migration ${broken} failed and was rolled back.*NoSuchTable`));
    await expect(failed).rejects.toMatchObject({ migrationName: broken });

    expect(await tableExists("Scratch")).toBe(false);
    expect((await history()).map((r) => r.migration_name)).toEqual(committed);

    fs.writeFileSync(path.join(dir, broken, "migration.sql"), 'CREATE TABLE "Scratch" ("id" INTEGER);\n');
    expect((await migrate(database.session, { migrationsDir: dir })).applied).toEqual([broken]);
    expect(await tableExists("Scratch")).toBe(true);
  });

  it("applies a script with a PL/pgSQL body and quoted semicolons as one unit", async () => {
    const name = "29990101000000_function";
    const dir = migrationsCopy({
      [name]: `CREATE FUNCTION lw_probe() RETURNS text LANGUAGE plpgsql AS $$ BEGIN RETURN 'a;b'; END; $$;\n`,
    });
    await migrate(database.session, { migrationsDir: dir });
    expect(await database.session.query("SELECT lw_probe() AS v")).toEqual([{ v: "a;b" }]);
  });

  it("refuses a non-empty database that has no migration history", async () => {
    await database.session.exec('CREATE TABLE "Legacy" ("id" INTEGER)');
    await expect(migrate(database.session)).rejects.toThrow(/The database is not empty \(tables Legacy\) but has no migration history/);
  });

  it("refuses a history row that never finished, and one this checkout does not have", async () => {
    await migrate(database.session);
    const insert = "INSERT INTO _prisma_migrations (id, checksum, migration_name, finished_at) VALUES ($1, $2, $3, $4)";
    await database.session.query(insert, ["00000000-0000-4000-8000-000000000001", "0".repeat(64), "29990101000000_future", new Date()]);
    await expect(migrate(database.session)).rejects.toThrow("Migration 29990101000000_future is applied to the database but missing from this checkout");

    await database.session.query(insert, ["00000000-0000-4000-8000-000000000002", "0".repeat(64), "29990101000001_halfway", null]);
    await expect(migrate(database.session)).rejects.toThrow(/Migration 29990101000001_halfway is recorded as started but never finished/);
  });

  it.runIf(backend === "postgresql")("serialises concurrent migrators so each migration is applied once", async () => {
    const other = new pg.Client({ connectionString: database.url });
    await other.connect();
    try {
      const results = await Promise.all([migrate(database.session), migrate(pgSession(other))]);
      expect(results.map((r) => r.applied.length).sort()).toEqual([0, committed.length]);
      expect(await history()).toHaveLength(committed.length);
    } finally {
      await other.end();
    }
  });
});
