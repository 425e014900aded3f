import type { PlacementConstraints } from './placementConstraints';
import type { CandidateSource } from './plotsPlaceSequential';
import type { Rng } from './rng';

/**
 * Candidates for simple random placement in stratum `s`: exactly uniform over the stratum — a
 * triangle of its earcut triangulation picked with probability proportional to its area, then a
 * uniform point in it by folding the unit square (r1 + r2 > 1 → 1 − r1, 1 − r2). Refusing candidates
 * that break a constraint keeps the accepted points uniform over the ground that meets them.
 * Source: uniform sampling in a triangle (Devroye, Non-Uniform Random Variate Generation, 1986,
 * ch. XI §2); rejection sampling (ibid., ch. II §3).
 * Returns a source with no candidates when the stratum has no area.
 */
export function plotsPlaceRandom(c: PlacementConstraints, s: number, rng: Rng): CandidateSource {
  const { triangles: t, cumulativeArea: cum } = c.strata[s];
  const n = cum.length;
  const total = n > 0 ? cum[n - 1] : 0;
  return {
    insideByConstruction: true,
    next(out: Float64Array): boolean {
      if (!(total > 0)) return false;
      const target = rng.float() * total;
      let lo = 0;
      let hi = n - 1;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (cum[mid] > target) hi = mid;
        else lo = mid + 1;
      }
      let r1 = rng.float();
      let r2 = rng.float();
      if (r1 + r2 > 1) {
        r1 = 1 - r1;
        r2 = 1 - r2;
      }
      const o = lo * 6;
      out[0] = t[o] + r1 * (t[o + 2] - t[o]) + r2 * (t[o + 4] - t[o]);
      out[1] = t[o + 1] + r1 * (t[o + 3] - t[o + 1]) + r2 * (t[o + 5] - t[o + 1]);
      return true;
    },
  };
}
