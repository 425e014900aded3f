import { describe, expect, it } from 'vitest';
import { plotCollectionInvented } from '../field/plotCollectionInvented';
import { type ResultsTable, resultsCheck, resultsReview } from './resultsCheck';

// Invented plot file: two strata with 3 primaries and 3 reserves each.
const plots = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 3, reserves: 3, mappedM2: 60_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 3, reserves: 3, mappedM2: 40_000, usableM2: 30_000 },
]);
/** A results table from plain test text (no quoting), shaped as the CSV reader returns it. */
function tableOf(text: string): ResultsTable {
  const lines = text.split('\n');
  const delimiter = lines[0].includes(';') ? ';' : ',';
  const columns = lines[0].split(delimiter);
  const rows = lines
    .map((line, i) => ({ row: i + 1, fields: line.split(delimiter) }))
    .slice(1)
    .filter((r) => r.fields.some((f) => f !== ''))
    .map((r) => ({ row: r.row, cells: Object.fromEntries(columns.map((c, j) => [c, r.fields[j] ?? ''])) }));
  const decimal = delimiter === ';' && rows.some((r) => Object.values(r.cells).some((v) => /^\d*,\d+$/.test(v))) ? ',' : '.';
  return { fileName: 'field.csv', columns, idColumn: 'plot_id', delimiter, decimal, rows };
}
const csv = tableOf;
const messages = (text: string, kind: 'measure' | 'cover' | 'count' | 'presence' = 'measure', column = 'v') =>
  resultsCheck(plots, csv(text), { column, kind }).map((p) => `${p.severity}: ${p.message}`);

const COMPLETE = 'HEA-01,1\nHEA-02,2\nHEA-03,3\nSAL-01,4\nSAL-02,5\nSAL-03,6\n';

describe('resultsCheck', () => {
  it('finds nothing wrong with a complete set of results', () => {
    expect(messages(`plot_id,v\n${COMPLETE}`)).toEqual([]);
    const r = resultsReview(plots, csv(`plot_id,v\n${COMPLETE}`), { column: 'v', kind: 'measure' });
    expect(r.observations.map((o) => o.value)).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it('names ids that are not in the plan', () => {
    expect(messages(`plot_id,v\n${COMPLETE}HEA-99,1\n`)).toEqual(['error: field.csv row 8, column plot_id: "HEA-99" is not a plot of the plan']);
  });

  it('names a row without a plot id', () => {
    expect(messages(`plot_id,v\n${COMPLETE} ,7\n`)).toEqual(['error: field.csv row 8, column plot_id: no plot id']);
  });

  it('names duplicated ids with the row of the first', () => {
    expect(messages(`plot_id,v\n${COMPLETE}SAL-02,5\n`)).toEqual(['error: field.csv row 8, column plot_id: "SAL-02" appears again (first at row 6)']);
  });

  it('warns about primaries with no result and no replacement', () => {
    const m = messages('plot_id,v\nHEA-01,1\nHEA-02,\nSAL-01,4\nSAL-02,5\nSAL-03,6\n');
    expect(m).toEqual([
      'warning: field.csv row 3, column v: primary HEA-02 has no result and no replacement (stratum "Coastal heath" is short by one plot)',
      'warning: field.csv: primary HEA-03 has no row and no replacement (stratum "Coastal heath" is short by one plot)',
    ]);
  });

  it('accepts a rejected primary replaced by the first reserve', () => {
    const m = messages('plot_id,v,status,replaced_by\nHEA-01,1,done,\nHEA-02,,rejected,HEA-R1\nHEA-R1,2.5,done,\nHEA-03,3,,\nSAL-01,4,,\nSAL-02,5,,\nSAL-03,6,,\n');
    expect(m).toEqual([]);
  });

  it('warns when reserves are used out of rank order', () => {
    const m = messages('plot_id,v,status,replaced_by\nHEA-01,1,,\nHEA-02,,Rejected,HEA-R2\nHEA-R2,2.5,,\nHEA-03,3,,\nSAL-01,4,,\nSAL-02,5,,\nSAL-03,6,,\n');
    expect(m).toEqual([
      'warning: field.csv row 3, column replaced_by: reserve HEA-R2 (rank 2) is used while HEA-R1 (rank 1) of stratum "Coastal heath" is unused; reserves must be used in rank order',
    ]);
  });

  it('refuses replacements that are not reserves of the same stratum, or used twice', () => {
    const base = 'plot_id,v,status,replaced_by\n';
    expect(messages(`${base}HEA-01,,rejected,SAL-R1\n`)[0]).toBe('error: field.csv row 2, column replaced_by: "SAL-R1" is not a reserve of stratum "Coastal heath"');
    expect(messages(`${base}HEA-01,,rejected,HEA-02\n`)[0]).toBe('error: field.csv row 2, column replaced_by: "HEA-02" is not a reserve of stratum "Coastal heath"');
    expect(messages(`${base}HEA-01,,rejected,XX-R1\n`)[0]).toBe('error: field.csv row 2, column replaced_by: "XX-R1" is not a plot of the plan');
    expect(messages(`${base}HEA-01,,rejected,HEA-R1\nHEA-02,,rejected,HEA-R1\n`)[0]).toBe('error: field.csv row 3, column replaced_by: reserve "HEA-R1" already replaces HEA-01');
    expect(messages(`${base}HEA-01,1,done,HEA-R1\n`)[0]).toBe('error: field.csv row 2, column replaced_by: "HEA-R1" given as a replacement, but plot HEA-01 is not marked rejected');
  });

  it('refuses unknown status words', () => {
    expect(messages('plot_id,v,status\nHEA-01,1,maybe\n')[0]).toBe('error: field.csv row 2, column status: "maybe" is not a status (use done or rejected)');
  });

  it('names non-numeric values, with a hint for decimal-comma files', () => {
    expect(messages('plot_id,v\nHEA-01,abc\n')[0]).toBe('error: field.csv row 2, column v: "abc" is not a number');
    expect(messages('plot_id;v\nHEA-01;1,5\nHEA-02;2.5\n'.replace('2.5', 'x'))[0]).toBe(
      'error: field.csv row 3, column v: "x" is not a number (this file uses decimal commas)',
    );
  });

  it('refuses cover outside 0–100 and negative counts, fractional counts and magnitudes beyond the limit', () => {
    expect(messages('plot_id,cover\nHEA-01,101\n', 'cover', 'cover')[0]).toBe('error: field.csv row 2, column cover: cover 101 is outside 0–100 %');
    expect(messages('plot_id,n\nHEA-01,-2\n', 'count', 'n')[0]).toBe('error: field.csv row 2, column n: count -2 is negative');
    expect(messages('plot_id,n\nHEA-01,2.5\n', 'count', 'n')[0]).toBe('error: field.csv row 2, column n: count 2.5 is not a whole number (if the column is not a count, give --kind measure)');
  });

  it('reads presence words and refuses others', () => {
    const r = resultsReview(plots, csv('plot_id,orchid\nHEA-01,Yes\nHEA-02,absent\nHEA-03,y\n'), { column: 'orchid', kind: 'presence' });
    expect(r.observations.map((o) => o.value)).toEqual([1, 0, 1]);
    expect(messages('plot_id,orchid\nHEA-01,perhaps\n', 'presence', 'orchid')[0]).toBe(
      'error: field.csv row 2, column orchid: "perhaps" is not a presence/absence value (use 1/0, yes/no, y/n, present/absent, true/false)',
    );
  });

  it('ignores, with a warning, values given for rejected plots', () => {
    const m = messages('plot_id,v,status,replaced_by\nHEA-01,7,rejected,HEA-R1\nHEA-R1,2,,\n');
    expect(m[0]).toBe('warning: field.csv row 2, column v: value "7" ignored because plot HEA-01 is rejected');
  });

  it('warns about a measured reserve that replaces nothing', () => {
    const m = messages(`plot_id,v\n${COMPLETE}SAL-R1,9\n`);
    expect(m).toEqual([
      'warning: field.csv row 8, column plot_id: reserve SAL-R1 has a result but replaces no rejected plot (give it in the rejected plot\'s replaced_by)',
    ]);
  });

  it('warns when the reserve named as a replacement has no result', () => {
    const m = messages('plot_id,v,status,replaced_by\nHEA-01,,rejected,HEA-R1\nHEA-02,2,,\nHEA-03,3,,\nSAL-01,4,,\nSAL-02,5,,\nSAL-03,6,,\n');
    expect(m).toEqual(['warning: field.csv: reserve HEA-R1, which replaces HEA-01, has no result for v']);
  });

  it('takes rejections and promotions already recorded in the plot file', () => {
    const recorded = structuredClone(plots);
    const p = recorded.features.find((f) => f.properties.plot_id === 'HEA-02')!;
    p.properties.status = 'rejected';
    const r1 = recorded.features.find((f) => f.properties.plot_id === 'HEA-R1')!;
    r1.properties.status = 'promoted';
    r1.properties.replaces = 'HEA-02';
    const m = resultsCheck(recorded, csv('plot_id,v\nHEA-01,1\nHEA-R1,2\nHEA-03,3\nSAL-01,4\nSAL-02,5\nSAL-03,6\n'), { column: 'v', kind: 'measure' });
    expect(m).toEqual([]);
  });
});
