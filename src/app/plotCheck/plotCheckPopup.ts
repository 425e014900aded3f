import type { PlotCheckRecord } from '../../core/plotCheck/plotCheckTypes';
import { EXCLUSION_KIND_LABELS } from '../../core/site/exclusionKindNotes';
import { EXCLUSION_KINDS } from '../../core/model/types';
import { el } from '../dom';
import { stratumLabel } from '../../core/field/stratumLabel';

function row(term: string, value: string): [HTMLElement, HTMLElement] {
  return [el('dt', null, term), el('dd', null, value)];
}

/**
 * The popup of a checked plot, built from DOM nodes (names from files stay text): whether it
 * passes, each problem as a sentence, its stratum, where it is in the file, the nearest exclusion
 * of each kind, the nearest other plot and the route from the nearest access point.
 */
export function plotCheckPopupContent(r: PlotCheckRecord): HTMLElement {
  const dl = el('dl', 'popup-facts');
  const stratum = r.stratum ? stratumLabel(r.stratum.name, r.stratum.code) : r.holeIn ? `none: in a hole in ${r.holeIn.name}` : 'none';
  const pairs = [row('Stratum', stratum), row('In the file', r.where), row('Lat, lon', `${r.lat.toFixed(6)}, ${r.lon.toFixed(6)}`)];
  for (const k of EXCLUSION_KINDS) {
    const n = r.nearestByKind[k];
    if (n) pairs.push(row(`Nearest ${EXCLUSION_KIND_LABELS[k].toLowerCase()}`, `${n.distanceM.toFixed(1)} m (${n.name})`));
  }
  if (r.nearestPlot) pairs.push(row('Nearest plot', `${r.nearestPlot.id}, ${r.nearestPlot.distanceM.toFixed(1)} m`));
  if (r.access) pairs.push(row('From access', `${r.access.accessPointName}: ${r.access.distanceM.toFixed(0)} m at ${r.access.bearingTrueDeg.toFixed(1)}° true, ${r.access.bearingMagDeg.toFixed(1)}° magnetic`));
  for (const p of pairs) dl.append(...p);
  const box = el('div', `plot-popup check-popup ${r.ok ? 'check-pass' : 'check-fail'}`, el('h3', null, `${r.id} ${r.ok ? '— passes' : '— fails the check'}`));
  box.dataset.check = r.ok ? 'pass' : 'fail';
  if (r.problems.length) box.append(el('ul', 'check-problems', ...r.problems.map((p) => el('li', null, p.text))));
  box.append(dl);
  return box;
}
