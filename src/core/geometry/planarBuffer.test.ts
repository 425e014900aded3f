import { describe, expect, it } from 'vitest';
import { ARC_TOLERANCE_M } from './bufferShapesXY';
import { planarBuffer } from './planarBuffer';

function segmentDistance(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const t = Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - ax - t * dx, py - ay - t * dy);
}
function lineDistance(line: number[][], x: number, y: number): number {
  let d = Infinity;
  for (let i = 1; i < line.length; i++) d = Math.min(d, segmentDistance(x, y, line[i - 1][0], line[i - 1][1], line[i][0], line[i][1]));
  return d;
}
function polygonsArea(polys: [number, number][][][]): number {
  let total = 0;
  for (const poly of polys) {
    poly.forEach((ring, r) => {
      let a = 0;
      for (let i = 1; i < ring.length; i++) a += ring[i - 1][0] * ring[i][1] - ring[i][0] * ring[i - 1][1];
      total += (r === 0 ? 1 : -1) * Math.abs(a / 2);
    });
  }
  return total;
}

describe('planarBuffer', () => {
  it('keeps every vertex of a line buffer between r and r + 2 cm of the line', () => {
    const line = [[0, 0], [120, 30], [150, 140], [60, 90]];
    const polys = planarBuffer({ type: 'LineString', coordinates: line }, 15);
    expect(polys).toHaveLength(1);
    for (const ring of polys[0]) {
      for (const [x, y] of ring) {
        const d = lineDistance(line, x, y);
        expect(d).toBeGreaterThanOrEqual(15 - 1e-6);
        expect(d).toBeLessThanOrEqual(15 + ARC_TOLERANCE_M + 1e-6);
      }
    }
  });

  it('gives a straight line the stadium area 2rL + πr² within 0.1 %', () => {
    // Stadium area: elementary geometry (common practice, no source).
    const polys = planarBuffer({ type: 'LineString', coordinates: [[0, 0], [300, 400]] }, 12);
    expect(Math.abs(polygonsArea(polys) / (2 * 12 * 500 + Math.PI * 144) - 1)).toBeLessThan(1e-3);
  });

  it('grows a convex polygon by the Steiner formula A + P·r + πr² within 0.1 %', () => {
    // Steiner's formula for parallel bodies of convex sets (Schneider, Convex Bodies, 2nd ed., §4.1).
    const tri = [[0, 0], [200, 0], [50, 120], [0, 0]];
    const perimeter = 200 + Math.hypot(150, 120) + Math.hypot(50, 120);
    const polys = planarBuffer({ type: 'Polygon', coordinates: [tri] }, 8);
    expect(Math.abs(polygonsArea(polys) / (12000 + perimeter * 8 + Math.PI * 64) - 1)).toBeLessThan(1e-3);
  });

  it('shrinks a hole by the buffer and fills a hole narrower than twice the buffer', () => {
    const shell = [[0, 0], [100, 0], [100, 100], [0, 100], [0, 0]];
    const wide = [[20, 20], [20, 80], [80, 80], [80, 20], [20, 20]];
    const narrow = [[45, 20], [45, 80], [55, 80], [55, 20], [45, 20]];
    const withWide = planarBuffer({ type: 'Polygon', coordinates: [shell, wide] }, 5);
    expect(withWide[0]).toHaveLength(2);
    // What stays of the hole is the ground more than r from its edges: a square of side 60 − 2r (elementary geometry).
    const holeArea = polygonsArea([[withWide[0][1]]]);
    expect(Math.abs(holeArea / 2500 - 1)).toBeLessThan(1e-3);
    expect(planarBuffer({ type: 'Polygon', coordinates: [shell, narrow] }, 6)[0]).toHaveLength(1);
  });
});
