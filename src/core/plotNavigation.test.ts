import { describe, expect, it } from 'vitest';
import { InputError } from './InputError';
import { magneticDeclination } from './magneticDeclination';
import { plotNavigation } from './plotNavigation';
import type { AccessPoint } from './types';

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
    const d = magneticDeclination([-38, 145], 0, date).declinationDeg;
    expect(row.bearingMagDeg).toBeCloseTo(122.29528569881 - d, 8);
    expect(nav.model).toBe('WMM-2025');
    expect(nav.epoch).toBe(2025);
    expect(nav.warnings).toEqual([]);
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
