// The whole-workup view of a prediction: product recovery with its interval, purity and crude mass, every
// component's fate, the product's trail through the steps, and the flags with causes and remedies.
import { type WorkupPrediction } from "@/lib/chem/types";
import { type Interval } from "@/lib/chem/uncertainty";
import { formatNumber } from "@/components/ui/format";
import { productTrail } from "@/lib/workups-client/product-trail";
import { FlagNotes } from "./step-notes";
import { ProductTrailChart } from "./product-trail-chart";
import { RecoveryInterval } from "./recovery-interval";
import { mg, pct } from "./format";

export interface IntervalView {
  recovery: Pick<Interval, "p025" | "p975">;
  purityPct: Pick<Interval, "p025" | "p975">;
}

export function PredictionOverview({ prediction, intervals, intervalNote, combinedAt, reported, onStep }: {
  prediction: WorkupPrediction;
  intervals: Record<string, IntervalView> | null;
  /** How the interval was computed (draws, preview or stored). */
  intervalNote: string;
  combinedAt: ReadonlyMap<number, readonly string[]>;
  reported?: number | null;
  onStep?: (step: number) => void;
}) {
  const key = prediction.productKey;
  const product = prediction.components.find((c) => c.key === key);
  const band = key ? intervals?.[key] : undefined;
  const trail = product ? productTrail(prediction.steps, product.key, product.startMmol, combinedAt) : [];
  const cautionSteps = [...new Set(prediction.cautions.map((c) => c.step))];
  return (
    <div className="space-y-4">
      {product ? (
        <div>
          <p className="text-xs font-medium uppercase tracking-wide text-stone-500">Predicted recovery of {product.name}</p>
          <p className="mt-0.5 text-3xl font-semibold tabular-nums text-stone-900" data-testid="predicted-recovery">{pct(product.recovery)}</p>
          <p className="text-xs text-stone-600" data-testid="predicted-interval">
            {band ? <>95 % interval {pct(band.recovery.p025)} – {pct(band.recovery.p975)} <span className="text-stone-400">({intervalNote})</span></> : intervalNote}
          </p>
          <RecoveryInterval predicted={product.recovery} low={band?.recovery.p025 ?? null} high={band?.recovery.p975 ?? null} reported={reported} />
          <dl className="mt-1 grid grid-cols-2 gap-x-4 gap-y-1 text-sm">
            <dt className="text-stone-500">Purity of the crude</dt>
            <dd className="tabular-nums">{formatNumber(product.purityPct, 1)} %{band ? <span className="text-xs text-stone-500"> ({formatNumber(band.purityPct.p025, 0)}–{formatNumber(band.purityPct.p975, 0)} %)</span> : null}</dd>
            <dt className="text-stone-500">Crude mass</dt>
            <dd className="tabular-nums">{mg(prediction.crudeMassMg)}</dd>
            {Object.entries(prediction.residualSolventsMg).map(([solvent, amount]) => (
              <div key={solvent} className="contents"><dt className="text-stone-500">of which {solvent}</dt><dd className="tabular-nums">{mg(amount)}</dd></div>
            ))}
          </dl>
        </div>
      ) : (
        <p className="text-sm text-stone-600">No component has the role “product”: the engine follows every component, but recovery is judged for the product.</p>
      )}
      <table className="w-full text-sm">
        <caption className="mb-1 text-left text-xs font-medium uppercase tracking-wide text-stone-500">In the isolated material</caption>
        <thead className="text-left text-xs text-stone-500"><tr><th scope="col" className="font-normal">Component</th><th scope="col" className="text-right font-normal">Recovered</th><th scope="col" className="text-right font-normal">Mass</th></tr></thead>
        <tbody>
          {prediction.components.map((c) => (
            <tr key={c.key} className={c.key === key ? "font-medium" : "text-stone-700"}>
              <th scope="row" className={`max-w-44 truncate py-0.5 text-left ${c.key === key ? "font-medium" : "font-normal"}`} title={c.name}>{c.name}</th>
              <td className="text-right tabular-nums">{pct(c.recovery)}</td>
              <td className="text-right tabular-nums">{mg(c.isolatedMg)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {product && trail.length > 0 ? (
        <div>
          <p className="mb-1 text-xs font-medium uppercase tracking-wide text-stone-500">The product, step by step</p>
          <ProductTrailChart trail={trail} productName={product.name} />
        </div>
      ) : null}
      <div>
        <p className="mb-1 text-xs font-medium uppercase tracking-wide text-stone-500">Flags ({prediction.flags.length})</p>
        {prediction.flags.length === 0 ? <p className="text-sm text-stone-600">Nothing the engine checks for stands out.</p> : <FlagNotes flags={prediction.flags} showStep onStep={onStep} />}
      </div>
      {cautionSteps.length > 0 ? (
        <p className="rounded border border-orange-200 bg-orange-50 px-3 py-2 text-xs text-orange-950">
          {prediction.cautions.length} safety prompt{prediction.cautions.length === 1 ? "" : "s"} at step{cautionSteps.length === 1 ? "" : "s"} {cautionSteps.join(", ")}, shown at each step.
          They are prompts, not approvals: your institution&apos;s rules, your group&apos;s procedures and the current safety data sheets decide.
        </p>
      ) : null}
    </div>
  );
}

/** Saved-stream names each combine step (1-based) pools back, from the spec's operations. */
export function combineSteps(operations: readonly { type?: unknown; streams?: unknown }[]): Map<number, string[]> {
  const out = new Map<number, string[]>();
  operations.forEach((op, i) => {
    if (op.type === "combine" && Array.isArray(op.streams)) out.set(i + 1, op.streams.filter((s): s is string => typeof s === "string"));
  });
  return out;
}
