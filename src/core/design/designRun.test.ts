import { version as packageVersion } from '../../../package.json';
import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { designRun } from './designRun';
import { designSettingsDefault } from './designSettingsDefault';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { isInputError } from '../common/InputError';

const site = siteInventedRandom(8, 3, 3);

describe('designRun', () => {
  it('reports progress from 0 to 1', () => {
    const fractions: number[] = [];
    designRun(site, designSettingsDefault({ plots: 30 }), { onProgress: (f) => fractions.push(f) });
    expect(fractions[0]).toBe(0);
    expect(fractions[fractions.length - 1]).toBe(1);
    expect([...fractions].sort((a, b) => a - b)).toEqual(fractions);
  });

  it('writes the allocation rows, CRS, statements and software into the summary', () => {
    const r = designRun(site, designSettingsDefault({ plots: 30, reservePerStratum: 2, seed: 12 }));
    expect(r.design.seed).toBe(12);
    expect(r.design.crs.utm_zone).toMatch(/^\d{1,2}S$/);
    expect(r.design.software).toEqual({ name: 'stratplot', version: packageVersion });
    for (const row of r.design.allocation) {
      expect(Object.keys(row)).toEqual(['stratum', 'mapped_m2', 'usable_m2', 'share', 'plots', 'reserve', 'capacity']);
      expect(row.usable_m2).toBeLessThanOrEqual(row.mapped_m2);
    }
    expect(r.design.allocation.reduce((a, row) => a + row.share, 0)).toBeCloseTo(1, 5);
    const words = r.design.statements.join(' ');
    expect(words).toMatch(/usable area/);
    expect(words).toMatch(/Inference covers the usable area only/);
    expect(words).toMatch(/lowest-ranked unused reserve/);
    expect(words).toMatch(/landholder's permission/);
    const p = r.features[0].properties;
    expect(p.plot_id).toMatch(/^[A-Z0-9]+-\d{2}$/);
    expect(p.mgrs).toMatch(/^\d{1,2}[C-X][A-Z]{2}\d{10}$/);
    expect(String(p.lon).split('.')[1]?.length ?? 0).toBeLessThanOrEqual(7);
  });

  it('gives no plots to a stratum that buffered exclusions cover completely, and says so', () => {
    const covered = siteInventedRandom(3, 3, 0);
    const ring = (covered.parts[2].geometry.coordinates as number[][][])[0];
    const xs = ring.map((p) => p[0]);
    const ys = ring.map((p) => p[1]);
    const [a, b, c, d] = [Math.min(...xs) - 0.001, Math.min(...ys) - 0.001, Math.max(...xs) + 0.001, Math.max(...ys) + 0.001];
    covered.exclusions.push({ id: 'lake', kind: 'water', bufferM: 10, geometry: { type: 'Polygon', coordinates: [[[a, b], [c, b], [c, d], [a, d], [a, b]]] } });
    const r = designRun(covered, designSettingsDefault({ plots: 20, reservePerStratum: 1 }));
    const row = r.design.allocation.find((x) => x.stratum === 'S1')!;
    expect(row.usable_m2).toBe(0);
    expect(row.plots).toBe(0);
    expect(r.design.allocation.reduce((n, x) => n + x.plots, 0)).toBe(20);
    expect(r.design.warnings.join(' ')).toMatch(/stratum "S1" has no usable area/);
  });

  it('gives each plot its distance to the nearest exclusion as GeographicLib measures it, and its design density', () => {
    // geographiclib-geodesic 2.2.0 (Karney 2013): geodesic distance from the plot to the hazard point.
    const lone = siteInventedRandom(9, 2, 0);
    const [lon, lat] = (lone.parts[0].geometry.coordinates as number[][][])[0][0];
    lone.exclusions.push({ id: 'shaft', kind: 'hazard', bufferM: 30, geometry: { type: 'Point', coordinates: [lon + 0.001, lat + 0.001] } });
    const r = designRun(lone, designSettingsDefault({ plots: 12, seed: 3 }));
    for (const f of r.features) {
      const p = f.properties;
      const s12 = geodesic.Geodesic.WGS84.Inverse(p.lat, p.lon, lat + 0.001, lon + 0.001).s12 as number;
      expect(p.nearest_exclusion_kind).toBe('hazard');
      // 0.05 m for the 0.1 m rounding, 0.01 m for 7-decimal coordinates.
      expect(Math.abs(p.nearest_exclusion_m! - s12)).toBeLessThan(0.06);
      const row = r.design.allocation.find((x) => x.stratum === p.stratum)!;
      expect(p.design_density_per_ha).toBeCloseTo(row.plots / (row.usable_m2 / 10000), 5);
    }
  });

  it('throws an InputError naming the setting for impossible requests', () => {
    const cases: [Partial<Parameters<typeof designSettingsDefault>[0]>, RegExp][] = [
      [{ plots: 4, minPerStratum: 2 }, /needs 6 plots, more than the 4/],
      [{ allocation: 'neyman', sd: { S0: 1 } }, /standard deviation for stratum "S1"/],
      [{ targetHalfwidth: { value: 0.1, relative: true } }, /pilot mean/],
      [{ method: 'transect' }, /baseline/],
      [{ spacingM: -1 }, /minimum spacing/],
    ];
    for (const [over, message] of cases) {
      let caught: unknown;
      try {
        designRun(site, designSettingsDefault({ plots: 30, ...over }));
      } catch (e) {
        caught = e;
      }
      expect(isInputError(caught), String(message)).toBe(true);
      expect((caught as Error).message).toMatch(message);
    }
  });
});
