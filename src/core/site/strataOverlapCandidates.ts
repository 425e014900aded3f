import Flatbush from 'flatbush';
import { edgeCrossesRayEast } from '../geometry/edgeCrossesRayEast';
import type { Position } from 'geojson';
import type { StratumPart } from '../model/types';

/** Flat segments of every part, each turned so its part lies on its left. */
interface Segments {
  /** ax, ay, bx, by of each segment side by side: one memory read brings a whole segment. */
  xy: Float64Array;
  part: Int32Array;
  /** Index of the segment's ring, so runs along a ring can be followed. */
  ring: Int32Array;
  /** First segment of each part, and the end as the last entry. */
  partStart: Int32Array;
  count: number;
}

function ringsOf(part: StratumPart): Position[][][] {
  return part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
}

/** Every non-degenerate edge of every ring, shells counter-clockwise and holes clockwise (interior on the left). */
function segmentsOf(parts: readonly StratumPart[]): Segments {
  let total = 0;
  for (const part of parts) for (const poly of ringsOf(part)) for (const ring of poly) total += Math.max(0, ring.length - 1);
  const s: Segments = {
    xy: new Float64Array(4 * total),
    part: new Int32Array(total),
    ring: new Int32Array(total),
    partStart: new Int32Array(parts.length + 1),
    count: 0,
  };
  let n = 0;
  let ringId = 0;
  for (let p = 0; p < parts.length; p++) {
    s.partStart[p] = n;
    for (const poly of ringsOf(parts[p])) {
      for (let r = 0; r < poly.length; r++, ringId++) {
        const ring = poly[r];
        if (ring.length < 2) continue;
        const [x0, y0] = ring[0];
        let twiceArea = 0;
        for (let k = 1; k < ring.length - 1; k++) {
          twiceArea += (ring[k][0] - x0) * (ring[k + 1][1] - y0) - (ring[k + 1][0] - x0) * (ring[k][1] - y0);
        }
        const flip = r === 0 ? twiceArea < 0 : twiceArea > 0;
        for (let k = 0; k < ring.length - 1; k++) {
          const [x1, y1] = flip ? ring[ring.length - 1 - k] : ring[k];
          const [x2, y2] = flip ? ring[ring.length - 2 - k] : ring[k + 1];
          if (x1 === x2 && y1 === y2) continue;
          // + 0 turns −0 into 0, so equal coordinates also have equal bits for the hashes.
          s.xy[4 * n] = x1 + 0;
          s.xy[4 * n + 1] = y1 + 0;
          s.xy[4 * n + 2] = x2 + 0;
          s.xy[4 * n + 3] = y2 + 0;
          s.part[n] = p;
          s.ring[n] = ringId;
          n++;
        }
      }
    }
  }
  s.partStart[parts.length] = n;
  s.count = n;
  return s;
}

const words = new Float64Array(2);
const bits = new Uint32Array(words.buffer);

/** A 32-bit hash of a point's two doubles by their bits (murmur3's mixing steps, common practice). */
function pointHash(x: number, y: number): number {
  words[0] = x;
  words[1] = y;
  let h = 0x9e3779b9;
  for (let k = 0; k < 4; k++) {
    h ^= Math.imul(bits[k], 0xcc9e2d51);
    h = Math.imul((h << 13) | (h >>> 19), 5) + 0xe6546b64;
  }
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  return h >>> 0;
}

/** Hashes of every segment's start and end point. */
function endHashes(s: Segments): { start: Uint32Array; end: Uint32Array } {
  const start = new Uint32Array(s.count);
  const end = new Uint32Array(s.count);
  for (let i = 0; i < s.count; i++) {
    start[i] = pointHash(s.xy[4 * i], s.xy[4 * i + 1]);
    end[i] = pointHash(s.xy[4 * i + 2], s.xy[4 * i + 3]);
  }
  return { start, end };
}

/**
 * Indices 0…n−1 ordered by their 32-bit keys (a stable least-significant-digit radix sort, three
 * passes of 11 bits; common practice, no source): equal keys end up side by side, so groups are
 * walked in memory order instead of chasing hash chains.
 */
function orderByKey(keys: Uint32Array): Int32Array {
  const n = keys.length;
  let order = new Int32Array(n);
  let spare = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const counts = new Int32Array(2048);
  for (let shift = 0; shift < 32; shift += 11) {
    counts.fill(0);
    for (let i = 0; i < n; i++) counts[(keys[i] >>> shift) & 2047]++;
    let sum = 0;
    for (let d = 0; d < 2048; d++) {
      const c = counts[d];
      counts[d] = sum;
      sum += c;
    }
    for (let k = 0; k < n; k++) {
      const i = order[k];
      spare[counts[(keys[i] >>> shift) & 2047]++] = i;
    }
    [order, spare] = [spare, order];
  }
  return order;
}

/** Calls `visit(from, to)` for each run of `order` whose keys are equal and that holds more than one index. */
function forEachGroup(order: Int32Array, keys: Uint32Array, visit: (from: number, to: number) => void): void {
  for (let g = 0; g < order.length; ) {
    let end = g + 1;
    while (end < order.length && keys[order[end]] === keys[order[g]]) end++;
    if (end - g > 1) visit(g, end);
    g = end;
  }
}

/**
 * For each segment, the segment it is shared with: the same two end coordinates, used once in each
 * of two different parts in opposite directions — a boundary with one part on each side — or -1.
 * Any other repeat (the same direction, three uses, twice in one part) is not shared, so the sweep
 * sees it.
 */
function sharedPartners(s: Segments, ends: { start: Uint32Array; end: Uint32Array }): Int32Array {
  // Symmetric in the two ends, so a segment and its reverse have one key.
  const keys = new Uint32Array(s.count);
  for (let i = 0; i < s.count; i++) {
    const x = ends.start[i] ^ ends.end[i];
    keys[i] = Math.imul(x ^ (x >>> 16), 0x7feb352d) ^ (x >>> 15);
  }
  const order = orderByKey(keys);
  const partner = new Int32Array(s.count).fill(-1);
  forEachGroup(order, keys, (from, to) => {
    for (let a = from; a < to; a++) {
      const i = order[a];
      let same = 0;
      let match = -1;
      // A second equal segment already rules out sharing: stop there, so a run of repeats costs little.
      for (let b = from; b < to && same < 2; b++) {
        const t = order[b];
        if (t === i) continue;
        const reversed = s.xy[4 * t] === s.xy[4 * i + 2] && s.xy[4 * t + 1] === s.xy[4 * i + 3] && s.xy[4 * t + 2] === s.xy[4 * i] && s.xy[4 * t + 3] === s.xy[4 * i + 1];
        const forward = s.xy[4 * t] === s.xy[4 * i] && s.xy[4 * t + 1] === s.xy[4 * i + 1] && s.xy[4 * t + 2] === s.xy[4 * i + 2] && s.xy[4 * t + 3] === s.xy[4 * i + 3];
        if (!reversed && !forward) continue;
        same++;
        match = reversed ? t : -2;
      }
      if (same === 1 && match >= 0 && s.part[match] !== s.part[i]) partner[i] = match;
    }
  });
  return partner;
}

/**
 * For each segment, whether its start vertex (exact coordinates) is used by a part other than the
 * segment's owners (its part, and its partner's part when shared).
 */
function foreignStarts(s: Segments, other: Int32Array, starts: Uint32Array): Uint8Array {
  const order = orderByKey(starts);
  // Every vertex of a ring is the start of one of its segments, so starts stand for all vertices.
  const foreign = new Uint8Array(s.count);
  forEachGroup(order, starts, (from, to) => {
    const first = order[from];
    let oneVertex = true;
    // Up to three distinct parts among the group: with three, every member has one not its own.
    // Kept in locals, not an array: a large map has a group for nearly every vertex.
    let seen0 = -1;
    let seen1 = -1;
    let seen2 = -1;
    let distinct = 0;
    for (let a = from; a < to; a++) {
      const t = order[a];
      if (s.xy[4 * t] !== s.xy[4 * first] || s.xy[4 * t + 1] !== s.xy[4 * first + 1]) oneVertex = false;
      const p = s.part[t];
      if (distinct < 3 && p !== seen0 && p !== seen1) {
        if (distinct === 0) seen0 = p;
        else if (distinct === 1) seen1 = p;
        else seen2 = p;
        distinct++;
      }
    }
    for (let a = from; a < to; a++) {
      const i = order[a];
      if (oneVertex) {
        const own = s.part[i];
        const partner = other[i];
        if ((seen0 !== own && seen0 !== partner) || (distinct > 1 && seen1 !== own && seen1 !== partner) || (distinct > 2 && seen2 !== own && seen2 !== partner)) foreign[i] = 1;
        continue;
      }
      // Different vertices under one key (a hash collision, rare): compare pairwise.
      for (let b = from; b < to; b++) {
        const t = order[b];
        if (s.part[t] !== s.part[i] && s.part[t] !== other[i] && s.xy[4 * t] === s.xy[4 * i] && s.xy[4 * t + 1] === s.xy[4 * i + 1]) {
          foreign[i] = 1;
          break;
        }
      }
    }
  });
  return foreign;
}

/** Sign of the turn a → b → c with a tolerance: 0 when the points are collinear to within rounding. */
function turn(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  const ux = bx - ax;
  const uy = by - ay;
  const vx = cx - ax;
  const vy = cy - ay;
  const cross = ux * vy - uy * vx;
  const tol = 1e-12 * (Math.abs(ux * vy) + Math.abs(uy * vx));
  return cross > tol ? 1 : cross < -tol ? -1 : 0;
}

/** Whether c, collinear with a–b, lies within the segment's box (ends included). */
function within(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): boolean {
  return Math.min(ax, bx) <= cx && cx <= Math.max(ax, bx) && Math.min(ay, by) <= cy && cy <= Math.max(ay, by);
}

/**
 * Whether segments i and j meet anywhere except at one common end vertex (exactly equal
 * coordinates) where they go apart: a crossing, a touch, or a stretch in common. Near-collinear
 * cases count as meeting, so doubt always goes to the exact clipper.
 */
function segmentsMeet(s: Segments, i: number, j: number): boolean {
  const [ax, ay, bx, by] = [s.xy[4 * i], s.xy[4 * i + 1], s.xy[4 * i + 2], s.xy[4 * i + 3]];
  const [cx, cy, dx, dy] = [s.xy[4 * j], s.xy[4 * j + 1], s.xy[4 * j + 2], s.xy[4 * j + 3]];
  const aIsC = ax === cx && ay === cy;
  const aIsD = ax === dx && ay === dy;
  const bIsC = bx === cx && by === cy;
  const bIsD = bx === dx && by === dy;
  if (aIsC || aIsD || bIsC || bIsD) {
    if ((aIsC && bIsD) || (aIsD && bIsC)) return true;
    // One common end p; the others q (of i) and r (of j) go apart unless they point the same way along one line.
    const [px, py] = aIsC || aIsD ? [ax, ay] : [bx, by];
    const [qx, qy] = aIsC || aIsD ? [bx, by] : [ax, ay];
    const [rx, ry] = aIsC || bIsC ? [dx, dy] : [cx, cy];
    if (turn(px, py, qx, qy, rx, ry) !== 0) return false;
    return (qx - px) * (rx - px) + (qy - py) * (ry - py) > 0;
  }
  const o1 = turn(ax, ay, bx, by, cx, cy);
  const o2 = turn(ax, ay, bx, by, dx, dy);
  const o3 = turn(cx, cy, dx, dy, ax, ay);
  const o4 = turn(cx, cy, dx, dy, bx, by);
  if (o1 * o2 < 0 && o3 * o4 < 0) return true;
  if (o1 === 0 && within(ax, ay, bx, by, cx, cy)) return true;
  if (o2 === 0 && within(ax, ay, bx, by, dx, dy)) return true;
  if (o3 === 0 && within(cx, cy, dx, dy, ax, ay)) return true;
  if (o4 === 0 && within(cx, cy, dx, dy, bx, by)) return true;
  return false;
}

/** Whether (x, y) lies inside part p by the even–odd crossing rule over all its rings (Shimrat 1962). */
function isInsidePart(s: Segments, p: number, x: number, y: number): boolean {
  let inside = false;
  for (let k = s.partStart[p]; k < s.partStart[p + 1]; k++) {
    if (edgeCrossesRayEast(x, y, s.xy[4 * k], s.xy[4 * k + 1], s.xy[4 * k + 2], s.xy[4 * k + 3])) inside = !inside;
  }
  return inside;
}

/** Segments per chunk of a run in the sweep's index (common practice, no source: a few dozen keeps boxes tight and the index small). */
const CHUNK = 32;

/**
 * Pairs of parts that may overlap, as keys `i * parts.length + j` with i < j; every pair not in the
 * set provably shares no area. Parts must be valid polygons (closed rings, no self-intersections,
 * holes inside their shells, polygons of one MultiPolygon apart), as siteValidate checks first.
 *
 * Method: every edge is turned so its part lies on its left. An edge that two parts use once each
 * in opposite directions (found by a hash of its end coordinates) is a shared boundary with one
 * part on each side; it is kept once, owned by both. Edges are then followed in runs along their
 * rings, a run ending where its owners change or at a vertex another part uses. (1) Contacts: a
 * sweep through a flatbush index of run chunks tests edges of owners with no part in common; any
 * crossing, touch or stretch in common (a common end vertex where the two go apart excepted)
 * makes every pair of their owners a candidate. (2) Containment: with no contact, a run is wholly
 * inside or wholly outside each other part, so one point of each run is tested (even–odd rule)
 * against every other part whose box holds it. Completeness: the boundary of a common area of
 * parts X and Y is made of pieces of X's edges inside Y and of Y's edges inside X (neither an
 * edge X shares with Y, which has them on opposite sides); such a piece either meets the other's
 * edges (1) or lies in a run wholly inside it (2). Coordinates are plane lon/lat, as polyclip-ts
 * takes them; near-collinear cases count as meeting, so doubt goes to the exact clipper.
 */
export function strataOverlapCandidates(parts: readonly StratumPart[], boxes: readonly [number, number, number, number][]): Set<number> {
  const n = parts.length;
  const found = new Set<number>();
  if (n < 2) return found;
  const s = segmentsOf(parts);
  const ends = endHashes(s);
  const partner = sharedPartners(s, ends);
  // The second owner of each segment (its partner's part) or -1; a shared edge is kept in its lower part only.
  const other = new Int32Array(s.count).fill(-1);
  const kept: number[] = [];
  for (let i = 0; i < s.count; i++) {
    if (partner[i] >= 0) other[i] = s.part[partner[i]];
    if (other[i] < 0 || s.part[i] < other[i]) kept.push(i);
  }
  const foreign = foreignStarts(s, other, ends.start);
  const flag = (a: number, b: number) => {
    if (a >= 0 && b >= 0 && a !== b) found.add(a < b ? a * n + b : b * n + a);
  };
  const flagOwners = (i: number, j: number) => {
    flag(s.part[i], s.part[j]);
    flag(s.part[i], other[j]);
    flag(other[i], s.part[j]);
    flag(other[i], other[j]);
  };
  const disjoint = (i: number, j: number) => {
    const a = s.part[i];
    const b = other[i];
    const c = s.part[j];
    const d = other[j];
    return a !== c && a !== d && (b < 0 || (b !== c && b !== d));
  };
  // Runs, and chunks of at most CHUNK kept segments within a run.
  const runStarts: number[] = [];
  const chunkFirst: number[] = [];
  for (let k = 0; k < kept.length; k++) {
    const i = kept[k];
    const continues = k > 0 && kept[k - 1] === i - 1 && s.ring[i - 1] === s.ring[i] && other[i - 1] === other[i] && !foreign[i];
    if (!continues) runStarts.push(k);
    if (!continues || k - chunkFirst[chunkFirst.length - 1] >= CHUNK) chunkFirst.push(k);
  }
  chunkFirst.push(kept.length);
  const chunks = chunkFirst.length - 1;
  const cbox = new Float64Array(4 * chunks);
  const index = new Flatbush(Math.max(1, chunks));
  for (let c = 0; c < chunks; c++) {
    let [x0, y0, x1, y1] = [Infinity, Infinity, -Infinity, -Infinity];
    for (let k = chunkFirst[c]; k < chunkFirst[c + 1]; k++) {
      const i = kept[k];
      x0 = Math.min(x0, s.xy[4 * i], s.xy[4 * i + 2]);
      y0 = Math.min(y0, s.xy[4 * i + 1], s.xy[4 * i + 3]);
      x1 = Math.max(x1, s.xy[4 * i], s.xy[4 * i + 2]);
      y1 = Math.max(y1, s.xy[4 * i + 1], s.xy[4 * i + 3]);
    }
    cbox.set([x0, y0, x1, y1], 4 * c);
    index.add(x0, y0, x1, y1);
  }
  if (chunks === 0) index.add(0, 0, 0, 0);
  index.finish();
  const near: number[] = [];
  for (let c = 0; c < chunks; c++) {
    const [x0, y0, x1, y1] = [cbox[4 * c], cbox[4 * c + 1], cbox[4 * c + 2], cbox[4 * c + 3]];
    const first = kept[chunkFirst[c]];
    for (const d of index.search(x0, y0, x1, y1)) {
      if (d <= c || !disjoint(first, kept[chunkFirst[d]])) continue;
      // Only the edges of each chunk inside the two chunks' common box can meet.
      const wx0 = Math.max(x0, cbox[4 * d]);
      const wy0 = Math.max(y0, cbox[4 * d + 1]);
      const wx1 = Math.min(x1, cbox[4 * d + 2]);
      const wy1 = Math.min(y1, cbox[4 * d + 3]);
      near.length = 0;
      for (let k = chunkFirst[d]; k < chunkFirst[d + 1]; k++) {
        const j = kept[k];
        if (Math.max(s.xy[4 * j], s.xy[4 * j + 2]) >= wx0 && Math.min(s.xy[4 * j], s.xy[4 * j + 2]) <= wx1 && Math.max(s.xy[4 * j + 1], s.xy[4 * j + 3]) >= wy0 && Math.min(s.xy[4 * j + 1], s.xy[4 * j + 3]) <= wy1) near.push(j);
      }
      if (near.length === 0) continue;
      for (let k = chunkFirst[c]; k < chunkFirst[c + 1]; k++) {
        const i = kept[k];
        if (Math.max(s.xy[4 * i], s.xy[4 * i + 2]) < wx0 || Math.min(s.xy[4 * i], s.xy[4 * i + 2]) > wx1 || Math.max(s.xy[4 * i + 1], s.xy[4 * i + 3]) < wy0 || Math.min(s.xy[4 * i + 1], s.xy[4 * i + 3]) > wy1) continue;
        for (const j of near) if (segmentsMeet(s, i, j)) flagOwners(i, j);
      }
    }
  }
  // Containment: one point per run, tested against every part other than its owners whose box holds it.
  const partIndex = new Flatbush(n);
  for (const b of boxes) partIndex.add(b[0], b[1], b[2], b[3]);
  partIndex.finish();
  for (const k of runStarts) {
    const i = kept[k];
    const x = (s.xy[4 * i] + s.xy[4 * i + 2]) / 2;
    const y = (s.xy[4 * i + 1] + s.xy[4 * i + 3]) / 2;
    for (const q of partIndex.search(x, y, x, y)) {
      if (q === s.part[i] || q === other[i]) continue;
      const a = Math.min(q, s.part[i]) * n + Math.max(q, s.part[i]);
      const b = other[i] < 0 ? -1 : Math.min(q, other[i]) * n + Math.max(q, other[i]);
      if (found.has(a) && (b < 0 || found.has(b))) continue;
      if (isInsidePart(s, q, x, y)) {
        flag(q, s.part[i]);
        flag(q, other[i]);
      }
    }
  }
  return found;
}
