import type { FeatureCollection } from 'geojson';

/**
 * GeoJSON text (RFC 7946) of a feature collection, foreign members such as a plot file's
 * `design` kept. Coordinates are written in full precision (lon, lat order, WGS84).
 * @param pretty Indent two spaces (default true; false gives one line).
 */
export function featuresToGeoJson(fc: FeatureCollection, pretty = true): string {
  return `${JSON.stringify(fc, null, pretty ? 2 : undefined)}\n`;
}
