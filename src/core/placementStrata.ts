import earcut from 'earcut';
import Flatbush from 'flatbush';
import type { LocalFrame } from './localFrame';
import type { Site } from './types';

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
  edgeIndex: Flatbush | null;
  /** Whether a point lies in the stratum (not in a hole), by a triangle index built on first use. */
  contains(x: number, y: number): boolean;
}

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
  const table = new Int32Array(size).fill(-1);
  for (let i = 0; i < n; i++) {
    const o = i * 4;
    let [ax, ay, bx, by] = [seg[o], seg[o + 1], seg[o + 2], seg[o + 3]];
    if (bx < ax || (bx === ax && by < ay)) [ax, ay, bx, by] = [bx, by, ax, ay];
    let h = hashDouble(hashDouble(hashDouble(hashDouble(0x811c9dc5, ax), ay), bx), by) & (size - 1);
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
      h = (h + 1) & (size - 1);
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
    const tri: number[] = [];
    const seg: number[] = [];
    const bbox: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
    for (const poly of polygons) {
      const flat: number[] = [];
      const holes: number[] = [];
      for (let r = 0; r < poly.length; r++) {
        const ring = poly[r];
        let len = ring.length;
        if (len > 1 && ring[0][0] === ring[len - 1][0] && ring[0][1] === ring[len - 1][1]) len--;
        if (len < 3) continue;
        if (r > 0) holes.push(flat.length / 2);
        const start = flat.length;
        for (let i = 0; i < len; i++) {
          const [x, y] = frame.toXY(ring[i][0], ring[i][1]);
          flat.push(x, y);
          if (x < bbox[0]) bbox[0] = x;
          if (y < bbox[1]) bbox[1] = y;
          if (x > bbox[2]) bbox[2] = x;
          if (y > bbox[3]) bbox[3] = y;
        }
        for (let i = start; i < flat.length; i += 2) {
          const j = i + 2 < flat.length ? i + 2 : start;
          seg.push(flat[i], flat[i + 1], flat[j], flat[j + 1]);
        }
      }
      if (flat.length < 6) continue;
      const idx = earcut(flat, holes.length ? holes : null, 2);
      for (const k of idx) tri.push(flat[k * 2], flat[k * 2 + 1]);
    }
    const triangles = Float64Array.from(tri);
    const nt = triangles.length / 6;
    const cumulativeArea = new Float64Array(nt);
    let total = 0;
    for (let t = 0; t < nt; t++) {
      const o = t * 6;
      total += Math.abs((triangles[o + 2] - triangles[o]) * (triangles[o + 5] - triangles[o + 1]) - (triangles[o + 4] - triangles[o]) * (triangles[o + 3] - triangles[o + 1])) / 2;
      cumulativeArea[t] = total;
    }
    let segArr = Float64Array.from(seg);
    if (polygons.length > 1) {
      const shared = sharedSegments(segArr);
      const kept: number[] = [];
      for (let i = 0; i < shared.length; i++) if (!shared[i]) kept.push(segArr[i * 4], segArr[i * 4 + 1], segArr[i * 4 + 2], segArr[i * 4 + 3]);
      segArr = Float64Array.from(kept);
    }
    const ns = segArr.length / 4;
    let edgeIndex: Flatbush | null = null;
    if (ns > 0) {
      edgeIndex = new Flatbush(ns);
      for (let i = 0; i < ns; i++) {
        const o = i * 4;
        edgeIndex.add(Math.min(segArr[o], segArr[o + 2]), Math.min(segArr[o + 1], segArr[o + 3]), Math.max(segArr[o], segArr[o + 2]), Math.max(segArr[o + 1], segArr[o + 3]));
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
    return { key: info.key, bbox, triangles, cumulativeArea, edges: segArr, edgeIndex, contains };
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
