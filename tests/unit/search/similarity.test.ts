/** Exact top-k and threshold similarity: the index must return exactly what a brute-force scan returns. */
import { describe, expect, it } from "vitest";
import { tanimotoFromCounts } from "@/lib/chem/structure/fingerprint";
import { bruteForceSimilar, CompoundSearchIndex, type ReferenceEntry } from "@/lib/search";
import { minimumCommon } from "@/lib/search/similarity-partition";
import { randomFingerprint, randomId, seeded } from "./random-fingerprints";

interface Row extends ReferenceEntry {
  groupId: string;
}

function build(rows: Row[]): CompoundSearchIndex<{ label: string }> {
  const index = new CompoundSearchIndex<{ label: string }>();
  for (const r of rows) index.upsert({ id: r.id, groupId: r.groupId, morganFingerprint: r.fingerprint }, { label: `compound ${r.id}` });
  return index;
}

function expectSame(index: CompoundSearchIndex<{ label: string }>, rows: Row[], groupId: string, query: Uint8Array, k: number, threshold: number) {
  const expected = bruteForceSimilar(rows.filter((r) => r.groupId === groupId), query, k, threshold);
  const got = index.similar(groupId, query, { k, threshold });
  expect(got.map((h) => [h.id, h.score])).toEqual(expected.map((h) => [h.id, h.score]));
  for (const h of got) expect(h.meta?.label).toBe(`compound ${h.id}`);
}

/** 3000 fingerprints in two groups; a fifth are copies of others so equal scores (ties) are common. */
function dataset(seed: number): { rows: Row[]; random: () => number } {
  const random = seeded(seed);
  const rows: Row[] = [];
  for (let i = 0; i < 3000; i++) {
    const copyOf = i > 100 && random() < 0.2 ? rows[Math.floor(random() * rows.length)] : undefined;
    const fingerprint = copyOf ? copyOf.fingerprint.slice() : randomFingerprint(random, 8 + Math.floor(random() * 120), random() < 0.5 ? 2048 : 400);
    rows.push({ id: randomId(random), groupId: random() < 0.8 ? "alpha" : "beta", fingerprint });
  }
  return { rows, random };
}

describe("similarity search equals a brute-force scan", () => {
  it("for random queries, several k and thresholds, with ties broken by id", () => {
    const { rows, random } = dataset(7);
    const index = build(rows);
    for (let q = 0; q < 24; q++) {
      const query = q % 3 === 0 ? (rows[Math.floor(random() * rows.length)]?.fingerprint ?? new Uint8Array(256)) : randomFingerprint(random, 10 + Math.floor(random() * 100), q % 2 ? 2048 : 400);
      for (const k of [1, 10, 57]) for (const threshold of [0, 0.25, 0.6]) expectSame(index, rows, "alpha", query, k, threshold);
      expectSame(index, rows, "beta", query, 10, 0);
      expectSame(index, rows, "alpha", query, Infinity, 0.3);
    }
  }, 60_000);

  it("stays exact after removals, updates and moves between groups", () => {
    const { rows, random } = dataset(11);
    const index = build(rows);
    const live = new Map(rows.map((r) => [r.id, r]));
    for (const r of rows) {
      const dice = random();
      if (dice < 0.3) {
        expect(index.remove(r.id)).toBe(true);
        live.delete(r.id);
      } else if (dice < 0.4) {
        const updated: Row = { ...r, fingerprint: randomFingerprint(random, 40) };
        index.upsert({ id: r.id, groupId: r.groupId, morganFingerprint: updated.fingerprint }, { label: `compound ${r.id}` });
        live.set(r.id, updated);
      } else if (dice < 0.45) {
        const moved: Row = { ...r, groupId: r.groupId === "alpha" ? "beta" : "alpha" };
        index.upsert({ id: r.id, groupId: moved.groupId, morganFingerprint: r.fingerprint }, { label: `compound ${r.id}` });
        live.set(r.id, moved);
      }
    }
    const remaining = [...live.values()];
    expect(index.size).toBe(remaining.length);
    expect(index.groupSize("alpha") + index.groupSize("beta")).toBe(remaining.length);
    for (let q = 0; q < 25; q++) {
      const query = randomFingerprint(random, 20 + Math.floor(random() * 80));
      expectSame(index, remaining, "alpha", query, 10, 0);
      expectSame(index, remaining, "beta", query, 25, 0.1);
    }
  }, 60_000);

  it("never returns another group's compounds", () => {
    const { rows } = dataset(3);
    const index = build(rows);
    const betaIds = new Set(rows.filter((r) => r.groupId === "beta").map((r) => r.id));
    for (const r of rows.slice(0, 50)) for (const hit of index.similar("alpha", r.fingerprint, { k: 20 })) expect(betaIds.has(hit.id)).toBe(false);
    expect(index.similar("no-such-group", rows[0]?.fingerprint ?? new Uint8Array(256))).toEqual([]);
  });

  it("handles an empty query fingerprint and rejects malformed input", () => {
    const index = build(dataset(5).rows);
    const hits = index.similar("alpha", new Uint8Array(256), { k: 5 });
    expect(hits.map((h) => h.score)).toEqual([0, 0, 0, 0, 0]);
    expect(index.similar("alpha", new Uint8Array(256), { threshold: 0.1 })).toEqual([]);
    expect(() => index.similar("alpha", new Uint8Array(100))).toThrow(TypeError);
    expect(() => index.similar("alpha", new Uint8Array(256), { threshold: 1.5 })).toThrow(RangeError);
    expect(() => index.similar("alpha", new Uint8Array(256), { k: 2.5 })).toThrow(RangeError);
    expect(index.similar("alpha", new Uint8Array(256), { k: 0 })).toEqual([]);
    expect(() => index.upsert({ id: "x", groupId: "alpha", morganFingerprint: new Uint8Array(3) })).toThrow(TypeError);
  });

  it("counts a change in the generation, and an identical re-upsert not as a structural change", () => {
    const index = new CompoundSearchIndex();
    const fp = randomFingerprint(seeded(1), 30);
    index.upsert({ id: "a", groupId: "g", morganFingerprint: fp, updatedAt: new Date(1000) });
    const generation = index.generation;
    index.upsert({ id: "a", groupId: "g", morganFingerprint: fp.slice(), updatedAt: new Date(2000) });
    expect(index.generation).toBe(generation);
    expect(index.watermark?.getTime()).toBe(2000);
    index.remove("a");
    expect(index.generation).toBe(generation + 1);
    expect(index.remove("a")).toBe(false);
  });
});

describe("minimumCommon", () => {
  it("is the smallest common-bit count whose Tanimoto reaches the floor", () => {
    const random = seeded(99);
    for (let i = 0; i < 5000; i++) {
      const a = Math.floor(random() * 300);
      const b = Math.floor(random() * 300);
      const floor = random() < 0.2 ? tanimotoFromCounts(Math.floor(random() * (Math.min(a, b) + 1)), a, b) : random();
      const c = minimumCommon(floor, a, b);
      if (c === undefined) {
        expect(tanimotoFromCounts(Math.min(a, b), a, b)).toBeLessThan(floor);
      } else {
        expect(tanimotoFromCounts(c, a, b)).toBeGreaterThanOrEqual(floor);
        if (c > 0) expect(tanimotoFromCounts(c - 1, a, b)).toBeLessThan(floor);
      }
    }
  });
});
