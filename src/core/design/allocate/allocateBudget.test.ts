import { describe, expect, it } from 'vitest';
import { allocateBudget } from './allocateBudget';

describe('allocateBudget', () => {
  it('gives the cost-constrained optimum of Valliant, Dever & Kreuter (2018, ch. 3) for a budget of 100 000', () => {
    // docs/references.md §3: N_h, S_h and c_h below; budget 100 000 with no fixed overhead gives
    // n_h = 30.605403, 9.728474, 19.989127, 4.499121, 13.711619, 40.340301.
    const N = [215, 65, 252, 50, 149, 144];
    const S = [26787207, 10645109, 6909676, 11085034, 9817762, 44553355];
    const c = [1400, 200, 300, 600, 450, 1000];
    const r = allocateBudget({
      keys: ['s1', 's2', 's3', 's4', 's5', 's6'],
      weights: N.map((n, i) => (n * S[i]) / Math.sqrt(c[i])),
      costPerPlot: c,
      total: 100_000,
      overhead: 0,
      minPerStratum: 0,
    });
    const book = [30.605403, 9.728474, 19.989127, 4.499121, 13.711619, 40.340301];
    r.quotas.forEach((q, i) => {
      expect(q).toBeCloseTo(book[i], 5);
    });
    // Their sum, n = 118.874045 (computed from the book's n_h).
    expect(r.formulaN).toBeCloseTo(118.874045, 5);
    // Whole plots, by hand: 118 × the shares = 30.380, 9.657, 19.842, 4.466, 13.611, 40.044; floors
    // 30, 9, 19, 4, 13, 40 (115) and the three largest remainders (s3, s2, s5) get one more:
    // 30, 10, 20, 4, 14, 40, costing 42 000 + 2 000 + 6 000 + 2 400 + 6 300 + 40 000 = 98 700.
    // 119 plots round to 31, 10, 20, 4, 14, 40 and cost 100 100, over the budget.
    expect(r.n).toBe(118);
    expect(r.plots).toEqual([30, 10, 20, 4, 14, 40]);
    expect(r.plotsCost).toBe(98_700);
  });

  it('takes the fixed overhead off the budget first and finds the largest whole design (a hand example)', () => {
    // Invented strata: W = 0.5, 0.3, 0.2; S = 10, 20, 5; c = 4, 9, 1; C = 1000, c0 = 200.
    // Cochran 1977 §5.5: n_h = (C − c0) W_h S_h/√c_h / Σ W S √c. W S/√c = 2.5, 2, 1 (sum 5.5);
    // Σ W S √c = 10 + 18 + 1 = 29; n = 800 · 5.5 / 29 = 151.724; n_h = 68.966, 55.172, 27.586 (cost 800).
    // Whole designs by largest remainder: 152 → 69, 55, 28 costs 276 + 495 + 28 = 799 ≤ 800;
    // 153 → 69, 56, 28 costs 808 > 800, as do 154 (70, 56, 28: 812) and 155 (71, 56, 28: 816).
    const r = allocateBudget({ keys: ['a', 'b', 'c'], weights: [2.5, 2, 1], costPerPlot: [4, 9, 1], total: 1000, overhead: 200, minPerStratum: 2 });
    expect(r.formulaN).toBeCloseTo(151.7241379, 6);
    r.quotas.forEach((q, i) => {
      expect(q).toBeCloseTo([68.9655172, 55.1724138, 27.5862069][i], 6);
    });
    expect(r.n).toBe(152);
    expect(r.plots).toEqual([69, 55, 28]);
    expect(r.plotsCost).toBe(799);
  });

  it('says what is wrong with a budget that cannot work', () => {
    const base = { keys: ['a', 'b'], weights: [1, 1], costPerPlot: [10, 10], total: 100, overhead: 0, minPerStratum: 2 };
    expect(() => allocateBudget({ ...base, overhead: 100 })).toThrow('the fixed overhead 100 leaves nothing of the budget 100 for plots');
    expect(() => allocateBudget({ ...base, total: 30 })).toThrow(/cannot pay for 2 plots in each stratum: they cost 40/);
    expect(() => allocateBudget({ ...base, costPerPlot: [10, 0] })).toThrow('the cost per plot of stratum "b" must be a number > 0, got 0');
  });
});
