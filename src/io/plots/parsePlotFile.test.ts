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
});
