import Flatbush from 'flatbush';
import type { Footprint } from '../../model/designTypes';
import type { LocalFrame } from '../../geo/localFrame';
import { footprintShapeXY, type FootprintXY } from './placementFootprint';
import { EDGE_CHUNK, type StratumSampling, type StratumShapeXY, stratumShapesXY } from './placementStrata';
import type { StratumOutlineXY } from './stratumOutlineXY';
import { convexSegmentDistance, isInRingFlat, pointSegmentDistance } from '../../geometry/segmentDistance';
import type { ExclusionGeometry, ExclusionKind, LonLat, Site } from '../../model/types';

/** Why a candidate position was refused (0 = it fits). */
export const FIT_OK = 0;
export const FIT_OUTSIDE_STRATUM = 1;
export const FIT_NEAR_EDGE = 2;
export const FIT_EXCLUDED = 3;
export type FitResult = typeof FIT_OK | typeof FIT_OUTSIDE_STRATUM | typeof FIT_NEAR_EDGE | typeof FIT_EXCLUDED;

/** Options of {@link placementConstraintsBuild}. */
export interface PlacementConstraintOptions {
  footprint: Footprint;
  /** Ground metres the footprint must keep from its stratum's boundary (0: may not cross it). */
  edgeBufferM: number;
  /** Every stratum's outline (with its triangles, where made), in site order, where another thread has made them for this site and frame. */
  strataMade?: readonly StratumOutlineXY[];
  /** How strata are sampled and tested (placementStrata): by triangles (the default) or by cells. */
  sampling?: StratumSampling;
}

/** The site prepared for placement: strata, exclusions and the footprint, all in frame metres. */
export interface PlacementConstraints {
  frame: LocalFrame;
  /** Largest UTM point scale factor over the site: ground metres × scale = grid metres, never short. */
  scale: number;
  /** Meridian convergence at the site centre: bearing of true north from grid north, degrees clockwise. */
  convergenceDeg: number;
  strata: StratumShapeXY[];
  footprint: FootprintXY;
  /**
   * Whether a footprint centred at (x, y) lies wholly inside stratum `s` with the edge buffer and
   * clear of every exclusion widened by its buffer. `knownInside` skips the point-in-stratum test
   * when the candidate was drawn from the stratum's own triangles.
   */
  check(s: number, x: number, y: number, knownInside?: boolean): FitResult;
  /** Nearest exclusion to a point (ground metres from its centre), or null when there are none. */
  nearestExclusion(x: number, y: number): { distanceM: number; kind: ExclusionKind } | null;
  /** The edge buffer in grid metres (ground metres × scale). */
  edgeBufferGrid: number;
  /** Latitude of the site centre, degrees (for the point scale factor at a position). */
  lat0: number;
  /** The exclusions as `check` tests them, for measuring how close a plot comes (see plotClearances). */
  exclusionParts: ExclusionPartsXY;
  /** Grid distance from the footprint centred at (x, y) to segment `o` (offset of x1) of `arr`; 0 when they touch. */
  footprintDistance(x: number, y: number, o: number, arr: Float64Array): number;
  /** Indexes into `site.exclusions` of every exclusion polygon holding (x, y) (holes count as outside). */
  exclusionPolygonsAt(x: number, y: number): number[];
}

/** Exclusion geometry in frame metres: every segment with its buffer, kind and owner, and the polygons. */
export interface ExclusionPartsXY {
  /** Segments x1, y1, x2, y2 (points are zero-length segments). */
  seg: Float64Array;
  /** Buffer of each segment's exclusion in grid metres (ground metres × scale). */
  buf: Float64Array;
  kind: ExclusionKind[];
  /** Index into `site.exclusions` of each segment's exclusion. */
  owner: Int32Array;
  /** Segment boxes widened by their buffers; null when there are no exclusions. */
  index: Flatbush | null;
  /** Largest buffer, grid metres. */
  maxBuf: number;
}

/**
 * The one rule for "too close", shared by placement and by checking plots made elsewhere: with a
 * positive limit (buffer, edge buffer) a clearance shorter than it, less `slack`; with no limit, a
 * footprint that touches. All in grid metres. Placement uses no slack.
 */
export function isClearanceShort(clearance: number, limit: number, slack = 0): boolean {
  return limit > 0 ? clearance < limit - slack : clearance <= 0;
}

function geometryLines(g: ExclusionGeometry): { lines: LonLat[][]; polygons: LonLat[][][] } {
  switch (g.type) {
    case 'Point':
      return { lines: [[g.coordinates]], polygons: [] };
    case 'MultiPoint':
      return { lines: g.coordinates.map((p) => [p]), polygons: [] };
    case 'LineString':
      return { lines: [g.coordinates], polygons: [] };
    case 'MultiLineString':
      return { lines: g.coordinates, polygons: [] };
    case 'Polygon':
      return { lines: g.coordinates, polygons: [g.coordinates] };
    case 'MultiPolygon':
      return { lines: g.coordinates.flat(), polygons: g.coordinates };
  }
}

/**
 * UTM point scale factor at grid easting x (metres), latitude φ: k = k0 (1 + E²/2R² + E⁴/24R⁴) with
 * E = (x − 500 000)/k0 and R the geometric-mean radius of curvature at φ.
 * Source: Snyder 1987, USGS PP 1395, eq. 8-11 (series for k, leading terms).
 */
export function utmScaleFactor(x: number, latDeg: number): number {
  const a = 6378137;
  const e2 = 0.0066943799901413165;
  const s = Math.sin((latDeg * Math.PI) / 180);
  const r = (a * Math.sqrt(1 - e2)) / (1 - e2 * s * s);
  const e = (x - 500000) / 0.9996;
  const q = (e * e) / (r * r);
  return 0.9996 * (1 + q / 2 + (q * q) / 24);
}

/** The grid's scale and orientation at the strata: the largest UTM scale factor over their extent and the grid convergence. */
function gridScaleAt(strata: readonly StratumShapeXY[], frame: LocalFrame): { scale: number; convergenceDeg: number; lat0: number } {
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const s of strata) {
    if (s.bbox[0] < minX) minX = s.bbox[0];
    if (s.bbox[2] > maxX) maxX = s.bbox[2];
    if (s.bbox[1] < minY) minY = s.bbox[1];
    if (s.bbox[3] > maxY) maxY = s.bbox[3];
  }
  const cx = Number.isFinite(minX) ? (minX + maxX) / 2 : 500000;
  const cy = Number.isFinite(minY) ? (minY + maxY) / 2 : 0;
  const [lon0, lat0] = frame.toLonLat(cx, cy);
  const scale = Number.isFinite(minX) ? Math.max(utmScaleFactor(minX, lat0), utmScaleFactor(maxX, lat0), 1) : 1;
  const north = frame.toXY(lon0, lat0 + 1e-4);
  const convergenceDeg = (Math.atan2(north[0] - cx, north[1] - cy) * 180) / Math.PI;
  return { scale, convergenceDeg, lat0 };
}

/** Every exclusion in the grid, flattened: buffered segments (points as zero-length ones) and polygons for containment, each with its index. */
function exclusionsFlatXY(site: Site, frame: LocalFrame, scale: number) {
  // Exclusions, flattened: segments (points are zero-length segments) and polygons for containment.
  const segs: number[] = [];
  const segBuf: number[] = [];
  const segKind: ExclusionKind[] = [];
  const segOwner: number[] = [];
  const polyOwner: number[] = [];
  const polyXY: number[] = [];
  const polyRings: number[] = []; // per ring: start, end (value offsets into polyXY), owner polygon
  const polyBoxes: number[] = [];
  let polyCount = 0;
  for (let owner = 0; owner < site.exclusions.length; owner++) {
    const ex = site.exclusions[owner];
    const { lines, polygons } = geometryLines(ex.geometry);
    const buf = ex.bufferM * scale;
    for (const line of lines) {
      const pts = line.map((p) => frame.toXY(p[0], p[1]));
      if (pts.length === 1) {
        segs.push(pts[0][0], pts[0][1], pts[0][0], pts[0][1]);
        segBuf.push(buf);
        segKind.push(ex.kind);
        segOwner.push(owner);
      }
      for (let i = 1; i < pts.length; i++) {
        segs.push(pts[i - 1][0], pts[i - 1][1], pts[i][0], pts[i][1]);
        segBuf.push(buf);
        segKind.push(ex.kind);
        segOwner.push(owner);
      }
    }
    for (const poly of polygons) {
      let bx0 = Infinity;
      let by0 = Infinity;
      let bx1 = -Infinity;
      let by1 = -Infinity;
      for (const ring of poly) {
        const start = polyXY.length;
        for (const p of ring) {
          const [x, y] = frame.toXY(p[0], p[1]);
          polyXY.push(x, y);
          if (x < bx0) bx0 = x;
          if (x > bx1) bx1 = x;
          if (y < by0) by0 = y;
          if (y > by1) by1 = y;
        }
        polyRings.push(start, polyXY.length, polyCount);
      }
      polyBoxes.push(bx0, by0, bx1, by1);
      polyOwner.push(owner);
      polyCount++;
    }
  }
  const segArr = Float64Array.from(segs);
  const bufArr = Float64Array.from(segBuf);
  const nSeg = bufArr.length;
  let segIndex: Flatbush | null = null;
  if (nSeg > 0) {
    segIndex = new Flatbush(nSeg);
    for (let i = 0; i < nSeg; i++) {
      const b = bufArr[i];
      const o = i * 4;
      segIndex.add(
        Math.min(segArr[o], segArr[o + 2]) - b,
        Math.min(segArr[o + 1], segArr[o + 3]) - b,
        Math.max(segArr[o], segArr[o + 2]) + b,
        Math.max(segArr[o + 1], segArr[o + 3]) + b,
      );
    }
    segIndex.finish();
  }
  let maxBuf = 0;
  for (let i = 0; i < nSeg; i++) if (bufArr[i] > maxBuf) maxBuf = bufArr[i];
  const polyXYArr = Float64Array.from(polyXY);
  const ringsOf: number[][] = Array.from({ length: polyCount }, () => []);
  for (let r = 0; r < polyRings.length; r += 3) ringsOf[polyRings[r + 2]].push(polyRings[r], polyRings[r + 1]);
  let polyIndex: Flatbush | null = null;
  if (polyCount > 0) {
    polyIndex = new Flatbush(polyCount);
    for (let i = 0; i < polyCount; i++) polyIndex.add(polyBoxes[i * 4], polyBoxes[i * 4 + 1], polyBoxes[i * 4 + 2], polyBoxes[i * 4 + 3]);
    polyIndex.finish();
  }

  return { segArr, bufArr, nSeg, segKind, segOwner, segIndex, maxBuf, polyXYArr, ringsOf, polyOwner, polyIndex };
}

/**
 * Prepares a site for placement in `frame`: each stratum's triangles (earcut) and boundary segments
 * (edges shared by two parts of one stratum dropped), and every exclusion's segments, points and
 * polygons in flatbush indexes, boxes widened by the exclusion's buffer. Distances are planar in the
 * UTM frame and every ground distance (buffers, edge buffer, footprint size) is multiplied by the
 * largest point scale factor over the site, so a ground distance is never shorter than asked
 * (conservative by at most ~0.1 %). Footprint edges are turned by the meridian convergence so they
 * face TRUE north, not grid north.
 * Sources: planar distances (O'Rourke 1998, §1.5); scale factor (Snyder 1987, eq. 8-11).
 */
export function placementConstraintsBuild(site: Site, frame: LocalFrame, options: PlacementConstraintOptions): PlacementConstraints {
  const strata = stratumShapesXY(site, frame, options.strataMade, options.sampling);
  const { scale, convergenceDeg, lat0 } = gridScaleAt(strata, frame);
  const footprint = footprintShapeXY(options.footprint, scale, convergenceDeg);
  const edgeGrid = options.edgeBufferM * scale;

  const { segArr, bufArr, segKind, segOwner, segIndex, maxBuf, polyXYArr, ringsOf, polyOwner, polyIndex } = exclusionsFlatXY(site, frame, scale);

  const isInExclusionPolygon = (x: number, y: number): number => {
    if (!polyIndex) return -1;
    let hit = -1;
    polyIndex.collides(x, y, x, y, (p) => {
      const rings = ringsOf[p];
      let inside = false;
      for (let r = 0; r < rings.length; r += 2) if (isInRingFlat(x, y, polyXYArr, rings[r], rings[r + 1])) inside = !inside;
      if (inside) hit = p;
      return inside;
    });
    return hit;
  };

  const exclusionPolygonsAt = (x: number, y: number): number[] => {
    if (!polyIndex) return [];
    const owners: number[] = [];
    for (const p of polyIndex.search(x, y, x, y)) {
      const rings = ringsOf[p];
      let inside = false;
      for (let r = 0; r < rings.length; r += 2) if (isInRingFlat(x, y, polyXYArr, rings[r], rings[r + 1])) inside = !inside;
      if (inside && !owners.includes(polyOwner[p])) owners.push(polyOwner[p]);
    }
    return owners;
  };

  const footprintDistance = (x: number, y: number, o: number, arr: Float64Array): number => {
    const d =
      footprint.vx.length > 0
        ? convexSegmentDistance(x, y, footprint.vx, footprint.vy, arr[o], arr[o + 1], arr[o + 2], arr[o + 3])
        : pointSegmentDistance(x, y, arr[o], arr[o + 1], arr[o + 2], arr[o + 3]) - footprint.radius;
    return Math.max(d, 0);
  };

  const h = footprint.halfExtent;
  const needsEdgeTest = h > 0 || edgeGrid > 0;
  const check = (s: number, x: number, y: number, knownInside = false): FitResult => {
    const st = strata[s];
    if (!knownInside && !st.contains(x, y)) return FIT_OUTSIDE_STRATUM;
    if (needsEdgeTest && st.edgeIndex) {
      const r = h + edgeGrid;
      const edges = st.edges;
      const near = st.edgeIndex.collides(x - r, y - r, x + r, y + r, (k) => {
        const end = Math.min(edges.length, (k + 1) * EDGE_CHUNK * 4);
        for (let o = k * EDGE_CHUNK * 4; o < end; o += 4) {
          if (isClearanceShort(footprintDistance(x, y, o, edges), edgeGrid)) return true;
        }
        return false;
      });
      if (near) return FIT_NEAR_EDGE;
    }
    if (segIndex) {
      const hit = segIndex.collides(x - h, y - h, x + h, y + h, (i) => isClearanceShort(footprintDistance(x, y, i * 4, segArr), bufArr[i]));
      if (hit) return FIT_EXCLUDED;
    }
    if (isInExclusionPolygon(x, y) >= 0) return FIT_EXCLUDED;
    return FIT_OK;
  };

  const nearestExclusion = (x: number, y: number): { distanceM: number; kind: ExclusionKind } | null => {
    if (!segIndex) return null;
    const k = utmScaleFactor(x, lat0);
    const inPoly = isInExclusionPolygon(x, y);
    const first = segIndex.neighbors(x, y, 1)[0];
    const o = first * 4;
    let best = pointSegmentDistance(x, y, segArr[o], segArr[o + 1], segArr[o + 2], segArr[o + 3]);
    let bestKind = segKind[first];
    const r = best + maxBuf;
    for (const i of segIndex.search(x - r, y - r, x + r, y + r)) {
      const p = i * 4;
      const d = pointSegmentDistance(x, y, segArr[p], segArr[p + 1], segArr[p + 2], segArr[p + 3]);
      if (d < best) {
        best = d;
        bestKind = segKind[i];
      }
    }
    if (inPoly >= 0) return { distanceM: 0, kind: bestKind };
    return { distanceM: best / k, kind: bestKind };
  };

  const exclusionParts: ExclusionPartsXY = { seg: segArr, buf: bufArr, kind: segKind, owner: Int32Array.from(segOwner), index: segIndex, maxBuf };
  return { frame, scale, convergenceDeg, strata, footprint, check, nearestExclusion, edgeBufferGrid: edgeGrid, lat0, exclusionParts, footprintDistance, exclusionPolygonsAt };
}
