"use client";
import { useRouter } from "next/navigation";
import { useState, useTransition, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { ActionResult } from "@/lib/errors";

/**
 * The second step of every value edit: shows the value being replaced beside the new one, and only then saves.
 * The action carries the old value, so a change made meanwhile by someone else is refused rather than overwritten.
 */
export function ConfirmChange({ summary, save, onBack, confirmLabel = "Confirm and save" }: {
  summary: ReactNode;
  save: () => Promise<ActionResult>;
  onBack: () => void;
  confirmLabel?: string;
}) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="space-y-3 rounded-md border border-amber-200 bg-amber-50 p-3 text-sm" role="group" aria-label="Confirm the change">
      <div className="text-stone-800">{summary}</div>
      {error ? <Notice tone="error" title={error} /> : null}
      <div className="flex gap-2">
        <Button
          disabled={pending}
          onClick={() =>
            startTransition(async () => {
              const result = await save();
              if (result.ok) {
                onBack();
                router.refresh();
              } else {
                setError(result.fieldErrors ? `${result.message} ${Object.values(result.fieldErrors).flat().join(" ")}` : result.message);
              }
            })
          }
        >
          {pending ? "Saving…" : confirmLabel}
        </Button>
        <Button variant="ghost" disabled={pending} onClick={onBack}>Back</Button>
      </div>
    </div>
  );
}

/** "2.1 (literature: CRC Handbook)" or "no value". */
export function describeValue(value: number | null | undefined, source?: string | null): string {
  if (value === null || value === undefined) return "no value";
  return source ? `${value} (${source})` : String(value);
}
