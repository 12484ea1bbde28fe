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

/** Every string (and object key) in `value` that cannot be stored, with its path; at most `limit` problems. */
export function findUnsafeText(value: unknown, limit = 20): UnsafeTextProblem[] {
  const problems: UnsafeTextProblem[] = [];
  const seen = new Set<object>();
  const visit = (v: unknown, path: (string | number)[]) => {
    if (problems.length >= limit) return;
    if (typeof v === "string") {
      const message = unsafeTextMessage(v);
      if (message) problems.push({ path, message });
      return;
    }
    if (v === null || typeof v !== "object" || seen.has(v)) return;
    seen.add(v);
    if (Array.isArray(v)) {
      v.forEach((x, i) => visit(x, [...path, i]));
      return;
    }
    if (v instanceof Date || v instanceof Uint8Array || (typeof Blob !== "undefined" && v instanceof Blob)) return;
    for (const [k, x] of Object.entries(v)) {
      const keyProblem = unsafeTextMessage(k);
      if (keyProblem) problems.push({ path: [...path], message: `a field name ${keyProblem}` });
      visit(x, [...path, k]);
    }
  };
  visit(value, []);
  return problems;
}
