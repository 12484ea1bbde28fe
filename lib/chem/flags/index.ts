/**
 * Failure-mode flags. Each rule reads the simulation and returns flags with a plain-language
 * cause and a remedy. Thresholds are the document's suggested defaults. Flags are prompts to look, not verdicts.
 */
import { type Flag } from "../types";
import { type FlagContext, type Rule } from "./context";
import { co2Foaming, heldUp, precipitation, volatileProduct, wetOrganic } from "./handling";
import { discardedProduct, emulsionRisk, layerMisidentified, poorCut } from "./layers";
import { cosolventNotRemoved, dipolarCarried, overWashing, solventTooNonPolar, temperatureSensitive, tooFewExtractions } from "./partition";
import { capacity, degradation, extractionWrongPh, polarProduct, washNearPka } from "./ph";
import { chelation, crudeMassSuspect, ionPair, measurementArtefact, noInProcessAssay, oxidantNotQuenched, wrongQuench } from "./record";

export type { FlagContext } from "./context";

const RULES: Rule[] = [
  washNearPka, extractionWrongPh, capacity, tooFewExtractions, overWashing, cosolventNotRemoved, dipolarCarried,
  crudeMassSuspect, emulsionRisk, layerMisidentified, discardedProduct, co2Foaming, volatileProduct, heldUp,
  degradation, precipitation, polarProduct, ionPair, wrongQuench, poorCut, wetOrganic, temperatureSensitive,
  solventTooNonPolar, noInProcessAssay, measurementArtefact, chelation, oxidantNotQuenched,
];

/** Codes of the failure modes that the engine evaluates. */
export const IMPLEMENTED_FAILURE_MODES = [
  "F1", "F2", "F3", "F4", "F5", "F6", "F7", "F8", "F9", "F10", "F11", "F12", "F13", "F14", "F15",
  "F16", "F17", "F18", "F19", "F20", "F22", "F23", "F24", "F25", "F26", "F27", "F28", "F29",
] as const;

const SEVERITY_ORDER = { danger: 0, warning: 1, info: 2 } as const;

export function evaluateFlags(ctx: FlagContext): Flag[] {
  const flags = RULES.flatMap((rule) => rule(ctx));
  return flags.sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] || (a.step ?? 0) - (b.step ?? 0));
}
