/** Seeded test data for the search tests: fingerprints of chosen density and ids that sort unpredictably. */

/** Mulberry32, a small seeded generator (common practice for reproducible tests). */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A 2048-bit fingerprint with about `bits` set bits, drawn from the first `span` bit positions. */
export function randomFingerprint(random: () => number, bits: number, span = 2048): Uint8Array {
  const fp = new Uint8Array(256);
  for (let i = 0; i < bits; i++) {
    const bit = Math.floor(random() * span);
    fp[bit >> 3] = (fp[bit >> 3] ?? 0) | (1 << (bit & 7));
  }
  return fp;
}

export function randomId(random: () => number): string {
  return Math.floor(random() * 36 ** 8).toString(36).padStart(8, "0");
}
