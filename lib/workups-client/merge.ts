/**
 * Three-way merge for a save refused as stale: start from the user's form, and take the other person's change
 * wherever the user left that part as it was when they opened it. Header fields merge one by one; the spec's
 * parts (components with their links, the starting mixture, the steps, each setting) merge as wholes, since a step
 * list edited on both sides cannot be combined safely by position. Where both changed the same part, the user's
 * version is kept and the part is named in `both`.
 */
import type { JsonObject, JsonValue, SnapshotHeader, WorkupSnapshot } from "@/lib/workups/record";

export interface MergeResult {
  merged: WorkupSnapshot;
  /** Parts only the other person changed, now taken into the form. */
  taken: string[];
  /** Parts both changed, differently; the user's version stays. */
  both: string[];
}

function canonical(v: JsonValue | undefined): string {
  if (v === undefined) return "undefined";
  if (Array.isArray(v)) return `[${v.map(canonical).join(",")}]`;
  if (v !== null && typeof v === "object") return `{${Object.keys(v).sort().map((k) => `${JSON.stringify(k)}:${canonical(v[k])}`).join(",")}}`;
  return JSON.stringify(v);
}

const same = (a: JsonValue | undefined, b: JsonValue | undefined) => canonical(a) === canonical(b);

export function mergeSnapshots(base: WorkupSnapshot, theirs: WorkupSnapshot, mine: WorkupSnapshot): MergeResult {
  const taken: string[] = [];
  const both: string[] = [];
  const pick = (name: string, b: JsonValue | undefined, t: JsonValue | undefined, m: JsonValue | undefined): JsonValue | undefined => {
    if (same(t, b) || same(t, m)) return m;
    if (same(m, b)) {
      taken.push(name);
      return t;
    }
    both.push(name);
    return m;
  };

  const header = { ...mine.header } as Record<string, JsonValue>;
  for (const key of Object.keys(mine.header) as (keyof SnapshotHeader)[]) {
    const v = pick(key, base.header[key], theirs.header[key], mine.header[key]);
    if (v !== undefined) header[key] = v;
  }

  const spec: JsonObject = { ...mine.spec };
  const keys = new Set([...Object.keys(base.spec), ...Object.keys(theirs.spec), ...Object.keys(mine.spec)]);
  let links = mine.links;
  for (const key of keys) {
    if (key === "components") {
      const b = { c: base.spec.components ?? null, l: base.links as unknown as JsonValue };
      const t = { c: theirs.spec.components ?? null, l: theirs.links as unknown as JsonValue };
      const m = { c: mine.spec.components ?? null, l: mine.links as unknown as JsonValue };
      const chosen = pick("components", b, t, m);
      if (chosen === (t as JsonObject)) {
        spec.components = t.c;
        links = theirs.links;
      }
      continue;
    }
    const v = pick(key, base.spec[key], theirs.spec[key], mine.spec[key]);
    if (v === undefined) delete spec[key];
    else spec[key] = v;
  }
  return { merged: { header: header as unknown as SnapshotHeader, spec, links }, taken, both };
}
