import { InputError } from '../common/InputError';
import { MAX_NOTE_LENGTH } from '../common/inputLimits';
import type { PlotCollection, PlotProperties } from '../model/designTypes';
import type { PositionFix } from '../model/fieldTypes';
import { plotIsActive } from './plotFieldState';

function plotIndex(collection: PlotCollection, plotId: string): number {
  const i = collection.features.findIndex((f) => f.properties.plot_id === plotId);
  if (i < 0) throw new InputError(`no plot "${plotId}" in this design`);
  return i;
}

function withPlot(collection: PlotCollection, i: number, properties: PlotProperties): PlotCollection {
  const features = collection.features.slice();
  features[i] = { ...features[i], properties };
  return { ...collection, features };
}

/**
 * Records that a crew reached plot `plotId`: the time, the crew's name, and the device's position
 * with its accuracy when it had one (a plot found by tape and compass indoors of cover has none).
 * Only plots to visit can be visited: a waiting reserve must be promoted first, a rejected plot restored.
 * Pure: returns a new collection.
 * @throws InputError for an unknown plot, a plot not to visit, or a time that is not a date.
 */
export function plotsVisitRecord(collection: PlotCollection, plotId: string, visit: { atIso: string; by: string; fix: PositionFix | null }): PlotCollection {
  const i = plotIndex(collection, plotId);
  const p = collection.features[i].properties;
  if (!plotIsActive(p)) {
    const why = p.status === 'rejected' ? 'is rejected (restore it first)' : 'is a waiting reserve (it is visited only once it replaces a rejected plot)';
    throw new InputError(`plot ${plotId} ${why}`);
  }
  if (Number.isNaN(new Date(visit.atIso).getTime())) throw new InputError(`the time of the visit to plot ${plotId} is not a date: "${visit.atIso}"`);
  const { visit_lon: _x, visit_lat: _y, visit_accuracy_m: _a, ...rest } = p;
  const at: Partial<PlotProperties> = visit.fix
    ? { visit_lon: visit.fix.lon, visit_lat: visit.fix.lat, visit_accuracy_m: Math.round(visit.fix.accuracyM * 10) / 10 }
    : {};
  return withPlot(collection, i, { ...rest, visited_at: visit.atIso, visited_by: visit.by.trim().slice(0, MAX_NOTE_LENGTH), ...at });
}

/** Takes back a visit recorded by mistake (the measurements typed stay). Pure. */
export function plotsVisitClear(collection: PlotCollection, plotId: string): PlotCollection {
  const i = plotIndex(collection, plotId);
  const { visited_at: _t, visited_by: _b, visit_lon: _x, visit_lat: _y, visit_accuracy_m: _a, ...rest } = collection.features[i].properties;
  return withPlot(collection, i, rest);
}

/**
 * Keeps what the crew typed for a plot: the measurements by variable name (as typed; blank ones
 * dropped) and the free-text note. Values are checked by the form (fieldValueCheck) and again by
 * the results checks when estimated, so nothing typed is refused here. Pure.
 * @throws InputError for an unknown plot or a value or note longer than MAX_NOTE_LENGTH.
 */
export function plotsFieldEntry(collection: PlotCollection, plotId: string, entry: { values: Record<string, string>; note: string }): PlotCollection {
  const i = plotIndex(collection, plotId);
  const values: Record<string, string> = {};
  for (const [name, text] of Object.entries(entry.values)) {
    if (text.length > MAX_NOTE_LENGTH) throw new InputError(`plot ${plotId}, ${name}: the value is longer than ${MAX_NOTE_LENGTH} characters`);
    if (text.trim() !== '') values[name] = text.trim();
  }
  if (entry.note.length > MAX_NOTE_LENGTH) throw new InputError(`plot ${plotId}: the note is longer than ${MAX_NOTE_LENGTH} characters`);
  const { field_values: _v, crew_note: _n, ...rest } = collection.features[i].properties;
  const note = entry.note.trim();
  return withPlot(collection, i, { ...rest, ...(Object.keys(values).length ? { field_values: values } : {}), ...(note ? { crew_note: note } : {}) });
}
