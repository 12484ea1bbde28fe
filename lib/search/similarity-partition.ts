/**
 * One group's Morgan fingerprints, bucketed by popcount so whole buckets can be skipped: for fingerprints with a and
 * b bits, Tanimoto ≤ min(a, b) / max(a, b) (Swamidass & Baldi, J. Chem. Inf. Model. 2007, 47, 302). Buckets are
 * visited from the best bound down, and scanning stops once the bound falls below the k-th score found, so the
 * result is exactly a brute-force scan's. Within a bucket the kernel keeps only entries whose common-bit count could
 * reach the current k-th score; removal moves the bucket's last entry into the hole.
 */
import { popcount, tanimotoFromCounts } from "@/lib/chem/structure/fingerprint";
import { before, type IndexEntry } from "./entry";
import { CHUNK_ENTRIES, type FingerprintMemory, MAX_LIST_CHUNKS, OUT_ADDRESS, QUERY_ADDRESS, LIST_ADDRESS } from "./fingerprint-memory";
import { TopK } from "./top-k";

interface Bucket<Meta> {
  chunks: number[];
  entries: IndexEntry<Meta>[];
}

export interface SimilarityOptions {
  /** Most hits returned; default 10. Infinity returns every hit at or above the threshold. */
  k?: number;
  /** Lowest Tanimoto returned, 0–1; default 0. */
  threshold?: number;
}

export interface ScoredEntry<Meta> {
  entry: IndexEntry<Meta>;
  score: number;
}

export class SimilarityPartition<Meta> {
  private readonly buckets = new Map<number, Bucket<Meta>>();
  private count = 0;

  constructor(private readonly memory: FingerprintMemory) {}

  get size(): number {
    return this.count;
  }

  add(entry: IndexEntry<Meta>, fingerprint: Uint8Array): void {
    const bits = popcount(fingerprint);
    let bucket = this.buckets.get(bits);
    if (!bucket) {
      bucket = { chunks: [], entries: [] };
      this.buckets.set(bits, bucket);
    }
    const position = bucket.entries.length;
    if (position % CHUNK_ENTRIES === 0) bucket.chunks.push(this.memory.allocChunk());
    this.memory.write(bucket.chunks[position >> 6] ?? 0, position & 63, fingerprint);
    bucket.entries.push(entry);
    entry.popcount = bits;
    entry.position = position;
    this.count += 1;
  }

  holds(entry: IndexEntry<Meta>, fingerprint: Uint8Array): boolean {
    const bucket = this.buckets.get(entry.popcount);
    return bucket?.entries[entry.position] === entry && this.memory.equals(bucket.chunks[entry.position >> 6] ?? 0, entry.position & 63, fingerprint);
  }

  remove(entry: IndexEntry<Meta>): void {
    const bucket = this.buckets.get(entry.popcount);
    if (!bucket || bucket.entries[entry.position] !== entry) return;
    const last = bucket.entries.length - 1;
    const moved = bucket.entries[last];
    if (moved && entry.position !== last) {
      this.memory.move(bucket.chunks[last >> 6] ?? 0, last & 63, bucket.chunks[entry.position >> 6] ?? 0, entry.position & 63);
      bucket.entries[entry.position] = moved;
      moved.position = entry.position;
    }
    bucket.entries.pop();
    if (last % CHUNK_ENTRIES === 0) this.memory.freeChunk(bucket.chunks.pop() ?? 0);
    if (bucket.entries.length === 0) this.buckets.delete(entry.popcount);
    this.count -= 1;
  }

  search(query: Uint8Array, options: SimilarityOptions = {}): ScoredEntry<Meta>[] {
    const k = options.k ?? 10;
    const threshold = options.threshold ?? 0;
    if (k <= 0 || this.count === 0) return [];
    const a = popcount(query);
    const order = [...this.buckets.keys()].map((b) => ({ b, bound: tanimotoFromCounts(Math.min(a, b), a, b) })).sort((x, y) => y.bound - x.bound);
    this.memory.setQuery(query);
    const top = Number.isFinite(k) ? new TopK<IndexEntry<Meta>>(k) : undefined;
    const all: ScoredEntry<Meta>[] = [];
    for (const { b, bound } of order) {
      if (bound < threshold || bound < (top?.floor ?? -Infinity)) break;
      const floor = Math.max(threshold, top?.floor ?? -Infinity);
      const cmin = minimumCommon(floor, a, b);
      if (cmin === undefined) continue;
      const bucket = this.buckets.get(b);
      if (!bucket) continue;
      this.scanBucket(bucket, cmin, (entry, common) => {
        const score = tanimotoFromCounts(common, a, b);
        if (score < threshold) return;
        if (top) top.offer(score, entry);
        else all.push({ entry, score });
      });
    }
    if (top) return top.items.map((entry, i) => ({ entry, score: top.scores[i] ?? 0 }));
    return all.sort((x, y) => (before(x.score, x.entry.id, y.score, y.entry.id) ? -1 : 1));
  }

  private scanBucket(bucket: Bucket<Meta>, cmin: number, visit: (entry: IndexEntry<Meta>, common: number) => void): void {
    const total = bucket.entries.length;
    const countAt = (i: number) => Math.min(CHUNK_ENTRIES, total - i * CHUNK_ENTRIES);
    for (let start = 0; start < bucket.chunks.length; start += MAX_LIST_CHUNKS) {
      const end = Math.min(bucket.chunks.length, start + MAX_LIST_CHUNKS);
      const listed = this.memory.setList(bucket.chunks, countAt, start, end);
      const found = this.memory.kernel.similarity(QUERY_ADDRESS, LIST_ADDRESS, listed, OUT_ADDRESS, cmin);
      const words = this.memory.words;
      const base = start * CHUNK_ENTRIES;
      for (let r = 0; r < found; r++) {
        const at = OUT_ADDRESS / 4 + r * 2;
        const entry = bucket.entries[base + (words[at] ?? 0)];
        if (entry) visit(entry, words[at + 1] ?? 0);
      }
    }
  }

  /** Every stored fingerprint, for tests and diagnostics. */
  *fingerprints(): Generator<{ entry: IndexEntry<Meta>; fingerprint: Uint8Array }> {
    for (const bucket of this.buckets.values()) {
      for (const entry of bucket.entries) yield { entry, fingerprint: this.memory.read(bucket.chunks[entry.position >> 6] ?? 0, entry.position & 63) };
    }
  }
}

/**
 * Smallest common-bit count c (0 ≤ c ≤ min(a, b)) whose Tanimoto reaches `floor`, evaluated with the same expression
 * used for ranking so a borderline tie is never lost; undefined when no c can.
 */
export function minimumCommon(floor: number, a: number, b: number): number | undefined {
  const max = Math.min(a, b);
  if (floor <= 0) return 0;
  let c = Math.min(max, Math.max(0, Math.ceil((floor * (a + b)) / (1 + floor))));
  while (c > 0 && tanimotoFromCounts(c - 1, a, b) >= floor) c -= 1;
  while (c <= max && tanimotoFromCounts(c, a, b) < floor) c += 1;
  return c <= max ? c : undefined;
}
