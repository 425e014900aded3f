import type { FeatureCollection, Geometry, Position } from 'geojson';
import { InputError } from '../../core/common/InputError';
import { crsDegreesCheck } from './crsDegreesCheck';
import { crsResolveEpsg } from './crsResolve';

/**
 * Converts every coordinate of a feature collection from the given EPSG code to WGS84 lon/lat
 * (returns a new collection; the input is not changed). Altitudes are kept. The definition,
 * datum shift included, comes from crsResolveEpsg, the one table of coordinate systems imports use.
 * Throws InputError naming the file for a code stratplot does not carry (listing the supported
 * ones), or naming the feature and position whose coordinates do not convert to a position on
 * Earth, or when every coordinate is degree-sized while the code names a projected system
 * (crsDegreesCheck).
 */
export function featuresToWgs84(fc: FeatureCollection, epsg: number, fileName: string): FeatureCollection {
  const crs = crsResolveEpsg(epsg, fileName);
  if (crs.epsg === 4326) return fc;
  crsDegreesCheck(fc, crs, fileName);
  const features = fc.features.map((feature, index) => {
    let position = 0;
    const convert = (p: Position): Position => {
      const [lon, lat] = crs.toWgs84(p[0], p[1]);
      if (!(Number.isFinite(lon) && Number.isFinite(lat) && Math.abs(lat) <= 90 && Math.abs(lon) <= 540)) {
        throw new InputError(
          `${fileName}: feature ${index}, position ${position}: ${p[0]}, ${p[1]} is not a position in ${crs.label} (it does not convert to WGS84)`,
        );
      }
      position++;
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
