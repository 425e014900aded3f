import { describe, expect, it } from 'vitest';
import { polygonClipToBox } from './polygonClipToBox';

function shoelace(ring: number[][]): number {
  let a = 0;
  for (let i = 1; i < ring.length; i++) a += ring[i - 1][0] * ring[i][1] - ring[i][0] * ring[i - 1][1];
  return a / 2;
}

describe('polygonClipToBox', () => {
  it('keeps the part of a square inside the box (worked by hand: 10 × 10 square, box over its corner → 5 × 5)', () => {
    const r = polygonClipToBox(
      [
        [0, 0],
        [10, 0],
        [10, 10],
        [0, 10],
        [0, 0],
      ],
      [5, 5, 20, 20],
    );
    expect(shoelace(r)).toBeCloseTo(25, 12);
  });

  it('keeps the area of a concave U shape inside the box, bridges adding nothing', () => {
    // U of three 1 × 3 bars on a 3 × 1 base: area 3 + 2 + 2 = 7; the box cuts the top row y > 2: 7 − 2 = 5.
    const u = [
      [0, 0],
      [3, 0],
      [3, 3],
      [2, 3],
      [2, 1],
      [1, 1],
      [1, 3],
      [0, 3],
      [0, 0],
    ];
    expect(shoelace(polygonClipToBox(u, [-1, -1, 4, 2]))).toBeCloseTo(5, 12);
  });

  it('returns nothing for a ring wholly outside the box', () => {
    expect(
      polygonClipToBox(
        [
          [0, 0],
          [1, 0],
          [1, 1],
        ],
        [5, 5, 6, 6],
      ),
    ).toEqual([]);
  });
});
