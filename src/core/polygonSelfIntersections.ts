import Flatbush from 'flatbush';
import type { Position } from 'geojson';
import { problemMake } from './problemMake';
import type { Problem, ProblemLocation } from './types';

/** Where two segments meet: a proper crossing, a touch at an end point, or a collinear overlap. */
type Meet = { kind: 'cross' | 'touch' | 'overlap'; x: number; y: number } | null;

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  const d = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
  return d > 0 ? 1 : d < 0 ? -1 : 0;
}

function onSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by);
}

function segmentsMeet(s: Float64Array, i: number, j: number): Meet {
  const ax = s[4 * i];
  const ay = s[4 * i + 1];
  const bx = s[4 * i + 2];
  const by = s[4 * i + 3];
  const cx = s[4 * j];
  const cy = s[4 * j + 1];
  const dx = s[4 * j + 2];
  const dy = s[4 * j + 3];
  const o1 = orient(ax, ay, bx, by, cx, cy);
  const o2 = orient(ax, ay, bx, by, dx, dy);
  const o3 = orient(cx, cy, dx, dy, ax, ay);
  const o4 = orient(cx, cy, dx, dy, bx, by);
  if (o1 * o2 < 0 && o3 * o4 < 0) {
    const t = ((cx - ax) * (dy - cy) - (cy - ay) * (dx - cx)) / ((bx - ax) * (dy - cy) - (by - ay) * (dx - cx));
    return { kind: 'cross', x: ax + t * (bx - ax), y: ay + t * (by - ay) };
  }
  if (o1 === 0 && o2 === 0) {
    const ends: [number, number][] = [];
    if (onSegment(ax, ay, bx, by, cx, cy)) ends.push([cx, cy]);
    if (onSegment(ax, ay, bx, by, dx, dy)) ends.push([dx, dy]);
    if (onSegment(cx, cy, dx, dy, ax, ay)) ends.push([ax, ay]);
    if (onSegment(cx, cy, dx, dy, bx, by)) ends.push([bx, by]);
    if (ends.length === 0) return null;
    const distinct = new Set(ends.map(([x, y]) => `${x},${y}`));
    return { kind: distinct.size > 1 ? 'overlap' : 'touch', x: ends[0][0], y: ends[0][1] };
  }
  if (o1 === 0 && onSegment(ax, ay, bx, by, cx, cy)) return { kind: 'touch', x: cx, y: cy };
  if (o2 === 0 && onSegment(ax, ay, bx, by, dx, dy)) return { kind: 'touch', x: dx, y: dy };
  if (o3 === 0 && onSegment(cx, cy, dx, dy, ax, ay)) return { kind: 'touch', x: ax, y: ay };
  if (o4 === 0 && onSegment(cx, cy, dx, dy, bx, by)) return { kind: 'touch', x: bx, y: by };
  return null;
}

/**
 * Self-intersections of one polygon (all its rings), as errors: a ring crossing or touching
 * itself away from neighbouring edges (bow-ties, figure-eights), or two rings crossing or
 * running along each other (a single-point touch between rings is allowed, as in OGC Simple
 * Features). Segments are indexed with flatbush, so the cost is O(n log n + k), not O(n²).
 * Expects rings without duplicate consecutive vertices (see ringProblems). Reports at most
 * `limit` crossings per polygon. Checked against turf `kinks` in the tests.
 */
export function polygonSelfIntersections(rings: readonly (readonly Position[])[], where: ProblemLocation, limit = 3): Problem[] {
  let count = 0;
  for (const ring of rings) count += Math.max(0, ring.length - 1);
  if (count < 3) return [];
  const segs = new Float64Array(4 * count);
  const ringOf = new Int32Array(count);
  const indexInRing = new Int32Array(count);
  const ringLength = rings.map((r) => Math.max(0, r.length - 1));
  const index = new Flatbush(count);
  let k = 0;
  rings.forEach((ring, r) => {
    for (let i = 0; i + 1 < ring.length; i++, k++) {
      segs[4 * k] = ring[i][0];
      segs[4 * k + 1] = ring[i][1];
      segs[4 * k + 2] = ring[i + 1][0];
      segs[4 * k + 3] = ring[i + 1][1];
      ringOf[k] = r;
      indexInRing[k] = i;
      index.add(Math.min(ring[i][0], ring[i + 1][0]), Math.min(ring[i][1], ring[i + 1][1]), Math.max(ring[i][0], ring[i + 1][0]), Math.max(ring[i][1], ring[i + 1][1]));
    }
  });
  index.finish();
  const problems: Problem[] = [];
  let a = 0;
  // The filter does the work and keeps nothing, so a search allocates no result array.
  const visit = (b: number): boolean => {
    if (b <= a || problems.length >= limit) return false;
    const meet = segmentsMeet(segs, a, b);
    if (!meet) return false;
    const sameRing = ringOf[a] === ringOf[b];
    const n = ringLength[ringOf[a]];
    const gap = Math.abs(indexInRing[a] - indexInRing[b]);
    // Neighbours share a vertex; only folding back along each other (a spike) is a problem.
    if (sameRing && (gap === 1 || gap === n - 1) && meet.kind !== 'overlap') return false;
    if (!sameRing && meet.kind === 'touch') return false;
    const text = sameRing
      ? `crosses itself: edges ${indexInRing[a]} and ${indexInRing[b]} meet`
      : `crosses ring ${ringOf[b]} (its edge ${indexInRing[b]})`;
    problems.push(problemMake('error', 'self-intersection', { ...where, ring: ringOf[a], vertex: indexInRing[a], lonLat: [meet.x, meet.y] }, text));
    return false;
  };
  for (a = 0; a < count && problems.length < limit; a++) {
    index.search(
      Math.min(segs[4 * a], segs[4 * a + 2]),
      Math.min(segs[4 * a + 1], segs[4 * a + 3]),
      Math.max(segs[4 * a], segs[4 * a + 2]),
      Math.max(segs[4 * a + 1], segs[4 * a + 3]),
      visit,
    );
  }
  return problems;
}
