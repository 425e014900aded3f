import { describe, expect, it } from 'vitest';
import type { Site } from '../../core/model/types';
import { strataSnapIndexBuild, strataSnapNearest } from './strataSnap';

// A screen where 1 px = 1e-5 degree and north is up (a plain linear stand-in for the map's projection).
const S = 1e5;
const project = (lon: number, lat: number) => ({ x: lon * S, y: -lat * S });
const unproject = (x: number, y: number): [number, number] => [x / S, -y / S];
const boxAround = (lon: number, lat: number, px: number): [number, number, number, number] => [lon - px / S, lat - px / S, lon + px / S, lat + px / S];

const site: Site = {
  name: 'snap (invented)',
  strata: [],
  parts: [{ id: 'a', stratum: 'A', geometry: { type: 'Polygon', coordinates: [[[0, 0], [0.001, 0], [0.001, 0.001], [0, 0.001], [0, 0]]] } }],
  exclusions: [],
  access: [],
  boundary: null,
};

describe('snapping to mapped strata while drawing', () => {
  const snap = strataSnapIndexBuild(site)!;

  it('snaps to a vertex within the radius, exactly', () => {
    const at = strataSnapNearest(snap, project(0.00103, 0.00104), boxAround(0.00103, 0.00104, 10), project, unproject, 10);
    expect(at).toEqual([0.001, 0.001]);
  });

  it('snaps to the nearest point of an edge when no vertex is near', () => {
    const at = strataSnapNearest(snap, project(0.0005, 0.00004), boxAround(0.0005, 0.00004, 10), project, unproject, 10);
    expect(at?.[0]).toBeCloseTo(0.0005, 9);
    expect(at?.[1]).toBeCloseTo(0, 9);
  });

  it('leaves the pointer alone farther than the radius from every edge', () => {
    expect(strataSnapNearest(snap, project(0.0005, 0.0005), boxAround(0.0005, 0.0005, 10), project, unproject, 10)).toBeUndefined();
  });
});
