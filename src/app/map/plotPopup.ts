import type { PlotProperties } from '../../core/designTypes';
import { el } from '../dom';

function row(term: string, value: string): [HTMLElement, HTMLElement] {
  return [el('dt', null, term), el('dd', null, value)];
}

/** The content of a plot's popup, built from DOM nodes: position in three systems, stratum, nearest exclusion. */
export function plotPopupContent(p: PlotProperties, stratumLabel: string): HTMLElement {
  const status = p.status === 'rejected' ? `rejected: ${p.reject_reason ?? ''}` : p.status === 'promoted' ? `promoted reserve, replaces ${p.replaces ?? '?'}` : p.role === 'reserve' ? `reserve, rank ${p.rank}` : `primary, rank ${p.rank}`;
  const near = p.nearest_exclusion_m === null ? 'none mapped' : `${p.nearest_exclusion_m.toFixed(0)} m (${p.nearest_exclusion_kind ?? 'exclusion'})`;
  const dl = el('dl', 'popup-facts');
  for (const pair of [
    row('Stratum', stratumLabel),
    row('Status', status),
    row('Lat, lon', `${p.lat.toFixed(6)}, ${p.lon.toFixed(6)}`),
    row('UTM', `${p.utm_zone} ${p.easting.toFixed(1)} E ${p.northing.toFixed(1)} N`),
    row('MGRS', p.mgrs),
    row('Nearest exclusion', near),
  ]) dl.append(...pair);
  const box = el('div', 'plot-popup', el('h3', null, p.plot_id), dl);
  if (p.notes) box.append(el('p', 'popup-notes', p.notes));
  return box;
}
