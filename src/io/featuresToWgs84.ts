import type { FeatureCollection, Geometry, Position } from 'geojson';
import proj4 from 'proj4';
import { InputError } from '../core/InputError';

/** EPSG codes that already are WGS84 longitude/latitude in degrees. */
const WGS84_CODES = new Set([4326, 4979]);

/**
 * The proj4 definition for an EPSG code: WGS84 UTM zones (326xx north, 327xx south) are built
 * here, other codes only when proj4 itself knows them (4269, 3857 and their aliases).
 * Returns null for codes we cannot convert.
 */
export function epsgProj4Definition(epsg: number): string | null {
  const zone = epsg % 100;
  const base = epsg - zone;
  if ((base === 32600 || base === 32700) && zone >= 1 && zone <= 60) {
    return `+proj=utm +zone=${zone}${base === 32700 ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`;
  }
  const known = proj4.defs(`EPSG:${epsg}`);
  return known ? `EPSG:${epsg}` : null;
}

/** True when the EPSG code is WGS84 lon/lat and needs no conversion. */
export function isWgs84Epsg(epsg: number): boolean {
  return WGS84_CODES.has(epsg);
}

/**
 * Converts every coordinate of a feature collection from the given EPSG code to WGS84 lon/lat
 * (returns a new collection; the input is not changed). Altitudes are kept.
 * Throws InputError naming the code when proj4 cannot convert it, or naming the feature whose
 * coordinates do not convert (e.g. metres given for a degrees system).
 */
export function featuresToWgs84(fc: FeatureCollection, epsg: number, fileName: string): FeatureCollection {
  if (isWgs84Epsg(epsg)) return fc;
  const def = epsgProj4Definition(epsg);
  if (!def) {
    throw new InputError(
      `${fileName}: coordinate system EPSG:${epsg} is not one stratplot can convert (it knows WGS84 EPSG:4326, ` +
        'UTM EPSG:326xx/327xx, EPSG:3857 and EPSG:4269); reproject the file to EPSG:4326 first',
    );
  }
  const converter = proj4(def, 'EPSG:4326');
  const features = fc.features.map((feature, index) => {
    const convert = (p: Position): Position => {
      const [lon, lat] = converter.forward([p[0], p[1]]);
      if (!Number.isFinite(lon) || !Number.isFinite(lat)) {
        throw new InputError(
          `${fileName}: feature ${index}: coordinate ${p[0]}, ${p[1]} does not convert from EPSG:${epsg} to WGS84`,
        );
      }
      return p.length > 2 ? [lon, lat, ...p.slice(2)] : [lon, lat];
    };
    return { ...feature, geometry: feature.geometry ? geometryMapPositions(feature.geometry, convert) : feature.geometry };
  });
  return { ...fc, features };
}

/** A copy of a geometry with every position passed through `f`. */
export function geometryMapPositions(geometry: Geometry, f: (p: Position) => Position): Geometry {
  switch (geometry.type) {
    case 'Point':
      return { ...geometry, coordinates: f(geometry.coordinates) };
    case 'MultiPoint':
    case 'LineString':
      return { ...geometry, coordinates: geometry.coordinates.map(f) };
    case 'MultiLineString':
    case 'Polygon':
      return { ...geometry, coordinates: geometry.coordinates.map((line) => line.map(f)) };
    case 'MultiPolygon':
      return { ...geometry, coordinates: geometry.coordinates.map((poly) => poly.map((ring) => ring.map(f))) };
    case 'GeometryCollection':
      return { ...geometry, geometries: geometry.geometries.map((g) => geometryMapPositions(g, f)) };
  }
}
