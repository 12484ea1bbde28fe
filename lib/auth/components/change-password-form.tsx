"use client";
import { useActionState } from "react";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { FieldErrorSummary } from "@/components/ui/error-summary";
import { SubmitButton } from "@/components/ui/submit-button";
import { changePasswordAction } from "@/lib/auth/password-actions";

export function ChangePasswordForm() {
  const [state, action] = useActionState(changePasswordAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  if (state?.ok) {
    return (
      <Notice tone="success" title="Password changed">
        Every session you had, this one included, has ended. <a className="underline" href="/sign-in">Sign in again</a> with the new password.
      </Notice>
    );
  }
  return (
    <form action={action} className="max-w-md space-y-4">
      <FieldErrorSummary errors={errors} attempt={state} title="Password not changed: fix these first"
        fields={{ currentPassword: "Current password", newPassword: "New password", confirmPassword: "New password again" }} />
      <Field label="Current password" name="currentPassword" type="password" autoComplete="current-password" required errors={errors?.currentPassword} />
      <Field label="New password" name="newPassword" type="password" autoComplete="new-password" minLength={10} required hint="At least 10 characters; not a common password or your email." errors={errors?.newPassword} />
      <Field label="New password again" name="confirmPassword" type="password" autoComplete="new-password" required errors={errors?.confirmPassword} />
      {state && !state.ok && !errors ? <Notice tone="error">{state.message}</Notice> : null}
      <SubmitButton pendingLabel="Changing…">Change password</SubmitButton>
    </form>
  );
}
