import { describe, expect, it } from 'vitest';
import { designEffect } from './designEffect';
import { estimateStratifiedMean } from './estimateStratifiedMean';
import { stratumStats } from './stratumStats';

describe('designEffect', () => {
  it('is about 1 when the strata do not differ', () => {
    const a = [3, 5, 4, 6, 2, 4];
    const b = [4, 6, 3, 5, 2, 4];
    const e = estimateStratifiedMean(
      [
        { stratum: 'a', basisM2: 1, ...stratumStats(a) },
        { stratum: 'b', basisM2: 1, ...stratumStats(b) },
      ],
      { plotAreaM2: null },
    );
    const d = designEffect(e.variance, [...a, ...b], { plotAreaM2: null, totalBasisM2: 2 });
    // Equal strata with equal means: stratifying gains nothing, so deff is near 1 (common practice, no source).
    expect(d.deff).toBeGreaterThan(0.9);
    expect(d.deff).toBeLessThan(1.2);
  });

  it('is well below 1 when the strata separate high and low values', () => {
    const a = [1, 2, 1, 2];
    const b = [10, 11, 10, 11];
    const e = estimateStratifiedMean(
      [
        { stratum: 'a', basisM2: 1, ...stratumStats(a) },
        { stratum: 'b', basisM2: 1, ...stratumStats(b) },
      ],
      { plotAreaM2: null },
    );
    const d = designEffect(e.variance, [...a, ...b], { plotAreaM2: null, totalBasisM2: 2 });
    // By hand: v_st = 2·0.25·(1/3)/4 = 0.0417; pooled s² = 164/7 = 23.43, v_srs = 2.93; deff ≈ 0.014.
    const pooled = stratumStats([...a, ...b]).sd as number;
    expect(d.srsVariance).toBeCloseTo((pooled * pooled) / 8, 12);
    expect(d.deff).toBeCloseTo((e.variance as number) / ((pooled * pooled) / 8), 12);
    expect(d.deff).toBeLessThan(0.05);
  });

  it('applies the overall sampling fraction to the SRS variance', () => {
    const d = designEffect(1, [1, 2, 3, 4], { plotAreaM2: 10, totalBasisM2: 80 });
    // f = 4·10/80 = 0.5; s² = 5/3; v_srs = 0.5·(5/3)/4 (by hand).
    expect(d.srsVariance).toBeCloseTo((0.5 * (5 / 3)) / 4, 12);
  });

  it('is not available without a stratified variance', () => {
    expect(designEffect(null, [1, 2, 3], { plotAreaM2: null, totalBasisM2: 1 }).deff).toBeNull();
  });
});
