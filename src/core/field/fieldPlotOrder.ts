import type { PlotProperties } from '../model/designTypes';
import type { AccessPoint } from '../model/types';
import { plotIsActive } from './plotFieldState';
import { nearestAccess } from './plotNavigation';
import { walkingOrder } from './walkingOrder';

/**
 * Beyond this many plots to visit the field view lists them by stratum and rank instead of
 * touring them: the tour needs n² geodesic distances (about 2 s for 1,000 plots on a phone-class core).
 */
export const FIELD_TOUR_MAX_PLOTS = 400;

/** The plots to visit in the order to walk them, and how that order was made. */
export interface FieldPlotOrder {
  ids: string[];
  /** "from North car park", "from plot HEA-01", or "by stratum and rank". */
  how: string;
}

/**
 * The active plots (primaries not rejected, promoted reserves) in walking order: the tour of
 * walkingOrder (nearest neighbour, then 2-opt) from the access point nearest the first plot, or
 * from the first plot when the site has none. Rejected plots and waiting reserves are left out,
 * so a rejection re-routes the crew through the reserve that replaces it.
 */
export function fieldPlotOrder(plots: readonly PlotProperties[], access: readonly AccessPoint[]): FieldPlotOrder {
  const active = plots.filter(plotIsActive);
  if (active.length === 0) return { ids: [], how: 'no plots to visit' };
  if (active.length > FIELD_TOUR_MAX_PLOTS) {
    const ids = [...active]
      .sort((a, b) => a.stratum.localeCompare(b.stratum) || a.rank - b.rank || a.plot_id.localeCompare(b.plot_id))
      .map((p) => p.plot_id);
    return { ids, how: `by stratum and rank (over ${FIELD_TOUR_MAX_PLOTS} plots: no walking tour)` };
  }
  const first = active[0];
  const from = access.length ? nearestAccess(first, access) : null;
  const start = from ? { id: from.id, lon: from.lon, lat: from.lat } : { id: '', lon: first.lon, lat: first.lat };
  const stops = active.map((p) => ({ id: p.plot_id, lon: p.lon, lat: p.lat }));
  const tour = walkingOrder(start, stops, { returnToStart: false });
  return { ids: tour.order, how: from ? `from ${from.name}` : `from plot ${first.plot_id}` };
}

/** The next plot to walk to: the first of the order not yet visited, or null when all are done. */
export function fieldNextPlot(order: FieldPlotOrder, plots: readonly PlotProperties[]): string | null {
  const visited = new Set(plots.filter((p) => p.visited_at).map((p) => p.plot_id));
  return order.ids.find((id) => !visited.has(id)) ?? null;
}
