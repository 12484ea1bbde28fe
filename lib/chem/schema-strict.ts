/**
 * Objects that refuse keys they do not know. A misspelt key is not dropped silently (a `"portion": 5` would run
 * one portion, a `"pKa"` would make the compound neutral): each unknown key gets its own issue at its own path,
 * with the nearest allowed key as a suggestion. Stored records the app wrote itself are read with
 * `withoutUnknownKeys`, which drops such keys instead (README, "Input: a workup description").
 */
import { z } from "zod";

/** Marks the issues this module raises, so a tolerant reader can tell them from every other problem. */
export const UNKNOWN_KEY = "unknown_key";

/**
 * Optimal string alignment distance (Levenshtein with adjacent transpositions counted as one edit; Damerau,
 * Comm. ACM 7 (1964) 171), case-insensitive: "pKa" against "pKas" is 1, "protions" against "portions" is 1.
 */
export function editDistance(a: string, b: string): number {
  const s = a.toLowerCase(), t = b.toLowerCase();
  const d: number[][] = Array.from({ length: s.length + 1 }, (_, i) => Array.from({ length: t.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i <= s.length; i++) {
    for (let j = 1; j <= t.length; j++) {
      const row = d[i] as number[], prev = d[i - 1] as number[];
      const cost = s[i - 1] === t[j - 1] ? 0 : 1;
      let v = Math.min((prev[j] as number) + 1, (row[j - 1] as number) + 1, (prev[j - 1] as number) + cost);
      if (i > 1 && j > 1 && s[i - 1] === t[j - 2] && s[i - 2] === t[j - 1]) v = Math.min(v, ((d[i - 2] as number[])[j - 2] as number) + 1);
      row[j] = v;
    }
  }
  return (d[s.length] as number[])[t.length] as number;
}

/**
 * The allowed key nearest to `key`, when it is close enough to be a slip: at most a third of the longer name's
 * letters differ (at least one), or one name contains the other ("volumeMl" for "volume").
 */
export function suggestKey(key: string, allowed: readonly string[]): string | null {
  let best: string | null = null, bestD = Infinity;
  for (const a of allowed) {
    const d = editDistance(key, a);
    if (d < bestD) { best = a; bestD = d; }
  }
  if (best === null) return null;
  const limit = Math.max(1, Math.floor(Math.max(key.length, best.length) / 3));
  if (bestD <= limit) return best;
  const k = key.toLowerCase();
  const contained = allowed.find((a) => a.length >= 3 && k.length >= 3 && (k.startsWith(a.toLowerCase()) || a.toLowerCase().startsWith(k)));
  return contained ?? null;
}

export function unknownKeyMessage(key: string, allowed: readonly string[]): string {
  const near = suggestKey(key, allowed);
  return near ? `\`${key}\`: unknown key; did you mean \`${near}\`?` : `\`${key}\`: unknown key; allowed here: ${allowed.map((a) => `\`${a}\``).join(", ")}`;
}

/**
 * z.strictObject whose unknown keys are reported one by one at their own path (zod reports them together at the
 * object's path). The issues continue, so the object's other checks still run and every problem is listed at once.
 */
export function strictObject<T extends z.core.$ZodLooseShape>(shape: T) {
  const allowed = Object.keys(shape);
  // `when`: run even after a property failed (a check is skipped by default once an issue has aborted).
  return z.strictObject(shape).check(z.core._check<Record<string, unknown>>((payload) => {
    const issues = payload.issues;
    for (let i = issues.length - 1; i >= 0; i--) {
      const issue = issues[i];
      if (!issue || issue.code !== "unrecognized_keys" || (issue.path?.length ?? 0) > 0) continue;
      issues.splice(i, 1, ...issue.keys.map((key) => ({
        code: "custom" as const, path: [key], input: (issue.input)?.[key],
        message: unknownKeyMessage(key, allowed), params: { reason: UNKNOWN_KEY }, continue: true,
      })));
    }
  }, { when: () => true }));
}

/** True for an issue raised by a strictObject for a key it does not know. */
export function isUnknownKeyIssue(issue: z.core.$ZodIssue): boolean {
  return issue.code === "custom" && (issue.params as { reason?: unknown } | undefined)?.reason === UNKNOWN_KEY;
}

/**
 * A deep copy of `input` without the keys `schema` does not know, and the paths of the keys dropped. For data the
 * app stored itself (saved versions, its own export), where an old key is noise rather than a typing slip.
 */
export function withoutUnknownKeys(schema: z.ZodType, input: unknown): { value: unknown; dropped: string[] } {
  const value = structuredClone(input);
  const dropped: string[] = [];
  for (let round = 0; round < 4; round++) {
    const r = schema.safeParse(value);
    if (r.success) break;
    const unknown = r.error.issues.filter(isUnknownKeyIssue);
    if (unknown.length === 0) break;
    for (const issue of unknown) {
      let node: unknown = value;
      for (const part of issue.path.slice(0, -1)) node = (node as Record<PropertyKey, unknown> | null)?.[part];
      const last = issue.path.at(-1);
      if (node !== null && typeof node === "object" && last !== undefined) {
        delete (node as Record<PropertyKey, unknown>)[last];
        dropped.push(issue.path.map(String).join("."));
      }
    }
  }
  return { value, dropped };
}
