import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SegmentChunkIndex } from './segmentChunkIndex';

/** Every segment whose box meets the query box, by looking at each one (the plain definition of a box query). */
function bruteForce(xy: Float64Array, count: number, q: [number, number, number, number]): number[] {
  const found: number[] = [];
  for (let i = 0; i < count; i++) {
    const o = 4 * i;
    if (Math.max(xy[o], xy[o + 2]) < q[0] || Math.min(xy[o], xy[o + 2]) > q[2]) continue;
    if (Math.max(xy[o + 1], xy[o + 3]) < q[1] || Math.min(xy[o + 1], xy[o + 3]) > q[3]) continue;
    found.push(i);
  }
  return found;
}

describe('SegmentChunkIndex', () => {
  it('finds exactly the segments whose boxes meet a query, edges included, on random walks', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true })), { minLength: 1, maxLength: 60 }),
        fc.array(fc.tuple(fc.double({ min: -40, max: 40, noNaN: true }), fc.double({ min: -40, max: 40, noNaN: true }), fc.double({ min: 0, max: 30, noNaN: true })), { minLength: 1, maxLength: 10 }),
        (steps, queries) => {
          const xy = new Float64Array(4 * steps.length);
          let [x, y] = [0, 0];
          steps.forEach(([dx, dy], i) => {
            xy.set([x, y, x + dx, y + dy], 4 * i);
            x += dx;
            y += dy;
          });
          const index = new SegmentChunkIndex(xy, steps.length);
          for (const [qx, qy, size] of queries) {
            const q: [number, number, number, number] = [qx, qy, qx + size, qy + size];
            const seen: number[] = [];
            index.some(q[0], q[1], q[2], q[3], (i) => {
              seen.push(i);
              return false;
            });
            expect(seen.sort((a, b) => a - b)).toEqual(bruteForce(xy, steps.length, q));
          }
        },
      ),
      { numRuns: 100 },
    );
  });

  it('counts a segment that only touches the query box and stops at the first accepted segment', () => {
    // Two segments: (0,0)–(1,0) and (1,0)–(1,1); the box [1, 1] × [2, 2] touches the second at (1, 1).
    const index = new SegmentChunkIndex(Float64Array.from([0, 0, 1, 0, 1, 0, 1, 1]), 2);
    const seen: number[] = [];
    const touching = index.some(1, 1, 2, 2, (i) => {
      seen.push(i);
      return false;
    });
    expect(touching).toBe(false);
    expect(seen).toEqual([1]);
    expect(index.some(-1, -1, 3, 3, () => true)).toBe(true);
    expect(index.maxX).toBe(1);
  });
});
