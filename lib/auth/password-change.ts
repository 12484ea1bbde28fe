// Changing one's password: the current password is checked (counted like a sign-in, so a borrowed session cannot
// guess it freely), the new one must pass the same rules as at sign-up, and every existing session ends.
import { z } from "zod";
import { getDb } from "@/lib/db/client";
import { ValidationError } from "@/lib/errors";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { EMAIL_PASSWORD_MESSAGE, passwordSchema, weakPasswordReason } from "@/lib/auth/password-rules";
import { reserveSignInAttempt, settleSignInAttempt } from "@/lib/auth/rate-limit";

export const changePasswordSchema = z
  .object({
    currentPassword: z.string().min(1, "Enter your current password.").max(1024),
    newPassword: passwordSchema,
    confirmPassword: z.string().max(1024),
  })
  .refine((p) => p.newPassword === p.confirmPassword, { path: ["confirmPassword"], message: "The two passwords differ." });

export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

export async function changePassword(user: { id: string; email: string }, input: ChangePasswordInput): Promise<void> {
  if (weakPasswordReason(input.newPassword, user.email) !== null) throw new ValidationError({ newPassword: [EMAIL_PASSWORD_MESSAGE] });
  const db = await getDb();
  const reservation = await reserveSignInAttempt(db, user.email, `password-change:${user.id}`);
  const stored = await db.user.findUnique({ where: { id: user.id }, select: { passwordHash: true } });
  const ok = await verifyPassword(input.currentPassword, stored?.passwordHash);
  await settleSignInAttempt(db, reservation, ok);
  if (!ok) throw new ValidationError({ currentPassword: ["That is not your current password."] });
  const passwordHash = await hashPassword(input.newPassword);
  // Raising the session version ends this session too: the new password is used at the next sign-in.
  await db.user.update({ where: { id: user.id }, data: { passwordHash, sessionVersion: { increment: 1 } }, select: { id: true } });
}
