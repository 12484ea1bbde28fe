"use client";
import { useActionState } from "react";
import { CopyField } from "@/components/ui/copy-field";
import { Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { FieldErrorSummary } from "@/components/ui/error-summary";
import { SubmitButton } from "@/components/ui/submit-button";
import { createApiTokenAction, revokeApiTokenAction } from "@/lib/auth/api-tokens/actions";

export function CreateApiTokenForm() {
  const [state, action] = useActionState(createApiTokenAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <div className="space-y-4">
      <FieldErrorSummary errors={errors} attempt={state} title="Token not created: fix these first" fields={{ name: "Token name", expiresInDays: "Expires" }} />
      <form action={action} className="flex flex-wrap items-end gap-3">
        <div className="min-w-64 flex-1">
          <Field label="Token name" name="name" placeholder="e.g. plate-reader export script" maxLength={80} required errors={errors?.name} />
        </div>
        <div>
          <label htmlFor="field-expiresInDays" className="block text-sm font-medium text-stone-700">Expires</label>
          <select id="field-expiresInDays" name="expiresInDays" defaultValue="90" className={`${inputClass} mt-1 w-40`}>
            <option value="7">after 7 days</option>
            <option value="30">after 30 days</option>
            <option value="90">after 90 days</option>
            <option value="365">after a year</option>
            <option value="never">never (until revoked)</option>
          </select>
          {errors?.expiresInDays ? <p role="alert" className="mt-1 text-sm text-red-700">{errors.expiresInDays[0]}</p> : null}
        </div>
        <SubmitButton pendingLabel="Creating…">Create token</SubmitButton>
      </form>
      {state && !state.ok && !errors ? <Notice tone="error">{state.message}</Notice> : null}
      {state?.ok ? (
        <Notice tone="success" title={`Token "${state.data.name}" created`}>
          <div className="mt-2 space-y-2">
            <CopyField label="Your new API token" value={state.data.token} />
            <p>
              Send it as <code className="font-mono">Authorization: Bearer …</code>. It acts with your role in this group. Copy it now:
              Layerwise stores only a fingerprint and cannot show it again.
            </p>
          </div>
        </Notice>
      ) : null}
    </div>
  );
}

export function RevokeApiTokenForm({ tokenId, name }: { tokenId: string; name: string }) {
  const [state, action] = useActionState(revokeApiTokenAction, null);
  return (
    <form
      action={action}
      onSubmit={(e) => {
        if (!window.confirm(`Revoke the token "${name}"? Scripts using it stop working at once.`)) e.preventDefault();
      }}
    >
      <input type="hidden" name="tokenId" value={tokenId} />
      <SubmitButton variant="danger" pendingLabel="Revoking…">Revoke</SubmitButton>
      {state && !state.ok ? <p role="alert" className="mt-1 text-sm text-red-700">{state.message}</p> : null}
    </form>
  );
}
