import type { FeatureCollection, Geometry } from 'geojson';
import { describe, expect, it } from 'vitest';
import { DEFAULT_BUFFER_M } from '../../core/model/types';
import { exclusionsFromFeatures } from './exclusionsFromFeatures';

const pt: Geometry = { type: 'Point', coordinates: [150, -35] };
const fc = (props: Record<string, unknown>[], geometry: Geometry = pt): FeatureCollection => ({
  type: 'FeatureCollection',
  features: props.map((p) => ({ type: 'Feature', properties: p, geometry })),
});

describe('exclusionsFromFeatures', () => {
  it('reads kinds, synonyms, buffers, names and notes', () => {
    const ex = exclusionsFromFeatures(fc([{ kind: 'Cliff edge', buffer_m: 20, name: 'North bluff', notes: 'loose rock' }, { kind: 'RIVER' }, { kind: 'hazard', buffer_m: '5' }]), { fileName: 'x.geojson' });
    expect(ex.map((e) => e.kind)).toEqual(['cliff', 'water', 'hazard']);
    expect(ex.map((e) => e.bufferM)).toEqual([20, DEFAULT_BUFFER_M.water, 5]);
    expect(ex[0].name).toBe('North bluff');
    expect(ex[0].notes).toBe('loose rock');
    expect(ex.map((e) => e.id)).toEqual(['X1', 'X2', 'X3']);
  });

  it('names the feature and the allowed kinds for an unknown kind', () => {
    expect(() => exclusionsFromFeatures(fc([{ kind: 'cliff' }, { kind: 'volcano' }]), { fileName: 'x.geojson' })).toThrow(
      'x.geojson: feature 1: unknown kind "volcano"; allowed kinds: cliff, water, private, hazard, other',
    );
    expect(() => exclusionsFromFeatures(fc([{}]), { fileName: 'x.geojson' })).toThrow('x.geojson: feature 0 has no kind');
  });

  it('rejects negative and non-numeric buffers', () => {
    expect(() => exclusionsFromFeatures(fc([{ kind: 'water', buffer_m: -3 }]), { fileName: 'x' })).toThrow('x: feature 0: buffer_m -3 is negative');
    expect(() => exclusionsFromFeatures(fc([{ kind: 'water', buffer_m: 'ten' }]), { fileName: 'x' })).toThrow('x: feature 0: buffer_m "ten" is not a number of metres');
  });

  it('rejects geometry collections', () => {
    const g: Geometry = { type: 'GeometryCollection', geometries: [pt] };
    expect(() => exclusionsFromFeatures(fc([{ kind: 'water' }], g), { fileName: 'x' })).toThrow('x: feature 0 is a GeometryCollection');
  });
});

