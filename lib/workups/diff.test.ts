import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { diffSnapshots } from "./diff";
import { type JsonObject, type WorkupSnapshot } from "./record";

const example = JSON.parse(fs.readFileSync(path.resolve("examples/acid-base-separation.json"), "utf8")) as JsonObject;

function snapshot(spec: JsonObject = structuredClone(example)): WorkupSnapshot {
  return {
    header: { title: "Benzanilide", performedOn: "2026-11-03", chemistId: null, notebookRef: "AB-12/041", scaleMmol: 5, expectedProductMmol: 5, assayedProductMmol: null },
    spec,
    links: [{ key: "aniline", compoundId: "c-aniline" }],
  };
}

type Ops = JsonObject[];
const opsOf = (s: WorkupSnapshot) => s.spec["operations"] as Ops;

describe("version diff", () => {
  it("finds nothing between equal versions, whatever the key order", () => {
    const a = snapshot();
    const reversed = (v: unknown): unknown =>
      Array.isArray(v) ? v.map(reversed)
        : v !== null && typeof v === "object" ? Object.fromEntries(Object.entries(v).reverse().map(([k, x]) => [k, reversed(x)]))
          : v;
    const b = snapshot(reversed(example) as JsonObject);
    expect(Object.keys(b.spec)).toEqual(Object.keys(example).reverse());
    expect(diffSnapshots(a, b).unchanged).toBe(true);
  });

  it("reports header fields with their old and new values", () => {
    const b = snapshot();
    b.header.title = "Benzanilide, second run";
    b.header.assayedProductMmol = 4.6;
    expect(diffSnapshots(snapshot(), b).header).toEqual([
      { field: "assayedProductMmol", from: null, to: 4.6 },
      { field: "title", from: "Benzanilide", to: "Benzanilide, second run" },
    ]);
  });

  it("shows an inserted step as one addition, not as every later step changed", () => {
    const b = snapshot();
    opsOf(b).splice(1, 0, { type: "wash", reagent: "water", volume: { value: 20, unit: "mL" }, portions: 1, label: "water" });
    const d = diffSnapshots(snapshot(), b).operations;
    expect(d.added).toEqual([{ step: 2, type: "wash", label: "water" }]);
    expect(d.removed).toEqual([]);
    expect(d.changed).toEqual([]);
  });

  it("pairs a changed step with its old self and names the changed parameters", () => {
    const b = snapshot();
    opsOf(b)[2] = { ...opsOf(b)[2]!, portions: 2 };
    opsOf(b).splice(0, 1);
    const d = diffSnapshots(snapshot(), b).operations;
    expect(d.removed).toEqual([{ step: 1, type: "wash", label: "1 M HCl" }]);
    expect(d.changed).toEqual([{ fromStep: 3, toStep: 2, type: "wash", changes: [{ field: "portions", from: 1, to: 2 }] }]);
    expect(d.added).toEqual([]);
  });

  it("reports components added, removed, changed, and relinked to another compound", () => {
    const b = snapshot();
    const components = b.spec["components"] as JsonObject[];
    components[0] = { ...components[0]!, amount: { value: 4.5, unit: "mmol" } };
    components.splice(3, 1);
    components.push({ key: "dmap", name: "DMAP", role: "catalyst", molarMass: 122.17, amount: { value: 0.1, unit: "mmol" } });
    b.links = [{ key: "aniline", compoundId: "c-aniline-2" }];
    const d = diffSnapshots(snapshot(), b).components;
    expect(d.added).toEqual([{ key: "dmap", name: "DMAP" }]);
    expect(d.removed).toEqual([{ key: "benzoic-acid", name: "Benzoic acid" }]);
    expect(d.changed).toEqual([
      { key: "benzanilide", name: "Benzanilide (N-phenylbenzamide)", changes: [{ field: "amount", from: { value: 5, unit: "mmol" }, to: { value: 4.5, unit: "mmol" } }] },
      { key: "aniline", name: "Aniline", changes: [{ field: "compoundId", from: "c-aniline", to: "c-aniline-2" }] },
    ]);
  });

  it("reports spec settings outside components and operations", () => {
    const b = snapshot();
    b.spec["funnel"] = { value: 500, unit: "mL" };
    expect(diffSnapshots(snapshot(), b).settings).toEqual([{ field: "funnel", from: { value: 250, unit: "mL" }, to: { value: 500, unit: "mL" } }]);
  });

  it("follows steps by their saved ids: a first save that adds ids changes nothing, a moved and edited step is one change", () => {
    const legacy = snapshot();
    const withIds = snapshot();
    opsOf(withIds).forEach((op, i) => { op["id"] = `step-${i + 1}`; });
    expect(diffSnapshots(legacy, withIds).unchanged).toBe(true);
    const moved = snapshot(structuredClone(withIds.spec));
    const [first] = opsOf(moved).splice(0, 1);
    first!["label"] = "moved to the end";
    opsOf(moved).push(first!);
    opsOf(moved).unshift({ id: "new1", type: "dilute", solvent: "etoac", volume: { value: 10, unit: "mL" } });
    const d = diffSnapshots(withIds, moved).operations;
    expect(d.added).toEqual([{ step: 1, type: "dilute", label: null }]);
    expect(d.removed).toEqual([]);
    expect(d.changed).toHaveLength(1);
    expect(d.changed[0]).toMatchObject({ fromStep: 1, toStep: opsOf(moved).length, changes: [{ field: "label", from: opsOf(withIds)[0]!["label"], to: "moved to the end" }] });
  });
});
