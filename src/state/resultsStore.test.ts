import { describe, expect, it } from 'vitest';
import { plotCollectionInvented } from '../core/field/plotCollectionInvented';
import { recaptureGridAdd, recaptureGridRemove, recaptureGridSet, resultsDesignPatch, resultsLoad, resultsMappingSet, resultsOptionsSet, resultsStoreCreate } from './resultsStore';

/** n values with exactly the given mean and sample variance (divisor n − 1): evenly spaced ranks, rescaled. */
function valuesWith(n: number, mean: number, variance: number): number[] {
  const rankSd = Math.sqrt((n * (n + 1)) / 12);
  return Array.from({ length: n }, (_, i) => mean + Math.sqrt(variance) * ((i + 1 - (n + 1) / 2) / rankSd));
}

// Thompson, Sampling, 3rd ed. 2012, ch. 11 (aerial survey): N_h, n_h, ȳ_h, s_h² as in docs/references.md §3.
// In an areal design N_h is the stratum area in plot units: 1 m² plots over N_h m².
const THOMPSON = [
  { N: 400, n: 98, mean: 24.1, s2: 5575 },
  { N: 30, n: 10, mean: 25.6, s2: 4064 },
  { N: 61, n: 37, mean: 267.6, s2: 347556 },
  { N: 18, n: 6, mean: 179.0, s2: 22798 },
  { N: 70, n: 39, mean: 293.7, s2: 123578 },
  { N: 120, n: 21, mean: 33.2, s2: 9795 },
];

function thompsonFile() {
  const plots = plotCollectionInvented(
    THOMPSON.map((s, i) => ({ key: `Stratum ${i + 1}`, code: `S${i + 1}`, primaries: s.n, reserves: 0, mappedM2: s.N, usableM2: s.N })),
    { shape: 'square', sideM: 1, angleDeg: 0 },
  );
  const lines = ['plot_id,animals'];
  THOMPSON.forEach((s, i) => {
    valuesWith(s.n, s.mean, s.s2).forEach((v, j) => {
      lines.push(`S${i + 1}-${String(j + 1).padStart(2, '0')},${v}`);
    });
  });
  return { plots, csv: `${lines.join('\n')}\n` };
}

// Invented plot file (not a real site): heath 5 ha usable, saltmarsh 3 ha, dune 1 ha, 10 m square plots.
const small = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 2, mappedM2: 60_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 3, reserves: 1, mappedM2: 40_000, usableM2: 30_000 },
  { key: 'Dune', code: 'DUN', primaries: 2, reserves: 1, mappedM2: 10_000, usableM2: 10_000 },
]);

describe('resultsStore', () => {
  it('reproduces Thompson’s stratified total, its SE and Satterthwaite df from a loaded CSV', () => {
    const { plots, csv } = thompsonFile();
    const store = resultsStoreCreate();
    resultsLoad(store, 'aerial-invented.csv', csv, plots);
    const s = store.getState();
    expect(s.mapping?.idColumn).toBe('plot_id');
    expect(s.variable).toBe('animals');
    expect(s.problems.filter((p) => p.severity === 'error')).toEqual([]);
    // Thompson 2012 ch. 11, docs/references.md §3: τ̂ = 54 496.6, v = 34 105 732.4 (SE 5 840.0), df 134.3.
    expect(s.report?.total).toBeCloseTo(54_496.6, 6);
    expect(s.report?.total_se).toBeCloseTo(Math.sqrt(34_105_732.4), 2);
    expect(s.report?.df).toBeCloseTo(134.3, 1);
  });

  it('reads a semicolon file with decimal commas and finds the id column by its values', () => {
    const store = resultsStoreCreate();
    const csv = '\uFEFFPlot;cover_pct;orchid\nHEA-01;10,5;yes\nHEA-02;20;no\nHEA-03;15;no\nHEA-04;30;yes\nSAL-01;5;no\nSAL-02;0;no\nSAL-03;10;yes\nDUN-01;40;no\nDUN-02;50;yes\n';
    resultsLoad(store, 'field.csv', new TextEncoder().encode(csv), small);
    const s = store.getState();
    expect(s.loadError).toBeNull();
    expect(s.mapping?.idColumn).toBe('Plot');
    expect(s.mapping?.kinds).toEqual({ cover_pct: 'cover', orchid: 'presence' });
    // Weighted by hand: W = 5/9, 3/9, 1/9; means 18.875, 5, 45.
    expect(s.report?.mean).toBeCloseTo((5 / 9) * 18.875 + (3 / 9) * 5 + (1 / 9) * 45, 12);
    expect(s.plotValues['HEA-01']).toEqual({ cover_pct: 10.5 });
    resultsOptionsSet(store, { variable: 'orchid' }, small);
    // Presence share by hand: (5/9)(2/4) + (3/9)(1/3) + (1/9)(1/2).
    expect(store.getState().report?.mean).toBeCloseTo(5 / 18 + 1 / 9 + 1 / 18, 12);
  });

  it('reads the status and replacement columns the user maps, and names them in problems', () => {
    const store = resultsStoreCreate();
    const csv = [
      'plot_id,height_cm,Visit state,Reserve used',
      'HEA-01,12,done,',
      'HEA-02,15,unsafe,HEA-R1',
      'HEA-R1,11,done,',
      'HEA-03,14,done,',
      'HEA-04,18,maybe,',
      'SAL-01,5,done,',
      'SAL-02,7,done,',
      'SAL-03,6,done,',
      'DUN-01,30,done,',
      'DUN-02,34,done,',
    ].join('\n');
    resultsLoad(store, 'visits.csv', csv, small);
    let s = store.getState();
    expect(s.mapping?.statusColumn).toBe('Visit state');
    expect(s.mapping?.replacedByColumn).toBe('Reserve used');
    const bad = s.problems.find((p) => p.code === 'results-bad-status');
    expect(bad?.message).toBe('visits.csv row 6, column Visit state: "maybe" is not a status (use done or rejected)');
    expect(bad?.where).toMatchObject({ row: 6, column: 'Visit state' });
    expect(s.report).toBeNull();
    expect(s.estimateError).toContain('1 error');
    // Without a status column every row counts as measured, and the reserve is reported as unassigned.
    resultsMappingSet(store, { statusColumn: null, replacedByColumn: null }, small);
    s = store.getState();
    expect(s.mapping?.kinds).toEqual({ height_cm: 'measure', 'Visit state': 'measure', 'Reserve used': 'measure' });
    expect(s.problems.some((p) => p.code === 'results-reserve-unassigned')).toBe(true);
    expect(s.report?.strata[0].n).toBe(5);
  });

  it('keeps the previous file and says what is wrong when a file cannot be read', () => {
    const store = resultsStoreCreate();
    resultsLoad(store, 'ok.csv', 'plot_id,x\nHEA-01,1\n', small);
    resultsLoad(store, 'broken.csv', 'plot_id,x\nHEA-01,1,2\n', small);
    const s = store.getState();
    expect(s.fileName).toBe('ok.csv');
    expect(s.loadError).toBe('broken.csv row 2: 3 fields, but the header has 2');
  });

  it('collapses a one-plot stratum for the variance and lends its group’s pooled SD to next season’s Neyman sizes', () => {
    const store = resultsStoreCreate();
    const csv = 'plot_id,height\nHEA-01,12\nHEA-02,15\nHEA-03,14\nHEA-04,18\nSAL-01,5\nSAL-02,7\nSAL-03,6\nDUN-01,30\n';
    resultsLoad(store, 'h.csv', csv, small);
    expect(store.getState().report?.se).toBeNull();
    expect(store.getState().nextError).toContain('Dune');
    resultsOptionsSet(store, { collapse: true, target: { value: 1, relative: false } }, small);
    const s = store.getState();
    expect(s.report?.collapsed).toEqual(['Saltmarsh (n = 3) + Dune (n = 1)']);
    expect(s.report?.se).not.toBeNull();
    // Saltmarsh + Dune pooled: 5, 7, 6, 30 → sample SD by hand √(((−7)² + (−5)² + (−6)² + 18²)/3) = √(434/3).
    expect(s.nextSd.Dune).toBeCloseTo(Math.sqrt(434 / 3), 12);
    expect(s.nextSd.Saltmarsh).toBeCloseTo(1, 12);
    const patch = resultsDesignPatch(s, 'neyman');
    expect(patch).toEqual({ plots: s.next?.neyman.n, allocation: 'neyman', sd: s.nextSd, targetHalfwidth: null });
    expect(s.next?.neyman.halfwidth).toBeLessThanOrEqual(1);
  });

  it('adds, edits and removes recapture grid forms', () => {
    const store = resultsStoreCreate();
    recaptureGridAdd(store);
    recaptureGridSet(store, 'grid-2', { marked: '948', name: 'North grid' });
    expect(store.getState().grids.map((g) => [g.id, g.name, g.marked])).toEqual([
      ['grid-1', 'Grid 1', ''],
      ['grid-2', 'North grid', '948'],
    ]);
    recaptureGridRemove(store, 'grid-1');
    recaptureGridAdd(store);
    expect(store.getState().grids.map((g) => g.id)).toEqual(['grid-2', 'grid-3']);
  });
});
