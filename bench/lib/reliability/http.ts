// One HTTP exchange with the instance, never throwing: a reset or a timeout is an answer too (status -1 / -2), so
// the bench can count it instead of stopping.
export interface Answer {
  status: number;
  headers: Headers;
  body: string;
  ms: number;
  /** "reset" (connection dropped, or the body broke off), "timeout", or null. */
  failure: "reset" | "timeout" | null;
}

export interface Ask {
  method?: string;
  headers?: Record<string, string>;
  body?: string | Uint8Array;
  timeoutMs?: number;
}

export async function ask(base: string, path: string, options: Ask = {}): Promise<Answer> {
  const t0 = performance.now();
  try {
    const res = await fetch(base + path, {
      method: options.method ?? "GET",
      headers: options.headers,
      body: options.body as BodyInit | undefined,
      redirect: "manual",
      signal: AbortSignal.timeout(options.timeoutMs ?? 60_000),
    });
    let body = "";
    try {
      body = await res.text();
    } catch {
      return { status: res.status, headers: res.headers, body, ms: performance.now() - t0, failure: "reset" };
    }
    return { status: res.status, headers: res.headers, body, ms: performance.now() - t0, failure: null };
  } catch (error) {
    const timeout = error instanceof Error && (error.name === "TimeoutError" || error.name === "AbortError");
    const cause = error instanceof Error ? `${error.message}${error.cause instanceof Error ? `: ${error.cause.message}` : ""}` : "request failed";
    return { status: timeout ? -2 : -1, headers: new Headers(), body: cause, ms: performance.now() - t0, failure: timeout ? "timeout" : "reset" };
  }
}

export const bearer = (token: string) => ({ authorization: `Bearer ${token}` });
export const jsonHeaders = (token: string) => ({ ...bearer(token), "content-type": "application/json" });

/** Runs `jobs` with at most `width` at once, in order of the list. */
export async function pool<T, R>(items: readonly T[], width: number, job: (item: T, index: number) => Promise<R>): Promise<R[]> {
  const out: R[] = new Array<R>(items.length);
  let next = 0;
  await Promise.all(Array.from({ length: Math.min(width, items.length) }, async () => {
    while (next < items.length) {
      const i = next++;
      out[i] = await job(items[i] as T, i);
    }
  }));
  return out;
}
