/**
 * Real databases for integration tests, on every configured backend. No mocks.
 *
 * Backends: "pglite" always (in-memory, or a temp data dir); "postgresql" too when TEST_DATABASE_URL (or else
 * DATABASE_URL) is set: a database lw_test_<random> is created on that server and dropped WITH (FORCE) afterwards.
 *
 *   describeEachDatabase(name, (t) => { ...tests using t.db... })
 *       One describe block per backend ("name [pglite]", "name [postgresql]"), each with a fresh migrated database
 *       opened in beforeAll and dropped in afterAll. `t.db` (a Db from lib/db/client), `t.backend` and `t.url` may be
 *       read inside tests and hooks.
 *   withTestDatabases(fn)                    runs `await fn(database)` once per backend, each on a fresh migrated database.
 *   createTestDatabase(backend, options?)    a fresh migrated TestDatabase you dispose() yourself;
 *       options: { migrationsDir?: string; onDisk?: boolean } (onDisk: a temp data dir instead of memory, pglite only).
 *   createEmptyDatabase(backend, options?)   an EMPTY database with a raw SqlSession (migration tests);
 *       options: { onDisk?: boolean }. For PostgreSQL `url` can be handed to another process; for an on-disk PGlite
 *       call release() first (one process per data dir), then pass `url` (pglite:<dir>).
 *   testBackends()                           the backends this run covers.
 *   tempDir(prefix)                          a temp folder removed at process exit.
 *
 * Example:
 *   describeEachDatabase("groups", (t) => {
 *     it("stores a group", async () => {
 *       const group = await t.db.group.create({ data: { name: "Demo", slug: "demo" } });
 *       expect(await t.db.group.findUnique({ where: { id: group.id } })).toMatchObject({ slug: "demo" });
 *     });
 *   });
 */
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { PGlite } from "@electric-sql/pglite";
import pg from "pg";
import { afterAll, beforeAll, describe } from "vitest";
import { createDb, type Db } from "@/lib/db/client";
import { pgSession, pgliteSession, type SqlSession } from "@/lib/db/sql";

export type Backend = "pglite" | "postgresql";

export interface TestDatabase {
  backend: Backend;
  /** pglite:memory, pglite:<dir> or the postgresql:// URL of the created database. */
  url: string;
  db: Db;
  dispose: () => Promise<void>;
}

export interface EmptyDatabase {
  backend: Backend;
  url: string;
  session: SqlSession;
  /** The PGlite instance behind `session` (pglite backend only). */
  pglite?: PGlite;
  /** Closes the session but keeps the database (PostgreSQL) or data dir (PGlite) for another opener. */
  release: () => Promise<void>;
  /** release() and then drop the database / remove the data dir. */
  dispose: () => Promise<void>;
}

const adminUrl = (): string | undefined => process.env["TEST_DATABASE_URL"] || process.env["DATABASE_URL"] || undefined;

export function testBackends(): Backend[] {
  return adminUrl() ? ["pglite", "postgresql"] : ["pglite"];
}

const tempDirs = new Set<string>();
process.once("exit", () => {
  for (const dir of tempDirs) fs.rmSync(dir, { recursive: true, force: true });
});

export function tempDir(prefix: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), `${prefix}-`));
  tempDirs.add(dir);
  return dir;
}

async function withAdmin<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const url = adminUrl();
  if (!url) throw new Error("PostgreSQL tests need TEST_DATABASE_URL or DATABASE_URL");
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** Creates lw_test_<random> on the configured server; returns its URL and the function that drops it. */
async function createPostgresDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `lw_test_${randomBytes(6).toString("hex")}`;
  await withAdmin((c) => c.query(`CREATE DATABASE "${name}"`));
  const url = new URL(adminUrl()!);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: () => withAdmin((c) => c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`)).then(() => undefined),
  };
}

export async function createTestDatabase(
  backend: Backend,
  options: { migrationsDir?: string; onDisk?: boolean } = {},
): Promise<TestDatabase> {
  if (backend === "pglite") {
    const dir = options.onDisk ? tempDir("lw-pglite") : undefined;
    const url = dir ? `pglite:${dir}` : "pglite:memory";
    const { db, close } = await createDb({ url, migrationsDir: options.migrationsDir });
    return {
      backend, url, db,
      dispose: async () => {
        await close();
        if (dir) fs.rmSync(dir, { recursive: true, force: true });
      },
    };
  }
  const created = await createPostgresDatabase();
  try {
    const { db, close } = await createDb({ url: created.url, migrationsDir: options.migrationsDir });
    return { backend, url: created.url, db, dispose: () => close().finally(created.drop) };
  } catch (e) {
    await created.drop();
    throw e;
  }
}

export async function createEmptyDatabase(backend: Backend, options: { onDisk?: boolean } = {}): Promise<EmptyDatabase> {
  if (backend === "pglite") {
    const dir = options.onDisk ? tempDir("lw-pglite") : undefined;
    const pglite = dir ? new PGlite(dir) : new PGlite();
    await pglite.waitReady;
    const release = async () => {
      if (!pglite.closed) await pglite.close();
    };
    return {
      backend, url: dir ? `pglite:${dir}` : "pglite:memory", session: pgliteSession(pglite), pglite, release,
      dispose: async () => {
        await release();
        if (dir) fs.rmSync(dir, { recursive: true, force: true });
      },
    };
  }
  const created = await createPostgresDatabase();
  const client = new pg.Client({ connectionString: created.url });
  await client.connect();
  let open = true;
  const release = async () => {
    if (open) await client.end();
    open = false;
  };
  return { backend, url: created.url, session: pgSession(client), release, dispose: () => release().finally(created.drop) };
}

export async function withTestDatabases(fn: (database: TestDatabase) => Promise<void>): Promise<void> {
  for (const backend of testBackends()) {
    const database = await createTestDatabase(backend);
    try {
      await fn(database);
    } finally {
      await database.dispose();
    }
  }
}

export interface TestDatabaseContext {
  readonly backend: Backend;
  readonly url: string;
  readonly db: Db;
}

export function describeEachDatabase(name: string, fn: (t: TestDatabaseContext) => void): void {
  for (const backend of testBackends()) {
    describe(`${name} [${backend}]`, () => {
      let current: TestDatabase | undefined;
      const opened = (): TestDatabase => {
        if (!current) throw new Error("The test database is opened in beforeAll: use t.db inside tests and hooks.");
        return current;
      };
      beforeAll(async () => {
        current = await createTestDatabase(backend);
      });
      afterAll(async () => {
        await current?.dispose();
        current = undefined;
      });
      fn({
        backend,
        get url() {
          return opened().url;
        },
        get db() {
          return opened().db;
        },
      });
    });
  }
}
