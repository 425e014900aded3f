import { xoroshiro128plusFromState } from 'pure-rand/generator/xoroshiro128plus';
import { jStat } from 'jstat';
import { describe, expect, it } from 'vitest';
import { type Rng, rngCreate, rngCreateLegacy, rngStream, xoroshiro128PlusFromHalves } from './rng';
import { rngStreams, rngVersionOf } from './rngStreams';
import { splitmix64 } from './splitmix64';

// Critical values used below (docs/references.md §7): chi-square upper 0.001 point for 19 df is
// 43.82 (standard tables); |r| of n independent pairs exceeds 3.291/√n with probability 0.001
// (normal approximation to the null distribution of r, z(0.9995) = 3.291, standard tables).
const CHI2_19DF_P001 = 43.82;
const Z_09995 = 3.291;

/** The k-th float (1-based) of each seed 1..n+1 under `make`. */
function drawsAcrossSeeds(make: (seed: number) => Rng, n: number, kMax: number): Float64Array[] {
  const byK = Array.from({ length: kMax }, () => new Float64Array(n + 1));
  for (let seed = 1; seed <= n + 1; seed++) {
    const r = make(seed);
    for (let k = 0; k < kMax; k++) byK[k][seed - 1] = r.float();
  }
  return byK;
}

/** Chi-square of 20 equal bins over the first n values, and the correlation of value s with value s+1. */
function crossSeedStats(values: Float64Array, n: number): { chi2: number; r: number } {
  const bins = new Array(20).fill(0);
  for (let i = 0; i < n; i++) bins[Math.floor(values[i] * 20)]++;
  const e = n / 20;
  const chi2 = bins.reduce((a, c) => a + (c - e) ** 2 / e, 0);
  const r = jStat.corrcoeff(Array.from(values.subarray(0, n)), Array.from(values.subarray(1, n + 1)));
  return { chi2, r };
}

describe('splitmix64', () => {
  it('gives the first five outputs for state 1234567 listed by the Rosetta Code task "Pseudo-random numbers/Splitmix64"', () => {
    const next = splitmix64(1234567n);
    expect([next(), next(), next(), next(), next()]).toEqual([
      6457827717110365317n,
      3203168211198807973n,
      9817491932198370423n,
      4593380528125082431n,
      16408922859458223821n,
    ]);
  });
});

describe('xoroshiro128PlusFromHalves', () => {
  it('agrees with pure-rand 8.4.2 (low 32 bits) and a 64-bit BigInt port of Blackman & Vigna (2018) over 20 000 outputs', () => {
    const state = [0x12345678 | 0, 0x9abcdef0 | 0, 0xdeadbeef | 0, 0x01234567];
    const reference = xoroshiro128plusFromState(state);
    const g = xoroshiro128PlusFromHalves(state[0], state[1], state[2], state[3]);
    const mask = (1n << 64n) - 1n;
    const rotl = (x: bigint, k: bigint) => ((x << k) | (x >> (64n - k))) & mask;
    let s0 = (BigInt(state[0] >>> 0) << 32n) | BigInt(state[1] >>> 0);
    let s1 = (BigInt(state[2] >>> 0) << 32n) | BigInt(state[3] >>> 0);
    let lowMismatch = 0;
    let fullMismatch = 0;
    for (let i = 0; i < 20000; i++) {
      const out = (s0 + s1) & mask;
      const t = s1 ^ s0;
      s0 = rotl(s0, 24n) ^ t ^ ((t << 16n) & mask);
      s1 = rotl(t, 37n);
      g.next();
      if (reference.next() >>> 0 !== g.lo) lowMismatch++;
      if (((BigInt(g.hi) << 32n) | BigInt(g.lo)) !== out) fullMismatch++;
    }
    expect(lowMismatch).toBe(0);
    expect(fullMismatch).toBe(0);
  });
});

describe('rngStream', () => {
  it('repeats its sequence for the same seed, name and index', () => {
    const a = Array.from({ length: 8 }, ((r) => () => r.float())(rngStream(123, 'random', 2)));
    const b = Array.from({ length: 8 }, ((r) => () => r.float())(rngStream(123, 'random', 2)));
    expect(b).toEqual(a);
  });

  it('keeps the k-th draw uniform over seeds 1–2000 and unrelated to the next seed’s, for several k', () => {
    // The design engine's first stratum stream and the main stream, at draws 1, 2, 3, 10, 50 and 100.
    for (const make of [(s: number) => rngStream(s, 'random', 0), (s: number) => rngCreate(s)]) {
      const n = 2000;
      const byK = drawsAcrossSeeds(make, n, 100);
      for (const k of [1, 2, 3, 10, 50, 100]) {
        const { chi2, r } = crossSeedStats(byK[k - 1], n);
        expect(chi2, `draw ${k}`).toBeLessThan(CHI2_19DF_P001);
        expect(Math.abs(r), `draw ${k}`).toBeLessThan(Z_09995 / Math.sqrt(n));
      }
    }
  });

  it('gives strata of one seed unrelated streams: draw k of stratum h against draw k of stratum h + 1', () => {
    const n = 2000;
    for (const k of [1, 5, 20]) {
      const a: number[] = [];
      const b: number[] = [];
      for (let seed = 1; seed <= n; seed++) {
        const s0 = rngStream(seed, 'random', 0);
        const s1 = rngStream(seed, 'random', 1);
        for (let i = 1; i < k; i++) {
          s0.float();
          s1.float();
        }
        a.push(s0.float());
        b.push(s1.float());
      }
      expect(Math.abs(jStat.corrcoeff(a, b)), `draw ${k}`).toBeLessThan(Z_09995 / Math.sqrt(n));
    }
  });

  it('gives floats in [0, 1) with mean near 1/2 and integers without bias over 3 values (common practice, no source)', () => {
    const r = rngStream(7, 'main');
    let sum = 0;
    let min = 1;
    let max = 0;
    const counts = [0, 0, 0];
    for (let i = 0; i < 30000; i++) {
      const f = r.float();
      min = Math.min(min, f);
      max = Math.max(max, f);
      sum += f;
      counts[r.int(3)]++;
    }
    expect(min).toBeGreaterThanOrEqual(0);
    expect(max).toBeLessThan(1);
    expect(Math.abs(sum / 30000 - 0.5)).toBeLessThan(0.01);
    // Chi-square with 2 df, upper 0.001 critical value 13.82 (standard tables, docs/references.md §7).
    const chi = counts.reduce((a, c) => a + (c - 10000) ** 2 / 10000, 0);
    expect(chi).toBeLessThan(13.82);
  });

  it('refuses a seed that is not a finite number', () => {
    expect(() => rngStream(Number.NaN, 'main')).toThrow(RangeError);
  });
});

describe('rngCreateLegacy', () => {
  it('still makes version-1 sequences, whose draws across neighbouring seeds fail the same test', () => {
    // Why version 1 is kept only to remake old designs: over seeds 1–2000 the draws of consecutive
    // seeds are strongly correlated at most draw positions (measured: 134 of the first 200 positions
    // beyond the 0.001 bound, |r| up to 0.52).
    const n = 2000;
    const byK = drawsAcrossSeeds(rngCreateLegacy, n, 10);
    const failing = byK.filter((v) => Math.abs(crossSeedStats(v, n).r) >= Z_09995 / Math.sqrt(n)).length;
    expect(failing).toBeGreaterThanOrEqual(5);
  });
});

describe('rngStreams', () => {
  it('hands out one shared generator under version 1, in the order it is asked, as designs before version 2 drew', () => {
    const v1 = rngStreams(42, 1);
    const legacy = rngCreateLegacy(42);
    const drawn = [v1.stream('random', 0).float(), v1.stream('random', 3).float(), v1.stream('grid-origin').float()];
    expect(drawn).toEqual([legacy.float(), legacy.float(), legacy.float()]);
  });

  it('gives each purpose and stratum its own stream under version 2', () => {
    const v2 = rngStreams(42, 2);
    expect(v2.stream('random', 0).float()).toBe(rngStream(42, 'random', 0).float());
    expect(v2.stream('random', 1).float()).not.toBe(v2.stream('random', 0).float());
    expect(v2.stream('balanced', 0).float()).not.toBe(v2.stream('random', 0).float());
  });

  it('reads a missing version as 1, the streams of designs saved before versions were recorded', () => {
    expect(rngVersionOf({})).toBe(1);
    expect(rngVersionOf({ rngVersion: 2 })).toBe(2);
  });
});
