import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';

/** A seeded source of uniform random numbers; the only kind of randomness the design engine uses. */
export interface Rng {
  /** The seed it was made from. */
  readonly seed: number;
  /** Uniform in [0, 1), 53 random bits. */
  float(): number;
  /** Uniform integer in [0, n), for 1 ≤ n ≤ 2^32, without modulo bias. */
  int(n: number): number;
}

const TWO_POW_32 = 4294967296;
const SCALE_53 = 2 ** -53;

/**
 * A generator for `seed` (any finite number; the integer part, taken modulo 2^32, is used):
 * xoroshiro128+ (Blackman & Vigna 2018) as implemented by pure-rand, with the first outputs
 * discarded so that neighbouring small seeds do not start correlated. Same seed → same sequence
 * in Node and in browsers (32-bit integer arithmetic only).
 * Throws a RangeError for a seed that is not a finite number.
 */
export function rngCreate(seed: number): Rng {
  if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${seed}`);
  const seed32 = Math.trunc(seed) % TWO_POW_32 | 0;
  const gen = xoroshiro128plus(seed32);
  for (let i = 0; i < 16; i++) gen.next();
  // 26 high bits then 27 high bits: the usual way of building a 53-bit double from 32-bit outputs.
  function uniform53(): number {
    const a = gen.next() >>> 6;
    const b = gen.next() >>> 5;
    return (a * 134217728 + b) * SCALE_53;
  }
  return {
    seed,
    float: uniform53,
    int(n: number): number {
      if (!(n >= 1 && n <= TWO_POW_32)) throw new RangeError(`int(n) needs 1 ≤ n ≤ 2^32, got ${n}`);
      const limit = TWO_POW_32 - (TWO_POW_32 % n);
      for (;;) {
        const v = gen.next() >>> 0;
        if (v < limit) return v % n;
      }
    },
  };
}

/** A seed from the clock, for when the user gave none; it is always reported so runs can be repeated. */
export function rngSeedFromClock(nowMs: number): number {
  return Math.floor(nowMs) % 2147483647;
}
