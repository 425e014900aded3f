import { HALTON_SKIP_MAX, haltonValue } from './halton';
import type { PlacementConstraints } from './placementConstraints';
import type { CandidateSource } from './plotsPlaceSequential';
import type { Rng } from './rng';

/**
 * Candidates for spatially balanced placement in stratum `s` by Balanced Acceptance Sampling: the
 * Halton sequence in bases 2 and 3 over the stratum's bounding box, each dimension started at its
 * own random index (u1, u2 drawn uniformly), candidates taken in sequence order; those outside the
 * stratum or breaking a constraint are refused by the caller. Every prefix of the kept points is
 * spread evenly, so reserves drawn next keep the balance.
 * Source: Robertson, Brown, McDonald & Jaksons, Biometrics 69(3):776–784, 2013 (BAS, random start);
 * Halton 1960.
 */
export function plotsPlaceBalanced(c: PlacementConstraints, s: number, rng: Rng): CandidateSource {
  const [x0, y0, x1, y1] = c.strata[s].bbox;
  const u1 = rng.int(HALTON_SKIP_MAX);
  const u2 = rng.int(HALTON_SKIP_MAX);
  let k = 0;
  const empty = !(x1 > x0 && y1 > y0);
  return {
    insideByConstruction: false,
    next(out: Float64Array): boolean {
      if (empty) return false;
      out[0] = x0 + haltonValue(u1 + k, 2) * (x1 - x0);
      out[1] = y0 + haltonValue(u2 + k, 3) * (y1 - y0);
      k++;
      return true;
    },
  };
}
