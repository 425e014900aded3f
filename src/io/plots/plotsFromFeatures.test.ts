import type { FeatureCollection } from 'geojson';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../core/common/InputError';
import { plotsFromFeatures } from './plotsFromFeatures';

const point = (lon: number, lat: number, properties: Record<string, unknown> = {}, id?: string) => ({ type: 'Feature' as const, id, properties, geometry: { type: 'Point' as const, coordinates: [lon, lat] } });

describe('plotsFromFeatures', () => {
  it('keeps each plot id or name from the file, whatever its letter case, else the feature id, else where it is', () => {
    const fc: FeatureCollection = {
      type: 'FeatureCollection',
      features: [point(119.1, -34.4, { Plot_ID: 'HEA-01' }), point(119.2, -34.4, { name: 'Waypoint 7' }), point(119.3, -34.4, {}, 'f-3'), point(119.4, -34.4, { note: 'no id' })],
    };
    expect(plotsFromFeatures(fc, { fileName: 'x.geojson' }).plots.map((p) => [p.id, p.where])).toEqual([
      ['HEA-01', 'feature 0'],
      ['Waypoint 7', 'feature 1'],
      ['f-3', 'feature 2'],
      ['feature 3', 'feature 3'],
    ]);
    expect(plotsFromFeatures(fc, { fileName: 'x.csv' }).plots[3].where).toBe('row 4');
    expect(plotsFromFeatures(fc, { fileName: 'x.geojson', idField: 'note' }).plots.map((p) => p.id)).toEqual(['feature 0', 'feature 1', 'f-3', 'no id']);
  });

  it('leaves out lines, polygons and the access points and exclusions stratplot writes beside plots, and says so', () => {
    const fc: FeatureCollection = {
      type: 'FeatureCollection',
      features: [
        point(119.1, -34.4, { plot_id: 'BAN-01', role: 'reserve', status: 'promoted', replaces: 'BAN-02' }),
        point(119.2, -34.4, { access_id: 'gate', name: 'Gate' }),
        point(119.3, -34.4, { exclusion_id: 'shaft', kind: 'hazard' }),
        { type: 'Feature', properties: { name: 'track' }, geometry: { type: 'LineString', coordinates: [[119, -34], [119.1, -34]] } },
      ],
    };
    const r = plotsFromFeatures(fc, { fileName: 'field.gpx' });
    expect(r.plots).toEqual([{ id: 'BAN-01', where: 'feature 0', lon: 119.1, lat: -34.4, role: 'reserve', status: 'promoted', replaces: 'BAN-02' }]);
    expect(r.warnings).toEqual(['field.gpx: 1 line or polygon feature was not read: plots are points', 'field.gpx: 2 access point or exclusion features were not read as plots']);
  });

  it('gives each point of a MultiPoint its own plot, and refuses a file without points or an unknown id field', () => {
    const multi: FeatureCollection = { type: 'FeatureCollection', features: [{ type: 'Feature', properties: { id: 'G' }, geometry: { type: 'MultiPoint', coordinates: [[1, 2], [3, 4]] } }] };
    expect(plotsFromFeatures(multi, { fileName: 'm.geojson' }).plots.map((p) => p.id)).toEqual(['G/1', 'G/2']);
    const lines: FeatureCollection = { type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: [[1, 2], [3, 4]] } }] };
    for (const bad of [() => plotsFromFeatures(lines, { fileName: 'l.geojson' }), () => plotsFromFeatures(multi, { fileName: 'm.geojson', idField: 'plot' })]) {
      expect(bad).toThrow();
      try {
        bad();
      } catch (e) {
        expect(isInputError(e)).toBe(true);
        expect((e as Error).message).toMatch(/^(l|m)\.geojson: /);
      }
    }
  });
});
