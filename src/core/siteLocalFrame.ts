import { InputError } from './InputError';
import { type LocalFrame, localFrameAt } from './localFrame';
import type { LonLat, StratumPart } from './types';

/** Signed planar area and first moments of a lon/lat ring, with longitudes scaled by cos(lat0). */
function ringMoments(ring: readonly LonLat[], cosLat0: number): [a: number, mx: number, my: number] {
  let a = 0;
  let mx = 0;
  let my = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const x0 = ring[j][0] * cosLat0;
    const y0 = ring[j][1];
    const x1 = ring[i][0] * cosLat0;
    const y1 = ring[i][1];
    const c = x0 * y1 - x1 * y0;
    a += c;
    mx += (x0 + x1) * c;
    my += (y0 + y1) * c;
  }
  return [a / 2, mx / 6, my / 6];
}

/**
 * The site's local metric frame: the UTM zone holding the area-weighted centroid of all strata
 * parts (shells less holes). The centroid is the planar one of lon/lat scaled by cos(latitude)
 * about the bounding-box centre, which picks the right zone for any site-sized area; it falls back
 * to the bounding-box centre when the parts have no area. Sites crossing the antimeridian are not
 * supported. Source of the centroid formula: the shoelace moments (common practice, no source).
 * Throws InputError when there are no parts or the site lies outside UTM's 80°S–84°N.
 */
export function siteLocalFrame(parts: readonly StratumPart[]): LocalFrame {
  let minLon = Infinity;
  let minLat = Infinity;
  let maxLon = -Infinity;
  let maxLat = -Infinity;
  const rings: LonLat[][] = [];
  for (const part of parts) {
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) {
      for (const ring of poly) {
        rings.push(ring);
        for (const [lon, lat] of ring) {
          if (lon < minLon) minLon = lon;
          if (lon > maxLon) maxLon = lon;
          if (lat < minLat) minLat = lat;
          if (lat > maxLat) maxLat = lat;
        }
      }
    }
  }
  if (!Number.isFinite(minLon)) throw new InputError('the site has no strata polygons to place a local frame on');
  const lon0 = (minLon + maxLon) / 2;
  const lat0 = (minLat + maxLat) / 2;
  const cosLat0 = Math.cos((lat0 * Math.PI) / 180);
  let area = 0;
  let mx = 0;
  let my = 0;
  for (const part of parts) {
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) {
      poly.forEach((ring, r) => {
        const shifted = ring.map(([lon, lat]) => [lon - lon0, lat - lat0]);
        const [a, x, y] = ringMoments(shifted, cosLat0);
        // Shells count positive and holes negative, whatever the winding in the file.
        const sign = (r === 0 ? 1 : -1) * Math.sign(a);
        area += sign * a;
        mx += sign * x;
        my += sign * y;
      });
    }
  }
  const useCentroid = Math.abs(area) > 0 && Number.isFinite(mx / area);
  const lon = useCentroid ? lon0 + mx / area / cosLat0 : lon0;
  const lat = useCentroid ? lat0 + my / area : lat0;
  if (!(lat >= -80 && lat <= 84)) {
    throw new InputError(`the site centre ${lon.toFixed(5)}, ${lat.toFixed(5)} is outside UTM's 80°S–84°N (polar sites are not supported)`);
  }
  return localFrameAt(lon, lat);
}
