import { describe, expect, it } from 'vitest';
import { designRun } from '../design/designRun';
import { designSettingsDefault } from '../design/designSettingsDefault';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { fieldNextPlot, fieldPlotOrder } from './fieldPlotOrder';
import { plotsRejectAndPromote } from './plotsRejectAndPromote';
import { plotsFieldEntry, plotsVisitClear, plotsVisitRecord } from './plotVisit';

const site = siteInventedRandom(21, 2, 1);
const design = designRun(site, designSettingsDefault({ plots: 6, reservePerStratum: 2, seed: 5 }));
const props = (c: typeof design, id: string) => c.features.find((f) => f.properties.plot_id === id)!.properties;
const primary = design.features.find((f) => f.properties.role === 'primary')!.properties;
const reserve = design.features.find((f) => f.properties.role === 'reserve')!.properties;
const fix = { lon: primary.lon, lat: primary.lat, accuracyM: 4.26, atIso: '2026-12-03T01:00:00Z' };

describe('plotsVisitRecord', () => {
  it('records the time, crew and position of a visit, and takes it back', () => {
    const visited = plotsVisitRecord(design, primary.plot_id, { atIso: '2026-12-03T01:02:03Z', by: ' Crew A (invented) ', fix });
    expect(props(visited, primary.plot_id)).toMatchObject({ visited_at: '2026-12-03T01:02:03Z', visited_by: 'Crew A (invented)', visit_lon: primary.lon, visit_lat: primary.lat, visit_accuracy_m: 4.3 });
    expect(props(design, primary.plot_id).visited_at).toBeUndefined();
    const cleared = plotsVisitClear(visited, primary.plot_id);
    expect(props(cleared, primary.plot_id)).toEqual(props(design, primary.plot_id));
  });

  it('records a visit with no position when the device has none', () => {
    const visited = plotsVisitRecord(design, primary.plot_id, { atIso: '2026-12-03T01:02:03Z', by: '', fix: null });
    expect(props(visited, primary.plot_id).visit_lat).toBeUndefined();
  });

  it('refuses waiting reserves, rejected plots, unknown plots and a time that is not a date', () => {
    const visit = { atIso: '2026-12-03T01:02:03Z', by: 'A', fix };
    expect(() => plotsVisitRecord(design, reserve.plot_id, visit)).toThrow(/waiting reserve/);
    const rejected = plotsRejectAndPromote(design, primary.plot_id, 'flooded', '2026-12-03T00:00:00Z').collection;
    expect(() => plotsVisitRecord(rejected, primary.plot_id, visit)).toThrow(/rejected/);
    expect(() => plotsVisitRecord(design, 'NOPE-1', visit)).toThrow(/no plot "NOPE-1"/);
    expect(() => plotsVisitRecord(design, primary.plot_id, { ...visit, atIso: 'soon' })).toThrow(/not a date/);
  });
});

describe('plotsFieldEntry', () => {
  it('keeps values as typed, drops blanks, and keeps the note', () => {
    const c = plotsFieldEntry(design, primary.plot_id, { values: { cover: ' 35 ', height: '' }, note: ' wet ground ' });
    expect(props(c, primary.plot_id)).toMatchObject({ field_values: { cover: '35' }, crew_note: 'wet ground' });
    const empty = plotsFieldEntry(c, primary.plot_id, { values: {}, note: '' });
    expect(props(empty, primary.plot_id).field_values).toBeUndefined();
    expect(props(empty, primary.plot_id).crew_note).toBeUndefined();
  });

  it('refuses a note beyond the length limit', () => {
    expect(() => plotsFieldEntry(design, primary.plot_id, { values: {}, note: 'x'.repeat(2001) })).toThrow(/longer than 2000/);
  });
});

describe('fieldPlotOrder and fieldNextPlot', () => {
  it('walks the plots to visit only: a rejected plot leaves the order and its promoted reserve joins it', () => {
    const plots = design.features.map((f) => f.properties);
    const order = fieldPlotOrder(plots, site.access);
    const primaries = plots.filter((p) => p.role === 'primary').map((p) => p.plot_id);
    expect([...order.ids].sort()).toEqual([...primaries].sort());
    const { collection, rejection } = plotsRejectAndPromote(design, order.ids[0], 'unsafe', '2026-12-03T00:00:00Z');
    const after = fieldPlotOrder(collection.features.map((f) => f.properties), site.access);
    expect(after.ids).not.toContain(order.ids[0]);
    expect(after.ids).toContain(rejection.replacement);
  });

  it('gives the first plot of the order not yet visited, and null when all are done', () => {
    const plots = design.features.map((f) => f.properties);
    const order = fieldPlotOrder(plots, site.access);
    const first = plotsVisitRecord(design, order.ids[0], { atIso: '2026-12-03T01:00:00Z', by: 'A', fix: null });
    expect(fieldNextPlot(order, first.features.map((f) => f.properties))).toBe(order.ids[1]);
    let all = design;
    for (const id of order.ids) all = plotsVisitRecord(all, id, { atIso: '2026-12-03T01:00:00Z', by: 'A', fix: null });
    expect(fieldNextPlot(order, all.features.map((f) => f.properties))).toBeNull();
  });
});
