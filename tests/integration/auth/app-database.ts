/**
 * Like describeEachDatabase (tests/integration/helpers/databases.ts), but the fresh database is the one the app's own
 * getDb() returns, because the auth code under test opens its database itself. Per backend: an empty database
 * (PGlite data dir, or a PostgreSQL database created and later dropped), pointed at through the environment,
 * migrated by getDb() on first use exactly as in production.
 */
import { afterAll, beforeAll, describe } from "vitest";
import { closeDb, getDb, type Db } from "@/lib/db/client";
import { resetEnv } from "@/lib/env";
import { createEmptyDatabase, testBackends, type Backend, type EmptyDatabase } from "@/tests/integration/helpers/databases";

export interface AppDatabaseContext {
  readonly backend: Backend;
  readonly db: Db;
}

const KEYS = ["DATABASE_URL", "LAYERWISE_DATA_DIR", "AUTH_SECRET"] as const;

export function describeWithAppDatabase(name: string, fn: (t: AppDatabaseContext) => void): void {
  for (const backend of testBackends()) {
    describe(`${name} [${backend}]`, () => {
      let empty: EmptyDatabase | undefined;
      let db: Db | undefined;
      const saved = Object.fromEntries(KEYS.map((k) => [k, process.env[k]]));
      beforeAll(async () => {
        empty = await createEmptyDatabase(backend, { onDisk: true });
        await empty.release();
        if (backend === "pglite") {
          delete process.env["DATABASE_URL"];
          process.env["LAYERWISE_DATA_DIR"] = empty.url.slice("pglite:".length);
        } else {
          process.env["DATABASE_URL"] = empty.url;
        }
        process.env["AUTH_SECRET"] = "integration-test-secret-0123456789";
        resetEnv();
        await closeDb();
        db = await getDb();
      });
      afterAll(async () => {
        await closeDb();
        for (const k of KEYS) {
          if (saved[k] === undefined) delete process.env[k];
          else process.env[k] = saved[k];
        }
        resetEnv();
        await empty?.dispose();
      });
      fn({
        backend,
        get db() {
          if (!db) throw new Error("The app database opens in beforeAll: use t.db inside tests and hooks.");
          return db;
        },
      });
    });
  }
}
