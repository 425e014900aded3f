import { describe, expect, it } from 'vitest';
import { estimateFromResults } from '../../core/results/estimateFromResults';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { estimatesToCsv } from './estimatesToCsv';
import { parseResultsCsv } from './parseResultsCsv';

// Invented plot file and results (not a real site).
const plots = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 2, reserves: 0, mappedM2: 20_000, usableM2: 20_000 },
  { key: 'Dune; grass', code: 'DUN', primaries: 2, reserves: 0, mappedM2: 20_000, usableM2: 20_000 },
]);
const report = estimateFromResults(plots, parseResultsCsv('r.csv', 'plot_id,v\nHEA-01,1.5\nHEA-02,2.5\nDUN-01,3\nDUN-02,5\n'), {
  value: 'v',
  kind: 'measure',
  collapse: false,
});

describe('estimatesToCsv', () => {
  it('writes stratum rows, an all-strata row and notes that a CSV reader reads back', () => {
    const csv = estimatesToCsv(report);
    const back = parseResultsCsv('out.csv', csv, { idColumn: 'level' });
    expect(back.rows[0].cells).toMatchObject({ level: 'stratum', stratum: 'Coastal heath', n: '2', mean: '2', weight: '0.5', basis_ha: '2' });
    expect(back.rows[1].cells.stratum).toBe('Dune; grass');
    expect(back.rows[2].cells).toMatchObject({ level: 'all', mean: '3', n: '4' });
    expect(Number(back.rows[2].cells.ci95_low)).toBeCloseTo((report.ci95 as [number, number])[0], 12);
    expect(back.rows.some((r) => r.cells.level === 'note' && r.cells.stratum.startsWith('Estimates cover the usable area'))).toBe(true);
  });

  it('writes semicolons with decimal commas and quotes text that holds the delimiter', () => {
    // se = √((1 − 0.01)·0.5/2) with f = 2·100 m²/2 ha = 0.01 (by hand).
    const csv = estimatesToCsv(report, { delimiter: ';' });
    expect(csv.split('\r\n')[1]).toBe('stratum;Coastal heath;2;2;0,7071067811865476;0,49749371855331;;;;0,5;2;0,01;;;;');
    expect(csv).toContain('"Dune; grass"');
    const back = parseResultsCsv('out.csv', csv, { idColumn: 'level' });
    expect(back.decimal).toBe(',');
  });
});
