/**
 * One WebAssembly memory holding an index's fingerprints in 16 kB chunks, so the kernels read them in place.
 * Chunks are handed out singly (screening fingerprints, 64 × 256 bytes each) or as contiguous runs of 1–16
 * (bit-sliced similarity super-chunks). The first 68 chunk-sized slots are scratch for one kernel call.
 */
import { type ScanKernel, instantiateKernel } from "./wasm-kernel";

export const ENTRY_BYTES = 256;
export const CHUNK_ENTRIES = 64;
export const CHUNK_BYTES = ENTRY_BYTES * CHUNK_ENTRIES;
export const QUERY_ADDRESS = 0;
/** Counter planes of the sliced kernel: up to 12 × 8 bytes (counts up to 4095). */
export const PLANES_ADDRESS = 256;
/** The query's set-bit positions as u16, up to 2048 of them. */
export const QBITS_ADDRESS = 512;
export const LIST_ADDRESS = 8192;
/** Chunks (or 64-entry blocks) per kernel call: 2048 × 64 = 131 072 entries, 8 bytes of output each. */
export const MAX_LIST_CHUNKS = 2048;
export const OUT_ADDRESS = 65_536;
const DATA_START = OUT_ADDRESS + MAX_LIST_CHUNKS * CHUNK_ENTRIES * 8;
const PAGE = 65_536;

export class FingerprintMemory {
  readonly kernel: ScanKernel;
  private readonly memory: WebAssembly.Memory;
  private bytesView: Uint8Array;
  private wordsView: Uint32Array;
  /** Free runs by length (1, 2, 4, 8, 16 chunks): start chunk numbers. */
  private readonly free = new Map<number, number[]>();
  private allocated = 0;
  private inUse = 0;

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

  /** A run of `length` contiguous chunks, zero-filled; returns the first chunk's number. */
  allocRun(length: number): number {
    const reused = this.free.get(length)?.pop();
    this.inUse += length;
    if (reused !== undefined) {
      this.bytes.fill(0, this.address(reused), this.address(reused + length));
      return reused;
    }
    const start = this.allocated;
    this.allocated += length;
    const needed = DATA_START + this.allocated * CHUNK_BYTES;
    const have = this.memory.buffer.byteLength;
    if (needed > have) {
      // Grow by at least 1/8 so a bulk load does not reallocate on every chunk.
      this.memory.grow(Math.max(Math.ceil((needed - have) / PAGE), Math.ceil(have / PAGE / 8)));
    }
    return start;
  }

  freeRun(start: number, length: number): void {
    let list = this.free.get(length);
    if (!list) {
      list = [];
      this.free.set(length, list);
    }
    list.push(start);
    this.inUse -= length;
  }

  allocChunk(): number {
    return this.allocRun(1);
  }

  freeChunk(chunk: number): void {
    this.freeRun(chunk, 1);
  }

  address(chunk: number, slot = 0): number {
    return DATA_START + chunk * CHUNK_BYTES + slot * ENTRY_BYTES;
  }

  write(chunk: number, slot: number, fingerprint: Uint8Array): void {
    this.bytes.set(fingerprint, this.address(chunk, slot));
  }

  /** Copies `count` entries; overlapping ranges are fine (memmove semantics). */
  move(fromChunk: number, fromSlot: number, toChunk: number, toSlot: number, count = 1): void {
    const from = this.address(fromChunk, fromSlot);
    this.bytes.copyWithin(this.address(toChunk, toSlot), from, from + count * ENTRY_BYTES);
  }

  setQuery(fingerprint: Uint8Array): void {
    this.bytes.set(fingerprint, QUERY_ADDRESS);
  }

  /** Writes `count` [address, count] pairs for the screening kernel. */
  setList(chunks: readonly number[], counts: (position: number) => number, start: number, end: number): number {
    const words = this.words;
    let at = LIST_ADDRESS / 4;
    for (let i = start; i < end; i++) {
      words[at++] = this.address(chunks[i] ?? 0);
      words[at++] = counts(i);
    }
    return end - start;
  }

  /** Bytes held by the WebAssembly memory (fingerprints, free runs and scratch). */
  get reservedBytes(): number {
    return this.memory.buffer.byteLength;
  }

  get chunksInUse(): number {
    return this.inUse;
  }
}
