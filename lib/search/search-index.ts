/**
 * The in-memory compound search index of one server process. Entries are partitioned by group, so a query only ever
 * scans its own group. Similarity is exact top-k Tanimoto on Morgan fingerprints; substructure search screens
 * screening fingerprints (screen.ts) in WebAssembly and confirms candidates with the graph matcher (and RDKit for
 * the rare query the matcher cannot decide alone).
 *
 * `generation` increases with every change; `watermark` is the newest `updatedAt` applied, which sync.ts uses to
 * fetch only rows changed since (so several app instances over one PostgreSQL converge).
 */
import { FINGERPRINT_BYTES } from "@/lib/chem/structure/fingerprint";
import { type IndexEntry } from "./entry";
import { FingerprintMemory } from "./fingerprint-memory";
import { ScreenPartition } from "./screen-partition";
import { type SimilarityOptions, SimilarityPartition } from "./similarity-partition";
import { targetScreen } from "./screen";
import { type SubstructureQuery } from "./substructure-query";

export interface IndexedCompound {
  id: string;
  groupId: string;
  /** Morgan radius 2, 2048 bits (256 bytes). */
  morganFingerprint: Uint8Array;
  /** Compact graph (lib/chem/structure/search-graph.ts); needed for substructure search. */
  searchGraph?: Uint8Array;
  /** Accepted for compatibility and ignored: the index derives its screening fingerprint from `searchGraph`. */
  patternFingerprint?: Uint8Array;
  /** Canonical SMILES; lets RDKit confirm hits for the rare query the graph matcher cannot decide alone. */
  canonicalSmiles?: string;
  updatedAt?: Date;
}

export interface SimilarityHit<Meta> {
  id: string;
  score: number;
  meta: Meta | undefined;
}

export interface SubstructureResult<Meta> {
  hits: { id: string; meta: Meta | undefined }[];
  /** True when more hits exist beyond `limit`. */
  more: boolean;
  /** Entries that passed the fingerprint screen and were matched. */
  candidates: number;
}

interface Group<Meta> {
  similarity: SimilarityPartition<Meta>;
  screens: ScreenPartition<Meta>;
}

export class CompoundSearchIndex<Meta = unknown> {
  private readonly memory = new FingerprintMemory();
  private readonly groups = new Map<string, Group<Meta>>();
  private readonly entries = new Map<string, IndexEntry<Meta>>();
  private changes = 0;
  private newest: number | undefined;

  get generation(): number {
    return this.changes;
  }

  /** Newest `updatedAt` applied so far, or undefined before any dated row. */
  get watermark(): Date | undefined {
    return this.newest === undefined ? undefined : new Date(this.newest);
  }

  get size(): number {
    return this.entries.size;
  }

  groupSize(groupId: string): number {
    return this.groups.get(groupId)?.similarity.size ?? 0;
  }

  has(id: string): boolean {
    return this.entries.has(id);
  }

  /** Adds or replaces a compound; moving it to another group is allowed. The index keeps `searchGraph` as given. */
  upsert(compound: IndexedCompound, meta?: Meta): void {
    checkFingerprint(compound.morganFingerprint, "morganFingerprint");
    const updatedAt = compound.updatedAt?.getTime();
    if (updatedAt !== undefined && (this.newest === undefined || updatedAt > this.newest)) this.newest = updatedAt;
    const existing = this.entries.get(compound.id);
    if (existing && existing.groupId === compound.groupId && this.unchanged(existing, compound)) {
      existing.meta = meta;
      existing.smiles = compound.canonicalSmiles;
      existing.updatedAt = updatedAt;
      return;
    }
    if (existing) this.detach(existing);
    const entry: IndexEntry<Meta> = {
      id: compound.id,
      groupId: compound.groupId,
      meta,
      popcount: 0,
      position: 0,
      graph: compound.searchGraph,
      smiles: compound.canonicalSmiles,
      updatedAt,
    };
    const group = this.group(compound.groupId);
    group.similarity.add(entry, compound.morganFingerprint);
    if (entry.graph) group.screens.add(entry, targetScreen(entry.graph));
    this.entries.set(entry.id, entry);
    this.changes += 1;
  }

  remove(id: string): boolean {
    const entry = this.entries.get(id);
    if (!entry) return false;
    this.detach(entry);
    this.changes += 1;
    return true;
  }

  /** Drops every entry of `groupId` that is not in `liveIds` (rows deleted elsewhere); returns how many went. */
  retainOnly(groupId: string, liveIds: Iterable<string>): number {
    const live = new Set(liveIds);
    const gone = [...this.entries.values()].filter((e) => e.groupId === groupId && !live.has(e.id));
    gone.forEach((e) => this.remove(e.id));
    return gone.length;
  }

  similar(groupId: string, queryFingerprint: Uint8Array, options: SimilarityOptions = {}): SimilarityHit<Meta>[] {
    checkFingerprint(queryFingerprint, "query fingerprint");
    const threshold = options.threshold ?? 0;
    if (!(threshold >= 0 && threshold <= 1)) throw new RangeError("threshold must be between 0 and 1");
    const k = options.k ?? 10;
    if (!(Number.isInteger(k) || k === Infinity) || k < 0) throw new RangeError("k must be a whole number ≥ 0, or Infinity");
    const group = this.groups.get(groupId);
    if (!group) return [];
    return group.similarity.search(queryFingerprint, options).map(({ entry, score }) => ({ id: entry.id, score, meta: entry.meta }));
  }

  /** Hits in id order; stops after `limit` (default: all). */
  substructure(groupId: string, query: SubstructureQuery, options: { limit?: number } = {}): SubstructureResult<Meta> {
    const limit = options.limit ?? Infinity;
    const hits: SubstructureResult<Meta>["hits"] = [];
    let candidates = 0;
    let more = false;
    const group = this.groups.get(groupId);
    if (!group || limit <= 0) return { hits, more: (group?.screens.size ?? 0) > 0 && limit <= 0, candidates };
    group.screens.screen(
      query.screen,
      (entry) => {
        candidates += 1;
        const graph = entry.graph as Uint8Array;
        const matched = query.matcher.matches(graph) && (query.exact || (entry.smiles !== undefined && query.verify(entry.smiles)));
        if (!matched) return true;
        if (hits.length >= limit) {
          more = true;
          return false;
        }
        hits.push({ id: entry.id, meta: entry.meta });
        return true;
      },
      Number.isFinite(limit) ? 4 : 1 << 30,
    );
    return { hits, more, candidates };
  }

  /** Memory held: fingerprints in WebAssembly, plus an estimate of the JavaScript side (graphs, ids, entries). */
  memoryUsage(): { wasmBytes: number; fingerprintChunks: number; graphBytes: number; entries: number } {
    let graphBytes = 0;
    for (const e of this.entries.values()) graphBytes += e.graph?.byteLength ?? 0;
    return { wasmBytes: this.memory.reservedBytes, fingerprintChunks: this.memory.chunksInUse, graphBytes, entries: this.entries.size };
  }

  private group(groupId: string): Group<Meta> {
    let group = this.groups.get(groupId);
    if (!group) {
      group = { similarity: new SimilarityPartition<Meta>(this.memory), screens: new ScreenPartition<Meta>(this.memory) };
      this.groups.set(groupId, group);
    }
    return group;
  }

  private detach(entry: IndexEntry<Meta>): void {
    const group = this.groups.get(entry.groupId);
    if (group) {
      group.similarity.remove(entry);
      group.screens.remove(entry);
      if (group.similarity.size === 0) this.groups.delete(entry.groupId);
    }
    this.entries.delete(entry.id);
  }

  private unchanged(entry: IndexEntry<Meta>, compound: IndexedCompound): boolean {
    const group = this.groups.get(entry.groupId);
    return !!group && group.similarity.holds(entry, compound.morganFingerprint) && sameBytes(entry.graph, compound.searchGraph);
  }
}

function checkFingerprint(fp: Uint8Array, what: string): void {
  if (!(fp instanceof Uint8Array) || fp.length !== FINGERPRINT_BYTES) throw new TypeError(`${what} must be a Uint8Array of ${FINGERPRINT_BYTES} bytes`);
}

function sameBytes(a: Uint8Array | undefined, b: Uint8Array | undefined): boolean {
  if (!a || !b) return a === b;
  return a.length === b.length && a.every((x, i) => x === b[i]);
}
