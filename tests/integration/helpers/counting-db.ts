/**
 * A real, migrated in-memory PGlite database whose client records every SQL statement Prisma sends, for tests that
 * hold a loader to a number of database round trips (N workups must not mean N queries). No mock: the statements run.
 *
 *   const c = await createCountingDb();
 *   const { result, statements } = await c.count(() => listWorkups(c.db, groupId, {}));
 *   await c.dispose();
 */
import { PGlite } from "@electric-sql/pglite";
import { PrismaPGlite } from "pglite-prisma-adapter";
import { PrismaClient } from "@/generated/prisma/client";
import { secretColumns, type Db } from "@/lib/db/client";
import { migrate } from "@/lib/db/migrate";
import { pgliteSession } from "@/lib/db/sql";

export interface CountingDb {
  db: Db;
  /** Runs `fn` and answers its result with the statements sent while it ran (one at a time: do not overlap calls). */
  count<T>(fn: () => Promise<T>): Promise<{ result: T; statements: string[] }>;
  dispose: () => Promise<void>;
}

export async function createCountingDb(): Promise<CountingDb> {
  const pglite = new PGlite();
  await pglite.waitReady;
  await migrate(pgliteSession(pglite));
  let sent: string[] | null = null;
  const query = pglite.query.bind(pglite);
  // The adapter sends every statement outside a transaction through PGlite.query.
  pglite.query = ((sql: string, ...rest: unknown[]) => {
    sent?.push(sql);
    return (query as (sql: string, ...rest: unknown[]) => ReturnType<PGlite["query"]>)(sql, ...rest);
  }) as PGlite["query"];
  const db: Db = new PrismaClient({ adapter: new PrismaPGlite(pglite), omit: secretColumns });
  return {
    db,
    async count(fn) {
      sent = [];
      try {
        const result = await fn();
        return { result, statements: sent };
      } finally {
        sent = null;
      }
    },
    dispose: async () => {
      await db.$disconnect();
      await pglite.close();
    },
  };
}
