import { authalicQ } from './equalAreaXY';
import type { LonLat } from '../model/types';

const A = 6378137;
const DEG = Math.PI / 180;
// Mean radius, only to bound the edge-shape term below (its size, not its exact value, matters).
const R_MEAN = 6371008.8;
/** Bound on the summed edge lenses, relative to the area; tests hold the result to 1e-7 of GeographicLib. */
const MAX_RELATIVE_ERROR = 5e-8;
/** Beyond this latitude the bound below grows too fast to be worth it: GeographicLib takes over. */
const MAX_ABS_LAT_DEG = 80;

/**
 * Signed WGS84 area of one ring whose edges are all short, in m² (counter-clockwise positive), or NaN
 * when the ring is not short-edged enough for this route (the caller then uses GeographicLib).
 * Each vertex goes to the Lambert cylindrical equal-area projection of the ellipsoid,
 * x = a·λ, y = a·q(φ)/2 (Snyder 1987 eqs. 3-12 and 10-15), and a shoelace sum near the first vertex
 * gives the area of the ring with edges straight in that projection. A geodesic edge of length L
 * departs from the straight one by a lens of area about L³·(1 + |tan φ|)/(12R); the route is taken
 * only when the sum of those lenses, taken all with one sign, stays under 5e-8 of the ring's area, which keeps it within
 * 1e-7 of GeographicLib's geodesic polygon area (checked in the tests). Rings above 80° latitude,
 * around a pole or across more than 180° of longitude always return NaN.
 * Source: Snyder, Map Projections — A Working Manual, USGS PP 1395 (1987), pp. 16, 76–77.
 */
export function ringAreaAuthalicM2(ring: readonly LonLat[]): number {
  let n = ring.length;
  if (n > 1 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) n -= 1;
  if (n < 3) return 0;
  const lon0 = ring[0][0];
  const lat0 = ring[0][1];
  const q0 = authalicQ(Math.sin(lat0 * DEG));
  const cos0 = Math.cos(lat0 * DEG);
  let sum = 0;
  // Σ L³ with east-west lengths scaled by cos φ0; corrected below for the ring's latitude span.
  let lens = 0;
  let minAbsLat = Math.abs(lat0);
  let maxAbsLat = minAbsLat;
  let prevX = 0;
  let prevY = 0;
  let prevLat = lat0;
  let prevDLon = 0;
  // Visit vertices 1..n-1 then back to 0, so the closing edge is handled inside the loop.
  for (let k = 1; k <= n; k++) {
    const p = ring[k === n ? 0 : k];
    const lat = p[1];
    const absLat = Math.abs(lat);
    if (!(absLat <= MAX_ABS_LAT_DEG)) return Number.NaN;
    if (absLat < minAbsLat) minAbsLat = absLat;
    else if (absLat > maxAbsLat) maxAbsLat = absLat;
    let dLon = p[0] - lon0;
    if (dLon > 180) dLon -= 360;
    else if (dLon < -180) dLon += 360;
    const stepLon = dLon - prevDLon;
    if (Math.abs(stepLon) > 90) return Number.NaN;
    const x = A * dLon * DEG;
    const y = k === n ? 0 : (A / 2) * (authalicQ(Math.sin(lat * DEG)) - q0);
    sum += prevX * y - x * prevY;
    const dx = stepLon * cos0;
    const dy = lat - prevLat;
    const l2 = dx * dx + dy * dy;
    lens += l2 * Math.sqrt(l2);
    prevX = x;
    prevY = y;
    prevLat = lat;
    prevDLon = dLon;
  }
  const area = sum / 2;
  // Back to metres: degrees to radians, R, 1 % for the sphere standing in for the ellipsoid, and the
  // widest cos φ of the ring over cos φ0 (east-west lengths were scaled by cos φ0).
  const widen = Math.cos(minAbsLat * DEG) / cos0;
  const lensM3 = lens * (DEG * R_MEAN) ** 3 * 1.02 * widen * widen * widen;
  const bound = (lensM3 * (1 + Math.tan(maxAbsLat * DEG))) / (12 * R_MEAN);
  if (!(bound <= MAX_RELATIVE_ERROR * Math.abs(area))) return Number.NaN;
  return area;
}
