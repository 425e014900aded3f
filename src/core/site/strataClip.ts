import type { MultiPolygon, Polygon } from 'geojson';
import { polygonsDifference, polygonsIntersection, type ClipPolygons } from '../geometry/polygonClip';
import type { AreaGeometry, StratumPart } from '../model/types';

/** MultiPolygon coordinates back to the smallest GeoJSON geometry, or null when nothing is left. */
function geometryOf(polys: ClipPolygons): AreaGeometry | null {
  if (polys.length === 0) return null;
  if (polys.length === 1) return { type: 'Polygon', coordinates: polys[0] } satisfies Polygon;
  return { type: 'MultiPolygon', coordinates: polys } satisfies MultiPolygon;
}

/**
 * What is left of a polygon drawn next to mapped strata once every stratum feature is taken out
 * of it (polygon difference in plane lon/lat), so neighbours share edges instead of overlapping;
 * null when it lies wholly inside them.
 */
export function polygonBesideStrata(polygon: Polygon, parts: readonly StratumPart[]): AreaGeometry | null {
  if (parts.length === 0) return polygon;
  return geometryOf(polygonsDifference(polygon.coordinates, ...parts.map((p) => p.geometry.coordinates)));
}

/**
 * Stratum features with a hole cut: the polygon is subtracted from every feature it overlaps, and
 * features it swallows whole are dropped. `changed` counts the features it touched.
 */
export function strataWithHoleCut(parts: readonly StratumPart[], polygon: Polygon): { parts: StratumPart[]; changed: number } {
  const out: StratumPart[] = [];
  let changed = 0;
  for (const part of parts) {
    if (polygonsIntersection(part.geometry.coordinates, polygon.coordinates).length === 0) {
      out.push(part);
      continue;
    }
    changed++;
    const rest = geometryOf(polygonsDifference(part.geometry.coordinates, polygon.coordinates));
    if (rest) out.push({ ...part, geometry: rest });
  }
  return { parts: out, changed };
}
