import fc from 'fast-check';
import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from './polygonAreaM2';
import { ringAreaAuthalicM2 } from './ringAreaAuthalicM2';
import type { LonLat } from '../model/types';

// The outside reference: GeographicLib's PolygonArea (geographiclib-geodesic 2.2.0, Karney 2013).
function geographiclibAreaM2(ring: readonly LonLat[]): number {
  const poly = geodesic.Geodesic.WGS84.Polygon(false);
  for (let i = 0; i < ring.length - 1; i++) poly.AddPoint(ring[i][1], ring[i][0]);
  return poly.Compute(false, true).area ?? 0;
}

/** A wiggly star ring around (lon, lat), radius about `radiusM`, `n` vertices, closed, counter-clockwise. */
function starRing(lon: number, lat: number, radiusM: number, n: number, phase: number, jitter: number[]): LonLat[] {
  const kLat = 1 / 111320;
  const kLon = kLat / Math.cos((lat * Math.PI) / 180);
  const ring: LonLat[] = [];
  for (let v = 0; v < n; v++) {
    const a = (v / n) * 2 * Math.PI;
    const r = radiusM * (1 + 0.15 * Math.sin(5 * a + phase) + (0.01 * jitter[v % jitter.length] * 1000) / n);
    ring.push([lon + Math.cos(a) * r * kLon, lat + Math.sin(a) * r * kLat]);
  }
  ring.push(ring[0]);
  return ring;
}

describe('ringAreaAuthalicM2', () => {
  it('stays within 1e-7 of GeographicLib on random short-edged rings at many latitudes in both hemispheres', () => {
    // From 50 m radius up: below ~1000 m² GeographicLib's own rounding (about 1e-6 m² a vertex) exceeds 1e-7.
    let taken = 0;
    fc.assert(
      fc.property(
        fc.double({ min: -79, max: 79, noNaN: true }),
        fc.double({ min: -179.9, max: 179.9, noNaN: true }),
        fc.double({ min: 50, max: 20000, noNaN: true }),
        fc.integer({ min: 8, max: 3000 }),
        fc.double({ min: 0, max: 6.28, noNaN: true }),
        fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 1, maxLength: 40 }),
        (lat, lon, radiusM, n, phase, jitter) => {
          const ring = starRing(lon, lat, radiusM, n, phase, jitter);
          const reference = geographiclibAreaM2(ring);
          const fast = ringAreaAuthalicM2(ring);
          if (Number.isNaN(fast)) return;
          taken++;
          expect(Math.abs(fast / reference - 1)).toBeLessThan(1e-7);
        },
      ),
      { numRuns: 100, seed: 11 },
    );
    expect(taken).toBeGreaterThan(30);
  });

  it('takes the fast route for mapped habitat polygons with metre-scale edges', () => {
    for (const lat of [-60, -34.6, 0, 34.6, 60]) {
      const ring = starRing(118.2, lat, 400, 2500, 1, [0.3, -0.2, 0.7]);
      const fast = ringAreaAuthalicM2(ring);
      expect(Number.isNaN(fast)).toBe(false);
      // 1e-8: about the size of GeographicLib's own rounding over 2 500 vertices (~1e-6 m² a vertex).
      expect(Math.abs(fast / geographiclibAreaM2(ring) - 1)).toBeLessThan(1e-8);
    }
  });

  it('keeps the area, with the sign flipped, when the ring is reversed and across the antimeridian', () => {
    const ring = starRing(179.999, -17.5, 800, 400, 0.5, [0.1, 0.9]);
    const fwd = ringAreaAuthalicM2(ring);
    const back = ringAreaAuthalicM2([...ring].reverse());
    expect(fwd).toBeGreaterThan(0);
    expect(back).toBeCloseTo(-fwd, 3);
    expect(Math.abs(fwd / geographiclibAreaM2(ring) - 1)).toBeLessThan(1e-7);
  });

  it('declines long-edged, polar and pole-circling rings so GeographicLib measures them', () => {
    // The 1° box of docs/references.md §1 (geodesic edges 12 308 778 361.469 m²) is far too long-edged.
    expect(ringAreaAuthalicM2([[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]])).toBeNaN();
    expect(ringAreaAuthalicM2(starRing(10, 85, 300, 200, 0, [0]))).toBeNaN();
    const aroundPole: LonLat[] = Array.from({ length: 73 }, (_, k) => [-180 + k * 5, 70] as LonLat);
    expect(ringAreaAuthalicM2(aroundPole)).toBeNaN();
    // polygonAreaM2 then still gives GeographicLib's documented value.
    expect(polygonAreaM2({ type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]]] })).toBeCloseTo(12308778361.469, 2);
  });

  it('measures a 5 m regular 81-gon at the equator as a 40-digit evaluation and GeographicLib exact do', () => {
    // Vertices (sin a·5/110574°, cos a·5/111320°) lat/lon. The same projection formula evaluated with
    // mpmath at 40 digits gives 78.4609127454 m² (computed, C); GeographicLib Planimeter -E (exact
    // geodesics) prints 78.46094 m², geographiclib-geodesic 2.2.0 gives 78.46102 m²: there its rounding
    // of ~1e-4 m² dominates.
    const ring: LonLat[] = [];
    for (let v = 0; v < 81; v++) {
      const a = (v / 81) * 2 * Math.PI;
      ring.push([(Math.cos(a) * 5) / 111320, (Math.sin(a) * 5) / 110574]);
    }
    ring.push(ring[0]);
    const fast = ringAreaAuthalicM2(ring);
    expect(Math.abs(fast - 78.4609127454)).toBeLessThan(1e-8);
    expect(Math.abs(fast - 78.46094)).toBeLessThan(5e-5);
    expect(Math.abs(fast - geographiclibAreaM2(ring))).toBeLessThan(2e-4);
  });

  it.each([
    [0, 1, 12308463893.975],
    [45, 46, 8686494956.67],
    [60, 61, 6123140878.746],
  ])('gives the docs/references.md §1 zone area from %f° to %f° × 1° with its parallels densified', (lat0, lat1, expected) => {
    // Rows computed from Snyder's zone formula and confirmed by GeographicLib Planimeter (rhumb edges);
    // densified every 0.001° (meridians too, which changes nothing: they are geodesics and rhumb lines
    // alike), the edges are short enough for this route, and parallels and meridians are straight in it.
    const ring: LonLat[] = [];
    for (let i = 0; i < 1000; i++) ring.push([i / 1000, lat0]);
    for (let i = 0; i < 1000; i++) ring.push([1, lat0 + (i / 1000) * (lat1 - lat0)]);
    for (let i = 1000; i > 0; i--) ring.push([i / 1000, lat1]);
    for (let i = 1000; i > 0; i--) ring.push([0, lat0 + (i / 1000) * (lat1 - lat0)]);
    ring.push([0, lat0]);
    const fast = ringAreaAuthalicM2(ring);
    expect(Number.isNaN(fast)).toBe(false);
    expect(Math.abs(fast / expected - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fast / geographiclibAreaM2(ring) - 1)).toBeLessThan(1e-7);
  });
});
