// What happens behind the sign-in form and the single sign-on callback, kept apart from next-auth's option object
// so the integration tests can drive it directly.
import { z } from "zod";
import { getDb } from "@/lib/db/client";
import { verifyPassword } from "@/lib/auth/password";
import { normaliseEmail } from "@/lib/auth/password-rules";
import { oidcEmail, type OidcProfile } from "@/lib/auth/oidc";
import { ForbiddenError } from "@/lib/errors";
import { reserveSignInAttempt, settleSignInAttempt } from "@/lib/auth/rate-limit";

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
}

const credentialsSchema = z.object({
  email: z.string().max(254),
  password: z.string().max(1024),
});

/**
 * Checks an email and password. Returns the user, or null when they do not match; throws RateLimitedError while
 * this email is held back (lib/auth/rate-limit.ts). The attempt is reserved before the password is hashed, so
 * parallel guesses are counted before any of them runs; unknown and known emails take the same path and one bcrypt
 * comparison each, so neither the answer nor its timing tells which emails have accounts.
 */
export async function signInWithPassword(input: unknown, clientAddress: string): Promise<SignedInUser | null> {
  const parsed = credentialsSchema.safeParse(input);
  if (!parsed.success) return null;
  const email = normaliseEmail(parsed.data.email);
  if (email === "") return null;
  const db = await getDb();
  const reservation = await reserveSignInAttempt(db, email, clientAddress);
  const user = await db.user.findUnique({
    where: { email },
    select: { id: true, email: true, name: true, passwordHash: true },
  });
  const ok = (await verifyPassword(parsed.data.password, user?.passwordHash)) && user !== null;
  await settleSignInAttempt(db, reservation, ok);
  return ok ? { id: user.id, email: user.email, name: user.name } : null;
}

/**
 * The Layerwise account for an email the institution's identity provider vouched for, created without a password
 * on first sign-in. It belongs to no group until its owner opens an invite link, so it can see nothing yet.
 */
export async function userForSingleSignOn(profile: OidcProfile | undefined, displayName: string | null): Promise<SignedInUser> {
  // Checked here as well as in next-auth's signIn callback: nothing reaches (or merges into) an account by email
  // unless the issuer said the email is verified.
  const email = oidcEmail(profile);
  if (email === null) throw new ForbiddenError("Your institution's sign-on did not confirm your email address.");
  const db = await getDb();
  return db.user.upsert({
    where: { email },
    update: {},
    create: { email, name: displayName?.trim() || email.split("@")[0] || email },
    select: { id: true, email: true, name: true },
  });
}

/** The group a fresh session starts in: the one the user joined first. */
export async function firstGroupId(userId: string): Promise<string | null> {
  const db = await getDb();
  const membership = await db.membership.findFirst({
    where: { userId },
    orderBy: [{ createdAt: "asc" }, { id: "asc" }],
    select: { groupId: true },
  });
  return membership?.groupId ?? null;
}

export async function isMemberOf(userId: string, groupId: string): Promise<boolean> {
  const db = await getDb();
  const membership = await db.membership.findUnique({ where: { groupId_userId: { groupId, userId } }, select: { id: true } });
  return membership !== null;
}
