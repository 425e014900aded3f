import Flatbush from 'flatbush';
import type { Position } from 'geojson';
import { edgeCrossesRayEast } from '../geometry/edgeCrossesRayEast';
import { InputError } from '../common/InputError';
import { siteLongitudeUnwrap } from '../geo/siteLocalFrame';
import type { Site } from '../model/types';

/** One placed plot to check: its WGS84 position and the stratum it was placed in. */
export interface PlacedPlotLonLat {
  id: string;
  stratum: string;
  lon: number;
  lat: number;
}

/** Mean Earth radius, m (IUGG R1), for the edge-model tolerance. */
const EARTH_RADIUS_M = 6_371_008.8;
/** Metres per degree of latitude and of longitude at the equator, for local distances (common practice, no source). */
const M_PER_DEG_LAT = 110_574;
const M_PER_DEG_LON = 111_320;
const CHUNK = 8;

/** One stratum's edges in unwrapped lon/lat (x1, y1, x2, y2 …), chunked in a flatbush index. */
interface StratumEdges {
  edges: Float64Array;
  index: Flatbush;
  /** Longest edge, metres (roughly), which bounds the tolerance. */
  longestM: number;
}

function edgesOf(site: Site, key: string, unwrap: (lon: number) => number): StratumEdges | null {
  const rings: Position[][] = [];
  for (const part of site.parts) {
    if (part.stratum !== key) continue;
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) for (const ring of poly) if (ring.length > 1) rings.push(ring);
  }
  // Each ring starts a new chunk, so no chunk spans the gap between two rings; NaN pads the rest.
  let chunkCount = 0;
  for (const ring of rings) chunkCount += Math.ceil((ring.length - 1) / CHUNK);
  if (chunkCount === 0) return null;
  const edges = new Float64Array(chunkCount * CHUNK * 4).fill(Number.NaN);
  const index = new Flatbush(chunkCount);
  let longestM = 0;
  let c = 0;
  for (const ring of rings) {
    // Each vertex is read and unwrapped once: it ends one edge and starts the next.
    let bx = unwrap(ring[0][0]);
    let by = ring[0][1];
    for (let start = 0; start + 1 < ring.length; start += CHUNK, c++) {
      let x0 = bx;
      let y0 = by;
      let x1 = bx;
      let y1 = by;
      for (let i = start, e = c * CHUNK * 4; i < start + CHUNK && i + 1 < ring.length; i++, e += 4) {
        const ax = bx;
        const ay = by;
        const next = ring[i + 1];
        bx = unwrap(next[0]);
        by = next[1];
        edges[e] = ax;
        edges[e + 1] = ay;
        edges[e + 2] = bx;
        edges[e + 3] = by;
        if (bx < x0) x0 = bx;
        if (by < y0) y0 = by;
        if (bx > x1) x1 = bx;
        if (by > y1) y1 = by;
        // The cosine is taken only for an edge that could be the longest yet: its length with a
        // cosine of 1 bounds it from above (widened far beyond rounding), so the result is the same.
        const ex = (bx - ax) * M_PER_DEG_LON;
        const ey = (by - ay) * M_PER_DEG_LAT;
        if ((ex * ex + ey * ey) * (1 + 1e-9) >= longestM * longestM) {
          const kx = Math.cos((((ay + by) / 2) * Math.PI) / 180) * M_PER_DEG_LON;
          longestM = Math.max(longestM, Math.hypot((bx - ax) * kx, (by - ay) * M_PER_DEG_LAT));
        }
      }
      index.add(x0, y0, x1, y1);
    }
  }
  index.finish();
  return { edges, index, longestM };
}

/** Sagitta bound, metres: how far the straight edges of the grid or of lon/lat may stand from the geodesic one of length L. */
function edgeToleranceM(lengthM: number, latDeg: number): number {
  return (lengthM * lengthM * (1 + Math.abs(Math.tan((latDeg * Math.PI) / 180)))) / (8 * EARTH_RADIUS_M) + 0.05;
}

/** Whether the point lies inside the stratum (crossing number to the east, half-open in y). */
function isInside(s: StratumEdges, x: number, y: number): boolean {
  let inside = false;
  for (const c of s.index.search(x, y, Number.POSITIVE_INFINITY, y)) {
    for (let e = c * CHUNK * 4; e < (c + 1) * CHUNK * 4 && e < s.edges.length; e += 4) {
      // NaN marks the gap between two rings' edges in the flat list.
      if (!Number.isNaN(s.edges[e + 1]) && edgeCrossesRayEast(x, y, s.edges[e], s.edges[e + 1], s.edges[e + 2], s.edges[e + 3])) inside = !inside;
    }
  }
  return inside;
}

/** Distance, metres, from the point to the nearest edge within `reachM`, with that edge's tolerance; null when none is that near. */
function nearestEdge(s: StratumEdges, x: number, y: number, reachM: number): { distanceM: number; toleranceM: number } | null {
  const kx = Math.max(Math.cos((y * Math.PI) / 180) * M_PER_DEG_LON, 1e-6);
  const dx = reachM / kx;
  const dy = reachM / M_PER_DEG_LAT;
  let best: { distanceM: number; toleranceM: number } | null = null;
  for (const c of s.index.search(x - dx, y - dy, x + dx, y + dy)) {
    for (let e = c * CHUNK * 4; e < (c + 1) * CHUNK * 4 && e < s.edges.length; e += 4) {
      if (Number.isNaN(s.edges[e])) continue;
      const ax = (s.edges[e] - x) * kx;
      const ay = (s.edges[e + 1] - y) * M_PER_DEG_LAT;
      const bx = (s.edges[e + 2] - x) * kx;
      const by = (s.edges[e + 3] - y) * M_PER_DEG_LAT;
      const ex = bx - ax;
      const ey = by - ay;
      const len2 = ex * ex + ey * ey;
      const t = len2 > 0 ? Math.max(0, Math.min(1, -(ax * ex + ay * ey) / len2)) : 0;
      const d = Math.hypot(ax + t * ex, ay + t * ey);
      if (!best || d < best.distanceM) best = { distanceM: d, toleranceM: edgeToleranceM(Math.sqrt(len2), y) };
    }
  }
  return best;
}

/**
 * Checks, after placement in the UTM frame, that every plot's WGS84 position lies inside its
 * stratum on the ellipsoid (crossing number over the stratum's rings in lon/lat, unwrapped across
 * the antimeridian as the site frame is). A plot just outside is accepted when it is within the
 * distance by which the grid's straight edges, lon/lat's straight edges and the ellipsoid's
 * geodesic edges may differ (L²(1 + |tan φ|)/8R for an edge of length L, plus 5 cm for rounding the
 * coordinates to 1 cm); beyond that, the frame has distorted the site and the design is refused
 * rather than handed over with a plot outside its stratum.
 * Source of the test: the crossing-number rule (Shimrat 1962, ACM Algorithm 112; common practice).
 * Throws InputError naming the plot, its stratum and how far outside it lies.
 */
export function plotsInStrataCheck(site: Site, plots: readonly PlacedPlotLonLat[]): void {
  const unwrap = siteLongitudeUnwrap(site.parts);
  const cache = new Map<string, StratumEdges | null>();
  for (const p of plots) {
    let s = cache.get(p.stratum);
    if (s === undefined) {
      s = edgesOf(site, p.stratum, unwrap);
      cache.set(p.stratum, s);
    }
    const x = unwrap(p.lon);
    if (s && isInside(s, x, p.lat)) continue;
    const reach = s ? edgeToleranceM(s.longestM, p.lat) : 0;
    const near = s ? nearestEdge(s, x, p.lat, reach) : null;
    if (near && near.distanceM <= near.toleranceM) continue;
    const how = near ? `${near.distanceM.toFixed(1)} m` : `more than ${Math.max(1, Math.round(reach))} m`;
    throw new InputError(
      `plot ${p.id} was placed at ${p.lon.toFixed(6)}, ${p.lat.toFixed(6)}, ${how} outside its stratum "${p.stratum}" on the ellipsoid: the site is too distorted in its UTM frame; split it into smaller sites`,
    );
  }
}
