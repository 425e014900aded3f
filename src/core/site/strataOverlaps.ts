import Flatbush from 'flatbush';
import { areaGeometryPlanar, type PolygonsLonLat } from '../geometry/areaGeometryPlanar';
import { strataOverlapCandidates } from './strataOverlapCandidates';
import { boxesMayOverlap, partBox, strataPairOverlap } from './strataOverlapsByClipping';
import type { Problem, StratumPart } from '../model/types';

export { MIN_OVERLAP_M2 } from './strataOverlapsByClipping';

/**
 * Pairs of strata features that overlap (a point in two features), as errors with the overlap's
 * ellipsoidal area (m²) and a position inside it. Features of different strata make the design
 * ambiguous; two features of one stratum would count their overlap twice in the mapped area.
 * A screen over all edges at once (strataOverlapCandidates: shared edges cancelled by a hash of
 * their ends, a sweep for contacts, one point-in-polygon test per run of edges) proves most pairs
 * apart; only the pairs it cannot clear are intersected with polyclip-ts in plane lon/lat (so shared
 * edges stay exactly shared) and measured on the ellipsoid, exactly as strataOverlapsByClipping
 * does for every pair, with the same problems in the same order.
 * `indices[i]` is the feature index reported for `parts[i]`.
 */
export function strataOverlaps(parts: readonly StratumPart[], indices?: readonly number[]): Problem[] {
  if (parts.length < 2) return [];
  const boxes = parts.map(partBox);
  const index = new Flatbush(parts.length);
  for (const b of boxes) index.add(b[0], b[1], b[2], b[3]);
  index.finish();
  // Only parts whose box meets another part's box go through the screen (separate strata cost nothing).
  const near = new Uint8Array(parts.length);
  for (let i = 0; i < parts.length; i++) {
    const b = boxes[i];
    for (const j of index.search(b[0], b[1], b[2], b[3])) {
      if (j === i || !boxesMayOverlap(b, boxes[j])) continue;
      near[i] = 1;
      near[j] = 1;
    }
  }
  const screened = parts.map((_, i) => i).filter((i) => near[i]);
  if (screened.length < 2) return [];
  const found = strataOverlapCandidates(
    screened.map((i) => parts[i]),
    screened.map((i) => boxes[i]),
  );
  if (found.size === 0) return [];
  const candidates = new Set<number>();
  for (const k of found) candidates.add(screened[Math.floor(k / screened.length)] * parts.length + screened[k % screened.length]);
  const planar: (PolygonsLonLat | undefined)[] = [];
  const planarOf = (i: number) => (planar[i] ??= areaGeometryPlanar(parts[i].geometry));
  const problems: Problem[] = [];
  for (let i = 0; i < parts.length; i++) {
    const b = boxes[i];
    for (const j of index.search(b[0], b[1], b[2], b[3])) {
      if (j <= i || !candidates.has(i * parts.length + j)) continue;
      const found = strataPairOverlap(parts, boxes, planarOf, i, j, indices);
      if (found) problems.push(found);
    }
  }
  return problems;
}
