"use client";
import { buttonClass } from "@/components/ui/button";

/** Unexpected failures: the details are in the server log under the digest shown here. */
export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-lg px-4 py-24 text-center">
      <h1 className="text-2xl font-semibold text-stone-900">Something went wrong</h1>
      <p className="mt-3 text-stone-600">
        The page could not be shown. Try again; if it keeps failing, give this reference to whoever runs Layerwise:
        <span className="ml-1 font-mono text-sm">{error.digest ?? "none"}</span>
      </p>
      <button type="button" onClick={reset} className={buttonClass("secondary", "mt-6")}>
        Try again
      </button>
    </main>
  );
}
