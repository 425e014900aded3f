import { describe, expect, it } from 'vitest';
import { ARC_TOLERANCE_M, bufferCircleRing } from './bufferShapesXY';

function ringArea(ring: [number, number][]): number {
  let a = 0;
  for (let i = 1; i < ring.length; i++) a += ring[i - 1][0] * ring[i][1] - ring[i][0] * ring[i - 1][1];
  return a / 2;
}

describe('bufferCircleRing', () => {
  it.each([0.5, 5, 30, 250])('covers a circle of radius %f m with vertices at most 2 cm outside it', (r) => {
    const ring = bufferCircleRing(100, 200, r);
    expect(ring[0]).toEqual(ring[ring.length - 1]);
    for (const [x, y] of ring) {
      const d = Math.hypot(x - 100, y - 200);
      expect(d).toBeGreaterThanOrEqual(r);
      expect(d - r).toBeLessThanOrEqual(ARC_TOLERANCE_M + 1e-9);
    }
    // Every edge is tangent, so its midpoint is at least r away (elementary geometry).
    for (let i = 1; i < ring.length; i++) {
      const mx = (ring[i - 1][0] + ring[i][0]) / 2 - 100;
      const my = (ring[i - 1][1] + ring[i][1]) / 2 - 200;
      expect(Math.hypot(mx, my)).toBeGreaterThanOrEqual(r - 1e-9);
    }
    // Counter-clockwise, and no more than 0.1 % above πr².
    const area = ringArea(ring);
    expect(area).toBeGreaterThan(Math.PI * r * r);
    expect(area / (Math.PI * r * r) - 1).toBeLessThan(1e-3);
  });
});
