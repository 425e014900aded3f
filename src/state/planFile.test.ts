import { describe, expect, it } from 'vitest';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import { type AutosaveStorage, AUTOSAVE_KEY, autosaveRestore, autosaveStart } from './autosave';
import { planFileApply, planFileFromState, planFileParse, planHasUnsavedWork } from './planFile';
import { plotCollectionInvented } from '../core/field/plotCollectionInvented';
import { plannerStoreCreate } from './plannerStore';
import { recaptureGridSet, resultsLoad, resultsMappingSet, resultsStoreCreate } from './resultsStore';
import { resultsSnapshotTake } from './resultsSnapshot';
import { stratumPartAdd } from './strataActions';

const square = { type: 'Polygon' as const, coordinates: [[[150, -35], [150.001, -35], [150.001, -34.999], [150, -34.999], [150, -35]]] };

function memoryStorage(): AutosaveStorage & { data: Map<string, unknown> } {
  const data = new Map<string, unknown>();
  return { data, get: async (k) => data.get(k), set: async (k, v) => void data.set(k, v) };
}

describe('plan files', () => {
  it('round-trips the site, design, result and field decisions through the plan file text', () => {
    const store = plannerStoreCreate(designSettingsDefault({ seed: 7 }));
    stratumPartAdd(store, 'Heath', square);
    const text = JSON.stringify(planFileFromState(store.getState(), '2026-12-01T00:00:00.000Z'));
    const plan = planFileParse(text, 'site.stratplot.json');
    expect(plan.format).toBe('stratplot-plan');
    expect(plan.site).toEqual(store.getState().site);
    expect(plan.design.seed).toBe(7);
    const other = plannerStoreCreate(designSettingsDefault());
    planFileApply(other, plan, designSettingsDefault(), true);
    expect(other.getState().site).toEqual(store.getState().site);
    expect(planHasUnsavedWork(other.getState())).toBe(false);
    // Undo never crosses into the plan that was there before.
    expect(other.temporal.getState().pastStates).toHaveLength(0);
  });

  it('opens a plan saved before generator versions were recorded with version 1, so its plots can be made again', () => {
    const store = plannerStoreCreate(designSettingsDefault({ seed: 7 }));
    stratumPartAdd(store, 'Heath', square);
    const saved = planFileFromState(store.getState(), '2026-12-01T00:00:00.000Z');
    expect(planFileParse(JSON.stringify(saved), 'new.stratplot.json').design.rngVersion).toBe(3);
    const { rngVersion: _dropped, ...before } = saved.design;
    const old = planFileParse(JSON.stringify({ ...saved, design: before }), 'old.stratplot.json');
    expect(old.design.rngVersion).toBe(1);
    const other = plannerStoreCreate(designSettingsDefault());
    planFileApply(other, old, designSettingsDefault(), true);
    expect(other.getState().design.rngVersion).toBe(1);
  });

  it('names the file and the problem when a plan cannot be read', () => {
    expect(() => planFileParse('{"format":', 'a.json')).toThrow(/^a\.json: not valid JSON/);
    expect(() => planFileParse('{"type":"FeatureCollection"}', 'b.json')).toThrow('b.json: not a stratplot plan file');
    expect(() => planFileParse('{"format":"stratplot-plan","version":3}', 'c.json')).toThrow('c.json: plan version 3 is not one this program reads (it reads versions 1 to 2)');
    const badPart = { format: 'stratplot-plan', version: 2, site: { strata: [], parts: [{ stratum_id: 'A', geometry: { type: 'Point', coordinates: [0, 0] } }], exclusions: [], access: [] }, design: {} };
    expect(() => planFileParse(JSON.stringify(badPart), 'd.json')).toThrow('d.json: site.parts[0] geometry is Point, not a polygon');
  });

  it('counts edits after opening a file as unsaved work', () => {
    const store = plannerStoreCreate(designSettingsDefault());
    expect(planHasUnsavedWork(store.getState())).toBe(false);
    stratumPartAdd(store, 'Heath', square);
    expect(planHasUnsavedWork(store.getState())).toBe(true);
  });
});

describe('autosave', () => {
  it('keeps the working plan in storage after a change and restores it into a fresh store', async () => {
    const storage = memoryStorage();
    const store = plannerStoreCreate(designSettingsDefault());
    const { stop } = autosaveStart(store, storage, 5);
    stratumPartAdd(store, 'Heath', square);
    await stop();
    expect(typeof storage.data.get(AUTOSAVE_KEY)).toBe('string');
    const fresh = plannerStoreCreate(designSettingsDefault());
    expect(await autosaveRestore(fresh, storage, designSettingsDefault())).toBe(true);
    expect(fresh.getState().site.parts).toHaveLength(1);
    // Restored work was never written to a file, so it still counts as unsaved.
    expect(planHasUnsavedWork(fresh.getState())).toBe(true);
  });

  it('finds nothing to restore in empty storage and reports a damaged copy in words', async () => {
    const storage = memoryStorage();
    const store = plannerStoreCreate(designSettingsDefault());
    expect(await autosaveRestore(store, storage, designSettingsDefault())).toBe(false);
    storage.data.set(AUTOSAVE_KEY, '{not json');
    await expect(autosaveRestore(store, storage, designSettingsDefault())).rejects.toThrow('the browser copy of your work is damaged');
  });
});

// Invented plot file and field values (not a real site): heath 5 ha usable, saltmarsh 3 ha, 10 m square plots.
const plots = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 2, reserves: 1, mappedM2: 50_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 2, reserves: 1, mappedM2: 30_000, usableM2: 30_000 },
]);
const CSV = 'plot,height_cm,status\nHEA-01,12,done\nHEA-02,16,done\nSAL-01,5,done\nSAL-02,9,done\n';
// Stratified mean by hand (Cochran, Sampling Techniques, 3rd ed. 1977, ch. 5: ȳ_st = Σ W_h ȳ_h): W = 5/8, 3/8; means 14, 7.
const MEAN = (5 / 8) * 14 + (3 / 8) * 7;

function plannerWithPlots() {
  const store = plannerStoreCreate(designSettingsDefault({ seed: 3 }));
  stratumPartAdd(store, 'Heath', square);
  store.setState({ result: plots });
  return store;
}

function resultsWorked() {
  const results = resultsStoreCreate();
  resultsLoad(results, 'heights.csv', CSV, plots);
  resultsMappingSet(results, { statusColumn: null }, plots);
  recaptureGridSet(results, 'grid-1', { marked: '30', caught: '25', recaptured: '10' });
  return results;
}

describe('results in the plan file and the browser copy', () => {
  it('saves the Results step in the plan file and gives the same estimate on open', () => {
    const planner = plannerWithPlots();
    const results = resultsWorked();
    expect(results.getState().report?.mean).toBeCloseTo(MEAN, 12);
    const text = JSON.stringify(planFileFromState(planner.getState(), '2026-12-01T00:00:00.000Z', resultsSnapshotTake(results.getState())));
    const plan = planFileParse(text, 'site.stratplot.json');
    expect(plan.results?.csvText).toBe(CSV);
    const otherPlanner = plannerStoreCreate(designSettingsDefault());
    const otherResults = resultsStoreCreate();
    planFileApply(otherPlanner, plan, designSettingsDefault(), true, otherResults);
    const s = otherResults.getState();
    // The status column the user unset stays unset: it is read as one more variable.
    expect(s.mapping).toMatchObject({ idColumn: 'plot', statusColumn: null, replacedByColumn: null });
    expect(Object.keys(s.mapping?.kinds ?? {})).toEqual(['height_cm', 'status']);
    expect(s.grids[0]).toMatchObject({ marked: '30', caught: '25', recaptured: '10' });
    expect(s.report?.mean).toBeCloseTo(MEAN, 12);
  });

  it('opens a plan saved without results and empties the Results step for it', () => {
    const planner = plannerWithPlots();
    const text = JSON.stringify(planFileFromState(planner.getState(), '2026-12-01T00:00:00.000Z'));
    expect(JSON.parse(text)).not.toHaveProperty('results');
    const plan = planFileParse(text, 'old.stratplot.json');
    expect(plan.results).toBeUndefined();
    const results = resultsWorked();
    planFileApply(plannerStoreCreate(designSettingsDefault()), plan, designSettingsDefault(), true, results);
    expect(results.getState().table).toBeNull();
    expect(results.getState().grids[0].marked).toBe('');
  });

  it('keeps a change made only in the Results step in the browser copy and restores it on reload', async () => {
    const storage = memoryStorage();
    const planner = plannerWithPlots();
    const results = resultsStoreCreate();
    const { stop } = autosaveStart(planner, storage, 5, undefined, results);
    resultsLoad(results, 'heights.csv', CSV, plots);
    await new Promise((r) => setTimeout(r, 20));
    recaptureGridSet(results, 'grid-1', { name: 'East grid' });
    await stop();
    const freshPlanner = plannerStoreCreate(designSettingsDefault());
    const freshResults = resultsStoreCreate();
    expect(await autosaveRestore(freshPlanner, storage, designSettingsDefault(), freshResults)).toBe(true);
    expect(freshResults.getState().fileName).toBe('heights.csv');
    expect(freshResults.getState().grids[0].name).toBe('East grid');
    expect(freshResults.getState().mapping?.statusColumn).toBe('status');
    expect(freshResults.getState().report?.mean).toBeCloseTo(MEAN, 12);
  });

  it('names the file when its results member is damaged', () => {
    const planner = plannerWithPlots();
    const plan = { ...planFileFromState(planner.getState(), ''), results: { csvText: 'plot\n', grids: {} } };
    expect(() => planFileParse(JSON.stringify(plan), 'e.json')).toThrow('e.json: results.grids must be a list');
  });
});
