import { describe, expect, it } from 'vitest';
import { tQuantile, tQuantile95 } from './tQuantile';

describe('tQuantile', () => {
  // Student t 0.975 quantiles, standard tables (docs/references.md §7), printed to 3 decimals.
  it.each([
    [1, 12.706],
    [5, 2.571],
    [10, 2.228],
    [30, 2.042],
    [Number.POSITIVE_INFINITY, 1.96],
  ])('matches the printed table at %s df', (df, expected) => {
    expect(tQuantile95(df)).toBeCloseTo(expected, 3);
  });

  it('is symmetric about zero', () => {
    expect(tQuantile(0.025, 7)).toBeCloseTo(-tQuantile(0.975, 7), 9);
  });

  it('joins the normal quantile smoothly at very large df', () => {
    // Normal 0.975 quantile 1.959963985 (standard tables).
    expect(tQuantile95(1e6)).toBeCloseTo(1.959966, 5);
    expect(tQuantile95(1e8)).toBeCloseTo(1.959964, 6);
  });

  it('rejects probabilities and df outside the domain', () => {
    expect(() => tQuantile(1, 5)).toThrow(RangeError);
    expect(() => tQuantile(0.5, 0)).toThrow(RangeError);
  });
});
