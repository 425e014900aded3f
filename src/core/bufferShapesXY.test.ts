import { describe, expect, it } from 'vitest';
import { ARC_TOLERANCE_M, bufferCapsuleRing, bufferCircleRing } from './bufferShapesXY';

function ringArea(ring: [number, number][]): number {
  let a = 0;
  for (let i = 1; i < ring.length; i++) a += ring[i - 1][0] * ring[i][1] - ring[i][0] * ring[i - 1][1];
  return a / 2;
}
function segmentDistance(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const t = Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - ax - t * dx, py - ay - t * dy);
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

describe('bufferCapsuleRing', () => {
  it('has the area of a stadium, 2rL + πr², to within 0.1 %', () => {
    // Stadium area 2rL + πr²: elementary geometry (common practice, no source).
    const r = 15;
    const ring = bufferCapsuleRing(0, 0, 300, 400, r);
    const exact = 2 * r * 500 + Math.PI * r * r;
    const area = ringArea(ring);
    expect(area).toBeGreaterThan(exact);
    expect(area / exact - 1).toBeLessThan(1e-3);
  });

  it('keeps every vertex between r and r + 2 cm of the segment', () => {
    const r = 10;
    for (const [x, y] of bufferCapsuleRing(5, 5, -40, 12, r)) {
      const d = segmentDistance(x, y, 5, 5, -40, 12);
      expect(d).toBeGreaterThanOrEqual(r - 1e-9);
      expect(d).toBeLessThanOrEqual(r + ARC_TOLERANCE_M + 1e-9);
    }
  });

  it('becomes a circle for a zero-length segment', () => {
    expect(bufferCapsuleRing(1, 2, 1, 2, 8)).toEqual(bufferCircleRing(1, 2, 8));
  });
});
