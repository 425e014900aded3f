import type { Feature, FeatureCollection, Geometry } from 'geojson';
import { jsonDepthOver, limitExceeded, MAX_NESTING_DEPTH } from '../../../core/common/inputLimits';
import { InputError } from '../../../core/common/InputError';
import { featuresToWgs84 } from '../../crs/featuresToWgs84';
import { jsonErrorOffset } from '../../common/jsonErrorOffset';

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
 * CRS84/EPSG:4326 pass through, other EPSG codes are converted with crsResolve's definitions;
 * `epsg` stands in for a missing `crs`. Throws InputError for text that is not JSON (with line and
 * column), is not GeoJSON, has a malformed geometry (naming the feature index), names a CRS
 * stratplot does not carry, or names one that contradicts `epsg`.
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
  const code = sourceEpsg(fileName, root.crs, epsg);
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

/**
 * EPSG code named by a pre-RFC 7946 `crs` member (GeoJSON 2008 §3: a named CRS as an OGC URN,
 * "EPSG:n" or an OGC http URI; the older `{"type":"EPSG","properties":{"code":n}}` form is read
 * too), or undefined when there is none; an unreadable member yields `given` when there is one.
 * Whether the code is one we can convert is crsResolve's call.
 */
function crsEpsg(fileName: string, crs: unknown, given: number | undefined): number | undefined {
  if (crs === undefined || crs === null) return undefined;
  const props = (crs as { properties?: { name?: unknown; code?: unknown } }).properties;
  if (typeof props?.code === 'number' && Number.isInteger(props.code)) return props.code;
  const name = props?.name;
  // A crs member we cannot read is no contradiction of a code the user gave for the file.
  if (typeof name !== 'string') {
    if (given !== undefined) return given;
    throw new InputError(`${fileName}: the "crs" member has no name; give the file's EPSG code (--epsg)`);
  }
  if (/CRS84$/i.test(name.trim())) return 4326;
  const match = /EPSG:(?:[\d.]*:)?(\d+)$/i.exec(name.trim()) ?? /\/def\/crs\/EPSG\/[^/]+\/(\d+)$/i.exec(name.trim());
  if (!match && given !== undefined) return given;
  if (!match) throw new InputError(`${fileName}: coordinate system "${name}" in the "crs" member is not an EPSG code; give the file's EPSG code (--epsg)`);
  return Number(match[1]);
}

/** The code to convert from: the file's `crs` member, else the epsg option; a contradiction is refused. */
function sourceEpsg(fileName: string, crs: unknown, epsg: number | undefined): number | undefined {
  const stated = crsEpsg(fileName, crs, epsg);
  if (stated !== undefined && epsg !== undefined && stated !== epsg) {
    throw new InputError(`${fileName}: its "crs" member names EPSG:${stated} but EPSG:${epsg} was given (--epsg); leave out one of them`);
  }
  return stated ?? epsg;
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
  if (properties && jsonDepthOver(properties, MAX_NESTING_DEPTH)) {
    throw limitExceeded(`${fileName}: feature ${index}`, `its properties are nested more than ${MAX_NESTING_DEPTH} deep`, `${MAX_NESTING_DEPTH} levels`);
  }
  const geometry = f.geometry === null || f.geometry === undefined ? null : geometryChecked(fileName, f.geometry, index);
  const feature: Feature = { type: 'Feature', properties: (properties as Record<string, unknown>) ?? {}, geometry: geometry as Geometry };
  if (typeof f.id === 'string' || typeof f.id === 'number') feature.id = f.id;
  return feature;
}

function geometryChecked(fileName: string, value: unknown, index: number, depth = 0): Geometry {
  const g = value as Record<string, unknown>;
  const type = g?.type;
  if (typeof type !== 'string' || !GEOMETRY_TYPES.has(type)) {
    throw new InputError(`${fileName}: feature ${index}: unknown geometry type ${JSON.stringify(type ?? null)}`);
  }
  if (type === 'GeometryCollection') {
    if (!Array.isArray(g.geometries)) throw new InputError(`${fileName}: feature ${index}: GeometryCollection has no "geometries"`);
    if (depth >= MAX_NESTING_DEPTH) {
      throw limitExceeded(`${fileName}: feature ${index}`, `GeometryCollections are nested more than ${MAX_NESTING_DEPTH} deep`, `${MAX_NESTING_DEPTH} levels`);
    }
    return { type, geometries: g.geometries.map((member) => geometryChecked(fileName, member, index, depth + 1)) };
  }
  coordinatesChecked(fileName, index, type, g.coordinates, NESTING[type]);
  return { type, coordinates: g.coordinates } as Geometry;
}

function coordinatesChecked(fileName: string, index: number, type: string, c: unknown, depth: number): void {
  if (depth === 0) {
    const ok = Array.isArray(c) && c.length >= 2 && c.every((v) => typeof v === 'number' && Number.isFinite(v));
    if (!ok) {
      throw new InputError(`${fileName}: feature ${index}: ${type} has a position that is not [lon, lat] numbers: ${positionShown(c)}`);
    }
    return;
  }
  if (!Array.isArray(c)) throw new InputError(`${fileName}: feature ${index}: ${type} coordinates are not nested arrays`);
  for (const member of c) coordinatesChecked(fileName, index, type, member, depth - 1);
}

/** A short picture of a bad position, without walking into arrays nested arbitrarily deep. */
function positionShown(c: unknown): string {
  if (!Array.isArray(c)) return JSON.stringify(c ?? null)?.slice(0, 60) ?? String(c);
  const items = c.slice(0, 3).map((v) => (Array.isArray(v) ? '[…]' : typeof v === 'number' || typeof v === 'boolean' || v === null ? String(v) : JSON.stringify(v)?.slice(0, 20)));
  return `[${items.join(', ')}${c.length > 3 ? ', …' : ''}]`;
}

