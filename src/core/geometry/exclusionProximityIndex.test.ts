import { describe, expect, it } from 'vitest';
import { exclusionProximityIndex } from './exclusionProximityIndex';
import { localFrameAt } from '../geo/localFrame';
import type { Exclusion, LonLat } from '../model/types';

// Invented geometry laid out in UTM metres around 34.4°S 119.1°E, so distances are known by construction.
const frame = localFrameAt(119.1, -34.4);
const o = frame.toXY(119.1, -34.4);
const ll = (e: number, n: number): LonLat => frame.toLonLat(o[0] + e, o[1] + n);
const square = (x0: number, y0: number, s: number): LonLat[] => [ll(x0, y0), ll(x0 + s, y0), ll(x0 + s, y0 + s), ll(x0, y0 + s), ll(x0, y0)];
const exclusions: Exclusion[] = [
  // Water with an island hole: 0..300 square, hole 100..200.
  { id: 'lake', kind: 'water', bufferM: 10, geometry: { type: 'Polygon', coordinates: [square(0, 0, 300), square(100, 100, 100).reverse()] } },
  { id: 'shaft', kind: 'hazard', bufferM: 30, geometry: { type: 'Point', coordinates: ll(-500, 0) } },
];
const index = exclusionProximityIndex(exclusions, frame);
const at = (e: number, n: number) => {
  const v = frame.toXY(...(ll(e, n) as [number, number]));
  return [v[0], v[1]] as const;
};

describe('exclusionProximityIndex', () => {
  it('is zero inside a polygon and measures to the hole edge from the island', () => {
    expect(index.nearest(...at(50, 50), ['water'], 100)?.distanceM).toBe(0);
    // Centre of the hole: 50 m to each hole edge (planar, by construction; round trip through proj4 ~1e-6 m).
    expect(index.nearest(...at(150, 150), ['water'], 100)?.distanceM).toBeCloseTo(50, 4);
  });

  it('measures to a point exclusion and ignores kinds not asked for', () => {
    expect(index.nearest(...at(-500, 40), ['hazard'], 100)?.distanceM).toBeCloseTo(40, 4);
    expect(index.nearest(...at(-500, 40), ['water'], 100)).toBeNull();
  });

  it('finds a segment that crosses a polygon, and one that ends within its buffer', () => {
    const [ax, ay] = at(-100, 150);
    const [bx, by] = at(400, 150);
    expect(index.crossedBy(ax, ay, bx, by, ['water'], 0).map((h) => h.exclusion.id)).toEqual(['lake']);
    const [cx, cy] = at(-5, 150);
    const near = index.crossedBy(ax, ay, cx, cy, ['water'], 0);
    expect(near[0].distanceM).toBeCloseTo(5, 4);
    const [dx, dy] = at(-20, 150);
    expect(index.crossedBy(ax, ay, dx, dy, ['water'], 0)).toEqual([]);
  });
});
