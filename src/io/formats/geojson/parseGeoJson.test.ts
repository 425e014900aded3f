import type { Point } from 'geojson';
import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { parseGeoJson } from './parseGeoJson';

// IOGP Guidance Note 7-2 British National Grid example (docs/references.md §2): 50°30′N 0°30′E on OSGB36.
const BNG_POINT = { type: 'Point', coordinates: [577274.99, 69740.5] };
// EPSG transformation 1314 (OSGB36 → WGS84, position vector), typed from the EPSG dataset.
const OSGB36_GEOGRAPHIC = '+proj=longlat +ellps=airy +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +no_defs';

const withCrs = (crs: unknown, geometry: unknown = BNG_POINT) => JSON.stringify({ type: 'FeatureCollection', crs, features: [{ type: 'Feature', properties: {}, geometry }] });
const onOsgb36 = (text: string, epsg?: number) => {
  const wgs84 = (parseGeoJson('bng.geojson', text, epsg).features[0].geometry as Point).coordinates;
  return proj4('EPSG:4326', OSGB36_GEOGRAPHIC, wgs84);
};

describe('parseGeoJson coordinate systems', () => {
  it('recognises EPSG:27700 in each way a crs member names it', () => {
    const names = ['urn:ogc:def:crs:EPSG::27700', 'EPSG:27700', 'urn:ogc:def:crs:EPSG:6.6:27700', 'http://www.opengis.net/def/crs/EPSG/0/27700'];
    for (const name of names) {
      const [lon, lat] = onOsgb36(withCrs({ type: 'name', properties: { name } }));
      expect(lon).toBeCloseTo(0.5, 6);
      expect(lat).toBeCloseTo(50.5, 6);
    }
    const [lon, lat] = onOsgb36(withCrs({ type: 'EPSG', properties: { code: 27700 } }));
    expect([lon, lat].map((v) => Number(v.toFixed(6)))).toEqual([0.5, 50.5]);
  });

  it('takes the epsg option for a file without a crs member, or one that agrees with it', () => {
    const bare = JSON.stringify({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: BNG_POINT }] });
    expect(onOsgb36(bare, 27700)[1]).toBeCloseTo(50.5, 6);
    expect(onOsgb36(withCrs({ type: 'name', properties: { name: 'EPSG:27700' } }), 27700)[1]).toBeCloseTo(50.5, 6);
  });

  it('refuses an epsg option that contradicts the crs member', () => {
    expect(() => parseGeoJson('bng.geojson', withCrs({ type: 'name', properties: { name: 'EPSG:27700' } }), 32630)).toThrow(
      'bng.geojson: its "crs" member names EPSG:27700 but EPSG:32630 was given (--epsg); leave out one of them',
    );
  });

  it('asks for the EPSG code when the crs member is not one, and uses it when given', () => {
    const odd = withCrs({ type: 'name', properties: { name: 'OSGB 1936 / British National Grid' } });
    expect(() => parseGeoJson('odd.geojson', odd)).toThrow(/^odd\.geojson: coordinate system "OSGB 1936 \/ British National Grid" in the "crs" member is not an EPSG code; give the file's EPSG code \(--epsg\)$/);
    expect(onOsgb36(odd, 27700)[0]).toBeCloseTo(0.5, 6);
  });
});
