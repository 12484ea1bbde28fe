// One schema per input, shared by the forms (for messages beside the field) and the server actions.
import { z } from "zod";
import { EMAIL_PASSWORD_MESSAGE, emailSchema, passwordSchema, weakPasswordReason } from "@/lib/auth/password-rules";
import { ROLES } from "@/lib/authz/roles";
import { INVITE_LIFETIMES_DAYS } from "./invite-options";

export { INVITE_LIFETIMES_DAYS };

export const roleSchema = z.enum(ROLES, { error: () => "Choose lead, member or viewer." });

export const createInviteSchema = z.object({
  role: roleSchema,
  expiresInDays: z.coerce
    .number()
    .refine((d) => (INVITE_LIFETIMES_DAYS as readonly number[]).includes(d), { message: "Choose 1, 7 or 14 days." }),
});

export const changeRoleSchema = z.object({
  membershipId: z.string().min(1).max(64),
  role: roleSchema,
});

export const membershipIdSchema = z.object({ membershipId: z.string().min(1).max(64) });
export const inviteIdSchema = z.object({ inviteId: z.string().min(1).max(64) });

export const newAccountSchema = z
  .object({
    name: z.string().trim().min(1, "Enter your name.").max(120, "Use at most 120 characters."),
    email: emailSchema,
    password: passwordSchema,
    confirmPassword: z.string(),
  })
  .refine((a) => a.password === a.confirmPassword, { path: ["confirmPassword"], message: "The two passwords differ." })
  .refine((a) => weakPasswordReason(a.password, a.email) === null, { path: ["password"], message: EMAIL_PASSWORD_MESSAGE });

export type CreateInviteInput = z.infer<typeof createInviteSchema>;
export type NewAccountInput = z.infer<typeof newAccountSchema>;
