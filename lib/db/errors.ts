// Prisma's known request errors, by name rather than by magic string. Codes: Prisma error reference
// (https://www.prisma.io/docs/orm/reference/error-reference), "Prisma Client (Query Engine)".
import { Prisma } from "@/generated/prisma/client";

export const PrismaErrorCode = {
  /** Unique constraint failed. */
  uniqueViolation: "P2002",
  /** Foreign key constraint failed. */
  foreignKeyViolation: "P2003",
  /** A required record was not found (update/delete/connect of a missing row, findUniqueOrThrow). */
  recordNotFound: "P2025",
  /** Interactive transaction problem (e.g. it timed out or was already closed). */
  transactionFailed: "P2028",
  /** Write conflict or deadlock: the transaction may be retried. */
  writeConflict: "P2034",
} as const;

export type PrismaErrorName = keyof typeof PrismaErrorCode;

export function isPrismaError(error: unknown, name: PrismaErrorName): error is Prisma.PrismaClientKnownRequestError {
  return error instanceof Prisma.PrismaClientKnownRequestError && error.code === PrismaErrorCode[name];
}

export const isUniqueViolation = (error: unknown) => isPrismaError(error, "uniqueViolation");
export const isRecordNotFound = (error: unknown) => isPrismaError(error, "recordNotFound");
export const isForeignKeyViolation = (error: unknown) => isPrismaError(error, "foreignKeyViolation");

/** Prisma's "timed out fetching a new connection from the connection pool". */
const POOL_TIMEOUT = "P2024";

/** node-postgres's messages when no pooled connection came within connectionTimeoutMillis (pg-pool, pg). */
const POOL_WAIT_MESSAGES = [/timeout exceeded when trying to connect/i, /connection terminated due to connection timeout/i];

function messagesOf(error: unknown): string[] {
  const out: string[] = [];
  for (let e: unknown = error, depth = 0; e instanceof Error && depth < 5; e = e.cause, depth++) out.push(e.message);
  return out;
}

/**
 * The database could not take the work in time: an interactive transaction could not start within its maxWait
 * (P2028), or no connection of the pool came free (P2024, or node-postgres's own connection timeout). Nothing was
 * written; the request may be retried, so lib/errors.ts answers 503 with Retry-After rather than 500.
 * P2028 also names a transaction that ran past its timeout; that one was rolled back, so the same answer holds.
 */
export function isOverloadError(error: unknown): boolean {
  if (isPrismaError(error, "transactionFailed")) return true;
  if (error instanceof Prisma.PrismaClientKnownRequestError && error.code === POOL_TIMEOUT) return true;
  return messagesOf(error).some((m) => POOL_WAIT_MESSAGES.some((re) => re.test(m)));
}
