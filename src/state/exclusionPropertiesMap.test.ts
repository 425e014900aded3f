import type { FeatureCollection } from 'geojson';
import { describe, expect, it } from 'vitest';
import { exclusionsFromFeatures } from '../io/site/exclusionsFromFeatures';
import { exclusionMappingGuess, exclusionPropertiesMap } from './exclusionPropertiesMap';

// Invented exclusion features; attribute names as another tool might have written them.
const fc: FeatureCollection = {
  type: 'FeatureCollection',
  features: [
    { type: 'Feature', properties: { feat_class: 'River', setback: 25, name: 'Big creek' }, geometry: { type: 'LineString', coordinates: [[150, -35], [150.01, -35]] } },
    { type: 'Feature', properties: { feat_class: 'cliff edge', setback: '' }, geometry: { type: 'LineString', coordinates: [[150, -35.01], [150.01, -35.01]] } },
  ],
};

describe('mapping exclusion attributes to kinds and buffers', () => {
  it('reads kinds and buffers from the attributes chosen, with blank buffers taking the kind default', () => {
    const mapped = exclusionPropertiesMap(fc, { kind: { attribute: 'feat_class' }, buffer: { attribute: 'setback' } }, 'x.geojson');
    const out = exclusionsFromFeatures(mapped, { fileName: 'x.geojson' });
    // Default cliff buffer 15 m: DEFAULT_BUFFER_M (common practice, no source).
    expect(out.map((e) => [e.kind, e.bufferM, e.name])).toEqual([['water', 25, 'Big creek'], ['cliff', 15, undefined]]);
    expect(fc.features[0].properties?.kind).toBeUndefined();
  });

  it('gives one kind and one buffer to every feature when asked', () => {
    const mapped = exclusionPropertiesMap(fc, { kind: { every: 'private' }, buffer: { everyM: 5 } }, 'x.geojson');
    expect(exclusionsFromFeatures(mapped, { fileName: 'x.geojson' }).map((e) => [e.kind, e.bufferM])).toEqual([['private', 5], ['private', 5]]);
  });

  it('replaces buffer_m from the file by each kind’s default when that is chosen', () => {
    const withBuffer: FeatureCollection = { ...fc, features: fc.features.map((f) => ({ ...f, properties: { ...f.properties, buffer_m: 99 } })) };
    const mapped = exclusionPropertiesMap(withBuffer, { kind: { every: 'hazard' }, buffer: 'kind-default' }, 'x.geojson');
    // Default hazard buffer 30 m: DEFAULT_BUFFER_M (common practice, no source).
    expect(exclusionsFromFeatures(mapped, { fileName: 'x.geojson' }).map((e) => e.bufferM)).toEqual([30, 30]);
  });

  it('names the file and the attributes present when the chosen attribute is missing', () => {
    expect(() => exclusionPropertiesMap(fc, { kind: { attribute: 'kind' }, buffer: 'kind-default' }, 'x.geojson')).toThrow(
      'x.geojson: no feature has the attribute "kind"; attributes are: feat_class, setback, name',
    );
  });

  it('refuses a negative buffer for every feature', () => {
    expect(() => exclusionPropertiesMap(fc, { kind: { every: 'water' }, buffer: { everyM: -1 } }, 'x.geojson')).toThrow(/0 or more metres, got -1/);
  });

  it('leaves an unknown kind for the reader to report with the feature index', () => {
    const mapped = exclusionPropertiesMap(fc, { kind: { attribute: 'name' }, buffer: 'kind-default' }, 'x.geojson');
    expect(() => exclusionsFromFeatures(mapped, { fileName: 'x.geojson' })).toThrow(/x\.geojson: feature 0: unknown kind "Big creek"/);
  });

  it('guesses kind and buffer_m attributes first, and the default buffer when there is no buffer attribute', () => {
    expect(exclusionMappingGuess(['id', 'kind', 'buffer_m'])).toEqual({ kind: { attribute: 'kind' }, buffer: { attribute: 'buffer_m' } });
    expect(exclusionMappingGuess(['id', 'label'])).toEqual({ kind: null, buffer: 'kind-default' });
  });
});
