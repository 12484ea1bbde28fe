// The guard as the app uses it. Start every page loader, server action and route handler with one of these.
// Within one request (a page with its layout, which both ask), the credentials and the signed-in user's account
// (user, session version, memberships with their groups: one statement) are read once: React's cache() is per
// request on the server and holds nothing between requests. Route handlers ask once anyway.
import { cache } from "react";
import { getDb, type Db } from "@/lib/db/client";
import { UnauthenticatedError } from "@/lib/errors";
import { assertSessionCurrent, loadSessionAccount, resolveMember, type Credentials, type GuardOptions, type MemberContext } from "@/lib/authz/guard";
import { type Permission, type RoleName } from "@/lib/authz/permissions";
import { requestCredentials } from "@/lib/authz/request";

export { can, found, resolveMember, type Credentials, type GuardOptions, type MemberContext } from "@/lib/authz/guard";
export { PERMISSIONS, ROLES, ROLE_LABELS, isRoleName, roleCan, type Permission, type RoleName } from "@/lib/authz/permissions";

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
}

/** A group of the signed-in user, for the group switcher. */
export interface SignedInGroup {
  id: string;
  name: string;
  slug: string;
  role: RoleName;
}

export interface RequestGuard {
  /**
   * The signed-in member of the active group (or of `options.group`), holding `permission`.
   * Throws UnauthenticatedError 401, NotFoundError 404, ForbiddenError 403 (NoMembershipError when in no group).
   */
  requireMember(permission: Permission, options?: GuardOptions): Promise<MemberContext>;
  /** A signed-in person whether or not they belong to a group (invite acceptance, the no-group page). */
  requireUser(): Promise<SignedInUser>;
  /** The signed-in user's groups, ordered by name (the frame's group switcher). */
  signedInGroups(): Promise<SignedInGroup[]>;
}

/**
 * The guard over one source of credentials and one database, with the per-request reads cached. The app's guard is
 * built from the request's credentials and the app's database below; tests build one over a database they count.
 */
export function requestGuard(readCredentials: () => Promise<Credentials | null>, openDb: () => Promise<Db>): RequestGuard {
  const credentials = cache(readCredentials);
  const account = cache(async (userId: string) => loadSessionAccount(userId, await openDb()));
  const currentAccount = async () => {
    const c = await credentials();
    if (c?.kind !== "session") throw new UnauthenticatedError();
    return assertSessionCurrent(await account(c.userId), c.sessionVersion);
  };
  return {
    requireMember: async (permission, options) => resolveMember(await credentials(), permission, options, account),
    requireUser: async () => {
      const { user } = await currentAccount();
      return { id: user.id, email: user.email, name: user.name };
    },
    signedInGroups: async () => (await currentAccount()).memberships.map((m) => ({ ...m.group, role: m.role as RoleName })),
  };
}

const appGuard = requestGuard(requestCredentials, getDb);

export const requireMember: RequestGuard["requireMember"] = (permission, options) => appGuard.requireMember(permission, options);
export const requireUser: RequestGuard["requireUser"] = () => appGuard.requireUser();
export const signedInGroups: RequestGuard["signedInGroups"] = () => appGuard.signedInGroups();

/** Like requireUser, but null when nobody is signed in. */
export async function currentUser(): Promise<SignedInUser | null> {
  try {
    return await requireUser();
  } catch (error) {
    if (error instanceof UnauthenticatedError) return null;
    throw error;
  }
}
