import { describe, expect, it } from 'vitest';
import { magneticDeclination } from '../geo/magneticDeclination';
import { fieldGuidance } from './fieldGuidance';

const fix = (lon: number, lat: number, accuracyM = 4) => ({ lon, lat, accuracyM, atIso: '2026-06-01T00:00:00Z' });

describe('fieldGuidance', () => {
  it('gives the distance and true bearing GeodSolve gives at site scale', () => {
    // GeographicLib GeodSolve -i (Debian geographiclib-tools): "-38 145 -38.01 145.02" → azi1 122.29528569881, s12 2077.840537.
    const g = fieldGuidance(fix(145, -38), { lon: 145.02, lat: -38.01 }, new Date('2026-06-01T00:00:00Z'), null);
    expect(g.distanceM).toBeCloseTo(2077.840537, 5);
    expect(g.bearingTrueDeg).toBeCloseTo(122.29528569881, 8);
    expect(g.arrowDeg).toBeNull();
  });

  it('gives the magnetic bearing as true bearing less the declination at the crew for the date', () => {
    // A plot due north lies on the meridian, a geodesic: true bearing exactly 0 (docs/references.md §6).
    const date = new Date('2026-01-01T00:00:00Z');
    const g = fieldGuidance(fix(-147, -3), { lon: -147, lat: -2.99 }, date, null);
    const decl = magneticDeclination([-3, -147], 0, date).declinationDeg;
    expect(g.bearingTrueDeg).toBe(0);
    expect(g.declinationDeg).toBe(decl);
    expect(g.bearingMagDeg).toBeCloseTo(360 - decl, 10);
    // WMM2025 test value at 33 km is 9.71° (docs/references.md §6); at the ground it differs by hundredths.
    expect(Math.abs(decl - 9.71)).toBeLessThan(0.1);
    expect(g.magModel).toMatch(/WMM/);
  });

  it('turns the arrow by the compass heading, taken from magnetic north', () => {
    const date = new Date('2026-06-01T00:00:00Z');
    const decl = magneticDeclination([-38, 145], 0, date).declinationDeg;
    // Heading 100° magnetic is 100° + D true; the plot lies at 122.29528569881° true (GeodSolve, above).
    const g = fieldGuidance(fix(145, -38), { lon: 145.02, lat: -38.01 }, date, 100);
    expect(g.arrowDeg).toBeCloseTo(122.29528569881 - (100 + decl), 8);
    const behind = fieldGuidance(fix(145, -38), { lon: 145.02, lat: -38.01 }, date, 300);
    expect(behind.arrowDeg).toBeCloseTo(122.29528569881 - (300 + decl) + 360, 8);
  });

  it('refuses a position outside WGS84 ranges', () => {
    expect(() => fieldGuidance(fix(145, 95), { lon: 145, lat: -38 }, new Date(), null)).toThrow(/latitude/);
  });
});
