import { describe, expect, it } from 'vitest';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import { plotCollectionInvented } from '../core/field/plotCollectionInvented';
import { type AutosaveStorage, autosaveRestore, autosaveStart } from './autosave';
import { fieldEntrySave, fieldSetupSet, fieldVisit, fieldVisitClear } from './fieldActions';
import { planFileApply, planFileFromState, planFileParse } from './planFile';
import { planFromPlotFile } from './planFromPlotFile';
import { plannerStoreCreate } from './plannerStore';
import { plotReject } from './plotReject';
import { planChangeDescribe } from './planChangeDescribe';
import { type PlannerPlan, plannerPlanOf } from './plannerStore';

function memoryStorage(): AutosaveStorage {
  const data = new Map<string, unknown>();
  return { get: async (k) => data.get(k), set: async (k, v) => void data.set(k, v) };
}

/** A store holding an invented plot file opened in the field view. */
function fieldStore() {
  const plots = plotCollectionInvented([
    { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 2, mappedM2: 50_000, usableM2: 48_000 },
    { key: 'Banksia scrub', code: 'BAN', primaries: 3, reserves: 1, mappedM2: 30_000, usableM2: 30_000 },
  ]);
  const store = plannerStoreCreate(designSettingsDefault());
  planFileApply(store, planFromPlotFile(plots, 'invented-plots.geojson'), designSettingsDefault(), false);
  return { store, plots };
}

const plotOf = (store: ReturnType<typeof fieldStore>['store'], id: string) => store.getState().result!.features.find((f) => f.properties.plot_id === id)!.properties;

describe('field actions', () => {
  it('opens a plot file with its strata named as the plots name them', () => {
    const { store, plots } = fieldStore();
    const names = [...new Set(plots.features.map((f) => f.properties.stratum))].sort();
    expect(store.getState().site.strata.map((s) => s.label).sort()).toEqual(names);
    expect(store.getState().site.name).toBe('invented-plots');
    expect(store.getState().site.exclusions).toEqual([]);
  });

  it('records a visit by the crew, its entries, and takes the visit back, each an undo step', () => {
    const { store, plots } = fieldStore();
    const id = plots.features.find((f) => f.properties.role === 'primary')!.properties.plot_id;
    fieldSetupSet(store, { crew: 'Crew B (invented)', variables: [{ name: 'cover', kind: 'percent' }] });
    fieldVisit(store, id, { lon: 1, lat: 2, accuracyM: 5, atIso: '2026-12-03T02:00:00Z' }, '2026-12-03T02:00:01Z');
    fieldEntrySave(store, id, { cover: '40' }, 'dry');
    const past = store.temporal.getState().pastStates as PlannerPlan[];
    expect(planChangeDescribe(past[past.length - 1], plannerPlanOf(store.getState())).text).toBe(`entries for ${id}`);
    expect(planChangeDescribe(past[past.length - 2], past[past.length - 1]).text).toBe(`${id} visited`);
    expect(plotOf(store, id)).toMatchObject({ visited_at: '2026-12-03T02:00:01Z', visited_by: 'Crew B (invented)', visit_accuracy_m: 5, field_values: { cover: '40' }, crew_note: 'dry' });
    const steps = store.temporal.getState().pastStates.length;
    fieldEntrySave(store, id, { cover: '40' }, 'dry');
    expect(store.temporal.getState().pastStates.length).toBe(steps);
    store.temporal.getState().undo();
    expect(plotOf(store, id).field_values).toBeUndefined();
    fieldVisitClear(store, id);
    expect(plotOf(store, id).visited_at).toBeUndefined();
  });

  it('refuses a bad setup and leaves the setup as it was', () => {
    const { store } = fieldStore();
    expect(() => fieldSetupSet(store, { arrivalRadiusM: 0 })).toThrow(/arrival radius/);
    expect(() => fieldSetupSet(store, { variables: [{ name: 'plot_id', kind: 'text' }] })).toThrow(/always has/);
    expect(store.getState().field.arrivalRadiusM).toBe(5);
  });

  it('keeps visits, entries, rejections and the setup through the plan file and the browser copy', async () => {
    const { store, plots } = fieldStore();
    const [a, b] = plots.features.filter((f) => f.properties.role === 'primary').map((f) => f.properties.plot_id);
    fieldSetupSet(store, { crew: 'Crew B (invented)', variables: [{ name: 'cover', kind: 'percent' }], arrivalRadiusM: 8 });
    fieldVisit(store, a, null, '2026-12-03T02:00:00Z');
    fieldEntrySave(store, a, { cover: '12.5' }, 'note');
    plotReject(store, b, 'Entry refused by the landholder', '2026-12-03T03:00:00Z');
    const plan = planFileParse(JSON.stringify(planFileFromState(store.getState(), '2026-12-03T04:00:00Z')), 'walked.stratplot.json');
    expect(plan.field).toEqual({ crew: 'Crew B (invented)', variables: [{ name: 'cover', kind: 'percent' }], arrivalRadiusM: 8 });
    const other = plannerStoreCreate(designSettingsDefault());
    planFileApply(other, plan, designSettingsDefault(), true);
    expect(plotOf(other, a)).toMatchObject({ visited_at: '2026-12-03T02:00:00Z', field_values: { cover: '12.5' }, crew_note: 'note' });
    expect(plotOf(other, b)).toMatchObject({ status: 'rejected', reject_reason: 'Entry refused by the landholder' });

    const storage = memoryStorage();
    const { flush } = autosaveStart(store, storage, 10);
    fieldVisit(store, plots.features.find((f) => f.properties.role === 'primary' && f.properties.plot_id !== a && f.properties.plot_id !== b)!.properties.plot_id, null);
    await flush();
    const restored = plannerStoreCreate(designSettingsDefault());
    expect(await autosaveRestore(restored, storage, designSettingsDefault())).toBe(true);
    expect(restored.getState().field.crew).toBe('Crew B (invented)');
    expect(restored.getState().result!.features.filter((f) => f.properties.visited_at).length).toBe(2);
  });

  it('names the plot, the field and the file when a plan file carries a damaged visit or setup', () => {
    const { store, plots } = fieldStore();
    const doc = planFileFromState(store.getState(), '2026-12-03T04:00:00Z');
    const text = (mutate: (d: typeof doc) => void) => {
      const d = JSON.parse(JSON.stringify(doc));
      mutate(d);
      return JSON.stringify(d);
    };
    const id = plots.features[0].properties.plot_id;
    expect(() => planFileParse(text((d) => Object.assign(d.result!.features[0].properties, { visited_at: 'yesterday' })), 'p.json')).toThrow(`p.json: feature 0 (${id}): visited_at "yesterday" is not a date`);
    expect(() => planFileParse(text((d) => Object.assign(d.result!.features[0].properties, { visit_lat: 123 })), 'p.json')).toThrow(/visit_lat 123 is out of range/);
    expect(() => planFileParse(text((d) => Object.assign(d.result!.features[0].properties, { field_values: { cover: 5 } })), 'p.json')).toThrow(/field_values "cover" must be text/);
    expect(() => planFileParse(text((d) => Object.assign(d, { field: { arrivalRadiusM: -1 } })), 'p.json')).toThrow(/p.json: field.arrivalRadiusM must be a distance/);
    expect(() => planFileParse(text((d) => Object.assign(d, { field: { variables: [{ name: 'a', kind: 'x' }] } })), 'p.json')).toThrow(/p.json: field, variable 1 \("a"\): kind "x"/);
  });
});
