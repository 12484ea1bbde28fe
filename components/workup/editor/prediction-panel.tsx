"use client";
// The live prediction beside the form: status (updated, waiting for valid input, computing the interval) and the
// whole-workup overview. Clicking a flag's step scrolls to that step.
import { ENGINE_VERSION } from "@/lib/chem/version";
import { formatNumber } from "@/components/ui/format";
import { PredictionOverview, combineSteps } from "@/components/workup/prediction/prediction-overview";
import { specInput } from "@/lib/workups-client/to-spec";
import { stepElementId } from "./operation-card";
import { useEditor } from "./editor-context";
import { FieldLinks } from "@/components/ui/error-summary";
import { placeMessages } from "@/lib/workups-client/field-errors";
import { revealIn, summaryItems } from "./error-items";

export function PredictionPanel() {
  const { live, state } = useEditor();
  const p = live.prediction;
  const status =
    live.status === "waiting" ? "Waiting for a workup the engine can read…"
      : live.status === "invalid" ? `${p ? "Showing the last readable form. " : ""}Fix ${live.issues.length} field${live.issues.length === 1 ? "" : "s"} to update the prediction.`
        : live.status === "failed" ? `The engine could not run this workup: ${live.failure ?? ""}`
          : `Updated${live.elapsedMs !== null ? ` in ${formatNumber(live.elapsedMs, 0)} ms` : ""} · engine ${ENGINE_VERSION}`;
  const intervalNote = live.intervalStatus === "computing" ? "computing the interval…"
    : live.intervalStatus === "failed" ? "the interval could not be computed"
      : live.interval ? `preview, ${live.interval.draws} draws; saving stores the server's` : "no interval yet";
  const steps = combineSteps(specInput(state).operations as { type?: unknown; streams?: unknown }[]);
  const onStep = (n: number) => {
    const op = state.operations[n - 1];
    if (op) document.getElementById(stepElementId(op.id))?.scrollIntoView({ behavior: "smooth", block: "start" });
  };
  return (
    <section aria-labelledby="prediction-heading" className="rounded-lg border border-stone-200 bg-white p-4 shadow-xs" data-testid="live-prediction" data-revision={live.revision}>
      <h2 id="prediction-heading" className="text-base font-semibold text-stone-900">Prediction</h2>
      <p aria-live="polite" className={`mt-0.5 text-xs ${live.status === "ready" ? "text-stone-500" : "text-amber-800"}`} data-testid="prediction-status">{status}</p>
      {live.status === "invalid" && live.issues.length > 0 ? (
        <FieldLinks items={summaryItems(placeMessages(live.issues, state), state)} onReveal={revealIn(state)} className="mt-1 list-disc space-y-0.5 pl-5 text-xs" />
      ) : null}
      {p ? (
        <div className={`mt-3 ${live.stale ? "opacity-60" : ""}`}>
          <PredictionOverview prediction={p} intervals={live.interval?.components ?? null} intervalNote={intervalNote} combinedAt={steps} onStep={onStep} />
        </div>
      ) : (
        <p className="mt-3 text-sm text-stone-600">Add at least one component with its amount and log P, and one step. The engine then shows where everything goes, step by step.</p>
      )}
    </section>
  );
}
