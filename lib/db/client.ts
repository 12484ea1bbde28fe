// The one place that knows which database Layerwise runs on. Embedded PGlite (PostgreSQL in WebAssembly) in the
// data dir by default; PostgreSQL through node-postgres when DATABASE_URL is set. Everything else gets a PrismaClient.
// Opening a database also brings it up to date with the committed migrations (lib/db/migrate.ts), on the same PGlite
// instance the client then uses, because PGlite is single-process.
import type * as runtime from "@prisma/client/runtime/client";
import { type Prisma, PrismaClient } from "@/generated/prisma/client";
import { env } from "@/lib/env";
import { displayPath, lockDataDir } from "./lock";
import { migrate, type MigrateOptions } from "./migrate";
import { pgSession, pgliteSession } from "./sql";

/**
 * Secret columns are left out of every result unless a query asks for them, e.g.
 * `db.user.findUnique({ where: { email }, omit: { passwordHash: false } })`.
 */
export const secretColumns = {
  user: { passwordHash: true },
  apiToken: { tokenHash: true },
  invite: { tokenHash: true },
} as const;

type PrismaDb = PrismaClient<never, typeof secretColumns>;
type TransactionOptions = Parameters<PrismaDb["$transaction"]>[1];

/** The client inside an interactive transaction, with the same secret columns omitted. */
export type DbTransaction = Omit<PrismaDb, runtime.ITXClientDenyList>;

/**
 * The app's database client. Prisma 7.10 types the interactive-transaction client without the global `omit`
 * (secret columns would type-check there yet be undefined at run time), so `$transaction` is re-declared with
 * DbTransaction; the object itself is Prisma's.
 */
export type Db = Omit<PrismaDb, "$transaction"> & {
  $transaction<R>(fn: (tx: DbTransaction) => Promise<R>, options?: TransactionOptions): Promise<R>;
  $transaction<P extends Prisma.PrismaPromise<unknown>[]>(
    queries: [...P],
    options?: Pick<NonNullable<TransactionOptions>, "isolationLevel">,
  ): Promise<runtime.Types.Utils.UnwrapTuple<P>>;
};

/**
 * How long work may queue for the database before the request is answered 503 with Retry-After (lib/errors.ts maps
 * these errors), so an overloaded instance sheds load in bounded time instead of piling up requests or failing with
 * 500. Sized for one instance of the app on a small machine; DEVELOPERS.md ("Overload") explains them.
 */
export const DB_LIMITS = {
  /** PostgreSQL connections per instance (node-postgres pool). Several instances share the server's max_connections (default 100). */
  poolSize: 10,
  /** Longest wait for a free pooled connection (PostgreSQL) before the query fails. */
  connectionWaitMs: 10_000,
  /** Longest wait to start an interactive transaction (Prisma maxWait; P2028 beyond it). PGlite runs one at a time. */
  transactionMaxWaitMs: 10_000,
  /** Longest an interactive transaction may run before it is rolled back (Prisma timeout; P2028). Bulk imports ask for more. */
  transactionTimeoutMs: 15_000,
} as const;

export interface DbLimits {
  poolSize?: number;
  connectionWaitMs?: number;
  transactionMaxWaitMs?: number;
  transactionTimeoutMs?: number;
}

const newClient = (adapter: runtime.SqlDriverAdapterFactory, limits: Required<DbLimits>): Db =>
  new PrismaClient({
    adapter, omit: secretColumns,
    transactionOptions: { maxWait: limits.transactionMaxWaitMs, timeout: limits.transactionTimeoutMs },
  });

export interface Database {
  db: Db;
  /** Disconnects, closes an embedded database and releases its data-dir lock. */
  close: () => Promise<void>;
}

export interface CreateDbOptions {
  /** `postgresql://…`, `pglite:<dir>` (an embedded data dir, created if missing) or `pglite:memory` (throw-away). */
  url: string;
  /** Apply pending migrations before returning (default true). */
  migrate?: boolean;
  migrationsDir?: MigrateOptions["migrationsDir"];
  log?: MigrateOptions["log"];
  /** Pool and transaction limits; DB_LIMITS for any left out (tests shrink them to provoke overload). */
  limits?: DbLimits;
}

const limitsOf = (options: CreateDbOptions): Required<DbLimits> => ({ ...DB_LIMITS, ...options.limits });

async function openPglite(dir: string, options: CreateDbOptions): Promise<Database> {
  const release = dir === "memory" ? () => undefined : lockDataDir(dir);
  try {
    const { PGlite } = await import("@electric-sql/pglite");
    const { PrismaPGlite } = await import("pglite-prisma-adapter");
    const pglite = dir === "memory" ? new PGlite() : new PGlite(dir);
    try {
      await pglite.waitReady;
      if (options.migrate !== false) await migrate(pgliteSession(pglite), options);
      const db = newClient(new PrismaPGlite(pglite), limitsOf(options));
      return {
        db,
        close: async () => {
          try {
            await db.$disconnect();
            await pglite.close();
          } finally {
            release();
          }
        },
      };
    } catch (e) {
      await pglite.close().catch(() => undefined);
      throw e;
    }
  } catch (e) {
    release();
    throw e;
  }
}

async function openPostgres(url: string, options: CreateDbOptions): Promise<Database> {
  const { default: pg } = await import("pg");
  const { PrismaPg } = await import("@prisma/adapter-pg");
  if (options.migrate !== false) {
    const session = new pg.Client({ connectionString: url });
    await session.connect();
    try {
      await migrate(pgSession(session), options);
    } finally {
      await session.end();
    }
  }
  const limits = limitsOf(options);
  const db = newClient(new PrismaPg({ connectionString: url, max: limits.poolSize, connectionTimeoutMillis: limits.connectionWaitMs }), limits);
  return { db, close: () => db.$disconnect() };
}

/** Opens a database of its own (tests, scripts). The caller closes it. */
export async function createDb(options: CreateDbOptions): Promise<Database> {
  const { url } = options;
  if (url.startsWith("pglite:")) return openPglite(url.slice("pglite:".length), options);
  if (/^postgres(ql)?:\/\//.test(url)) return openPostgres(url, options);
  throw new Error(`Unsupported database URL "${url.split(":")[0]}:…": use postgresql://…, pglite:<dir> or pglite:memory.`);
}

function configuredUrl(): string {
  const { databaseUrl, dataDir } = env();
  return databaseUrl ?? `pglite:${dataDir}`;
}

/** Where getDb() connects, for start-up messages (never shows a password). */
export function describeDatabase(): string {
  const url = configuredUrl();
  if (url.startsWith("pglite:")) return `embedded database at ${displayPath(url.slice("pglite:".length))}`;
  const parsed = new URL(url);
  return `PostgreSQL database ${parsed.pathname.slice(1) || "(default)"} on ${parsed.host}`;
}

/** Opens the configured database as a private instance (scripts that must report migrations or close it themselves). */
export function openConfiguredDb(options: Omit<CreateDbOptions, "url"> = {}): Promise<Database> {
  return createDb({ ...options, url: configuredUrl() });
}

// Cached on globalThis so that Next's dev-mode module reloads reuse the open database instead of locking it twice.
const shared = globalThis as typeof globalThis & { __layerwiseDatabase?: Promise<Database> };

function openShared(): Promise<Database> {
  const opening = createDb({ url: configuredUrl() });
  opening.catch(() => {
    if (shared.__layerwiseDatabase === opening) shared.__layerwiseDatabase = undefined; // let a later call retry
  });
  return opening;
}

/** The app's database client, opened (and migrated) on first use. */
export async function getDb(): Promise<Db> {
  return (await (shared.__layerwiseDatabase ??= openShared())).db;
}

/** Closes the app's database if it is open (end of scripts, tests). */
export async function closeDb(): Promise<void> {
  const opening = shared.__layerwiseDatabase;
  shared.__layerwiseDatabase = undefined;
  const database = await opening?.catch(() => undefined); // a failed open has nothing to close
  await database?.close();
}
