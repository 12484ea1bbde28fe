import { describe, expect, it } from "vitest";
import type { WorkupSnapshot } from "@/lib/workups/record";
import { mergeSnapshots } from "@/lib/workups-client/merge";

const base: WorkupSnapshot = {
  header: { title: "Ester wash", performedOn: "2026-11-02", chemistId: null, notebookRef: "HL-1", scaleMmol: 5, expectedProductMmol: 5, assayedProductMmol: null },
  spec: {
    components: [{ key: "ester", name: "Ester", amount: { value: 5, unit: "mmol" } }],
    mixture: { solvents: [{ solvent: "etoac", volume: { value: 50, unit: "mL" } }] },
    operations: [{ type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" } }],
  },
  links: [{ key: "ester", compoundId: "c1" }],
};

const withHeader = (s: WorkupSnapshot, patch: Partial<WorkupSnapshot["header"]>): WorkupSnapshot => ({ ...s, header: { ...s.header, ...patch } });

describe("merging a stale save", () => {
  it("takes their change where the form left the field alone, and keeps the form's own edits", () => {
    const theirs = withHeader(base, { title: "Ester wash, brine only" });
    const mine = withHeader(base, { notebookRef: "HL-2" });
    const r = mergeSnapshots(base, theirs, mine);
    expect(r.merged.header.title).toBe("Ester wash, brine only");
    expect(r.merged.header.notebookRef).toBe("HL-2");
    expect(r.taken).toEqual(["title"]);
    expect(r.both).toEqual([]);
  });

  it("keeps the form's value where both changed the same field, and says so", () => {
    const r = mergeSnapshots(base, withHeader(base, { scaleMmol: 6 }), withHeader(base, { scaleMmol: 7 }));
    expect(r.merged.header.scaleMmol).toBe(7);
    expect(r.both).toEqual(["scaleMmol"]);
  });

  it("takes their steps whole when the form did not touch the steps; components travel with their links", () => {
    const theirs: WorkupSnapshot = {
      ...base,
      spec: { ...base.spec, operations: [...(base.spec.operations as never[]), { type: "dry", agent: "mgso4" }], components: [{ key: "ester", name: "Ethyl ester", amount: { value: 5, unit: "mmol" } }] },
      links: [{ key: "ester", compoundId: "c2" }],
    };
    const mine: WorkupSnapshot = { ...base, spec: { ...base.spec, funnel: { value: 250, unit: "mL" } } };
    const r = mergeSnapshots(base, theirs, mine);
    expect(r.merged.spec.operations).toEqual(theirs.spec.operations);
    expect(r.merged.spec.funnel).toEqual({ value: 250, unit: "mL" });
    expect(r.merged.links).toEqual([{ key: "ester", compoundId: "c2" }]);
    expect(r.taken.sort()).toEqual(["components", "operations"]);
  });

  it("counts the same change made on both sides as no conflict, and a part only they removed as taken", () => {
    const theirs: WorkupSnapshot = withHeader({ ...base, spec: { components: base.spec.components!, operations: base.spec.operations! } }, { title: "Same" });
    const r = mergeSnapshots(base, theirs, withHeader(base, { title: "Same" }));
    expect(r.both).toEqual([]);
    expect(r.taken).toEqual(["mixture"]);
    expect("mixture" in r.merged.spec).toBe(false);
  });
});
