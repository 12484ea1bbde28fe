// Typed errors carry their HTTP status; errorResponse() and actionFailure() are the only places that turn an error
// into something a user sees. Only AppError messages are shown; anything else is logged under an id and answered
// with a generic message, so internals (SQL, stack traces, file paths) never reach a browser.
import { randomUUID } from "node:crypto";
import { unstable_rethrow } from "next/navigation";
import { z } from "zod";
import { isOverloadError, isRecordNotFound, isUniqueViolation } from "@/lib/db/errors";
import { findUnsafeText } from "@/lib/validation/safe-text";

export type FieldErrors = Record<string, string[]>;

/**
 * Messages grouped by field path. The paths come from the client's own keys, so they are collected in a Map and
 * made into own properties: a key such as "constructor" or "__proto__" must not reach Object.prototype.
 */
function fieldErrorsOf(issues: readonly { path: readonly PropertyKey[]; message: string }[]): FieldErrors {
  const byField = new Map<string, string[]>();
  for (const issue of issues) {
    const key = issue.path.length > 0 ? issue.path.map(String).join(".") : "_form";
    const messages = byField.get(key) ?? [];
    messages.push(issue.message);
    byField.set(key, messages);
  }
  return Object.fromEntries(byField);
}

export abstract class AppError extends Error {
  abstract readonly status: number;
  abstract readonly code: string;
}

export class UnauthenticatedError extends AppError {
  readonly status = 401;
  readonly code = "unauthenticated";
  constructor(message = "Sign in to continue.") {
    super(message);
  }
}

export class ForbiddenError extends AppError {
  readonly status = 403;
  readonly code = "forbidden";
  constructor(message = "Your role in this group does not allow this.") {
    super(message);
  }
}

/** Signed in, but not a member of any group yet (pages send such users to /no-group). */
export class NoMembershipError extends ForbiddenError {
  constructor() {
    super("You are not a member of any group yet. Open the invite link a group lead sent you.");
  }
}

export class NotFoundError extends AppError {
  readonly status = 404;
  readonly code = "not_found";
  constructor(what = "record") {
    super(`No such ${what}.`);
  }
}

export class ConflictError extends AppError {
  readonly status = 409;
  readonly code = "conflict";
}

export class PayloadTooLargeError extends AppError {
  readonly status = 413;
  readonly code = "payload_too_large";
}

/** The client stopped sending its request body (a stalled upload holds a connection and memory). */
export class RequestTimeoutError extends AppError {
  readonly status = 408;
  readonly code = "request_timeout";
}

export class BadRequestError extends AppError {
  readonly status = 400;
  readonly code = "bad_request";
}

export class UnsupportedMediaTypeError extends AppError {
  readonly status = 415;
  readonly code = "unsupported_media_type";
}

export class ValidationError extends AppError {
  readonly status = 422;
  readonly code = "validation";
  constructor(
    readonly fieldErrors: FieldErrors,
    message = "Some fields need attention.",
  ) {
    super(message);
  }

  static fromZod(error: z.ZodError): ValidationError {
    return new ValidationError(fieldErrorsOf(error.issues));
  }
}

export class RateLimitedError extends AppError {
  readonly status = 429;
  readonly code = "rate_limited";
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super(message);
  }
}

/**
 * The instance is saturated (its engine threads or its database connections are all busy for longer than a request
 * may wait): 503 with Retry-After, nothing written. Clients retry after the stated seconds.
 */
export class ServiceUnavailableError extends AppError {
  readonly status = 503;
  readonly code = "overloaded";
  constructor(
    message = "The server is busy right now; nothing was saved. Try again in a few seconds.",
    readonly retryAfterSeconds = 5,
  ) {
    super(message);
  }
}

/** Normalises anything thrown into an AppError when we know what it means, else undefined. */
export function asAppError(error: unknown): AppError | undefined {
  if (error instanceof AppError) return error;
  if (isOverloadError(error)) return new ServiceUnavailableError();
  if (error instanceof z.ZodError) return ValidationError.fromZod(error);
  if (isRecordNotFound(error)) return new NotFoundError();
  if (isUniqueViolation(error)) return new ConflictError("A record with these values already exists.");
  return undefined;
}

/** Logs an unexpected error under a fresh id and returns the id for the user to quote. */
export function logUnexpected(error: unknown, where: string): string {
  const id = randomUUID().slice(0, 8);
  console.error(`[layerwise] unexpected error ${id} in ${where}:`, error);
  return id;
}

export interface ErrorBody {
  error: { code: string; message: string; fields?: FieldErrors; id?: string };
}

/** The one mapping from a thrown value to an HTTP response (route handlers). */
export function errorResponse(error: unknown, where = "route handler"): Response {
  const known = asAppError(error);
  if (known) {
    const body: ErrorBody = { error: { code: known.code, message: known.message } };
    if (known instanceof ValidationError) body.error.fields = known.fieldErrors;
    const headers: Record<string, string> = {};
    if (known instanceof RateLimitedError || known instanceof ServiceUnavailableError) headers["Retry-After"] = String(known.retryAfterSeconds);
    return Response.json(body, { status: known.status, headers });
  }
  const id = logUnexpected(error, where);
  const body: ErrorBody = { error: { code: "internal", message: `Something went wrong (reference ${id}).`, id } };
  return Response.json(body, { status: 500 });
}

export type ActionResult<T = undefined> =
  | { ok: true; data: T; message?: string }
  | { ok: false; status: number; message: string; fieldErrors?: FieldErrors; retryAfterSeconds?: number };

/** The same mapping for server actions, whose results travel to a form instead of an HTTP body. */
export function actionFailure(error: unknown, where = "server action"): ActionResult<never> {
  unstable_rethrow(error); // redirect(), notFound() and friends are control flow, not failures
  const known = asAppError(error);
  if (known) {
    return {
      ok: false,
      status: known.status,
      message: known.message,
      ...(known instanceof ValidationError ? { fieldErrors: known.fieldErrors } : {}),
      ...(known instanceof RateLimitedError || known instanceof ServiceUnavailableError ? { retryAfterSeconds: known.retryAfterSeconds } : {}),
    };
  }
  const id = logUnexpected(error, where);
  return { ok: false, status: 500, message: `Something went wrong (reference ${id}).` };
}

/** Parses input with a zod schema, throwing ValidationError (422, messages by field) when it does not fit. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  refuseUnsafeText(input);
  const result = schema.safeParse(input);
  if (!result.success) throw ValidationError.fromZod(result.error);
  return result.data;
}

/** NUL characters and broken UTF-16 cannot be stored: 422 naming each field, before the schema or any query runs. */
export function refuseUnsafeText(input: unknown): void {
  const problems = findUnsafeText(input);
  if (problems.length === 0) return;
  throw new ValidationError(fieldErrorsOf(problems));
}

/** A form's fields as a plain object (files and repeated names are not used by our forms). */
export function formFields(form: FormData): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === "string") fields[key] = value;
  return fields;
}
