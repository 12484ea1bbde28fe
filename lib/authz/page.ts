// The guard for page loaders: the same checks as requireMember, answered the way a browser expects
// (sign-in redirect, the no-group page, 404, 403).
import { forbidden, notFound, redirect } from "next/navigation";
import { ForbiddenError, NoMembershipError, NotFoundError, UnauthenticatedError } from "@/lib/errors";
import { requireMember, requireUser, type SignedInUser } from "@/lib/authz/index";
import { type GuardOptions, type MemberContext } from "@/lib/authz/guard";
import { type Permission } from "@/lib/authz/permissions";

export interface PageGuardOptions extends GuardOptions {
  /** Where to come back to after signing in (a path inside the app). */
  returnTo?: string;
}

export function signInPath(returnTo?: string): string {
  return returnTo && isLocalPath(returnTo) ? `/sign-in?callbackUrl=${encodeURIComponent(returnTo)}` : "/sign-in";
}

/** Only same-origin paths may be returned to, so a crafted link cannot send someone elsewhere after sign-in. */
export function isLocalPath(path: string): boolean {
  return path.startsWith("/") && !path.startsWith("//") && !path.startsWith("/\\");
}

/**
 * Answers a guard failure the way a browser expects; anything else is rethrown to the error page. Also for page
 * loaders' own lookups: `await getWorkup(member, id).catch(pageFailure)` turns a scoped miss into the 404 page.
 */
export function pageFailure(error: unknown, returnTo?: string): never {
  if (error instanceof UnauthenticatedError) redirect(signInPath(returnTo));
  if (error instanceof NoMembershipError) redirect("/no-group");
  if (error instanceof NotFoundError) notFound();
  if (error instanceof ForbiddenError) forbidden();
  throw error;
}

export async function requirePageMember(permission: Permission, options: PageGuardOptions = {}): Promise<MemberContext> {
  try {
    return await requireMember(permission, { ...options, sessionOnly: true });
  } catch (error) {
    pageFailure(error, options.returnTo);
  }
}

export async function requirePageUser(returnTo?: string): Promise<SignedInUser> {
  try {
    return await requireUser();
  } catch (error) {
    if (error instanceof UnauthenticatedError) redirect(signInPath(returnTo));
    throw error;
  }
}
