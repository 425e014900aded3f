import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import type { RngVersion } from '../../model/designTypes';
import { fnv1a64, splitmix64, uint64Of } from './splitmix64';

/** A seeded source of uniform random numbers; the only kind of randomness the design engine uses. */
export interface Rng {
  /** The seed it was made from. */
  readonly seed: number;
  /** Uniform in [0, 1), 53 random bits. */
  float(): number;
  /** Uniform integer in [0, n), for 1 ≤ n ≤ 2^32, without modulo bias. */
  int(n: number): number;
}


/** The generator version new designs use. */
export const RNG_VERSION_CURRENT: RngVersion = 3;

const TWO_POW_32 = 4294967296;
const SCALE_53 = 2 ** -53;

function seedCheck(seed: number): void {
  if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${seed}`);
}

function intFrom(next32: () => number, n: number): number {
  if (!(n >= 1 && n <= TWO_POW_32)) throw new RangeError(`int(n) needs 1 ≤ n ≤ 2^32, got ${n}`);
  const limit = TWO_POW_32 - (TWO_POW_32 % n);
  for (;;) {
    const v = next32();
    if (v < limit) return v % n;
  }
}

/**
 * The version-1 generator for `seed` (the integer part, modulo 2^32): xoroshiro128+ (Blackman &
 * Vigna 2018) as pure-rand seeds it — a state that is nearly the seed itself — with 16 outputs
 * discarded, drawing the low 32 bits of each output. Kept only so that designs made before
 * generator version 2 can be made again exactly; its k-th draw is visibly correlated across
 * neighbouring seeds, so new designs never use it.
 * Throws a RangeError for a seed that is not a finite number.
 */
export function rngCreateLegacy(seed: number): Rng {
  seedCheck(seed);
  const seed32 = Math.trunc(seed) % TWO_POW_32 | 0;
  const gen = xoroshiro128plus(seed32);
  for (let i = 0; i < 16; i++) gen.next();
  // 26 high bits then 27 high bits of two 32-bit outputs make a 53-bit double.
  function uniform53(): number {
    const a = gen.next() >>> 6;
    const b = gen.next() >>> 5;
    return (a * 134217728 + b) * SCALE_53;
  }
  return { seed, float: uniform53, int: (n) => intFrom(() => gen.next() >>> 0, n) };
}

/** xoroshiro128+ on 32-bit halves: `next()` advances and leaves the 64-bit output in `hi` and `lo` (unsigned). */
export interface Xoroshiro128Plus {
  next(): void;
  hi: number;
  lo: number;
}

/**
 * xoroshiro128+ (Blackman & Vigna, "Scrambled linear pseudorandom number generators", 2018; the
 * constants a = 24, b = 16, c = 37) from a full 128-bit state given as four 32-bit halves, in 32-bit
 * integer arithmetic so Node and every browser give the same numbers.
 */
export function xoroshiro128PlusFromHalves(s0h: number, s0l: number, s1h: number, s1l: number): Xoroshiro128Plus {
  const g: Xoroshiro128Plus = {
    hi: 0,
    lo: 0,
    next(): void {
      g.lo = (s0l + s1l) >>> 0;
      g.hi = (s0h + s1h + (g.lo < s0l >>> 0 ? 1 : 0)) >>> 0;
      const th = s1h ^ s0h;
      const tl = s1l ^ s0l;
      // s0 = rotl(s0, 24) ^ t ^ (t << 16)
      const rh = (s0h << 24) | (s0l >>> 8);
      const rl = (s0l << 24) | (s0h >>> 8);
      s0h = rh ^ th ^ ((th << 16) | (tl >>> 16));
      s0l = rl ^ tl ^ (tl << 16);
      // s1 = rotl(t, 37): swap the halves, then turn left by 5
      s1h = (tl << 5) | (th >>> 27);
      s1l = (th << 5) | (tl >>> 27);
    },
  };
  return g;
}

/** Floats from the top 53 bits of each output, integers from its top 32: the low bits of xoroshiro128+ are its weak ones (Blackman & Vigna 2018). */
function rngFromXoroshiro(seed: number, g: Xoroshiro128Plus): Rng {
  return {
    seed,
    float(): number {
      g.next();
      return (g.hi * 2097152 + (g.lo >>> 11)) * SCALE_53;
    },
    int: (n) =>
      intFrom(() => {
        g.next();
        return g.hi;
      }, n),
  };
}

/** The seed as a 64-bit integer: its integer part, wrapped modulo 2^64 (so −1 and 2^64 − 1 agree). */
function seed64Of(seed: number): bigint {
  return uint64Of(BigInt(Math.trunc(seed)));
}

/**
 * A version-2 generator for one named stream of a seed: the seed's integer part (modulo 2^64) is
 * mixed by splitmix64, the stream's name and index are folded in (FNV-1a), and splitmix64 from that
 * key fills xoroshiro128+'s whole 128-bit state. The same seed, name and index always give the same
 * sequence; neighbouring seeds, and different streams of one seed, give sequences with no visible
 * relation (tested over consecutive seeds in rng.test.ts).
 * Source: Steele, Lea & Flood 2014 (splitmix64); Blackman & Vigna 2018 (xoroshiro128+ and the advice
 * to seed it with splitmix64).
 * Throws a RangeError for a seed that is not a finite number.
 */
export function rngStream(seed: number, name: string, index = 0): Rng {
  seedCheck(seed);
  const key = splitmix64(seed64Of(seed))() ^ fnv1a64(`${name}#${index}`);
  const fill = splitmix64(key);
  const a = fill();
  let b = fill();
  if (a === 0n && b === 0n) b = 1n; // the one state xoroshiro cannot leave; never met in practice
  const half = (v: bigint, shift: bigint) => Number((v >> shift) & 0xffffffffn) | 0;
  return rngFromXoroshiro(seed, xoroshiro128PlusFromHalves(half(a, 32n), half(a, 0n), half(b, 32n), half(b, 0n)));
}

/** The current generator for `seed`, its main stream (see {@link rngStream}); for tools and tests that need one sequence. */
export function rngCreate(seed: number): Rng {
  return rngStream(seed, 'main');
}

/** A seed from the clock, for when the user gave none; it is always reported so runs can be repeated. */
export function rngSeedFromClock(nowMs: number): number {
  return Math.floor(nowMs) % 2147483647;
}
