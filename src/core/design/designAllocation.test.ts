import { describe, expect, it } from 'vitest';
import { designAllocation } from './designAllocation';
import { designSettingsDefault } from './designSettingsDefault';

// Valliant, Dever & Kreuter 2018, ch. 3 (docs/references.md §3), with N_h standing in for the areas.
const N = [215, 65, 252, 50, 149, 144];
const S = [26787207, 10645109, 6909676, 11085034, 9817762, 44553355];
const C = [1400, 200, 300, 600, 450, 1000];
const keys = ['s1', 's2', 's3', 's4', 's5', 's6'];
const strata = keys.map((key, i) => ({ key, basisM2: N[i] }));
const sd = Object.fromEntries(keys.map((k, i) => [k, S[i]]));
const cost = Object.fromEntries(keys.map((k, i) => [k, C[i]]));

describe('designAllocation', () => {
  it('sizes a Neyman design with costs by the budget as the book’s cost-constrained optimum', () => {
    const r = designAllocation(strata, designSettingsDefault({ allocation: 'neyman', sd, cost, budget: { total: 100_000, overhead: 0 }, minPerStratum: 0 }));
    expect(r.allocation.quotas.map((q) => Number(q.toFixed(6)))).toEqual([30.605403, 9.728474, 19.989127, 4.499121, 13.711619, 40.340301]);
    expect(r.allocation.plots).toEqual([30, 10, 20, 4, 14, 40]);
    expect(r.budget).toEqual({ total: 100_000, overhead: 0, plotsCost: 98_700, formulaN: expect.closeTo(118.874045, 5) });
    expect(r.statements[0]).toContain('the cost-optimum n_h ∝ W_h S_h/√c_h (Cochran 1977 §5.5) gives 118.87 plots in real numbers, and 118 whole plots cost 98700');
  });

  it('states the expected half-width at the chosen n when every stratum has a pilot SD', () => {
    // Two invented strata, W = 0.6, 0.4, S = 10 and 20, 10 plots proportional → 6 and 4 (point plots).
    // By hand: v = 0.36·100/6 + 0.16·400/4 = 6 + 16 = 22; ν = 22² / (6²/5 + 16²/3) = 484 / 92.5333 = 5.2305;
    // t(0.975, 5.2305) lies between the tabled 2.571 (5 df) and 2.447 (6 df), so the half-width is
    // between 2.447·√22 = 11.48 and 2.571·√22 = 12.06.
    const r = designAllocation(
      [
        { key: 'a', basisM2: 6 },
        { key: 'b', basisM2: 4 },
      ],
      designSettingsDefault({ plots: 10, sd: { a: 10, b: 20 }, minPerStratum: 0 }),
    );
    expect(r.allocation.plots).toEqual([6, 4]);
    expect(r.precision?.n).toBe(10);
    expect(r.precision?.df).toBeCloseTo(5.2305, 4);
    expect(r.precision?.halfwidth).toBeGreaterThan(11.48);
    expect(r.precision?.halfwidth).toBeLessThan(12.06);
    expect(r.precision?.halfwidthNormal).toBeCloseTo(1.959964 * Math.sqrt(22), 5);
    expect(r.statements.join(' ')).toMatch(/^Expected precision at n = 10 from the pilot SDs: a 95 % CI half-width of 11\.\d+ \(t\(0\.975\) on 5\.2 Satterthwaite df/);
  });
});
