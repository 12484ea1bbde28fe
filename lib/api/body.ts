// Reading request bodies for the JSON API: a size limit enforced while streaming (a missing or false Content-Length
// does not get past it), and clear messages for an empty body, malformed JSON (400) and an oversized one (413).
import { BadRequestError, PayloadTooLargeError, RequestTimeoutError } from "@/lib/errors";

/** A body that sends nothing for this long is dropped (the README states it). */
export const BODY_IDLE_TIMEOUT_MS = 30_000;

export interface BodyOptions {
  /** Longest pause between two chunks of the body. Default BODY_IDLE_TIMEOUT_MS. */
  idleTimeoutMs?: number;
}

/** The next chunk, or RequestTimeoutError when none comes within `ms`. */
async function readWithin(reader: ReadableStreamDefaultReader<Uint8Array>, ms: number): Promise<ReadableStreamReadResult<Uint8Array>> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const stalled = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new RequestTimeoutError(`The request body stalled: nothing arrived for ${Math.round(ms / 1000)} s. Send it again.`)), ms);
  });
  try {
    return await Promise.race([reader.read(), stalled]);
  } finally {
    clearTimeout(timer);
  }
}

/** Default limit for JSON bodies: a workup with 50 components and 200 steps is well under 200 kB. */
export const JSON_BODY_LIMIT = 1024 * 1024;

function describeLimit(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(0)} MB` : `${(bytes / 1024).toFixed(0)} kB`;
}

function tooLarge(limit: number): PayloadTooLargeError {
  return new PayloadTooLargeError(`The request body is larger than ${describeLimit(limit)}. Send less at once.`);
}

/** The body's bytes, refusing it as soon as it passes `limit` bytes. */
export async function readBodyBytes(request: Request, limit: number, options: BodyOptions = {}): Promise<Uint8Array<ArrayBuffer>> {
  const declared = request.headers.get("content-length");
  if (declared !== null && /^\d+$/.test(declared) && Number(declared) > limit) throw tooLarge(limit);
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    let chunk: ReadableStreamReadResult<Uint8Array>;
    try {
      chunk = await readWithin(reader, options.idleTimeoutMs ?? BODY_IDLE_TIMEOUT_MS);
    } catch (error) {
      await reader.cancel().catch(() => undefined);
      throw error;
    }
    const { done, value } = chunk;
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel();
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  const joined = new Uint8Array(size);
  let offset = 0;
  for (const chunk of chunks) {
    joined.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return joined;
}

/** A body's bytes as text, or BadRequestError when they are not UTF-8. */
export function bodyText(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new BadRequestError("The request body is not valid UTF-8 text.");
  }
}

/** A body's text parsed as JSON, or BadRequestError naming what is wrong (also used on engine threads). */
export function bodyJson(text: string): unknown {
  if (text.trim() === "") throw new BadRequestError("The request body is empty: send a JSON object.");
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    const detail = error instanceof SyntaxError ? ` (${error.message})` : "";
    throw new BadRequestError(`The request body is not valid JSON${detail}.`);
  }
}

/** The body as text, refusing it as soon as it passes `limit` bytes. */
export async function readBodyText(request: Request, limit: number, options: BodyOptions = {}): Promise<string> {
  return bodyText(await readBodyBytes(request, limit, options));
}

/** Parses a JSON body. The value is unknown: validate it with the route's zod schema. */
export async function readJsonBody(request: Request, limit = JSON_BODY_LIMIT, options: BodyOptions = {}): Promise<unknown> {
  return bodyJson(await readBodyText(request, limit, options));
}

/** Query-string parameters as a plain object (repeated names keep the last value). */
export function queryOf(request: Request): Record<string, string> {
  return Object.fromEntries(new URL(request.url).searchParams.entries());
}
