/**
 * One WebAssembly memory holding every fingerprint of an index in 16 kB chunks of 64 entries (256 bytes each), so
 * the scan kernels read them without copying. The first 66 chunk-sized slots are scratch space for the query, the
 * chunk list and the results of one kernel call.
 */
import { type ScanKernel, instantiateKernel } from "./wasm-kernel";

export const ENTRY_BYTES = 256;
export const CHUNK_ENTRIES = 64;
export const CHUNK_BYTES = ENTRY_BYTES * CHUNK_ENTRIES;
export const QUERY_ADDRESS = 0;
export const LIST_ADDRESS = 1024;
/** Chunks per kernel call: 2048 × 64 = 131 072 entries, 8 bytes of output each. */
export const MAX_LIST_CHUNKS = 2048;
export const OUT_ADDRESS = 32_768;
const DATA_START = OUT_ADDRESS + MAX_LIST_CHUNKS * CHUNK_ENTRIES * 8;
const PAGE = 65_536;

export class FingerprintMemory {
  readonly kernel: ScanKernel;
  private readonly memory: WebAssembly.Memory;
  private bytesView: Uint8Array;
  private wordsView: Uint32Array;
  private readonly free: number[] = [];
  private allocated = 0;

  constructor() {
    this.memory = new WebAssembly.Memory({ initial: Math.ceil(DATA_START / PAGE) + 16 });
    this.kernel = instantiateKernel(this.memory);
    this.bytesView = new Uint8Array(this.memory.buffer);
    this.wordsView = new Uint32Array(this.memory.buffer);
  }

  /** Views are replaced when the memory grows (growth detaches the old ArrayBuffer). */
  get bytes(): Uint8Array {
    if (this.bytesView.buffer !== this.memory.buffer) this.refreshViews();
    return this.bytesView;
  }

  get words(): Uint32Array {
    if (this.wordsView.buffer !== this.memory.buffer) this.refreshViews();
    return this.wordsView;
  }

  private refreshViews(): void {
    this.bytesView = new Uint8Array(this.memory.buffer);
    this.wordsView = new Uint32Array(this.memory.buffer);
  }

  allocChunk(): number {
    const reused = this.free.pop();
    if (reused !== undefined) return reused;
    const chunk = this.allocated++;
    const needed = DATA_START + this.allocated * CHUNK_BYTES;
    const have = this.memory.buffer.byteLength;
    if (needed > have) {
      // Grow by at least 1/8 so a bulk load does not reallocate on every chunk.
      const pages = Math.max(Math.ceil((needed - have) / PAGE), Math.ceil(have / PAGE / 8));
      this.memory.grow(pages);
    }
    return chunk;
  }

  freeChunk(chunk: number): void {
    this.free.push(chunk);
  }

  address(chunk: number, slot = 0): number {
    return DATA_START + chunk * CHUNK_BYTES + slot * ENTRY_BYTES;
  }

  write(chunk: number, slot: number, fingerprint: Uint8Array): void {
    this.bytes.set(fingerprint, this.address(chunk, slot));
  }

  read(chunk: number, slot: number): Uint8Array {
    const at = this.address(chunk, slot);
    return this.bytes.slice(at, at + ENTRY_BYTES);
  }

  equals(chunk: number, slot: number, fingerprint: Uint8Array): boolean {
    const bytes = this.bytes;
    const at = this.address(chunk, slot);
    for (let i = 0; i < ENTRY_BYTES; i++) if (bytes[at + i] !== fingerprint[i]) return false;
    return true;
  }

  /** Copies `count` entries; overlapping ranges are fine (memmove semantics). */
  move(fromChunk: number, fromSlot: number, toChunk: number, toSlot: number, count = 1): void {
    const from = this.address(fromChunk, fromSlot);
    this.bytes.copyWithin(this.address(toChunk, toSlot), from, from + count * ENTRY_BYTES);
  }

  setQuery(fingerprint: Uint8Array): void {
    this.bytes.set(fingerprint, QUERY_ADDRESS);
  }

  /** Writes the [address, count] list for a kernel call. */
  setList(chunks: readonly number[], counts: (position: number) => number, start: number, end: number): number {
    const words = this.words;
    let at = LIST_ADDRESS / 4;
    for (let i = start; i < end; i++) {
      words[at++] = this.address(chunks[i] ?? 0);
      words[at++] = counts(i);
    }
    return end - start;
  }

  /** Bytes held by the WebAssembly memory (fingerprints, free chunks and scratch). */
  get reservedBytes(): number {
    return this.memory.buffer.byteLength;
  }

  get chunksInUse(): number {
    return this.allocated - this.free.length;
  }
}
