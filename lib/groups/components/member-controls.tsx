"use client";
import { useActionState } from "react";
import { inputClass } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { changeRoleAction, removeMemberAction, revokeInviteAction } from "@/lib/groups/actions";

function ErrorLine({ message }: { message: string | undefined }) {
  return message ? <p role="alert" className="mt-1 text-sm text-red-700">{message}</p> : null;
}

export function RoleForm({ membershipId, role, name }: { membershipId: string; role: string; name: string }) {
  const [state, action] = useActionState(changeRoleAction, null);
  return (
    <form action={action} className="flex items-center gap-2">
      <input type="hidden" name="membershipId" value={membershipId} />
      <label className="sr-only" htmlFor={`role-${membershipId}`}>Role of {name}</label>
      <select id={`role-${membershipId}`} name="role" defaultValue={role} className={`${inputClass} w-32`}>
        <option value="lead">Lead</option>
        <option value="member">Member</option>
        <option value="viewer">Viewer</option>
      </select>
      <SubmitButton variant="secondary" pendingLabel="Saving…">Save role</SubmitButton>
      <ErrorLine message={state && !state.ok ? state.message : undefined} />
    </form>
  );
}

export function RemoveMemberForm({ membershipId, name, isSelf }: { membershipId: string; name: string; isSelf: boolean }) {
  const [state, action] = useActionState(removeMemberAction, null);
  return (
    <form
      action={action}
      onSubmit={(e) => {
        const question = isSelf ? "Leave this group? You will lose access to its records." : `Remove ${name} from this group?`;
        if (!window.confirm(question)) e.preventDefault();
      }}
    >
      <input type="hidden" name="membershipId" value={membershipId} />
      <SubmitButton variant="danger" pendingLabel="Removing…">{isSelf ? "Leave" : "Remove"}</SubmitButton>
      <ErrorLine message={state && !state.ok ? state.message : undefined} />
    </form>
  );
}

export function RevokeInviteForm({ inviteId }: { inviteId: string }) {
  const [state, action] = useActionState(revokeInviteAction, null);
  return (
    <form action={action}>
      <input type="hidden" name="inviteId" value={inviteId} />
      <SubmitButton variant="ghost" pendingLabel="Revoking…">Revoke</SubmitButton>
      <ErrorLine message={state && !state.ok ? state.message : undefined} />
    </form>
  );
}
