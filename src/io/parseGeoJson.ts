import type { Feature, FeatureCollection, Geometry } from 'geojson';
import { InputError } from '../core/InputError';
import { featuresToWgs84 } from './featuresToWgs84';
import { jsonErrorOffset } from './jsonErrorOffset';

const GEOMETRY_TYPES = new Set([
  'Point',
  'MultiPoint',
  'LineString',
  'MultiLineString',
  'Polygon',
  'MultiPolygon',
  'GeometryCollection',
]);

/** Depth of coordinate nesting each geometry type must have (Point 0 = one position). */
const NESTING: Record<string, number> = {
  Point: 0,
  MultiPoint: 1,
  LineString: 1,
  MultiLineString: 2,
  Polygon: 2,
  MultiPolygon: 3,
};

/**
 * Reads GeoJSON text (RFC 7946): a FeatureCollection, a single Feature or a bare geometry, always
 * returned as a FeatureCollection in WGS84 lon/lat. The pre-RFC `crs` member is honoured:
 * CRS84/EPSG:4326 pass through, other EPSG codes are converted; `epsg` overrides a missing `crs`.
 * Throws InputError for text that is not JSON (with line and column), is not GeoJSON, or has a
 * malformed geometry (naming the feature index).
 */
export function parseGeoJson(fileName: string, text: string, epsg?: number): FeatureCollection {
  const data = jsonParseWithPosition(fileName, text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  if (data === null || typeof data !== 'object' || Array.isArray(data)) {
    throw new InputError(`${fileName}: not GeoJSON (expected an object with a "type" member)`);
  }
  const root = data as Record<string, unknown>;
  let fc: FeatureCollection;
  if (root.type === 'FeatureCollection') {
    if (!Array.isArray(root.features)) throw new InputError(`${fileName}: FeatureCollection has no "features" array`);
    const features = root.features.map((f, i) => featureChecked(fileName, f, i));
    fc = { type: 'FeatureCollection', features };
  } else if (root.type === 'Feature') {
    fc = { type: 'FeatureCollection', features: [featureChecked(fileName, root, 0)] };
  } else if (typeof root.type === 'string' && GEOMETRY_TYPES.has(root.type)) {
    const geometry = geometryChecked(fileName, root, 0);
    fc = { type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry }] };
  } else {
    throw new InputError(`${fileName}: not GeoJSON (type is ${JSON.stringify(root.type ?? null)})`);
  }
  const code = crsEpsg(fileName, root.crs) ?? epsg;
  return code === undefined ? fc : featuresToWgs84(fc, code, fileName);
}

function jsonParseWithPosition(fileName: string, text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    let offset = -1;
    try {
      offset = jsonErrorOffset(text);
    } catch {
      // Nested too deeply to locate the error; still say it is not JSON.
    }
    if (offset < 0) throw new InputError(`${fileName}: not valid JSON`);
    const before = text.slice(0, offset);
    const line = before.split('\n').length;
    const column = offset - before.lastIndexOf('\n');
    throw new InputError(`${fileName}: not valid JSON (line ${line}, column ${column})`);
  }
}

/** EPSG code named by a pre-RFC 7946 `crs` member, or undefined when there is none. */
function crsEpsg(fileName: string, crs: unknown): number | undefined {
  if (crs === undefined || crs === null) return undefined;
  const name = (crs as { properties?: { name?: unknown } }).properties?.name;
  if (typeof name !== 'string') throw new InputError(`${fileName}: the "crs" member has no name`);
  if (/CRS84$/i.test(name)) return 4326;
  const match = /EPSG:(?:[\d.]*:)?(\d+)$/i.exec(name);
  if (!match) throw new InputError(`${fileName}: coordinate system "${name}" is not an EPSG code stratplot knows`);
  return Number(match[1]);
}

function featureChecked(fileName: string, value: unknown, index: number): Feature {
  if (value === null || typeof value !== 'object' || (value as { type?: unknown }).type !== 'Feature') {
    throw new InputError(`${fileName}: feature ${index} is not a GeoJSON Feature`);
  }
  const f = value as Record<string, unknown>;
  const properties = f.properties;
  if (properties !== null && properties !== undefined && (typeof properties !== 'object' || Array.isArray(properties))) {
    throw new InputError(`${fileName}: feature ${index}: "properties" must be an object or null`);
  }
  const geometry = f.geometry === null || f.geometry === undefined ? null : geometryChecked(fileName, f.geometry, index);
  const feature: Feature = { type: 'Feature', properties: (properties as Record<string, unknown>) ?? {}, geometry: geometry as Geometry };
  if (typeof f.id === 'string' || typeof f.id === 'number') feature.id = f.id;
  return feature;
}

function geometryChecked(fileName: string, value: unknown, index: number): Geometry {
  const g = value as Record<string, unknown>;
  const type = g?.type;
  if (typeof type !== 'string' || !GEOMETRY_TYPES.has(type)) {
    throw new InputError(`${fileName}: feature ${index}: unknown geometry type ${JSON.stringify(type ?? null)}`);
  }
  if (type === 'GeometryCollection') {
    if (!Array.isArray(g.geometries)) throw new InputError(`${fileName}: feature ${index}: GeometryCollection has no "geometries"`);
    return { type, geometries: g.geometries.map((member) => geometryChecked(fileName, member, index)) };
  }
  coordinatesChecked(fileName, index, type, g.coordinates, NESTING[type]);
  return { type, coordinates: g.coordinates } as Geometry;
}

function coordinatesChecked(fileName: string, index: number, type: string, c: unknown, depth: number): void {
  if (depth === 0) {
    const ok = Array.isArray(c) && c.length >= 2 && c.every((v) => typeof v === 'number' && Number.isFinite(v));
    if (!ok) {
      throw new InputError(`${fileName}: feature ${index}: ${type} has a position that is not [lon, lat] numbers: ${JSON.stringify(c)?.slice(0, 60)}`);
    }
    return;
  }
  if (!Array.isArray(c)) throw new InputError(`${fileName}: feature ${index}: ${type} coordinates are not nested arrays`);
  for (const member of c) coordinatesChecked(fileName, index, type, member, depth - 1);
}
