// Personal API tokens: each belongs to one user in one group and acts with that user's current role there.
// Tokens are managed only from a browser session, so a leaked token cannot mint more tokens.
import { z } from "zod";
import { getDb } from "@/lib/db/client";
import { newApiToken } from "@/lib/authz/api-token-format";
import { type MemberContext } from "@/lib/authz/guard";
import { assertRoleCan } from "@/lib/authz/permissions";
import { ForbiddenError, NotFoundError } from "@/lib/errors";

/** Lifetimes offered when a token is created; "never" keeps it until revoked. */
export const TOKEN_LIFETIMES = ["never", "7", "30", "90", "365"] as const;

export const createApiTokenSchema = z.object({
  name: z.string().trim().min(1, "Give the token a name, such as the script that will use it.").max(80, "Use at most 80 characters."),
  expiresInDays: z.enum(TOKEN_LIFETIMES, "Choose 7, 30, 90 or 365 days, or no expiry.").default("never"),
});

export function tokenExpiry(expiresInDays: (typeof TOKEN_LIFETIMES)[number], now = new Date()): Date | null {
  return expiresInDays === "never" ? null : new Date(now.getTime() + Number(expiresInDays) * 24 * 60 * 60_000);
}

export interface ApiTokenRow {
  id: string;
  name: string;
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
  expiresAt: Date | null;
}

const rowSelect = { id: true, name: true, prefix: true, createdAt: true, lastUsedAt: true, revokedAt: true, expiresAt: true } as const;

function assertBrowserSession(member: MemberContext): void {
  assertRoleCan(member.role, "tokens:manage");
  if (member.via !== "session") throw new ForbiddenError("API tokens can only be managed from a signed-in browser session.");
}

export async function listApiTokens(member: MemberContext): Promise<ApiTokenRow[]> {
  assertBrowserSession(member);
  const db = await getDb();
  return db.apiToken.findMany({
    where: { groupId: member.group.id, userId: member.user.id },
    orderBy: { createdAt: "desc" },
    select: rowSelect,
  });
}

/** Returns the token itself exactly once; only its digest is stored. */
export async function createApiToken(member: MemberContext, name: string, expiresAt: Date | null = null): Promise<{ token: string; row: ApiTokenRow }> {
  assertBrowserSession(member);
  const db = await getDb();
  const { token, tokenHash, prefix } = newApiToken();
  const row = await db.apiToken.create({
    data: { groupId: member.group.id, userId: member.user.id, name, prefix, tokenHash, expiresAt },
    select: rowSelect,
  });
  return { token, row };
}

export async function revokeApiToken(member: MemberContext, tokenId: string): Promise<void> {
  assertBrowserSession(member);
  const db = await getDb();
  const { count } = await db.apiToken.updateMany({
    where: { id: tokenId, groupId: member.group.id, userId: member.user.id, revokedAt: null },
    data: { revokedAt: new Date() },
  });
  if (count === 0) throw new NotFoundError("active API token");
}
