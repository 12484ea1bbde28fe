/**
 * Stable ids of a workup's steps. The editor gives every step an id that is saved with it (`id` on the operation in
 * the stored spec; the engine's schema ignores it), so a three-way merge and the history can follow a step when
 * steps are inserted, removed or moved. Steps saved before ids existed (or sent by a client that sends none) get
 * an id from their position, the same for everyone who opened that version, so two people editing such a record
 * still agree on which step is which. Pure; browser-safe.
 */
import { type JsonObject, type JsonValue } from "./record";

const STEP_ID = /^[A-Za-z0-9_-]{1,40}$/;

export function stepIdOf(op: JsonValue | undefined, index: number): string {
  const id = op !== null && typeof op === "object" && !Array.isArray(op) ? op["id"] : undefined;
  return typeof id === "string" && STEP_ID.test(id) ? id : `step-${index + 1}`;
}

/** The operations of a spec, each with its id written in (position ids for steps saved without one). */
export function withStepIds(operations: JsonValue | undefined): JsonObject[] {
  if (!Array.isArray(operations)) return [];
  const seen = new Set<string>();
  return operations.map((op, i) => {
    const record: JsonObject = op !== null && typeof op === "object" && !Array.isArray(op) ? op : {};
    let id = stepIdOf(record, i);
    if (seen.has(id)) id = `${id}-${i + 1}`; // a duplicated step that kept its source's id
    seen.add(id);
    return { ...record, id };
  });
}
