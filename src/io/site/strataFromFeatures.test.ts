import type { FeatureCollection, Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { STRATUM_PALETTE, strataFromFeatures } from './strataFromFeatures';
import { stratumCodeDerive } from './stratumCodeDerive';

const sq = (x: number): Polygon => ({ type: 'Polygon', coordinates: [[[x, 0], [x + 1, 0], [x + 1, 1], [x, 1], [x, 0]]] });
const fc = (props: Record<string, unknown>[]): FeatureCollection => ({
  type: 'FeatureCollection',
  features: props.map((p, i) => ({ type: 'Feature', properties: p, geometry: sq(i) })),
});

describe('strataFromFeatures', () => {
  it('groups features by the stratum field and derives codes and palette colours', () => {
    const { strata, parts } = strataFromFeatures(fc([{ stratum: 'Coastal heath' }, { stratum: 'Dune swale' }, { stratum: 'Coastal heath' }]), { fileName: 's.geojson' });
    expect(strata.map((s) => s.key)).toEqual(['Coastal heath', 'Dune swale']);
    expect(strata.map((s) => s.code)).toEqual(['COH', 'DUS']);
    expect(strata.map((s) => s.colour)).toEqual([STRATUM_PALETTE[0], STRATUM_PALETTE[1]]);
    expect(parts.map((p) => p.id)).toEqual(['COH-1', 'DUS-1', 'COH-2']);
  });

  it('takes label, code and colour from properties and honours another field', () => {
    const { strata } = strataFromFeatures(fc([{ veg: 'W1', label: 'Woodland', code: 'wdl', color: '#ABC' }]), { fileName: 's.geojson', field: 'veg' });
    expect(strata[0]).toEqual({ key: 'W1', label: 'Woodland', code: 'WDL', colour: '#aabbcc' });
  });

  it('lists the fields that exist when the field is unknown', () => {
    expect(() => strataFromFeatures(fc([{ habitat: 'a', area: 1 }]), { fileName: 's.geojson' })).toThrow(
      's.geojson: no feature has the field "stratum"; fields present: habitat, area',
    );
  });

  it('names a feature that is not a polygon', () => {
    const bad: FeatureCollection = { type: 'FeatureCollection', features: [...fc([{ stratum: 'a' }]).features, { type: 'Feature', properties: { stratum: 'a' }, geometry: { type: 'Point', coordinates: [0, 0] } }] };
    expect(() => strataFromFeatures(bad, { fileName: 's.geojson' })).toThrow('s.geojson: feature 1 is a Point; strata must be Polygon or MultiPolygon features');
  });

  it('refuses a file with no features', () => {
    expect(() => strataFromFeatures({ type: 'FeatureCollection', features: [] }, { fileName: 'e.geojson' })).toThrow('e.geojson: no polygons');
  });

  it('names a feature without a stratum value', () => {
    expect(() => strataFromFeatures(fc([{ stratum: 'a' }, { stratum: '' }]), { fileName: 's.geojson' })).toThrow('s.geojson: feature 1 has no value in the field "stratum"');
  });

  it('rejects conflicting codes and bad colours', () => {
    expect(() => strataFromFeatures(fc([{ stratum: 'a', code: 'X' }, { stratum: 'a', code: 'Y' }]), { fileName: 's' })).toThrow(/feature 1 gives stratum "a" the code "Y"/);
    expect(() => strataFromFeatures(fc([{ stratum: 'a', code: 'X' }, { stratum: 'b', code: 'X' }]), { fileName: 's' })).toThrow('s: strata "a" and "b" both have the code "X"');
    expect(() => strataFromFeatures(fc([{ stratum: 'a', colour: 'red' }]), { fileName: 's' })).toThrow('s: feature 0: colour "red" is not a #rrggbb colour');
  });

  it('keeps unique feature ids and replaces duplicated ones', () => {
    const c = fc([{ stratum: 'a', id: 'p1' }, { stratum: 'a', id: 'p2' }, { stratum: 'b', id: 'p2' }]);
    expect(strataFromFeatures(c, { fileName: 's' }).parts.map((p) => p.id)).toEqual(['p1', 'AXX-2', 'BXX-1']);
  });
});

describe('stratumCodeDerive', () => {
  it('makes three-letter codes from one, two or three words and avoids clashes', () => {
    expect(stratumCodeDerive('Heath', new Set())).toBe('HEA');
    expect(stratumCodeDerive('Érable grove', new Set())).toBe('ERG');
    expect(stratumCodeDerive('Tall open forest', new Set())).toBe('TOF');
    expect(stratumCodeDerive('Heathland', new Set(['HEA']))).toBe('HE2');
  });
});
