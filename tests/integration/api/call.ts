/**
 * Calls the app's route handlers as Next.js would, without starting a server: each call runs inside the request
 * scope that `headers()` reads (Next's work and work-unit async storage), so the real guard (lib/authz: request.ts →
 * resolveMember) sees the Authorization header and the API token is looked up in the database. The storage modules
 * are Next internals (next 16.4.6); if an upgrade moves them, this helper is the one place to change.
 */
import "./next-runtime";
import { randomBytes } from "node:crypto";
import { workAsyncStorage } from "next/dist/server/app-render/work-async-storage.external";
import { workUnitAsyncStorage } from "next/dist/server/app-render/work-unit-async-storage.external";
import { HeadersAdapter } from "next/dist/server/web/spec-extension/adapters/headers";
import { RequestCookiesAdapter } from "next/dist/server/web/spec-extension/adapters/request-cookies";
import { RequestCookies } from "next/dist/server/web/spec-extension/cookies";
import { newApiToken } from "@/lib/authz/api-token-format";
import { type Db } from "@/lib/db/client";

/** Any route handler: its params type is whatever its route declares (the caller passes matching `params`). */
type Handler = (request: Request, context: { params: Promise<never> }) => Promise<Response> | Response;

export interface CallOptions {
  token?: string | null;
  params?: Record<string, string>;
  /** A JSON value, or raw text sent as is (malformed JSON, CSV). */
  body?: unknown;
  rawBody?: string | Uint8Array;
  headers?: Record<string, string>;
  query?: Record<string, string>;
}

export async function callRoute(handler: Handler, method: string, path: string, options: CallOptions = {}): Promise<Response> {
  const url = new URL(`http://localhost${path}`);
  for (const [k, v] of Object.entries(options.query ?? {})) url.searchParams.set(k, v);
  const headers = new Headers(options.headers);
  if (options.token) headers.set("authorization", `Bearer ${options.token}`);
  let body: BodyInit | undefined;
  if (options.rawBody !== undefined) body = options.rawBody as BodyInit;
  else if (options.body !== undefined) {
    body = JSON.stringify(options.body);
    headers.set("content-type", "application/json");
  }
  const request = new Request(url, { method, headers, body });
  const workStore = { route: url.pathname, page: url.pathname, forceStatic: false, dynamicShouldError: false, isStaticGeneration: false };
  // The Cookie header as cookies() reads it; in the "action" phase Next reads the userspace mutable copy.
  const cookies = RequestCookiesAdapter.seal(new RequestCookies(headers));
  const requestStore = { type: "request", phase: "action", headers: HeadersAdapter.seal(new Headers(headers)), url: { pathname: url.pathname, search: url.search }, cookies, mutableCookies: cookies, userspaceMutableCookies: cookies };
  type WorkStore = Parameters<typeof workAsyncStorage.run>[0];
  type UnitStore = Parameters<typeof workUnitAsyncStorage.run>[0];
  return workAsyncStorage.run(workStore as unknown as WorkStore, () =>
    workUnitAsyncStorage.run(requestStore as unknown as UnitStore, () =>
      Promise.resolve(handler(request, { params: Promise.resolve(options.params ?? {}) as Promise<never> })),
    ),
  );
}

/** An API token for a member, created through the data layer the way the settings page does. */
export async function tokenFor(db: Db, groupId: string, userId: string): Promise<string> {
  const { token, tokenHash, prefix } = newApiToken();
  await db.apiToken.create({ data: { groupId, userId, name: `test ${randomBytes(3).toString("hex")}`, prefix, tokenHash } });
  return token;
}

export async function json<T = Record<string, unknown>>(response: Response): Promise<T> {
  return (await response.json()) as T;
}
