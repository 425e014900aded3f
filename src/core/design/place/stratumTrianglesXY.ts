import earcut from 'earcut';
import type { Position } from 'geojson';
import type { LocalFrame } from '../../geo/localFrame';
import { utmForwardArray } from '../../geo/utmForwardArray';

/** One stratum in frame metres as flat arrays only, so it can be made in one thread and used in another. */
export interface StratumTrianglesXY {
  /** minX, minY, maxX, maxY of the stratum (Infinity/−Infinity when it has no polygons). */
  bbox: [number, number, number, number];
  /** Triangles, six values each: ax, ay, bx, by, cx, cy. */
  triangles: Float64Array;
  /** Running total of triangle areas (m² in the grid), for picking a triangle by area. */
  cumulativeArea: Float64Array;
  /** Outer boundary segments x1, y1, x2, y2 (edges shared by two parts of the stratum left out). */
  edges: Float64Array;
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
 * One stratum's polygons (lon/lat rings, shells then holes) in frame metres: earcut triangles of
 * each polygon (holes cut out) with their running area, its box, and its outer boundary segments.
 * Source of the triangulation: earcut (ear clipping with z-order hashing, Mapbox).
 */
export function stratumTrianglesXY(polygons: readonly (readonly Position[])[][], frame: LocalFrame): StratumTrianglesXY {
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
  return { bbox, triangles, cumulativeArea, edges: seg };
}
