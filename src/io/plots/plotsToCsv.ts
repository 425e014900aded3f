import type { PlotCollection } from '../../core/model/designTypes';
import { featuresToCsv } from '../formats/csv/featuresToCsv';

/** Fixed leading columns of a plot CSV, in order; other plot properties follow. */
export const PLOT_CSV_COLUMNS = [
  'plot_id', 'stratum', 'stratum_code', 'role', 'rank', 'field_state', 'field_note', 'lat', 'lon', 'utm_zone', 'easting', 'northing', 'mgrs',
  'nearest_exclusion_m', 'nearest_exclusion_kind', 'notes',
] as const;

/** Name of the last column, which repeats the safety caution on every row. */
export const CSV_CAUTION_COLUMN = 'caution';

/**
 * The plot list as CSV for spreadsheets and phones: the fixed columns {@link PLOT_CSV_COLUMNS},
 * then any further properties the plots carry (navigation such as distance and bearing,
 * status...) in first-seen order, and with `caution` a last column holding the safety caution on
 * every row. A column rather than a leading row, so the header stays on line 1 where
 * spreadsheets, GIS and phone apps look for it, and a row filtered or copied on its own still
 * carries it. Numbers are written as numbers; text cells that
 * would start a spreadsheet formula are neutralised with an apostrophe. UTF-8, optional
 * byte-order mark.
 */
export function plotsToCsv(collection: PlotCollection, options: { bom?: boolean; caution?: string } = {}): string {
  const leading = [...PLOT_CSV_COLUMNS];
  if (!options.caution) return featuresToCsv(collection, { bom: options.bom, leading });
  const features = collection.features.map((f) => ({ ...f, properties: { ...f.properties, [CSV_CAUTION_COLUMN]: options.caution } }));
  return featuresToCsv({ ...collection, features }, { bom: options.bom, leading, trailing: [CSV_CAUTION_COLUMN] });
}
