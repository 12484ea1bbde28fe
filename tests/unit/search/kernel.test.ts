/** The hand-assembled WebAssembly kernels against plain JavaScript on random data. */
import { describe, expect, it } from "vitest";
import { intersectionCount } from "@/lib/chem/structure/fingerprint";
import { FingerprintMemory, LIST_ADDRESS, OUT_ADDRESS, QBITS_ADDRESS } from "@/lib/search/fingerprint-memory";
import { kernelBytes } from "@/lib/search/wasm-kernel";
import { randomFingerprint, seeded } from "./random-fingerprints";

describe("scan kernels", () => {
  it("assemble into a valid WebAssembly module", () => {
    expect(WebAssembly.validate(kernelBytes())).toBe(true);
  });

  it("screen: returns exactly the entries that contain every query bit", () => {
    const memory = new FingerprintMemory();
    const random = seeded(3);
    const entries = Array.from({ length: 150 }, () => randomFingerprint(random, 60, 300));
    const chunks = [memory.allocChunk(), memory.allocChunk(), memory.allocChunk()];
    entries.forEach((fp, i) => memory.write(chunks[i >> 6] ?? 0, i & 63, fp));
    for (let q = 0; q < 20; q++) {
      const a = entries[q] ?? new Uint8Array(256);
      const b = entries[q + 50] ?? new Uint8Array(256);
      const query = a.map((x, i) => x & (b[i] ?? 0) & (q % 2 ? 0xff : 0x0f));
      memory.setQuery(query);
      const listed = memory.setList(chunks, (i) => Math.min(64, entries.length - i * 64), 0, chunks.length);
      const found = memory.kernel.screen(0, LIST_ADDRESS, listed, OUT_ADDRESS, 0);
      const got = Array.from(memory.words.slice(OUT_ADDRESS / 4, OUT_ADDRESS / 4 + found), (code) => (code >> 6) * 64 + (code & 63));
      const expected = entries.flatMap((fp, i) => (fp.every((x, j) => ((query[j] ?? 0) & x) === (query[j] ?? 0)) ? [i] : []));
      expect(got).toEqual(expected);
    }
  });

  it("sliced: counts common bits exactly for every lane at or above cmin", () => {
    const memory = new FingerprintMemory();
    const random = seeded(8);
    // Two super-chunks (4 and 2 blocks) holding 350 fingerprints bit-sliced by hand.
    const supers = [{ size: 4, blocks: 4 }, { size: 2, blocks: 2 }].map((s) => ({ ...s, chunk: memory.allocRun(s.size) }));
    const entries = Array.from({ length: 350 }, () => randomFingerprint(random, 10 + Math.floor(random() * 80), 500));
    entries.forEach((fp, i) => {
      const sup = i < 256 ? supers[0] : supers[1];
      if (!sup) return;
      const local = i < 256 ? i : i - 256;
      const t = local >> 6;
      const lane = local & 63;
      for (let k = 0; k < 2048; k++) {
        if (((fp[k >> 3] ?? 0) & (1 << (k & 7))) === 0) continue;
        const at = (memory.address(sup.chunk) + (k * sup.size + t) * 8) / 4 + (lane >> 5);
        memory.words[at] = (memory.words[at] ?? 0) | (1 << (lane & 31));
      }
    });
    for (let q = 0; q < 15; q++) {
      const query = randomFingerprint(random, 20 + q * 7, 500);
      const bits: number[] = [];
      for (let k = 0; k < 2048; k++) if ((query[k >> 3] ?? 0) & (1 << (k & 7))) bits.push(k);
      bits.forEach((bit, i) => {
        memory.bytes[QBITS_ADDRESS + 2 * i] = bit & 0xff;
        memory.bytes[QBITS_ADDRESS + 2 * i + 1] = bit >> 8;
      });
      const cmin = q % 4 === 0 ? 0 : Math.floor(bits.length * 0.15 * (q % 4));
      supers.forEach((sup, s) => {
        const at = LIST_ADDRESS / 4 + s * 4;
        memory.words[at] = memory.address(sup.chunk);
        memory.words[at + 1] = 3 + Math.log2(sup.size);
        memory.words[at + 2] = sup.blocks;
        memory.words[at + 3] = s === 1 ? 350 - 256 - 64 : 64;
      });
      const found = memory.kernel.sliced(QBITS_ADDRESS, bits.length, LIST_ADDRESS, 2, OUT_ADDRESS, cmin, 0, 12);
      const got = new Map<number, number>();
      for (let r = 0; r < found; r++) got.set(memory.words[OUT_ADDRESS / 4 + 2 * r] ?? -1, memory.words[OUT_ADDRESS / 4 + 2 * r + 1] ?? -1);
      const expected = new Map(entries.flatMap((fp, i) => {
        const c = intersectionCount(query, fp);
        return c >= cmin ? [[i, c] as const] : [];
      }));
      expect(got).toEqual(expected);
    }
  });
});
