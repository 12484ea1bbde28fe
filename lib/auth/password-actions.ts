"use server";
import { requireUser } from "@/lib/authz";
import { actionFailure, formFields, parseInput, type ActionResult } from "@/lib/errors";
import { changePassword, changePasswordSchema } from "@/lib/auth/password-change";

export async function changePasswordAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  try {
    const user = await requireUser();
    await changePassword(user, parseInput(changePasswordSchema, formFields(form)));
    return { ok: true, data: undefined };
  } catch (error) {
    return actionFailure(error, "change password");
  }
}
