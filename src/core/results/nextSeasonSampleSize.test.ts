import { describe, expect, it } from 'vitest';
import { nextSeasonSampleSize } from './nextSeasonSampleSize';

describe('nextSeasonSampleSize', () => {
  it('reproduces the Levy & Lemeshow (1999) proportional sample size', () => {
    // Levy & Lemeshow, Sampling of Populations, 3rd ed. 1999, pp. 176–178 (docs/references.md §3):
    // N_h 600, 500, 400; means 0.164, 0.166, 0.236; variances 0.245, 0.296, 0.436; ε = 0.20, 95 %
    // → n = 558.17 → 223, 186, 149. The units are plots of 1 m², so N_h = A_h.
    const N = [600, 500, 400];
    const means = [0.164, 0.166, 0.236];
    const variances = [0.245, 0.296, 0.436];
    const mean = (N[0] * means[0] + N[1] * means[1] + N[2] * means[2]) / 1500;
    const r = nextSeasonSampleSize(
      N.map((Nh, h) => ({ stratum: `S${h + 1}`, basisM2: Nh, sd: Math.sqrt(variances[h]) })),
      { target: { value: 0.2, relative: true }, observedMean: mean, plotAreaM2: 1 },
    );
    expect(r.proportional.formulaN).toBeCloseTo(558.17, 1);
    // The book sizes in the normal approximation and rounds to 558 (223, 186, 149). The sizes here are
    // for the t interval the estimate will report (Satterthwaite ν ≈ 524, t = 1.9645): 560 plots,
    // worked out in sampleSizeForTarget.test.ts.
    expect(r.proportional.n).toBe(560);
    expect(r.proportional.plots.map((p) => p.plots)).toEqual([224, 187, 149]);
    expect(r.targetHalfwidth).toBeCloseTo(0.2 * mean, 12);
    expect(r.fpcApplied).toBe(true);
  });

  it('needs no more plots under Neyman allocation than under proportional', () => {
    const strata = [
      { stratum: 'heath', basisM2: 50_000, sd: 4 },
      { stratum: 'saltmarsh', basisM2: 30_000, sd: 12 },
      { stratum: 'dune', basisM2: 20_000, sd: 1 },
    ];
    const r = nextSeasonSampleSize(strata, { target: { value: 1, relative: false }, observedMean: null, plotAreaM2: null });
    expect(r.neyman.n).toBeLessThanOrEqual(r.proportional.n);
    expect(r.neyman.halfwidth).toBeLessThanOrEqual(1);
    expect(r.proportional.halfwidth).toBeLessThanOrEqual(1);
    // Neyman n = (Σ W_h S_h)² / V without fpc (Cochran 1977 eq. 5.26): (0.5·4 + 0.3·12 + 0.2·1)² (1.96)².
    expect(r.neyman.formulaN).toBeCloseTo((5.8 * 1.959963984540054) ** 2, 6);
  });

  it('asks for an SD when a stratum had fewer than 2 plots, and takes an override', () => {
    const strata = [
      { stratum: 'heath', basisM2: 1, sd: 2 },
      { stratum: 'Wet meadow', basisM2: 1, sd: null },
    ];
    const opts = { target: { value: 1, relative: false }, observedMean: null, plotAreaM2: null };
    expect(() => nextSeasonSampleSize(strata, opts)).toThrow('stratum "Wet meadow" has no observed SD (fewer than 2 plots)');
    expect(nextSeasonSampleSize(strata, { ...opts, sdOverride: { 'Wet meadow': 3 } }).neyman.n).toBeGreaterThan(0);
  });

  it('refuses a relative target without a mean', () => {
    expect(() =>
      nextSeasonSampleSize([{ stratum: 'a', basisM2: 1, sd: 1 }], { target: { value: 0.1, relative: true }, observedMean: 0, plotAreaM2: null }),
    ).toThrow('a relative target needs an observed mean other than 0');
  });
});
