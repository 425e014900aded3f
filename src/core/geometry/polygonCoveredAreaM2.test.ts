import * as polyclip from 'polyclip-ts';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { localFrameAt } from '../geo/localFrame';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { polygonCoveredAreaM2 } from './polygonCoveredAreaM2';
import type { LonLat } from '../model/types';

// Invented layout in UTM metres near (150.5, −35.1); every ring is converted to lon/lat.
const frame = localFrameAt(150.5, -35.1);
const [X0, Y0] = frame.toXY(150.5, -35.1);
type XYPoly = [number, number][][];
const ll = (poly: XYPoly): LonLat[][] => poly.map((ring) => ring.map(([x, y]) => frame.toLonLat(X0 + x, Y0 + y)));
const sq = (x: number, y: number, s: number): XYPoly => [[[x, y], [x + s, y], [x + s, y + s], [x, y + s], [x, y]]];
const area = (polys: XYPoly[]) => polygonAreaM2({ type: 'MultiPolygon', coordinates: polys.map(ll) });
/** The reference: a general-purpose clipper (polyclip-ts 0.16.8, Martinez–Rueda–Feito) then polygonAreaM2. */
function clippedArea(a: XYPoly, pieces: XYPoly[]): number {
  const u = polyclip.union(pieces[0], ...pieces.slice(1));
  const r = polyclip.intersection(a, u) as XYPoly[];
  return r.length ? area(r) : 0;
}

describe('polygonCoveredAreaM2', () => {
  it('gives the whole area when a piece covers the part, and nothing when pieces miss it', () => {
    const a = sq(0, 0, 100);
    expect(polygonCoveredAreaM2([ll(a)], [[ll(sq(-10, -10, 200))]]) / area([a])).toBeCloseTo(1, 9);
    expect(polygonCoveredAreaM2([ll(a)], [[ll(sq(300, 0, 50))]])).toBe(0);
  });

  it('counts a quarter overlap, and two identical overlapping pieces only once', () => {
    const a = sq(0, 0, 100);
    const p = sq(50, 50, 100);
    const expected = area([sq(50, 50, 50)]);
    expect(polygonCoveredAreaM2([ll(a)], [[ll(p)]]) / expected).toBeCloseTo(1, 8);
    expect(polygonCoveredAreaM2([ll(a)], [[ll(p)], [ll(p)]]) / expected).toBeCloseTo(1, 8);
  });

  it('counts a piece sharing an edge from outside as nothing, and one sharing it from inside once', () => {
    const a = sq(0, 0, 100);
    // A grid-straight edge and its equal-area-straight twin part by ~1e-5 m over 100 m: the slack is
    // that sliver, 1e-6 of the part's area (the accuracy designUsableAreas promises).
    const slack = 1e-6 * area([a]);
    expect(Math.abs(polygonCoveredAreaM2([ll(a)], [[ll(sq(100, 0, 100))]]))).toBeLessThan(slack);
    expect(Math.abs(polygonCoveredAreaM2([ll(a)], [[ll(sq(0, 0, 40))]]) - area([sq(0, 0, 40)]))).toBeLessThan(slack);
  });

  it('respects holes in the part and in the pieces', () => {
    const a: XYPoly = [...sq(0, 0, 100), [...sq(20, 20, 20)[0]].reverse() as [number, number][]];
    const ring: XYPoly = [sq(10, 10, 80)[0], sq(30, 30, 40)[0]];
    const expected = clippedArea(a, [ring]);
    expect(Math.abs(polygonCoveredAreaM2([ll(a)], [[ll(ring)]]) / expected - 1)).toBeLessThan(1e-7);
  });

  it('agrees with a general-purpose clipper on random overlapping discs over a star-shaped part', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -50, max: 450, noNaN: true }), fc.double({ min: -50, max: 450, noNaN: true }), fc.double({ min: 5, max: 60, noNaN: true })), { minLength: 1, maxLength: 6 }),
        fc.integer({ min: 12, max: 300 }),
        (discs, n) => {
          const star: [number, number][] = [];
          for (let v = 0; v < n; v++) {
            const t = (v / n) * 2 * Math.PI;
            const r = 150 + 40 * Math.sin(5 * t);
            star.push([200 + r * Math.cos(t), 200 + r * Math.sin(t)]);
          }
          star.push(star[0]);
          const pieces: XYPoly[] = discs.map(([cx, cy, r]) => {
            const ring: [number, number][] = [];
            for (let k = 0; k < 32; k++) ring.push([cx + r * Math.cos((k / 32) * 2 * Math.PI), cy + r * Math.sin((k / 32) * 2 * Math.PI)]);
            ring.push(ring[0]);
            return [ring];
          });
          const expected = clippedArea([star], pieces);
          const got = polygonCoveredAreaM2([ll([star])], pieces.map((p) => [ll(p)]));
          // 1e-6 m² slack for the clipper's and the projection's rounding on ~1e5 m² of part.
          expect(Math.abs(got - expected)).toBeLessThan(1e-6 * area([[star]]) + 1e-6);
        },
      ),
      { numRuns: 60, seed: 7 },
    );
  });
});
