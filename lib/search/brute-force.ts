/** Reference answers by exhaustive scan in plain JavaScript; the index must agree with these exactly. */
import { intersectionCount, popcount, tanimotoFromCounts } from "@/lib/chem/structure/fingerprint";
import { before } from "./entry";

export interface ReferenceEntry {
  id: string;
  fingerprint: Uint8Array;
}

export function bruteForceSimilar(entries: readonly ReferenceEntry[], query: Uint8Array, k = 10, threshold = 0): { id: string; score: number }[] {
  const a = popcount(query);
  return entries
    .map((e) => ({ id: e.id, score: tanimotoFromCounts(intersectionCount(query, e.fingerprint), a, popcount(e.fingerprint)) }))
    .filter((h) => h.score >= threshold)
    .sort((x, y) => (before(x.score, x.id, y.score, y.id) ? -1 : 1))
    .slice(0, Number.isFinite(k) ? k : undefined);
}
