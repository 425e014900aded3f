import type { PlotCollection, PlotProperties } from '../model/designTypes';
import { plotFieldStates, plotFieldStateText } from './plotFieldState';

/** Properties worked out from the field state on every write; readers drop them (see parsePlotFile). */
export const PLOT_DERIVED_FIELDS = ['field_state', 'field_note'] as const;

/**
 * The collection with each plot's field state spelled out for the files a crew carries:
 * `field_state` (primary, reserve, promoted, rejected: the symbol key) and `field_note` (what to
 * do, with a rejection's reason, time and replacement), placed right after `rank`. Earlier copies
 * of these fields are replaced, so they always follow the stored field state. Pure.
 */
export function plotCollectionForField(collection: PlotCollection): PlotCollection {
  const plots = collection.features.map((f) => f.properties);
  const states = plotFieldStates(plots);
  const features = collection.features.map((f) => {
    const p = f.properties;
    const s = states.get(p.plot_id)!;
    const { field_state: _state, field_note: _note, ...rest } = p;
    const entries = Object.entries(rest);
    const at = entries.findIndex(([k]) => k === 'rank') + 1 || entries.length;
    entries.splice(at, 0, ['field_state', s.key], ['field_note', plotFieldStateText(p, s).note]);
    return { ...f, properties: Object.fromEntries(entries) as unknown as PlotProperties };
  });
  return { ...collection, features };
}
