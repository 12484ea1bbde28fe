/**
 * Undo for the editor: every edit pushes the state before it, except that a run of edits to the same field within
 * COALESCE_MS counts as one (typing "25" is one undo step, not two). Pure; the hook keeps it in React state.
 */

/** Keystrokes to one field closer together than this are one edit. */
export const COALESCE_MS = 1200;
/** Oldest edits are forgotten beyond this many. */
export const MAX_UNDO = 200;

export interface UndoHistory<T> {
  past: T[];
  present: T;
  future: T[];
  /** The field the last edit touched and when, for coalescing. */
  lastKey: string | null;
  lastAt: number;
}

export function startHistory<T>(present: T): UndoHistory<T> {
  return { past: [], present, future: [], lastKey: null, lastAt: 0 };
}

/** Records `next` as the new present. `key` names the field edited (null: a structural edit, never merged). */
export function record<T>(h: UndoHistory<T>, next: T, key: string | null, now: number): UndoHistory<T> {
  if (next === h.present) return h;
  const merge = key !== null && key === h.lastKey && now - h.lastAt < COALESCE_MS && h.past.length > 0;
  const past = merge ? h.past : [...h.past, h.present].slice(-MAX_UNDO);
  return { past, present: next, future: [], lastKey: key, lastAt: now };
}

export function undo<T>(h: UndoHistory<T>): UndoHistory<T> {
  const previous = h.past.at(-1);
  if (previous === undefined) return h;
  return { past: h.past.slice(0, -1), present: previous, future: [h.present, ...h.future], lastKey: null, lastAt: 0 };
}

export function redo<T>(h: UndoHistory<T>): UndoHistory<T> {
  const [next, ...rest] = h.future;
  if (next === undefined) return h;
  return { past: [...h.past, h.present], present: next, future: rest, lastKey: null, lastAt: 0 };
}

/** Replaces the present without an undo step (e.g. after a save the saved state is the new baseline). */
export function reset<T>(present: T): UndoHistory<T> {
  return startHistory(present);
}
