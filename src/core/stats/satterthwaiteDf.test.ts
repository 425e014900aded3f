import { describe, expect, it } from 'vitest';
import { satterthwaiteDf } from './satterthwaiteDf';

describe('satterthwaiteDf', () => {
  it('reproduces the Thompson (2012) aerial-survey df of 134.3', () => {
    // Thompson, Sampling, 3rd ed. 2012, ch. 11 (docs/references.md §3): inputs from memory, df computed.
    const N = [400, 30, 61, 18, 70, 120];
    const n = [98, 10, 37, 6, 39, 21];
    const s2 = [5575, 4064, 347556, 22798, 123578, 9795];
    const terms = N.map((Nh, h) => ({ coefficient: (Nh * (Nh - n[h])) / n[h], variance: s2[h], n: n[h] }));
    expect(satterthwaiteDf(terms)).toBeCloseTo(134.3, 1);
  });

  it('gives n − 1 for a single stratum', () => {
    expect(satterthwaiteDf([{ coefficient: 0.3, variance: 12, n: 9 }])).toBeCloseTo(8, 12);
  });

  it('gives the pooled df when equal strata have equal variances', () => {
    // Two identical terms: (2x)²/(2x²/(n−1)) = 2(n − 1) (algebra, no source needed).
    const t = { coefficient: 1, variance: 4, n: 6 };
    expect(satterthwaiteDf([t, t])).toBeCloseTo(10, 12);
  });

  it('keeps its value for variances so small or so large that their squares would under- or overflow', () => {
    // The ratio is scale-free (algebra, no source needed): the pooled case above, scaled by 1e-320 and 1e300.
    for (const variance of [4e-320, 4e300]) {
      const t = { coefficient: 1, variance, n: 6 };
      expect(satterthwaiteDf([t, t])).toBeCloseTo(10, 9);
    }
  });

  it('returns null when every variance is zero', () => {
    expect(satterthwaiteDf([{ coefficient: 1, variance: 0, n: 5 }])).toBeNull();
  });

  it('refuses a term from a single observation', () => {
    expect(() => satterthwaiteDf([{ coefficient: 1, variance: 3, n: 1 }])).toThrow(RangeError);
  });
});
