"use client";
import { signIn, useSession } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useActionState, useEffect, useRef, useState, useTransition } from "react";
import { Field, textField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { FieldErrorSummary } from "@/components/ui/error-summary";
import { SubmitButton } from "@/components/ui/submit-button";
import { buttonClass } from "@/components/ui/button";
import { joinWithAccountAction, joinWithNewAccountAction, type JoinedGroup } from "@/lib/groups/actions";
import { PASSWORD_MIN_LENGTH } from "@/lib/auth/password-limits";
import type { ActionResult } from "@/lib/errors";

/** Signed in: one button adds the membership, then makes the new group the active one. */
export function JoinAsSignedIn({ token, groupName }: { token: string; groupName: string }) {
  const router = useRouter();
  const { update } = useSession();
  const [pending, startTransition] = useTransition();
  const [result, setResult] = useState<ActionResult<JoinedGroup> | null>(null);
  function join() {
    startTransition(async () => {
      const outcome = await joinWithAccountAction(token);
      setResult(outcome);
      if (outcome.ok) {
        await update({ activeGroupId: outcome.data.groupId });
        router.replace("/workups");
        router.refresh();
      }
    });
  }
  return (
    <div className="space-y-4">
      {result && !result.ok ? <Notice tone="error">{result.message}</Notice> : null}
      <button type="button" onClick={join} disabled={pending} className={buttonClass("primary", "w-full")}>
        {pending ? "Joining…" : `Join ${groupName}`}
      </button>
    </div>
  );
}

/** Not signed in: create the account, then sign in with the password just chosen. */
export function JoinWithNewAccount({ token }: { token: string }) {
  const router = useRouter();
  const [state, action] = useActionState(joinWithNewAccountAction.bind(null, token), null);
  const credentials = useRef<{ email: string; password: string } | null>(null);
  const [signInFailed, setSignInFailed] = useState(false);
  // Controlled, so that a refused attempt (say, passwords that differ) keeps what was typed: React resets
  // uncontrolled fields once a form action finishes. The passwords are typed again on purpose.
  const [name, setName] = useState("");
  const [email, setEmail] = useState("");
  useEffect(() => {
    if (!state?.ok || !credentials.current) return;
    const { email, password } = credentials.current;
    credentials.current = null;
    void signIn("credentials", { email, password, redirect: false }).then((r) => {
      if (r?.ok && !r.error) {
        router.replace("/workups");
        router.refresh();
      } else setSignInFailed(true);
    });
  }, [state, router]);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form
      action={action}
      onSubmit={(e) => {
        const form = new FormData(e.currentTarget);
        credentials.current = { email: textField(form, "email"), password: textField(form, "password") };
      }}
      className="space-y-4"
    >
      {state && !state.ok && !errors ? <Notice tone="error">{state.message}</Notice> : null}
      <FieldErrorSummary errors={errors} attempt={state} title="Not created: fix these first"
        fields={{ name: "Your name", email: "Email", password: "Password", confirmPassword: "Password again" }} />
      {state?.ok ? (
        <Notice tone="success">
          Welcome to {state.data.groupName}. {signInFailed ? <a className="underline" href="/sign-in">Sign in</a> : "Signing you in…"}
        </Notice>
      ) : null}
      <Field label="Your name" name="name" autoComplete="name" required errors={errors?.name} value={name} onChange={(e) => setName(e.target.value)} />
      <Field label="Email" name="email" type="email" autoComplete="email" required errors={errors?.email} value={email} onChange={(e) => setEmail(e.target.value)} />
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN_LENGTH}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        errors={errors?.password}
      />
      <Field label="Password again" name="confirmPassword" type="password" autoComplete="new-password" required errors={errors?.confirmPassword} />
      <SubmitButton className="w-full" pendingLabel="Creating your account…">Create account and join</SubmitButton>
    </form>
  );
}
