import { describe, expect, it } from "vitest";
import { COALESCE_MS, MAX_UNDO, record, redo, startHistory, undo } from "@/lib/workups-client/undo-history";

describe("undo history", () => {
  it("merges quick edits of one field into one undo step", () => {
    let h = startHistory("");
    h = record(h, "2", "volume", 1000);
    h = record(h, "25", "volume", 1000 + COALESCE_MS / 2);
    expect(undo(h).present).toBe("");
  });

  it("keeps edits of different fields, or far apart in time, as separate steps", () => {
    let h = startHistory("a");
    h = record(h, "b", "title", 0);
    h = record(h, "c", "notebook", 10);
    h = record(h, "d", "notebook", 10 + COALESCE_MS + 1);
    expect(undo(h).present).toBe("c");
    expect(undo(undo(h)).present).toBe("b");
    expect(undo(undo(undo(h))).present).toBe("a");
  });

  it("never merges structural edits (key null) and redoes what was undone", () => {
    let h = startHistory(0);
    h = record(h, 1, null, 0);
    h = record(h, 2, null, 1);
    const back = undo(h);
    expect(back.present).toBe(1);
    expect(redo(back).present).toBe(2);
    expect(record(back, 5, null, 2).future).toEqual([]);
  });

  it("forgets the oldest edits beyond the limit and does nothing with nothing to undo", () => {
    let h = startHistory(0);
    for (let i = 1; i <= MAX_UNDO + 10; i++) h = record(h, i, null, i);
    expect(h.past).toHaveLength(MAX_UNDO);
    const s = startHistory("x");
    expect(undo(s)).toBe(s);
    expect(redo(s)).toBe(s);
  });
});
