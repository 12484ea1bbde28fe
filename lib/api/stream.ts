// Streamed responses: text chunks from an async generator, and NDJSON progress lines from a long task.
import { errorResponse, type ErrorBody } from "@/lib/errors";

export function textStream(chunks: AsyncIterable<string>): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  const iterator = chunks[Symbol.asyncIterator]();
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      const next: IteratorResult<string, unknown> = await iterator.next();
      if (next.done) controller.close();
      else controller.enqueue(encoder.encode(next.value));
    },
    async cancel() {
      await iterator.return?.();
    },
  });
}

/**
 * Like textStream, but the first chunk is produced before the stream is returned, so the route can still answer
 * an error (a 4xx with its message) instead of sending 200 and its headers and then breaking the connection.
 */
export async function primedTextStream(chunks: AsyncIterable<string>): Promise<ReadableStream<Uint8Array>> {
  const iterator = chunks[Symbol.asyncIterator]();
  const first = await iterator.next();
  async function* rest(): AsyncGenerator<string> {
    if (first.done) return;
    yield first.value;
    for (let next = await iterator.next(); !next.done; next = await iterator.next()) yield next.value;
  }
  const stream = textStream(rest());
  return stream;
}

/**
 * Runs `task` while streaming each object it sends as one JSON line. A failure ends the stream with
 * {"type":"error", ...} carrying the same body the API answers errors with.
 */
export function ndjsonResponse(task: (send: (line: object) => void) => Promise<void>): Response {
  const encoder = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (line: object) => controller.enqueue(encoder.encode(`${JSON.stringify(line)}\n`));
      try {
        await task(send);
      } catch (error) {
        const response = errorResponse(error, "streamed task");
        const body = (await response.json()) as ErrorBody;
        send({ type: "error", status: response.status, ...body });
      }
      controller.close();
    },
  });
  return new Response(stream, { headers: { "Content-Type": "application/x-ndjson; charset=utf-8", "Cache-Control": "no-store" } });
}
