import { describe, expect, it } from 'vitest';
import { designRun } from '../../core/design/designRun';
import { designSettingsDefault } from '../../core/design/designSettingsDefault';
import { plotsRejectAndPromote } from '../../core/field/plotsRejectAndPromote';
import { plotsFieldEntry, plotsVisitRecord } from '../../core/field/plotVisit';
import { siteInventedRandom } from '../../core/fixtures/siteInventedRandom';
import type { PlotCollection } from '../../core/model/designTypes';
import { estimateFromResults } from '../../core/results/estimateFromResults';
import { resultsCheck } from '../../core/results/resultsCheck';
import { parseResultsCsv } from './parseResultsCsv';
import { fieldResultsToCsv } from './fieldResultsToCsv';

const site = siteInventedRandom(21, 2, 1);
const design = designRun(site, designSettingsDefault({ plots: 8, reservePerStratum: 2, seed: 7 }));
const variables = [
  { name: 'cover', kind: 'percent' as const },
  { name: 'remarks', kind: 'text' as const },
];

/** The design walked: one primary rejected (its first reserve promoted), every plot to visit recorded with invented values. */
function walked(): { plots: PlotCollection; values: Map<string, number>; rejected: string; reserve: string } {
  const rejected = design.features.find((f) => f.properties.role === 'primary')!.properties.plot_id;
  const out = plotsRejectAndPromote(design, rejected, 'Under water', '2026-12-03T00:10:00Z');
  let plots = out.collection;
  const values = new Map<string, number>();
  let n = 0;
  plots.features.forEach((f, k) => {
    const p = f.properties;
    if (p.plot_id === rejected || (p.role === 'reserve' && p.status !== 'promoted')) return;
    const v = 10 + ((k * 13) % 37) + 0.5;
    values.set(p.plot_id, v);
    n += 1;
    plots = plotsVisitRecord(plots, p.plot_id, { atIso: '2026-12-03T01:00:00Z', by: 'Crew A (invented)', fix: { lon: p.lon, lat: p.lat, accuracyM: 3, atIso: '2026-12-03T01:00:00Z' } });
    plots = plotsFieldEntry(plots, p.plot_id, { values: { cover: String(v), remarks: n === 1 ? '=HYPERLINK("x")' : 'ok, dry' }, note: n === 2 ? 'gate "locked"' : '' });
  });
  return { plots, values, rejected, reserve: out.rejection.replacement! };
}

describe('fieldResultsToCsv', () => {
  it('gives the Results step a table it reads without a problem, with the rejection and its reserve', () => {
    const { plots, rejected, reserve } = walked();
    const table = parseResultsCsv('field.csv', fieldResultsToCsv(plots, variables));
    expect(table.columns.slice(0, 6)).toEqual(['plot_id', 'stratum', 'role', 'status', 'replaced_by', 'reject_reason']);
    expect(table.columns).toContain('cover');
    const row = (id: string) => table.rows.find((r) => r.cells.plot_id === id)!.cells;
    expect(row(rejected)).toMatchObject({ status: 'rejected', replaced_by: reserve, reject_reason: 'Under water', cover: '' });
    expect(row(reserve)).toMatchObject({ status: 'done', role: 'reserve', visited_by: 'Crew A (invented)' });
    expect(resultsCheck(plots, table, { column: 'cover', kind: 'cover' })).toEqual([]);
  });

  it('gives the stratified mean worked out by hand from the values typed', () => {
    const { plots, values } = walked();
    const table = parseResultsCsv('field.csv', fieldResultsToCsv(plots, variables));
    const report = estimateFromResults(plots, table, { value: 'cover', kind: 'cover', collapse: false });
    // Cochran (1977) ch. 5: ȳ_st = Σ W_h ȳ_h with W_h the stratum's share of the usable area.
    const usable = new Map(plots.design.allocation.map((r) => [r.stratum, r.usable_m2]));
    const total = [...usable.values()].reduce((a, b) => a + b, 0);
    const byStratum = new Map<string, number[]>();
    for (const f of plots.features) {
      const v = values.get(f.properties.plot_id);
      if (v !== undefined) byStratum.set(f.properties.stratum, [...(byStratum.get(f.properties.stratum) ?? []), v]);
    }
    const expected = [...byStratum].reduce((a, [s, vs]) => a + (usable.get(s)! / total) * (vs.reduce((x, y) => x + y, 0) / vs.length), 0);
    expect(report.mean).toBeCloseTo(expected, 10);
  });

  it('guards text that a spreadsheet would run as a formula and quotes commas and quotes (RFC 4180)', () => {
    const csv = fieldResultsToCsv(walked().plots, variables);
    expect(csv).toContain(`'=HYPERLINK(""x"")`);
    expect(csv).toContain('"ok, dry"');
    expect(csv).toContain('"gate ""locked"""');
  });

  it('leaves out waiting reserves and leaves unvisited plots blank', () => {
    const csv = fieldResultsToCsv(design, variables);
    const table = parseResultsCsv('field.csv', csv);
    expect(table.rows.every((r) => r.cells.role === 'primary' && r.cells.status === '' && r.cells.cover === '')).toBe(true);
  });
});
