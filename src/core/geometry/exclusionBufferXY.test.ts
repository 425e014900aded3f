import type { Geometry } from 'geojson';
import { describe, expect, it } from 'vitest';
import { exclusionBufferXY, type MultiPolygonXY } from './exclusionBufferXY';
import { localFrameAt } from '../geo/localFrame';
import type { Exclusion, ExclusionGeometry } from '../model/types';

const frame = localFrameAt(150.5, -35.1);
const [X0, Y0] = frame.toXY(150.5, -35.1);
/** Lon/lat of a point `dx`, `dy` metres from the test origin in the frame. */
const at = (dx: number, dy: number) => frame.toLonLat(X0 + dx, Y0 + dy);
const excl = (geometry: Geometry, bufferM: number): Exclusion => ({ id: 'x', kind: 'hazard', geometry: geometry as ExclusionGeometry, bufferM });

function areaXY(mp: MultiPolygonXY): number {
  let total = 0;
  for (const poly of mp) {
    poly.forEach((ring, r) => {
      // Shoelace about the test origin: UTM coordinates are too large for it to be exact.
      let a = 0;
      for (let i = 1; i < ring.length; i++) {
        a += (ring[i - 1][0] - X0) * (ring[i][1] - Y0) - (ring[i][0] - X0) * (ring[i - 1][1] - Y0);
      }
      total += r === 0 ? Math.abs(a / 2) : -Math.abs(a / 2);
    });
  }
  return total;
}

describe('exclusionBufferXY', () => {
  it('turns a point into a disc of area πr² within 0.1 %', () => {
    const mp = exclusionBufferXY(excl({ type: 'Point', coordinates: at(0, 0) }, 30), frame);
    expect(mp).toHaveLength(1);
    expect(Math.abs(areaXY(mp) / (Math.PI * 900) - 1)).toBeLessThan(1e-3);
  });

  it('gives one stadium for a straight line of two collinear segments', () => {
    // Stadium area 2rL + πr² (elementary geometry, common practice, no source).
    const line = { type: 'LineString', coordinates: [at(0, 0), at(100, 0), at(200, 0)] } as Geometry;
    const mp = exclusionBufferXY(excl(line, 10), frame);
    expect(mp).toHaveLength(1);
    expect(Math.abs(areaXY(mp) / (2 * 10 * 200 + Math.PI * 100) - 1)).toBeLessThan(1e-3);
  });

  it('grows a square by the Steiner formula A + P·r + πr²', () => {
    // Steiner's formula for the parallel body of a convex polygon (Steiner 1840; any convex
    // geometry text, e.g. Schneider, Convex Bodies, 2nd ed., §4.1).
    const ring = [at(0, 0), at(100, 0), at(100, 100), at(0, 100), at(0, 0)];
    const mp = exclusionBufferXY(excl({ type: 'Polygon', coordinates: [ring] }, 20), frame);
    const expected = 100 * 100 + 400 * 20 + Math.PI * 400;
    expect(Math.abs(areaXY(mp) / expected - 1)).toBeLessThan(1e-3);
  });

  it('keeps a polygon as it is when its buffer is zero, and gives nothing for a bare line', () => {
    const ring = [at(0, 0), at(50, 0), at(50, 40), at(0, 40), at(0, 0)];
    const mp = exclusionBufferXY(excl({ type: 'Polygon', coordinates: [ring] }, 0), frame);
    expect(areaXY(mp)).toBeCloseTo(2000, 4);
    expect(exclusionBufferXY(excl({ type: 'LineString', coordinates: [at(0, 0), at(9, 9)] }, 0), frame)).toEqual([]);
    expect(exclusionBufferXY(excl({ type: 'MultiPoint', coordinates: [at(0, 0)] }, 0), frame)).toEqual([]);
  });

  it('merges overlapping discs of a multipoint into one polygon', () => {
    const mp = exclusionBufferXY(excl({ type: 'MultiPoint', coordinates: [at(0, 0), at(10, 0), at(500, 0)] }, 10), frame);
    expect(mp).toHaveLength(2);
    // Two unit-radius discs d = r apart overlap by 2r²acos(d/2r) − (d/2)√(4r² − d²) (circle–circle lens, elementary geometry).
    const lens = 2 * 100 * Math.acos(0.5) - 5 * Math.sqrt(400 - 100);
    expect(Math.abs(areaXY(mp) / (3 * Math.PI * 100 - lens) - 1)).toBeLessThan(1e-3);
  });
});
