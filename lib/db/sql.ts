// The tiny raw-SQL surface the migrator needs, over either backend's native connection (not Prisma's), so
// migrations can run before a Prisma client exists and on the very PGlite instance the app then uses.
import type { PGlite } from "@electric-sql/pglite";
import type { ClientBase } from "pg";

export interface SqlSession {
  /** One statement with $1.. parameters; returns its rows. */
  query<Row extends object>(sql: string, params?: readonly unknown[]): Promise<Row[]>;
  /** A script of any number of statements, sent as one simple query (how Prisma's engine sends a migration). */
  exec(script: string): Promise<void>;
}

export function pgliteSession(db: PGlite): SqlSession {
  return {
    async query<Row extends object>(sql: string, params: readonly unknown[] = []) {
      return (await db.query<Row>(sql, [...params])).rows;
    },
    async exec(script) {
      await db.exec(script);
    },
  };
}

/** A single pg session (a Client, or a client checked out of a pool): advisory locks are per session. */
export function pgSession(client: ClientBase): SqlSession {
  return {
    async query<Row extends object>(sql: string, params: readonly unknown[] = []) {
      return (await client.query<Row>(sql, [...params])).rows;
    },
    async exec(script) {
      await client.query(script);
    },
  };
}
