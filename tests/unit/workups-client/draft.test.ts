// Unsaved edits survive a reload: they are kept per workup in the browser's storage (a Map-backed stand-in here),
// read back whole or not at all, and removed when saved or discarded.
import { describe, expect, it } from "vitest";
import type { WorkupSnapshot } from "@/lib/workups/record";
import { clearDraft, loadDraft, saveDraft, type Draft, type DraftStorage } from "@/lib/workups-client/draft";

function memoryStorage(): DraftStorage & { data: Map<string, string> } {
  const data = new Map<string, string>();
  return { data, getItem: (k) => data.get(k) ?? null, setItem: (k, v) => { data.set(k, v); }, removeItem: (k) => { data.delete(k); } };
}

const snap: WorkupSnapshot = {
  header: { title: "Wash", performedOn: "2026-11-02", chemistId: null, notebookRef: "", scaleMmol: null, expectedProductMmol: null, assayedProductMmol: null },
  spec: { operations: [{ id: "s1", type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" } }] },
  links: [],
};
const draft: Draft = { workupId: "cw1", baseVersion: 3, base: snap, mine: { ...snap, header: { ...snap.header, title: "Wash twice" } }, savedAt: "2026-12-03T09:00:00.000Z" };

describe("drafts of unsaved edits", () => {
  it("keeps the form, its base version and the base snapshot per workup", () => {
    const storage = memoryStorage();
    saveDraft(storage, draft);
    expect(loadDraft(storage, "cw1")).toEqual(draft);
    expect(loadDraft(storage, "cw2")).toBeNull();
    clearDraft(storage, "cw1");
    expect(loadDraft(storage, "cw1")).toBeNull();
  });

  it("ignores a damaged or foreign entry instead of restoring part of it", () => {
    const storage = memoryStorage();
    storage.setItem("layerwise:draft:cw1", "{not json");
    expect(loadDraft(storage, "cw1")).toBeNull();
    storage.setItem("layerwise:draft:cw1", JSON.stringify({ ...draft, workupId: "other" }));
    expect(loadDraft(storage, "cw1")).toBeNull();
    storage.setItem("layerwise:draft:cw1", JSON.stringify({ ...draft, mine: { header: {} } }));
    expect(loadDraft(storage, "cw1")).toBeNull();
  });

  it("survives a storage that refuses to write (full or disabled)", () => {
    const refusing: DraftStorage = { getItem: () => { throw new Error("denied"); }, setItem: () => { throw new Error("quota"); }, removeItem: () => { throw new Error("denied"); } };
    expect(() => saveDraft(refusing, draft)).not.toThrow();
    expect(loadDraft(refusing, "cw1")).toBeNull();
    expect(() => clearDraft(refusing, "cw1")).not.toThrow();
  });
});
