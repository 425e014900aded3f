import type { MultiPolygon, Position } from 'geojson';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import type { AreaGeometry } from '../model/types';

/** Polygons → rings → [lon, lat] as polyclip-ts takes them (degrees treated as plane coordinates). */
export type PolygonsLonLat = [number, number][][][];

/**
 * A polygonal geometry's rings as plane [lon, lat] pairs. Clipping strata against each other in
 * degrees keeps shared edges exactly shared (the same straight segment in lon/lat) and leaves
 * untouched vertices bit-for-bit; a projection would bend them differently per feature.
 * Not valid across the antimeridian.
 */
export function areaGeometryPlanar(geometry: AreaGeometry): PolygonsLonLat {
  const polys: Position[][][] = geometry.type === 'Polygon' ? [geometry.coordinates] : geometry.coordinates;
  return polys.map((poly) => poly.map((ring) => ring.map((p) => [p[0], p[1]] as [number, number])));
}

/**
 * Each polygon of a planar lon/lat clipping result with its ellipsoidal area (m², polygonAreaM2)
 * and a position inside or on it to zoom to (the planar centroid of its shell), largest first.
 */
export function planarPieces(polys: PolygonsLonLat): { geometry: MultiPolygon; areaM2: number; lonLat: Position }[] {
  return polys
    .map((poly) => {
      const geometry: MultiPolygon = { type: 'MultiPolygon', coordinates: [poly] };
      const shell = poly[0];
      const [x0, y0] = shell[0];
      let a = 0;
      let cx = 0;
      let cy = 0;
      for (let i = 1; i < shell.length; i++) {
        const [xa, ya] = [shell[i - 1][0] - x0, shell[i - 1][1] - y0];
        const [xb, yb] = [shell[i][0] - x0, shell[i][1] - y0];
        const c = xa * yb - xb * ya;
        a += c;
        cx += (xa + xb) * c;
        cy += (ya + yb) * c;
      }
      const lonLat: Position = a !== 0 ? [x0 + cx / (3 * a), y0 + cy / (3 * a)] : [x0, y0];
      return { geometry, areaM2: polygonAreaM2(geometry), lonLat };
    })
    .sort((p, q) => q.areaM2 - p.areaM2);
}
