import type { PlotCollection } from '../core/designTypes';
import { featuresToCsv } from './featuresToCsv';

/** Fixed leading columns of a plot CSV, in order; other plot properties follow. */
export const PLOT_CSV_COLUMNS = [
  'plot_id', 'stratum', 'role', 'rank', 'lat', 'lon', 'utm_zone', 'easting', 'northing', 'mgrs',
  'nearest_exclusion_m', 'nearest_exclusion_kind', 'notes',
] as const;

/**
 * The plot list as CSV for spreadsheets and phones: the fixed columns {@link PLOT_CSV_COLUMNS},
 * then any further properties the plots carry (navigation such as distance and bearing,
 * status...) in first-seen order. Numbers are written as numbers; text cells that would start a
 * spreadsheet formula are neutralised with an apostrophe. UTF-8, optional byte-order mark.
 */
export function plotsToCsv(collection: PlotCollection, options: { bom?: boolean } = {}): string {
  return featuresToCsv(collection, { bom: options.bom, leading: [...PLOT_CSV_COLUMNS] });
}
