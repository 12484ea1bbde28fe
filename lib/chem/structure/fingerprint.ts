/**
 * Fingerprints as bytes.
 *
 * Bit layout (both fingerprints): bit i of the 2048 lives in byte i >> 3 under mask 1 << (i & 7), i.e. bytes in
 * bit order and least-significant bit first inside a byte. This is RDKit's own `*_as_uint8array` layout, checked
 * against the '0'/'1' string form in tests, so stored bytes can be compared with any RDKit build.
 *
 * - Morgan (circular) fingerprint, radius 2, 2048 bits: Rogers & Hahn, J. Chem. Inf. Model. 2010, 50, 742
 *   (the ECFP4-like setting). Used for Tanimoto similarity.
 * - RDKit pattern fingerprint, 2048 bits: hashed substructure patterns meant to make a substructure's bits a subset
 *   of its superstructure's. Offered for callers; the search index screens with its own fingerprint instead
 *   (lib/search/screen.ts), because RDKit's query form drops true hits for some SMARTS.
 */
import { type RDKitMol } from "./rdkit";

export const FINGERPRINT_BITS = 2048;
export const FINGERPRINT_BYTES = FINGERPRINT_BITS / 8;
const MORGAN_PARAMS = JSON.stringify({ radius: 2, nBits: FINGERPRINT_BITS });
const PATTERN_PARAMS = JSON.stringify({ nBits: FINGERPRINT_BITS });

function copy(bytes: unknown): Uint8Array {
  if (!(bytes instanceof Uint8Array) || bytes.length !== FINGERPRINT_BYTES) throw new Error("RDKit returned a fingerprint of unexpected size");
  return new Uint8Array(bytes);
}

export function morganFingerprint(mol: RDKitMol): Uint8Array {
  return copy(mol.get_morgan_fp_as_uint8array(MORGAN_PARAMS));
}

export function patternFingerprint(mol: RDKitMol): Uint8Array {
  return copy(mol.get_pattern_fp_as_uint8array(PATTERN_PARAMS));
}

export function bitIsSet(fingerprint: Uint8Array, bit: number): boolean {
  return ((fingerprint[bit >> 3] ?? 0) & (1 << (bit & 7))) !== 0;
}

const POPCOUNT_8 = Uint8Array.from({ length: 256 }, (_, b) => {
  let n = 0;
  for (let x = b; x; x >>= 1) n += x & 1;
  return n;
});

export function popcount(fingerprint: Uint8Array): number {
  let n = 0;
  for (const byte of fingerprint) n += POPCOUNT_8[byte] ?? 0;
  return n;
}

export function intersectionCount(a: Uint8Array, b: Uint8Array): number {
  let n = 0;
  for (let i = 0; i < a.length; i++) n += POPCOUNT_8[(a[i] ?? 0) & (b[i] ?? 0)] ?? 0;
  return n;
}

/**
 * Tanimoto (Jaccard) similarity |A∩B| / |A∪B| from the three counts. Two empty fingerprints score 0 (nothing in
 * common is known). Every ranking in Layerwise goes through this one expression so ties compare bit-identically.
 */
export function tanimotoFromCounts(common: number, countA: number, countB: number): number {
  const union = countA + countB - common;
  return union === 0 ? 0 : common / union;
}

export function tanimoto(a: Uint8Array, b: Uint8Array): number {
  return tanimotoFromCounts(intersectionCount(a, b), popcount(a), popcount(b));
}
