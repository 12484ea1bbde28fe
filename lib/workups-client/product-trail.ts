/**
 * Where the product is after each step, as fractions of what was there at the start: still in the stream carried
 * forward, set aside in a saved layer (not yet combined back), or gone, by where it went. The mass balance closes:
 * kept + saved + the losses = 1 at every step (to the engine's rounding).
 */
import { type SideStream, type StepResult } from "@/lib/chem/types";

export type LossKind = "aqueous" | "organic" | "solid" | "evaporated";

export interface TrailPoint {
  step: number;
  label: string;
  kept: number;
  saved: number;
  lost: Record<LossKind, number>;
}

function lossKind(s: SideStream): LossKind | null {
  switch (s.fate) {
    case "drying_agent": case "filter_cake": return "solid";
    case "evaporated": return "evaporated";
    case "waste": return s.wasteClass === "aqueous" ? "aqueous" : s.wasteClass === "solid" ? "solid" : "organic";
    default: return null;
  }
}

/**
 * `combinedAt` gives, for each combine step (1-based), the saved-stream names it pools back into the kept stream.
 * Returns [] when the product has no starting amount.
 */
export function productTrail(steps: StepResult[], productKey: string, startMmol: number, combinedAt: ReadonlyMap<number, readonly string[]>): TrailPoint[] {
  if (!(startMmol > 0)) return [];
  const lost: Record<LossKind, number> = { aqueous: 0, organic: 0, solid: 0, evaporated: 0 };
  const saved = new Map<string, number>();
  return steps.map((step) => {
    for (const name of combinedAt.get(step.index) ?? []) saved.delete(name);
    for (const side of step.sideStreams) {
      const mmol = side.components[productKey] ?? 0;
      if (side.fate === "saved") saved.set(side.name, mmol);
      const kind = lossKind(side);
      if (kind) lost[kind] += mmol;
    }
    const savedMmol = [...saved.values()].reduce((a, b) => a + b, 0);
    return {
      step: step.index,
      label: step.label,
      kept: (step.kept.components[productKey] ?? 0) / startMmol,
      saved: savedMmol / startMmol,
      lost: { aqueous: lost.aqueous / startMmol, organic: lost.organic / startMmol, solid: lost.solid / startMmol, evaporated: lost.evaporated / startMmol },
    };
  });
}
