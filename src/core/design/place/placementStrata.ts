import earcut from 'earcut';
import Flatbush from 'flatbush';
import type { LocalFrame } from '../../geo/localFrame';
import type { Site } from '../../model/types';
import { utmForwardArray } from '../../geo/utmForwardArray';

/** One stratum in frame metres, ready for sampling and containment tests. */
export interface StratumShapeXY {
  key: string;
  /** minX, minY, maxX, maxY of the stratum (Infinity/−Infinity when it has no polygons). */
  bbox: [number, number, number, number];
  /** Triangles, six values each: ax, ay, bx, by, cx, cy. */
  triangles: Float64Array;
  /** Running total of triangle areas (m² in the grid), for picking a triangle by area. */
  cumulativeArea: Float64Array;
  /** Outer boundary segments x1, y1, x2, y2 (edges shared by two parts of the stratum left out). */
  edges: Float64Array;
  /** Index of runs of {@link EDGE_CHUNK} consecutive segments of `edges` (item k: segments k·EDGE_CHUNK …). */
  edgeIndex: Flatbush | null;
  /** Whether a point lies in the stratum (not in a hole), by a triangle index built on first use. */
  contains(x: number, y: number): boolean;
}

/** Segments per box of a stratum's edge index. */
export const EDGE_CHUNK = 8;

const words = new Float64Array(1);
const wordsU = new Uint32Array(words.buffer);

function hashDouble(h: number, v: number): number {
  words[0] = v === 0 ? 0 : v;
  h = Math.imul(h ^ wordsU[0], 0x9e3779b1);
  return Math.imul(h ^ wordsU[1], 0x85ebca77);
}

/** Marks segments that occur twice (in either direction), by an open-addressing hash of their ends. */
function sharedSegments(seg: Float64Array): Uint8Array {
  const n = seg.length / 4;
  const shared = new Uint8Array(n);
  let size = 1;
  while (size < n * 2) size <<= 1;
  const mask = size - 1;
  const table = new Int32Array(size).fill(-1);
  for (let i = 0; i < n; i++) {
    const o = i * 4;
    // Ends in a fixed order, so a segment and its reverse hash alike.
    const flip = seg[o + 2] < seg[o] || (seg[o + 2] === seg[o] && seg[o + 3] < seg[o + 1]);
    const ax = flip ? seg[o + 2] : seg[o];
    const ay = flip ? seg[o + 3] : seg[o + 1];
    const bx = flip ? seg[o] : seg[o + 2];
    const by = flip ? seg[o + 1] : seg[o + 3];
    let h = hashDouble(hashDouble(hashDouble(hashDouble(0x811c9dc5, ax), ay), bx), by) & mask;
    for (;;) {
      const j = table[h];
      if (j < 0) {
        table[h] = i;
        break;
      }
      const p = j * 4;
      const same =
        (seg[p] === ax && seg[p + 1] === ay && seg[p + 2] === bx && seg[p + 3] === by) ||
        (seg[p] === bx && seg[p + 1] === by && seg[p + 2] === ax && seg[p + 3] === ay);
      if (same) {
        shared[i] = 1;
        shared[j] = 1;
        break;
      }
      h = (h + 1) & mask;
    }
  }
  return shared;
}

/**
 * Every stratum of the site in frame metres, in site order: earcut triangles of each polygon (holes
 * cut out), boundary segments in a flatbush index, and a point-in-stratum test. Source of the
 * triangulation: earcut (ear clipping with z-order hashing, Mapbox).
 */
export function stratumShapesXY(site: Site, frame: LocalFrame): StratumShapeXY[] {
  return site.strata.map((info) => {
    const parts = site.parts.filter((p) => p.stratum === info.key);
    const polygons = parts.flatMap((p) => (p.geometry.type === 'Polygon' ? [p.geometry.coordinates] : p.geometry.coordinates));
    const bbox: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
    let vertexCount = 0;
    for (const poly of polygons) for (const ring of poly) vertexCount += ring.length;
    // Sized once: every ring edge is at most one segment; triangles are collected per polygon.
    let seg = new Float64Array(vertexCount * 4);
    let segCount = 0;
    const triParts: { coords: Float64Array; idx: number[] }[] = [];
    let triValues = 0;
    for (const poly of polygons) {
      let polyCount = 0;
      for (const ring of poly) polyCount += ring.length;
      const flat = new Float64Array(polyCount * 2);
      const holes: number[] = [];
      let used = 0;
      for (let r = 0; r < poly.length; r++) {
        const ring = poly[r];
        let len = ring.length;
        if (len > 1 && ring[0][0] === ring[len - 1][0] && ring[0][1] === ring[len - 1][1]) len--;
        if (len < 3) continue;
        if (r > 0) holes.push(used / 2);
        const start = used;
        for (let i = 0; i < len; i++) {
          const p = ring[i];
          flat[used++] = p[0];
          flat[used++] = p[1];
        }
        // Projected in place, one flat pass per ring (no per-vertex objects).
        const xy = utmForwardArray(frame, flat.subarray(start, used), flat.subarray(start, used));
        for (let i = 0; i < xy.length; i += 2) {
          const x = xy[i];
          const y = xy[i + 1];
          if (x < bbox[0]) bbox[0] = x;
          if (y < bbox[1]) bbox[1] = y;
          if (x > bbox[2]) bbox[2] = x;
          if (y > bbox[3]) bbox[3] = y;
        }
        for (let i = start; i < used; i += 2) {
          const j = i + 2 < used ? i + 2 : start;
          const o = segCount * 4;
          seg[o] = flat[i];
          seg[o + 1] = flat[i + 1];
          seg[o + 2] = flat[j];
          seg[o + 3] = flat[j + 1];
          segCount++;
        }
      }
      if (used < 6) continue;
      const coords = used === flat.length ? flat : flat.subarray(0, used);
      const idx = earcut(coords, holes.length ? holes : null, 2);
      triParts.push({ coords, idx });
      triValues += idx.length * 2;
    }
    // Corners are written straight into one array, sized once.
    const triangles = new Float64Array(triValues);
    let off = 0;
    for (const { coords, idx } of triParts) {
      for (let k = 0; k < idx.length; k++) {
        const c = idx[k] * 2;
        triangles[off++] = coords[c];
        triangles[off++] = coords[c + 1];
      }
    }
    const nt = triangles.length / 6;
    const cumulativeArea = new Float64Array(nt);
    let total = 0;
    for (let t = 0; t < nt; t++) {
      const o = t * 6;
      total += Math.abs((triangles[o + 2] - triangles[o]) * (triangles[o + 5] - triangles[o + 1]) - (triangles[o + 4] - triangles[o]) * (triangles[o + 3] - triangles[o + 1])) / 2;
      cumulativeArea[t] = total;
    }
    seg = seg.subarray(0, segCount * 4);
    if (polygons.length > 1) {
      const shared = sharedSegments(seg);
      let kept = 0;
      for (let i = 0; i < segCount; i++) {
        if (shared[i]) continue;
        if (kept !== i) seg.copyWithin(kept * 4, i * 4, i * 4 + 4);
        kept++;
      }
      seg = seg.subarray(0, kept * 4);
    }
    const ns = seg.length / 4;
    // Runs of EDGE_CHUNK consecutive segments share one index box: far fewer boxes to sort and search.
    const chunks = Math.ceil(ns / EDGE_CHUNK);
    let edgeIndex: Flatbush | null = null;
    if (chunks > 0) {
      edgeIndex = new Flatbush(chunks);
      for (let k = 0; k < chunks; k++) {
        let x0 = Infinity;
        let y0 = Infinity;
        let x1 = -Infinity;
        let y1 = -Infinity;
        const end = Math.min(ns, (k + 1) * EDGE_CHUNK) * 4;
        for (let o = k * EDGE_CHUNK * 4; o < end; o += 2) {
          if (seg[o] < x0) x0 = seg[o];
          if (seg[o] > x1) x1 = seg[o];
          if (seg[o + 1] < y0) y0 = seg[o + 1];
          if (seg[o + 1] > y1) y1 = seg[o + 1];
        }
        edgeIndex.add(x0, y0, x1, y1);
      }
      edgeIndex.finish();
    }
    let triIndex: Flatbush | null = null;
    const contains = (x: number, y: number): boolean => {
      if (nt === 0 || x < bbox[0] || x > bbox[2] || y < bbox[1] || y > bbox[3]) return false;
      if (!triIndex) {
        triIndex = new Flatbush(nt);
        for (let t = 0; t < nt; t++) {
          const o = t * 6;
          triIndex.add(
            Math.min(triangles[o], triangles[o + 2], triangles[o + 4]),
            Math.min(triangles[o + 1], triangles[o + 3], triangles[o + 5]),
            Math.max(triangles[o], triangles[o + 2], triangles[o + 4]),
            Math.max(triangles[o + 1], triangles[o + 3], triangles[o + 5]),
          );
        }
        triIndex.finish();
      }
      return triIndex.collides(x, y, x, y, (t) => isInTriangle(triangles, t * 6, x, y));
    };
    return { key: info.key, bbox, triangles, cumulativeArea, edges: seg, edgeIndex, contains };
  });
}

function isInTriangle(t: Float64Array, o: number, px: number, py: number): boolean {
  const d1 = (px - t[o + 2]) * (t[o + 1] - t[o + 3]) - (t[o] - t[o + 2]) * (py - t[o + 3]);
  const d2 = (px - t[o + 4]) * (t[o + 3] - t[o + 5]) - (t[o + 2] - t[o + 4]) * (py - t[o + 5]);
  const d3 = (px - t[o]) * (t[o + 5] - t[o + 1]) - (t[o + 4] - t[o]) * (py - t[o + 1]);
  const hasNeg = d1 < 0 || d2 < 0 || d3 < 0;
  const hasPos = d1 > 0 || d2 > 0 || d3 > 0;
  return !(hasNeg && hasPos);
}
