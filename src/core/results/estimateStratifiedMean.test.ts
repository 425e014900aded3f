import { describe, expect, it } from 'vitest';
import { estimateStratifiedMean, type StratumSummary } from './estimateStratifiedMean';
import { stratumStats } from './stratumStats';

// Thompson, Sampling, 3rd ed., Wiley 2012, ch. 11, aerial survey (docs/references.md §3): inputs from
// memory (M), results computed from the formulas (C). N_h plays the role of the basis area with a
// plot "area" of 1, so W_h = N_h/N and f_h = n_h/N_h, as in an areal design.
const N = [400, 30, 61, 18, 70, 120];
const n = [98, 10, 37, 6, 39, 21];
const ybar = [24.1, 25.6, 267.6, 179.0, 293.7, 33.2];
const s2 = [5575, 4064, 347556, 22798, 123578, 9795];
const thompson: StratumSummary[] = N.map((Nh, h) => ({
  stratum: `S${h + 1}`,
  basisM2: Nh,
  n: n[h],
  mean: ybar[h],
  sd: Math.sqrt(s2[h]),
}));

describe('estimateStratifiedMean', () => {
  it('reproduces the Thompson (2012) stratified total, variance and df', () => {
    const e = estimateStratifiedMean(thompson, { plotAreaM2: 1 });
    const Ntot = 699;
    // Expected τ̂ = 54 496.6, v = 34 105 732.4, SE 5 840.0, df 134.3 (docs/references.md §3).
    expect((e.mean as number) * Ntot).toBeCloseTo(54496.6, 1);
    expect((e.variance as number) * Ntot * Ntot).toBeCloseTo(34105732.4, 0);
    expect((e.se as number) * Ntot).toBeCloseTo(5840.0, 1);
    expect(e.df).toBeCloseTo(134.3, 1);
    expect(e.warnings).toEqual([]);
  });

  it('reproduces the television-viewing example of Scheaffer, Mendenhall & Ott from the raw data', () => {
    // Scheaffer, Mendenhall & Ott, Elementary Survey Sampling, Example 5.1 (edition and example number
    // from memory): N_h = 155, 62, 93 households, n_h = 20, 8, 12 (this stratum structure is also set
    // out on https://studylib.net/doc/5858608 and gauthmath.com solution 1813514338091045). Raw hours
    // and the printed results (stratum means 33.900, 25.125, 19.000; s² 35.358, 232.411, 87.636;
    // ȳ_st = 27.675, v = 1.97, bound 2√v = 2.81) are from memory; the raw data reproduce every
    // remembered summary, which is the check that the memory is right.
    const hours = [
      [35, 43, 36, 39, 28, 28, 29, 25, 38, 27, 26, 32, 29, 40, 35, 41, 37, 31, 45, 34],
      [27, 15, 4, 41, 49, 25, 10, 30],
      [8, 14, 12, 15, 30, 32, 21, 20, 34, 7, 11, 24],
    ];
    const sizes = [155, 62, 93];
    const strata = hours.map((v, h) => ({ stratum: ['town A', 'town B', 'rural'][h], basisM2: sizes[h], ...stratumStats(v) }));
    expect(strata.map((x) => ((x.sd as number) ** 2).toFixed(3))).toEqual(['35.358', '232.411', '87.636']);
    const e = estimateStratifiedMean(strata, { plotAreaM2: 1 });
    expect(e.mean).toBeCloseTo(27.675, 3);
    expect(e.variance).toBeCloseTo(1.97, 2);
    expect(2 * (e.se as number)).toBeCloseTo(2.81, 2);
  });

  it('uses weights from the areas and no fpc for point plots', () => {
    const e = estimateStratifiedMean(
      [
        { stratum: 'a', basisM2: 3e4, n: 4, mean: 10, sd: 2 },
        { stratum: 'b', basisM2: 1e4, n: 4, mean: 20, sd: 4 },
      ],
      { plotAreaM2: null },
    );
    // By hand: ȳ = 0.75·10 + 0.25·20 = 12.5; v = 0.5625·4/4 + 0.0625·16/4 = 0.8125.
    expect(e.mean).toBeCloseTo(12.5, 12);
    expect(e.variance).toBeCloseTo(0.8125, 12);
    expect(e.strata.map((r) => r.samplingFraction)).toEqual([0, 0]);
    // df = 0.8125² / (0.5625²/3 + 0.25²/3) = 5.216 (by hand), so the multiplier lies between the
    // tabled t(0.975, 5) = 2.571 and t(0.975, 10) = 2.228 (docs/references.md §7).
    expect(e.df).toBeCloseTo(0.66015625 / (0.31640625 / 3 + 0.0625 / 3), 10);
    const half = (e.ci95 as [number, number])[1] - 12.5;
    const multiplier = half / Math.sqrt(0.8125);
    expect(multiplier).toBeLessThan(2.571);
    expect(multiplier).toBeGreaterThan(2.228);
  });

  it('reports no SE for a stratum with one observation, but still the mean', () => {
    const e = estimateStratifiedMean(
      [
        { stratum: 'a', basisM2: 1, n: 5, mean: 1, sd: 1 },
        { stratum: 'Wet flat', basisM2: 1, n: 1, mean: 3, sd: null },
      ],
      { plotAreaM2: null },
    );
    expect(e.mean).toBeCloseTo(2, 12);
    expect(e.se).toBeNull();
    expect(e.ci95).toBeNull();
    expect(e.warnings[0]).toContain('only one observation in stratum "Wet flat"');
  });

  it('reports no mean when a stratum has no observation', () => {
    const e = estimateStratifiedMean(
      [
        { stratum: 'a', basisM2: 1, n: 5, mean: 1, sd: 1 },
        { stratum: 'b', basisM2: 1, n: 0, mean: null, sd: null },
      ],
      { plotAreaM2: null },
    );
    expect(e.mean).toBeNull();
    expect(e.warnings[0]).toContain('no observations in stratum "b"');
  });

  it('gives a zero-width CI and no df when every value is the same', () => {
    const e = estimateStratifiedMean([{ stratum: 'a', basisM2: 1, n: 3, mean: 4, sd: 0 }], { plotAreaM2: null });
    expect(e.se).toBe(0);
    expect(e.df).toBeNull();
    expect(e.ci95).toEqual([4, 4]);
  });
});
