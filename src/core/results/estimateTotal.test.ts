import { describe, expect, it } from 'vitest';
import { estimateStratifiedMean } from './estimateStratifiedMean';
import { estimateTotal } from './estimateTotal';

describe('estimateTotal', () => {
  it('reproduces the Thompson (2012) aerial-survey total with plots of one unit of area', () => {
    // Thompson, Sampling, 3rd ed. 2012, ch. 11 (docs/references.md §3; inputs from memory, results computed): each of the
    // N_h units is given 1 m², so A_h = N_h m² and the total is Σ N_h ȳ_h = 54 496.6, SE 5 840.0.
    const N = [400, 30, 61, 18, 70, 120];
    const n = [98, 10, 37, 6, 39, 21];
    const ybar = [24.1, 25.6, 267.6, 179.0, 293.7, 33.2];
    const s2 = [5575, 4064, 347556, 22798, 123578, 9795];
    const e = estimateStratifiedMean(
      N.map((Nh, h) => ({ stratum: `S${h + 1}`, basisM2: Nh, n: n[h], mean: ybar[h], sd: Math.sqrt(s2[h]) })),
      { plotAreaM2: 1 },
    );
    const t = estimateTotal(e, { plotAreaM2: 1 });
    expect(t.total).toBeCloseTo(54496.6, 1);
    expect(t.totalSe).toBeCloseTo(5840.0, 1);
    // The Satterthwaite df of the example is 134.3 (docs/references.md §3), and t(0.975, 134.3) from the
    // tabled 1.980 at 120 df and 1.960 at ∞, interpolated in 120/ν as printed tables are read:
    // 1.960 + 0.020 · 120/134.3 = 1.9779 (docs/references.md §7; interpolation error well under 3e-4).
    expect(e.df).toBeCloseTo(134.3, 1);
    const [lo, hi] = t.total_ci95 as [number, number];
    expect(Math.abs((hi - lo) / 2 / 5840.0 - 1.9779)).toBeLessThan(3e-4);
    expect((lo + hi) / 2).toBeCloseTo(54496.6, 1);
  });

  it('turns counts per 100 m² plot into plants per ha over 12 ha', () => {
    const e = estimateStratifiedMean([{ stratum: 'a', basisM2: 120_000, n: 4, mean: 3, sd: 1 }], { plotAreaM2: 100 });
    const t = estimateTotal(e, { plotAreaM2: 100 });
    // 3 per 100 m² = 300 per ha; × 12 ha = 3 600 (by hand).
    expect(t.densityPerHa).toBeCloseTo(300, 9);
    expect(t.areaHa).toBeCloseTo(12, 12);
    expect(t.total).toBeCloseTo(3600, 9);
  });

  it('treats values as densities per ha when the plots have no area', () => {
    const e = estimateStratifiedMean([{ stratum: 'a', basisM2: 50_000, n: 4, mean: 8, sd: 2 }], { plotAreaM2: null });
    const t = estimateTotal(e, { plotAreaM2: null });
    expect(t.total).toBeCloseTo(40, 12);
    expect(t.totalSe).toBeCloseTo(5, 12);
  });

  it('passes through a missing SE as null', () => {
    const e = estimateStratifiedMean([{ stratum: 'a', basisM2: 1e4, n: 1, mean: 8, sd: null }], { plotAreaM2: null });
    const t = estimateTotal(e, { plotAreaM2: null });
    expect(t.total).toBe(8);
    expect(t.totalSe).toBeNull();
    expect(t.total_ci95).toBeNull();
  });
});
