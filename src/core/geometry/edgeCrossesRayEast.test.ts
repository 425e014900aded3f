import { describe, expect, it } from 'vitest';
import { edgeCrossesRayEast } from './edgeCrossesRayEast';

/** Crossing number of a point against a closed ring of [x, y] corners (the rule's definition). */
const crossings = (ring: [number, number][], x: number, y: number) =>
  ring.reduce((n, [x1, y1], i) => {
    const [x2, y2] = ring[(i + 1) % ring.length];
    return n + (edgeCrossesRayEast(x, y, x1, y1, x2, y2) ? 1 : 0);
  }, 0);

// Worked cases of the even–odd rule (Haines 1994, "Point in polygon strategies"): computed by hand.
describe('edgeCrossesRayEast', () => {
  const square: [number, number][] = [[0, 0], [4, 0], [4, 4], [0, 4]];
  it('counts one crossing from inside a square and none or two from outside', () => {
    expect(crossings(square, 2, 2)).toBe(1);
    expect(crossings(square, 5, 2)).toBe(0);
    expect(crossings(square, -1, 2)).toBe(2);
  });

  it('counts a ray through a vertex once, and never a horizontal edge', () => {
    const diamond: [number, number][] = [[2, 0], [4, 2], [2, 4], [0, 2]];
    expect(crossings(diamond, 1, 2)).toBe(1);
    expect(crossings(diamond, -1, 2)).toBe(2);
    expect(edgeCrossesRayEast(0, 1, 1, 1, 3, 1)).toBe(false);
  });

  it('is half-open: a point on the lower edge is inside, on the upper edge outside', () => {
    expect(crossings(square, 2, 0)).toBe(1);
    expect(crossings(square, 2, 4)).toBe(0);
  });
});
