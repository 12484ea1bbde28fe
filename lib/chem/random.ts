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
  /** Fills `out` with the next out.length standard normals, the numbers normal() would return one by one (a
   * Monte-Carlo draw takes them so, with no number boxed on its way out of a call). */
  normals(out: Float64Array): void;
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
  // The state lives in typed arrays: a closure's number variables outside the small-integer range are boxed on
  // every update, and a Monte-Carlo run draws tens of thousands of numbers. The bits are those of a, b, c, d.
  const s = new Int32Array(4);
  s[0] = seeder();
  s[1] = seeder();
  s[2] = seeder();
  s[3] = seeder();
  if ((s[0] | s[1] | s[2] | s[3]) === 0) s[0] = 1;

  const nextUint32 = (): number => {
    const b = s[1] as number;
    const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
    const t = (b << 9) >>> 0;
    const c = (s[2] as number) ^ (s[0] as number);
    const d = (s[3] as number) ^ b;
    const b2 = b ^ c;
    s[0] = (s[0] as number) ^ d;
    s[1] = b2;
    s[2] = c ^ t;
    s[3] = rotl(d, 11);
    return result;
  };

  const spare = new Float64Array(1);
  let hasSpare = false;
  const uniform = (): number => nextUint32() / 4294967296;

  const normal = (): number => {
    if (hasSpare) {
      hasSpare = false;
      return spare[0] as number;
    }
    // 1 − u keeps the logarithm's argument in (0, 1].
    const radius = Math.sqrt(-2 * Math.log(1 - uniform()));
    const angle = 2 * Math.PI * uniform();
    spare[0] = radius * Math.sin(angle);
    hasSpare = true;
    return radius * Math.cos(angle);
  };

  return {
    seed: Math.trunc(seed) >>> 0,
    uniform,
    normal,
    normals(out: Float64Array): void {
      for (let i = 0; i < out.length; i++) out[i] = normal();
    },
  };
}
