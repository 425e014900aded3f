import type { Feature } from 'geojson';
import type { PlotCollection, PlotProperties } from '../../../core/model/designTypes';
import { FIELD_CAUTION } from '../../../core/field/fieldCaution';
import { plotCollectionForField } from '../../../core/field/plotCollectionForField';
import { plotFieldStateOf, plotFieldStateText, plotRejectionLines } from '../../../core/field/plotFieldState';
import { featuresToGpx, type GpxLabels } from './featuresToGpx';

/**
 * What a plot's waypoint shows on a GPS unit: name = plot id, type = field state (primary,
 * reserve, promoted), desc = what to do and the stratum's name and code, cmt = the short state
 * and the plot's notes (what a crew reads at the plot). The field state comes from `field_state`
 * and `field_note` when the plot carries them (plotCollectionForField), else from its status.
 */
export function plotGpxLabels(p: PlotProperties): GpxLabels {
  const state = plotFieldStateOf(p, null);
  const key = p.field_state ?? state.key;
  const note = p.field_note ?? plotFieldStateText(p, state).note;
  const short = key === 'promoted' && p.replaces ? `promoted, replaces ${p.replaces}` : key === 'rejected' ? 'REJECTED' : key;
  const stratum = `Stratum: ${p.stratum}${p.stratum_code ? ` (${p.stratum_code})` : ''}.`;
  return { name: p.plot_id, desc: `${note} ${stratum}`, type: key, cmt: p.notes ? `${short} ${p.rank}: ${p.notes}` : `${short} ${p.rank}` };
}

/** True for features that a navigation file leaves out: rejected plots (listed in its description instead). */
export function isRejectedPlot(f: Feature): boolean {
  return (f.properties as Partial<PlotProperties> | null)?.status === 'rejected' && typeof f.properties?.plot_id === 'string';
}

/** The description of a navigation file: the caution, then the rejected plots it leaves out and why. */
export function navigationDescription(collection: Pick<PlotCollection, 'features'>): string {
  const lines = plotRejectionLines(collection);
  return lines.length ? `${FIELD_CAUTION} Rejected plots, left out of this file: ${lines.join(' ')}` : FIELD_CAUTION;
}

/**
 * GPX 1.1 waypoints of a plot list for GPS units, labelled by {@link plotGpxLabels}. Rejected
 * plots are left out (a GPS must not lead anyone there); the file's description carries the
 * caution and lists them with their reasons. Reserves follow primaries in the file order given.
 * Returns UTF-8 XML text.
 */
export function plotsToGpx(collection: PlotCollection, options: { name?: string; version?: string } = {}): string {
  const field = plotCollectionForField(collection);
  return featuresToGpx(
    { type: 'FeatureCollection', features: field.features.filter((f) => !isRejectedPlot(f)) },
    {
      name: options.name ?? 'stratplot plots',
      description: navigationDescription(collection),
      creator: `stratplot ${options.version ?? collection.design?.software?.version ?? ''}`.trim(),
      labels: (f) => plotGpxLabels(f.properties as PlotProperties),
    },
  );
}
