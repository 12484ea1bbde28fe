/**
 * The cause a group found when it reviewed a shortfall: the choices, their words and the input schema. No server
 * code here, so the review's form can check its input in the browser with the schema the server uses.
 */
import { z } from "zod";
import { strictObject } from "@/lib/chem/schema-strict";
import { type CauseCode } from "./causes";

/** Each cause in a few words, for the "cause found" choice (the ranked list words each variant itself). */
export const CAUSE_LABELS: Record<CauseCode, string> = {
  reaction_shortfall: "The reaction gave less product than expected",
  emulsion_loss: "Emulsion or hold-up loss at a separation",
  wrong_ph: "Aqueous pH off target",
  product_logp_lower: "Product more polar than assumed",
  cosolvent_not_removed: "Water-miscible co-solvent not removed",
  one_fewer_extraction: "Fewer extractions than recorded",
  wrong_layer: "Wrong layer kept",
};

/** A cause code, or "other" for a cause the engine does not model (a spill, a decomposed product, a wrong weighing). */
export const FOUND_CAUSES = [
  "reaction_shortfall", "emulsion_loss", "wrong_ph", "product_logp_lower", "cosolvent_not_removed", "one_fewer_extraction", "wrong_layer", "other",
] as const satisfies readonly (CauseCode | "other")[];
export type FoundCause = (typeof FOUND_CAUSES)[number];
/** Every cause the ranking knows is a choice (a new CauseCode without a place in FOUND_CAUSES fails to compile). */
const everyCauseListed: Exclude<CauseCode, FoundCause> extends never ? true : never = true;
void everyCauseListed;

export const FOUND_CAUSE_LABELS: Record<FoundCause, string> = { ...CAUSE_LABELS, other: "Something else (say what in the note)" };

export function isFoundCause(value: unknown): value is FoundCause {
  return typeof value === "string" && (FOUND_CAUSES as readonly string[]).includes(value);
}

/** The cause as stored, or null for anything that is not one (a code retired since it was recorded). */
export function storedFoundCause(value: unknown): FoundCause | null {
  return isFoundCause(value) ? value : null;
}

export const foundCauseInputSchema = strictObject({
  /** null clears a finding recorded earlier. */
  cause: z.enum(FOUND_CAUSES, { error: () => `Cause must be one of: ${FOUND_CAUSES.join(", ")}, or null to clear it` }).nullable(),
  note: z.string({ error: "Note must be text" }).trim().max(1000, { error: "Note must be ≤ 1000 characters" }).default(""),
}).superRefine((v, ctx) => {
  if (v.cause === "other" && v.note === "") ctx.addIssue({ code: "custom", path: ["note"], message: "Say in the note what the cause was" });
});
