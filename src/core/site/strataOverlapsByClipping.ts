import Flatbush from 'flatbush';
import { polygonsIntersection } from '../geometry/polygonClip';
import { areaGeometryPlanar, type PolygonsLonLat, planarPieces } from '../geometry/areaGeometryPlanar';
import { problemMake } from '../common/problemMake';
import type { Problem, StratumPart } from '../model/types';

/** Overlaps smaller than this, m², are taken as digitising noise on shared edges (common practice, no source). */
export const MIN_OVERLAP_M2 = 0.01;

/** More than the m² of one square degree anywhere (111.32 km per degree at the equator, × 1.2). */
const BOX_M2_PER_DEG2 = (1.2 * 111_320) ** 2;

/** Lon/lat bounding box of a part's shells. */
export function partBox(part: StratumPart): [number, number, number, number] {
  const box: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
  for (const poly of polys) {
    for (const [lon, lat] of poly[0] ?? []) {
      if (lon < box[0]) box[0] = lon;
      if (lat < box[1]) box[1] = lat;
      if (lon > box[2]) box[2] = lon;
      if (lat > box[3]) box[3] = lat;
    }
  }
  return box;
}

/**
 * Whether two lon/lat boxes have a common part that could hold {@link MIN_OVERLAP_M2}: boxes that
 * only touch (shared edges, the usual case for neighbouring strata) cannot. The common box's area
 * is bounded generously (1.2 × 111.32 km per degree both ways).
 */
export function boxesMayOverlap(b: readonly number[], c: readonly number[]): boolean {
  const w = Math.min(b[2], c[2]) - Math.max(b[0], c[0]);
  const h = Math.min(b[3], c[3]) - Math.max(b[1], c[1]);
  return w > 0 && h > 0 && w * h * BOX_M2_PER_DEG2 >= MIN_OVERLAP_M2;
}

/**
 * The overlap problem of parts `i` and `j` (the same message, area and position strataOverlaps
 * reports), or null when their boxes' common part cannot hold {@link MIN_OVERLAP_M2} or polyclip-ts
 * finds less than that in common. `planarOf` gives a part's rings as plane lon/lat (cached by the caller).
 */
export function strataPairOverlap(
  parts: readonly StratumPart[],
  boxes: readonly [number, number, number, number][],
  planarOf: (i: number) => PolygonsLonLat,
  i: number,
  j: number,
  indices?: readonly number[],
): Problem | null {
  if (!boxesMayOverlap(boxes[i], boxes[j])) return null;
  const common = polygonsIntersection(planarOf(i), planarOf(j)) as PolygonsLonLat;
  if (common.length === 0) return null;
  const pieces = planarPieces(common);
  const areaM2 = pieces.reduce((s, p) => s + p.areaM2, 0);
  if (areaM2 < MIN_OVERLAP_M2) return null;
  const [a, o] = [parts[i], parts[j]];
  const other = `feature ${indices?.[j] ?? j}${o.id ? ` (${o.id})` : ''}`;
  const what = a.stratum === o.stratum ? `of the same stratum "${a.stratum}"` : `in stratum "${o.stratum}"`;
  return problemMake('error', a.stratum === o.stratum ? 'parts-overlap' : 'strata-overlap',
    { featureIndex: indices?.[i] ?? i, featureId: a.id || undefined, lonLat: pieces[0].lonLat },
    `stratum "${a.stratum}" overlaps ${other} ${what} by ${areaM2.toFixed(2)} m²`, areaM2);
}

/**
 * Pairs of strata features that overlap (a point in two features), by clipping every pair whose
 * bounding boxes overlap: the reference method, kept to check strataOverlaps against. Candidate
 * pairs come from a flatbush index of bounding boxes, then polyclip-ts intersects each pair in plane
 * lon/lat (so shared edges stay exactly shared) and the overlap is measured on the ellipsoid.
 * Returns the problems in the order strataOverlaps gives them.
 */
export function strataOverlapsByClipping(parts: readonly StratumPart[], indices?: readonly number[]): Problem[] {
  if (parts.length < 2) return [];
  const boxes = parts.map(partBox);
  const index = new Flatbush(parts.length);
  for (const b of boxes) index.add(b[0], b[1], b[2], b[3]);
  index.finish();
  const planar: (PolygonsLonLat | undefined)[] = [];
  const planarOf = (i: number) => (planar[i] ??= areaGeometryPlanar(parts[i].geometry));
  const problems: Problem[] = [];
  for (let i = 0; i < parts.length; i++) {
    const b = boxes[i];
    for (const j of index.search(b[0], b[1], b[2], b[3])) {
      if (j <= i) continue;
      const found = strataPairOverlap(parts, boxes, planarOf, i, j, indices);
      if (found) problems.push(found);
    }
  }
  return problems;
}
