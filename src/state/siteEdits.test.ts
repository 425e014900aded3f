import type { Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../core/geo/polygonAreaM2';
import { historyRedo, historyUndo, selectionRemove } from './historyActions';
import { plannerStoreCreate } from './plannerStore';
import { stratumHoleCut, stratumPartAddBeside } from './strataClipActions';
import { strataMerge, stratumPartAdd, stratumRecode, stratumRecolour, stratumRename } from './strataActions';
import { exclusionAdd, exclusionUpdate } from './exclusionActions';
import { TEST_DESIGN } from './testDesign';

const box = (w: number, s: number, e: number, n: number): Polygon => ({
  type: 'Polygon',
  coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]],
});

describe('site edits in the planner store', () => {
  it('adds a stratum with a derived code and a palette colour when the first feature is drawn', () => {
    const store = plannerStoreCreate(TEST_DESIGN);
    stratumPartAdd(store, 'Coastal heath', box(150, -35, 150.001, -34.999));
    const { site } = store.getState();
    expect(site.strata).toEqual([{ key: 'Coastal heath', label: 'Coastal heath', code: 'COH', colour: '#cc6677' }]);
    expect(site.parts).toHaveLength(1);
    expect(store.getState().selection).toEqual({ kind: 'part', id: site.parts[0].id });
  });

  it('undoes and redoes each edit as one step', () => {
    const store = plannerStoreCreate(TEST_DESIGN);
    stratumPartAdd(store, 'Heath', box(150, -35, 150.001, -34.999));
    stratumRename(store, 'Heath', 'Low heath');
    expect(store.getState().site.strata[0].label).toBe('Low heath');
    expect(historyUndo(store)).toBe(true);
    expect(store.getState().site.strata[0].label).toBe('Heath');
    expect(historyRedo(store)).toBe(true);
    expect(store.getState().site.strata[0].label).toBe('Low heath');
    historyUndo(store);
    historyUndo(store);
    // Adding the first feature of a new stratum was one step: both are gone together.
    expect(store.getState().site.parts).toHaveLength(0);
    expect(store.getState().site.strata).toHaveLength(0);
    expect(historyUndo(store)).toBe(false);
  });

  it('clips a stratum drawn next to another so the two share an edge and do not overlap', () => {
    const store = plannerStoreCreate(TEST_DESIGN);
    const a = box(150, -35, 150.002, -34.998);
    stratumPartAdd(store, 'Heath', a);
    // The second box overlaps the first by half its width.
    stratumPartAddBeside(store, 'Marsh', box(150.001, -35, 150.003, -34.998));
    const [first, second] = store.getState().site.parts;
    const areaFirst = polygonAreaM2(first.geometry);
    const areaSecond = polygonAreaM2(second.geometry);
    const areaUnion = polygonAreaM2(box(150, -35, 150.003, -34.998));
    // Areas of parts sum to the whole (invariant; WGS84 geodesic areas from polygonAreaM2).
    expect(areaFirst + areaSecond).toBeCloseTo(areaUnion, 3);
    const xs = (second.geometry as Polygon).coordinates[0].map((p) => p[0]);
    expect(Math.min(...xs)).toBeCloseTo(150.002, 9);
  });

  it('cuts a hole through a stratum feature and refuses a hole that touches no stratum', () => {
    const store = plannerStoreCreate(TEST_DESIGN);
    stratumPartAdd(store, 'Woodland', box(150, -35, 150.004, -34.996));
    const before = polygonAreaM2(store.getState().site.parts[0].geometry);
    const hole = box(150.001, -34.999, 150.002, -34.998);
    expect(stratumHoleCut(store, hole)).toBe(1);
    const part = store.getState().site.parts[0];
    expect((part.geometry as Polygon).coordinates).toHaveLength(2);
    expect(polygonAreaM2(part.geometry)).toBeCloseTo(before - polygonAreaM2(hole), 3);
    expect(() => stratumHoleCut(store, box(151, -35, 151.001, -34.999))).toThrow(/does not overlap any stratum/);
  });

  it('merges one stratum into another, moving its features', () => {
    const store = plannerStoreCreate(TEST_DESIGN);
    stratumPartAdd(store, 'Heath', box(150, -35, 150.001, -34.999));
    stratumPartAdd(store, 'Scrub', box(150.001, -35, 150.002, -34.999));
    strataMerge(store, 'Scrub', 'Heath');
    const { site } = store.getState();
    expect(site.strata.map((s) => s.key)).toEqual(['Heath']);
    expect(site.parts.every((p) => p.stratum === 'Heath')).toBe(true);
  });

  it('rejects a bad colour, a clashing code and a negative buffer with messages that say what is wrong', () => {
    const store = plannerStoreCreate(TEST_DESIGN);
    stratumPartAdd(store, 'Heath', box(150, -35, 150.001, -34.999));
    stratumPartAdd(store, 'Scrub', box(150.001, -35, 150.002, -34.999));
    expect(() => stratumRecolour(store, 'Heath', 'red')).toThrow('stratum "Heath": colour "red" is not #rrggbb');
    expect(() => stratumRecode(store, 'Scrub', 'hea')).toThrow('code HEA is already used by stratum "Heath"');
    // Files name strata by name, so two strata never go by one name (nor one by another's id).
    expect(() => stratumRename(store, 'Scrub', 'Heath')).toThrow('another stratum is already called "Heath"; choose a name of its own');
    stratumRename(store, 'Heath', 'Low heath');
    expect(() => stratumRename(store, 'Scrub', 'Heath')).toThrow('another stratum is already called "Heath"');
    const id = exclusionAdd(store, 'cliff', { type: 'LineString', coordinates: [[150, -35], [150.001, -35]] });
    expect(store.getState().site.exclusions[0].bufferM).toBe(15);
    expect(() => exclusionUpdate(store, id, { bufferM: -1 })).toThrow(`exclusion ${id}: buffer must be a number of metres, 0 or more`);
  });

  it('deletes the selected feature and can bring it back with undo', () => {
    const store = plannerStoreCreate(TEST_DESIGN);
    exclusionAdd(store, 'hazard', { type: 'Point', coordinates: [150, -35] });
    expect(selectionRemove(store)).toBe(true);
    expect(store.getState().site.exclusions).toHaveLength(0);
    historyUndo(store);
    expect(store.getState().site.exclusions).toHaveLength(1);
  });
});
