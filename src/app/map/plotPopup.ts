import type { PlotProperties } from '../../core/model/designTypes';
import { type PlotFieldState, plotFieldStateOf, plotFieldStateText } from '../../core/field/plotFieldState';
import { el } from '../dom';

function row(term: string, value: string): [HTMLElement, HTMLElement] {
  return [el('dt', null, term), el('dd', null, value)];
}

/**
 * The content of a plot's popup, built from DOM nodes: its field state (what the crew is to do,
 * with a rejection's reason and replacement), stratum, position in three systems and nearest
 * exclusion. Rebuild it whenever the plot's field state changes (see MapView).
 */
export function plotPopupContent(p: PlotProperties, stratumLabel: string, state: PlotFieldState = plotFieldStateOf(p, null)): HTMLElement {
  const text = plotFieldStateText(p, state);
  const near = p.nearest_exclusion_m === null ? 'none mapped' : `${p.nearest_exclusion_m.toFixed(0)} m (${p.nearest_exclusion_kind ?? 'exclusion'})`;
  const dl = el('dl', 'popup-facts');
  for (const pair of [
    row('Stratum', stratumLabel),
    row('Status', text.note),
    row('Lat, lon', `${p.lat.toFixed(6)}, ${p.lon.toFixed(6)}`),
    row('UTM', `${p.utm_zone} ${p.easting.toFixed(1)} E ${p.northing.toFixed(1)} N`),
    row('MGRS', p.mgrs),
    row('Nearest exclusion', near),
  ]) dl.append(...pair);
  const box = el('div', `plot-popup state-${state.key}`, el('h3', null, state.key === 'rejected' ? `${p.plot_id} (rejected)` : p.plot_id), dl);
  box.dataset.state = state.key;
  if (p.notes) box.append(el('p', 'popup-notes', p.notes));
  return box;
}
