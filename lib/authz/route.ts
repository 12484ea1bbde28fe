// The guard for route handlers: every JSON API route is written as memberRoute(permission, handler), so a handler
// cannot forget the check, and every error leaves through errorResponse (401/403/404/409/415/422/429, or 500 + id).
// A state-changing request carried by the session cookie must also come from our own pages (./csrf.ts).
import { env } from "@/lib/env";
import { errorResponse, refuseUnsafeText } from "@/lib/errors";
import { requireMember } from "@/lib/authz/index";
import { assertSameOriginWrite } from "@/lib/authz/csrf";
import { type GuardOptions, type MemberContext } from "@/lib/authz/guard";
import { type Permission } from "@/lib/authz/permissions";

export interface RouteArgs<P> {
  member: MemberContext;
  params: P;
}

export interface RouteOptions extends GuardOptions {
  /** Body media types a browser session may send to this route (default application/json), e.g. ["text/csv"]. */
  bodyTypes?: readonly string[];
  /** A query parameter that narrows the answer to one person's records: only that person or a lead may use it. */
  personParam?: string;
}

type RouteContext<P> = { params: Promise<P> };

export function memberRoute<P = Record<string, never>>(
  permission: Permission,
  handler: (request: Request, args: RouteArgs<P>) => Response | Promise<Response>,
  options: RouteOptions = {},
): (request: Request, context: RouteContext<P>) => Promise<Response> {
  return async (request, context) => {
    try {
      const person = options.personParam ? new URL(request.url).searchParams.get(options.personParam) : null;
      const member = await requireMember(permission, { ...options, person });
      if (member.via === "session") assertSameOriginWrite(request, { bodyTypes: options.bodyTypes, publicUrl: env().nextAuthUrl });
      const params = await context.params;
      refuseUnsafeText(params); // a NUL or broken character in a path segment: 422, not a failed query
      return await handler(request, { member, params });
    } catch (error) {
      return errorResponse(error, `${request.method} ${new URL(request.url).pathname}`);
    }
  };
}
