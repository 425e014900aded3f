import { describe, expect, it } from 'vitest';
import { ARC_TOLERANCE_M } from './bufferShapesXY';
import { exclusionBufferPartsXY } from './exclusionBufferPartsXY';
import { localFrameAt } from '../geo/localFrame';
import { planarBuffer } from './planarBuffer';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { polygonCoveredAreaM2 } from './polygonCoveredAreaM2';
import type { Exclusion, ExclusionGeometry, LonLat } from '../model/types';

// Invented layout in UTM metres about a point on the central meridian of zone 56 (scale k0 = 0.9996).
const frame = localFrameAt(153, -35.1);
const [X0, Y0] = frame.toXY(153, -35.1);
const at = (x: number, y: number): LonLat => frame.toLonLat(X0 + x, Y0 + y);
const excl = (geometry: ExclusionGeometry, bufferM: number): Exclusion => ({ id: 'x', kind: 'cliff', geometry, bufferM });
const big: LonLat[][][] = [[[at(-500, -500), at(500, -500), at(500, 500), at(-500, 500), at(-500, -500)]]];

/** Ellipsoidal area of the union of the pieces, measured through polygonCoveredAreaM2 on a large square. */
function unionAreaM2(e: Exclusion): number {
  const pieces = exclusionBufferPartsXY(e, frame, [X0, Y0]).map((poly) => [poly.map((ring) => ring.map(([x, y]) => at(x, y)))]);
  return polygonCoveredAreaM2(big, pieces);
}

/** The same ground area as frame area: UTM areas are k² too large; k ≈ k0 at the central meridian. */
const groundFromGrid = (gridM2: number) => gridM2 / 0.9996 ** 2;

function isInsideRing(ring: readonly (readonly number[])[], x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > y !== yj > y && x < xj + ((y - yj) / (yi - yj)) * (xi - xj)) inside = !inside;
  }
  return inside;
}

describe('exclusionBufferPartsXY', () => {
  it('gives the Steiner area 2rL + πr² for a buffered straight line, within the arc tolerance', () => {
    // Steiner's formula for the parallel body of a convex set (area + perimeter·r + πr²); a segment
    // of length L has "area" 0 and perimeter 2L. The pieces stand at most ARC_TOLERANCE_M outside.
    const [L, r] = [200, 15];
    const area = unionAreaM2(excl({ type: 'LineString', coordinates: [at(-100, 0), at(100, 0)] }, r));
    const expected = groundFromGrid(2 * r * L + Math.PI * r * r);
    expect(area).toBeGreaterThan(expected * (1 - 1e-6));
    expect(area - expected).toBeLessThan(ARC_TOLERANCE_M * (2 * L + 2 * Math.PI * r));
  });

  it('gives the Steiner area s² + 4sr + πr² for a buffered square pond', () => {
    const [s, r] = [80, 10];
    const pond = [at(0, 0), at(s, 0), at(s, s), at(0, s), at(0, 0)];
    const area = unionAreaM2(excl({ type: 'Polygon', coordinates: [pond] }, r));
    const expected = groundFromGrid(s * s + 4 * s * r + Math.PI * r * r);
    expect(area).toBeGreaterThan(expected * (1 - 1e-6));
    expect(area - expected).toBeLessThan(ARC_TOLERANCE_M * (4 * s + 2 * Math.PI * r));
  });

  it('agrees with the merged JTS buffer of planarBuffer on a winding cliff line to 2e-4', () => {
    const xy: [number, number][] = Array.from({ length: 14 }, (_, k) => [k * 22 - 150, 35 * Math.sin(k / 1.7)]);
    const e = excl({ type: 'LineString', coordinates: xy.map(([x, y]) => at(x, y)) }, 15);
    const jts = planarBuffer({ type: 'LineString', coordinates: xy }, 15);
    const jtsArea = polygonAreaM2({ type: 'MultiPolygon', coordinates: jts.map((poly) => poly.map((ring) => ring.map(([x, y]) => at(x, y)))) });
    expect(Math.abs(unionAreaM2(e) / jtsArea - 1)).toBeLessThan(2e-4);
  });

  it('covers every point closer than the buffer to a zig-zag line', () => {
    const line: [number, number][] = [[0, 0], [40, 30], [45, -20], [90, 0], [89, 1]];
    const parts = exclusionBufferPartsXY(excl({ type: 'LineString', coordinates: line.map(([x, y]) => at(x, y)) }, 12), frame, [X0, Y0]);
    const distance = (x: number, y: number) =>
      Math.min(
        ...line.slice(1).map(([bx, by], i) => {
          const [ax, ay] = line[i];
          const t = Math.max(0, Math.min(1, ((x - ax) * (bx - ax) + (y - ay) * (by - ay)) / ((bx - ax) ** 2 + (by - ay) ** 2)));
          return Math.hypot(x - ax - t * (bx - ax), y - ay - t * (by - ay));
        }),
      );
    let checked = 0;
    for (let x = -15; x <= 105; x += 0.7) {
      for (let y = -35; y <= 45; y += 0.7) {
        if (distance(x, y) >= 11.999) continue;
        checked++;
        expect(parts.some((poly) => isInsideRing(poly[0], x, y) && !poly.slice(1).some((h) => isInsideRing(h, x, y)))).toBe(true);
      }
    }
    expect(checked).toBeGreaterThan(1000);
  });

  it('gives nothing for a zero buffer on a point or line, and the polygon itself for a zero-buffer polygon', () => {
    expect(exclusionBufferPartsXY(excl({ type: 'Point', coordinates: at(0, 0) }, 0), frame)).toEqual([]);
    expect(exclusionBufferPartsXY(excl({ type: 'LineString', coordinates: [at(0, 0), at(9, 9)] }, 0), frame)).toEqual([]);
    expect(exclusionBufferPartsXY(excl({ type: 'Polygon', coordinates: [[at(0, 0), at(9, 0), at(0, 9), at(0, 0)]] }, 0), frame)).toHaveLength(1);
  });
});
