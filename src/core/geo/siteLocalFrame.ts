import { limitExceeded, limitNumber, MAX_FRAME_REACH_KM } from '../common/inputLimits';
import { InputError } from '../common/InputError';
import { type LocalFrame, localFrameAt } from './localFrame';
import type { LonLat, StratumPart } from '../model/types';

/**
 * Signed planar area and first moments of a lon/lat ring about (lon0, lat0), longitudes unwrapped
 * and scaled by cos(lat0); worked vertex by vertex, with no shifted copy of the ring.
 */
function ringMoments(ring: readonly LonLat[], unwrap: (lon: number) => number, lon0: number, lat0: number, cosLat0: number): [a: number, mx: number, my: number] {
  let a = 0;
  let mx = 0;
  let my = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const x0 = (unwrap(ring[j][0]) - lon0) * cosLat0;
    const y0 = ring[j][1] - lat0;
    const x1 = (unwrap(ring[i][0]) - lon0) * cosLat0;
    const y1 = ring[i][1] - lat0;
    const c = x0 * y1 - x1 * y0;
    a += c;
    mx += (x0 + x1) * c;
    my += (y0 + y1) * c;
  }
  return [a / 2, mx / 6, my / 6];
}

/** Mean Earth radius, km (IUGG R1 of the ellipsoid), for the frame reach test. */
const EARTH_RADIUS_KM = 6371.0088;

/**
 * Whether longitudes are better read shifted by +360° when negative: true when that makes the
 * site narrower, i.e. it lies across the antimeridian (a stratum split at ±180° as RFC 7946 §3.1.9
 * asks, or a ring running from 179.9° to −179.9°).
 */
function acrossAntimeridian(minLon: number, maxLon: number, minShifted: number, maxShifted: number): boolean {
  return maxShifted - minShifted < maxLon - minLon;
}

/**
 * How to read the site's longitudes as one unbroken range: the identity, or (for a site across the
 * antimeridian) negative longitudes shifted by +360°, the same unwrapping siteLocalFrame uses.
 */
export function siteLongitudeUnwrap(parts: readonly StratumPart[]): (lon: number) => number {
  let minLon = Infinity;
  let maxLon = -Infinity;
  let minShifted = Infinity;
  let maxShifted = -Infinity;
  for (const part of parts) {
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) {
      const shell = poly[0] ?? [];
      for (let i = 0; i < shell.length; i++) {
        const lon = shell[i][0];
        if (lon < minLon) minLon = lon;
        if (lon > maxLon) maxLon = lon;
        const shifted = lon < 0 ? lon + 360 : lon;
        if (shifted < minShifted) minShifted = shifted;
        if (shifted > maxShifted) maxShifted = shifted;
      }
    }
  }
  return acrossAntimeridian(minLon, maxLon, minShifted, maxShifted) ? (lon) => (lon < 0 ? lon + 360 : lon) : (lon) => lon;
}

/**
 * The site's local metric frame: the UTM zone holding the area-weighted centroid of all strata
 * parts (shells less holes). The centroid is the planar one of lon/lat scaled by cos(latitude)
 * about the bounding-box centre, which picks the right zone for any site-sized area; it falls back
 * to the bounding-box centre when the parts have no area. Longitudes are first unwrapped so that a
 * site across the antimeridian is taken where its ground is (zone 60 or 1), not at the mean of
 * +180 and −180. Every vertex must then lie within {@link MAX_FRAME_REACH_KM} of the zone's
 * central meridian (distance on the sphere of mean radius, asin(cos φ · sin Δλ) · R).
 * Source of the centroid formula: the shoelace moments (common practice, no source).
 * Throws InputError when there are no parts, the site lies outside UTM's 80°S–84°N, or it is too
 * large for one UTM frame (naming its reach and the limit).
 */
export function siteLocalFrame(parts: readonly StratumPart[]): LocalFrame {
  // A site's parts array is never changed in place (edits make a new one), and each stage of a
  // design asks for the frame again: one pass over a million vertices is enough.
  const known = framesMade.get(parts);
  if (known) return known;
  const frame = siteLocalFrameMake(parts);
  framesMade.set(parts, frame);
  return frame;
}

const framesMade = new WeakMap<readonly StratumPart[], LocalFrame>();

function siteLocalFrameMake(parts: readonly StratumPart[]): LocalFrame {
  let minLon = Infinity;
  let minLat = Infinity;
  let maxLon = -Infinity;
  let maxLat = -Infinity;
  let minShifted = Infinity;
  let maxShifted = -Infinity;
  const rings: LonLat[][] = [];
  for (const part of parts) {
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) {
      for (const ring of poly) {
        rings.push(ring);
        for (let i = 0; i < ring.length; i++) {
          const lon = ring[i][0];
          const lat = ring[i][1];
          if (lon < minLon) minLon = lon;
          if (lon > maxLon) maxLon = lon;
          if (lat < minLat) minLat = lat;
          if (lat > maxLat) maxLat = lat;
          const shifted = lon < 0 ? lon + 360 : lon;
          if (shifted < minShifted) minShifted = shifted;
          if (shifted > maxShifted) maxShifted = shifted;
        }
      }
    }
  }
  if (!Number.isFinite(minLon)) throw new InputError('the site has no strata polygons to place a local frame on');
  const shift = acrossAntimeridian(minLon, maxLon, minShifted, maxShifted);
  const unwrap = (lon: number) => (shift && lon < 0 ? lon + 360 : lon);
  const [westLon, eastLon] = shift ? [minShifted, maxShifted] : [minLon, maxLon];
  const lon0 = (westLon + eastLon) / 2;
  const lat0 = (minLat + maxLat) / 2;
  const cosLat0 = Math.cos((lat0 * Math.PI) / 180);
  let area = 0;
  let mx = 0;
  let my = 0;
  for (const part of parts) {
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) {
      poly.forEach((ring, r) => {
        const [a, x, y] = ringMoments(ring, unwrap, lon0, lat0, cosLat0);
        // Shells count positive and holes negative, whatever the winding in the file.
        const sign = (r === 0 ? 1 : -1) * Math.sign(a);
        area += sign * a;
        mx += sign * x;
        my += sign * y;
      });
    }
  }
  const useCentroid = Math.abs(area) > 0 && Number.isFinite(mx / area);
  const unwrapped = useCentroid ? lon0 + mx / area / cosLat0 : lon0;
  const lon = unwrapped >= 180 ? unwrapped - 360 : unwrapped;
  const lat = useCentroid ? lat0 + my / area : lat0;
  if (!(lat >= -80 && lat <= 84)) {
    throw new InputError(`the site centre ${lon.toFixed(5)}, ${lat.toFixed(5)} is outside UTM's 80°S–84°N (polar sites are not supported)`);
  }
  const frame = localFrameAt(lon, lat);
  frameReachChecked(frame, rings);
  return frame;
}

/** Refuses a site whose farthest vertex lies more than MAX_FRAME_REACH_KM from the frame's central meridian. */
function frameReachChecked(frame: LocalFrame, rings: readonly (readonly LonLat[])[]): void {
  const meridian = 6 * frame.zone - 183;
  const limit = Math.sin(MAX_FRAME_REACH_KM / EARTH_RADIUS_KM);
  let worst = 0;
  for (const ring of rings) {
    for (let i = 0; i < ring.length; i++) {
      const lon = ring[i][0];
      const lat = ring[i][1];
      if (!(lat >= -80 && lat <= 84)) {
        throw new InputError(`the site reaches latitude ${lat.toFixed(5)} at longitude ${lon.toFixed(5)}, outside UTM's 80°S–84°N (polar ground is not supported)`);
      }
      let d = Math.abs(lon - meridian) % 360;
      if (d > 180) d = 360 - d;
      // Beyond 90° of longitude the meridian's plane is behind the point: as far as it can be.
      const reach = d >= 90 ? 1 : Math.cos((lat * Math.PI) / 180) * Math.sin((d * Math.PI) / 180);
      if (reach > worst) worst = reach;
    }
  }
  if (worst <= limit) return;
  const km = Math.asin(Math.min(1, worst)) * EARTH_RADIUS_KM;
  throw limitExceeded(
    'the site',
    `it is too large for one UTM frame: its strata reach ${limitNumber(km)} km from the central meridian of UTM zone ${frame.zone} (${frame.zone * 6 - 183}°); split it into smaller sites`,
    `${limitNumber(MAX_FRAME_REACH_KM)} km from the central meridian`,
  );
}
