import { redirect } from "next/navigation";
import { SignInForm } from "@/lib/auth/components/sign-in-form";
import { signInErrorMessage } from "@/lib/auth/sign-in-messages";
import { currentUser } from "@/lib/authz";
import { isLocalPath } from "@/lib/authz/page";
import { env } from "@/lib/env";

export const metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const requested = typeof params.callbackUrl === "string" ? params.callbackUrl : "";
  const callbackUrl = isLocalPath(requested) ? requested : "/workups";
  if (await currentUser()) redirect(callbackUrl);
  const oidc = env().oidc;
  return (
    <main className="flex min-h-screen items-center justify-center bg-stone-50 px-4">
      <div className="w-full max-w-sm">
        <div className="mb-8 text-center">
          <p className="text-2xl font-semibold tracking-tight text-stone-900">Layerwise</p>
          <p className="mt-1 text-sm text-stone-600">Your group&apos;s workups, predicted and compared.</p>
        </div>
        <div className="rounded-lg border border-stone-200 bg-white p-6 shadow-xs">
          <h1 className="mb-5 text-lg font-semibold text-stone-900">Sign in</h1>
          <SignInForm
            callbackUrl={callbackUrl}
            singleSignOn={oidc ? { name: oidc.name } : null}
            initialError={signInErrorMessage(typeof params.error === "string" ? params.error : undefined)}
          />
        </div>
        <p className="mt-6 text-center text-xs text-stone-500">New here? Accounts are created from an invite link sent by a group lead.</p>
      </div>
    </main>
  );
}
