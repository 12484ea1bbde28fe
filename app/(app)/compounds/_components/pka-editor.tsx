"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { revertPKaAction, setPKaAction } from "@/lib/compounds/actions";
import type { StoredPKa } from "@/lib/compounds/schemas";
import { ConfirmChange, describeValue } from "./confirm-change";
import { ValueForm, type ValueDraft } from "./value-form";

type Step = { at: "view" } | { at: "edit" } | { at: "confirm"; draft: ValueDraft } | { at: "revert" };

const small = "!px-2 !py-1 text-xs";

/**
 * Edits one site's pKa (index = its position), or adds a site when `entry` is undefined (index = list length).
 * Reverting puts an estimated site back to its estimate, or removes a site that was added by hand.
 */
export function PKaEditor({ compoundId, index, entry }: { compoundId: string; index: number; entry?: StoredPKa }) {
  const [step, setStep] = useState<Step>({ at: "view" });
  const back = () => setStep({ at: "view" });
  const label = entry ? `pKa of the ${entry.site || "site"}` : "pKa of a new site";
  if (step.at === "edit") {
    return (
      <ValueForm
        label="pKa" withSe withKind={!entry}
        initial={{ value: entry ? String(entry.value) : "", provenance: "measured", source: "", se: "", kind: entry?.kind ?? "base" }}
        onReview={(draft) => setStep({ at: "confirm", draft })}
        onCancel={back}
      />
    );
  }
  if (step.at === "confirm") {
    const { draft } = step;
    const se = draft.se.trim() === "" ? undefined : Number(draft.se);
    return (
      <ConfirmChange
        summary={<>Replace the {label} <strong>{describeValue(entry?.value, entry ? `${entry.provenance}${entry.source ? `: ${entry.source}` : ""}` : null)}</strong> with <strong>{draft.value}{se !== undefined ? ` ± ${se}` : ""} ({draft.provenance}: {draft.source})</strong>?</>}
        save={() => setPKaAction({ compoundId, index, value: Number(draft.value), kind: entry?.kind ?? draft.kind, provenance: draft.provenance, source: draft.source, se, expected: entry?.value ?? null })}
        onBack={back}
      />
    );
  }
  if (step.at === "revert" && entry) {
    return (
      <ConfirmChange
        summary={entry.estimate
          ? <>Put the {label} back from <strong>{entry.value}</strong> to the estimate <strong>{entry.estimate.value}</strong>?</>
          : <>Remove the {label} <strong>{entry.value}</strong>?</>}
        save={() => revertPKaAction({ compoundId, index, expected: entry.value })}
        onBack={back}
        confirmLabel={entry.estimate ? "Back to the estimate" : "Remove the site"}
      />
    );
  }
  if (!entry) return <Button variant="secondary" className={small} onClick={() => setStep({ at: "edit" })}>Add a site</Button>;
  return (
    <span className="inline-flex gap-1">
      <Button variant="secondary" className={small} onClick={() => setStep({ at: "edit" })} aria-label={`Change the ${label}`}>Change</Button>
      {entry.provenance !== "estimated" ? (
        <Button variant="ghost" className={small} onClick={() => setStep({ at: "revert" })}>{entry.estimate ? "Back to estimate" : "Remove"}</Button>
      ) : null}
    </span>
  );
}
