"use client";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Field, textField } from "@/components/ui/field";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { FieldErrorSummary } from "@/components/ui/error-summary";

/** next-auth reports a wrong email or password as this code; anything else it reports is our own message. */
const WRONG_CREDENTIALS = "CredentialsSignin";

export function SignInForm({ callbackUrl, singleSignOn, initialError }: { callbackUrl: string; singleSignOn: { name: string } | null; initialError: string | null }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(initialError);
  const [pending, setPending] = useState(false);
  const [missing, setMissing] = useState<{ errors: Record<string, string[]>; attempt: number }>({ errors: {}, attempt: 0 });

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    // A blank field is named before anything is sent (each attempt counts against the sign-in delay).
    const errors: Record<string, string[]> = {};
    if (textField(form, "email").trim() === "") errors["email"] = ["Enter the email address of your account."];
    if (textField(form, "password") === "") errors["password"] = ["Enter your password."];
    setMissing((m) => ({ errors, attempt: Object.keys(errors).length > 0 ? m.attempt + 1 : m.attempt }));
    if (Object.keys(errors).length > 0) return;
    setPending(true);
    setError(null);
    const result = await signIn("credentials", {
      email: textField(form, "email"),
      password: textField(form, "password"),
      redirect: false,
    });
    setPending(false);
    if (result?.ok && !result.error) {
      router.replace(callbackUrl);
      router.refresh();
      return;
    }
    setError(!result?.error || result.error === WRONG_CREDENTIALS ? "That email and password do not match an account." : result.error);
  }

  return (
    <div className="space-y-6">
      {error ? <Notice tone="error">{error}</Notice> : null}
      <FieldErrorSummary errors={missing.errors} attempt={missing.attempt} title="Not signed in: fill these in" fields={{ email: "Email", password: "Password" }} />
      <form onSubmit={(e) => void submit(e)} className="space-y-4" noValidate>
        <Field label="Email" name="email" type="email" autoComplete="username" required autoFocus errors={missing.errors["email"]} />
        <Field label="Password" name="password" type="password" autoComplete="current-password" required errors={missing.errors["password"]} />
        <button type="submit" disabled={pending} className={buttonClass("primary", "w-full")}>
          {pending ? "Signing in…" : "Sign in"}
        </button>
      </form>
      {singleSignOn ? (
        <>
          <div className="flex items-center gap-3 text-xs uppercase tracking-wide text-stone-400">
            <span className="h-px flex-1 bg-stone-200" />
            or
            <span className="h-px flex-1 bg-stone-200" />
          </div>
          <button type="button" onClick={() => void signIn("oidc", { callbackUrl })} className={buttonClass("secondary", "w-full")}>
            {singleSignOn.name}
          </button>
        </>
      ) : null}
    </div>
  );
}
