import Papa from 'papaparse';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { PLOT_CHECK_COLUMNS, plotCheckRowFlat } from '../../core/plotCheck/plotCheckRecordOut';
import { plotCheckSettingsText } from '../../core/plotCheck/plotCheckSettingsText';
import type { PlotsCheckReport } from '../../core/plotCheck/plotCheckTypes';
import { plotCheckRecordsBySeverity } from '../../core/plotCheck/plotsCheck';
import { csvCell } from '../common/csvCell';

/** What a check report names besides the plots: the site, the files checked, when. */
export interface PlotCheckReportMeta {
  siteName: string;
  /** Each file checked or checked against, e.g. "plots: contractor.gpx", "strata: site.geojson". */
  files: string[];
  /** Printed as the date of the check (default: now). */
  generatedAt?: Date;
  /** Program and version, e.g. "stratplot 0.1.0". */
  software: string;
}

/** Columns after the plot columns, repeated on every row so a row copied alone keeps them. */
export const PLOT_CHECK_CSV_TRAILING = ['checked_on', 'site', 'files_checked', 'check_settings', 'software', 'caution'] as const;

/**
 * The check as a CSV table for the land manager's records (RFC 4180, UTF-8, optional BOM): one row
 * per plot, most serious first ({@link PLOT_CHECK_COLUMNS}: result, problems as sentences, stratum,
 * distances to each kind of exclusion, to the nearest plot and from the nearest access point with
 * true and magnetic bearings), then on every row the date, site, files checked, settings, software
 * and the safety caution. Header on line 1; text that would start a spreadsheet formula is
 * neutralised (csvCell).
 */
export function plotCheckReportCsv(report: PlotsCheckReport, meta: PlotCheckReportMeta, options: { bom?: boolean } = {}): string {
  const when = (meta.generatedAt ?? new Date()).toISOString().slice(0, 10);
  const tail = [when, meta.siteName, meta.files.join('; '), plotCheckSettingsText(report), meta.software, FIELD_CAUTION];
  const fields = [...PLOT_CHECK_COLUMNS, ...PLOT_CHECK_CSV_TRAILING];
  const data = plotCheckRecordsBySeverity(report.plots).map((r) => {
    const row = plotCheckRowFlat(r);
    return [...PLOT_CHECK_COLUMNS.map((k) => csvCell(row[k])), ...tail.map(csvCell)];
  });
  const text = Papa.unparse({ fields, data }, { newline: '\r\n', escapeFormulae: false, quotes: false });
  return `${options.bom ? '\uFEFF' : ''}${text}\r\n`;
}
