import { describe, expect, it } from 'vitest';
import { estimateStratifiedMean } from './estimateStratifiedMean';
import { rngCreate } from './rng';
import { stratumStats } from './stratumStats';

// An invented population: a smooth surface z(x, y) over three rectangular strata (metres), one of
// them with an excluded square in the middle. Its mean over the usable ground is integrated
// analytically, so the simulation has an outside truth.
const L = 1000;
const z = (x: number, y: number) => 20 + 0.01 * x + 8 * Math.sin((2 * Math.PI * y) / L) + (x * y) / 1e5 + 30 * Math.exp(-x / 300);

type Rect = [x0: number, y0: number, x1: number, y1: number];

/** ∫∫ z over a rectangle, term by term. */
function integral([x0, y0, x1, y1]: Rect): number {
  const w = x1 - x0;
  const h = y1 - y0;
  const c = 20 * w * h;
  const lin = 0.01 * ((x1 * x1 - x0 * x0) / 2) * h;
  const sin = 8 * w * (L / (2 * Math.PI)) * (Math.cos((2 * Math.PI * y0) / L) - Math.cos((2 * Math.PI * y1) / L));
  const xy = (((x1 * x1 - x0 * x0) / 2) * ((y1 * y1 - y0 * y0) / 2)) / 1e5;
  const exp = 30 * 300 * (Math.exp(-x0 / 300) - Math.exp(-x1 / 300)) * h;
  return c + lin + sin + xy + exp;
}
const area = ([x0, y0, x1, y1]: Rect) => (x1 - x0) * (y1 - y0);

const strata = [
  { outer: [0, 0, 1000, 1000] as Rect, hole: [400, 400, 600, 600] as Rect | null, n: 8 },
  { outer: [1000, 0, 1500, 1000] as Rect, hole: null, n: 6 },
  { outer: [0, 1000, 1500, 1300] as Rect, hole: null, n: 5 },
];
const usable = strata.map((s) => area(s.outer) - (s.hole ? area(s.hole) : 0));
const trueMean =
  strata.reduce((acc, s) => acc + integral(s.outer) - (s.hole ? integral(s.hole) : 0), 0) / usable.reduce((a, b) => a + b, 0);

describe('estimateStratifiedMean coverage', () => {
  it('covers the true mean of the usable area in 93–97 % of 2,000 stratified random samples', () => {
    // Fast in-test sampler (uniform points in rectangles, rejecting the hole) instead of the design
    // engine, so 2,000 repetitions take milliseconds; point plots, so f_h = 0.
    const rng = rngCreate(20_240_611);
    const reps = 2000;
    let covered = 0;
    let meanSum = 0;
    let meanSqSum = 0;
    for (let r = 0; r < reps; r++) {
      const summaries = strata.map((s, h) => {
        const values: number[] = [];
        const [x0, y0, x1, y1] = s.outer;
        while (values.length < s.n) {
          const x = x0 + rng.float() * (x1 - x0);
          const y = y0 + rng.float() * (y1 - y0);
          if (s.hole && x >= s.hole[0] && x < s.hole[2] && y >= s.hole[1] && y < s.hole[3]) continue;
          values.push(z(x, y));
        }
        return { stratum: `S${h + 1}`, basisM2: usable[h], ...stratumStats(values) };
      });
      const e = estimateStratifiedMean(summaries, { plotAreaM2: null });
      const [lo, hi] = e.ci95 as [number, number];
      if (lo <= trueMean && trueMean <= hi) covered += 1;
      meanSum += e.mean as number;
      meanSqSum += (e.mean as number) ** 2;
    }
    const coverage = covered / reps;
    console.log(`stratified 95 % CI coverage over ${reps} samples: ${(coverage * 100).toFixed(1)} % (true mean ${trueMean.toFixed(4)})`);
    expect(coverage).toBeGreaterThanOrEqual(0.93);
    expect(coverage).toBeLessThanOrEqual(0.97);
    // Unbiased: the average estimate is within 4 Monte Carlo standard errors of the truth.
    const average = meanSum / reps;
    const monteCarloSe = Math.sqrt((meanSqSum / reps - average * average) / reps);
    expect(Math.abs(average - trueMean)).toBeLessThan(4 * monteCarloSe);
  });
});
