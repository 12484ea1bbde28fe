"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { clearLogPAction, setLogPAction } from "@/lib/compounds/actions";
import { ConfirmChange, describeValue } from "./confirm-change";
import { ValueForm, type ValueDraft } from "./value-form";

type Step = { at: "view" } | { at: "edit" } | { at: "confirm"; draft: ValueDraft } | { at: "clear" };

/** Sets, replaces or removes the measured or literature log P, always showing the value it replaces first. */
export function LogPEditor({ compoundId, logP, sourceText }: { compoundId: string; logP: number | null; sourceText: string | null }) {
  const [step, setStep] = useState<Step>({ at: "view" });
  const back = () => setStep({ at: "view" });
  if (step.at === "edit") {
    return (
      <ValueForm
        label="log P"
        initial={{ value: logP === null ? "" : String(logP), provenance: "measured", source: "", se: "", kind: "acid" }}
        onReview={(draft) => setStep({ at: "confirm", draft })}
        onCancel={back}
      />
    );
  }
  if (step.at === "confirm") {
    const { draft } = step;
    return (
      <ConfirmChange
        summary={<>Replace log P <strong>{describeValue(logP, sourceText)}</strong> with <strong>{draft.value} ({draft.provenance}: {draft.source})</strong>?</>}
        save={() => setLogPAction({ compoundId, value: Number(draft.value), provenance: draft.provenance, source: draft.source, expected: logP })}
        onBack={back}
      />
    );
  }
  if (step.at === "clear") {
    return (
      <ConfirmChange
        summary={<>Remove log P <strong>{describeValue(logP, sourceText)}</strong>? The estimate from the structure applies again.</>}
        save={() => clearLogPAction({ compoundId, expected: logP })}
        onBack={back}
        confirmLabel="Remove the value"
      />
    );
  }
  return (
    <span className="inline-flex gap-2">
      <Button variant="secondary" className="!px-2 !py-1 text-xs" onClick={() => setStep({ at: "edit" })}>
        {logP === null ? "Add a measured or literature log P" : "Change"}
      </Button>
      {logP !== null ? <Button variant="ghost" className="!px-2 !py-1 text-xs" onClick={() => setStep({ at: "clear" })}>Remove</Button> : null}
    </span>
  );
}
