/**
 * Where the product is after each step, as fractions of what was there at the start: still in the stream carried
 * forward, set aside in a saved layer (not yet combined back), or gone, by where it went (the engine's loss
 * buckets: aqueous layers, organic waste, drying agent, filter cake, evaporation). The mass balance closes:
 * kept + saved + the losses = 1 at every step (to the engine's rounding).
 */
import { LOSS_BUCKETS, lossBucket, noLosses, type LossBucket } from "@/lib/chem/losses";
import { type StepResult } from "@/lib/chem/types";

export type LossKind = LossBucket;
export const LOSS_KINDS = LOSS_BUCKETS;

export interface TrailPoint {
  step: number;
  label: string;
  kept: number;
  saved: number;
  lost: Record<LossKind, number>;
}

/**
 * `combinedAt` gives, for each combine step (1-based), the saved-stream names it pools back into the kept stream.
 * Returns [] when the product has no starting amount.
 */
export function productTrail(steps: StepResult[], productKey: string, startMmol: number, combinedAt: ReadonlyMap<number, readonly string[]>): TrailPoint[] {
  if (!(startMmol > 0)) return [];
  const lost = noLosses();
  const saved = new Map<string, number>();
  return steps.map((step) => {
    for (const name of combinedAt.get(step.index) ?? []) saved.delete(name);
    for (const side of step.sideStreams) {
      const mmol = side.components[productKey] ?? 0;
      if (side.fate === "saved") saved.set(side.name, mmol);
      const kind = lossBucket(side);
      if (kind) lost[kind] += mmol;
    }
    const savedMmol = [...saved.values()].reduce((a, b) => a + b, 0);
    const share = noLosses();
    for (const k of LOSS_BUCKETS) share[k] = lost[k] / startMmol;
    return { step: step.index, label: step.label, kept: (step.kept.components[productKey] ?? 0) / startMmol, saved: savedMmol / startMmol, lost: share };
  });
}
