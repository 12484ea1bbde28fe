/**
 * Geometry of the per-step pictures: layer heights proportional to volume on one scale for the whole workup, so a
 * 20 mL wash under 50 mL of ethyl acetate looks like it. Pure numbers; the SVG components draw them.
 */
import { type PhaseState, type StepResult } from "@/lib/chem/types";

export interface LayerBox {
  kind: PhaseState["kind"];
  position: PhaseState["position"];
  volumeMl: number;
  /** Top edge and height in the drawing's units (y grows downwards). */
  y: number;
  height: number;
}

/** Smallest drawn height of a layer that holds any liquid, so a 1 mL layer stays visible. */
export const MIN_LAYER_HEIGHT = 3;
/** Head-room over the largest liquid volume, so the fullest step is not drawn brim-full (common practice: a funnel is filled to about three quarters). */
export const HEADROOM = 1.3;

/** The vessel volume every step is drawn against: the funnel's size when given, else the largest liquid volume with head-room. */
export function drawingCapacityMl(steps: StepResult[], funnelMl?: number): number {
  let largest = 0;
  for (const step of steps) {
    for (const contact of step.contacts) largest = Math.max(largest, contact.phases.reduce((v, p) => v + p.volumeMl, 0));
    largest = Math.max(largest, step.kept.volumeMl);
  }
  const needed = largest * HEADROOM;
  return Math.max(funnelMl ?? 0, needed, 1);
}

/**
 * Stacks the phases from the bottom of a vessel whose liquid region spans `top`…`bottom`. The phase the engine puts
 * on top is drawn on top; a single phase fills from the bottom.
 */
export function layerBoxes(phases: PhaseState[], capacityMl: number, top: number, bottom: number): LayerBox[] {
  const span = bottom - top;
  const order = [...phases].sort((a, b) => rank(a.position) - rank(b.position));
  let y = bottom;
  return order.map((p) => {
    const height = p.volumeMl > 0 ? Math.max(MIN_LAYER_HEIGHT, Math.min(span, (p.volumeMl / capacityMl) * span)) : 0;
    y -= height;
    return { kind: p.kind, position: p.position, volumeMl: p.volumeMl, y: Math.max(top, y), height };
  });
}

function rank(position: PhaseState["position"]): number {
  return position === "bottom" ? 0 : position === "single" ? 1 : 2;
}

/** Share of each component's amount in each phase of one contact (0–1), for the bars beside the picture. */
export function phaseShares(phases: PhaseState[], key: string): { kind: PhaseState["kind"]; share: number; mmol: number; charged: number }[] {
  const amounts = phases.map((p) => {
    const s = p.components[key];
    return { kind: p.kind, mmol: s ? s.neutral + s.charged : 0, charged: s ? s.charged : 0 };
  });
  const total = amounts.reduce((a, b) => a + b.mmol, 0);
  return amounts.map((a) => ({ ...a, share: total > 0 ? a.mmol / total : 0 }));
}
