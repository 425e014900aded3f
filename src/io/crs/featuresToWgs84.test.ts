import geodesic from 'geographiclib-geodesic';
import type { FeatureCollection, Point } from 'geojson';
import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { featuresToWgs84 } from './featuresToWgs84';

const points = (...coords: number[][]): FeatureCollection => ({
  type: 'FeatureCollection',
  features: coords.map((coordinates) => ({ type: 'Feature', properties: {}, geometry: { type: 'Point', coordinates } })),
});
const at = (fc: FeatureCollection, i = 0) => (fc.features[i].geometry as Point).coordinates;

/*
 * OSGB36 → WGS84 as EPSG transformation 1314 publishes it (7-parameter Helmert, position vector:
 * tX 446.448, tY −125.157, tZ 542.06 m, rX 0.15″, rY 0.247″, rZ 0.842″, dS −20.489 ppm), typed
 * here from the EPSG dataset so the check does not reuse the product's own definition string.
 */
const OSGB36_GEOGRAPHIC = '+proj=longlat +ellps=airy +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +no_defs';

describe('featuresToWgs84', () => {
  it('converts British National Grid with the published projection and datum shift', () => {
    // IOGP Guidance Note 7-2 (docs/references.md §2): 50°30′N 0°30′E on OSGB36 is E 577 274.99,
    // N 69 740.50. That latitude/longitude is on the Airy ellipsoid, not WGS84, so the WGS84
    // result is taken back to OSGB36 with the EPSG:1314 shift (proj4) before comparing: this
    // checks the projection against IOGP and that the shift was applied in the right direction.
    const wgs84 = at(featuresToWgs84(points([577274.99, 69740.5]), 27700, 'bng.geojson'));
    const [lon36, lat36] = proj4('EPSG:4326', OSGB36_GEOGRAPHIC, wgs84);
    expect(lon36).toBeCloseTo(0.5, 6);
    expect(lat36).toBeCloseTo(50.5, 6);
    // OSGB36 and WGS84 positions of one point differ by some 100 m across Great Britain (from
    // memory); the conversion must not have left the datum out.
    const shiftM = geodesic.Geodesic.WGS84.Inverse(50.5, 0.5, wgs84[1], wgs84[0]).s12 as number;
    expect(shiftM).toBeGreaterThan(50);
    expect(shiftM).toBeLessThan(200);
  });

  it('converts GDA94 / MGA zone 55 as UTM 55S on GRS80', () => {
    // GeographicLib GeoConvert 2.x (Debian geographiclib-tools), `GeoConvert -u -p 3`:
    // −42.88, 147.33 is 55S 526950.052 5252458.048; GRS80 and WGS84 give the same TM to < 1 mm
    // and GDA94 is taken as WGS84 (crsResolve, < 2 m, common practice at site scale).
    const [lon, lat] = at(featuresToWgs84(points([526950.052, 5252458.048]), 28355, 'mga.geojson'));
    expect(lon).toBeCloseTo(147.33, 7);
    expect(lat).toBeCloseTo(-42.88, 7);
  });

  it('keeps altitudes and leaves WGS84 input as it is', () => {
    const fc = points([334368.634, 6250948.345, 12.5]);
    const out = at(featuresToWgs84(fc, 32756, 'utm.geojson'));
    // docs/references.md §2 WGS84 set: −33.8688, 151.2093 is 56S E 334368.634 N 6250948.345.
    expect(out[0]).toBeCloseTo(151.2093, 7);
    expect(out[1]).toBeCloseTo(-33.8688, 7);
    expect(out[2]).toBe(12.5);
    expect(at(fc)).toEqual([334368.634, 6250948.345, 12.5]);
    const wgs = points([151.2, -33.9]);
    expect(featuresToWgs84(wgs, 4326, 'w.geojson')).toBe(wgs);
    // EPSG:4979 is WGS 84 geographic 3D (EPSG dataset): the same longitude and latitude.
    expect(at(featuresToWgs84(points([151.2, -33.9, 40]), 4979, 'w3d.geojson'))).toEqual([151.2, -33.9, 40]);
  });

  it('names the feature and position that do not convert', () => {
    expect(() => featuresToWgs84(points([500000, 6000000], [1e9, 1e9]), 32755, 'far.geojson')).toThrow(
      'far.geojson: feature 1, position 0: 1000000000, 1000000000 is not a position in EPSG:32755 (it does not convert to WGS84)',
    );
  });

  it('refuses a code it does not carry and lists the supported ones', () => {
    expect(() => featuresToWgs84(points([0, 0]), 3111, 'vicgrid.geojson')).toThrow(/^vicgrid\.geojson: EPSG:3111 is not a coordinate system stratplot knows; supported: 4326, .*27700/);
  });
});
