/**
 * One group's screening fingerprints in id order: leaves of up to 64 entries, each leaf one memory chunk, leaves sorted
 * by their first id (the leaf level of a B+-tree). Keeping id order lets a substructure search with a limit screen
 * and match from the start and stop after `limit` hits, and the same query returns the same page on every instance.
 */
import { type IndexEntry } from "./entry";
import { CHUNK_ENTRIES, type FingerprintMemory, LIST_ADDRESS, MAX_LIST_CHUNKS, OUT_ADDRESS, QUERY_ADDRESS } from "./fingerprint-memory";

interface Leaf<Meta> {
  chunk: number;
  entries: IndexEntry<Meta>[];
}

export interface ScreenVisit<Meta> {
  /** Return false to stop the scan. */
  (entry: IndexEntry<Meta>): boolean;
}

export class ScreenPartition<Meta> {
  private readonly leaves: Leaf<Meta>[] = [];
  private count = 0;

  constructor(private readonly memory: FingerprintMemory) {}

  get size(): number {
    return this.count;
  }

  /** Index of the leaf that holds, or would hold, `id`. */
  private leafFor(id: string): number {
    let lo = 0;
    let hi = this.leaves.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      const first = this.leaves[mid]?.entries[0]?.id ?? "";
      if (first <= id) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }

  add(entry: IndexEntry<Meta>, fingerprint: Uint8Array): void {
    if (this.leaves.length === 0) this.leaves.push({ chunk: this.memory.allocChunk(), entries: [] });
    let index = this.leafFor(entry.id);
    let leaf = this.leaves[index] as Leaf<Meta>;
    let slot = lowerBound(leaf.entries, entry.id);
    if (leaf.entries.length === CHUNK_ENTRIES) {
      const appending = index === this.leaves.length - 1 && slot === CHUNK_ENTRIES;
      const next: Leaf<Meta> = { chunk: this.memory.allocChunk(), entries: [] };
      if (!appending) {
        // Split in half; appends (ids arriving in order) start a fresh leaf instead, so bulk loads stay dense.
        const half = CHUNK_ENTRIES / 2;
        this.memory.move(leaf.chunk, half, next.chunk, 0, CHUNK_ENTRIES - half);
        next.entries = leaf.entries.splice(half);
      }
      this.leaves.splice(index + 1, 0, next);
      if (slot > leaf.entries.length || appending) {
        slot -= leaf.entries.length;
        index += 1;
        leaf = next;
      }
    }
    if (slot < leaf.entries.length) this.memory.move(leaf.chunk, slot, leaf.chunk, slot + 1, leaf.entries.length - slot);
    this.memory.write(leaf.chunk, slot, fingerprint);
    leaf.entries.splice(slot, 0, entry);
    this.count += 1;
  }

  remove(entry: IndexEntry<Meta>): void {
    const index = this.leafFor(entry.id);
    const leaf = this.leaves[index];
    if (!leaf) return;
    const slot = lowerBound(leaf.entries, entry.id);
    if (leaf.entries[slot] !== entry) return;
    const after = leaf.entries.length - slot - 1;
    if (after > 0) this.memory.move(leaf.chunk, slot + 1, leaf.chunk, slot, after);
    leaf.entries.splice(slot, 1);
    this.count -= 1;
    if (leaf.entries.length === 0) {
      this.memory.freeChunk(leaf.chunk);
      this.leaves.splice(index, 1);
    }
  }

  /**
   * Visits, in id order, every entry whose screening fingerprint contains all bits of `query`. Screens `batch` leaves
   * per kernel call, growing the batch geometrically, so a search that stops early has screened little.
   */
  screen(query: Uint8Array, visit: ScreenVisit<Meta>, firstBatch = 16): void {
    this.memory.setQuery(query);
    const chunks = this.leaves.map((l) => l.chunk);
    const countAt = (i: number) => this.leaves[i]?.entries.length ?? 0;
    let batch = Math.min(MAX_LIST_CHUNKS, Math.max(1, firstBatch));
    for (let start = 0; start < this.leaves.length; start += batch, batch = Math.min(MAX_LIST_CHUNKS, batch * 2)) {
      const end = Math.min(this.leaves.length, start + batch);
      const listed = this.memory.setList(chunks, countAt, start, end);
      const found = this.memory.kernel.screen(QUERY_ADDRESS, LIST_ADDRESS, listed, OUT_ADDRESS, 0);
      // Copy the codes out: visiting may run RDKit, which must not see half-read scratch space.
      const codes = this.memory.words.slice(OUT_ADDRESS / 4, OUT_ADDRESS / 4 + found);
      for (const code of codes) {
        const entry = this.leaves[start + (code >> 6)]?.entries[code & 63];
        if (entry && !visit(entry)) return;
      }
    }
  }
}

function lowerBound<Meta>(entries: IndexEntry<Meta>[], id: string): number {
  let lo = 0;
  let hi = entries.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((entries[mid]?.id ?? "") < id) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
