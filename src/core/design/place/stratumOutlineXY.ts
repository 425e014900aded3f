import type { Position } from 'geojson';
import type { LocalFrame } from '../../geo/localFrame';
import { utmForwardArray } from '../../geo/utmForwardArray';
import type { StratumCellsXY } from './stratumCellsXY';

/** One stratum's outline in frame metres as flat arrays only, so it can be made in one thread and used in another. */
export interface StratumOutlineXY {
  /** minX, minY, maxX, maxY of the stratum (Infinity/−Infinity when it has no polygons). */
  bbox: [number, number, number, number];
  /** Outer boundary segments x1, y1, x2, y2 (edges shared by two parts of the stratum left out). */
  edges: Float64Array;
  /** Area in grid m² (shells less holes, by the shoelace formula over each ring). */
  areaGrid: number;
  /** Every kept polygon's vertices x, y (shell, then holes; closing vertex dropped), polygon after polygon. */
  coords: Float64Array;
  /** Value offsets into `coords` where each kept polygon starts, and one past the last (length polygons + 1). */
  polygonStarts: Int32Array;
  /** Vertex index (within its polygon) where each hole starts, polygon after polygon. */
  holeStarts: Int32Array;
  /** Offsets into `holeStarts` of each polygon's holes, and one past the last (length polygons + 1). */
  polygonHoles: Int32Array;
  /** The cell grid of this box and these edges (stratumCellsXY), where another thread made it ahead; otherwise made on first use. */
  cellGrid?: StratumCellsXY;
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
 * One stratum's polygons (lon/lat rings, shells then holes) projected once into frame metres, flat:
 * its box, its outer boundary segments (a segment two parts share, in either direction, cancels
 * out), its area, and each polygon's vertices and hole starts as earcut takes them. A ring of fewer
 * than three distinct vertices is left out, and so is a polygon whose shell is.
 * Source of the area: the shoelace formula (Gauss), shells positive and holes negative whatever
 * their winding in the file.
 */
export function stratumOutlineXY(polygons: readonly (readonly Position[])[][], frame: LocalFrame): StratumOutlineXY {
  const bbox: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  let vertexCount = 0;
  for (const poly of polygons) for (const ring of poly) vertexCount += ring.length;
  // Sized once: every ring edge is at most one segment, every vertex at most one coordinate pair.
  let seg = new Float64Array(vertexCount * 4);
  let segCount = 0;
  const coords = new Float64Array(vertexCount * 2);
  let used = 0;
  const polygonStarts: number[] = [];
  const holeStarts: number[] = [];
  const polygonHoles: number[] = [0];
  let areaGrid = 0;
  for (const poly of polygons) {
    const polyStart = used;
    const holesBefore = holeStarts.length;
    let polyArea = 0;
    for (let r = 0; r < poly.length; r++) {
      const ring = poly[r];
      let len = ring.length;
      if (len > 1 && ring[0][0] === ring[len - 1][0] && ring[0][1] === ring[len - 1][1]) len--;
      if (len < 3) continue;
      if (r > 0) holeStarts.push((used - polyStart) / 2);
      const start = used;
      for (let i = 0; i < len; i++) {
        const p = ring[i];
        coords[used++] = p[0];
        coords[used++] = p[1];
      }
      // Projected in place, one flat pass per ring (no per-vertex objects).
      const xy = utmForwardArray(frame, coords.subarray(start, used), coords.subarray(start, used));
      let twice = 0;
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
        seg[o] = coords[i];
        seg[o + 1] = coords[i + 1];
        seg[o + 2] = coords[j];
        seg[o + 3] = coords[j + 1];
        twice += coords[i] * coords[j + 1] - coords[j] * coords[i + 1];
        segCount++;
      }
      polyArea += (r === 0 ? 1 : -1) * Math.abs(twice / 2);
    }
    // Earcut is given only polygons of at least three vertices in all.
    if (used - polyStart < 6) {
      used = polyStart;
      holeStarts.length = holesBefore;
      continue;
    }
    polygonStarts.push(polyStart);
    polygonHoles.push(holeStarts.length);
    areaGrid += polyArea;
  }
  polygonStarts.push(used);
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
  return {
    bbox,
    edges: seg,
    areaGrid,
    coords: coords.subarray(0, used),
    polygonStarts: Int32Array.from(polygonStarts),
    holeStarts: Int32Array.from(holeStarts),
    polygonHoles: Int32Array.from(polygonHoles),
  };
}
