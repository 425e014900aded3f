import type { PlacementConstraints } from './placementConstraints';
import type { CandidateSource } from './plotsPlaceSequential';
import type { Rng } from './rng';
import { CELL_BOUNDARY, stratumCellsContain } from './stratumCellsXY';

/**
 * Draws in a row that fall outside the stratum before the source counts as dry: each draw lands in
 * the stratum with a chance of at least its area over the area of its cells (common practice, no source).
 */
const MAX_DRAWS_OUTSIDE = 100_000;

/**
 * Candidates for simple random placement in stratum `s` from its cell grid (stratumCellsXY),
 * exactly uniform over the stratum: a cell that holds ground of it picked with equal chance, a
 * uniform point in the cell, and in a cell its boundary crosses the point drawn again until it lies
 * inside (rejection from a uniform cover of the stratum leaves the kept points uniform over it).
 * Refusing candidates that break a constraint keeps the accepted points uniform over the ground
 * that meets them. Used from random generator version 3 on; earlier versions draw from the
 * stratum's triangles (plotsPlaceRandom).
 * Source: rejection sampling (Devroye, Non-Uniform Random Variate Generation, 1986, ch. II §3).
 * Returns a source with no candidates when the stratum has no area.
 */
export function plotsPlaceCells(c: PlacementConstraints, s: number, rng: Rng): CandidateSource {
  const stratum = c.strata[s];
  return {
    insideByConstruction: true,
    next(out: Float64Array): boolean {
      const g = stratum.cells();
      const n = g.ground.length;
      if (n === 0) return false;
      for (let draw = 0; draw < MAX_DRAWS_OUTSIDE; draw++) {
        const cell = g.ground[Math.floor(rng.float() * n)];
        const col = cell % g.nx;
        const row = (cell - col) / g.nx;
        const x = g.x0 + (col + rng.float()) * g.side;
        const y = g.y0 + (row + rng.float()) * g.side;
        if (g.state[cell] === CELL_BOUNDARY && !stratumCellsContain(g, stratum.edges, x, y)) continue;
        out[0] = x;
        out[1] = y;
        return true;
      }
      return false;
    },
  };
}
