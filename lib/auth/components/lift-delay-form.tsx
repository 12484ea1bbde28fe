"use client";
import { useActionState } from "react";
import { SubmitButton } from "@/components/ui/submit-button";
import { liftSignInDelayAction } from "@/lib/auth/sign-in-delay-actions";

/** For leads: clears the waiting time after failed sign-ins on a member's account. */
export function LiftSignInDelayForm({ membershipId }: { membershipId: string }) {
  const [state, action] = useActionState(liftSignInDelayAction, null);
  return (
    <form action={action}>
      <input type="hidden" name="membershipId" value={membershipId} />
      <SubmitButton variant="secondary" pendingLabel="Lifting…">Lift sign-in delay</SubmitButton>
      {state?.ok ? <p className="mt-1 text-sm text-stone-600">{state.data.lifted === 0 ? "No failed sign-ins were recorded." : "They can sign in again now."}</p> : null}
      {state && !state.ok ? <p role="alert" className="mt-1 text-sm text-red-700">{state.message}</p> : null}
    </form>
  );
}
