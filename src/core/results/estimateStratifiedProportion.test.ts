import { describe, expect, it } from 'vitest';
import { estimateStratifiedMean } from './estimateStratifiedMean';
import { estimateStratifiedProportion } from './estimateStratifiedProportion';
import { stratumStats } from './stratumStats';

describe('estimateStratifiedProportion', () => {
  it('applies Cochran eq. 5.52 to the presence counts', () => {
    const e = estimateStratifiedProportion(
      [
        { stratum: 'heath', basisM2: 6e4, n: 10, present: 3 },
        { stratum: 'dune', basisM2: 4e4, n: 8, present: 6 },
      ],
      { plotAreaM2: 100 },
    );
    // By hand: p = 0.6·0.3 + 0.4·0.75 = 0.48. f = 10·100/6e4 = 1/60 and 8·100/4e4 = 1/50.
    // v = 0.36·(59/60)·0.21/9 + 0.16·(49/50)·0.1875/7.
    const v = 0.36 * (59 / 60) * (0.21 / 9) + 0.16 * (49 / 50) * (0.1875 / 7);
    expect(e.mean).toBeCloseTo(0.48, 12);
    expect(e.variance).toBeCloseTo(v, 12);
  });

  it('equals the stratified mean of the 0/1 values', () => {
    const a = [1, 0, 0, 1, 1, 0, 0];
    const b = [1, 1, 1, 0, 1];
    const p = estimateStratifiedProportion(
      [
        { stratum: 'a', basisM2: 2, n: a.length, present: 3 },
        { stratum: 'b', basisM2: 3, n: b.length, present: 4 },
      ],
      { plotAreaM2: null },
    );
    const m = estimateStratifiedMean(
      [
        { stratum: 'a', basisM2: 2, ...stratumStats(a) },
        { stratum: 'b', basisM2: 3, ...stratumStats(b) },
      ],
      { plotAreaM2: null },
    );
    expect(p.mean).toBeCloseTo(m.mean as number, 12);
    expect(p.se).toBeCloseTo(m.se as number, 12);
    expect(p.df).toBeCloseTo(m.df as number, 9);
  });

  it('keeps the CI inside 0 to 1', () => {
    const p = estimateStratifiedProportion([{ stratum: 'a', basisM2: 1, n: 3, present: 1 }], { plotAreaM2: null });
    expect((p.ci95 as [number, number])[0]).toBe(0);
  });

  it('warns that a stratum with all or none present gives a too narrow CI', () => {
    const p = estimateStratifiedProportion(
      [
        { stratum: 'a', basisM2: 1, n: 4, present: 4 },
        { stratum: 'b', basisM2: 1, n: 4, present: 2 },
      ],
      { plotAreaM2: null },
    );
    expect(p.warnings.join(' ')).toContain('none or all');
  });
});
