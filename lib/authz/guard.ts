// THE authorization guard. Every page loader, server action and route handler gets its MemberContext from here
// (through requireMember in ./index.ts); nothing else decides who may see or change a group's data.
// This file does not touch the request, so integration tests can call resolveMember with explicit credentials.
import { getDb, type Db } from "@/lib/db/client";
import { ForbiddenError, NoMembershipError, NotFoundError, UnauthenticatedError } from "@/lib/errors";
import { hashApiToken, looksLikeApiToken } from "@/lib/authz/api-token-format";
import { assertRoleCan, roleCan, type Permission, type RoleName } from "@/lib/authz/permissions";
import { assertMaySeePerson } from "@/lib/authz/people";

/** Who is asking: a signed-in browser session, or a bearer API token. */
export type Credentials =
  | { kind: "session"; userId: string; activeGroupId: string | null; /** User.sessionVersion when the session began (absent = 0). */ sessionVersion?: number }
  | { kind: "token"; token: string };

export interface MemberContext {
  user: { id: string; email: string; name: string };
  group: { id: string; name: string; slug: string };
  role: RoleName;
  via: "session" | "token";
}

export interface GuardOptions {
  /** A group id or slug named by the request; a group the user is not in answers 404. */
  group?: string;
  /** Pages and server actions: a browser session only. API tokens open the JSON API and nothing else. */
  sessionOnly?: boolean;
  /** The request narrows figures to this one person (a chemist filter): only they or a lead may (./people.ts). */
  person?: string | null;
}

const memberSelect = {
  role: true,
  group: { select: { id: true, name: true, slug: true } },
  user: { select: { id: true, email: true, name: true } },
} as const;

/** Only touch lastUsedAt once a minute per token, so reads do not become writes. */
const LAST_USED_RESOLUTION_MS = 60_000;

async function membershipForToken(token: string, options: GuardOptions) {
  if (!looksLikeApiToken(token)) throw new UnauthenticatedError("This API token is not valid.");
  const db = await getDb();
  const found = await db.apiToken.findUnique({
    where: { tokenHash: hashApiToken(token) },
    select: { id: true, userId: true, groupId: true, revokedAt: true, lastUsedAt: true, expiresAt: true },
  });
  if (!found || found.revokedAt) throw new UnauthenticatedError("This API token is not valid or has been revoked.");
  if (found.expiresAt && found.expiresAt.getTime() <= Date.now()) throw new UnauthenticatedError("This API token has expired. Create a new one under Settings → API tokens.");
  const membership = await db.membership.findFirst({
    where: {
      userId: found.userId,
      groupId: found.groupId,
      ...(options.group ? { group: { OR: [{ id: options.group }, { slug: options.group }] } } : {}),
    },
    select: memberSelect,
  });
  // A token outlives nothing: once its owner leaves the group it opens nothing there.
  if (!membership) throw options.group ? new NotFoundError("group") : new UnauthenticatedError("This API token's owner is no longer in its group.");
  const now = new Date();
  if (!found.lastUsedAt || now.getTime() - found.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await db.apiToken.update({ where: { id: found.id }, data: { lastUsedAt: now }, select: { id: true } });
  }
  return membership;
}

export const SESSION_ENDED_MESSAGE = "Your session has ended (signed out, password changed or removed from a group). Sign in again.";

/** What the guard and the signed-in frame need to know about a session's user, read in one statement. */
export interface SessionAccount {
  user: { id: string; email: string; name: string; sessionVersion: number };
  /** The user's memberships with their groups, ordered by group name (the group switcher's order). */
  memberships: { role: string; group: { id: string; name: string; slug: string }; joinedRank: number }[];
}

interface AccountRow {
  userId: string;
  email: string;
  userName: string;
  sessionVersion: number;
  role: string | null;
  groupId: string | null;
  groupName: string | null;
  groupSlug: string | null;
  joinedRank: number | null;
}

/**
 * The user, their session version and every membership with its group, in one statement (Prisma would send one
 * query per relation: user, memberships, groups). Null when the user no longer exists.
 */
export async function loadSessionAccount(userId: string, db?: Db): Promise<SessionAccount | null> {
  const client = db ?? (await getDb());
  const rows = await client.$queryRaw<AccountRow[]>`
    SELECT u.id AS "userId", u.email, u.name AS "userName", u."sessionVersion",
           m.role::text AS role, g.id AS "groupId", g.name AS "groupName", g.slug AS "groupSlug",
           (CASE WHEN m.id IS NULL THEN NULL ELSE row_number() OVER (ORDER BY m."createdAt", m.id) END)::int AS "joinedRank"
      FROM "User" u
      LEFT JOIN "Membership" m ON m."userId" = u.id
      LEFT JOIN "Group" g ON g.id = m."groupId"
     WHERE u.id = ${userId}
     ORDER BY g.name, g.id`;
  const first = rows[0];
  if (!first) return null;
  return {
    user: { id: first.userId, email: first.email, name: first.userName, sessionVersion: first.sessionVersion },
    memberships: rows.flatMap((r) => r.groupId !== null && r.role !== null && r.joinedRank !== null
      ? [{ role: r.role, group: { id: r.groupId, name: r.groupName ?? "", slug: r.groupSlug ?? "" }, joinedRank: r.joinedRank }]
      : []),
  };
}

/** Loads a session's account; the app passes one that reads once per request (./index.ts). */
export type AccountLoader = (userId: string) => Promise<SessionAccount | null>;

/**
 * Refuses a session token minted before the user's session version was last raised (sign-out, password change,
 * removal from a group): the JWT itself cannot be recalled, so the guard compares it with the database each time.
 */
export function assertSessionCurrent(account: SessionAccount | null, sessionVersion: number | undefined): SessionAccount {
  if (!account) throw new UnauthenticatedError("Your account no longer exists. Sign in again.");
  if (account.user.sessionVersion !== (sessionVersion ?? 0)) throw new UnauthenticatedError(SESSION_ENDED_MESSAGE);
  return account;
}

function membershipForSession(account: SessionAccount, activeGroupId: string | null, options: GuardOptions) {
  const user = { id: account.user.id, email: account.user.email, name: account.user.name };
  const pick = (m: SessionAccount["memberships"][number] | undefined) => (m ? { role: m.role, group: m.group, user } : undefined);
  if (options.group) {
    const named = pick(account.memberships.find((m) => m.group.id === options.group || m.group.slug === options.group));
    if (!named) throw new NotFoundError("group");
    return named;
  }
  const active = activeGroupId ? pick(account.memberships.find((m) => m.group.id === activeGroupId)) : undefined;
  if (active) return active;
  // No active group yet, or the user has since left it: fall back to the group joined first.
  const first = pick([...account.memberships].sort((a, b) => a.joinedRank - b.joinedRank)[0]);
  if (first) return first;
  throw new NoMembershipError();
}

/**
 * Resolves credentials to the member context for one group and checks the permission.
 * Throws UnauthenticatedError (401), NoMembershipError (403), NotFoundError (404, a group the user is not in)
 * or ForbiddenError (403, the role does not hold the permission, or is unknown).
 */
export async function resolveMember(
  credentials: Credentials | null,
  permission: Permission,
  options: GuardOptions = {},
  loadAccount: AccountLoader = loadSessionAccount,
): Promise<MemberContext> {
  if (!credentials) throw new UnauthenticatedError();
  if (credentials.kind === "token" && options.sessionOnly) {
    throw new ForbiddenError("API tokens open the JSON API (/api/v1) only; pages and forms need a signed-in browser session.");
  }
  const membership =
    credentials.kind === "token"
      ? await membershipForToken(credentials.token, options)
      : membershipForSession(assertSessionCurrent(await loadAccount(credentials.userId), credentials.sessionVersion), credentials.activeGroupId, options);
  assertRoleCan(membership.role, permission);
  const context: MemberContext = { user: membership.user, group: membership.group, role: membership.role, via: credentials.kind };
  assertMaySeePerson(context, options.person);
  return context;
}

/** For showing or hiding controls; the action behind a control checks again through the guard. */
export function can(context: Pick<MemberContext, "role">, permission: Permission): boolean {
  return roleCan(context.role, permission);
}

/** Turns a group-scoped lookup that found nothing into a 404. */
export function found<T>(row: T | null | undefined, what = "record"): T {
  if (row === null || row === undefined) throw new NotFoundError(what);
  return row;
}
