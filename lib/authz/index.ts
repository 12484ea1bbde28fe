// The guard as the app uses it. Start every page loader, server action and route handler with one of these.
import { cache } from "react";
import { getDb } from "@/lib/db/client";
import { UnauthenticatedError } from "@/lib/errors";
import { assertSessionCurrent, resolveMember, type GuardOptions, type MemberContext } from "@/lib/authz/guard";
import { type Permission } from "@/lib/authz/permissions";
import { requestCredentials } from "@/lib/authz/request";

export { can, found, resolveMember, type Credentials, type GuardOptions, type MemberContext } from "@/lib/authz/guard";
export { PERMISSIONS, ROLES, ROLE_LABELS, isRoleName, roleCan, type Permission, type RoleName } from "@/lib/authz/permissions";

/** One credentials lookup per request even when layout and page both ask (React cache is per request). */
const currentCredentials = cache(requestCredentials);

/**
 * The signed-in member of the active group (or of `options.group`), holding `permission`.
 * Throws UnauthenticatedError 401, NotFoundError 404, ForbiddenError 403 (NoMembershipError when in no group).
 */
export async function requireMember(permission: Permission, options?: GuardOptions): Promise<MemberContext> {
  return resolveMember(await currentCredentials(), permission, options);
}

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
}

/** A signed-in person whether or not they belong to a group (invite acceptance, the no-group page). */
export async function requireUser(): Promise<SignedInUser> {
  const credentials = await currentCredentials();
  if (credentials?.kind !== "session") throw new UnauthenticatedError();
  await assertSessionCurrent(credentials.userId, credentials.sessionVersion);
  const db = await getDb();
  const user = await db.user.findUnique({ where: { id: credentials.userId }, select: { id: true, email: true, name: true } });
  if (!user) throw new UnauthenticatedError("Your account no longer exists. Sign in again.");
  return user;
}

/** Like requireUser, but null when nobody is signed in. */
export async function currentUser(): Promise<SignedInUser | null> {
  try {
    return await requireUser();
  } catch (error) {
    if (error instanceof UnauthenticatedError) return null;
    throw error;
  }
}
