import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import { polygonAreaM2 } from '../core/geo/polygonAreaM2';
import { drawFinish } from './drawFinish';
import { importExclusions, importFieldGuess, importRead, importStrata } from './importActions';
import { plannerStoreCreate } from './plannerStore';

const enc = (o: unknown) => new TextEncoder().encode(JSON.stringify(o));
const ring: [number, number][] = [[150, -35], [150.002, -35], [150.002, -34.998], [150, -34.998], [150, -35]];

describe('importing files and finishing drawings', () => {
  it('offers the attribute that names strata and adds the features by it', async () => {
    const bytes = enc({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: { id: 3, habitat: 'Heath' }, geometry: { type: 'Polygon', coordinates: [ring] } }] });
    const preview = await importRead('veg.geojson', bytes);
    expect(preview.polygons).toBe(1);
    expect(importFieldGuess(preview.polygonFields)).toBe('habitat');
    const store = plannerStoreCreate(designSettingsDefault());
    importStrata(store, preview, 'habitat');
    expect(store.getState().site.strata.map((s) => s.key)).toEqual(['Heath']);
    expect(store.getState().strataField).toBe('habitat');
    // A second file's first stratum would get the same first palette colour: it is moved along.
    const again = await importRead('more.geojson', enc({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: { habitat: 'Marsh' }, geometry: { type: 'Polygon', coordinates: [ring] } }] }));
    importStrata(store, again, 'habitat');
    const [a, b] = store.getState().site.strata;
    expect(a.colour).not.toBe(b.colour);
  });

  it('passes on the reader’s message naming the file and feature for a wrong field or kind', async () => {
    const store = plannerStoreCreate(designSettingsDefault());
    const strata = await importRead('veg.geojson', enc({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: { habitat: 'Heath' }, geometry: { type: 'Polygon', coordinates: [ring] } }] }));
    expect(() => importStrata(store, strata, 'stratum')).toThrow(/veg\.geojson: no feature has the field "stratum"; fields present: habitat/);
    const excl = await importRead('x.geojson', enc({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: { kind: 'lava' }, geometry: { type: 'Point', coordinates: [150, -35] } }] }));
    expect(() => importExclusions(store, excl)).toThrow(/x\.geojson.*feature 0/);
  });

  it('adds exclusions with kinds and buffers mapped from the file’s own attributes, in one undo step', async () => {
    const store = plannerStoreCreate(designSettingsDefault());
    const bytes = enc({
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', properties: { what: 'Creek', gap: 12 }, geometry: { type: 'LineString', coordinates: [[150, -35], [150.002, -35]] } },
        { type: 'Feature', properties: { what: 'shaft', gap: null }, geometry: { type: 'Point', coordinates: [150.001, -35.001] } },
      ],
    });
    const preview = await importRead('invented-hazards.geojson', bytes);
    expect(preview.fields).toEqual(['what', 'gap']);
    expect(importExclusions(store, preview, { kind: { attribute: 'what' }, buffer: { attribute: 'gap' } })).toBe(2);
    // Hazard default 30 m: DEFAULT_BUFFER_M (common practice, no source).
    expect(store.getState().site.exclusions.map((e) => [e.kind, e.bufferM])).toEqual([['water', 12], ['hazard', 30]]);
    store.temporal.getState().undo();
    expect(store.getState().site.exclusions).toEqual([]);
  });

  it('turns a drawn polygon into a new stratum and a drawn line into a cliff with its 15 m default buffer', () => {
    const store = plannerStoreCreate(designSettingsDefault());
    drawFinish(store, 'stratum', { type: 'Polygon', coordinates: [ring] });
    const part = store.getState().site.parts[0];
    expect(part.stratum).toBe('Stratum 1');
    // Reference: GeographicLib's JavaScript port (geographiclib-geodesic 2.2), geodesic polygon on WGS84.
    const poly = geodesic.Geodesic.WGS84.Polygon(false);
    for (const [lon, lat] of ring.slice(0, -1)) poly.AddPoint(lat, lon);
    // (ring positions are [lon, lat] pairs)
    expect(polygonAreaM2(part.geometry)).toBeCloseTo(Math.abs(poly.Compute(false, true).area ?? Number.NaN), 2);
    drawFinish(store, 'cliff', { type: 'LineString', coordinates: [[150, -35], [150.002, -35]] });
    expect(store.getState().site.exclusions[0]).toMatchObject({ kind: 'cliff', bufferM: 15 });
    expect(() => drawFinish(store, 'hazard', { type: 'LineString', coordinates: [[150, -35], [150.002, -35]] })).toThrow('the hazard tool draws a Point, not a LineString');
  });
});
