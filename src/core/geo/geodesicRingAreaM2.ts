import { WGS84_GEODESIC } from './geodesic';
import { ringAreaAuthalicM2 } from './ringAreaAuthalicM2';
import type { LonLat } from '../model/types';

const WGS84 = WGS84_GEODESIC;

/**
 * Signed area of one ring on the WGS84 ellipsoid, in m², edges taken as geodesics.
 * Counter-clockwise rings (GeoJSON shells) are positive. A closing vertex equal to the first is optional.
 * Rings of short edges take the equal-area projection route of {@link ringAreaAuthalicM2} (within 1e-7
 * of the geodesic area, some fifteen times faster); the rest go through GeographicLib.
 * Source: Karney, "Algorithms for geodesics", J. Geodesy 87 (2013), via geographiclib-geodesic.
 */
export function geodesicRingAreaM2(ring: readonly LonLat[]): number {
  const fast = ringAreaAuthalicM2(ring);
  if (!Number.isNaN(fast)) return fast;
  const poly = WGS84.Polygon(false);
  let n = ring.length;
  if (n > 1 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) n -= 1;
  if (n < 3) return 0;
  for (let i = 0; i < n; i++) poly.AddPoint(ring[i][1], ring[i][0]);
  return poly.Compute(false, true).area ?? 0;
}

/** Length of one ring or line on the WGS84 ellipsoid, in metres (geodesic edges). */
export function geodesicPathLengthM(path: readonly LonLat[], closed: boolean): number {
  const line = WGS84.Polygon(!closed);
  for (const p of path) line.AddPoint(p[1], p[0]);
  return line.Compute(false, true).perimeter;
}
