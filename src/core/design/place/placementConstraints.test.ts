import { describe, expect, it } from 'vitest';
import { localFrameAt } from '../../geo/localFrame';
import { FIT_EXCLUDED, FIT_NEAR_EDGE, FIT_OK, FIT_OUTSIDE_STRATUM, placementConstraintsBuild, utmScaleFactor } from './placementConstraints';
import type { Site } from '../../model/types';

const frame = localFrameAt(117.9, -35.02);
const [e0, n0] = frame.toXY(117.9, -35.02);
const ll = (x: number, y: number) => frame.toLonLat(e0 + x, n0 + y);
const box = (x0: number, y0: number, x1: number, y1: number) => [ll(x0, y0), ll(x1, y0), ll(x1, y1), ll(x0, y1), ll(x0, y0)];

/** Invented: two 100 m squares of one stratum side by side, a cliff line with a 15 m buffer, a pond. */
const site: Site = {
  name: 'invented',
  strata: [{ key: 'A', label: 'A', code: 'AAA', colour: '#000000' }],
  parts: [
    { id: 'a', stratum: 'A', geometry: { type: 'Polygon', coordinates: [box(0, 0, 100, 100)] } },
    { id: 'b', stratum: 'A', geometry: { type: 'Polygon', coordinates: [box(100, 0, 200, 100)] } },
  ],
  exclusions: [
    { id: 'c', kind: 'cliff', bufferM: 15, geometry: { type: 'LineString', coordinates: [ll(150, 0), ll(150, 40)] } },
    { id: 'w', kind: 'water', bufferM: 0, geometry: { type: 'Polygon', coordinates: [box(20, 60, 40, 80)] } },
  ],
  access: [],
  boundary: null,
};

describe('placementConstraintsBuild', () => {
  const c = placementConstraintsBuild(site, frame, { footprint: { shape: 'square', sideM: 10, angleDeg: 0 }, edgeBufferM: 3 });

  it('lets a footprint straddle the edge shared by two parts of one stratum', () => {
    expect(c.check(0, e0 + 100, n0 + 50)).toBe(FIT_OK);
  });

  it('refuses a footprint within the edge buffer of the outer boundary, and a centre outside', () => {
    expect(c.check(0, e0 + 7, n0 + 50)).toBe(FIT_NEAR_EDGE);
    expect(c.check(0, e0 + 9, n0 + 50)).toBe(FIT_OK);
    expect(c.check(0, e0 - 5, n0 + 50)).toBe(FIT_OUTSIDE_STRATUM);
  });

  it('refuses a footprint inside a buffered line and inside or touching a polygon', () => {
    expect(c.check(0, e0 + 150 - 19, n0 + 20)).toBe(FIT_EXCLUDED);
    expect(c.check(0, e0 + 150 - 21, n0 + 20)).toBe(FIT_OK);
    expect(c.check(0, e0 + 30, n0 + 70)).toBe(FIT_EXCLUDED);
    expect(c.check(0, e0 + 30, n0 + 56)).toBe(FIT_EXCLUDED);
    expect(c.check(0, e0 + 30, n0 + 54)).toBe(FIT_OK);
  });

  it('measures the nearest exclusion from the plot centre', () => {
    const near = c.nearestExclusion(e0 + 120, n0 + 20)!;
    expect(near.kind).toBe('cliff');
    expect(near.distanceM).toBeCloseTo(30 / utmScaleFactor(e0 + 120, -35.02), 3);
  });

  it('turns footprints by the meridian convergence, matching the ellipsoidal series for the convergence (Snyder 1987, ch. 8; equation number from memory) to 0.001°', () => {
    // γ ≈ Δλ sin φ [1 + Δλ² cos² φ (1 + 3η² + 2η⁴)/3], Δλ from the zone's central meridian (117°E).
    const [lon, lat] = frame.toLonLat(e0 + 100, n0 + 50);
    const phi = (lat * Math.PI) / 180;
    const dl = ((lon - 117) * Math.PI) / 180;
    const eta2 = (0.0066943799901413165 / (1 - 0.0066943799901413165)) * Math.cos(phi) ** 2;
    const gamma = dl * Math.sin(phi) * (1 + ((dl * dl * Math.cos(phi) ** 2) / 3) * (1 + 3 * eta2 + 2 * eta2 * eta2));
    // Grid north is turned −γ from true north here (southern hemisphere, east of the meridian).
    expect(c.convergenceDeg).toBeCloseTo((-gamma * 180) / Math.PI, 3);
    const [vx, vy] = [c.footprint.vx[3] - c.footprint.vx[0], c.footprint.vy[3] - c.footprint.vy[0]];
    expect((Math.atan2(vx, vy) * 180) / Math.PI).toBeCloseTo(c.convergenceDeg, 9);
  });
});

describe('utmScaleFactor', () => {
  it("gives Snyder's (1987) transverse Mercator example k = 0.9997989 at x = 127 106.5 m from the meridian", () => {
    // Snyder, USGS PP 1395, ellipsoidal TM example (Clarke 1866, 40.5°N); the ellipsoid changes k by < 1e-8.
    expect(utmScaleFactor(500000 + 127106.5, 40.5)).toBeCloseTo(0.9997989, 6);
  });
});
