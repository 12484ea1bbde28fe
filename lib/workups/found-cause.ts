/**
 * The cause a group found when it reviewed a shortfall (at a group meeting, from the chemist's notebook or a re-run
 * of the workup). It does not change the workup's own judgement; it teaches the next ones: the group's cause
 * frequencies count found causes in full (lib/workups/judgement-history.ts), so that a group whose shortfalls are
 * mostly, say, wrong pH sees that cause ranked higher in future.
 */
import { z } from "zod";
import { strictObject } from "@/lib/chem/schema-strict";
import { type Db } from "@/lib/db/client";
import { NotFoundError, parseInput } from "@/lib/errors";
import { audit } from "./audit";
import { CAUSE_CODES, CAUSE_LABELS } from "./causes";
import { type Actor } from "./context";

/** A cause code, or "other" for a cause the engine does not model (a spill, a decomposed product, a wrong weighing). */
export const FOUND_CAUSES = [...CAUSE_CODES, "other"] as const;
export type FoundCause = (typeof FOUND_CAUSES)[number];

export const FOUND_CAUSE_LABELS: Record<FoundCause, string> = { ...CAUSE_LABELS, other: "Something else (say what in the note)" };

export function isFoundCause(value: unknown): value is FoundCause {
  return typeof value === "string" && (FOUND_CAUSES as readonly string[]).includes(value);
}

export const foundCauseInputSchema = strictObject({
  /** null clears a finding recorded earlier. */
  cause: z.enum(FOUND_CAUSES, { error: () => `Cause must be one of: ${FOUND_CAUSES.join(", ")}, or null to clear it` }).nullable(),
  note: z.string({ error: "Note must be text" }).trim().max(1000, { error: "Note must be ≤ 1000 characters" }).default(""),
}).superRefine((v, ctx) => {
  if (v.cause === "other" && v.note === "") ctx.addIssue({ code: "custom", path: ["note"], message: "Say in the note what the cause was" });
});

export interface FoundCauseRecord {
  workupId: string;
  cause: FoundCause | null;
  note: string;
  recordedAt: string | null;
}

/** Records (or clears) the cause found for the workup's reported outcome; a workup without an outcome is a 404. */
export async function recordFoundCause(db: Db, actor: Actor, workupId: string, input: unknown): Promise<FoundCauseRecord> {
  const found = parseInput(foundCauseInputSchema, input);
  const recordedAt = found.cause === null ? null : new Date();
  return db.$transaction(async (tx) => {
    const { count } = await tx.outcome.updateMany({
      where: { workupId, groupId: actor.groupId },
      data: { foundCause: found.cause, foundCauseNote: found.cause === null ? "" : found.note, foundCauseById: found.cause === null ? null : actor.userId, foundCauseAt: recordedAt },
    });
    if (count === 0) throw new NotFoundError("reported outcome for this workup");
    await audit(tx, actor, "workup.found_cause", workupId, { cause: found.cause, note: found.note });
    return { workupId, cause: found.cause, note: found.cause === null ? "" : found.note, recordedAt: recordedAt?.toISOString() ?? null };
  });
}

/** The cause as stored, or null for anything that is not one (a code retired since it was recorded). */
export function storedFoundCause(value: unknown): FoundCause | null {
  return isFoundCause(value) ? value : null;
}
