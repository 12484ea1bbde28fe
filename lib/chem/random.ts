/**
 * Seeded pseudo-random numbers for Monte Carlo: the same seed gives the same draws on the
 * server, in the browser and in tests, so an uncertainty interval can be reproduced exactly.
 *
 * Generator: xoshiro128** (Blackman & Vigna, "Scrambled linear pseudorandom number generators",
 * ACM TOMS 47 (2021) 36), 128-bit state, period 2^128 − 1, seeded through splitmix32 so that
 * neighbouring seeds give unrelated streams. Normals by the Box–Muller transform
 * (Box & Muller, Ann. Math. Stat. 29 (1958) 610).
 */

export interface Rng {
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Standard normal N(0, 1). */
  normal(): number;
  /** The seed the stream started from. */
  readonly seed: number;
}

function splitmix32(state: number): () => number {
  let s = state >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

const rotl = (x: number, k: number): number => ((x << k) | (x >>> (32 - k))) >>> 0;

/** A new stream for an integer seed (taken modulo 2^32). */
export function createRng(seed: number): Rng {
  if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${seed}`);
  const seeder = splitmix32(Math.trunc(seed));
  let a = seeder();
  let b = seeder();
  let c = seeder();
  let d = seeder();
  if ((a | b | c | d) === 0) a = 1;

  const nextUint32 = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
    const t = (b << 9) >>> 0;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result;
  };

  let spareNormal: number | null = null;
  const uniform = (): number => nextUint32() / 4294967296;

  return {
    seed: Math.trunc(seed) >>> 0,
    uniform,
    normal(): number {
      if (spareNormal !== null) {
        const z = spareNormal;
        spareNormal = null;
        return z;
      }
      // 1 − u keeps the logarithm's argument in (0, 1].
      const radius = Math.sqrt(-2 * Math.log(1 - uniform()));
      const angle = 2 * Math.PI * uniform();
      spareNormal = radius * Math.sin(angle);
      return radius * Math.cos(angle);
    },
  };
}
