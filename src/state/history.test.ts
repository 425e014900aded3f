import { describe, expect, it } from 'vitest';
import { designRun } from '../core/design/designRun';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import type { PlanFile } from './planFileTypes';
import { designResultSet, designSettingsSet } from './designActions';
import { exclusionAdd } from './exclusionActions';
import { historyNext, historyRedo, historyUndo } from './historyActions';
import { planReplace } from './planReplace';
import { plannerStoreCreate, siteEmpty } from './plannerStore';
import { plotReject } from './plotReject';
import { plotRestore } from './plotRestore';
import { plotRejections } from '../core/field/plotFieldState';
import { planFileOf } from './planFile';
import { resultsLoad, resultsStoreCreate } from './resultsStore';
import { stratumPartAdd, stratumRename } from './strataActions';

// Invented site: two 400 m squares (not a real place).
const box = (w: number, s: number, e: number, n: number) => ({
  type: 'Polygon' as const,
  coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]],
});

function designedStore() {
  const store = plannerStoreCreate(designSettingsDefault({ plots: 6, reservePerStratum: 2, seed: 11 }));
  stratumPartAdd(store, 'Heath', box(150, -35, 150.004, -34.996));
  stratumPartAdd(store, 'Marsh', box(150.004, -35, 150.008, -34.996));
  const s = store.getState();
  designResultSet(store, designRun(s.site, s.design));
  return store;
}

const primary = (store: ReturnType<typeof designedStore>, stratum: string) =>
  store.getState().result!.features.map((f) => f.properties).find((p) => p.role === 'primary' && p.stratum === stratum)!;

describe('one undo history for the whole plan', () => {
  it('undoes a rejection with its promotion, says so, and shows the Plots step', () => {
    const store = designedStore();
    const victim = primary(store, 'Marsh');
    const promoted = plotReject(store, victim.plot_id, 'Under water', '2026-12-01T09:00:00Z');
    store.setState({ step: 'strata' });
    expect(historyNext(store, 'undo')?.text).toBe(`${victim.plot_id} rejected (Under water); ${promoted} promoted to replace ${victim.plot_id}`);
    expect(historyUndo(store)).toBe(true);
    const s = store.getState();
    expect(plotRejections(s.result!)).toEqual([]);
    expect(s.result!.features.every((f) => (f.properties.status ?? 'planned') === 'planned')).toBe(true);
    // It was made on another step: the planner goes there rather than undo out of sight.
    expect(s.step).toBe('plots');
    expect(s.notice?.text).toBe(`Undone in step 4, Plots: ${victim.plot_id} rejected (Under water); ${promoted} promoted to replace ${victim.plot_id}.`);
    expect(historyRedo(store)).toBe(true);
    expect(plotRejections(store.getState().result!)).toHaveLength(1);
    expect(store.getState().notice?.text).toMatch(/^Redone in step 4, Plots: /);
  });

  it('covers any action that changes the plots’ field state, without knowing the action', () => {
    const store = designedStore();
    const victim = primary(store, 'Heath');
    plotReject(store, victim.plot_id, 'Unsafe to reach');
    plotRestore(store, victim.plot_id);
    expect(historyNext(store, 'undo')?.text).toContain(`${victim.plot_id} restored`);
    historyUndo(store);
    expect(plotRejections(store.getState().result!)).toHaveLength(1);
    historyUndo(store);
    expect(plotRejections(store.getState().result!)).toHaveLength(0);
  });

  it('undoes a design setting on the Design step and names the setting', () => {
    const store = plannerStoreCreate(designSettingsDefault({ spacingM: 40 }));
    stratumPartAdd(store, 'Heath', box(150, -35, 150.004, -34.996));
    designSettingsSet(store, { spacingM: 50 });
    historyUndo(store);
    expect(store.getState().design.spacingM).toBe(40);
    expect(store.getState().site.parts).toHaveLength(1);
    expect(store.getState().step).toBe('design');
    expect(store.getState().notice?.text).toBe('Undone in step 3, Design: minimum spacing 40 → 50.');
  });

  it('brings back the earlier design and its field decisions when a new design is undone', () => {
    const store = designedStore();
    plotReject(store, primary(store, 'Heath').plot_id, 'Unsafe to reach');
    const kept = store.getState().result;
    designSettingsSet(store, { seed: 12 });
    const s = store.getState();
    designResultSet(store, designRun(s.site, s.design));
    expect(plotRejections(store.getState().result!)).toHaveLength(0);
    expect(historyNext(store, 'undo')?.text).toMatch(/^made a design of 6 primary plots and 4 reserves$/);
    historyUndo(store);
    expect(store.getState().result).toBe(kept);
    expect(plotRejections(store.getState().result!)).toHaveLength(1);
  });

  it('names site edits on their steps: strata on step 1, exclusions on step 2', () => {
    const store = plannerStoreCreate(designSettingsDefault());
    stratumPartAdd(store, 'Heath', box(150, -35, 150.004, -34.996));
    expect(historyNext(store, 'undo')).toEqual({ text: 'added stratum “Heath”', step: 'strata' });
    stratumPartAdd(store, 'Heath', box(150.004, -35, 150.008, -34.996));
    expect(historyNext(store, 'undo')?.text).toBe('added a feature to “Heath”');
    stratumRename(store, 'Heath', 'Low heath');
    expect(historyNext(store, 'undo')?.text).toBe('renamed stratum “Heath” to “Low heath”');
    exclusionAdd(store, 'cliff', { type: 'LineString', coordinates: [[150, -35], [150.004, -35]] }, 'Cliff edge');
    expect(historyNext(store, 'undo')).toEqual({ text: 'added exclusion “Cliff edge”', step: 'exclusions' });
  });

  it('keeps the view out of the history: tool, selection, messages and step are no undo steps', () => {
    const store = plannerStoreCreate(designSettingsDefault());
    store.setState({ tool: 'stratum', selection: { kind: 'plot', id: 'X' }, notice: { tone: 'info', text: 'hello' }, step: 'design' });
    expect(store.temporal.getState().pastStates).toHaveLength(0);
    expect(historyUndo(store)).toBe(false);
  });
});

describe('replacing the plan', () => {
  const demo: PlanFile = planFileOf({ ...siteEmpty('Other site (invented)'), strata: [] }, designSettingsDefault({ plots: 99 }));

  it('is one undo step that brings back the site, design, plots, field decisions and Results work', () => {
    const store = designedStore();
    plotReject(store, primary(store, 'Heath').plot_id, 'Unsafe to reach');
    const results = resultsStoreCreate();
    const csv = 'plot_id,cover\nHEA-01,12\n';
    resultsLoad(results, 'cover.csv', csv, store.getState().result);
    const before = store.getState();
    planReplace(store, demo, designSettingsDefault(), 'the invented demo site', true, results);
    expect(store.getState().site.name).toBe('Other site (invented)');
    expect(results.getState().fileName).toBeNull();
    expect(store.temporal.getState().pastStates.length).toBeGreaterThan(0);
    expect(historyNext(store, 'undo')).toEqual({ text: 'opened the invented demo site', step: null });
    historyUndo(store, results);
    const after = store.getState();
    expect(after.site).toBe(before.site);
    expect(after.design).toBe(before.design);
    expect(after.result).toBe(before.result);
    expect(results.getState().fileName).toBe('cover.csv');
    expect(after.notice?.text).toBe('Undone: opened the invented demo site. The plan you had before is back.');
    historyRedo(store, results);
    expect(store.getState().site.name).toBe('Other site (invented)');
    expect(results.getState().fileName).toBeNull();
  });
});
