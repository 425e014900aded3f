import { describe, expect, it } from 'vitest';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { parsePlotFile } from './parsePlotFile';

const good = plotCollectionInvented([{ key: 'Coastal heath', code: 'HEA', primaries: 2, reserves: 1, mappedM2: 1e4, usableM2: 9e3 }]);

describe('parsePlotFile', () => {
  it('reads a plot file back as written', () => {
    expect(parsePlotFile('p.geojson', JSON.stringify(good))).toEqual(good);
  });

  it('says what is wrong and where', () => {
    expect(() => parsePlotFile('p.geojson', '{')).toThrow(/^p\.geojson: not valid JSON/);
    expect(() => parsePlotFile('p.geojson', '{"type":"Feature"}')).toThrow('p.geojson: not a GeoJSON FeatureCollection of plots');
    expect(() => parsePlotFile('p.geojson', '{"type":"FeatureCollection","features":[]}')).toThrow('p.geojson: no "design" summary');
    const bad = structuredClone(good) as unknown as { features: { properties: Record<string, unknown> }[] };
    bad.features[1].properties.role = 'spare';
    expect(() => parsePlotFile('p.geojson', JSON.stringify(bad))).toThrow('p.geojson: feature 1 (HEA-02) has role "spare"; expected primary or reserve');
    delete bad.features[0].properties.stratum;
    expect(() => parsePlotFile('p.geojson', JSON.stringify(bad))).toThrow('p.geojson: feature 0 has no stratum');
  });

  it('keeps the visit record a crew left and names a damaged one', () => {
    const walked = structuredClone(good);
    Object.assign(walked.features[0].properties, { visited_at: '2026-12-03T01:00:00Z', visited_by: 'Crew A (invented)', visit_lon: 119.1, visit_lat: -34.4, visit_accuracy_m: 4, field_values: { cover: '35' }, crew_note: 'dry' });
    expect(parsePlotFile('p.geojson', JSON.stringify(walked))).toEqual(walked);
    const bad = structuredClone(walked) as unknown as { features: { properties: Record<string, unknown> }[] };
    bad.features[0].properties.visit_accuracy_m = -2;
    expect(() => parsePlotFile('p.geojson', JSON.stringify(bad))).toThrow('p.geojson: feature 0 (HEA-01): visit_accuracy_m -2 is out of range');
    bad.features[0].properties.visit_accuracy_m = 4;
    bad.features[0].properties.field_values = ['35'];
    expect(() => parsePlotFile('p.geojson', JSON.stringify(bad))).toThrow('p.geojson: feature 0 (HEA-01): field_values must be an object of measurements by variable name');
  });
});
