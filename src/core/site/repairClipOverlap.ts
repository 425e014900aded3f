import Flatbush from 'flatbush';
import { polygonsDifference, polygonsIntersection } from '../geometry/polygonClip';
import { areaGeometryPlanar, type PolygonsLonLat } from '../geometry/areaGeometryPlanar';
import { InputError } from '../common/InputError';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { MIN_OVERLAP_M2 } from './strataOverlaps';
import type { StratumPart } from '../model/types';

/** Which stratum keeps ground that two strata claim. */
export type OverlapRule = { keep: 'first' } | { keep: 'stratum'; stratum: string };

function box(part: StratumPart): [number, number, number, number] {
  const b: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
  for (const poly of polys) {
    for (const [x, y] of poly[0] ?? []) {
      b[0] = Math.min(b[0], x);
      b[1] = Math.min(b[1], y);
      b[2] = Math.max(b[2], x);
      b[3] = Math.max(b[3], y);
    }
  }
  return b;
}

/**
 * Gives ground claimed by features of two different strata to one of them, by a stated rule:
 * `{ keep: 'first' }` — the feature listed first keeps it; `{ keep: 'stratum', stratum }` — the
 * named stratum keeps it (between two others, the first listed). The losing feature is clipped by
 * polyclip-ts in plane lon/lat, so its untouched vertices and the edges it shares with the
 * winner stay exactly as they were; slivers under MIN_OVERLAP_M2 left by the clipper are dropped.
 * Features of the same stratum are left alone. Pure: returns new parts (a part clipped to nothing
 * is dropped and named in `dropped`) and the ellipsoidal area moved, m².
 * Throws InputError when the named stratum has no features.
 */
export function repairClipOverlap(
  parts: readonly StratumPart[],
  rule: OverlapRule,
): { parts: StratumPart[]; clippedM2: number; dropped: string[] } {
  if (rule.keep === 'stratum' && !parts.some((p) => p.stratum === rule.stratum)) {
    throw new InputError(`cannot give overlaps to stratum "${rule.stratum}": it has no features`);
  }
  if (parts.length < 2) return { parts: [...parts], clippedM2: 0, dropped: [] };
  const boxes = parts.map(box);
  const index = new Flatbush(parts.length);
  for (const b of boxes) index.add(b[0], b[1], b[2], b[3]);
  index.finish();
  const xy: PolygonsLonLat[] = parts.map((p) => areaGeometryPlanar(p.geometry));
  const changed = new Set<number>();
  // i is listed before j, so i keeps the ground unless the rule names j's stratum instead.
  const wins = (i: number, j: number) => !(rule.keep === 'stratum' && parts[j].stratum === rule.stratum && parts[i].stratum !== rule.stratum);
  let clippedM2 = 0;
  for (let i = 0; i < parts.length; i++) {
    for (const j of index.search(...boxes[i])) {
      if (j <= i || parts[i].stratum === parts[j].stratum) continue;
      if (xy[i].length === 0 || xy[j].length === 0) continue;
      const common = polygonsIntersection(xy[i], xy[j]) as PolygonsLonLat;
      if (common.length === 0) continue;
      const areaM2 = polygonAreaM2({ type: 'MultiPolygon', coordinates: common });
      if (areaM2 < MIN_OVERLAP_M2) continue;
      const [keep, lose] = wins(i, j) ? [i, j] : [j, i];
      xy[lose] = (polygonsDifference(xy[lose], xy[keep]) as PolygonsLonLat).filter(
        (poly) => polygonAreaM2({ type: 'Polygon', coordinates: poly }) >= MIN_OVERLAP_M2,
      );
      changed.add(lose);
      clippedM2 += areaM2;
    }
  }
  const out: StratumPart[] = [];
  const dropped: string[] = [];
  parts.forEach((p, i) => {
    if (!changed.has(i)) {
      out.push(p);
    } else if (xy[i].length === 0) {
      dropped.push(p.id);
    } else {
      const polys = xy[i];
      out.push({ ...p, geometry: polys.length === 1 ? { type: 'Polygon', coordinates: polys[0] } : { type: 'MultiPolygon', coordinates: polys } });
    }
  });
  return { parts: out, clippedM2, dropped };
}
