import type { Geometry, Position } from 'geojson';

/** Shape type Point (ESRI Shapefile Technical Description, July 1998, Table 1). */
export const SHP_POINT = 1;
/** Shape type PolyLine (same table). */
export const SHP_POLYLINE = 3;
/** Shape type Polygon (same table). */
export const SHP_POLYGON = 5;
/** Shape type MultiPoint (same table). */
export const SHP_MULTIPOINT = 8;

/** Twice the signed area of a ring in the plane by the shoelace formula: positive when counter-clockwise (y up). */
function ringSignedArea2(ring: Position[]): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    s += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  }
  return s;
}

function closed(ring: Position[]): Position[] {
  const a = ring[0];
  const b = ring[ring.length - 1];
  return a[0] === b[0] && a[1] === b[1] ? ring : [...ring, a];
}

/** Rings of polygons in shapefile order: every shell clockwise, every hole counter-clockwise. */
function polygonParts(polygons: Position[][][]): Position[][] {
  const parts: Position[][] = [];
  for (const polygon of polygons) {
    polygon.forEach((raw, i) => {
      if (raw.length === 0) return;
      const ring = closed(raw);
      const ccw = ringSignedArea2(ring) > 0;
      const wantCcw = i > 0;
      parts.push(ccw === wantCcw ? ring : [...ring].reverse());
    });
  }
  return parts;
}

/** Parts (lines or rings) and record type of a geometry, or null for an empty or null one. */
export function shpParts(geometry: Geometry | null): { type: number; parts: Position[][] } | null {
  if (!geometry) return null;
  switch (geometry.type) {
    case 'Point':
      return { type: SHP_POINT, parts: [[geometry.coordinates]] };
    case 'MultiPoint':
      return geometry.coordinates.length ? { type: SHP_MULTIPOINT, parts: [geometry.coordinates] } : null;
    case 'LineString':
      return geometry.coordinates.length ? { type: SHP_POLYLINE, parts: [geometry.coordinates] } : null;
    case 'MultiLineString':
      return { type: SHP_POLYLINE, parts: geometry.coordinates.filter((l) => l.length > 0) };
    case 'Polygon':
      return { type: SHP_POLYGON, parts: polygonParts([geometry.coordinates]) };
    case 'MultiPolygon':
      return { type: SHP_POLYGON, parts: polygonParts(geometry.coordinates) };
    default:
      return null;
  }
}

function recordBytes(type: number, parts: Position[][] | null): Uint8Array {
  if (!parts || parts.length === 0) {
    const b = new Uint8Array(4);
    return b; // shape type 0: null shape
  }
  if (type === SHP_POINT) {
    const b = new Uint8Array(20);
    const v = new DataView(b.buffer);
    v.setInt32(0, SHP_POINT, true);
    v.setFloat64(4, parts[0][0][0], true);
    v.setFloat64(12, parts[0][0][1], true);
    return b;
  }
  const points = parts.flat();
  const [xmin, ymin, xmax, ymax] = bbox(points);
  const multi = type === SHP_MULTIPOINT;
  const head = multi ? 40 : 44 + 4 * parts.length;
  const b = new Uint8Array(head + 16 * points.length);
  const v = new DataView(b.buffer);
  v.setInt32(0, type, true);
  v.setFloat64(4, xmin, true);
  v.setFloat64(12, ymin, true);
  v.setFloat64(20, xmax, true);
  v.setFloat64(28, ymax, true);
  if (multi) {
    v.setInt32(36, points.length, true);
  } else {
    v.setInt32(36, parts.length, true);
    v.setInt32(40, points.length, true);
    let start = 0;
    parts.forEach((p, i) => {
      v.setInt32(44 + 4 * i, start, true);
      start += p.length;
    });
  }
  points.forEach((p, i) => {
    v.setFloat64(head + 16 * i, p[0], true);
    v.setFloat64(head + 16 * i + 8, p[1], true);
  });
  return b;
}

function bbox(points: Position[]): [number, number, number, number] {
  let xmin = Infinity;
  let ymin = Infinity;
  let xmax = -Infinity;
  let ymax = -Infinity;
  for (const p of points) {
    if (p[0] < xmin) xmin = p[0];
    if (p[0] > xmax) xmax = p[0];
    if (p[1] < ymin) ymin = p[1];
    if (p[1] > ymax) ymax = p[1];
  }
  return points.length ? [xmin, ymin, xmax, ymax] : [0, 0, 0, 0];
}

function header(out: DataView, type: number, lengthBytes: number, box: number[]): void {
  out.setInt32(0, 9994, false);
  out.setInt32(24, lengthBytes / 2, false);
  out.setInt32(28, 1000, true);
  out.setInt32(32, type, true);
  for (const [i, n] of box.entries()) out.setFloat64(36 + 8 * i, n, true);
}

/**
 * Writes one shapefile layer (.shp main file and .shx index) of a single shape type from parts
 * already in the file's CRS, per the ESRI Shapefile Technical Description (July 1998): big-endian
 * file code, lengths and record numbers, little-endian shapes; null parts become null shapes.
 */
export function shpWriteLayer(type: number, records: (Position[][] | null)[]): { shp: Uint8Array; shx: Uint8Array } {
  const bodies = records.map((parts) => recordBytes(type, parts));
  const shpLen = 100 + bodies.reduce((s, b) => s + 8 + b.length, 0);
  const shp = new Uint8Array(shpLen);
  const shx = new Uint8Array(100 + 8 * bodies.length);
  const sv = new DataView(shp.buffer);
  const xv = new DataView(shx.buffer);
  const box = bbox(records.flatMap((p) => (p ? p.flat() : [])));
  header(sv, type, shpLen, box);
  header(xv, type, shx.length, box);
  let at = 100;
  bodies.forEach((body, i) => {
    xv.setInt32(100 + 8 * i, at / 2, false);
    xv.setInt32(104 + 8 * i, body.length / 2, false);
    sv.setInt32(at, i + 1, false);
    sv.setInt32(at + 4, body.length / 2, false);
    shp.set(body, at + 8);
    at += 8 + body.length;
  });
  return { shp, shx };
}
