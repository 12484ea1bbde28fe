/**
 * Reference answers by exhaustive scan in plain JavaScript, sharing no code with the index except the Tanimoto
 * expression and the tie order; the index must agree with these exactly. One pass, 32-bit SWAR popcount
 * (Hacker's Delight, 2nd ed., §5-1), a sorted insertion list for top-k.
 */
import { tanimotoFromCounts } from "@/lib/chem/structure/fingerprint";
import { before } from "./entry";

export interface ReferenceEntry {
  id: string;
  fingerprint: Uint8Array;
}

function bitCount32(x: number): number {
  let v = x - ((x >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24);
}

function words(fp: Uint8Array): Uint32Array {
  return fp.byteOffset % 4 === 0 ? new Uint32Array(fp.buffer, fp.byteOffset, fp.byteLength / 4) : new Uint32Array(fp.slice().buffer);
}

export function bruteForceSimilar(entries: readonly ReferenceEntry[], query: Uint8Array, k = 10, threshold = 0): { id: string; score: number }[] {
  const q = words(query);
  let a = 0;
  for (const w of q) a += bitCount32(w);
  const hits: { id: string; score: number }[] = [];
  for (const entry of entries) {
    const e = words(entry.fingerprint);
    let b = 0;
    let common = 0;
    for (let i = 0; i < e.length; i++) {
      const w = e[i] ?? 0;
      b += bitCount32(w);
      common += bitCount32(w & (q[i] ?? 0));
    }
    const score = tanimotoFromCounts(common, a, b);
    if (score < threshold) continue;
    if (Number.isFinite(k) && hits.length >= k) {
      const last = hits[hits.length - 1];
      if (!last || !before(score, entry.id, last.score, last.id)) continue;
      hits.pop();
    }
    let at = hits.length;
    while (at > 0 && before(score, entry.id, hits[at - 1]?.score ?? 0, hits[at - 1]?.id ?? "")) at -= 1;
    hits.splice(at, 0, { id: entry.id, score });
  }
  return hits;
}
