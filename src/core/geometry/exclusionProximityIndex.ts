import Flatbush from 'flatbush';
import { edgeCrossesRayEast } from './edgeCrossesRayEast';
import type { LocalFrame } from '../geo/localFrame';
import type { Exclusion, ExclusionKind, LonLat } from '../model/types';

/** The nearest exclusion of some kinds to a point, in a site's local metric frame. */
export interface ExclusionHit {
  exclusion: Exclusion;
  /** Planar distance in the UTM frame, metres; 0 inside a polygon. */
  distanceM: number;
}

/** Spatial index over exclusion geometries projected to a local UTM frame. */
export interface ExclusionProximityIndex {
  /** Nearest exclusion of the given kinds within `maxM` metres of (x, y), or null. */
  nearest(x: number, y: number, kinds: readonly ExclusionKind[], maxM: number): ExclusionHit | null;
  /**
   * Exclusions of the given kinds that the segment (ax, ay)–(bx, by) passes within `extraM` plus the
   * exclusion's own buffer of (0 when it crosses or enters the geometry).
   */
  crossedBy(ax: number, ay: number, bx: number, by: number, kinds: readonly ExclusionKind[], extraM: number): ExclusionHit[];
}

/**
 * Builds a {@link ExclusionProximityIndex}: each exclusion becomes segments (lines, polygon rings,
 * points as zero-length segments) in a Flatbush R-tree, plus polygon rings for inside tests.
 * Distances are planar in the UTM zone, which at site scale differs from the geodesic by the
 * zone's scale factor (at most ~0.1 %): ample for safety thresholds of tens of metres.
 * Source: R-tree packing per Flatbush (Agafonkin); point–segment distance by projection onto the segment.
 */
export function exclusionProximityIndex(exclusions: readonly Exclusion[], frame: LocalFrame): ExclusionProximityIndex {
  const seg: number[] = [];
  const segOwner: number[] = [];
  const polys: { owner: number; rings: Float64Array[] }[] = [];
  const toXY = (p: LonLat): [number, number] => {
    const xy = frame.toXY(p[0], p[1]);
    return [xy[0], xy[1]];
  };
  const addPath = (path: readonly LonLat[], owner: number, closeRing: boolean): Float64Array => {
    const xy = new Float64Array(path.length * 2);
    path.forEach((p, i) => {
      const [x, y] = toXY(p);
      xy[2 * i] = x;
      xy[2 * i + 1] = y;
    });
    const n = path.length;
    for (let i = 0; i + 1 < n; i++) {
      seg.push(xy[2 * i], xy[2 * i + 1], xy[2 * i + 2], xy[2 * i + 3]);
      segOwner.push(owner);
    }
    if (closeRing && n > 1) {
      seg.push(xy[2 * n - 2], xy[2 * n - 1], xy[0], xy[1]);
      segOwner.push(owner);
    }
    return xy;
  };
  exclusions.forEach((e, owner) => {
    const g = e.geometry;
    const points = g.type === 'Point' ? [g.coordinates] : g.type === 'MultiPoint' ? g.coordinates : [];
    for (const p of points) {
      const [x, y] = toXY(p);
      seg.push(x, y, x, y);
      segOwner.push(owner);
    }
    const lines = g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : [];
    for (const l of lines) addPath(l, owner, false);
    const polygons = g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [];
    for (const poly of polygons) polys.push({ owner, rings: poly.map((ring) => addPath(ring, owner, true)) });
  });
  const nSeg = segOwner.length;
  const tree = nSeg ? new Flatbush(nSeg) : null;
  for (let i = 0; i < nSeg; i++) {
    const [x1, y1, x2, y2] = [seg[4 * i], seg[4 * i + 1], seg[4 * i + 2], seg[4 * i + 3]];
    tree!.add(Math.min(x1, x2), Math.min(y1, y2), Math.max(x1, x2), Math.max(y1, y2));
  }
  tree?.finish();
  const insideOwners = (x: number, y: number, wanted: Set<ExclusionKind>): number[] =>
    polys.filter((p) => wanted.has(exclusions[p.owner].kind) && isInsideRings(x, y, p.rings)).map((p) => p.owner);

  return {
    nearest(x, y, kinds, maxM) {
      const wanted = new Set(kinds);
      const inside = insideOwners(x, y, wanted);
      if (inside.length) return { exclusion: exclusions[inside[0]], distanceM: 0 };
      if (!tree) return null;
      let best: ExclusionHit | null = null;
      for (const i of tree.search(x - maxM, y - maxM, x + maxM, y + maxM)) {
        const e = exclusions[segOwner[i]];
        if (!wanted.has(e.kind)) continue;
        const d = pointSegmentDistance(x, y, seg[4 * i], seg[4 * i + 1], seg[4 * i + 2], seg[4 * i + 3]);
        if (d <= maxM && (!best || d < best.distanceM)) best = { exclusion: e, distanceM: d };
      }
      return best;
    },
    crossedBy(ax, ay, bx, by, kinds, extraM) {
      const wanted = new Set(kinds);
      const hits = new Map<number, number>();
      for (const owner of [...insideOwners(ax, ay, wanted), ...insideOwners(bx, by, wanted)]) hits.set(owner, 0);
      if (tree) {
        let reach = extraM;
        for (const e of exclusions) if (wanted.has(e.kind)) reach = Math.max(reach, e.bufferM + extraM);
        const found = tree.search(Math.min(ax, bx) - reach, Math.min(ay, by) - reach, Math.max(ax, bx) + reach, Math.max(ay, by) + reach);
        for (const i of found) {
          const owner = segOwner[i];
          const e = exclusions[owner];
          if (!wanted.has(e.kind)) continue;
          const d = segmentSegmentDistance(ax, ay, bx, by, seg[4 * i], seg[4 * i + 1], seg[4 * i + 2], seg[4 * i + 3]);
          if (d <= e.bufferM + extraM && d < (hits.get(owner) ?? Number.POSITIVE_INFINITY)) hits.set(owner, d);
        }
      }
      return [...hits].sort((p, q) => p[0] - q[0]).map(([owner, d]) => ({ exclusion: exclusions[owner], distanceM: d }));
    },
  };
}

function pointSegmentDistance(px: number, py: number, x1: number, y1: number, x2: number, y2: number): number {
  const dx = x2 - x1;
  const dy = y2 - y1;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - x1) * dx + (py - y1) * dy) / len2));
  return Math.hypot(px - (x1 + t * dx), py - (y1 + t * dy));
}

function cross(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

function segmentSegmentDistance(
  ax: number, ay: number, bx: number, by: number,
  cx: number, cy: number, dx: number, dy: number,
): number {
  const d1 = cross(cx, cy, dx, dy, ax, ay);
  const d2 = cross(cx, cy, dx, dy, bx, by);
  const d3 = cross(ax, ay, bx, by, cx, cy);
  const d4 = cross(ax, ay, bx, by, dx, dy);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return 0;
  return Math.min(
    pointSegmentDistance(ax, ay, cx, cy, dx, dy),
    pointSegmentDistance(bx, by, cx, cy, dx, dy),
    pointSegmentDistance(cx, cy, ax, ay, bx, by),
    pointSegmentDistance(dx, dy, ax, ay, bx, by),
  );
}

// Even–odd rule over all rings, so holes count as outside.
function isInsideRings(x: number, y: number, rings: readonly Float64Array[]): boolean {
  let inside = false;
  for (const r of rings) {
    const n = r.length / 2;
    for (let i = 0, j = n - 1; i < n; j = i++) {
      const xi = r[2 * i];
      const yi = r[2 * i + 1];
      const xj = r[2 * j];
      const yj = r[2 * j + 1];
      if (edgeCrossesRayEast(x, y, xi, yi, xj, yj)) inside = !inside;
    }
  }
  return inside;
}
