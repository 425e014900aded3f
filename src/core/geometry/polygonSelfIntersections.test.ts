import { kinks } from '@turf/turf';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { polygonSelfIntersections } from './polygonSelfIntersections';

const where = { featureIndex: 0 };

describe('polygonSelfIntersections', () => {
  it('finds the crossing of a bow-tie where turf kinks does', () => {
    const ring = [[0, 0], [1, 1], [1, 0], [0, 1], [0, 0]];
    const [problem] = polygonSelfIntersections([ring], where);
    const ref = kinks({ type: 'Polygon', coordinates: [ring] }).features[0].geometry.coordinates;
    expect(problem.where.lonLat![0]).toBeCloseTo(ref[0], 12);
    expect(problem.where.lonLat![1]).toBeCloseTo(ref[1], 12);
  });

  it('accepts a simple polygon with a hole touching nothing', () => {
    const shell = [[0, 0], [4, 0], [4, 4], [0, 4], [0, 0]];
    const hole = [[1, 1], [1, 2], [2, 2], [2, 1], [1, 1]];
    expect(polygonSelfIntersections([shell, hole], where)).toEqual([]);
  });

  it('allows a hole to touch its shell at one point but not to cross it', () => {
    const shell = [[0, 0], [4, 0], [4, 4], [0, 4], [0, 0]];
    expect(polygonSelfIntersections([shell, [[0, 2], [1, 3], [1, 1], [0, 2]]], where)).toEqual([]);
    const crossing = polygonSelfIntersections([shell, [[3, 1], [5, 2], [3, 3], [3, 1]]], where);
    expect(crossing[0].message).toBe('feature 0, ring 0: crosses ring 1 (its edge 0) at 4.00000, 1.50000');
  });

  it('agrees with turf kinks on whether random rings are simple', () => {
    // turf 7.4 `kinks` (a plain all-pairs reference) as the outside check; seeded, 100 runs.
    const pt = fc.tuple(fc.integer({ min: 0, max: 20 }), fc.integer({ min: 0, max: 20 }));
    fc.assert(
      fc.property(fc.uniqueArray(pt, { minLength: 4, maxLength: 9, selector: ([x, y]) => `${x},${y}` }), (pts) => {
        const ring = [...pts, pts[0]];
        // kinks also reports touches of neighbouring collinear edges; compare only rings without
        // three consecutive collinear points, where both define "simple" the same way.
        const n = pts.length;
        for (let i = 0; i < n; i++) {
          const [a, b, c] = [pts[i], pts[(i + 1) % n], pts[(i + 2) % n]];
          if ((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]) === 0) return;
        }
        const ours = polygonSelfIntersections([ring], where).length > 0;
        const ref = kinks({ type: 'Polygon', coordinates: [ring] }).features.length > 0;
        expect(ours).toBe(ref);
      }),
      { numRuns: 100, seed: 7946 },
    );
  });

  it('agrees with turf kinks on long-edged random rings, where many edges are open at once', () => {
    // Edges spanning the whole ring make the sweep give up and the flatbush search take over.
    const pt = fc.tuple(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 0, max: 1000, noNaN: true }));
    fc.assert(
      fc.property(fc.array(pt, { minLength: 60, maxLength: 200 }), (pts) => {
        const ring = [...pts, pts[0]];
        const ours = polygonSelfIntersections([ring], where, 5);
        const ref = kinks({ type: 'Polygon', coordinates: [ring] }).features.length;
        expect(ours.length > 0).toBe(ref > 0);
        expect(ours.length).toBeLessThanOrEqual(5);
      }),
      { numRuns: 30, seed: 11 },
    );
  });

  it('finds the one crossing of a long wiggly ring with a single bow-tie', () => {
    const ring: [number, number][] = [];
    for (let k = 0; k < 3000; k++) {
      const a = (k / 3000) * 2 * Math.PI;
      const r = 400 + 30 * Math.sin(9 * a);
      ring.push([Math.cos(a) * r, Math.sin(a) * r]);
    }
    // Swap two neighbouring vertices: edges 1499 and 1501 now cross.
    [ring[1500], ring[1501]] = [ring[1501], ring[1500]];
    ring.push(ring[0]);
    const found = polygonSelfIntersections([ring], where);
    expect(found).toHaveLength(1);
    expect(found[0].where.vertex).toBe(1499);
  });
});
