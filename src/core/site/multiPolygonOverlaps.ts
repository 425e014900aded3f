import { polygonsIntersection } from '../geometry/polygonClip';
import { type PolygonsLonLat, planarPieces } from '../geometry/areaGeometryPlanar';
import { problemMake } from '../common/problemMake';
import { MIN_OVERLAP_M2 } from './strataOverlaps';
import type { AreaGeometry, Problem, ProblemLocation } from '../model/types';

/** More than the m² of one square degree anywhere (111.32 km per degree at the equator, × 1.2). */
const BOX_M2_PER_DEG2 = (1.2 * 111_320) ** 2;

function shellBox(shell: readonly number[][]): [number, number, number, number] {
  const box: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [lon, lat] of shell) {
    if (lon < box[0]) box[0] = lon;
    if (lat < box[1]) box[1] = lat;
    if (lon > box[2]) box[2] = lon;
    if (lat > box[3]) box[3] = lat;
  }
  return box;
}

/**
 * Polygons of one MultiPolygon that overlap each other, as errors with the overlap's ellipsoidal
 * area (m²) and a position inside it: the mapped area adds the polygons, so an overlap would be
 * counted twice (overlaps between features are strataOverlaps' job). As there, polygons are
 * clipped in plane lon/lat with polyclip-ts after a bounding-box test, overlaps under
 * {@link MIN_OVERLAP_M2} are digitising noise, and the overlap is measured on the ellipsoid.
 * @param where the feature, for the message
 */
export function multiPolygonOverlaps(geometry: AreaGeometry, where: ProblemLocation): Problem[] {
  if (geometry.type !== 'MultiPolygon' || geometry.coordinates.length < 2) return [];
  const polys = geometry.coordinates;
  const boxes = polys.map((p) => shellBox(p[0] ?? []));
  // Sorted by west edge, each polygon is compared only with those starting before it ends.
  const order = polys.map((_, i) => i).sort((a, b) => boxes[a][0] - boxes[b][0]);
  const planar = (i: number): PolygonsLonLat => [polys[i].map((ring) => ring.map((p) => [p[0], p[1]] as [number, number]))];
  const problems: Problem[] = [];
  for (let a = 0; a < order.length; a++) {
    const i = order[a];
    const b = boxes[i];
    for (let k = a + 1; k < order.length && boxes[order[k]][0] < b[2]; k++) {
      const j = order[k];
      const c = boxes[j];
      const w = Math.min(b[2], c[2]) - Math.max(b[0], c[0]);
      const h = Math.min(b[3], c[3]) - Math.max(b[1], c[1]);
      if (w <= 0 || h <= 0 || w * h * BOX_M2_PER_DEG2 < MIN_OVERLAP_M2) continue;
      const common = polygonsIntersection(planar(i), planar(j)) as PolygonsLonLat;
      if (common.length === 0) continue;
      const pieces = planarPieces(common);
      const areaM2 = pieces.reduce((s, p) => s + p.areaM2, 0);
      if (areaM2 < MIN_OVERLAP_M2) continue;
      const [first, second] = i < j ? [i, j] : [j, i];
      problems.push(
        problemMake('error', 'multipolygon-overlap', { ...where, lonLat: pieces[0].lonLat },
          `polygons ${first} and ${second} of this MultiPolygon overlap by ${areaM2.toFixed(2)} m² (the overlap would be counted twice); merge them or cut one`, areaM2),
      );
    }
  }
  return problems;
}
