import type { Position } from 'geojson';
import { polygonsUnion } from './polygonClip';
import { bufferCircleRing } from './bufferShapesXY';
import type { LocalFrame } from '../geo/localFrame';
import { planarBuffer } from './planarBuffer';
import type { Exclusion } from '../model/types';

type Ring = [number, number][];
/** Polygons as rings of [x, y] metres: the first ring of each polygon is its shell. */
export type MultiPolygonXY = Ring[][];

function projected(frame: LocalFrame, origin: readonly [number, number], p: Position): [number, number] {
  const [x, y] = frame.toXY(p[0], p[1]);
  return [x - origin[0], y - origin[1]];
}

/**
 * The pieces whose union is an exclusion's buffered footprint, in frame metres less `origin`
 * (callers working far from the frame's origin pass a nearby point to keep precision):
 * points give one circle each; lines and polygons one planarBuffer (JTS buffer) per geometry,
 * with rings, holes and joins merged. Every arc is drawn with tangent edges, so the pieces always
 * cover the true buffer and no vertex stands more than 0.02 m outside it. A polygon with a zero
 * buffer is itself; a zero buffer on a point or line gives no pieces (no area).
 */
export function exclusionBufferPiecesXY(
  exclusion: Exclusion,
  frame: LocalFrame,
  origin: readonly [number, number] = [0, 0],
): MultiPolygonXY {
  const r = exclusion.bufferM;
  const g = exclusion.geometry;
  const at = (p: Position) => projected(frame, origin, p);
  if (g.type === 'Point' || g.type === 'MultiPoint') {
    if (!(r > 0)) return [];
    const points = g.type === 'Point' ? [g.coordinates] : g.coordinates;
    return points.map((p) => {
      const [x, y] = at(p);
      return [bufferCircleRing(x, y, r)];
    });
  }
  if (g.type === 'LineString' || g.type === 'MultiLineString') {
    if (!(r > 0)) return [];
    const lines = g.type === 'LineString' ? [g.coordinates] : g.coordinates;
    return planarBuffer({ type: 'MultiLineString', coordinates: lines.map((line) => line.map(at)) }, r);
  }
  const polygons = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
  const xy = polygons.map((poly) => poly.map((ring) => ring.map(at)));
  return r > 0 ? planarBuffer({ type: 'MultiPolygon', coordinates: xy }, r) : xy;
}

/**
 * An exclusion's buffered footprint as one multipolygon in frame metres: the union (by
 * polyclip-ts, a Martinez–Rueda–Feito sweep-line clipper) of {@link exclusionBufferPiecesXY}
 * (only multipoints have more than one piece to merge).
 * Empty for a zero buffer on a point or line.
 */
export function exclusionBufferXY(exclusion: Exclusion, frame: LocalFrame): MultiPolygonXY {
  const anchor = firstPosition(exclusion);
  if (!anchor) return [];
  const [ox, oy] = frame.toXY(anchor[0], anchor[1]);
  const origin: [number, number] = [Math.round(ox), Math.round(oy)];
  const pieces = exclusionBufferPiecesXY(exclusion, frame, origin);
  if (pieces.length === 0) return [];
  const merged = pieces.length === 1 ? pieces : (polygonsUnion(pieces[0], ...pieces.slice(1)) as MultiPolygonXY);
  return merged.map((poly) => poly.map((ring) => ring.map(([x, y]) => [x + origin[0], y + origin[1]] as [number, number])));
}

function firstPosition(exclusion: Exclusion): Position | null {
  const g = exclusion.geometry;
  switch (g.type) {
    case 'Point':
      return g.coordinates;
    case 'MultiPoint':
    case 'LineString':
      return g.coordinates[0] ?? null;
    case 'MultiLineString':
    case 'Polygon':
      return g.coordinates[0]?.[0] ?? null;
    case 'MultiPolygon':
      return g.coordinates[0]?.[0]?.[0] ?? null;
  }
}
