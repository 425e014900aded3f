import { describe, expect, it } from 'vitest';
import { designSettingsDefault } from '../core/designSettingsDefault';
import { type AutosaveStorage, AUTOSAVE_KEY, autosaveRestore, autosaveStart } from './autosave';
import { planFileApply, planFileFromState, planFileParse, planHasUnsavedWork } from './planFile';
import { plannerStoreCreate } from './plannerStore';
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

  it('names the file and the problem when a plan cannot be read', () => {
    expect(() => planFileParse('{"format":', 'a.json')).toThrow(/^a\.json: not valid JSON/);
    expect(() => planFileParse('{"type":"FeatureCollection"}', 'b.json')).toThrow('b.json: not a stratplot plan file');
    expect(() => planFileParse('{"format":"stratplot-plan","version":2}', 'c.json')).toThrow('c.json: plan version 2 is not one this program reads');
    const badPart = { format: 'stratplot-plan', version: 1, site: { strata: [], parts: [{ stratum: 'A', geometry: { type: 'Point', coordinates: [0, 0] } }], exclusions: [], access: [] }, design: {} };
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
