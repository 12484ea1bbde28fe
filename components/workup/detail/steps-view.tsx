// The saved steps in words, each with what the stored prediction says happens in it (funnel picture, where each
// component goes) and the safety cautions it triggers. Reads the spec defensively: an old or imported record that no
// longer fits the schema still shows its steps.
import { type Library } from "@/lib/chem/library";
import { type WorkupPrediction } from "@/lib/chem/types";
import type { JsonObject, JsonValue } from "@/lib/workups/record";
import { stepWords } from "@/lib/workups-client/describe";
import { drawingCapacityMl } from "@/lib/workups-client/funnel-geometry";
import { CautionNotes, FlagNotes } from "@/components/workup/prediction/step-notes";
import { StepPrediction } from "@/components/workup/prediction/step-prediction";

export function StepsView({ spec, prediction, library }: { spec: JsonObject; prediction: WorkupPrediction | null; library: Library }) {
  const operations: JsonValue[] = Array.isArray(spec.operations) ? spec.operations : [];
  if (operations.length === 0) return <p className="text-sm text-stone-500">No steps recorded.</p>;
  const funnel = spec.funnel !== null && typeof spec.funnel === "object" && !Array.isArray(spec.funnel) && spec.funnel.unit === "mL" && typeof spec.funnel.value === "number" ? spec.funnel.value : undefined;
  const capacityMl = prediction ? drawingCapacityMl(prediction.steps, funnel) : 100;
  const components = prediction?.components.map((c) => ({ key: c.key, name: c.name, isProduct: c.key === prediction.productKey })) ?? [];
  const startMmol = Object.fromEntries(prediction?.components.map((c) => [c.key, c.startMmol]) ?? []);
  return (
    <ol className="space-y-4">
      {operations.map((op, i) => {
        const n = i + 1;
        const words = stepWords(op, library);
        const label = op !== null && typeof op === "object" && !Array.isArray(op) && typeof op.label === "string" ? op.label : "";
        const step = prediction?.steps[i];
        return (
          <li key={i} className="flex gap-3">
            <span aria-hidden className="mt-0.5 flex h-6 w-6 shrink-0 items-center justify-center rounded-full bg-stone-800 text-xs font-semibold text-white">{n}</span>
            <div className="min-w-0 flex-1 space-y-2">
              <p className="text-sm text-stone-900">
                <span className="sr-only">Step {n}: </span>
                {/* Sentence case from the style sheet, so the step type reads as a word in running text ("wash"). */}
                <span className="inline-block font-medium first-letter:uppercase">{words.title.charAt(0).toLowerCase() + words.title.slice(1)}</span>
                {words.details ? <span className="text-stone-700">: {words.details}</span> : null}
                {label ? <span className="ml-2 text-stone-500">“{label}”</span> : null}
              </p>
              <CautionNotes cautions={prediction?.cautions.filter((c) => c.step === n) ?? []} />
              {step ? <div className="rounded-md bg-stone-50 p-3"><StepPrediction step={step} components={components} capacityMl={capacityMl} startMmol={startMmol} /></div> : null}
              <FlagNotes flags={prediction?.flags.filter((f) => f.step === n) ?? []} />
            </div>
          </li>
        );
      })}
    </ol>
  );
}
