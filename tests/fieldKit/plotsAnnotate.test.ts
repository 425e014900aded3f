import { describe, expect, it } from 'vitest';
import { fieldKitPlots, fieldKitSite } from '../../src/io/fixtures/fieldKitSample';
import { bearingDistance } from '../../src/core/geo/bearingDistance';
import { magneticDeclination } from '../../src/core/geo/magneticDeclination';
import { plotsAnnotate } from '../../src/core/field/plotsAnnotate';

const date = new Date(Date.UTC(2026, 2, 15));

describe('plotsAnnotate', () => {
  it('adds distance and bearings from the chosen access point to every plot of the invented demo site', () => {
    const site = fieldKitSite();
    const plots = fieldKitPlots(site);
    const out = plotsAnnotate(plots, site, { accessPointId: 'access-north', surveyDate: date });
    const a = site.access.find((x) => x.id === 'access-north')!;
    // The declination is the WMM2025 model's (checked against its published test values in the next
    // test and in magneticDeclination.test.ts); here every row must use the same one, and say so.
    const d = out.features[0].properties.declination_deg!;
    expect(d).toBeCloseTo(magneticDeclination([a.lat, a.lon], 0, date).declinationDeg, 1);
    expect(out.features).toHaveLength(plots.features.length);
    for (const f of out.features) {
      const p = f.properties;
      const ref = bearingDistance(a.lon, a.lat, p.lon, p.lat); // geographiclib-geodesic inverse
      expect(p.access_point).toBe('access-north');
      expect(Math.abs(p.distance_m! - ref.distanceM)).toBeLessThanOrEqual(0.05);
      expect(Math.abs(p.bearing_true_deg! - ref.bearingTrueDeg)).toBeLessThanOrEqual(0.05);
      const mag = (ref.bearingTrueDeg - d + 360) % 360;
      // 0.05° from writing the bearing to 0.1°, 0.005° from the declination written to 0.01°.
      expect(Math.abs(p.bearing_mag_deg! - mag)).toBeLessThanOrEqual(0.055 + 1e-9);
      expect(p.mag_model).toMatch(/^WMM-2025, epoch 2025\.0, for 2026\.2/);
    }
    expect(out.annotation.model).toBe('WMM-2025');
  });

  it('writes the magnetic bearing the WMM2025 test table gives for a plot due north of a test point', () => {
    // WMM2025 report test values (docs/references.md §6): D = 9.71° at −3°, −147°, 33 km, 2026.0; a plot
    // due north has true bearing 0°, so its magnetic bearing is 350.29° (written to 0.1°: 350.3).
    const site = fieldKitSite();
    const plots = fieldKitPlots(site);
    const one = { ...plots, features: [{ ...plots.features[0], properties: { ...plots.features[0].properties, lon: -147, lat: -2.99 } }] };
    const wmm = { ...site, parts: [], exclusions: [], boundary: null, access: [{ id: 'wmm', name: 'WMM test point (invented access)', kind: 'gate' as const, lon: -147, lat: -3 }] };
    const out = plotsAnnotate(one, wmm, { surveyDate: new Date(Date.UTC(2026, 0, 1)), altitudeKm: 33 });
    expect(out.features[0].properties.bearing_true_deg! % 360).toBe(0);
    expect(out.features[0].properties.bearing_mag_deg).toBe(350.3);
    expect(Math.abs(out.features[0].properties.declination_deg! - 9.71)).toBeLessThan(0.006);
  });

  it('keeps the input unchanged and the other properties as they were', () => {
    const site = fieldKitSite();
    const plots = fieldKitPlots(site);
    const before = JSON.stringify(plots);
    const out = plotsAnnotate(plots, site, { surveyDate: date });
    expect(JSON.stringify(plots)).toBe(before);
    expect(out.features[0].properties.plot_id).toBe(plots.features[0].properties.plot_id);
    expect(out.design).toBe(plots.design);
  });

  it('joins safety notes and keeps notes a plot already had', () => {
    const site = fieldKitSite();
    const plots = fieldKitPlots(site);
    const cliff = site.exclusions.find((e) => e.kind === 'cliff')!;
    const c = cliff.geometry.type === 'LineString' ? cliff.geometry.coordinates[10] : [0, 0];
    // Move one plot right onto the cliff line: it must get the cliff note.
    const p0 = plots.features[0].properties;
    p0.lon = c[0];
    p0.lat = c[1];
    p0.notes = 'Marker peg missing (invented)';
    const out = plotsAnnotate(plots, site, { surveyDate: date });
    const notes = out.features[0].properties.notes!;
    expect(notes.startsWith('Marker peg missing (invented) | ')).toBe(true);
    expect(notes).toMatch(/Cliff edge 0 m away \(Ochre Spit cliff edge; noted within 50 m\)/);
  });
});
