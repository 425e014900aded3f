import { describe, expect, it } from 'vitest';
import { stratumStats } from './stratumStats';

describe('stratumStats', () => {
  it('matches a hand-checked small sample', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, Σ(y − ȳ)² = 32, s² = 32/7 (worked by hand, no source needed).
    const s = stratumStats([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(s.n).toBe(8);
    expect(s.mean).toBeCloseTo(5, 12);
    expect(s.sd).toBeCloseTo(Math.sqrt(32 / 7), 12);
    expect(s.se).toBeCloseTo(Math.sqrt(32 / 7) / Math.sqrt(8), 12);
  });

  it('keeps precision for large values with a small spread', () => {
    const s = stratumStats([1e9 + 4, 1e9 + 7, 1e9 + 13, 1e9 + 16]);
    // Same spread as 4, 7, 13, 16: s² = 30 (by hand).
    expect(s.sd).toBeCloseTo(Math.sqrt(30), 6);
  });

  it('gives a mean but no spread for a single value', () => {
    expect(stratumStats([3.5])).toEqual({ n: 1, mean: 3.5, sd: null, se: null });
  });

  it('gives nothing for an empty stratum', () => {
    expect(stratumStats([])).toEqual({ n: 0, mean: null, sd: null, se: null });
  });

  it('refuses values that are not finite', () => {
    expect(() => stratumStats([1, Number.NaN])).toThrow(RangeError);
  });
});
