import { limitExceeded, limitNumber, MAX_LAYOUT_POSITIONS } from '../../common/inputLimits';
import { InputError } from '../../common/InputError';
import type { PlacementConstraints } from './placementConstraints';
import type { CandidateSource } from './plotsPlaceSequential';
import type { Rng } from './rng';

/** A systematic grid in frame metres: origin, spacing and the bearing of its "north" axis from grid north. */
export interface GridLayout {
  originX: number;
  originY: number;
  spacing: number;
  /** Degrees clockwise from grid north (the user's angle from true north plus the convergence). */
  bearingDeg: number;
}

/**
 * A grid with a uniformly random origin within one cell of the site's south-west corner, so every
 * point of the ground has the same chance of being a grid point, turned `angleDeg` clockwise from
 * TRUE north. Source: systematic sampling with a random start (Cochran 1977, ch. 8; Ripley, Spatial
 * Statistics, 1981, §3.2 for the two-dimensional case).
 * @param spacingM ground metres between grid lines
 * Throws InputError when the spacing is not > 0.
 */
export function gridLayoutRandom(c: PlacementConstraints, spacingM: number, angleDeg: number, rng: Rng): GridLayout {
  if (!(spacingM > 0)) throw new InputError(`grid spacing must be more than 0 m, got ${spacingM}`);
  let minX = Infinity;
  let minY = Infinity;
  for (const s of c.strata) {
    minX = Math.min(minX, s.bbox[0]);
    minY = Math.min(minY, s.bbox[1]);
  }
  const spacing = spacingM * c.scale;
  return { originX: minX + rng.float() * spacing, originY: minY + rng.float() * spacing, spacing, bearingDeg: angleDeg + c.convergenceDeg };
}

/**
 * Candidates for systematic grid placement in stratum `s`: every grid point over the stratum's
 * bounding box, row by row (the caller keeps those that fit); with `offset`, the points half a cell
 * across in both directions (cell centres), in a random order, for reserves.
 * Throws InputError when the grid would need more than {@link MAX_LAYOUT_POSITIONS} positions.
 */
export function plotsPlaceGrid(c: PlacementConstraints, s: number, g: GridLayout, offset: { rng: Rng } | null): CandidateSource {
  const [x0, y0, x1, y1] = c.strata[s].bbox;
  const b = (g.bearingDeg * Math.PI) / 180;
  const ux = Math.cos(b);
  const uy = -Math.sin(b);
  const vx = Math.sin(b);
  const vy = Math.cos(b);
  const shift = offset ? 0.5 : 0;
  let iMin = Infinity;
  let iMax = -Infinity;
  let jMin = Infinity;
  let jMax = -Infinity;
  for (const [px, py] of [
    [x0, y0],
    [x1, y0],
    [x0, y1],
    [x1, y1],
  ]) {
    const i = ((px - g.originX) * ux + (py - g.originY) * uy) / g.spacing - shift;
    const j = ((px - g.originX) * vx + (py - g.originY) * vy) / g.spacing - shift;
    iMin = Math.min(iMin, Math.floor(i));
    iMax = Math.max(iMax, Math.ceil(i));
    jMin = Math.min(jMin, Math.floor(j));
    jMax = Math.max(jMax, Math.ceil(j));
  }
  const empty = !Number.isFinite(iMin);
  const ni = empty ? 0 : iMax - iMin + 1;
  const nj = empty ? 0 : jMax - jMin + 1;
  if (ni * nj > MAX_LAYOUT_POSITIONS) {
    throw limitExceeded(
      `grid spacing ${(g.spacing / c.scale).toFixed(1)} m`,
      `it gives ${limitNumber(ni * nj)} positions over stratum "${c.strata[s].key}"; use a wider spacing`,
      `${limitNumber(MAX_LAYOUT_POSITIONS)} layout positions`,
    );
  }
  const total = ni * nj;
  let order: Uint32Array | null = null;
  if (offset) {
    order = new Uint32Array(total);
    for (let k = 0; k < total; k++) order[k] = k;
    for (let k = total - 1; k > 0; k--) {
      const r = offset.rng.int(k + 1);
      const t = order[k];
      order[k] = order[r];
      order[r] = t;
    }
  }
  let k = 0;
  return {
    insideByConstruction: false,
    finite: true,
    next(out: Float64Array): boolean {
      if (k >= total) return false;
      const cell = order ? order[k] : k;
      k++;
      const i = iMin + (cell % ni) + shift;
      const j = jMin + Math.floor(cell / ni) + shift;
      out[0] = g.originX + (i * ux + j * vx) * g.spacing;
      out[1] = g.originY + (i * uy + j * vy) * g.spacing;
      return true;
    },
  };
}
