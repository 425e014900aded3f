import type { Position } from 'geojson';
import * as polyclip from 'polyclip-ts';
import { bufferCapsuleRing, bufferCircleRing } from './bufferShapesXY';
import type { LocalFrame } from './localFrame';
import type { Exclusion } from './types';

type Ring = [number, number][];
/** Polygons as rings of [x, y] metres: the first ring of each polygon is its shell. */
export type MultiPolygonXY = Ring[][];

function projected(frame: LocalFrame, origin: readonly [number, number], p: Position): [number, number] {
  const [x, y] = frame.toXY(p[0], p[1]);
  return [x - origin[0], y - origin[1]];
}

function linePieces(out: Ring[][], line: readonly Position[], bufferM: number, frame: LocalFrame, origin: readonly [number, number]): void {
  const pts = line.map((p) => projected(frame, origin, p));
  if (pts.length === 1) out.push([bufferCircleRing(pts[0][0], pts[0][1], bufferM)]);
  for (let i = 1; i < pts.length; i++) {
    out.push([bufferCapsuleRing(pts[i - 1][0], pts[i - 1][1], pts[i][0], pts[i][1], bufferM)]);
  }
}

/**
 * The pieces whose union is an exclusion's buffered footprint, in frame metres less `origin`
 * (callers working far from the frame's origin pass a nearby point to keep precision):
 * points give circles, lines the capsules of their segments, polygons themselves plus the
 * capsules of every ring edge (holes included). Arcs are circumscribed polygons whose vertices
 * stand at most 0.02 m outside the true circle, so the pieces always cover the true buffer.
 * A zero buffer on a point or line gives no pieces (the geometry itself has no area).
 */
export function exclusionBufferPiecesXY(
  exclusion: Exclusion,
  frame: LocalFrame,
  origin: readonly [number, number] = [0, 0],
): MultiPolygonXY {
  const r = exclusion.bufferM;
  const g = exclusion.geometry;
  const out: Ring[][] = [];
  const points = g.type === 'Point' ? [g.coordinates] : g.type === 'MultiPoint' ? g.coordinates : [];
  const lines = g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : [];
  const polygons = g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [];
  if (r > 0) {
    for (const p of points) {
      const [x, y] = projected(frame, origin, p);
      out.push([bufferCircleRing(x, y, r)]);
    }
    for (const line of lines) linePieces(out, line, r, frame, origin);
  }
  for (const poly of polygons) {
    out.push(poly.map((ring) => ring.map((p) => projected(frame, origin, p))));
    if (r > 0) for (const ring of poly) linePieces(out, ring, r, frame, origin);
  }
  return out;
}

/**
 * An exclusion's buffered footprint as one multipolygon in frame metres: the union (by
 * polyclip-ts, a Martinez–Rueda–Feito sweep-line clipper) of {@link exclusionBufferPiecesXY}.
 * Empty for a zero buffer on a point or line.
 */
export function exclusionBufferXY(exclusion: Exclusion, frame: LocalFrame): MultiPolygonXY {
  const anchor = firstPosition(exclusion);
  if (!anchor) return [];
  const [ox, oy] = frame.toXY(anchor[0], anchor[1]);
  const origin: [number, number] = [Math.round(ox), Math.round(oy)];
  const pieces = exclusionBufferPiecesXY(exclusion, frame, origin);
  if (pieces.length === 0) return [];
  const merged = polyclip.union(pieces[0], ...pieces.slice(1)) as MultiPolygonXY;
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
