import { describe, expect, it } from 'vitest';
import { InputError } from '../common/InputError';
import { plotNavigation } from './plotNavigation';
import type { AccessPoint } from '../model/types';

// Invented access points near an invented coastal site.
const access: AccessPoint[] = [
  { id: 'A1', name: 'North gate', kind: 'gate', lon: 145, lat: -38 },
  { id: 'A2', name: 'South landing', kind: 'landing', lon: 145.03, lat: -38.03 },
];
const date = new Date(Date.UTC(2026, 2, 15));

describe('plotNavigation', () => {
  it('measures from the chosen access point with GeodSolve distance and bearing', () => {
    const nav = plotNavigation([{ id: 'P1', lon: 145.02, lat: -38.01 }], access, { accessPointId: 'A1', date });
    const row = nav.rows[0];
    // Computed with GeographicLib GeodSolve -i: "-38 145 -38.01 145.02" → azi1 122.29528569881, s12 2077.840537.
    expect(row.distanceM).toBeCloseTo(2077.840537, 5);
    expect(row.bearingTrueDeg).toBeCloseTo(122.29528569881, 8);
    // Magnetic = true − the declination the row carries (checked against published values below).
    expect(row.bearingMagDeg).toBeCloseTo(122.29528569881 - nav.declinationDegByAccess.A1, 8);
    expect(nav.model).toBe('WMM-2025');
    expect(nav.epoch).toBe(2025);
    expect(nav.warnings).toEqual([]);
  });

  it('gives magnetic bearings that match the published WMM2025 test values', () => {
    // WMM2025 report test table (docs/references.md §6): D = 9.71° at −3°, −147°, 33 km, 2026.0 and
    // D = 12.93° at 38°, −144°, 69 km, 2025.5. A plot due north (south) of the access point lies on
    // its meridian, a geodesic, so its true bearing is exactly 0° (180°) and its magnetic bearing
    // 360 − 9.71 = 350.29° (180 − 12.93 = 167.07°); the table's 0.01° rounding bounds the error.
    const cases = [
      { at: { lat: -3, lon: -147 }, plot: { lat: -2.99, lon: -147 }, km: 33, year: 2026.0, mag: 350.29 },
      { at: { lat: 38, lon: -144 }, plot: { lat: 37.99, lon: -144 }, km: 69, year: 2025.5, mag: 167.07 },
    ];
    for (const c of cases) {
      const y = Math.floor(c.year);
      // The 365-day decimal year pinned in magneticDeclination.test.ts.
      const when = new Date(Date.UTC(y, 0, 1) + (c.year - y) * 365 * 86_400_000);
      const nav = plotNavigation([{ id: 'P', ...c.plot }], [{ id: 'W', name: 'WMM test point', kind: 'gate', ...c.at }], { date: when, altitudeKm: c.km });
      expect(Math.abs(nav.rows[0].bearingMagDeg - c.mag)).toBeLessThan(0.006);
    }
  });

  it('uses each plot’s nearest access point when none is chosen', () => {
    const nav = plotNavigation(
      [
        { id: 'P1', lon: 145.001, lat: -38.001 },
        { id: 'P2', lon: 145.029, lat: -38.029 },
      ],
      access,
      { date },
    );
    expect(nav.rows.map((r) => r.accessPointId)).toEqual(['A1', 'A2']);
    expect(Object.keys(nav.declinationDegByAccess).sort()).toEqual(['A1', 'A2']);
  });

  it('says which access point is missing', () => {
    expect(() => plotNavigation([], access, { accessPointId: 'B9', date })).toThrow(InputError);
    expect(() => plotNavigation([], access, { accessPointId: 'B9', date })).toThrow(/"B9".*A1, A2/);
    expect(() => plotNavigation([], [], { date })).toThrow(/no/);
  });

  it('carries the model warning for a date outside WMM2025', () => {
    const nav = plotNavigation([{ id: 'P1', lon: 145.01, lat: -38 }], access, { date: new Date(Date.UTC(2031, 0, 1)) });
    expect(nav.warnings[0]).toMatch(/outside WMM2025/);
  });
});
