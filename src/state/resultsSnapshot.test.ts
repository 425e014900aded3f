import { describe, expect, it } from 'vitest';
import { plotCollectionInvented } from '../core/field/plotCollectionInvented';
import { recaptureGridAdd, recaptureGridSet, resultsLoad, resultsMappingSet, resultsOptionsSet, resultsStoreCreate } from './resultsStore';
import { resultsReset, resultsSnapshotIsEmpty, resultsSnapshotParse, resultsSnapshotRestore, resultsSnapshotTake } from './resultsSnapshot';

// Invented plot file (not a real site): heath 5 ha usable, saltmarsh 3 ha, dune 1 ha, 10 m square plots.
const strata = [
  { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 2, mappedM2: 60_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 3, reserves: 1, mappedM2: 40_000, usableM2: 30_000 },
  { key: 'Dune', code: 'DUN', primaries: 2, reserves: 1, mappedM2: 10_000, usableM2: 10_000 },
];
const small = plotCollectionInvented(strata);

// Invented field values (semicolons, decimal commas, a byte-order mark, an id column not called plot_id).
const CSV = '\uFEFFPlot;cover_pct;orchid;crew\nHEA-01;10,5;yes;A\nHEA-02;20;no;A\nHEA-03;15;no;B\nHEA-04;30;yes;B\nSAL-01;5;no;A\nSAL-02;0;no;A\nSAL-03;10;yes;B\nDUN-01;40;no;B\nDUN-02;50;yes;A\n';

/** A store with the CSV loaded, cover_pct re-kinded as a plain measure, orchid chosen, collapse on and a second grid typed in. */
function workedStore() {
  const store = resultsStoreCreate();
  resultsLoad(store, 'field.csv', new TextEncoder().encode(CSV), small);
  resultsMappingSet(store, { kinds: { cover_pct: 'measure' } }, small);
  resultsOptionsSet(store, { variable: 'orchid', collapse: true, target: { value: 0.2, relative: true } }, small);
  recaptureGridAdd(store);
  recaptureGridSet(store, 'grid-2', { name: 'North grid', marked: '948', caught: '421', recaptured: '7', by: 'area', areaHa: '12,5' });
  return store;
}

describe('results snapshot', () => {
  it('gives back the same file, mapping, options, forms and estimate after a trip through JSON', () => {
    const store = workedStore();
    const before = store.getState();
    const snap = resultsSnapshotParse(JSON.parse(JSON.stringify(resultsSnapshotTake(before))), 'plan.json');
    const fresh = resultsStoreCreate();
    resultsSnapshotRestore(fresh, snap, small);
    const after = fresh.getState();
    expect(after.fileName).toBe('field.csv');
    expect(after.mapping).toEqual(before.mapping);
    expect(after.mapping?.kinds.cover_pct).toBe('measure');
    expect(after.variable).toBe('orchid');
    expect(after.collapse).toBe(true);
    expect(after.target).toEqual({ value: 0.2, relative: true });
    expect(after.grids).toEqual(before.grids);
    expect(after.grids[1]).toMatchObject({ name: 'North grid', marked: '948', by: 'area', areaHa: '12,5' });
    expect(after.problems).toEqual(before.problems);
    // Stratified estimate of a proportion, Cochran, Sampling Techniques, 3rd ed. 1977, ch. 5 (p̂_st = Σ W_h p̂_h;
    // section number from memory), by hand: W = 5/9, 3/9, 1/9 and p̂ = 2/4, 1/3, 1/2.
    expect(after.report?.mean).toBeCloseTo((5 / 9) * (2 / 4) + (3 / 9) * (1 / 3) + (1 / 9) * (1 / 2), 12);
    expect(after.report).toEqual(before.report);
  });

  it('restores results whose plot ids the design no longer has and lists them as problems', () => {
    const snap = resultsSnapshotTake(workedStore().getState());
    // The design was remade with fewer dune plots: DUN-02 is no longer a plot of the plan.
    const smaller = plotCollectionInvented([strata[0], strata[1], { ...strata[2], primaries: 1 }]);
    const store = resultsStoreCreate();
    resultsSnapshotRestore(store, snap, smaller);
    const s = store.getState();
    expect(s.sourceText).toBe(snap.csvText);
    expect(s.table?.rows).toHaveLength(9);
    const unknown = s.problems.filter((p) => p.code === 'results-unknown-id');
    expect(unknown.map((p) => p.message)).toEqual(['field.csv row 10, column Plot: "DUN-02" is not a plot of the plan']);
    expect(s.report).toBeNull();
    expect(s.estimateError).toContain('1 error');
  });

  it('says a fresh store holds nothing to keep, and an edited recapture form does', () => {
    const store = resultsStoreCreate();
    expect(resultsSnapshotIsEmpty(resultsSnapshotTake(store.getState()))).toBe(true);
    recaptureGridSet(store, 'grid-1', { marked: '12' });
    expect(resultsSnapshotIsEmpty(resultsSnapshotTake(store.getState()))).toBe(false);
    resultsReset(store);
    expect(resultsSnapshotIsEmpty(resultsSnapshotTake(store.getState()))).toBe(true);
  });

  it('names the file and the member when a kept snapshot has a wrong field', () => {
    const good = resultsSnapshotTake(workedStore().getState());
    const bad = (patch: object) => () => resultsSnapshotParse({ ...good, ...patch }, 'site.stratplot.json');
    expect(bad({ mapping: { ...good.mapping, kinds: { orchid: 'colour' } } })).toThrow(
      'site.stratplot.json: results.mapping.kinds["orchid"] is colour, not one of measure, cover, count, presence',
    );
    expect(bad({ grids: [{ ...good.grids[0], marked: 948 }] })).toThrow('site.stratplot.json: results.grids[0].marked must be text');
    expect(bad({ csvText: 3 })).toThrow('site.stratplot.json: results.csvText must be text or null');
    expect(bad({ target: { value: -1, relative: true } })).toThrow('site.stratplot.json: results.target needs a positive value');
    expect(() => resultsSnapshotParse('text', 'p.json')).toThrow('p.json: results is not an object');
  });

  it('leaves a file that no longer reads unloaded and says why', () => {
    const snap = { ...resultsSnapshotTake(workedStore().getState()), csvText: 'Plot;x\nHEA-01;1;2\n' };
    const store = resultsStoreCreate();
    resultsSnapshotRestore(store, snap, small);
    expect(store.getState().table).toBeNull();
    expect(store.getState().loadError).toBe('field.csv row 2: 3 fields, but the header has 2');
    expect(store.getState().grids[1].name).toBe('North grid');
  });
});
