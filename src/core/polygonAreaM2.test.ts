import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from './polygonAreaM2';

describe('polygonAreaM2', () => {
  it('gives GeographicLib documented area for the 1° box with geodesic edges', () => {
    // GeographicLib documentation via ../shared/REFERENCES.md §1: 12 308 778 361.469 m².
    const area = polygonAreaM2({ type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]]] });
    expect(area).toBeCloseTo(12308778361.469, 2);
  });

  it('keeps the area when the ring is reversed', () => {
    const ring = [[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]];
    const a = polygonAreaM2({ type: 'Polygon', coordinates: [ring] });
    const b = polygonAreaM2({ type: 'Polygon', coordinates: [[...ring].reverse()] });
    expect(b).toBeCloseTo(a, 4);
  });
});
