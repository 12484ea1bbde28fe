/**
 * Handling events of a workup, by kind, for the handling-loss term of the predictive distribution
 * (lib/chem/predictive.ts). Each portion of a wash or extraction is one separation cut; moving the crude into the
 * funnel and every combining of saved streams is one transfer; a co-solvent strip is a concentration.
 */
import type { Operation } from "./schema-operations";
import type { HandlingStep } from "./predictive";

export function handlingEvents(operations: readonly Operation[]): Record<HandlingStep, number> {
  const events: Record<HandlingStep, number> = { transfer: 1, separation: 0, drying: 0, filtration: 0, concentration: 0 };
  for (const op of operations) {
    switch (op.type) {
      case "wash":
      case "extract":
      case "back_extract":
        events.separation += op.portions;
        break;
      case "separate":
        events.separation += 1;
        break;
      case "combine":
        events.transfer += 1;
        break;
      case "dry":
        events.drying += 1;
        break;
      case "filter":
        events.filtration += 1;
        break;
      case "concentrate":
      case "remove_cosolvent":
        events.concentration += 1;
        break;
      default:
        break;
    }
  }
  return events;
}
