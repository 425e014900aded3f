import geodesic from 'geographiclib-geodesic';

/**
 * The only place stratplot reaches GeographicLib: the WGS84 geodesic solver and its output masks.
 * Source: Karney, "Algorithms for geodesics", J. Geodesy 87 (2013), via geographiclib-geodesic.
 */
export const WGS84_GEODESIC = geodesic.Geodesic.WGS84;

/** Output masks of {@link WGS84_GEODESIC}'s Inverse and Direct. */
export const GEODESIC_MASK = {
  distance: geodesic.Geodesic.DISTANCE,
  azimuth: geodesic.Geodesic.AZIMUTH,
  area: geodesic.Geodesic.AREA,
} as const;

