import { isClearanceShort, type PlacementConstraints, utmScaleFactor } from '../design/place/placementConstraints';
import { EDGE_CHUNK } from '../design/place/placementStrata';
import { pointSegmentDistance } from '../geometry/segmentDistance';
import type { ExclusionKind } from '../model/types';

/** How close a plot at one position comes to one exclusion, as placement measures it. */
export interface ExclusionClearance {
  /** Index into `site.exclusions`. */
  exclusion: number;
  /** Ground metres from the plot centre to the exclusion's mapped geometry (to its edge when inside a polygon). */
  centreM: number;
  /** Ground metres from the footprint to the mapped geometry (0 when it touches or overlaps). */
  footprintM: number;
  /** True when the plot centre lies inside the exclusion polygon. */
  inside: boolean;
  /** True when placement would refuse the plot for this exclusion (footprint inside the widened exclusion). */
  blocks: boolean;
}

/** How a plot's footprint sits in its stratum, as placement measures it. */
export interface EdgeClearance {
  /** Ground metres from the footprint to the stratum's boundary (0 when it crosses it). */
  footprintM: number;
  /** True when placement would refuse the plot: the footprint crosses the boundary or enters the edge buffer. */
  blocks: boolean;
}

/** The nearest exclusion of one kind to a plot centre. */
export interface NearestOfKind {
  exclusion: number;
  /** Ground metres from the plot centre to its mapped geometry (0 inside a polygon). */
  distanceM: number;
}

/** Queries on a site prepared for placement that say why and by how much a position fits or not. */
export interface PlotClearances {
  /** Index of the stratum holding (x, y) (not in a hole), or -1. */
  stratumAt(x: number, y: number): number;
  /** The footprint at (x, y) against stratum `s`'s boundary and edge buffer; null when placement makes no edge test. */
  edge(s: number, x: number, y: number): EdgeClearance | null;
  /** Every exclusion whose widened ground the footprint at (x, y) enters or whose polygon holds the centre, nearest first. */
  blocking(x: number, y: number): ExclusionClearance[];
  /** The nearest exclusion of each mapped kind to the centre (x, y). */
  nearestOfEachKind(x: number, y: number): Partial<Record<ExclusionKind, NearestOfKind>>;
}

/**
 * Measuring on top of placement's own tests: the same segments, buffers (× the site's largest scale
 * factor), footprint and rule ({@link isClearanceShort}) that `PlacementConstraints.check` uses, so a
 * position placement refuses is exactly one that `blocking` or `edge` reports (for `slackM` 0).
 * `slackM` (ground metres) lets positive limits be met to within the rounding of coordinates in a
 * file; touching limits (no buffer) stay exact. Distances are planar in the UTM frame divided by the
 * point scale factor at the plot, as plot files report them.
 * Sources: planar distances (O'Rourke 1998, §1.5); scale factor (Snyder 1987, eq. 8-11).
 */
export function plotClearances(c: PlacementConstraints, slackM = 0): PlotClearances {
  const ex = c.exclusionParts;
  const slack = slackM * c.scale;
  const h = c.footprint.halfExtent;
  const toGround = (x: number) => 1 / utmScaleFactor(x, c.lat0);

  const stratumAt = (x: number, y: number): number => c.strata.findIndex((st) => st.contains(x, y));

  const edge = (s: number, x: number, y: number): EdgeClearance | null => {
    const st = c.strata[s];
    const limit = c.edgeBufferGrid;
    if (!(h > 0 || limit > 0) || !st.edgeIndex) return null;
    const edges = st.edges;
    const chunkMin = (k: number): number => {
      let best = Number.POSITIVE_INFINITY;
      const end = Math.min(edges.length, (k + 1) * EDGE_CHUNK * 4);
      for (let o = k * EDGE_CHUNK * 4; o < end; o += 4) best = Math.min(best, c.footprintDistance(x, y, o, edges));
      return best;
    };
    // The nearest chunk box bounds the answer; every closer segment's box lies within that reach plus the footprint.
    let best = chunkMin(st.edgeIndex.neighbors(x, y, 1)[0]);
    const r = best + h;
    for (const k of st.edgeIndex.search(x - r, y - r, x + r, y + r)) best = Math.min(best, chunkMin(k));
    return { footprintM: best * toGround(x), blocks: isClearanceShort(best, limit, slack) };
  };

  const blocking = (x: number, y: number): ExclusionClearance[] => {
    const inside = new Set(c.exclusionPolygonsAt(x, y));
    const byOwner = new Map<number, { centre: number; footprint: number; blocks: boolean }>();
    if (ex.index) {
      const reach = h + ex.maxBuf;
      for (const i of ex.index.search(x - reach, y - reach, x + reach, y + reach)) {
        const o = i * 4;
        const footprint = c.footprintDistance(x, y, o, ex.seg);
        const centre = pointSegmentDistance(x, y, ex.seg[o], ex.seg[o + 1], ex.seg[o + 2], ex.seg[o + 3]);
        const owner = ex.owner[i];
        const was = byOwner.get(owner);
        const blocks = isClearanceShort(footprint, ex.buf[i], slack);
        byOwner.set(owner, {
          centre: Math.min(was?.centre ?? Number.POSITIVE_INFINITY, centre),
          footprint: Math.min(was?.footprint ?? Number.POSITIVE_INFINITY, footprint),
          blocks: (was?.blocks ?? false) || blocks,
        });
      }
    }
    const out: ExclusionClearance[] = [];
    const k = toGround(x);
    for (const [owner, m] of byOwner) {
      if (!m.blocks && !inside.has(owner)) continue;
      out.push({ exclusion: owner, centreM: m.centre * k, footprintM: inside.has(owner) ? 0 : m.footprint * k, inside: inside.has(owner), blocks: true });
    }
    for (const owner of inside) {
      if (byOwner.has(owner)) continue;
      out.push({ exclusion: owner, centreM: nearestOwnerM(x, y, owner) * k, footprintM: 0, inside: true, blocks: true });
    }
    return out.sort((a, b) => a.centreM - b.centreM || a.exclusion - b.exclusion);
  };

  // Distance from (x, y) to the nearest segment of one exclusion (grid metres), widening the search.
  const nearestOwnerM = (x: number, y: number, owner: number): number => {
    if (!ex.index) return 0;
    const [first] = ex.index.neighbors(x, y, 1, Number.POSITIVE_INFINITY, (i) => ex.owner[i] === owner);
    return first === undefined ? 0 : nearestAmong(x, y, first, (i) => ex.owner[i] === owner).distance;
  };

  // Exact nearest segment passing `keep`, starting from the segment whose (widened) box is nearest.
  const nearestAmong = (x: number, y: number, first: number, keep: (i: number) => boolean): { segment: number; distance: number } => {
    const d0 = (i: number) => pointSegmentDistance(x, y, ex.seg[i * 4], ex.seg[i * 4 + 1], ex.seg[i * 4 + 2], ex.seg[i * 4 + 3]);
    let best = { segment: first, distance: d0(first) };
    const r = best.distance;
    for (const i of ex.index!.search(x - r, y - r, x + r, y + r)) {
      if (!keep(i)) continue;
      const d = d0(i);
      if (d < best.distance) best = { segment: i, distance: d };
    }
    return best;
  };

  const nearestOfEachKind = (x: number, y: number): Partial<Record<ExclusionKind, NearestOfKind>> => {
    const out: Partial<Record<ExclusionKind, NearestOfKind>> = {};
    if (!ex.index) return out;
    const inside = c.exclusionPolygonsAt(x, y);
    const kinds = new Set(ex.kind);
    const k = toGround(x);
    for (const kind of kinds) {
      const keep = (i: number) => ex.kind[i] === kind;
      const held = inside.find((owner) => ex.kind[ex.owner.indexOf(owner)] === kind);
      if (held !== undefined) {
        out[kind] = { exclusion: held, distanceM: 0 };
        continue;
      }
      const [first] = ex.index.neighbors(x, y, 1, Number.POSITIVE_INFINITY, keep);
      if (first === undefined) continue;
      const best = nearestAmong(x, y, first, keep);
      out[kind] = { exclusion: ex.owner[best.segment], distanceM: best.distance * k };
    }
    return out;
  };

  return { stratumAt, edge, blocking, nearestOfEachKind };
}
