import { GEODESIC_MASK, WGS84_GEODESIC } from './geodesic';

const WGS84 = WGS84_GEODESIC;
// Distance and both azimuths; no reduced length or area needed here.
const MASK = GEODESIC_MASK.distance | GEODESIC_MASK.azimuth;

/** Geodesic distance and true bearings between two WGS84 points. */
export interface BearingDistance {
  /** Geodesic distance along the ellipsoid, metres. */
  distanceM: number;
  /** True bearing (azimuth) leaving the first point, degrees clockwise from true north, 0 ≤ b < 360. */
  bearingTrueDeg: number;
  /** True bearing of travel on arrival at the second point, degrees, 0 ≤ b < 360. */
  arrivalBearingTrueDeg: number;
}

/** Wraps an angle in degrees into [0, 360). */
export function bearingNormalizeDeg(deg: number): number {
  const r = deg % 360;
  const w = r < 0 ? r + 360 : r;
  // -1e-15 % 360 + 360 rounds to 360 in floating point.
  return w >= 360 ? 0 : w;
}

/**
 * Distance and true bearing from one WGS84 point to another along the geodesic (inverse problem).
 * @param lon1 @param lat1 start, degrees; @param lon2 @param lat2 end, degrees.
 * @returns distance in metres and bearings in degrees clockwise from true north in [0, 360);
 *   for coincident points the distance is 0 and the bearing 0.
 * @throws RangeError when a coordinate is not finite or a latitude is outside ±90°.
 * Source: Karney, "Algorithms for geodesics", J. Geodesy 87:43–55 (2013), via geographiclib-geodesic.
 */
export function bearingDistance(lon1: number, lat1: number, lon2: number, lat2: number): BearingDistance {
  for (const [name, v] of [
    ['lon1', lon1],
    ['lat1', lat1],
    ['lon2', lon2],
    ['lat2', lat2],
  ] as const) {
    if (!Number.isFinite(v)) throw new RangeError(`bearingDistance: ${name} is not a finite number (${v})`);
  }
  if (Math.abs(lat1) > 90 || Math.abs(lat2) > 90) {
    throw new RangeError(`bearingDistance: latitude outside ±90° (${lat1}, ${lat2})`);
  }
  return bearingDistanceUnchecked(lon1, lat1, lon2, lat2);
}

/** {@link bearingDistance} without argument checks, for inner loops over validated positions. */
export function bearingDistanceUnchecked(lon1: number, lat1: number, lon2: number, lat2: number): BearingDistance {
  if (lon1 === lon2 && lat1 === lat2) return { distanceM: 0, bearingTrueDeg: 0, arrivalBearingTrueDeg: 0 };
  const r = WGS84.Inverse(lat1, lon1, lat2, lon2, MASK);
  return {
    distanceM: r.s12 ?? 0,
    bearingTrueDeg: bearingNormalizeDeg(r.azi1 ?? 0),
    arrivalBearingTrueDeg: bearingNormalizeDeg(r.azi2 ?? 0),
  };
}

/** Geodesic distance in metres between two WGS84 points (see {@link bearingDistance}). */
export function geodesicDistanceM(lon1: number, lat1: number, lon2: number, lat2: number): number {
  if (lon1 === lon2 && lat1 === lat2) return 0;
  return WGS84.Inverse(lat1, lon1, lat2, lon2, GEODESIC_MASK.distance).s12 ?? 0;
}
