import mgrs from 'mgrs';
import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { designRun } from './designRun';
import { designSettingsDefault } from './designSettingsDefault';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';

describe('plotRecord', () => {
  it('writes every coordinate column of a row from the one rounded lon/lat', () => {
    // Reference libraries: proj4 2.22 (WGS84 / UTM) and mgrs 2.2 (NGA MGRS, truncating to 1 m).
    const r = designRun(siteInventedRandom(11, 3, 3), designSettingsDefault({ plots: 60, reservePerStratum: 2, seed: 5 }));
    const zone = Number.parseInt(r.design.crs.utm_zone, 10);
    const utm = proj4('EPSG:4326', `+proj=utm +zone=${zone} +south +ellps=WGS84 +units=m +no_defs`);
    for (const f of r.features) {
      const p = f.properties;
      expect(f.geometry.coordinates).toEqual([p.lon, p.lat]);
      expect(p.lon).toBe(Math.round(p.lon * 1e7) / 1e7);
      expect(p.mgrs).toBe(mgrs.forward([p.lon, p.lat], 5));
      const [e, n] = utm.forward([p.lon, p.lat]);
      // Easting and northing are that same position rounded to 0.1 m (1e-6 m for the two projections' last digits).
      expect(Math.abs(p.easting - e)).toBeLessThanOrEqual(0.05 + 1e-6);
      expect(Math.abs(p.northing - n)).toBeLessThanOrEqual(0.05 + 1e-6);
    }
  });
});
