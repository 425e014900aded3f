import { describe, expect, it } from 'vitest';
import { designRun } from '../core/design/designRun';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import { designResultSet, designSettingsSet } from './designActions';
import { historyUndo } from './historyActions';
import { plannerStoreCreate } from './plannerStore';
import { plotRejections } from '../core/field/plotFieldState';
import { plotReject } from './plotReject';
import { plotRestore } from './plotRestore';
import { stratumPartAdd } from './strataActions';

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

describe('design and field decisions in the planner store', () => {
  it('refuses settings that make no sense, saying which and why', () => {
    const store = plannerStoreCreate(designSettingsDefault());
    expect(() => designSettingsSet(store, { plots: 2.5 })).toThrow('number of plots must be a whole number ≥ 0, got 2.5');
    expect(() => designSettingsSet(store, { spacingM: -5 })).toThrow('minimum spacing (m) must be a number ≥ 0, got -5');
    expect(() => designSettingsSet(store, { seed: 1.5 })).toThrow('seed must be a whole number');
    designSettingsSet(store, { plots: 12 });
    expect(store.getState().design.plots).toBe(12);
  });

  it('undoes a design setting before the map edit made ahead of it', () => {
    const store = plannerStoreCreate(designSettingsDefault());
    stratumPartAdd(store, 'Heath', box(150, -35, 150.004, -34.996));
    designSettingsSet(store, { plots: 12 });
    historyUndo(store);
    expect(store.getState().site.parts).toHaveLength(1);
    expect(store.getState().design.plots).toBe(designSettingsDefault().plots);
  });

  it('promotes the rank-1 reserve of the same stratum when a primary is rejected, and keeps the decision', () => {
    const store = designedStore();
    const plots = store.getState().result!.features.map((f) => f.properties);
    const victim = plots.find((p) => p.role === 'primary' && p.stratum === 'Marsh')!;
    const reserve = plots.filter((p) => p.role === 'reserve' && p.stratum === 'Marsh').sort((a, b) => a.rank - b.rank)[0];
    const promoted = plotReject(store, victim.plot_id, 'Under water', '2026-12-01T09:00:00Z');
    expect(promoted).toBe(reserve.plot_id);
    const after = new Map(store.getState().result!.features.map((f) => [f.properties.plot_id, f.properties]));
    expect(after.get(victim.plot_id)?.status).toBe('rejected');
    expect(after.get(reserve.plot_id)).toMatchObject({ status: 'promoted', replaces: victim.plot_id });
    // The decision lives on the plots alone; the list of decisions is read from them.
    expect(plotRejections(store.getState().result!)).toEqual([{ plot_id: victim.plot_id, reason: 'Under water', replacement: reserve.plot_id, at: '2026-12-01T09:00:00Z' }]);
    expect(store.getState()).not.toHaveProperty('rejections');
  });

  it('restores a rejected plot: it is to be visited again and its reserve waits again, as before the rejection', () => {
    const store = designedStore();
    const before = store.getState().result!;
    const victim = before.features.find((f) => f.properties.role === 'primary')!.properties.plot_id;
    const promoted = plotReject(store, victim, 'Entry refused by the landholder', '2026-12-01T09:00:00Z');
    expect(plotRestore(store, victim)).toBe(promoted);
    expect(store.getState().result).toEqual(before);
    expect(JSON.stringify(store.getState().result)).toBe(JSON.stringify(before));
    expect(store.getState().notice?.text).toMatch(new RegExp(`${victim} restored`));
    expect(() => plotRestore(store, victim)).toThrow(`plot ${victim} is not rejected, so there is nothing to restore`);
  });

  it('marks the design stale when the map changes after it was made', () => {
    const store = designedStore();
    expect(store.getState().resultStale).toBe(false);
    stratumPartAdd(store, 'Scrub', box(150.008, -35, 150.01, -34.996));
    expect(store.getState().resultStale).toBe(true);
  });

  it('asks for a reason before rejecting a plot', () => {
    const store = designedStore();
    const id = store.getState().result!.features[0].properties.plot_id;
    expect(() => plotReject(store, id, '  ')).toThrow(`plot ${id}: give a reason for rejecting it`);
  });
});
