import { describe, expect, it } from 'vitest';
import { parseResultsCsv } from './parseResultsCsv';

const enc = (s: string) => new TextEncoder().encode(s);

describe('parseResultsCsv', () => {
  it('reads a comma file with decimal points', () => {
    const t = parseResultsCsv('r.csv', enc('plot_id,cover,status\nHEA-01,12.5,done\nHEA-02,7,rejected\n'));
    expect(t.delimiter).toBe(',');
    expect(t.decimal).toBe('.');
    expect(t.columns).toEqual(['plot_id', 'cover', 'status']);
    expect(t.rows).toEqual([
      { row: 2, cells: { plot_id: 'HEA-01', cover: '12.5', status: 'done' } },
      { row: 3, cells: { plot_id: 'HEA-02', cover: '7', status: 'rejected' } },
    ]);
  });

  it('reads a semicolon file with decimal commas and a byte-order mark', () => {
    const t = parseResultsCsv('r.csv', enc('\ufeffplot_id;cover\r\nHEA-01;12,5\r\nHEA-02;3\r\n'));
    expect(t.delimiter).toBe(';');
    expect(t.decimal).toBe(',');
    expect(t.columns[0]).toBe('plot_id');
    expect(t.rows[0].cells.cover).toBe('12,5');
  });

  it('reads tab-delimited files and quoted fields with delimiters, quotes and line breaks', () => {
    const t = parseResultsCsv('r.txt', enc('plot_id\tnotes\nA-1\t"wet; ""boggy""\nground"\nA-2\tok\n'));
    expect(t.delimiter).toBe('\t');
    expect(t.rows[0].cells.notes).toBe('wet; "boggy"\nground');
    expect(t.rows[1].row).toBe(4);
  });

  it('skips blank lines but keeps spreadsheet row numbers', () => {
    const t = parseResultsCsv('r.csv', 'plot_id,v\n\nA-1,1\n,\nA-2,2\n');
    expect(t.rows.map((r) => r.row)).toEqual([3, 5]);
  });

  it('uses another id column when asked', () => {
    const t = parseResultsCsv('r.csv', 'site,v\nA-1,1\n', { idColumn: 'site' });
    expect(t.idColumn).toBe('site');
  });

  it('names the columns when the id column is missing', () => {
    expect(() => parseResultsCsv('r.csv', 'id,v\nA,1\n')).toThrow('r.csv: no column "plot_id" for plot ids; columns are id, v (choose one with --id-column)');
  });

  it('names the row that has the wrong number of fields', () => {
    expect(() => parseResultsCsv('r.csv', 'plot_id,v\nA,1\nB,2,3\n')).toThrow('r.csv row 3: 3 fields, but the header has 2');
  });

  it('refuses a file that mixes decimal marks', () => {
    expect(() => parseResultsCsv('r.csv', 'plot_id;a;b\nA;1,5;2.5\n')).toThrow(
      'r.csv: mixes decimal commas (row 2, column a ("1,5")) and decimal points (row 2, column b ("2.5")); use one decimal mark throughout',
    );
  });

  it('refuses empty files, repeated columns, unclosed quotes and non-UTF-8 bytes', () => {
    expect(() => parseResultsCsv('r.csv', '\n\n')).toThrow('r.csv: the file is empty');
    expect(() => parseResultsCsv('r.csv', 'plot_id,v,v\n')).toThrow('r.csv row 1: column name "v" appears twice');
    expect(() => parseResultsCsv('r.csv', 'plot_id,v\nA,"1\n')).toThrow('r.csv row 2: a quoted field is never closed');
    expect(() => parseResultsCsv('r.csv', new Uint8Array([0x70, 0xff, 0x0a]))).toThrow('r.csv: not UTF-8 text');
  });
});
