import type { Position } from 'geojson';
import { bufferArcStepRad, bufferCircleRing } from './bufferShapesXY';
import type { MultiPolygonXY } from './exclusionBufferXY';
import type { LocalFrame } from '../geo/localFrame';
import type { Exclusion } from '../model/types';

type Ring = [number, number][];

/** Arc step and the radius r' = r / cos(θ/2) whose chords stay tangent to the true circle (as planarBuffer). */
function arcOf(radiusM: number): { theta: number; outer: number } {
  const quadrant = Math.max(2, Math.ceil(Math.PI / 2 / bufferArcStepRad(radiusM)));
  const theta = Math.PI / 2 / quadrant;
  return { theta, outer: radiusM / Math.cos(theta / 2) };
}

/**
 * A fan about (cx, cy) from angle `from` through `sweep` radians (signed), vertices at radius
 * `outer` no more than `theta` apart, so every chord stays outside the circle of the true radius.
 * It starts and ends one step early and late so that it overlaps the neighbouring rectangles rather
 * than sharing an edge with them (shared edges would be measured twice or not at all).
 */
function fan(cx: number, cy: number, from: number, sweep: number, theta: number, outer: number): Ring {
  const start = from - Math.sign(sweep) * theta;
  const total = sweep + 2 * Math.sign(sweep) * theta;
  const steps = Math.max(1, Math.ceil(Math.abs(total) / theta));
  const ring: Ring = [[cx, cy]];
  for (let k = 0; k <= steps; k++) {
    const a = start + (total * k) / steps;
    ring.push([cx + outer * Math.cos(a), cy + outer * Math.sin(a)]);
  }
  ring.push([cx, cy]);
  return ring;
}

/** Pieces covering everything within the buffer of one path (open or closed), in frame metres. */
function pathPieces(path: readonly [number, number][], closed: boolean, radiusM: number, out: MultiPolygonXY): void {
  const pts = path.filter((p, i) => i === 0 || p[0] !== path[i - 1][0] || p[1] !== path[i - 1][1]);
  if (closed && pts.length > 1 && pts[0][0] === pts[pts.length - 1][0] && pts[0][1] === pts[pts.length - 1][1]) pts.pop();
  const { theta, outer } = arcOf(radiusM);
  if (pts.length === 1) {
    out.push([bufferCircleRing(pts[0][0], pts[0][1], radiusM)]);
    return;
  }
  const segs = closed ? pts.length : pts.length - 1;
  const normals: number[] = [];
  for (let i = 0; i < segs; i++) {
    const [x0, y0] = pts[i];
    const [x1, y1] = pts[(i + 1) % pts.length];
    const len = Math.hypot(x1 - x0, y1 - y0);
    const nx = (-(y1 - y0) / len) * outer;
    const ny = ((x1 - x0) / len) * outer;
    normals.push(Math.atan2(ny, nx));
    out.push([[[x0 + nx, y0 + ny], [x0 - nx, y0 - ny], [x1 - nx, y1 - ny], [x1 + nx, y1 + ny], [x0 + nx, y0 + ny]]]);
  }
  // Joins: the fan between consecutive normals on the outer side of the turn.
  const joins = closed ? segs : segs - 1;
  for (let i = 0; i < joins; i++) {
    const j = (i + 1) % segs;
    let turn = normals[j] - normals[i];
    if (turn > Math.PI) turn -= 2 * Math.PI;
    if (turn < -Math.PI) turn += 2 * Math.PI;
    if (turn === 0) continue;
    const [cx, cy] = pts[(i + 1) % pts.length];
    // A left turn leaves the gap on the right (−normal side); a right turn on the left.
    const from = turn > 0 ? normals[i] + Math.PI : normals[i];
    out.push([fan(cx, cy, from, turn, theta, outer)]);
  }
  if (!closed) {
    // Round caps: from the left normal round the back at the start, from the right normal at the end.
    out.push([fan(pts[0][0], pts[0][1], normals[0], Math.PI, theta, outer)]);
    const last = pts[pts.length - 1];
    out.push([fan(last[0], last[1], normals[segs - 1] + Math.PI, Math.PI, theta, outer)]);
  }
}

/**
 * Pieces whose union is an exclusion's buffered footprint, in frame metres less `origin`, left
 * unmerged (overlapping) for callers that measure a union directly (polygonCoveredAreaM2): a
 * circle per point; per line or ring edge a rectangle of half-width r', per join a fan on the outer
 * side of the turn, per line end a round cap; a polygon adds itself. Arcs have tangent chords and
 * straight sides stand at r' = r / cos(θ/2) as in planarBuffer, so the union covers the true buffer
 * (the Minkowski sum of the geometry and a disc of radius r) and agrees with planarBuffer's to the
 * arc tolerance. A zero buffer gives no pieces for points and lines, and a polygon itself.
 * Source: the buffer as Minkowski sum with a disc (e.g. Serra, Image Analysis and Mathematical
 * Morphology, 1982); arc steps from bufferArcStepRad.
 */
export function exclusionBufferPartsXY(exclusion: Exclusion, frame: LocalFrame, origin: readonly [number, number] = [0, 0]): MultiPolygonXY {
  const r = exclusion.bufferM;
  const g = exclusion.geometry;
  const at = (p: Position): [number, number] => {
    const [x, y] = frame.toXY(p[0], p[1]);
    return [x - origin[0], y - origin[1]];
  };
  const out: MultiPolygonXY = [];
  if (g.type === 'Point' || g.type === 'MultiPoint') {
    if (!(r > 0)) return out;
    for (const p of g.type === 'Point' ? [g.coordinates] : g.coordinates) {
      const [x, y] = at(p);
      out.push([bufferCircleRing(x, y, r)]);
    }
    return out;
  }
  if (g.type === 'LineString' || g.type === 'MultiLineString') {
    if (!(r > 0)) return out;
    for (const line of g.type === 'LineString' ? [g.coordinates] : g.coordinates) if (line.length > 0) pathPieces(line.map(at), false, r, out);
    return out;
  }
  for (const poly of g.type === 'Polygon' ? [g.coordinates] : g.coordinates) {
    const rings = poly.map((ring) => ring.map(at));
    out.push(rings);
    if (r > 0) for (const ring of rings) if (ring.length > 0) pathPieces(ring, true, r, out);
  }
  return out;
}
