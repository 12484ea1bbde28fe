/**
 * Unsaved edits kept in the browser, so that reloading the page (or a crash of the tab) does not throw them away.
 * One draft per workup: the form as a snapshot, the version it was opened from and that version's snapshot (the
 * base a later three-way merge needs). Cleared when the edits are saved or deliberately discarded.
 */
import type { WorkupSnapshot } from "@/lib/workups/record";

export interface Draft {
  workupId: string;
  /** The version the form was opened from (or rebased onto). */
  baseVersion: number;
  base: WorkupSnapshot;
  mine: WorkupSnapshot;
  /** ISO time of the last edit kept. */
  savedAt: string;
}

/** The part of the Web Storage API used here (localStorage in the browser; a Map-backed stand-in in tests). */
export type DraftStorage = Pick<Storage, "getItem" | "setItem" | "removeItem">;

const keyOf = (workupId: string) => `layerwise:draft:${workupId}`;

export function saveDraft(storage: DraftStorage, draft: Draft): void {
  try {
    storage.setItem(keyOf(draft.workupId), JSON.stringify(draft));
  } catch {
    // Storage full or disabled: the leave-page warning still guards the edits.
  }
}

export function loadDraft(storage: DraftStorage, workupId: string): Draft | null {
  let text: string | null;
  try {
    text = storage.getItem(keyOf(workupId));
  } catch {
    return null;
  }
  if (!text) return null;
  try {
    const d = JSON.parse(text) as Partial<Draft>;
    const ok = d.workupId === workupId && typeof d.baseVersion === "number" && typeof d.savedAt === "string"
      && isSnapshot(d.base) && isSnapshot(d.mine);
    return ok ? (d as Draft) : null;
  } catch {
    return null;
  }
}

export function clearDraft(storage: DraftStorage, workupId: string): void {
  try {
    storage.removeItem(keyOf(workupId));
  } catch {
    // nothing to do
  }
}

function isSnapshot(v: unknown): v is WorkupSnapshot {
  if (v === null || typeof v !== "object") return false;
  const s = v as Record<string, unknown>;
  return s["header"] !== null && typeof s["header"] === "object" && s["spec"] !== null && typeof s["spec"] === "object" && Array.isArray(s["links"]);
}

/** The browser's localStorage, or null where there is none (server rendering, storage blocked). */
export function browserStorage(): DraftStorage | null {
  try {
    return typeof window !== "undefined" ? window.localStorage : null;
  } catch {
    return null;
  }
}
