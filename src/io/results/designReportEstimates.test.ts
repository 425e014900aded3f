import { describe, expect, it } from 'vitest';
import { estimateFromResults } from '../../core/results/estimateFromResults';
import { nextSeasonSampleSize } from '../../core/results/nextSeasonSampleSize';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { recaptureEstimate } from '../../core/results/recapture';
import { designReportEstimates } from './designReportEstimates';
import { designReportPdf, reportTablesParse } from '../pdf/designReportPdf';
import { parseResultsCsv } from './parseResultsCsv';
import { exportContext } from '../../core/field/exportContext';

// Invented plot file (not a real site): 10 m square plots.
const plots = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 3, reserves: 0, mappedM2: 50_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 2, reserves: 0, mappedM2: 30_000, usableM2: 30_000 },
]);
const table = parseResultsCsv('invented.csv', 'plot_id,stems\nHEA-01,4\nHEA-02,6\nHEA-03,8\nSAL-01,1\nSAL-02,3\n');
const report = estimateFromResults(plots, table, { value: 'stems', kind: 'count', collapse: false });

describe('designReportEstimates', () => {
  it('lists every stratum and the stratified line in a table the design report accepts', () => {
    const next = nextSeasonSampleSize(
      report.strata.map((s) => ({ stratum: s.stratum, basisM2: s.basis_m2, sd: s.sd })),
      { target: { value: 0.2, relative: true }, observedMean: report.mean, plotAreaM2: 100 },
    );
    // Krebs 1989 Box 2.1 (docs/references.md §4): M 948, n 421, m 167 → Chapman 2382.80.
    const grids = [{ name: 'North grid', estimate: recaptureEstimate({ marked: 948, caught: 421, recaptured: 167 }) }];
    const tables = designReportEstimates(report, next, grids);
    expect(reportTablesParse(tables)).toHaveLength(3);
    // By hand: SE_h = √((1 − f_h) s_h²/n_h), f = 3·100/50 000 and 2·100/30 000: √(0.994·4/3), √(0.99333·2/2).
    expect(tables[0].rows).toEqual([
      ['Coastal heath', 3, '6', '2', '1.151', '0.625'],
      ['Saltmarsh', 2, '2', '1.414', '0.9967', '0.375'],
      ['Stratified (8.00 ha)', 5, '4.5', '', String(Number((report.se as number).toPrecision(4))), '1'],
    ]);
    expect(tables[0].notes?.some((n) => n.startsWith('95 % CI of the mean'))).toBe(true);
    expect(tables[0].notes).toContain(report.population);
    expect(tables[1].rows.map((r) => r[0])).toEqual(['proportional', 'neyman']);
    expect(tables[2].rows[0].slice(0, 3)).toEqual(['North grid', '2390', '2383']);
    const pdf = designReportPdf(exportContext(plots, null, { annotate: false }), { paper: 'a4', estimates: tables, generatedAt: new Date('2026-01-01T00:00:00Z') });
    expect(new TextDecoder().decode(pdf.slice(0, 5))).toBe('%PDF-');
  });

  it('names the collapsed strata in the report and says the variance is conservative', () => {
    const short = parseResultsCsv('invented.csv', 'plot_id,stems\nHEA-01,4\nHEA-02,6\nHEA-03,8\nSAL-01,1\n');
    const collapsed = estimateFromResults(plots, short, { value: 'stems', kind: 'count', collapse: true });
    const [t] = designReportEstimates(collapsed);
    expect(t.rows.map((r) => r[0])).toEqual(['Coastal heath (collapsed)', 'Saltmarsh (collapsed)', 'Stratified (8.00 ha)']);
    // By hand (Cochran 1977 §5A.12, pair): W = 5/8, 3/8; means 6 and 1: ȳ_st = 0.625·6 + 0.375·1 = 4.125 (kept),
    // v = 4 (25/64)(9/64)(6 − 1)²/1 = 5.4931641, SE 2.344.
    expect(t.rows[2][2]).toBe('4.125');
    expect(t.rows[2][4]).toBe('2.344');
    expect(t.notes?.find((n) => n.startsWith('Collapsed for the variance: Coastal heath + Saltmarsh'))).toMatch(/conservative/);
  });
});
