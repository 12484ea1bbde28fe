// No drift: a database migrated by lib/db/migrate.ts matches prisma/schema.prisma exactly, and Prisma's own schema
// engine (the wasm build, through scripts/prisma-offline.mjs) accepts its migration history as applied and unedited.
// When this fails after a schema change, add the migration: npm run db:new-migration -- <name>
import { PGlite } from "@electric-sql/pglite";
import pg from "pg";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { migrate } from "@/lib/db/migrate";
import { createEmptyDatabase, testBackends, type EmptyDatabase } from "../helpers/databases";
import { EMPTY_DIFF, runPrismaOffline } from "../helpers/prisma-offline";

/** Runs one SQL script on the released database, as another session would. */
async function execOnReleased(database: EmptyDatabase, sql: string): Promise<void> {
  if (database.backend === "pglite") {
    const pglite = new PGlite(database.url.slice("pglite:".length));
    await pglite.exec(sql);
    await pglite.close();
    return;
  }
  const client = new pg.Client({ connectionString: database.url });
  await client.connect();
  await client.query(sql).finally(() => client.end());
}

describe.each(testBackends())("schema drift [%s]", (backend) => {
  let database: EmptyDatabase;
  beforeEach(async () => {
    database = await createEmptyDatabase(backend, { onDisk: true });
    await migrate(database.session);
    await database.release(); // the engine runs in another process
  });
  afterEach(async () => {
    await database.dispose();
  });

  it("the migrated database matches schema.prisma and Prisma reads its history as its own", async () => {
    const diff = await runPrismaOffline(["diff", "--from-database"], database.url);
    expect(diff.stderr).toBe("");
    expect(diff.stdout.trim(), "schema.prisma and the migrations differ: npm run db:new-migration -- <name>").toBe(EMPTY_DIFF);

    const status = await runPrismaOffline(["status"], database.url);
    expect(status.code, status.stderr).toBe(0);
    expect(JSON.parse(status.stdout)).toEqual({
      editedMigrationNames: [],
      failedMigrationNames: [],
      hasMigrationsTable: true,
      history: null,
    });
  });

  it("a column added behind the schema's back is reported as drift", async () => {
    await execOnReleased(database, 'ALTER TABLE "Group" ADD COLUMN "unplanned" INTEGER');
    const diff = await runPrismaOffline(["diff", "--from-database"], database.url);
    expect(diff.stdout).toContain('ALTER TABLE "Group" DROP COLUMN "unplanned"');
  });
});
