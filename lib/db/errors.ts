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
