import Flatbush from 'flatbush';
import type { Site } from '../../core/model/types';

/** Every edge of every mapped stratum ring, in a bbox index for snapping while drawing. */
export interface StrataSnapIndex {
  index: Flatbush;
  /** Edge i runs from (x0, y0) to (x1, y1) at [4i .. 4i+3], lon/lat degrees. */
  edges: Float64Array;
}

/** Builds the edge index of a site's strata, or null when nothing is mapped. */
export function strataSnapIndexBuild(site: Site): StrataSnapIndex | null {
  const e: number[] = [];
  for (const p of site.parts) {
    const polys = p.geometry.type === 'Polygon' ? [p.geometry.coordinates] : p.geometry.coordinates;
    for (const poly of polys) {
      for (const ring of poly) {
        for (let i = 1; i < ring.length; i++) e.push(ring[i - 1][0], ring[i - 1][1], ring[i][0], ring[i][1]);
      }
    }
  }
  const n = e.length / 4;
  if (n === 0) return null;
  const index = new Flatbush(n);
  for (let i = 0; i < n; i++) {
    const [x0, y0, x1, y1] = [e[4 * i], e[4 * i + 1], e[4 * i + 2], e[4 * i + 3]];
    index.add(Math.min(x0, x1), Math.min(y0, y1), Math.max(x0, x1), Math.max(y0, y1));
  }
  index.finish();
  return { index, edges: Float64Array.from(e) };
}

/**
 * The point to snap to near a pointer: a stratum vertex within `radiusPx` (preferred, so
 * neighbours share vertices exactly), else the nearest point on a stratum edge within `radiusPx`.
 * Distances are measured on screen. `box` is the lon/lat search window around the pointer.
 * @returns [lon, lat] or undefined when nothing is close enough
 */
export function strataSnapNearest(
  snap: StrataSnapIndex,
  pointer: { x: number; y: number },
  box: [west: number, south: number, east: number, north: number],
  project: (lon: number, lat: number) => { x: number; y: number },
  unproject: (x: number, y: number) => [number, number],
  radiusPx: number,
): [number, number] | undefined {
  let vertex: [number, number] | undefined;
  let vertexD = radiusPx;
  let edgePt: { x: number; y: number } | undefined;
  let edgeD = radiusPx;
  for (const i of snap.index.search(box[0], box[1], box[2], box[3])) {
    const a = project(snap.edges[4 * i], snap.edges[4 * i + 1]);
    const b = project(snap.edges[4 * i + 2], snap.edges[4 * i + 3]);
    for (const [q, lon, lat] of [[a, snap.edges[4 * i], snap.edges[4 * i + 1]], [b, snap.edges[4 * i + 2], snap.edges[4 * i + 3]]] as const) {
      const d = Math.hypot(q.x - pointer.x, q.y - pointer.y);
      if (d <= vertexD) {
        vertexD = d;
        vertex = [lon, lat];
      }
    }
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const len2 = dx * dx + dy * dy;
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((pointer.x - a.x) * dx + (pointer.y - a.y) * dy) / len2));
    const px = a.x + t * dx;
    const py = a.y + t * dy;
    const d = Math.hypot(px - pointer.x, py - pointer.y);
    if (d <= edgeD) {
      edgeD = d;
      edgePt = { x: px, y: py };
    }
  }
  if (vertex) return vertex;
  return edgePt ? unproject(edgePt.x, edgePt.y) : undefined;
}
