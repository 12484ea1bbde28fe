/**
 * What changed between two versions of a workup, for the history view: header fields, components (by key, with
 * their compound links) and operations. Steps saved with ids (step-ids.ts) are matched by id, wherever they moved;
 * a version whose steps carry no ids is matched by a longest common subsequence, so that inserting a step shows
 * one addition rather than every later step "changed". Pure; browser-safe.
 */
import { type JsonValue, type WorkupSnapshot } from "./record";
import { withStepIds } from "./step-ids";

export interface FieldChange {
  field: string;
  from: JsonValue;
  to: JsonValue;
}

export interface ComponentChange {
  key: string;
  name: string;
  changes: FieldChange[];
}

export interface OperationChange {
  /** 1-based step numbers in the older and newer version. */
  fromStep: number;
  toStep: number;
  type: string;
  changes: FieldChange[];
}

export interface VersionDiff {
  header: FieldChange[];
  components: { added: { key: string; name: string }[]; removed: { key: string; name: string }[]; changed: ComponentChange[] };
  operations: {
    added: { step: number; type: string; label: string | null }[];
    removed: { step: number; type: string; label: string | null }[];
    changed: OperationChange[];
  };
  /** Spec settings outside components and operations (mixture, temperature, funnel, name). */
  settings: FieldChange[];
  unchanged: boolean;
}

type JsonRecord = { [key: string]: JsonValue };

const asRecord = (v: JsonValue | undefined): JsonRecord => (v !== null && typeof v === "object" && !Array.isArray(v) ? v : {});
const asList = (v: JsonValue | undefined): JsonValue[] => (Array.isArray(v) ? v : []);
const same = (a: JsonValue | undefined, b: JsonValue | undefined) => canonical(a) === canonical(b);
const text = (v: JsonValue | undefined, fallback = ""): string => (typeof v === "string" || typeof v === "number" ? String(v) : fallback);

/** JSON with sorted keys, so key order never counts as a change. */
function canonical(v: JsonValue | undefined): string {
  if (v === undefined) return "undefined";
  if (Array.isArray(v)) return `[${v.map(canonical).join(",")}]`;
  if (v !== null && typeof v === "object") return `{${Object.keys(v).sort().map((k) => `${JSON.stringify(k)}:${canonical(v[k])}`).join(",")}}`;
  return JSON.stringify(v);
}

/** Top-level field differences of two objects (nested values compared whole, reported under their top-level name). */
export function fieldChanges(a: JsonRecord, b: JsonRecord, ignore: readonly string[] = []): FieldChange[] {
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].filter((k) => !ignore.includes(k)).sort();
  return keys.filter((k) => !same(a[k], b[k])).map((k) => ({ field: k, from: a[k] ?? null, to: b[k] ?? null }));
}

function componentDiff(a: JsonValue[], b: JsonValue[], linksA: Map<string, string | null>, linksB: Map<string, string | null>) {
  const byKey = (list: JsonValue[]) => new Map(list.map((c) => [text(asRecord(c)["key"]), asRecord(c)]));
  const before = byKey(a);
  const after = byKey(b);
  const name = (c: JsonRecord) => text(c["name"]);
  const added = [...after].filter(([k]) => !before.has(k)).map(([key, c]) => ({ key, name: name(c) }));
  const removed = [...before].filter(([k]) => !after.has(k)).map(([key, c]) => ({ key, name: name(c) }));
  const changed: ComponentChange[] = [];
  for (const [key, old] of before) {
    const next = after.get(key);
    if (!next) continue;
    const changes = fieldChanges(old, next);
    const linkFrom = linksA.get(key) ?? null;
    const linkTo = linksB.get(key) ?? null;
    if (linkFrom !== linkTo) changes.push({ field: "compoundId", from: linkFrom, to: linkTo });
    if (changes.length > 0) changed.push({ key, name: name(next), changes });
  }
  return { added, removed, changed };
}

/** Longest common subsequence of identical operations; returns matched index pairs in order. */
function matchOperations(a: string[], b: string[]): [number, number][] {
  const n = a.length;
  const m = b.length;
  const table = Array.from({ length: n + 1 }, () => new Array<number>(m + 1).fill(0));
  for (let i = n - 1; i >= 0; i--) {
    for (let j = m - 1; j >= 0; j--) {
      table[i]![j] = a[i] === b[j] ? table[i + 1]![j + 1]! + 1 : Math.max(table[i + 1]![j]!, table[i]![j + 1]!);
    }
  }
  const pairs: [number, number][] = [];
  let i = 0;
  let j = 0;
  while (i < n && j < m) {
    if (a[i] === b[j]) pairs.push([i++, j++]);
    else if (table[i + 1]![j]! >= table[i]![j + 1]!) i++;
    else j++;
  }
  return pairs;
}

const hasOwnId = (op: JsonValue) => typeof asRecord(op)["id"] === "string";

/** Steps matched by their ids (the older version's id-less steps by position, as the editor named them on load). */
function operationDiffById(a: JsonValue[], b: JsonValue[]): VersionDiff["operations"] {
  const older = withStepIds(a);
  const newer = withStepIds(b);
  const describe = (op: JsonRecord, index: number) => ({ step: index + 1, type: text(op["type"], "?"), label: typeof op["label"] === "string" ? op["label"] : null });
  const index = new Map(older.map((op, i) => [op["id"] as string, i]));
  const matched = new Set<number>();
  const added: VersionDiff["operations"]["added"] = [];
  const changed: OperationChange[] = [];
  newer.forEach((op, ni) => {
    const oi = index.get(op["id"] as string);
    if (oi === undefined) return added.push(describe(op, ni));
    matched.add(oi);
    const changes = fieldChanges(older[oi]!, op, ["id"]);
    if (changes.length > 0) changed.push({ fromStep: oi + 1, toStep: ni + 1, type: describe(op, ni).type, changes });
  });
  const removed = older.flatMap((op, i) => (matched.has(i) ? [] : [describe(op, i)]));
  return { added, removed, changed };
}

function operationDiff(a: JsonValue[], b: JsonValue[]): VersionDiff["operations"] {
  if (b.length > 0 && b.every(hasOwnId)) return operationDiffById(a, b);
  const pairs = matchOperations(a.map(canonical), b.map(canonical));
  const describe = (op: JsonValue | undefined, index: number) => {
    const r = asRecord(op);
    return { step: index + 1, type: text(r["type"], "?"), label: typeof r["label"] === "string" ? r["label"] : null };
  };
  const added: VersionDiff["operations"]["added"] = [];
  const removed: VersionDiff["operations"]["removed"] = [];
  const changed: OperationChange[] = [];
  // Between two matched anchors, pair leftover steps of the same type as "changed", the rest as removed/added.
  const anchors: [number, number][] = [[-1, -1], ...pairs, [a.length, b.length]];
  for (let k = 0; k + 1 < anchors.length; k++) {
    const [ai, bi] = anchors[k]!;
    const [an, bn] = anchors[k + 1]!;
    const olds = Array.from({ length: an - ai - 1 }, (_, x) => ai + 1 + x);
    const news = Array.from({ length: bn - bi - 1 }, (_, x) => bi + 1 + x);
    while (olds.length > 0 && news.length > 0 && describe(a[olds[0]!], 0).type === describe(b[news[0]!], 0).type) {
      const oi = olds.shift()!;
      const ni = news.shift()!;
      changed.push({ fromStep: oi + 1, toStep: ni + 1, type: describe(b[ni], ni).type, changes: fieldChanges(asRecord(a[oi]), asRecord(b[ni])) });
    }
    removed.push(...olds.map((i) => describe(a[i], i)));
    added.push(...news.map((i) => describe(b[i], i)));
  }
  return { added, removed, changed };
}

export function diffSnapshots(older: WorkupSnapshot, newer: WorkupSnapshot): VersionDiff {
  // A version saved before the notebook address existed had none: the same as a blank one.
  const headerOf = (s: WorkupSnapshot) => ({ notebookUrl: "", ...s.header }) as unknown as JsonRecord;
  const header = fieldChanges(headerOf(older), headerOf(newer));
  const links = (s: WorkupSnapshot) => new Map((s.links ?? []).map((l) => [l.key, l.compoundId]));
  const components = componentDiff(asList(older.spec["components"]), asList(newer.spec["components"]), links(older), links(newer));
  const operations = operationDiff(asList(older.spec["operations"]), asList(newer.spec["operations"]));
  const settings = fieldChanges(older.spec, newer.spec, ["components", "operations"]);
  const unchanged =
    header.length + settings.length + components.added.length + components.removed.length + components.changed.length +
      operations.added.length + operations.removed.length + operations.changed.length === 0;
  return { header, components, operations, settings, unchanged };
}

