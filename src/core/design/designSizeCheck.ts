import type { DesignSettings } from '../model/designTypes';
import { limitExceeded, limitNumber, MAX_DESIGN_PLOTS, MAX_POLYGON_VERTICES } from '../common/inputLimits';
import { InputError } from '../common/InputError';
import type { PlacementConstraints } from './place/placementConstraints';
import type { Site, StratumPart } from '../model/types';

/**
 * Refuses, before placement triangulates them (generator versions 1 and 2), stratum polygons of more than
 * {@link MAX_POLYGON_VERTICES} vertices (shell and holes together).
 * Throws InputError naming the stratum feature, its vertex count and the limit.
 */
export function placementPolygonsCheck(site: Site): void {
  const over = placementPolygonOver(site.parts);
  if (!over) return;
  const { part, polygon, polygons, vertices } = over;
  throw limitExceeded(
    `stratum "${site.parts[part].stratum}", feature ${part}${polygons > 1 ? `, polygon ${polygon}` : ''}`,
    `${limitNumber(vertices)} vertices is more than placement triangulates in good time (its area is measured all the same); simplify the outline`,
    `${limitNumber(MAX_POLYGON_VERTICES)} vertices per polygon in a design`,
  );
}

/** The first stratum polygon of more than {@link MAX_POLYGON_VERTICES} vertices: its part, its index in the part, the part's polygon count and its vertices; null when there is none. */
export function placementPolygonOver(parts: readonly StratumPart[]): { part: number; polygon: number; polygons: number; vertices: number } | null {
  for (let i = 0; i < parts.length; i++) {
    const g = parts[i].geometry;
    const polys = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
    for (let k = 0; k < polys.length; k++) {
      const vertices = polys[k].reduce((a, r) => a + r.length, 0);
      if (vertices > MAX_POLYGON_VERTICES) return { part: i, polygon: k, polygons: polys.length, vertices };
    }
  }
  return null;
}

/**
 * Refuses, before any placement, a design larger than {@link MAX_DESIGN_PLOTS}: the plots asked
 * for, the reserves of every stratum and the minimum per stratum, each against the limit.
 * @param strataCount strata that can receive plots
 * Throws InputError naming the setting, what it comes to and the limit.
 */
export function designSizeCheck(s: DesignSettings, strataCount: number): void {
  // Made only for a message: the first grouped number of a process loads the locale's data (tens of ms).
  const limit = () => `${limitNumber(MAX_DESIGN_PLOTS)} plots in one design`;
  if (!s.targetHalfwidth && (s.method === 'random' || s.method === 'balanced') && s.plots > MAX_DESIGN_PLOTS) {
    throw limitExceeded('number of plots', `${limitNumber(s.plots)} plots asked for`, limit());
  }
  if (s.minPerStratum * strataCount > MAX_DESIGN_PLOTS) {
    throw limitExceeded('minimum plots per stratum', `${limitNumber(s.minPerStratum)} in each of ${strataCount} strata make ${limitNumber(s.minPerStratum * strataCount)} plots`, limit());
  }
  const reserves = s.reservePerStratum * strataCount;
  const primaries = s.method === 'random' || s.method === 'balanced' ? (s.targetHalfwidth ? 0 : s.plots) : 0;
  if (primaries + reserves > MAX_DESIGN_PLOTS) {
    throw limitExceeded('reserve plots per stratum', `${limitNumber(s.reservePerStratum)} reserves in each of ${strataCount} strata${primaries ? ` and ${limitNumber(primaries)} primaries` : ''} make ${limitNumber(primaries + reserves)} plots`, limit());
  }
}

/**
 * Most plots that can lie in stratum `i` with centres at least `spacingM` apart: the discs of
 * radius r = spacing/2 about the plots do not overlap and lie within the stratum widened by r,
 * whose area is at most A + 2rP + πr²V (the stratum, a strip of width 2r along each of its edges
 * of total length P and a disc at each of its V vertices), so N ≤ (A + 2rP + πr²V) / πr². All in
 * grid units. Infinity when the spacing is 0. Source: the disc-packing area bound (common
 * practice, no source); it is an upper bound, far above what random placement reaches.
 */
export function stratumCapacityBound(c: PlacementConstraints, i: number, spacingM: number): number {
  if (!(spacingM > 0)) return Number.POSITIVE_INFINITY;
  const st = c.strata[i];
  const areaGrid = st.areaGrid;
  const e = st.edges;
  let perimeter = 0;
  for (let k = 0; k + 3 < e.length; k += 4) perimeter += Math.hypot(e[k + 2] - e[k], e[k + 3] - e[k + 1]);
  const vertices = e.length / 4;
  // Spacing in grid units is ground metres × the site's largest scale factor, as placement uses it.
  const r = (spacingM * c.scale) / 2;
  return Math.floor((areaGrid + 2 * r * perimeter + Math.PI * r * r * vertices) / (Math.PI * r * r));
}

/**
 * Refuses a random or balanced design whose plots (primaries and reserves) cannot all fit in the
 * strata at the minimum spacing whatever the placement, by {@link stratumCapacityBound}.
 * @param wanted primaries per stratum; @param reservePerStratum reserves asked in each stratum
 * Throws InputError naming the spacing, the plots asked for and the most that can fit.
 */
export function designCapacityCheck(c: PlacementConstraints, spacingM: number, wanted: readonly number[], reservePerStratum: number): void {
  if (!(spacingM > 0)) return;
  let asked = 0;
  let room = 0;
  for (let i = 0; i < c.strata.length; i++) {
    asked += wanted[i] + reservePerStratum;
    room += stratumCapacityBound(c, i, spacingM);
  }
  if (asked > room) {
    throw new InputError(
      `${limitNumber(asked)} plots (primaries and reserves) cannot fit at ${spacingM} m spacing: the strata have room for at most ${limitNumber(room)} plots that far apart; ask for fewer plots or a smaller spacing`,
    );
  }
}
