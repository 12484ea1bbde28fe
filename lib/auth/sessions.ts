// Ending sessions. Sessions are signed JWT cookies that cannot be recalled, so each carries the user's
// sessionVersion from when it began and the guard (lib/authz/guard.ts assertSessionCurrent) refuses one whose
// version is no longer the user's. Raising the version ends every session the user has, on every device.
import { getDb, type Db, type DbTransaction } from "@/lib/db/client";

export async function currentSessionVersion(userId: string): Promise<number> {
  const db = await getDb();
  const user = await db.user.findUnique({ where: { id: userId }, select: { sessionVersion: true } });
  return user?.sessionVersion ?? 0;
}

/** Ends all of the user's sessions (sign-out, password change, removal from a group). */
export async function endSessions(userId: string, db?: Db | DbTransaction): Promise<void> {
  const client = db ?? (await getDb());
  await client.user.updateMany({ where: { id: userId }, data: { sessionVersion: { increment: 1 } } });
}
