import { describe, expect, it } from "vitest";
import { DEFAULT_LIBRARY } from "@/lib/chem/library";
import { addComponent, addOperation, duplicateStep, keyFromName, moveOperation, removeComponent, savedStreamsBefore, setOperationList, setOperationType, setOperationValue, updateComponent } from "@/lib/workups-client/editor-actions";
import { blankComponent } from "@/lib/workups-client/compound-component";
import { emptyEditorState } from "@/lib/workups-client/from-spec";
import { operationInput } from "@/lib/workups-client/to-spec";
import { describeOperation } from "@/lib/workups-client/describe";

const lib = DEFAULT_LIBRARY;
const blank = () => emptyEditorState("2026-11-02", "");

describe("new steps start with the usual bench values (common practice)", () => {
  it("a wash is one 20 mL portion of brine keeping the organic layer", () => {
    const { state } = addOperation(blank(), "wash", lib);
    // The step's id travels with it into the saved spec (merges and the history follow steps by id).
    expect(operationInput(state.operations[0]!)).toEqual({ id: state.operations[0]!.id, type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" }, portions: 1, keep: "organic" });
  });

  it("an extraction uses the organic solvent already in the funnel, three portions", () => {
    let s = blank();
    s = { ...s, mixture: { ...s.mixture, solvents: [{ id: "m1", solvent: "thf", volume: { value: "10", unit: "mL" } }, { id: "m2", solvent: "dcm", volume: { value: "30", unit: "mL" } }] } };
    const { state } = addOperation(s, "extract", lib);
    expect(operationInput(state.operations[0]!)).toMatchObject({ solvent: "dcm", portions: 3 });
    const removal = addOperation(s, "remove_cosolvent", lib).state.operations[0]!;
    expect(removal.values.solvent).toBe("thf");
  });
});

describe("reordering, duplicating, changing type", () => {
  it("moves a step and leaves the ends alone", () => {
    const a = addOperation(blank(), "wash", lib);
    const b = addOperation(a.state, "dry", lib);
    const moved = moveOperation(b.state, b.id, -1);
    expect(moved.operations.map((o) => o.type)).toEqual(["dry", "wash"]);
    expect(moveOperation(moved, b.id, -1)).toBe(moved);
  });

  it("inserts after a given step", () => {
    const a = addOperation(blank(), "wash", lib);
    const b = addOperation(a.state, "concentrate", lib);
    const c = addOperation(b.state, "dry", lib, a.id);
    expect(c.state.operations.map((o) => o.type)).toEqual(["wash", "dry", "concentrate"]);
  });

  it("a duplicate gets a new id and drops the saved-stream name (names must be unique)", () => {
    const a = addOperation(blank(), "wash", lib);
    const named = setOperationValue(a.state, a.id, "saveAs", "first aqueous");
    const d = duplicateStep(named, a.id);
    expect(d.state.operations).toHaveLength(2);
    expect(d.id).not.toBe(a.id);
    expect(d.state.operations[1]?.values.saveAs).toBeUndefined();
    expect(savedStreamsBefore(d.state, d.id)).toEqual(["first aqueous"]);
  });

  it("changing wash to back-extraction keeps reagent and volume but takes the new type's kept layer", () => {
    const a = addOperation(blank(), "wash", lib);
    const s = setOperationValue(a.state, a.id, "reagent", "hcl_1m");
    const changed = setOperationType(s, a.id, "back_extract", lib).operations[0]!;
    expect(changed.id).toBe(a.id);
    expect(operationInput(changed)).toMatchObject({ type: "back_extract", reagent: "hcl_1m", volume: { value: 20, unit: "mL" }, keep: "aqueous" });
  });
});

describe("component keys", () => {
  it("derives a unique key from the name", () => {
    expect(keyFromName("Benzoic acid", new Set())).toBe("benzoic-acid");
    expect(keyFromName("Benzoic acid", new Set(["benzoic-acid"]))).toBe("benzoic-acid-2");
    expect(keyFromName("  ", new Set())).toBe("component");
  });

  it("a new component's key follows its name, and steps naming it follow too", () => {
    let s = addComponent(blank(), blankComponent("byproduct"));
    const id = s.components[0]!.id;
    const f = addOperation(s, "filter", lib);
    s = setOperationList(f.state, f.id, "solidComponents", [s.components[0]!.key]);
    s = updateComponent(s, id, { name: "Triphenylphosphine oxide" });
    expect(s.components[0]?.key).toBe("triphenylphosphine-oxide");
    expect(s.operations[0]?.lists.solidComponents).toEqual(["triphenylphosphine-oxide"]);
    expect(removeComponent(s, id).operations[0]?.lists.solidComponents).toEqual([]);
  });

  it("a loaded component keeps its key when renamed", () => {
    let s = addComponent(blank(), { ...blankComponent("product"), name: "Ester", autoKey: false, key: "ester" });
    s = updateComponent(s, s.components[0]!.id, { name: "Ethyl ester" });
    expect(s.components[0]?.key).toBe("ester");
  });
});

describe("step descriptions", () => {
  it.each([
    [{ type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" }, portions: 2, keep: "organic" }, "Wash: Brine (saturated NaCl), 2 × 20 mL, keep the organic layer"],
    [{ type: "adjust_ph", reagent: "naoh_10pct", targetPh: 12.5 }, "Adjust pH: 10% NaOH, to pH 12.5"],
    [{ type: "dry", agent: "mgso4", rinse: { solvent: "etoac", volume: { value: 10, unit: "mL" } } }, "Dry: Magnesium sulfate, rinse 10 mL Ethyl acetate"],
    [{ type: "wash", reagent: "sat_nahco3", volume: { value: 20, unit: "mL" } }, "Wash: sat_nahco3, 20 mL"],
  ])("%j", (op, expected) => {
    expect(describeOperation(op, lib)).toBe(expected);
  });
});
