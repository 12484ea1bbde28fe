/**
 * Text the databases cannot store. PostgreSQL (and PGlite) refuse a NUL character (U+0000) in text and JSON, and
 * a lone UTF-16 surrogate cannot be encoded as UTF-8 at all; either used to reach a query and come back as a 500.
 * Every input parsed through lib/errors.ts parseInput is scanned first, so such text is refused with 422 and the
 * field named, before any query. Pure; browser-safe.
 */

export type UnsafeTextProblem = { path: (string | number)[]; message: string };

// A high surrogate not followed by a low one, or a low surrogate not preceded by a high one.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function unsafeTextMessage(text: string): string | null {
  if (text.includes("\u0000")) return "must not contain a NUL character (U+0000)";
  if (LONE_SURROGATE.test(text)) return "contains a broken character (an unpaired UTF-16 surrogate); re-type or re-paste the text";
  return null;
}

/** A visited value and where it sits: the parent's link and the key, so no path is copied until one is reported. */
type Place = { value: unknown; key: string | number | null; parent: Place | null; /** A field name's own problem, reported at the object. */ keyProblem?: string };

function pathOf(place: Place): (string | number)[] {
  const path: (string | number)[] = [];
  for (let p: Place | null = place; p !== null && p.key !== null; p = p.parent) path.push(p.key);
  return path.reverse();
}

/**
 * Every string (and object key) in `value` that cannot be stored, with its path; at most `limit` problems. Walks
 * with its own stack, not by recursion: a body of a few thousand nested arrays must be answered, not overflow the
 * call stack (and paths are linked, not copied, so a deep body costs linear time).
 */
export function findUnsafeText(value: unknown, limit = 20): UnsafeTextProblem[] {
  const problems: UnsafeTextProblem[] = [];
  const seen = new Set<object>();
  const stack: Place[] = [{ value, key: null, parent: null }];
  while (stack.length > 0 && problems.length < limit) {
    const place = stack.pop()!;
    if (place.keyProblem !== undefined) {
      problems.push({ path: pathOf(place.parent ?? place), message: place.keyProblem });
      continue;
    }
    const v = place.value;
    if (typeof v === "string") {
      const message = unsafeTextMessage(v);
      if (message) problems.push({ path: pathOf(place), message });
      continue;
    }
    if (v === null || typeof v !== "object" || seen.has(v)) continue;
    seen.add(v);
    if (v instanceof Date || v instanceof Uint8Array || (typeof Blob !== "undefined" && v instanceof Blob)) continue;
    const children: Place[] = [];
    if (Array.isArray(v)) {
      v.forEach((x, i) => children.push({ value: x, key: i, parent: place }));
    } else {
      for (const [k, x] of Object.entries(v)) {
        const keyProblem = unsafeTextMessage(k);
        if (keyProblem) children.push({ value: null, key: null, parent: place, keyProblem: `a field name ${keyProblem}` });
        children.push({ value: x, key: k, parent: place });
      }
    }
    // Pushed in reverse so they are visited in document order.
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]!);
  }
  return problems;
}
