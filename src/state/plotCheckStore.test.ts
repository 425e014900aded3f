import { describe, expect, it } from 'vitest';
import type { Site } from '../core/model/types';
import { plotCheckClear, plotCheckFileRead, plotCheckRun, plotCheckRunHere, plotCheckSettingsSet, plotCheckStoreCreate } from './plotCheckStore';

// An invented 1 km square stratum with a hazard point in its middle; no real place.
const site: Site = {
  name: 'Invented square',
  strata: [{ key: 'S', label: 'Saltbush', code: 'SAL', colour: '#336699' }],
  parts: [{ id: 's', stratum: 'S', geometry: { type: 'Polygon', coordinates: [[[140, -30], [140.01, -30], [140.01, -29.99], [140, -29.99], [140, -30]]] } }],
  exclusions: [{ id: 'h', kind: 'hazard', bufferM: 30, name: 'Open bore', geometry: { type: 'Point', coordinates: [140.005, -29.995] } }],
  access: [],
  boundary: null,
};
const enc = (t: string) => new TextEncoder().encode(t);
const design = { spacingM: 20, footprint: { shape: 'point' } as const, edgeBufferM: 0 };

describe('the plot check store', () => {
  it('reads a plots file, checks it with the design settings and keeps the report beside the site it was made for', async () => {
    const store = plotCheckStoreCreate(design, new Date('2027-05-01T00:00:00Z'));
    expect(store.getState().settings).toEqual({ spacingM: 20, footprintText: 'point', edgeBufferM: 0, surveyDate: '2027-05-01' });
    await plotCheckFileRead(store, 'waypoints.csv', enc('name,lat,lon\nnear bore,-29.995,140.0051\nfar,-29.991,140.001\n'), {}, site, plotCheckRunHere);
    const s = store.getState();
    expect(s.fileName).toBe('waypoints.csv');
    expect(s.report?.plots.map((p) => [p.id, p.ok])).toEqual([['near bore', false], ['far', true]]);
    expect(s.report?.plots[0].problems[0].text).toMatch(/^Plot near bore lies \d+\.\d m from hazard "Open bore", inside its 30 m buffer\.$/);
    expect(s.reportSite).toBe(site);
    // A larger spacing applies once checked again.
    plotCheckSettingsSet(store, { spacingM: 700 });
    await plotCheckRun(store, site, plotCheckRunHere);
    expect(store.getState().report?.plots[1].problems.map((p) => p.code)).toEqual(['spacing']);
    plotCheckClear(store);
    expect(store.getState().report).toBeNull();
  });

  it('asks for the coordinate columns a CSV needs, and names what is wrong with a file without losing the last check', async () => {
    const store = plotCheckStoreCreate(design);
    await plotCheckFileRead(store, 'odd.csv', enc('tag,a,b\nP1,140.004,-29.996\n'), {}, site, plotCheckRunHere);
    const pending = store.getState().pending;
    expect(pending?.needs.csvColumns).toEqual(['tag', 'a', 'b']);
    await plotCheckFileRead(store, 'odd.csv', pending!.bytes, { csvColumns: { x: 'a', y: 'b' } }, site, plotCheckRunHere, pending!.round);
    expect(store.getState().pending).toBeNull();
    expect(store.getState().report?.plots.map((p) => p.id)).toEqual(['row 1']);
    await plotCheckFileRead(store, 'lines.geojson', enc(JSON.stringify({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: [[140, -30], [140.001, -30]] } }] })), {}, site, plotCheckRunHere);
    expect(store.getState().error).toMatch(/^lines\.geojson: no point features to check as plots/);
    expect(store.getState().report?.plots).toHaveLength(1);
    plotCheckSettingsSet(store, { footprintText: 'hexagon:3' });
    await plotCheckRun(store, site, plotCheckRunHere);
    expect(store.getState().error).toMatch(/hexagon:3/);
  });
});
