import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { allocateEqual } from './allocateEqual';
import { allocateLargestRemainder } from './allocateLargestRemainder';
import { allocateProportional } from './allocateProportional';

describe('allocateProportional', () => {
  it('rounds Levy & Lemeshow strata (1999, 3rd ed., pp. 176–178) of 600, 500, 400 units for n = 558 to 223, 186, 149', () => {
    // Book: n = 558.17 shared proportionally → 223, 186, 149 (docs/references.md §3).
    const r = allocateProportional(
      [
        { key: 'a', basisM2: 600 },
        { key: 'b', basisM2: 500 },
        { key: 'c', basisM2: 400 },
      ],
      558,
      0,
    );
    expect(r.plots).toEqual([223, 186, 149]);
  });

  it('applies the minimum per stratum and reallocates the rest proportionally', () => {
    // 100 plots over areas 1000, 10, 10, 1: quotas 98.0, 0.98, 0.98, 0.1 → three strata raised to 2,
    // the large one gets the 94 left (common practice, no source: worked by hand).
    const r = allocateProportional(
      [
        { key: 'big', basisM2: 1000 },
        { key: 'b', basisM2: 10 },
        { key: 'c', basisM2: 10 },
        { key: 'd', basisM2: 1 },
      ],
      100,
      2,
    );
    expect(r.plots).toEqual([94, 2, 2, 2]);
    expect(r.raisedToMinimum).toEqual([1, 2, 3]);
  });

  it('refuses a minimum that needs more plots than asked for, saying so', () => {
    expect(() => allocateProportional([1, 2, 3].map((i) => ({ key: `s${i}`, basisM2: i })), 5, 2)).toThrow(
      /minimum of 2 plots in each of 3 strata needs 6 plots, more than the 5/,
    );
  });

  it('sums to n and never leaves a stratum below the minimum, for any areas (seeded property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 1e7, noNaN: true }), { minLength: 1, maxLength: 12 }),
        fc.integer({ min: 0, max: 500 }),
        fc.integer({ min: 0, max: 3 }),
        (areas, extra, k) => {
          if (!areas.some((a) => a > 0)) areas[0] = 1;
          const n = areas.length * k + extra;
          const r = allocateProportional(
            areas.map((a, i) => ({ key: `s${i}`, basisM2: a })),
            n,
            k,
          );
          expect(r.plots.reduce((a, b) => a + b, 0)).toBe(n);
          expect(r.plots.every((p) => p >= k)).toBe(true);
          r.plots.forEach((p, i) => {
            expect(Math.abs(p - r.quotas[i])).toBeLessThan(1 + 1e-9);
          });
        },
      ),
      { numRuns: 100, seed: 20261201 },
    );
  });
});

describe('allocateLargestRemainder', () => {
  it('breaks a tie of remainders in favour of the larger exact quota, then the stratum listed first', () => {
    // Quotas 2.5, 1.5, 1.5, 0.5 for 6: floors 2,1,1,0 leave 2 plots; all remainders are .5, the larger
    // quota (2.5) wins first, then the first of the equal 1.5s (stated rule; no outside source).
    expect(allocateLargestRemainder([2.5, 1.5, 1.5, 0.5], 6)).toEqual([3, 2, 1, 0]);
  });

  it('gives the leftover plots of an equal allocation to the strata listed first', () => {
    expect(allocateEqual(['a', 'b', 'c'], 11, 0).plots).toEqual([4, 4, 3]);
  });
});
