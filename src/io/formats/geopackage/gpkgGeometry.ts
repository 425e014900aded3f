import type { Geometry, Position } from 'geojson';
import { MAX_NESTING_DEPTH } from '../../../core/common/inputLimits';

const WKB_TYPES = ['', 'Point', 'LineString', 'Polygon', 'MultiPoint', 'MultiLineString', 'MultiPolygon', 'GeometryCollection'] as const;

/** Error in a geometry blob; the caller adds file, table and row. */
export class GpkgGeometryError extends Error {}

class Reader {
  at = 0;
  little = true;
  constructor(readonly view: DataView) {}
  u8(): number {
    if (this.at + 1 > this.view.byteLength) throw new GpkgGeometryError('geometry blob ends early');
    return this.view.getUint8(this.at++);
  }
  u32(): number {
    if (this.at + 4 > this.view.byteLength) throw new GpkgGeometryError('geometry blob ends early');
    const v = this.view.getUint32(this.at, this.little);
    this.at += 4;
    return v;
  }
  f64(): number {
    if (this.at + 8 > this.view.byteLength) throw new GpkgGeometryError('geometry blob ends early');
    const v = this.view.getFloat64(this.at, this.little);
    this.at += 8;
    return v;
  }
}

/** A count read from the blob, refused when the bytes left cannot hold that many items of `minBytes` each. */
function countRead(r: Reader, minBytes: number, what: string): number {
  const n = r.u32();
  if (n * minBytes > r.view.byteLength - r.at) throw new GpkgGeometryError(`geometry blob ends early (it claims ${n} ${what})`);
  return n;
}

function wkbRead(r: Reader, depth = 0): Geometry {
  const order = r.u8();
  if (order > 1) throw new GpkgGeometryError(`invalid WKB byte order ${order}`);
  r.little = order === 1;
  const raw = r.u32();
  // ISO WKB adds 1000/2000/3000 for Z/M/ZM; extended WKB sets high bits instead.
  let dims = 2;
  let code = raw & 0x0fffffff;
  if (raw & 0x80000000) dims++;
  if (raw & 0x40000000) dims++;
  if (code > 1000) {
    const flag = Math.floor(code / 1000);
    if (flag > 3) throw new GpkgGeometryError(`unsupported WKB geometry type ${raw}`);
    dims = flag === 3 ? 4 : 3;
    code %= 1000;
  }
  const kind = WKB_TYPES[code];
  if (!kind) throw new GpkgGeometryError(`unsupported WKB geometry type ${raw}`);
  const point = (): Position => {
    const p = [r.f64(), r.f64()];
    for (let d = 2; d < dims; d++) r.f64();
    return p;
  };
  const points = (): Position[] => Array.from({ length: countRead(r, 8 * dims, 'points') }, point);
  const rings = (): Position[][] => Array.from({ length: countRead(r, 4, 'rings') }, points);
  switch (kind) {
    case 'Point':
      return { type: 'Point', coordinates: point() };
    case 'LineString':
      return { type: 'LineString', coordinates: points() };
    case 'Polygon':
      return { type: 'Polygon', coordinates: rings() };
    default: {
      if (depth >= MAX_NESTING_DEPTH) throw new GpkgGeometryError(`geometry collections are nested more than ${MAX_NESTING_DEPTH} deep (stratplot's limit)`);
      const parts = Array.from({ length: countRead(r, 9, 'parts') }, () => wkbRead(r, depth + 1));
      const member = kind === 'MultiPoint' ? 'Point' : kind === 'MultiLineString' ? 'LineString' : kind === 'MultiPolygon' ? 'Polygon' : null;
      const stray = member ? parts.find((g) => g.type !== member) : undefined;
      if (stray) throw new GpkgGeometryError(`a ${kind} holds a ${stray.type}`);
      if (kind === 'GeometryCollection') return { type: 'GeometryCollection', geometries: parts };
      const coords = parts.map((g) => (g as { coordinates: unknown }).coordinates);
      return { type: kind, coordinates: coords } as Geometry;
    }
  }
}

/**
 * Reads a GeoPackage geometry blob (OGC 12-128r18 GeoPackage 1.3, §2.1.3: "GP" magic, version,
 * flags with byte order, empty bit and envelope size, srs_id, envelope, then ISO WKB per
 * OGC 06-103r4 §8.2). Returns null for an empty geometry; Z and M values are dropped.
 * Throws GpkgGeometryError for a blob that does not follow the layout.
 */
export function gpkgGeometryRead(blob: Uint8Array): { geometry: Geometry | null; srsId: number } {
  const view = new DataView(blob.buffer, blob.byteOffset, blob.byteLength);
  if (blob.length < 8 || blob[0] !== 0x47 || blob[1] !== 0x50) throw new GpkgGeometryError('not a GeoPackage geometry (no "GP" header)');
  const flags = blob[3];
  const little = (flags & 1) === 1;
  const envelope = (flags >> 1) & 7;
  const sizes = [0, 32, 48, 48, 64];
  if (envelope > 4) throw new GpkgGeometryError(`invalid envelope code ${envelope}`);
  const srsId = view.getInt32(4, little);
  if (flags & 0x10) return { geometry: null, srsId };
  const r = new Reader(view);
  r.at = 8 + sizes[envelope];
  const geometry = wkbRead(r);
  if (geometry.type === 'Point' && geometry.coordinates.some(Number.isNaN)) return { geometry: null, srsId };
  return { geometry, srsId };
}

function wkbSize(g: Geometry): number {
  switch (g.type) {
    case 'Point':
      return 21;
    case 'LineString':
    case 'MultiPoint':
      return g.type === 'LineString' ? 9 + 16 * g.coordinates.length : 9 + 21 * g.coordinates.length;
    case 'Polygon':
      return 9 + g.coordinates.reduce((s, r) => s + 4 + 16 * r.length, 0);
    case 'MultiLineString':
      return 9 + g.coordinates.reduce((s, l) => s + 9 + 16 * l.length, 0);
    case 'MultiPolygon':
      return 9 + g.coordinates.reduce((s, p) => s + wkbSize({ type: 'Polygon', coordinates: p }), 0);
    case 'GeometryCollection':
      return 9 + g.geometries.reduce((s, x) => s + wkbSize(x), 0);
  }
}

function wkbWrite(g: Geometry, v: DataView, at: number): number {
  v.setUint8(at, 1);
  v.setUint32(at + 1, WKB_TYPES.indexOf(g.type), true);
  at += 5;
  const pt = (p: Position) => {
    v.setFloat64(at, p[0], true);
    v.setFloat64(at + 8, p[1], true);
    at += 16;
  };
  const pts = (ps: Position[]) => {
    v.setUint32(at, ps.length, true);
    at += 4;
    ps.forEach(pt);
  };
  const count = (n: number) => {
    v.setUint32(at, n, true);
    at += 4;
  };
  switch (g.type) {
    case 'Point':
      pt(g.coordinates);
      break;
    case 'LineString':
      pts(g.coordinates);
      break;
    case 'Polygon':
      count(g.coordinates.length);
      g.coordinates.forEach(pts);
      break;
    case 'MultiPoint':
      count(g.coordinates.length);
      for (const p of g.coordinates) at = wkbWrite({ type: 'Point', coordinates: p }, v, at);
      break;
    case 'MultiLineString':
      count(g.coordinates.length);
      for (const l of g.coordinates) at = wkbWrite({ type: 'LineString', coordinates: l }, v, at);
      break;
    case 'MultiPolygon':
      count(g.coordinates.length);
      for (const p of g.coordinates) at = wkbWrite({ type: 'Polygon', coordinates: p }, v, at);
      break;
    case 'GeometryCollection':
      count(g.geometries.length);
      for (const x of g.geometries) at = wkbWrite(x, v, at);
      break;
  }
  return at;
}

function envelopeOf(g: Geometry): [number, number, number, number] {
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  const walk = (c: unknown): void => {
    if (typeof (c as number[])[0] === 'number') {
      const [x, y] = c as number[];
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    } else (c as unknown[]).forEach(walk);
  };
  if (g.type === 'GeometryCollection') {
    for (const x of g.geometries) {
      const [a, b, c, d] = envelopeOf(x);
      walk([[a, c], [b, d]]);
    }
  } else walk(g.coordinates);
  return [minX, maxX, minY, maxY];
}

/**
 * A GeoPackage geometry blob (GeoPackage 1.3 §2.1.3, little-endian, xy envelope; WKB of
 * OGC 06-103r4 §8.2 in 2D) for a geometry already in the layer's CRS; null → an empty point.
 */
export function gpkgGeometryWrite(geometry: Geometry | null, srsId: number): Uint8Array {
  if (!geometry) {
    const out = new Uint8Array(8 + 21);
    const v = new DataView(out.buffer);
    out.set([0x47, 0x50, 0, 0x11]);
    v.setInt32(4, srsId, true);
    v.setUint8(8, 1);
    v.setUint32(9, 1, true);
    v.setFloat64(13, Number.NaN, true);
    v.setFloat64(21, Number.NaN, true);
    return out;
  }
  const out = new Uint8Array(8 + 32 + wkbSize(geometry));
  const v = new DataView(out.buffer);
  out.set([0x47, 0x50, 0, 0x03]);
  v.setInt32(4, srsId, true);
  for (const [i, n] of envelopeOf(geometry).entries()) v.setFloat64(8 + 8 * i, n, true);
  wkbWrite(geometry, v, 40);
  return out;
}
