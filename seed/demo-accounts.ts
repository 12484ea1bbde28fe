// The demo accounts' published password is fine on a laptop and dangerous on a network. These helpers find demo
// accounts that still accept it, and rotate or lock them (`npm run demo:accounts -- rotate|lock`).
import { randomBytes } from "node:crypto";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { type Db } from "@/lib/db/client";
import { DEMO_PASSWORD, demoGroup, otherGroup } from "@/seed/scenario";

export const DEMO_EMAILS: readonly string[] = [...demoGroup.people, ...otherGroup.people].map((p) => p.email);

/** Emails of demo accounts that still sign in with DEMO_PASSWORD. */
export async function demoAccountsWithPublishedPassword(db: Db): Promise<string[]> {
  const users = await db.user.findMany({
    where: { email: { in: [...DEMO_EMAILS] }, passwordHash: { not: null } },
    omit: { passwordHash: false },
  });
  const open: string[] = [];
  for (const user of users) if (await verifyPassword(DEMO_PASSWORD, user.passwordHash)) open.push(user.email);
  return open.sort();
}

/** Gives every demo account a fresh random password (returned once) and ends their sessions. */
export async function rotateDemoPasswords(db: Db): Promise<{ email: string; password: string }[]> {
  const users = await db.user.findMany({ where: { email: { in: [...DEMO_EMAILS] } }, select: { id: true, email: true } });
  const out: { email: string; password: string }[] = [];
  for (const user of users) {
    const password = randomBytes(12).toString("base64url");
    await db.user.update({ where: { id: user.id }, data: { passwordHash: await hashPassword(password), sessionVersion: { increment: 1 } } });
    out.push({ email: user.email, password });
  }
  return out;
}

/** Removes the demo accounts' passwords (they can no longer sign in with one) and ends their sessions. */
export async function lockDemoAccounts(db: Db): Promise<number> {
  const { count } = await db.user.updateMany({ where: { email: { in: [...DEMO_EMAILS] } }, data: { passwordHash: null, sessionVersion: { increment: 1 } } });
  return count;
}
