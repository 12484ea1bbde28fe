/**
 * The cause a group found when it reviewed a shortfall (at a group meeting, from the chemist's notebook or a re-run
 * of the workup). It does not change the workup's own judgement; it teaches the next ones: the group's cause
 * frequencies count found causes in full (lib/workups/judgement-history.ts), so that a group whose shortfalls are
 * mostly, say, wrong pH sees that cause ranked higher in future.
 */
import { type Db } from "@/lib/db/client";
import { NotFoundError, parseInput } from "@/lib/errors";
import { audit } from "./audit";
import { type Actor } from "./context";
import { foundCauseInputSchema, type FoundCause } from "./found-cause-schema";

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
