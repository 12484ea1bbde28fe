/**
 * Three-way merge for a save refused as stale. `base` is the version the form was opened from, `theirs` the version
 * saved meanwhile, `mine` the form. Header fields and spec settings merge one by one; components (by key) and steps
 * (by their saved id, lib/workups/step-ids.ts) merge item by item and field by field, so two people editing
 * different steps, or different fields of one step, both keep their change. Only the same field changed two
 * different ways is a conflict; it is listed with both values, and `choices` decides it (the form's value until
 * the user picks). A step whose type changed on one side merges as a whole (its fields belong to the type).
 * Pure; browser-safe.
 */
import { type JsonObject, type JsonValue, type SnapshotHeader, type WorkupSnapshot } from "@/lib/workups/record";
import { withStepIds } from "@/lib/workups/step-ids";
import { COMMON_OPERATION_FIELDS, listOperationTypes } from "@/lib/chem/operation-types";
import { fieldWords, stepTypeWords } from "./field-words";

/** Operation types and their fields as the editor names them ("Adjust pH", "Volume per portion"), never the keys. */
const STEP_TYPES = new Map(listOperationTypes().map((t) => [t.type as string, t]));

function stepFieldWords(type: unknown, field: string): string {
  const meta = typeof type === "string" ? STEP_TYPES.get(type) : undefined;
  const own = [...(meta?.fields ?? []), ...COMMON_OPERATION_FIELDS].find((f) => f.name === field);
  return own?.label ?? fieldWords(field);
}

/** Where a change or conflict is. `field: null` on an item means the item as a whole (added, removed, retyped). */
export type MergePath =
  | { part: "header"; field: string }
  | { part: "setting"; field: string }
  | { part: "component"; key: string; field: string | null }
  | { part: "step"; id: string; field: string | null }
  | { part: "order"; list: "components" | "steps" };

/** A value at a path; `undefined` means absent (a removed item, an unset field). */
export type Slot = JsonValue | undefined;

export interface MergeChange {
  path: MergePath;
  label: string;
  from: Slot;
  to: Slot;
}

export interface MergeConflict {
  /** Stable across re-merges: the key of `choices`. */
  id: string;
  path: MergePath;
  label: string;
  base: Slot;
  mine: Slot;
  theirs: Slot;
}

export type Choice = "mine" | "theirs";

export interface MergeResult {
  merged: WorkupSnapshot;
  /** Every real change the other person made since the base version. */
  theirChanges: MergeChange[];
  /** Every real change in the form since the base version. */
  myChanges: MergeChange[];
  /** Their changes now in the form (the form had left those places alone). */
  taken: MergeChange[];
  conflicts: MergeConflict[];
}

export function canonical(v: Slot): string {
  if (v === undefined) return "undefined";
  if (Array.isArray(v)) return `[${v.map(canonical).join(",")}]`;
  if (v !== null && typeof v === "object") return `{${Object.keys(v).sort().map((k) => `${JSON.stringify(k)}:${canonical(v[k])}`).join(",")}}`;
  return JSON.stringify(v);
}

export const same = (a: Slot, b: Slot) => canonical(a) === canonical(b);

export function pathId(path: MergePath): string {
  switch (path.part) {
    case "header": case "setting": return `${path.part}:${path.field}`;
    case "component": return `component:${path.key}:${path.field ?? "*"}`;
    case "step": return `step:${path.id}:${path.field ?? "*"}`;
    case "order": return `order:${path.list}`;
  }
}

const asRecord = (v: Slot): JsonObject => (v !== null && v !== undefined && typeof v === "object" && !Array.isArray(v) ? v : {});
const asList = (v: Slot): JsonValue[] => (Array.isArray(v) ? v : []);

/** One list item: its key, its fields (component links travel as the pseudo-field `compoundId`). */
type Item = JsonObject;
type Items = Map<string, Item>;

function componentItems(s: WorkupSnapshot): { order: string[]; items: Items } {
  const links = new Map((s.links ?? []).map((l) => [l.key, l.compoundId]));
  const items: Items = new Map();
  for (const c of asList(s.spec["components"])) {
    const record = asRecord(c);
    const key = typeof record["key"] === "string" ? record["key"] : "";
    if (!items.has(key)) items.set(key, { ...record, compoundId: links.get(key) ?? null });
  }
  return { order: [...items.keys()], items };
}

function stepItems(s: WorkupSnapshot): { order: string[]; items: Items } {
  const items: Items = new Map();
  for (const op of withStepIds(s.spec["operations"])) items.set(op["id"] as string, op);
  return { order: [...items.keys()], items };
}

interface Side {
  base: Slot;
  theirs: Slot;
  mine: Slot;
}

class Merger {
  readonly theirChanges: MergeChange[] = [];
  readonly myChanges: MergeChange[] = [];
  readonly taken: MergeChange[] = [];
  readonly conflicts: MergeConflict[] = [];
  constructor(private readonly choices: Readonly<Record<string, Choice>>) {}

  /** The merged value of one place, recording both sides' changes and any conflict. */
  pick(path: MergePath, label: string, { base, theirs, mine }: Side): Slot {
    const theirsChanged = !same(theirs, base);
    const mineChanged = !same(mine, base);
    if (theirsChanged) this.theirChanges.push({ path, label, from: base, to: theirs });
    if (mineChanged) this.myChanges.push({ path, label, from: base, to: mine });
    if (!theirsChanged || same(theirs, mine)) return mine;
    if (!mineChanged) {
      this.taken.push({ path, label, from: base, to: theirs });
      return theirs;
    }
    const id = pathId(path);
    this.conflicts.push({ id, path, label, base, mine, theirs });
    return this.choices[id] === "theirs" ? theirs : mine;
  }

  /** Field by field over the union of the three objects' keys (`skip`: fields merged elsewhere). */
  fields(make: (field: string) => MergePath, label: (field: string) => string, b: JsonObject, t: JsonObject, m: JsonObject, skip: readonly string[] = []): JsonObject {
    const out: JsonObject = {};
    const keys = [...new Set([...Object.keys(m), ...Object.keys(t), ...Object.keys(b)])].filter((k) => !skip.includes(k));
    for (const k of keys) {
      const v = this.pick(make(k), label(k), { base: b[k], theirs: t[k], mine: m[k] });
      if (v !== undefined) out[k] = v;
    }
    return out;
  }

  /** Items of a keyed list: presence first, then field by field. Returns the merged items (order settled later). */
  items(kind: "component" | "step", b: Items, t: Items, m: Items, label: (key: string, field: string | null) => string): Items {
    const out: Items = new Map();
    const keys = [...new Set([...m.keys(), ...t.keys(), ...b.keys()])];
    const path = (key: string, field: string | null): MergePath => (kind === "component" ? { part: "component", key, field } : { part: "step", id: key, field });
    for (const key of keys) {
      const [bi, ti, mi] = [b.get(key), t.get(key), m.get(key)];
      // Present on every side with the same type: field by field. Otherwise the item merges as a whole.
      const retyped = kind === "step" && bi && ti && mi && !(same(bi["type"], ti["type"]) && same(bi["type"], mi["type"]));
      if (ti && mi && (bi || !same(ti, mi)) && !retyped) {
        const merged = this.fields((f) => path(key, f), (f) => label(key, f), bi ?? {}, ti, mi, kind === "step" ? ["id"] : ["key"]);
        out.set(key, kind === "step" ? { ...merged, id: key } : { ...merged, key });
        continue;
      }
      const whole = this.pick(path(key, null), label(key, null), { base: bi, theirs: ti, mine: mi });
      if (whole !== undefined) out.set(key, asRecord(whole));
    }
    return out;
  }

  /** The order of a merged list: the side that reordered wins; both reordered differently is a conflict. */
  order(list: "components" | "steps", b: string[], t: string[], m: string[], kept: Items): string[] {
    const common = b.filter((k) => t.includes(k) && m.includes(k));
    const seq = (xs: string[]) => xs.filter((k) => common.includes(k));
    const chosen = this.pick({ part: "order", list }, list === "steps" ? "order of the steps" : "order of the components", {
      base: seq(b), theirs: seq(t), mine: seq(m),
    });
    const primary = same(chosen, seq(t)) && !same(chosen, seq(m)) ? t : m;
    const secondary = primary === t ? m : t;
    const result = primary.filter((k) => kept.has(k));
    // Items only the other side (or the base, restored by a choice) has: after their nearest kept predecessor there.
    for (const source of [secondary, b]) {
      source.forEach((k, i) => {
        if (!kept.has(k) || result.includes(k)) return;
        const before = source.slice(0, i).reverse().find((p) => result.includes(p));
        result.splice(before === undefined ? 0 : result.indexOf(before) + 1, 0, k);
      });
    }
    return result;
  }
}

const describeStep = (op: Item | undefined, position: number): string => {
  const type = typeof op?.["type"] === "string" ? stepTypeWords(op["type"]) : "step";
  const label = typeof op?.["label"] === "string" && op["label"].trim() ? `, ${op["label"].trim()}` : "";
  return `Step ${position} (${type}${label})`;
};

export function mergeSnapshots(base: WorkupSnapshot, theirs: WorkupSnapshot, mine: WorkupSnapshot, choices: Readonly<Record<string, Choice>> = {}): MergeResult {
  const merger = new Merger(choices);
  const header = merger.fields(
    (field) => ({ part: "header", field }), fieldWords,
    base.header as unknown as JsonObject, theirs.header as unknown as JsonObject, mine.header as unknown as JsonObject,
  );

  const settings = merger.fields((field) => ({ part: "setting", field }), fieldWords, base.spec, theirs.spec, mine.spec, ["components", "operations"]);

  const [bc, tc, mc] = [componentItems(base), componentItems(theirs), componentItems(mine)];
  const componentName = (key: string) => {
    const c = mc.items.get(key) ?? tc.items.get(key) ?? bc.items.get(key);
    return typeof c?.["name"] === "string" && c["name"] ? c["name"] : key;
  };
  const components = merger.items("component", bc.items, tc.items, mc.items, (key, field) => `Component ${componentName(key)}${field ? `: ${fieldWords(field)}` : ""}`);
  const componentOrder = merger.order("components", bc.order, tc.order, mc.order, components);

  const [bs, ts, ms] = [stepItems(base), stepItems(theirs), stepItems(mine)];
  const stepName = (id: string) => {
    for (const side of [ms, ts, bs]) {
      const i = side.order.indexOf(id);
      if (i >= 0) return describeStep(side.items.get(id), i + 1);
    }
    return id;
  };
  const stepType = (id: string) => (ms.items.get(id) ?? ts.items.get(id) ?? bs.items.get(id))?.["type"];
  const steps = merger.items("step", bs.items, ts.items, ms.items, (id, field) => `${stepName(id)}${field ? `: ${stepFieldWords(stepType(id), field)}` : ""}`);
  const stepOrder = merger.order("steps", bs.order, ts.order, ms.order, steps);

  const spec: JsonObject = { ...settings };
  const mergedComponents = componentOrder.map((k) => components.get(k)).filter((c): c is Item => c !== undefined);
  spec["components"] = mergedComponents.map(({ compoundId: _link, ...c }) => c);
  spec["operations"] = stepOrder.map((id) => steps.get(id)).filter((s): s is Item => s !== undefined);
  const links = mergedComponents
    .filter((c) => typeof c["compoundId"] === "string")
    .map((c) => ({ key: c["key"] as string, compoundId: c["compoundId"] as string }));
  return {
    merged: { header: header as unknown as SnapshotHeader, spec, links },
    theirChanges: merger.theirChanges,
    myChanges: merger.myChanges,
    taken: merger.taken,
    conflicts: merger.conflicts,
  };
}

/** The merged form's value at a path (for tests and the conflict view). */
export function valueAt(s: WorkupSnapshot, path: MergePath): Slot {
  switch (path.part) {
    case "header": return (s.header as unknown as JsonObject)[path.field];
    case "setting": return s.spec[path.field];
    case "component": {
      const item = componentItems(s).items.get(path.key);
      return path.field === null ? item : item?.[path.field];
    }
    case "step": {
      const item = stepItems(s).items.get(path.id);
      return path.field === null ? item : item?.[path.field];
    }
    case "order": return path.list === "steps" ? stepItems(s).order : componentItems(s).order;
  }
}
