/**
 * One group's Morgan fingerprints for exact top-k Tanimoto search.
 *
 * Layout: fingerprints are bucketed by popcount b and stored bit-sliced: a block of 64 compounds keeps, for each of
 * the 2048 bit positions, one 64-bit word whose lane j is that bit of compound j. A query then reads only the words
 * of its own set bits (about 45 of 2048 for drug-like Morgan fingerprints) and the kernel counts common bits for 64
 * compounds at once — exact counts, so scores equal a brute-force scan's. Blocks live in super-chunks of 1–16
 * blocks (doubling as a bucket grows), each bit's words contiguous, so a query's reads are sequential.
 *
 * Pruning: Tanimoto ≤ min(a, b) / max(a, b) (Swamidass & Baldi, J. Chem. Inf. Model. 2007, 47, 302). Buckets are
 * visited from the best bound down and scanning stops once the bound falls below the k-th score found; inside a
 * bucket the kernel returns only compounds whose common-bit count can reach the current k-th score.
 */
import { tanimotoFromCounts } from "@/lib/chem/structure/fingerprint";
import { before, type IndexEntry } from "./entry";
import { type FingerprintMemory, LIST_ADDRESS, OUT_ADDRESS, PLANES_ADDRESS, QBITS_ADDRESS } from "./fingerprint-memory";
import { TopK } from "./top-k";

const BITS = 2048;
const LANES = 64;
const MAX_SUPER = 16;

interface SuperChunk {
  chunk: number;
  address: number;
  /** Blocks this super-chunk can hold (1, 2, 4, 8 or 16). */
  size: number;
  used: number;
}

interface Bucket<Meta> {
  entries: IndexEntry<Meta>[];
  supers: SuperChunk[];
  /** Block number → its super-chunk and position there. */
  blocks: { sup: SuperChunk; t: number }[];
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
  /** How many compounds set each bit: queries add their rarest bits first, so hopeless lanes drop out early. */
  private readonly frequency = new Uint32Array(BITS);
  private count = 0;

  constructor(private readonly memory: FingerprintMemory) {}

  get size(): number {
    return this.count;
  }

  /** Index into memory.words of the low half of the word for bit k of block `block`. */
  private wordIndex(block: { sup: SuperChunk; t: number }, k: number): number {
    return (block.sup.address + (k * block.sup.size + block.t) * 8) >> 2;
  }

  add(entry: IndexEntry<Meta>, fingerprint: Uint8Array): void {
    const bits = setBits(fingerprint);
    let bucket = this.buckets.get(bits.length);
    if (!bucket) {
      bucket = { entries: [], supers: [], blocks: [] };
      this.buckets.set(bits.length, bucket);
    }
    const position = bucket.entries.length;
    if (position % LANES === 0) this.addBlock(bucket);
    const block = bucket.blocks[position >> 6] as { sup: SuperChunk; t: number };
    const lane = position & 63;
    const words = this.memory.words;
    for (const k of bits) {
      const at = this.wordIndex(block, k) + (lane >> 5);
      words[at] = (words[at] ?? 0) | (1 << (lane & 31));
      this.frequency[k] = (this.frequency[k] ?? 0) + 1;
    }
    bucket.entries.push(entry);
    entry.popcount = bits.length;
    entry.position = position;
    this.count += 1;
  }

  private addBlock(bucket: Bucket<Meta>): void {
    const last = bucket.supers[bucket.supers.length - 1];
    if (last && last.used < last.size) {
      bucket.blocks.push({ sup: last, t: last.used });
      last.used += 1;
      return;
    }
    const size = Math.min(MAX_SUPER, Math.max(1, bucket.blocks.length));
    const chunk = this.memory.allocRun(size);
    const sup: SuperChunk = { chunk, address: this.memory.address(chunk), size, used: 1 };
    bucket.supers.push(sup);
    bucket.blocks.push({ sup, t: 0 });
  }

  /** Moves the bucket's last compound into the removed one's lanes, clearing the last lanes. */
  remove(entry: IndexEntry<Meta>): void {
    const bucket = this.buckets.get(entry.popcount);
    if (!bucket || bucket.entries[entry.position] !== entry) return;
    const last = bucket.entries.length - 1;
    const from = bucket.blocks[last >> 6] as { sup: SuperChunk; t: number };
    const to = bucket.blocks[entry.position >> 6] as { sup: SuperChunk; t: number };
    const fromHalf = (last & 63) >> 5;
    const fromMask = 1 << (last & 31);
    const toHalf = (entry.position & 63) >> 5;
    const toMask = 1 << (entry.position & 31);
    const words = this.memory.words;
    for (let k = 0; k < BITS; k++) {
      const own = this.wordIndex(to, k) + toHalf;
      if (((words[own] ?? 0) & toMask) !== 0) this.frequency[k] = (this.frequency[k] ?? 1) - 1;
      const src = this.wordIndex(from, k) + fromHalf;
      const value = ((words[src] ?? 0) & fromMask) !== 0;
      words[src] = (words[src] ?? 0) & ~fromMask;
      if (entry.position === last) continue;
      const dst = this.wordIndex(to, k) + toHalf;
      words[dst] = value ? (words[dst] ?? 0) | toMask : (words[dst] ?? 0) & ~toMask;
    }
    const moved = bucket.entries[last];
    if (moved && entry.position !== last) {
      bucket.entries[entry.position] = moved;
      moved.position = entry.position;
    }
    bucket.entries.pop();
    if (last % LANES === 0) {
      bucket.blocks.pop();
      const sup = bucket.supers[bucket.supers.length - 1];
      if (sup) {
        sup.used -= 1;
        if (sup.used === 0) {
          this.memory.freeRun(sup.chunk, sup.size);
          bucket.supers.pop();
        }
      }
    }
    if (bucket.entries.length === 0) this.buckets.delete(entry.popcount);
    this.count -= 1;
  }

  /** The stored fingerprint of an entry, rebuilt from its lanes. */
  fingerprintOf(entry: IndexEntry<Meta>): Uint8Array | undefined {
    const bucket = this.buckets.get(entry.popcount);
    if (!bucket || bucket.entries[entry.position] !== entry) return undefined;
    const block = bucket.blocks[entry.position >> 6] as { sup: SuperChunk; t: number };
    const half = (entry.position & 63) >> 5;
    const mask = 1 << (entry.position & 31);
    const words = this.memory.words;
    const fp = new Uint8Array(BITS / 8);
    for (let k = 0; k < BITS; k++) if (((words[this.wordIndex(block, k) + half] ?? 0) & mask) !== 0) fp[k >> 3] = (fp[k >> 3] ?? 0) | (1 << (k & 7));
    return fp;
  }

  holds(entry: IndexEntry<Meta>, fingerprint: Uint8Array): boolean {
    const stored = this.fingerprintOf(entry);
    return stored !== undefined && stored.every((byte, i) => byte === fingerprint[i]);
  }

  search(query: Uint8Array, options: SimilarityOptions = {}): ScoredEntry<Meta>[] {
    const k = options.k ?? 10;
    const threshold = options.threshold ?? 0;
    if (k <= 0 || this.count === 0) return [];
    const frequency = this.frequency;
    const bits = setBits(query).sort((x, y) => (frequency[x] ?? 0) - (frequency[y] ?? 0) || x - y);
    const a = bits.length;
    const bytes = this.memory.bytes;
    bits.forEach((bit, i) => {
      bytes[QBITS_ADDRESS + 2 * i] = bit & 0xff;
      bytes[QBITS_ADDRESS + 2 * i + 1] = bit >> 8;
    });
    const order = [...this.buckets.keys()].map((b) => ({ b, bound: tanimotoFromCounts(Math.min(a, b), a, b) })).sort((x, y) => y.bound - x.bound);
    const top = Number.isFinite(k) ? new TopK<IndexEntry<Meta>>(k) : undefined;
    const all: ScoredEntry<Meta>[] = [];
    for (const { b, bound } of order) {
      if (bound < threshold || bound < (top?.floor ?? -Infinity)) break;
      const bucket = this.buckets.get(b);
      if (!bucket) continue;
      // The k-th score rises as super-chunks are scanned, so the common-bit floor is recomputed before each one.
      const floor = () => minimumCommon(Math.max(threshold, top?.floor ?? -Infinity), a, b);
      this.scanBucket(bucket, a, floor, (entry, common) => {
        const score = tanimotoFromCounts(common, a, b);
        if (score < threshold) return;
        if (top) top.offer(score, entry);
        else all.push({ entry, score });
      });
    }
    if (top) return top.items.map((entry, i) => ({ entry, score: top.scores[i] ?? 0 }));
    return all.sort((x, y) => (before(x.score, x.entry.id, y.score, y.entry.id) ? -1 : 1));
  }

  private scanBucket(bucket: Bucket<Meta>, nbits: number, floor: () => number | undefined, visit: (entry: IndexEntry<Meta>, common: number) => void): void {
    const lastLanes = bucket.entries.length - (bucket.blocks.length - 1) * LANES;
    let firstBlock = 0;
    bucket.supers.forEach((sup, s) => {
      const cmin = floor();
      if (cmin === undefined) return;
      const words = this.memory.words;
      const at = LIST_ADDRESS / 4;
      words[at] = sup.address;
      words[at + 1] = 3 + Math.log2(sup.size);
      words[at + 2] = sup.used;
      words[at + 3] = s === bucket.supers.length - 1 ? lastLanes : LANES;
      const found = this.memory.kernel.sliced(QBITS_ADDRESS, nbits, LIST_ADDRESS, 1, OUT_ADDRESS, cmin, PLANES_ADDRESS, 12);
      const out = this.memory.words;
      const base = firstBlock * LANES;
      for (let r = 0; r < found; r++) {
        const o = OUT_ADDRESS / 4 + r * 2;
        const entry = bucket.entries[base + (out[o] ?? 0)];
        if (entry) visit(entry, out[o + 1] ?? 0);
      }
      firstBlock += sup.used;
    });
  }
}

function setBits(fingerprint: Uint8Array): number[] {
  const bits: number[] = [];
  fingerprint.forEach((byte, i) => {
    for (let x = byte, j = 0; x; x >>= 1, j++) if (x & 1) bits.push(i * 8 + j);
  });
  return bits;
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


