import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { plotsCheck } from '../../core/plotCheck/plotsCheck';
import type { Site } from '../../core/model/types';
import { plotCheckReportCsv } from './plotCheckReportCsv';

// An invented 1 km square stratum; no real place.
const site: Site = {
  name: 'Invented square',
  strata: [{ key: 'S', label: 'Saltbush', code: 'SAL', colour: '#336699' }],
  parts: [{ id: 's', stratum: 'S', geometry: { type: 'Polygon', coordinates: [[[140, -30], [140.01, -30], [140.01, -29.99], [140, -29.99], [140, -30]]] } }],
  exclusions: [],
  access: [],
  boundary: null,
};

describe('plotCheckReportCsv', () => {
  it('writes one row per plot, failing first, with the caution and the files on every row, and neutralises formulas in ids', () => {
    const report = plotsCheck(site, [
      { id: 'inside', where: 'row 1', lon: 140.005, lat: -29.995 },
      { id: '=HYPERLINK("x")', where: 'row 2', lon: 141, lat: -29.995 },
    ], { spacingM: 0, footprint: { shape: 'point' }, edgeBufferM: 0, surveyDate: new Date('2027-01-01') });
    const text = plotCheckReportCsv(report, { siteName: 'Invented square', files: ['plots: a.csv', 'strata: s.geojson'], software: 'stratplot 0.1.0', generatedAt: new Date('2027-01-02T00:00:00Z') }, { bom: true });
    expect(text.startsWith('\uFEFFplot_id,where,ok,problems')).toBe(true);
    // papaparse 5 reads it back (RFC 4180).
    const rows = Papa.parse<Record<string, string>>(text.slice(1), { header: true, skipEmptyLines: true }).data;
    expect(rows.map((r) => [r.plot_id, r.ok])).toEqual([["'=HYPERLINK(\"x\")", 'FAIL'], ['inside', 'pass']]);
    expect(rows[0].problems).toBe('Plot =HYPERLINK("x") lies outside every mapped stratum.');
    expect(rows.every((r) => r.caution === FIELD_CAUTION && r.checked_on === '2027-01-02' && r.files_checked === 'plots: a.csv; strata: s.geojson')).toBe(true);
    expect(rows[1].check_settings).toMatch(/^spacing 0 m, footprint point, edge buffer 0 m/);
  });
});
