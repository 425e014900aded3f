import { geodesicRingAreaM2 } from './geodesicRingAreaM2';
import type { AreaGeometry, LonLat } from '../model/types';

/**
 * Area of a Polygon or MultiPolygon on the WGS84 ellipsoid, in m²: each shell less its holes,
 * whatever the winding of the input rings. Edges are geodesics (GeographicLib's model), which for
 * site-sized strata differs from rhumb-line edges by about 1e-9 relative. Rings of short edges are
 * measured in an equal-area projection instead (geodesicRingAreaM2), within 1e-7 of GeographicLib.
 * Source: Karney (2013) through geographiclib-geodesic; Snyder (1987) eqs. 3-12, 10-15.
 */
export function polygonAreaM2(geometry: AreaGeometry): number {
  const polygons: LonLat[][][] = geometry.type === 'Polygon' ? [geometry.coordinates] : geometry.coordinates;
  let total = 0;
  for (const rings of polygons) {
    if (rings.length === 0) continue;
    let area = Math.abs(geodesicRingAreaM2(rings[0]));
    for (let r = 1; r < rings.length; r++) area -= Math.abs(geodesicRingAreaM2(rings[r]));
    total += area;
  }
  return total;
}

/** Square metres per hectare. */
export const M2_PER_HA = 10_000;
