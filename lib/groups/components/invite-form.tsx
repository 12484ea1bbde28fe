"use client";
import { useActionState } from "react";
import { CopyField } from "@/components/ui/copy-field";
import { FieldErrors, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formatDate } from "@/components/ui/format";
import { createInviteAction } from "@/lib/groups/actions";
import { INVITE_LIFETIMES_DAYS } from "@/lib/groups/invite-options";
import { ROLE_LABELS } from "@/lib/authz/roles";
import { ErrorSummary } from "@/components/ui/error-summary";

/** Creates an invite link and shows it once, ready to copy into a message (no mail server involved). */
export function InviteForm() {
  const [state, action] = useActionState(createInviteAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <div className="space-y-4">
      <ErrorSummary attempt={state} title="No invite created: fix these first" items={[
        ...(errors?.role ?? []).map((m) => ({ targetId: "invite-role", text: `Role: ${m}` })),
        ...(errors?.expiresInDays ?? []).map((m) => ({ targetId: "invite-days", text: `Valid for: ${m}` })),
      ]} />
      <form action={action} className="flex flex-wrap items-end gap-3">
        <div className="space-y-1">
          <label htmlFor="invite-role" className="block text-sm font-medium text-stone-800">Role</label>
          <select id="invite-role" name="role" defaultValue="member" className={inputClass}>
            <option value="member">Member (reads and writes records)</option>
            <option value="viewer">Viewer (reads only)</option>
            <option value="lead">Lead (also manages members)</option>
          </select>
          <FieldErrors errors={errors?.role} />
        </div>
        <div className="space-y-1">
          <label htmlFor="invite-days" className="block text-sm font-medium text-stone-800">Valid for</label>
          <select id="invite-days" name="expiresInDays" defaultValue="7" className={inputClass}>
            {INVITE_LIFETIMES_DAYS.map((d) => (
              <option key={d} value={d}>{d === 1 ? "1 day" : `${d} days`}</option>
            ))}
          </select>
          <FieldErrors errors={errors?.expiresInDays} />
        </div>
        <SubmitButton pendingLabel="Creating…">Create invite link</SubmitButton>
      </form>
      {state && !state.ok && !errors ? <Notice tone="error">{state.message}</Notice> : null}
      {state?.ok ? (
        <Notice tone="success" title="Invite link created">
          <div className="mt-2 space-y-2">
            <CopyField label="Send this link to the person you are inviting" value={`${typeof window === "undefined" ? "" : window.location.origin}${state.data.path}`} />
            <p>
              It makes them a {((ROLE_LABELS as Record<string, string | undefined>)[state.data.role] ?? state.data.role).toLowerCase()}, works once, and expires on {formatDate(state.data.expiresAt)}. Layerwise keeps only a
              fingerprint of it, so copy it now: it cannot be shown again.
            </p>
          </div>
        </Notice>
      ) : null}
    </div>
  );
}
