import type { Geometry, Polygon } from 'geojson';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ringContainsPoint } from './holeProblems';
import { localFrameAt } from '../geo/localFrame';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { stratumUsableRegion } from './stratumUsableRegion';
import type { Exclusion, ExclusionGeometry, Site } from '../model/types';

const frame = localFrameAt(150.5, -35.1);
const [X0, Y0] = frame.toXY(150.5, -35.1);
const at = (dx: number, dy: number) => frame.toLonLat(X0 + dx, Y0 + dy);
const square = (x: number, y: number, s: number): Polygon => ({
  type: 'Polygon',
  coordinates: [[at(x, y), at(x + s, y), at(x + s, y + s), at(x, y + s), at(x, y)]],
});
const excl = (geometry: Geometry, bufferM: number, kind: Exclusion['kind'] = 'hazard'): Exclusion => ({
  id: 'x',
  kind,
  geometry: geometry as ExclusionGeometry,
  bufferM,
});
const site = (parts: Polygon[], exclusions: Exclusion[]): Site => ({
  name: 'Invented test site',
  strata: [{ key: 'heath', label: 'heath', code: 'HEA', colour: '#cc6677' }],
  parts: parts.map((geometry, i) => ({ id: `p${i}`, stratum: 'heath', geometry })),
  exclusions,
  access: [],
  boundary: null,
});

describe('stratumUsableRegion', () => {
  it('keeps exactly the mapped area when no exclusion reaches the stratum', () => {
    const s = site([square(0, 0, 200)], [excl({ type: 'Point', coordinates: at(900, 900) }, 30)]);
    const region = stratumUsableRegion(s, 'heath', frame);
    expect(region.areaM2).toBe(polygonAreaM2(square(0, 0, 200)));
  });

  it('loses π·30² for a 30 m-buffered hazard point in the middle, within 0.1 %', () => {
    // Disc area πr² (elementary geometry); UTM scale at this point (k ≈ 0.99992) makes the frame
    // square slightly larger on the ground, so compare with the mapped area minus the disc.
    const mapped = polygonAreaM2(square(0, 0, 200));
    const region = stratumUsableRegion(site([square(0, 0, 200)], [excl({ type: 'Point', coordinates: at(100, 100) }, 30)]), 'heath', frame);
    const lost = mapped - region.areaM2;
    expect(Math.abs(lost / (Math.PI * 900) - 1)).toBeLessThan(1e-3);
    expect(region.geometry.coordinates[0]).toHaveLength(2);
  });

  it('splits a stratum cut through by a buffered cliff line and loses 2rL', () => {
    // A band of width 2r across a 200 m square removes 2r·200 m² (elementary geometry).
    const cliff: Geometry = { type: 'LineString', coordinates: [at(-50, 100), at(250, 100)] };
    const region = stratumUsableRegion(site([square(0, 0, 200)], [excl(cliff, 15, 'cliff')]), 'heath', frame);
    expect(region.xy).toHaveLength(2);
    const lost = polygonAreaM2(square(0, 0, 200)) - region.areaM2;
    expect(Math.abs(lost / (30 * 200) - 1)).toBeLessThan(2e-3);
  });

  it('unions the parts of a stratum before measuring', () => {
    const s = site([square(0, 0, 100), square(50, 0, 100)], []);
    const region = stratumUsableRegion(s, 'heath', frame);
    const rect: Polygon = { type: 'Polygon', coordinates: [[at(0, 0), at(50, 0), at(100, 0), at(150, 0), at(150, 100), at(100, 100), at(50, 100), at(0, 100), at(0, 0)]] };
    const expected = polygonAreaM2(rect); // the overlapping halves count once
    expect(Math.abs(region.areaM2 / expected - 1)).toBeLessThan(1e-6);
  });

  it('returns usable rings in frame metres that match the lon/lat geometry', () => {
    const region = stratumUsableRegion(site([square(0, 0, 200)], [excl({ type: 'Point', coordinates: at(0, 0) }, 20)]), 'heath', frame);
    const [x, y] = region.xy[0][0][0];
    const [lon, lat] = region.geometry.coordinates[0][0][0];
    const [x2, y2] = frame.toXY(lon, lat);
    expect(Math.hypot(x - x2, y - y2)).toBeLessThan(1e-6);
  });

  it('names a stratum that has no polygons', () => {
    expect(() => stratumUsableRegion(site([square(0, 0, 10)], []), 'dune', frame)).toThrow('stratum "dune" has no mapped polygons');
  });

  it('never makes usable area larger than mapped, and loses no more than the buffers cover', () => {
    // Seeded property test: the loss is between 0 and the sum of the disc areas.
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: -50, max: 250 }), fc.integer({ min: -50, max: 250 }), fc.integer({ min: 1, max: 40 })), { minLength: 1, maxLength: 5 }), (pts) => {
        const exclusions = pts.map(([x, y, r]) => excl({ type: 'Point', coordinates: at(x, y) }, r));
        const mapped = polygonAreaM2(square(0, 0, 200));
        const usable = stratumUsableRegion(site([square(0, 0, 200)], exclusions), 'heath', frame).areaM2;
        const discs = pts.reduce((s, [, , r]) => s + Math.PI * r * r, 0);
        expect(usable).toBeLessThanOrEqual(mapped + 1e-6);
        expect(mapped - usable).toBeLessThanOrEqual(discs * 1.002 + 1e-6);
      }),
      { numRuns: 30, seed: 20261201 },
    );
  });

  it('keeps exactly the ground farther than the buffer from every exclusion', () => {
    // Seeded property test against the definition itself: a point more than r + 2 cm from a
    // cliff line and a hazard point is usable; one closer than r is not.
    const cliff: Geometry = { type: 'LineString', coordinates: [at(-20, 40), at(90, 120), at(160, 60), at(230, 150)] };
    const cliffXY = [[-20, 40], [90, 120], [160, 60], [230, 150]];
    const hazardXY = [60, 170];
    const s = site([square(0, 0, 200)], [excl(cliff, 15, 'cliff'), excl({ type: 'Point', coordinates: at(hazardXY[0], hazardXY[1]) }, 25)]);
    const region = stratumUsableRegion(s, 'heath', frame);
    const inUsable = (x: number, y: number) =>
      region.xy.some((poly) => poly.filter((ring) => ringContainsPoint(ring, X0 + x, Y0 + y)).length % 2 === 1);
    const segDist = (x: number, y: number, a: number[], b: number[]) => {
      const [dx, dy] = [b[0] - a[0], b[1] - a[1]];
      const t = Math.max(0, Math.min(1, ((x - a[0]) * dx + (y - a[1]) * dy) / (dx * dx + dy * dy)));
      return Math.hypot(x - a[0] - t * dx, y - a[1] - t * dy);
    };
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 199.5, noNaN: true }), fc.double({ min: 0.5, max: 199.5, noNaN: true }), (x, y) => {
        let dCliff = Infinity;
        for (let i = 1; i < cliffXY.length; i++) dCliff = Math.min(dCliff, segDist(x, y, cliffXY[i - 1], cliffXY[i]));
        const dHazard = Math.hypot(x - hazardXY[0], y - hazardXY[1]);
        if (dCliff < 15 || dHazard < 25) expect(inUsable(x, y)).toBe(false);
        if (dCliff > 15.02 && dHazard > 25.02) expect(inUsable(x, y)).toBe(true);
      }),
      { numRuns: 100, seed: 4326 },
    );
  });
});
