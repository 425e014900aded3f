import { gpx } from '@tmcw/togeojson';
import type { Feature, FeatureCollection, Geometry, Position } from 'geojson';
import { InputError } from '../../../core/common/InputError';
import { xmlParse } from '../../common/xmlParse';

function restoreGeometry(g: Geometry, shape: string | undefined, where: string): Geometry {
  if (!shape) return g;
  const lines: Position[][] = g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : [];
  const [kind, layout] = shape.split(':');
  if (kind === 'MultiLineString') return { type: 'MultiLineString', coordinates: lines };
  if (kind === 'Polygon') return { type: 'Polygon', coordinates: lines };
  if (kind === 'MultiPolygon') {
    const counts = (layout ?? '').split(',').map(Number);
    const total = counts.reduce((a, b) => a + b, 0);
    if (!counts.every((n) => Number.isInteger(n) && n > 0) || total !== lines.length) {
      throw new InputError(`${where}: its stratplot ring layout "${layout}" does not fit its ${lines.length} lines (the file is damaged)`);
    }
    let at = 0;
    return { type: 'MultiPolygon', coordinates: counts.map((n) => lines.slice(at, (at += n))) };
  }
  return g;
}

function checkPositions(fileName: string, index: number, g: Geometry): void {
  const walk = (c: unknown): void => {
    if (typeof (c as number[])[0] !== 'number') {
      (c as unknown[]).forEach(walk);
      return;
    }
    const [lon, lat] = c as number[];
    if (!(Math.abs(lat) <= 90 && Math.abs(lon) <= 180)) {
      throw new InputError(`${fileName}: feature ${index}: position lat="${lat}" lon="${lon}" is outside WGS84 ranges`);
    }
  };
  if ('coordinates' in g) walk(g.coordinates);
}

/** GPX 1.1 latitudeType and longitudeType are xsd:decimal: digits with an optional point, no exponent, no "0x". */
const GPX_DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)$/;

/** Every wpt/rtept/trkpt must carry a usable lat and lon; togeojson would silently skip the rest (or read "0x10" as 16). */
function checkPointElements(fileName: string, doc: Document): void {
  for (const tag of ['wpt', 'rtept', 'trkpt']) {
    Array.from(doc.getElementsByTagName(tag)).forEach((el, i) => {
      for (const [attr, max] of [['lat', 90], ['lon', 180]] as const) {
        const raw = el.getAttribute(attr);
        const v = Number(raw);
        if (raw === null || !GPX_DECIMAL.test(raw.trim()) || !Number.isFinite(v) || Math.abs(v) > max) {
          const name = el.getElementsByTagName('name')[0]?.textContent;
          throw new InputError(
            `${fileName}: <${tag}> ${i + 1}${name ? ` ("${name}")` : ''}: ${attr}=${raw === null ? 'missing' : `"${raw}"`} is not a ${attr === 'lat' ? 'latitude (−90 to 90)' : 'longitude (−180 to 180)'}`,
          );
        }
      }
    });
  }
}

function stripAltitude(p: Position): Position {
  return p.length > 2 && p[2] === undefined ? [p[0], p[1]] : p;
}

/**
 * Reads GPX 1.0/1.1 (via @tmcw/togeojson) as WGS84 GeoJSON: tracks and routes as lines,
 * waypoints as points, with name, cmt, desc, type and time as properties. Files written by
 * stratplot carry their full properties and polygon ring layout in extensions, which are
 * restored, so polygons and typed attributes survive a round trip. Throws InputError naming
 * `fileName` for text that is not XML, not GPX, or has a coordinate outside WGS84 ranges.
 */
export async function parseGpx(fileName: string, bytes: Uint8Array): Promise<FeatureCollection> {
  const doc = xmlParse(fileName, new TextDecoder().decode(bytes));
  if (doc.documentElement?.localName !== 'gpx') {
    throw new InputError(`${fileName}: not a GPX file (the root element is <${doc.documentElement?.nodeName}>, not <gpx>)`);
  }
  checkPointElements(fileName, doc);
  const raw = gpx(doc);
  const features: Feature[] = [];
  const multiPoints = new Map<string, Feature>();
  raw.features.forEach((f, i) => {
    const props = { ...(f.properties ?? {}) } as Record<string, unknown>;
    const shape = typeof props.sp_shape === 'string' ? props.sp_shape : undefined;
    let properties: Record<string, unknown>;
    if (typeof props.sp_properties === 'string') {
      try {
        properties = JSON.parse(props.sp_properties);
      } catch {
        throw new InputError(`${fileName}: feature ${i}: its stratplot properties are damaged (not JSON)`);
      }
    } else {
      properties = props;
      delete properties.coordinateProperties;
      delete properties.sp_shape;
    }
    if (!f.geometry) return;
    if (f.geometry.type === 'Point') f.geometry.coordinates = stripAltitude(f.geometry.coordinates);
    const geometry = restoreGeometry(f.geometry, shape, `${fileName}: feature ${i}`);
    checkPositions(fileName, i, geometry);
    if (shape?.startsWith('MultiPoint:') && geometry.type === 'Point') {
      const group = multiPoints.get(shape);
      if (group) {
        (group.geometry as { coordinates: Position[] }).coordinates.push(geometry.coordinates);
        return;
      }
      const first: Feature = { type: 'Feature', properties, geometry: { type: 'MultiPoint', coordinates: [geometry.coordinates] } };
      multiPoints.set(shape, first);
      features.push(first);
      return;
    }
    features.push({ type: 'Feature', properties, geometry });
  });
  return { type: 'FeatureCollection', features };
}
