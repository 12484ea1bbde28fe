// The guard for route handlers: every JSON API route is written as memberRoute(permission, handler), so a handler
// cannot forget the check, and every error leaves through errorResponse (401/403/404/409/422/429, or 500 + id).
import { errorResponse } from "@/lib/errors";
import { requireMember } from "@/lib/authz/index";
import { type GuardOptions, type MemberContext } from "@/lib/authz/guard";
import { type Permission } from "@/lib/authz/permissions";

export interface RouteArgs<P> {
  member: MemberContext;
  params: P;
}

type RouteContext<P> = { params: Promise<P> };

export function memberRoute<P = Record<string, never>>(
  permission: Permission,
  handler: (request: Request, args: RouteArgs<P>) => Response | Promise<Response>,
  options?: GuardOptions,
): (request: Request, context: RouteContext<P>) => Promise<Response> {
  return async (request, context) => {
    try {
      const member = await requireMember(permission, options);
      return await handler(request, { member, params: await context.params });
    } catch (error) {
      return errorResponse(error, `${request.method} ${new URL(request.url).pathname}`);
    }
  };
}
