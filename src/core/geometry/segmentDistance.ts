import { edgeCrossesRayEast } from './edgeCrossesRayEast';

/**
 * Planar distance helpers for the placement engine, on scalar arguments (no allocation in loops).
 * Formulas: closest point on a segment by projection, and the orientation test for crossing
 * segments (O'Rourke, Computational Geometry in C, 2nd ed. 1998, §1.5 and §7.2).
 */

/** Distance from point P to segment AB, in the units of the coordinates. */
export function pointSegmentDistance(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  let t = len2 > 0 ? ((px - ax) * dx + (py - ay) * dy) / len2 : 0;
  if (t < 0) t = 0;
  else if (t > 1) t = 1;
  const ex = ax + t * dx - px;
  const ey = ay + t * dy - py;
  return Math.sqrt(ex * ex + ey * ey);
}

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

/** True when segments AB and CD share at least one point. */
export function segmentsIntersect(
  ax: number,
  ay: number,
  bx: number,
  by: number,
  cx: number,
  cy: number,
  dx: number,
  dy: number,
): boolean {
  const d1 = orient(cx, cy, dx, dy, ax, ay);
  const d2 = orient(cx, cy, dx, dy, bx, by);
  const d3 = orient(ax, ay, bx, by, cx, cy);
  const d4 = orient(ax, ay, bx, by, dx, dy);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  return (
    (d1 === 0 && onSegment(cx, cy, dx, dy, ax, ay)) ||
    (d2 === 0 && onSegment(cx, cy, dx, dy, bx, by)) ||
    (d3 === 0 && onSegment(ax, ay, bx, by, cx, cy)) ||
    (d4 === 0 && onSegment(ax, ay, bx, by, dx, dy))
  );
}

function onSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return px >= Math.min(ax, bx) && px <= Math.max(ax, bx) && py >= Math.min(ay, by) && py <= Math.max(ay, by);
}

/** Distance between segments AB and CD (0 when they touch or cross). */
export function segmentSegmentDistance(
  ax: number,
  ay: number,
  bx: number,
  by: number,
  cx: number,
  cy: number,
  dx: number,
  dy: number,
): number {
  if (segmentsIntersect(ax, ay, bx, by, cx, cy, dx, dy)) return 0;
  return Math.min(
    pointSegmentDistance(ax, ay, cx, cy, dx, dy),
    pointSegmentDistance(bx, by, cx, cy, dx, dy),
    pointSegmentDistance(cx, cy, ax, ay, bx, by),
    pointSegmentDistance(dx, dy, ax, ay, bx, by),
  );
}

/**
 * Distance from a convex polygon (vertices `vx`,`vy` offsets from centre C, counter-clockwise or
 * clockwise) to segment AB: 0 when the segment enters the polygon.
 */
export function convexSegmentDistance(
  cx: number,
  cy: number,
  vx: Float64Array,
  vy: Float64Array,
  ax: number,
  ay: number,
  bx: number,
  by: number,
): number {
  const n = vx.length;
  if (isInConvex(cx, cy, vx, vy, ax, ay)) return 0;
  let best = Number.POSITIVE_INFINITY;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const d = segmentSegmentDistance(cx + vx[j], cy + vy[j], cx + vx[i], cy + vy[i], ax, ay, bx, by);
    if (d < best) {
      best = d;
      if (d === 0) return 0;
    }
  }
  return best;
}

function isInConvex(cx: number, cy: number, vx: Float64Array, vy: Float64Array, px: number, py: number): boolean {
  let sign = 0;
  const n = vx.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const o = orient(cx + vx[j], cy + vy[j], cx + vx[i], cy + vy[i], px, py);
    if (o === 0) continue;
    const s = o > 0 ? 1 : -1;
    if (sign === 0) sign = s;
    else if (s !== sign) return false;
  }
  return true;
}

/** Even–odd ray test of point P against one ring stored flat as x0,y0,x1,y1,… from `start` to `end` (exclusive, in values). */
export function isInRingFlat(px: number, py: number, xy: Float64Array, start: number, end: number): boolean {
  let inside = false;
  for (let i = start, j = end - 2; i < end; j = i, i += 2) {
    if (edgeCrossesRayEast(px, py, xy[i], xy[i + 1], xy[j], xy[j + 1])) inside = !inside;
  }
  return inside;
}
