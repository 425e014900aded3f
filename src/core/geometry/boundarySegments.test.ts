import { describe, expect, it } from 'vitest';
import { cutsAlong, segmentsContain, segmentsIndex, segmentsOf } from './boundarySegments';
import type { LonLat } from '../model/types';

// An identity "projection" keeps the checks in plain numbers (elementary geometry, no source needed).
const identity = (lon: number, lat: number, out: Float64Array, at: number) => {
  out[at] = lon;
  out[at + 1] = lat;
};
const square = (x: number, y: number, s: number): LonLat[] => [[x, y], [x + s, y], [x + s, y + s], [x, y + s], [x, y]];
const twiceSignedArea = (xy: Float64Array, count: number) => {
  let sum = 0;
  for (let i = 0; i < count; i++) sum += xy[4 * i] * xy[4 * i + 3] - xy[4 * i + 2] * xy[4 * i + 1];
  return sum;
};

describe('segmentsOf', () => {
  it('turns shells counter-clockwise and holes clockwise whatever their input winding', () => {
    const shellClockwise = [...square(0, 0, 10)].reverse();
    const holeCounterClockwise = square(2, 2, 2);
    const s = segmentsOf([[[shellClockwise, holeCounterClockwise]]], identity);
    expect(s.count).toBe(8);
    expect(twiceSignedArea(s.xy.subarray(0, 16), 4)).toBeCloseTo(200, 12);
    expect(twiceSignedArea(s.xy.subarray(16, 32), 4)).toBeCloseTo(-8, 12);
  });

  it('leaves out segments wholly outside a band and keeps those an eastward ray can meet', () => {
    const s = segmentsOf([[[square(0, 0, 10)]]], identity, [4, 4, 6]);
    // Only the east side (x = 10) crosses latitudes 4–6 east of x = 4.
    expect(s.count).toBe(1);
    expect(Array.from(s.xy.subarray(0, 4))).toEqual([10, 0, 10, 10]);
  });
});

describe('segmentsContain', () => {
  it('tells points in the shell, in the hole and outside apart', () => {
    const s = segmentsOf([[[square(0, 0, 10), square(2, 2, 2)]]], identity);
    const index = segmentsIndex(s)!;
    expect(segmentsContain(s, index, 5, 5)).toBe(true);
    expect(segmentsContain(s, index, 3, 3)).toBe(false);
    expect(segmentsContain(s, index, 11, 5)).toBe(false);
  });
});

describe('cutsAlong', () => {
  it('gives the parameter of a crossing and both ends of a collinear overlap', () => {
    const other = segmentsOf([[[square(5, -1, 2)]]], identity);
    const index = segmentsIndex(other);
    const cuts: number[] = [];
    cutsAlong(new Float64Array([0, 0, 10, 0]), 0, other, index, -1, cuts);
    expect(cuts.sort((a, b) => a - b)).toEqual([0.5, 0.7]);
    const along: number[] = [];
    cutsAlong(new Float64Array([0, -1, 10, -1]), 0, other, index, -1, along);
    // The square's south side runs along the segment from x = 5 to 7; its other sides touch it there too.
    expect([...new Set(along.map((t) => Math.round(t * 1e9) / 1e9))].sort((a, b) => a - b)).toEqual([0.5, 0.7]);
  });
});
