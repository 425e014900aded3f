import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bearingDistance, bearingNormalizeDeg, geodesicDistanceM } from './bearingDistance';

describe('bearingDistance', () => {
  it('reproduces the documented Wellington to Salamanca distance', () => {
    // geographiclib-geodesic README (npm, v2): Inverse(-41.32, 174.81, 40.96, -5.50) prints 19959679.267 m.
    const r = bearingDistance(174.81, -41.32, -5.5, 40.96);
    expect(r.distanceM).toBeCloseTo(19_959_679.267, 3);
    // GeographicLib GeodSolve -i -p 9 (Debian geographiclib-tools): azi1 161.06766998616015.
    expect(r.bearingTrueDeg).toBeCloseTo(161.06767, 5);
  });

  it('gives a site-scale distance and bearing as GeodSolve computes them', () => {
    // Computed with GeographicLib GeodSolve -i: "-38 145 -38.01 145.02" → 122.29528569881 122.28297109389 2077.840537.
    const r = bearingDistance(145, -38, 145.02, -38.01);
    expect(r.distanceM).toBeCloseTo(2077.840537, 5);
    expect(r.bearingTrueDeg).toBeCloseTo(122.29528569881, 8);
    expect(r.arrivalBearingTrueDeg).toBeCloseTo(122.28297109389, 8);
  });

  it('turns a westward azimuth into a bearing between 180 and 360', () => {
    // Computed with GeodSolve -i: "51.47 -0.46 40.64 -73.78" → azi1 -72.02085098652, s12 5554747.739656.
    const r = bearingDistance(-0.46, 51.47, -73.78, 40.64);
    expect(r.bearingTrueDeg).toBeCloseTo(360 - 72.02085098652, 8);
    expect(r.distanceM).toBeCloseTo(5_554_747.739656, 4);
  });

  it('is zero for coincident points and rejects non-finite input', () => {
    expect(bearingDistance(145, -38, 145, -38)).toEqual({ distanceM: 0, bearingTrueDeg: 0, arrivalBearingTrueDeg: 0 });
    expect(() => bearingDistance(Number.NaN, 0, 0, 0)).toThrow(/lon1/);
    expect(() => bearingDistance(0, 95, 0, 0)).toThrow(/latitude/);
  });

  it('measures the same distance both ways, with bearings that are reverse of the arrival bearings', () => {
    const lon = fc.double({ min: 140, max: 150, noNaN: true });
    const lat = fc.double({ min: -45, max: -30, noNaN: true });
    fc.assert(
      fc.property(lon, lat, lon, lat, (a, b, c, d) => {
        const f = bearingDistance(a, b, c, d);
        const r = bearingDistance(c, d, a, b);
        expect(Math.abs(f.distanceM - r.distanceM)).toBeLessThan(1e-6);
        expect(geodesicDistanceM(a, b, c, d)).toBeCloseTo(f.distanceM, 6);
        if (f.distanceM > 1) {
          const diff = Math.abs(bearingNormalizeDeg(r.bearingTrueDeg - f.arrivalBearingTrueDeg) - 180);
          expect(diff).toBeLessThan(1e-6);
        }
      }),
      { numRuns: 50 },
    );
  });
});

describe('bearingNormalizeDeg', () => {
  it('wraps any angle into 0 ≤ b < 360', () => {
    expect(bearingNormalizeDeg(-90)).toBe(270);
    expect(bearingNormalizeDeg(720)).toBe(0);
    expect(bearingNormalizeDeg(-1e-15)).toBeLessThan(360);
  });
});
