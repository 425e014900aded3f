import type { Feature } from 'geojson';
import type { PlotCollection, PlotProperties } from '../../core/model/designTypes';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { plotFieldStateOf, plotFieldStateText, plotRejectionLines } from '../../core/field/plotFieldState';
import type { GpxLabels } from '../formats/gpx/featuresToGpx';
import { stratumLabel } from '../../core/field/stratumLabel';

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
  const stratum = `Stratum: ${stratumLabel(p.stratum, p.stratum_code)}.`;
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
