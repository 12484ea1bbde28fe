/**
 * Two app instances, each with its own in-memory index, over one shared table of compounds (here an in-memory
 * change feed standing in for `SELECT … WHERE "updatedAt" >= $since`): a compound written through one instance is
 * found by the other's next search, deletions propagate, and a transaction that commits late with an older
 * updatedAt is still picked up inside the overlap window.
 */
import { describe, expect, it } from "vitest";
import { type CompoundChange, type CompoundChangeFeed, CompoundSearchIndex, IndexSync } from "@/lib/search";
import { randomFingerprint, seeded } from "./random-fingerprints";

class SharedTable implements CompoundChangeFeed<{ name: string }> {
  rows: CompoundChange<{ name: string }>[] = [];
  queries = 0;

  write(change: CompoundChange<{ name: string }>): void {
    this.rows = this.rows.filter((r) => r.compound.id !== change.compound.id).concat(change);
  }

  async changedSince(since: Date | undefined): Promise<CompoundChange<{ name: string }>[]> {
    this.queries += 1;
    await Promise.resolve();
    return this.rows.filter((r) => since === undefined || r.compound.updatedAt.getTime() >= since.getTime());
  }
}

const random = seeded(17);
const compound = (id: string, at: number, groupId = "g") => ({ id, groupId, morganFingerprint: randomFingerprint(random, 40), updatedAt: new Date(at) });

function instance(table: SharedTable) {
  return new IndexSync(new CompoundSearchIndex<{ name: string }>(), table, { overlapMs: 5000 });
}

describe("index sync across instances", () => {
  it("finds a compound registered through the other instance on the next search", async () => {
    const table = new SharedTable();
    const a = instance(table);
    const b = instance(table);
    await Promise.all([a.refresh(), b.refresh()]);
    const c = compound("c1", 1_000);
    table.write({ compound: c, meta: { name: "first" } });
    a.index.upsert(c, { name: "first" });
    expect(b.index.similar("g", c.morganFingerprint, { k: 1 })).toEqual([]);
    await b.refresh();
    expect(b.index.similar("g", c.morganFingerprint, { k: 1 }).map((h) => [h.id, h.score, h.meta?.name])).toEqual([["c1", 1, "first"]]);
  });

  it("applies tombstones, updates and moves between groups", async () => {
    const table = new SharedTable();
    const b = instance(table);
    table.write({ compound: compound("x", 1_000) });
    table.write({ compound: compound("y", 1_000) });
    await b.refresh();
    expect(b.index.size).toBe(2);
    const moved = { ...compound("y", 2_000), groupId: "h" };
    table.write({ compound: moved, meta: { name: "moved" } });
    table.write({ compound: compound("x", 2_000), deleted: true });
    await b.refresh();
    expect(b.index.has("x")).toBe(false);
    expect(b.index.groupSize("g")).toBe(0);
    expect(b.index.similar("h", moved.morganFingerprint, { k: 1 })[0]?.meta?.name).toBe("moved");
  });

  it("re-reads an overlap window, so a late commit with an older timestamp is not missed", async () => {
    const table = new SharedTable();
    const b = instance(table);
    table.write({ compound: compound("early", 10_000) });
    await b.refresh();
    // Committed after the refresh above but stamped 3 s earlier (its transaction began first).
    table.write({ compound: compound("late", 7_000) });
    // Older than the window (6 s before the watermark): a consistency gap the overlap cannot cover.
    table.write({ compound: compound("too-late", 3_000) });
    await b.refresh();
    expect(b.index.has("late")).toBe(true);
    expect(b.index.has("too-late")).toBe(false);
  });

  it("shares one database round trip between concurrent searches", async () => {
    const table = new SharedTable();
    const b = instance(table);
    await Promise.all([b.refresh(), b.refresh(), b.refresh()]);
    expect(table.queries).toBe(1);
  });

  it("drops rows deleted without a tombstone when the group is reconciled", async () => {
    const table = new SharedTable();
    const b = instance(table);
    ["p", "q", "r"].forEach((id) => table.write({ compound: compound(id, 1_000) }));
    await b.refresh();
    table.rows = table.rows.filter((r) => r.compound.id !== "q");
    expect(b.reconcileGroup("g", table.rows.map((r) => r.compound.id))).toBe(1);
    expect(b.index.has("q")).toBe(false);
    expect(b.index.size).toBe(2);
  });
});
