import type { PlotCollection, PlotProperties } from '../core/designTypes';
import { featuresToGpx } from './featuresToGpx';

/**
 * GPX 1.1 waypoints of a plot list for GPS units: name = plot id, desc = stratum, type = role
 * (primary/reserve), cmt = role and rank, then the plot's notes (what a crew reads at the
 * plot). Reserves follow primaries in the file order given. Returns UTF-8 XML text.
 */
export function plotsToGpx(collection: PlotCollection, options: { name?: string; version?: string } = {}): string {
  return featuresToGpx(collection, {
    name: options.name ?? 'stratplot plots',
    creator: `stratplot ${options.version ?? collection.design?.software?.version ?? ''}`.trim(),
    labels: (f) => {
      const p = f.properties as PlotProperties;
      const role = `${p.role} ${p.rank}`;
      return { name: p.plot_id, desc: p.stratum, type: p.role, cmt: p.notes ? `${role}: ${p.notes}` : role };
    },
  });
}
