import type { FeatureCollection, Geometry } from 'geojson';
import { describe, expect, it } from 'vitest';
import { accessFromFeatures } from './accessFromFeatures';

const pt: Geometry = { type: 'Point', coordinates: [150, -35] };
const fc = (props: Record<string, unknown>[], geometry: Geometry = pt): FeatureCollection => ({
  type: 'FeatureCollection',
  features: props.map((p) => ({ type: 'Feature', properties: p, geometry })),
});

describe('accessFromFeatures', () => {
  it('reads points with kinds, names and defaults', () => {
    const a = accessFromFeatures(fc([{ name: 'Top gate', kind: 'Gate' }, { kind: 'parking' }, {}]), { fileName: 'a.geojson' });
    expect(a.map((p) => [p.name, p.kind])).toEqual([['Top gate', 'gate'], ['Access 2', 'car_park'], ['Access 3', 'other']]);
    expect([a[0].lon, a[0].lat]).toEqual([150, -35]);
  });

  it('names a non-point feature and an unknown kind', () => {
    const line: Geometry = { type: 'LineString', coordinates: [[0, 0], [1, 1]] };
    expect(() => accessFromFeatures(fc([{}], line), { fileName: 'a' })).toThrow('a: feature 0 is a LineString; access points must be Point features');
    expect(() => accessFromFeatures(fc([{ kind: 'tunnel' }]), { fileName: 'a' })).toThrow('a: feature 0: unknown access kind "tunnel"; allowed: car_park, gate, landing, other');
  });
});
