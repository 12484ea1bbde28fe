// The refusal of a save based on a stale version: say who changed the workup, when, and that nothing was saved.
import { ConflictError } from "@/lib/errors";
import { type Client } from "./context";

export class StaleVersionError extends ConflictError {
  constructor(
    readonly currentVersion: number,
    readonly baseVersion: number,
    readonly editedBy: string | null,
    readonly editedAt: Date | null,
  ) {
    super(staleMessage(currentVersion, baseVersion, editedBy, editedAt));
  }
}

/** "14:02 UTC" today, "3 Dec 14:02 UTC" on another day (the server cannot know the reader's time zone). */
export function formatEditTime(at: Date, now = new Date()): string {
  const time = at.toISOString().slice(11, 16);
  if (at.toISOString().slice(0, 10) === now.toISOString().slice(0, 10)) return `${time} UTC`;
  const day = at.toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
  return `${time} UTC on ${day}`;
}

export function staleMessage(currentVersion: number, baseVersion: number, editedBy: string | null, editedAt: Date | null): string {
  const who = editedBy ?? "someone else";
  const when = editedAt ? ` at ${formatEditTime(editedAt)}` : "";
  return (
    `This workup was changed by ${who}${when} (version ${currentVersion}) after you opened it (version ${baseVersion}). ` +
    "Reload to see their changes; your edits were not saved."
  );
}

/** Builds the refusal from the latest version row (who saved it and when). */
export async function staleVersionError(tx: Client, workupId: string, currentVersion: number, baseVersion: number): Promise<StaleVersionError> {
  const latest = await tx.workupVersion.findFirst({
    where: { workupId, version: currentVersion },
    select: { editedById: true, createdAt: true },
  });
  const editor = latest?.editedById
    ? await tx.user.findUnique({ where: { id: latest.editedById }, select: { name: true } })
    : null;
  return new StaleVersionError(currentVersion, baseVersion, editor?.name ?? null, latest?.createdAt ?? null);
}
