import Flatbush from 'flatbush';
import type { Position } from 'geojson';
import { problemMake } from '../common/problemMake';
import type { Problem, ProblemLocation } from '../model/types';

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

/** The problem two segments make (a < b), or null when they only meet as neighbours or not at all. */
function pairProblem(
  segs: Float64Array,
  a: number,
  b: number,
  ringOf: Int32Array,
  indexInRing: Int32Array,
  ringLength: readonly number[],
  where: ProblemLocation,
): Problem | null {
  const sameRing = ringOf[a] === ringOf[b];
  const n = ringLength[ringOf[a]];
  const gap = Math.abs(indexInRing[a] - indexInRing[b]);
  // Neighbours share a vertex; only folding back along each other (a spike) is a problem, and
  // that needs all four ends on one line: a turn settles nearly every pair without building a meeting.
  const neighbours = sameRing && (gap === 1 || gap === n - 1);
  if (neighbours) {
    const ax = segs[4 * a];
    const ay = segs[4 * a + 1];
    const bx = segs[4 * a + 2];
    const by = segs[4 * a + 3];
    if (orient(ax, ay, bx, by, segs[4 * b], segs[4 * b + 1]) !== 0) return null;
    if (orient(ax, ay, bx, by, segs[4 * b + 2], segs[4 * b + 3]) !== 0) return null;
  }
  const meet = segmentsMeet(segs, a, b);
  if (!meet) return null;
  if (neighbours && meet.kind !== 'overlap') return null;
  if (!sameRing && meet.kind === 'touch') return null;
  const text = sameRing
    ? `crosses itself: edges ${indexInRing[a]} and ${indexInRing[b]} meet`
    : `crosses ring ${ringOf[b]} (its edge ${indexInRing[b]})`;
  return problemMake('error', 'self-intersection', { ...where, ring: ringOf[a], vertex: indexInRing[a], lonLat: [meet.x, meet.y] }, text);
}

/** Candidate pairs from a flatbush index of the segments' boxes: O(n log n + k) whatever the shape. */
function pairsByIndex(segs: Float64Array, count: number, report: (a: number, b: number) => boolean): void {
  const index = new Flatbush(count);
  for (let i = 0; i < count; i++) {
    const o = 4 * i;
    index.add(Math.min(segs[o], segs[o + 2]), Math.min(segs[o + 1], segs[o + 3]), Math.max(segs[o], segs[o + 2]), Math.max(segs[o + 1], segs[o + 3]));
  }
  index.finish();
  let a = 0;
  let done = false;
  const visit = (b: number): boolean => {
    if (b > a && !done) done = report(a, b);
    return false;
  };
  for (a = 0; a < count && !done; a++) {
    const o = 4 * a;
    index.search(Math.min(segs[o], segs[o + 2]), Math.min(segs[o + 1], segs[o + 3]), Math.max(segs[o], segs[o + 2]), Math.max(segs[o + 1], segs[o + 3]), visit);
  }
}

/**
 * Candidate pairs by a sweep over x: segments are bucketed by west end (a counting sort, linear),
 * and each is compared with the earlier ones still open and overlapping it in x and y. A segment
 * closes once its east end lies west of the current bucket, so every overlapping pair is still met
 * once. Fastest for mapped boundaries, where few segments are open at once; gives up and returns
 * false once the work passes `budget` comparisons (long edges spanning much of the ring).
 */
function pairsBySweep(segs: Float64Array, count: number, budget: number, report: (a: number, b: number) => boolean): boolean {
  const minX = new Float64Array(count);
  const maxX = new Float64Array(count);
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < count; i++) {
    minX[i] = Math.min(segs[4 * i], segs[4 * i + 2]);
    maxX[i] = Math.max(segs[4 * i], segs[4 * i + 2]);
    if (minX[i] < lo) lo = minX[i];
    if (minX[i] > hi) hi = minX[i];
  }
  const scale = hi > lo ? count / (hi - lo) : 0;
  const bucketOf = (x: number) => Math.min(count - 1, Math.floor((x - lo) * scale));
  const starts = new Int32Array(count + 1);
  for (let i = 0; i < count; i++) starts[bucketOf(minX[i]) + 1]++;
  for (let k = 0; k < count; k++) starts[k + 1] += starts[k];
  const order = new Int32Array(count);
  const fill = starts.slice(0, count);
  for (let i = 0; i < count; i++) order[fill[bucketOf(minX[i])]++] = i;
  const open = new Int32Array(count);
  let openCount = 0;
  let work = 0;
  for (let oi = 0; oi < count; oi++) {
    const c = order[oi];
    // Never above the segment's own west end, whatever the rounding.
    const bucketLo = Math.min(minX[c], scale > 0 ? lo + bucketOf(minX[c]) / scale : lo);
    const cx0 = minX[c];
    const cx1 = maxX[c];
    const cy0 = Math.min(segs[4 * c + 1], segs[4 * c + 3]);
    const cy1 = Math.max(segs[4 * c + 1], segs[4 * c + 3]);
    work += openCount;
    if (work > budget) return false;
    let kept = 0;
    for (let t = 0; t < openCount; t++) {
      const o = open[t];
      if (maxX[o] < bucketLo) continue;
      open[kept++] = o;
      if (maxX[o] < cx0 || minX[o] > cx1) continue;
      if (Math.max(segs[4 * o + 1], segs[4 * o + 3]) < cy0 || Math.min(segs[4 * o + 1], segs[4 * o + 3]) > cy1) continue;
      if (o < c ? report(o, c) : report(c, o)) return true;
    }
    openCount = kept;
    open[openCount++] = c;
  }
  return true;
}

/**
 * Self-intersections of one polygon (all its rings), as errors: a ring crossing or touching
 * itself away from neighbouring edges (bow-ties, figure-eights), or two rings crossing or
 * running along each other (a single-point touch between rings is allowed, as in OGC Simple
 * Features). Candidate pairs come from a sweep over x, or from a flatbush index of the segments
 * when the sweep would have too many segments open at once, so the cost stays O(n log n + k).
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
  let k = 0;
  rings.forEach((ring, r) => {
    for (let i = 0; i + 1 < ring.length; i++, k++) {
      segs[4 * k] = ring[i][0];
      segs[4 * k + 1] = ring[i][1];
      segs[4 * k + 2] = ring[i + 1][0];
      segs[4 * k + 3] = ring[i + 1][1];
      ringOf[k] = r;
      indexInRing[k] = i;
    }
  });
  // Every meeting is collected (up to a cap) and sorted, so both searches report the same first ones.
  const found: Problem[] = [];
  const cap = Math.max(limit, 1) * 20;
  const report = (a: number, b: number): boolean => {
    const problem = pairProblem(segs, a, b, ringOf, indexInRing, ringLength, where);
    if (problem) found.push(problem);
    return found.length >= cap;
  };
  if (!pairsBySweep(segs, count, 64 * count, report)) {
    found.length = 0;
    pairsByIndex(segs, count, report);
  }
  found.sort((p, q) => (p.where.ring ?? 0) - (q.where.ring ?? 0) || (p.where.vertex ?? 0) - (q.where.vertex ?? 0));
  const problems = found.slice(0, limit);
  return problems;
}
