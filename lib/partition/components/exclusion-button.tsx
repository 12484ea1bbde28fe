"use client";
// A lead's control to leave an observation out of the pooled value, or to bring it back.
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { setExclusionAction } from "../actions";

export function ExclusionButton({ observationId, compoundId, excluded }: { observationId: string; compoundId: string; excluded: boolean }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const toggle = () => {
    const reason = excluded ? "" : (window.prompt("Why leave this observation out? (kept in the audit trail)") ?? null);
    if (reason === null) return;
    startTransition(async () => {
      const result = await setExclusionAction({ observationId, compoundId, excluded: !excluded, reason });
      if (result.ok) router.refresh();
      else setError(result.message);
    });
  };
  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" onClick={toggle} disabled={pending}
        className="rounded-md border border-stone-300 px-2 py-0.5 text-xs font-medium text-stone-700 hover:bg-stone-100 disabled:opacity-60 print:hidden">
        {pending ? "…" : excluded ? "Include" : "Exclude"}
      </button>
      {error ? <span role="alert" className="text-xs text-red-700">{error}</span> : null}
    </span>
  );
}
