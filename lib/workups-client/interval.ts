/**
 * The interval shown while editing: the engine's seeded Monte Carlo with fewer draws than a save (200 against the
 * server's 300), so it returns within a few hundred milliseconds. Shared by the worker and the main-thread fallback.
 */
import { type LibraryOverrides } from "@/lib/chem/library";
import { type WorkupInput } from "@/lib/chem/schema";
import { engineSimulator } from "@/lib/chem/compiled";
import { propagateUncertainty, type Interval } from "@/lib/chem/uncertainty";

/** 200 draws put 5 draws in each 2.5 % tail: a usable preview edge (the saved interval uses more). */
export const PREVIEW_DRAWS = 200;
/** Fixed, so the same form shows the same interval every time. */
export const PREVIEW_SEED = 7;

export interface PreviewInterval {
  draws: number;
  failedDraws: number;
  components: Record<string, { recovery: Interval; purityPct: Interval; mainSources: { path: string; share: number }[] }>;
}

export interface IntervalRequest {
  id: number;
  spec: WorkupInput;
  library: LibraryOverrides;
  draws: number;
}

export type IntervalReply = { id: number; ok: true; interval: PreviewInterval } | { id: number; ok: false; message: string };

export function computeInterval(request: IntervalRequest): IntervalReply {
  try {
    // engineSimulator lets the uncertainty run on a compiled workup (numbers rewritten in place per draw).
    const u = propagateUncertainty(request.spec, engineSimulator(request.library), { draws: request.draws, seed: PREVIEW_SEED });
    return { id: request.id, ok: true, interval: { draws: u.draws, failedDraws: u.failedDraws, components: u.components } };
  } catch (error) {
    return { id: request.id, ok: false, message: error instanceof Error ? error.message : "the interval could not be computed" };
  }
}
