// Three-way merge of a stale save: nothing either person changed may be lost. Worked cases first (the NaHCO₃ wash
// changed by a colleague while the form changed another step is the measured defect), then a property test over
// hundreds of random concurrent edit pairs. Volumes and reagents are ordinary bench values (common practice).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { JsonObject, JsonValue, WorkupSnapshot } from "@/lib/workups/record";
import { mergeSnapshots, pathId, same, valueAt, type Choice, type MergeChange } from "@/lib/workups-client/merge";

const base: WorkupSnapshot = {
  header: { title: "Ester wash", performedOn: "2026-11-02", chemistId: null, notebookRef: "HL-1", scaleMmol: 5, expectedProductMmol: 5, assayedProductMmol: null },
  spec: {
    components: [{ key: "ester", name: "Ester", amount: { value: 5, unit: "mmol" } }, { key: "acid", name: "Acid", amount: { value: 1, unit: "mmol" } }],
    mixture: { solvents: [{ solvent: "etoac", volume: { value: 50, unit: "mL" } }] },
    operations: [
      { id: "s1", type: "wash", reagent: "water", volume: { value: 30, unit: "mL" } },
      { id: "s2", type: "wash", reagent: "sat_nahco3", volume: { value: 35, unit: "mL" }, label: "sat. NaHCO₃ wash" },
      { id: "s3", type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" } },
    ],
  },
  links: [{ key: "ester", compoundId: "c1" }],
};

const clone = (s: WorkupSnapshot): WorkupSnapshot => JSON.parse(JSON.stringify(s)) as WorkupSnapshot;
const ops = (s: WorkupSnapshot) => s.spec.operations as JsonObject[];

describe("merging a stale save", () => {
  it("keeps a colleague's NaHCO₃ volume change (35 → 30 mL) when the form changed another step", () => {
    const theirs = clone(base);
    ops(theirs)[1]!.volume = { value: 30, unit: "mL" };
    const mine = clone(base);
    ops(mine)[2]!.portions = 2;
    const r = mergeSnapshots(base, theirs, mine);
    expect(ops(r.merged)[1]!.volume).toEqual({ value: 30, unit: "mL" });
    expect(ops(r.merged)[2]!.portions).toBe(2);
    expect(r.conflicts).toEqual([]);
    expect(r.theirChanges.map((c) => c.label)).toEqual(["Step 2 (Wash, sat. NaHCO₃ wash): Volume per portion"]);
    expect(r.myChanges.map((c) => c.label)).toEqual(["Step 3 (Wash): Portions"]);
  });

  it("lists the colleague's changes against the version the form was opened from, not against their own version", () => {
    const theirs = clone(base);
    theirs.header.title = "Ester wash, bicarbonate reduced";
    const r = mergeSnapshots(base, theirs, clone(base));
    expect(r.theirChanges).toHaveLength(1);
    expect(r.taken).toHaveLength(1);
    expect(r.merged.header.title).toBe("Ester wash, bicarbonate reduced");
  });

  it("shows a true conflict with both values and lets the user choose either", () => {
    const theirs = clone(base);
    ops(theirs)[1]!.volume = { value: 30, unit: "mL" };
    const mine = clone(base);
    ops(mine)[1]!.volume = { value: 40, unit: "mL" };
    const r = mergeSnapshots(base, theirs, mine);
    expect(r.conflicts).toHaveLength(1);
    const conflict = r.conflicts[0]!;
    expect(conflict).toMatchObject({ label: "Step 2 (Wash, sat. NaHCO₃ wash): Volume per portion", base: { value: 35, unit: "mL" }, mine: { value: 40, unit: "mL" }, theirs: { value: 30, unit: "mL" } });
    expect(ops(r.merged)[1]!.volume).toEqual({ value: 40, unit: "mL" });
    const chosen = mergeSnapshots(base, theirs, mine, { [conflict.id]: "theirs" });
    expect(ops(chosen.merged)[1]!.volume).toEqual({ value: 30, unit: "mL" });
  });

  it("follows steps by id when either side inserts, removes or moves steps", () => {
    const theirs = clone(base);
    ops(theirs).splice(1, 0, { id: "t1", type: "wash", reagent: "hcl_1m", volume: { value: 20, unit: "mL" } });
    ops(theirs)[3]!.volume = { value: 25, unit: "mL" }; // brine, now step 4
    const mine = clone(base);
    ops(mine).splice(0, 1); // water wash removed
    ops(mine).push({ id: "m1", type: "dry", agent: "mgso4" });
    const r = mergeSnapshots(base, theirs, mine);
    expect(ops(r.merged).map((o) => o.id)).toEqual(["t1", "s2", "s3", "m1"]);
    expect(ops(r.merged)[2]!.volume).toEqual({ value: 25, unit: "mL" });
    expect(r.conflicts).toEqual([]);
  });

  it("asks when one side removed a step the other changed", () => {
    const theirs = clone(base);
    ops(theirs)[0]!.volume = { value: 50, unit: "mL" };
    const mine = clone(base);
    ops(mine).splice(0, 1);
    const r = mergeSnapshots(base, theirs, mine);
    expect(r.conflicts.map((c) => c.label)).toEqual(["Step 1 (Wash)"]);
    expect(ops(r.merged).map((o) => o.id)).toEqual(["s2", "s3"]);
    const kept = mergeSnapshots(base, theirs, mine, { [r.conflicts[0]!.id]: "theirs" });
    expect(ops(kept.merged).map((o) => o.id)).toEqual(["s1", "s2", "s3"]);
  });

  it("merges components by key and their compound links field by field", () => {
    const theirs = clone(base);
    theirs.links = [{ key: "ester", compoundId: "c2" }];
    const mine = clone(base);
    (mine.spec.components as JsonObject[])[0]!.name = "Ethyl ester";
    const r = mergeSnapshots(base, theirs, mine);
    expect(r.merged.links).toEqual([{ key: "ester", compoundId: "c2" }]);
    expect((r.merged.spec.components as JsonObject[])[0]!.name).toBe("Ethyl ester");
    expect((r.merged.spec.components as JsonObject[])[0]).not.toHaveProperty("compoundId");
  });

  it("gives steps saved without ids the same position ids on every side", () => {
    const legacy = clone(base);
    for (const op of ops(legacy)) delete op.id;
    const theirs = clone(legacy);
    ops(theirs)[1]!.volume = { value: 30, unit: "mL" };
    const mine = clone(legacy);
    ops(mine)[0]!.volume = { value: 25, unit: "mL" };
    const r = mergeSnapshots(legacy, theirs, mine);
    expect(ops(r.merged).map((o) => (o.volume as JsonObject).value)).toEqual([25, 30, 20]);
  });
});

// --- property test: random concurrent edits on both sides -------------------------------------------------------

type Edit =
  | { kind: "stepField"; at: number; field: "volume" | "reagent" | "portions" | "label"; value: number }
  | { kind: "removeStep"; at: number }
  | { kind: "insertStep"; at: number; reagent: number }
  | { kind: "moveStep"; from: number; to: number }
  | { kind: "header"; field: "title" | "notebookRef" | "scaleMmol"; value: number }
  | { kind: "component"; at: number; field: "name" | "amount"; value: number }
  | { kind: "link"; at: number; value: number }
  | { kind: "setting"; value: number };

const REAGENTS = ["water", "brine", "sat_nahco3", "hcl_1m", "naoh_1m"];
const edit: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ kind: fc.constant("stepField" as const), at: fc.nat(9), field: fc.constantFrom("volume" as const, "reagent" as const, "portions" as const, "label" as const), value: fc.nat(3) }),
  fc.record({ kind: fc.constant("removeStep" as const), at: fc.nat(9) }),
  fc.record({ kind: fc.constant("insertStep" as const), at: fc.nat(9), reagent: fc.nat(4) }),
  fc.record({ kind: fc.constant("moveStep" as const), from: fc.nat(9), to: fc.nat(9) }),
  fc.record({ kind: fc.constant("header" as const), field: fc.constantFrom("title" as const, "notebookRef" as const, "scaleMmol" as const), value: fc.nat(3) }),
  fc.record({ kind: fc.constant("component" as const), at: fc.nat(3), field: fc.constantFrom("name" as const, "amount" as const), value: fc.nat(3) }),
  fc.record({ kind: fc.constant("link" as const), at: fc.nat(3), value: fc.nat(2) }),
  fc.record({ kind: fc.constant("setting" as const), value: fc.nat(2) }),
);

function applyEdits(start: WorkupSnapshot, edits: Edit[], side: string): WorkupSnapshot {
  const s = clone(start);
  const steps = ops(s);
  const components = s.spec.components as JsonObject[];
  let added = 0;
  for (const e of edits) {
    const n = steps.length;
    switch (e.kind) {
      case "stepField": {
        const op = steps[e.at % Math.max(n, 1)];
        if (!op) break;
        const values: Record<typeof e.field, JsonValue> = {
          volume: { value: [10, 20, 30, 35][e.value]!, unit: "mL" }, reagent: REAGENTS[e.value]!, portions: e.value + 1, label: `wash ${e.value}`,
        };
        op[e.field] = values[e.field];
        break;
      }
      case "removeStep": if (n > 0) steps.splice(e.at % n, 1); break;
      case "insertStep": steps.splice(e.at % (n + 1), 0, { id: `${side}${++added}`, type: "wash", reagent: REAGENTS[e.reagent]!, volume: { value: 15, unit: "mL" } }); break;
      case "moveStep": {
        if (n < 2) break;
        const [op] = steps.splice(e.from % n, 1);
        steps.splice(e.to % n, 0, op!);
        break;
      }
      case "header": {
        const h = s.header as unknown as JsonObject;
        h[e.field] = e.field === "scaleMmol" ? e.value + 1 : `${e.field} ${e.value}`;
        break;
      }
      case "component": {
        const c = components[e.at % components.length]!;
        c[e.field] = e.field === "name" ? `name ${e.value}` : { value: e.value + 1, unit: "mmol" };
        break;
      }
      case "link": {
        const key = components[e.at % components.length]!.key as string;
        s.links = s.links.filter((l) => l.key !== key);
        if (e.value > 0) s.links.push({ key, compoundId: `c${e.value}` });
        break;
      }
      case "setting": if (e.value === 0) delete s.spec.funnel; else s.spec.funnel = { value: e.value * 250, unit: "mL" }; break;
    }
  }
  return s;
}

/** Every change of `changes` that is not a conflict is in `merged`; an order change holds for the steps both kept. */
function lost(merged: WorkupSnapshot, changes: MergeChange[], conflictIds: Set<string>): MergeChange[] {
  return changes.filter((c) => {
    if (conflictIds.has(pathId(c.path))) return false;
    const now = valueAt(merged, c.path);
    if (c.path.part === "order") {
      const kept = (c.to as string[]).filter((id) => (now as string[]).includes(id));
      return !same((now as string[]).filter((id) => kept.includes(id)), kept);
    }
    return !same(now, c.to);
  });
}

describe("no accepted change is ever lost (random concurrent edit pairs)", () => {
  it("keeps every non-conflicting change of both sides, and the chosen side of every conflict", () => {
    fc.assert(
      fc.property(fc.array(edit, { maxLength: 6 }), fc.array(edit, { maxLength: 6 }), fc.constantFrom<Choice>("mine", "theirs"), (theirEdits, myEdits, pick) => {
        const theirs = applyEdits(base, theirEdits, "t");
        const mine = applyEdits(base, myEdits, "m");
        const first = mergeSnapshots(base, theirs, mine);
        const choices = Object.fromEntries(first.conflicts.map((c) => [c.id, pick]));
        const r = mergeSnapshots(base, theirs, mine, choices);
        const conflictIds = new Set(r.conflicts.map((c) => c.id));
        expect(lost(r.merged, r.theirChanges, conflictIds)).toEqual([]);
        expect(lost(r.merged, r.myChanges, conflictIds)).toEqual([]);
        for (const c of r.conflicts) {
          if (c.path.part === "order") continue;
          expect(valueAt(r.merged, c.path)).toEqual(pick === "mine" ? c.mine : c.theirs);
        }
        // Steps added on either side are all there, and no step id appears twice.
        const ids = ops(r.merged).map((o) => o.id as string);
        expect(new Set(ids).size).toBe(ids.length);
        for (const side of [theirs, mine]) for (const op of ops(side)) if (/^[tm]\d/.test(op.id as string)) expect(ids).toContain(op.id);
        // Merging with nothing changed on their side gives the form back unchanged.
        expect(mergeSnapshots(base, base, mine).merged.spec.operations).toEqual(mine.spec.operations);
      }),
      { numRuns: 400 },
    );
  });
});
