import { footprintFormat } from '../design/footprintParse';
import type { PlotsCheckReport } from './plotCheckTypes';

/**
 * The settings a check ran with, in one line for reports and tables: spacing, footprint (as the
 * CLI takes it), edge buffer, the rounding allowance, the survey date and the magnetic model.
 */
export function plotCheckSettingsText(r: Pick<PlotsCheckReport, 'settings' | 'magnetic' | 'crs'>): string {
  const s = r.settings;
  const magnetic = r.magnetic ? `, magnetic bearings by ${r.magnetic.model} for ${r.magnetic.decimalYear.toFixed(2)}` : '';
  return (
    `spacing ${s.spacingM} m, footprint ${footprintFormat(s.footprint)}, edge buffer ${s.edgeBufferM} m, limits met to within ${s.slackM} m; ` +
    `survey date ${s.surveyDate}${magnetic}; UTM ${r.crs.utm_zone} (EPSG:${r.crs.epsg})`
  );
}

/** "9 plots checked: 1 passes, 8 fail." */
export function plotCheckCountsText(r: Pick<PlotsCheckReport, 'counts'>): string {
  const { plots, passing, failing } = r.counts;
  return `${plots} plot${plots === 1 ? '' : 's'} checked: ${passing} pass${passing === 1 ? 'es' : ''}, ${failing} fail${failing === 1 ? 's' : ''}.`;
}
