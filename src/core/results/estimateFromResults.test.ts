import { describe, expect, it } from 'vitest';
import { estimateFromResults } from './estimateFromResults';
import { plotCollectionInvented } from '../field/plotCollectionInvented';
import type { ResultsTable } from './resultsCheck';

// Invented plot file (not a real site): heath 5 ha usable, saltmarsh 3 ha usable, 10 m square plots.
const plots = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 2, mappedM2: 60_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 3, reserves: 1, mappedM2: 40_000, usableM2: 30_000 },
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
const table = tableOf;
const CSV = 'plot_id;stems;cover;orchid\nHEA-01;3;10,5;yes\nHEA-02;5;20;no\nHEA-03;4;15;no\nHEA-04;8;30;yes\nSAL-01;1;5;no\nSAL-02;0;0;no\nSAL-03;2;10;yes\n';

describe('estimateFromResults', () => {
  it('weights strata by usable area and applies the plot-area fpc', () => {
    const r = estimateFromResults(plots, table(CSV), { value: 'stems', kind: 'count', collapse: false });
    // By hand: heath ȳ = 5, s² = 14/3; saltmarsh ȳ = 1, s² = 1; W = 5/8, 3/8; f = 4·100/5e4, 3·100/3e4.
    const v = (25 / 64) * (1 - 0.008) * (14 / 3 / 4) + (9 / 64) * (1 - 0.01) * (1 / 3);
    expect(r.mean).toBeCloseTo(5 * 0.625 + 0.375, 12);
    expect(r.se).toBeCloseTo(Math.sqrt(v), 12);
    expect(r.strata.map((s) => s.weight)).toEqual([0.625, 0.375]);
    expect(r.strata[0].sampling_fraction).toBeCloseTo(0.008, 12);
    // Total: mean stems per 100 m² plot × 100 plots per ha × 8 ha.
    expect(r.total).toBeCloseTo((r.mean as number) * 100 * 8, 9);
    expect(r.total_unit).toContain('per-plot value / plot area');
    expect(r.population).toContain('usable area of the strata (8.00 ha)');
    expect(r.formulas.length).toBeGreaterThan(4);
    expect(r.deff).toBeGreaterThan(0);
  });

  it('gives cover totals as hectares covered', () => {
    const r = estimateFromResults(plots, table(CSV), { value: 'cover', kind: 'cover', collapse: false });
    expect(r.total).toBeCloseTo(((r.mean as number) / 100) * 8, 12);
    expect(r.total_unit).toBe('ha covered');
  });

  it('estimates presence as a stratified proportion', () => {
    const r = estimateFromResults(plots, table(CSV), { value: 'orchid', kind: 'presence', collapse: false });
    // By hand: 0.625·(2/4) + 0.375·(1/3) = 0.4375.
    expect(r.mean).toBeCloseTo(0.4375, 12);
    expect(r.total).toBeCloseTo(0.4375 * 8, 12);
  });

  it('uses mapped areas when the design says so, and says what that means', () => {
    const mapped = plotCollectionInvented(
      [
        { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 0, mappedM2: 60_000, usableM2: 50_000 },
        { key: 'Saltmarsh', code: 'SAL', primaries: 3, reserves: 0, mappedM2: 40_000, usableM2: 30_000 },
      ],
      { shape: 'point' },
      'mapped',
    );
    const r = estimateFromResults(mapped, table(CSV), { value: 'stems', kind: 'count', collapse: false });
    expect(r.strata.map((s) => s.weight)).toEqual([0.6, 0.4]);
    expect(r.strata[0].sampling_fraction).toBe(0);
    expect(r.total).toBeNull();
    expect(r.warnings.join('\n')).toContain('plots are points');
    expect(r.warnings.join('\n')).toContain('no total');
    expect(r.population).toContain('plots lie only on usable ground');
  });

  it('reports no SE for a stratum with one plot unless strata are collapsed, and keeps the mean when they are', () => {
    const csv = 'plot_id,v\nHEA-01,3\nHEA-02,5\nHEA-03,4\nHEA-04,8\nSAL-01,1\n';
    const plain = estimateFromResults(plots, table(csv), { value: 'v', kind: 'measure', collapse: false });
    expect(plain.mean).not.toBeNull();
    expect(plain.se).toBeNull();
    expect(plain.ci95).toBeNull();
    expect(plain.warnings.join('\n')).toContain('only one observation in stratum "Saltmarsh"');
    const c = estimateFromResults(plots, table(csv), { value: 'v', kind: 'measure', collapse: true });
    expect(c.strata.map((s) => s.stratum)).toEqual(['Coastal heath', 'Saltmarsh']);
    expect(c.strata.map((s) => s.group)).toEqual([
      ['Coastal heath', 'Saltmarsh'],
      ['Coastal heath', 'Saltmarsh'],
    ]);
    expect(c.mean).toBe(plain.mean);
    expect(c.collapsed).toEqual(['Coastal heath (n = 4) + Saltmarsh (n = 1)']);
    // By hand (Cochran 1977 §5A.12, pair of strata): W = 5/8, 3/8; means 5 and 1; L = 2:
    // v = 4 W_1² W_2² (ȳ_1 − ȳ_2)²/(W_1 + W_2)² = 4 · (25/64)(9/64) · 16 = 3.515625, 1 df.
    expect(c.se).toBeCloseTo(Math.sqrt(3.515625), 12);
    expect(c.df).toBeCloseTo(1, 12);
    expect(c.formulas.join('\n')).toContain('Hansen, Hurwitz & Madow 1953');
    expect(c.warnings.join('\n')).toContain('conservative');
  });

  it('collapses only the variance, by the published between-strata estimator (a worked example by hand)', () => {
    // Invented strata with point plots (no fpc): A 5 ha, B 3 ha, C 2 ha → W = 0.5, 0.3, 0.2.
    const three = plotCollectionInvented(
      [
        { key: 'A', code: 'AAA', primaries: 4, reserves: 0, mappedM2: 50_000, usableM2: 50_000 },
        { key: 'B', code: 'BBB', primaries: 1, reserves: 0, mappedM2: 30_000, usableM2: 30_000 },
        { key: 'C', code: 'CCC', primaries: 3, reserves: 0, mappedM2: 20_000, usableM2: 20_000 },
      ],
      { shape: 'point' },
    );
    const csv = 'plot_id,v\nAAA-01,10\nAAA-02,12\nAAA-03,14\nAAA-04,16\nBBB-01,20\nCCC-01,24\nCCC-02,26\nCCC-03,28\n';
    const r = estimateFromResults(three, table(csv), { value: 'v', kind: 'measure', collapse: true });
    // B has one plot and is grouped with the next stratum, C. By hand:
    // ȳ_st = 0.5·13 + 0.3·20 + 0.2·26 = 17.7 over the original strata (pooling B with C would give
    //   0.5·13 + 0.5·24.5 = 18.75 instead).
    // A keeps its own term: W² s²/n = 0.25 · (20/3)/4 = 0.4166667 (3 df).
    // Group {B, C} (Hansen, Hurwitz & Madow 1953; Cochran 1977 §5A.12), y_h = W_h ȳ_h = 6 and 5.2,
    //   y_g = 11.2, W_g = 0.5: v_g = 2 · [(6 − 0.6·11.2)² + (5.2 − 0.4·11.2)²] = 2 · (0.5184 + 0.5184) = 2.0736 (1 df).
    // v = 0.4166667 + 2.0736 = 2.4902667; SE 1.5780579.
    // Satterthwaite df = v² / (0.4166667²/3 + 2.0736²/1) = 6.2014281 / (0.0578704 + 4.2998170) = 1.4231007.
    expect(r.mean).toBeCloseTo(17.7, 12);
    expect(r.se).toBeCloseTo(Math.sqrt(0.25 * (20 / 3) / 4 + 2.0736), 12);
    expect(r.se).toBeCloseTo(1.5780579, 6);
    expect(r.df).toBeCloseTo(1.4231007, 6);
    expect(r.collapsed_groups).toEqual([{ strata: ['B', 'C'], variance: expect.closeTo(2.0736, 12), df: 1, pooled_sd: expect.any(Number) }]);
    expect(r.strata.map((s) => s.se === null)).toEqual([false, true, false]);
    expect(r.strata.map((s) => s.mean)).toEqual([13, 20, 26]);
  });

  it('stops at the first error and counts the others', () => {
    expect(() =>
      estimateFromResults(plots, table('plot_id,v\nHEA-01,x\nHEA-02,y\n'), { value: 'v', kind: 'measure', collapse: false }),
    ).toThrow('field.csv row 2, column v: "x" is not a number (and 1 more problem)');
  });
});

describe('estimateFromResults on a plot file from the design engine', () => {
  it('reads what designRun writes, including a promoted reserve', async () => {
    const { designRun } = await import('../design/designRun');
    const { designSettingsDefault } = await import('../design/designSettingsDefault');
    // An invented site (not a real place): two square strata side by side.
    const square = (lon0: number): number[][][] => [
      [
        [lon0, -27.41],
        [lon0 + 0.005, -27.41],
        [lon0 + 0.005, -27.405],
        [lon0, -27.405],
        [lon0, -27.41],
      ],
    ];
    const design = designRun(
      {
        name: 'Invented site',
        strata: [
          { key: 'Coastal heath', label: 'Coastal heath', code: 'HEA', colour: '#44aa99' },
          { key: 'Saltmarsh', label: 'Saltmarsh', code: 'SAL', colour: '#88ccee' },
        ],
        parts: [
          { id: 'a', stratum: 'Coastal heath', geometry: { type: 'Polygon', coordinates: square(153.1) } },
          { id: 'b', stratum: 'Saltmarsh', geometry: { type: 'Polygon', coordinates: square(153.105) } },
        ],
        exclusions: [],
        access: [],
        boundary: null,
      },
      designSettingsDefault({ plots: 8, reservePerStratum: 1, footprint: { shape: 'square', sideM: 10, angleDeg: 0 }, seed: 3 }),
    );
    const primaries = design.features.filter((f) => f.properties.role === 'primary').map((f) => f.properties.plot_id);
    const [first, ...rest] = primaries;
    const reserve = design.features.find((f) => f.properties.role === 'reserve' && f.properties.stratum === design.features[0].properties.stratum)!;
    const lines = ['plot_id,v,status,replaced_by', `${first},,rejected,${reserve.properties.plot_id}`, `${reserve.properties.plot_id},10,,`];
    for (const [i, id] of rest.entries()) lines.push(`${id},${i + 1},,`);
    const r = estimateFromResults(design, table(`${lines.join('\n')}\n`), { value: 'v', kind: 'measure', collapse: false });
    expect(r.warnings).toEqual([]);
    expect(r.strata.reduce((a, s) => a + s.n, 0)).toBe(primaries.length);
    const usable = design.design.allocation.map((row) => row.usable_m2);
    expect(r.strata.map((s) => s.weight)).toEqual(usable.map((u) => u / (usable[0] + usable[1])));
    expect(r.se).toBeGreaterThan(0);
  });
});
