import { edgeCrossesRayEast } from './edgeCrossesRayEast';
import type Flatbush from 'flatbush';
import { SegmentChunkIndex } from './segmentChunkIndex';
import type { equalAreaXY } from '../geo/equalAreaXY';
import type { LonLat } from '../model/types';

/** Polygons → rings → [lon, lat]; the first ring of each polygon is its shell. */
export type PolygonsLonLat = readonly (readonly (readonly LonLat[])[])[];

/** Oriented segments of one or more regions, flat. */
export interface Segments {
  /** x0, y0, x1, y1 per segment, metres in the equal-area frame, interior on the left. */
  xy: Float64Array;
  /** Which polygon (piece) each segment belongs to. */
  owner: Int32Array;
  count: number;
}

/** Lon/lat band [west, south, north]: only segments reaching into it from the west or inside it are kept. */
export type Band = readonly [number, number, number];

/**
 * Flattens polygons into oriented segments: shells counter-clockwise, holes clockwise. With a band,
 * segments wholly west of, south of or north of it are left out (rays cast east from points in the
 * band never meet them) and never projected.
 */
export function segmentsOf(polygons: readonly PolygonsLonLat[], project: ReturnType<typeof equalAreaXY>, band?: Band): Segments {
  let total = 0;
  for (const pieces of polygons) for (const poly of pieces) for (const ring of poly) total += ring.length;
  const xy = new Float64Array(total * 4);
  const owner = new Int32Array(total);
  let count = 0;
  polygons.forEach((pieces, id) => {
    for (const poly of pieces) {
      poly.forEach((ring, r) => {
        let n = ring.length;
        if (n > 1 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) n -= 1;
        if (n < 3) return;
        // Orientation from lon/lat: the projection keeps it (x grows with λ, y with φ).
        const lon0 = ring[0][0];
        const east = (lon: number) => {
          const d = lon - lon0;
          return d > 180 ? d - 360 : d < -180 ? d + 360 : d;
        };
        let twiceArea = 0;
        for (let i = 0, j = n - 1; i < n; j = i++) twiceArea += east(ring[j][0]) * ring[i][1] - east(ring[i][0]) * ring[j][1];
        const forward = r === 0 ? twiceArea > 0 : twiceArea < 0;
        const west = band ? east(band[0]) : 0;
        // Consecutive kept segments share a vertex: project it once.
        let lastEnd = -1;
        for (let k = 0; k < n; k++) {
          const i = forward ? k : n - 1 - k;
          const j = forward ? (k + 1) % n : (2 * n - 2 - k) % n;
          const p = ring[i];
          const q = ring[j];
          if (band && ((p[1] < band[1] && q[1] < band[1]) || (p[1] > band[2] && q[1] > band[2]) || (east(p[0]) < west && east(q[0]) < west))) continue;
          const o = 4 * count;
          if (lastEnd === i) {
            xy[o] = xy[o - 2];
            xy[o + 1] = xy[o - 1];
          } else project(p[0], p[1], xy, o);
          project(q[0], q[1], xy, o + 2);
          lastEnd = j;
          owner[count++] = id;
        }
      });
    }
  });
  return { xy, owner, count };
}

/** A chunked box index of the segments (SegmentChunkIndex), or null when there are none. */
export function segmentsIndex(s: Segments): SegmentChunkIndex | null {
  return s.count === 0 ? null : new SegmentChunkIndex(s.xy, s.count);
}

/** Even–odd point-in-region test against all segments near y = py (one region, e.g. the part). */
export function segmentsContain(s: Segments, index: SegmentChunkIndex, px: number, py: number): boolean {
  let inside = false;
  const v = s.xy;
  index.some(px, py, Number.POSITIVE_INFINITY, py, (i) => {
    const o = 4 * i;
    if (edgeCrossesRayEast(px, py, v[o], v[o + 1], v[o + 2], v[o + 3])) inside = !inside;
    return false;
  });
  return inside;
}

/** Whether piece `p` holds (px, py), by the even–odd rule over its own segments. */
function pieceHolds(v: Float64Array, ranges: Int32Array, p: number, px: number, py: number): boolean {
  let inside = false;
  for (let i = ranges[2 * p], end = ranges[2 * p + 1]; i < end; i++) {
    const o = 4 * i;
    if (edgeCrossesRayEast(px, py, v[o], v[o + 1], v[o + 2], v[o + 3])) inside = !inside;
  }
  return inside;
}

/**
 * Whether any piece that `accept` takes holds (px, py), by the even–odd rule over that piece's own
 * segments; pieces are tried only where their box holds the point, and the search stops at the
 * first that does. `ranges` holds each piece's first and past-last segment. With `last`, the piece
 * in `last[0]` is tried first and the piece found is kept there: test points walk along edges, so
 * the piece that held the previous one mostly holds the next (the answer is the same either way).
 */
export function anyPieceContains(
  s: Segments,
  ranges: Int32Array,
  pieceIndex: Flatbush,
  px: number,
  py: number,
  accept: (piece: number) => boolean,
  last?: Int32Array,
): boolean {
  const v = s.xy;
  const tried = last ? last[0] : -1;
  if (tried >= 0 && accept(tried) && pieceHolds(v, ranges, tried, px, py)) return true;
  return pieceIndex.collides(px, py, px, py, (p) => {
    if (p === tried || !accept(p) || !pieceHolds(v, ranges, p, px, py)) return false;
    if (last) last[0] = p;
    return true;
  });
}

/** Parameters along segment `a` where segments of `other` cross or touch it (collinear overlaps give their ends). */
export function cutsAlong(a: Float64Array, ao: number, other: Segments, index: SegmentChunkIndex | null, skipOwner: number, out: number[]): void {
  if (!index) return;
  const ax = a[ao];
  const ay = a[ao + 1];
  const dx = a[ao + 2] - ax;
  const dy = a[ao + 3] - ay;
  const len2 = dx * dx + dy * dy;
  if (len2 === 0) return;
  const tol = 1e-12 * Math.sqrt(len2) * (Math.abs(ax) + Math.abs(ay) + Math.sqrt(len2) + 1);
  const v = other.xy;
  index.some(Math.min(ax, ax + dx), Math.min(ay, ay + dy), Math.max(ax, ax + dx), Math.max(ay, ay + dy), (i) => {
    if (other.owner[i] === skipOwner) return false;
    const o = 4 * i;
    const bx = v[o];
    const by = v[o + 1];
    const ex = v[o + 2] - bx;
    const ey = v[o + 3] - by;
    const d0 = dx * (by - ay) - dy * (bx - ax);
    const d1 = dx * (by + ey - ay) - dy * (bx + ex - ax);
    if (Math.abs(d0) <= tol && Math.abs(d1) <= tol) {
      out.push(((bx - ax) * dx + (by - ay) * dy) / len2, ((bx + ex - ax) * dx + (by + ey - ay) * dy) / len2);
      return false;
    }
    const denom = dx * ey - dy * ex;
    if (denom === 0) return false;
    const t = ((bx - ax) * ey - (by - ay) * ex) / denom;
    const u = ((bx - ax) * dy - (by - ay) * dx) / denom;
    if (u >= 0 && u <= 1 && t > 0 && t < 1) out.push(t);
    return false;
  });
}
