import { polygonsDifference } from '../geometry/polygonClip';
import { areaGeometryPlanar, type PolygonsLonLat, planarPieces } from '../geometry/areaGeometryPlanar';
import { problemMake } from '../common/problemMake';
import type { AreaGeometry, Problem, StratumPart } from '../model/types';

/** Gaps smaller than this, m², are taken as digitising slivers and not reported (common practice, no source). */
export const MIN_GAP_M2 = 1;

/**
 * Parts of the site boundary that no stratum covers, as warnings (one per gap, largest first,
 * with its ellipsoidal area in m² and a position inside it): the design's estimates will not
 * cover them. Difference by polyclip-ts in plane lon/lat, so edges shared with the boundary stay
 * shared; areas on the ellipsoid.
 */
export function strataGaps(boundary: AreaGeometry, parts: readonly StratumPart[]): Problem[] {
  const outline = areaGeometryPlanar(boundary);
  if (outline.length === 0) return [];
  const strata = parts.map((p) => areaGeometryPlanar(p.geometry));
  const gaps = (strata.length === 0 ? outline : polygonsDifference(outline, ...strata)) as PolygonsLonLat;
  return planarPieces(gaps)
    .filter((g) => g.areaM2 >= MIN_GAP_M2)
    .map((g) =>
      problemMake('warning', 'boundary-gap', { featureIndex: 0, layer: 'boundary', lonLat: g.lonLat },
        `gap of ${g.areaM2.toFixed(2)} m² inside the site boundary that no stratum covers`, g.areaM2),
    );
}
