// Every compound write is stamped with the database server's clock, not the app instance's, so that several app
// instances with drifting clocks agree on one time line; search-service.ts relies on this for its watermark.
import { type Db } from "@/lib/db/client";

type Sql = Pick<Db, "$queryRaw">;

/**
 * The start time of the current transaction on the database server. Inside an interactive transaction this is the
 * same instant for every row the transaction writes, and it is never later than the transaction's commit.
 */
export async function databaseNow(sql: Sql): Promise<Date> {
  const rows = await sql.$queryRaw<{ now: Date }[]>`SELECT now() AS now`;
  const now = rows[0]?.now;
  if (!(now instanceof Date)) throw new Error("The database did not report its clock.");
  return now;
}

/**
 * Longest a compound-writing transaction may stay open (Prisma rolls back after this). A reader that has seen
 * everything committed up to time W has therefore seen every row stamped before W − WRITE_TIMEOUT_MS.
 */
export const WRITE_TIMEOUT_MS = 20_000;

export const writeTransaction = { timeout: WRITE_TIMEOUT_MS, maxWait: 5_000 } as const;
