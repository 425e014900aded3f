import { describe, expect, it } from 'vitest';
import { crsFromPrj } from './crsFromPrj';
import { crsResolveEpsg } from './crsResolve';

describe('crsFromPrj', () => {
  it('uses our EPSG:27700 definition for the ESRI British National Grid name without an authority', () => {
    const esri =
      'PROJCS["British_National_Grid",GEOGCS["GCS_OSGB_1936",DATUM["D_OSGB_1936",SPHEROID["Airy_1830",6377563.396,299.3249646]],' +
      'PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",400000.0],' +
      'PARAMETER["False_Northing",-100000.0],PARAMETER["Central_Meridian",-2.0],PARAMETER["Scale_Factor",0.9996012717],' +
      'PARAMETER["Latitude_Of_Origin",49.0],UNIT["Meter",1.0]]';
    const crs = crsFromPrj(esri, 'a.prj');
    expect(crs.epsg).toBe(27700);
    expect(crs.definition).toContain('+towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489');
  });

  it('falls back to proj4 for a WKT with a stated datum shift and no known name', () => {
    // Same grid as EPSG:27700 under a made-up name: proj4 parses its TOWGS84 itself.
    const wkt =
      'PROJCS["Invented grid",GEOGCS["OSGB 1936",DATUM["OSGB_1936",SPHEROID["Airy 1830",6377563.396,299.3249646],' +
      'TOWGS84[446.448,-125.157,542.06,0.15,0.247,0.842,-20.489]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],' +
      'PROJECTION["Transverse_Mercator"],PARAMETER["latitude_of_origin",49],PARAMETER["central_meridian",-2],' +
      'PARAMETER["scale_factor",0.9996012717],PARAMETER["false_easting",400000],PARAMETER["false_northing",-100000],UNIT["metre",1]]';
    const crs = crsFromPrj(wkt, 'b.prj');
    expect(crs.epsg).toBeNull();
    const ours = crsResolveEpsg(27700, 'test');
    const [e1, n1] = crs.fromWgs84(-1.5, 52.5);
    const [e2, n2] = ours.fromWgs84(-1.5, 52.5);
    expect(Math.hypot(e1 - e2, n1 - n2)).toBeLessThan(0.01);
  });

  it('treats ESRI and OGC WGS84 geographic WKT as WGS84 without conversion', () => {
    const crs = crsFromPrj('GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]],PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]]', 'c.prj');
    expect(crs.epsg).toBe(4326);
    expect(crs.toWgs84(151.2093, -33.8688)).toEqual([151.2093, -33.8688]);
  });

  it('reads the UTM zone from an ESRI WGS84 UTM name (GeoConvert manual example)', () => {
    // GeographicLib GeoConvert manual: 33.3°N 44.4°E is 38N 444140.54 3684706.36 (docs/references.md §2).
    const crs = crsFromPrj('PROJCS["WGS_1984_UTM_Zone_38N",GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]]]]', 'd.prj');
    const [e, n] = crs.fromWgs84(44.4, 33.3);
    expect(e).toBeCloseTo(444140.54, 2);
    expect(n).toBeCloseTo(3684706.36, 2);
  });

  it('refuses a datum on another ellipsoid with no stated shift, asking for the EPSG code', () => {
    const wkt =
      'PROJCS["Invented local grid",GEOGCS["Invented datum",DATUM["Invented",SPHEROID["Bessel 1841",6377397.155,299.1528128]],' +
      'PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["latitude_of_origin",0],' +
      'PARAMETER["central_meridian",135],PARAMETER["scale_factor",0.9999],PARAMETER["false_easting",0],PARAMETER["false_northing",0],UNIT["metre",1]]';
    expect(() => crsFromPrj(wkt, 'e.prj')).toThrow(
      'e.prj: the .prj names "Invented local grid" on a datum with no stated shift to WGS84; give the EPSG code of the data (--epsg, or the epsg option)',
    );
  });

  it('refuses an empty .prj', () => {
    expect(() => crsFromPrj('  ', 'f.prj')).toThrow('f.prj: the .prj file is empty; give the EPSG code of the data (--epsg, or the epsg option)');
  });
});

describe('crsResolveEpsg', () => {
  it('projects the Sydney point of the WGS84 UTM cross-check set in docs/references.md §2', () => {
    // WGS84 cross-check set (proj4 2.22, Krüger series and GeoConvert agree to 1 mm): −33.8688, 151.2093 → 56S 334368.634 6250948.345.
    const [e, n] = crsResolveEpsg(32756, 't').fromWgs84(151.2093, -33.8688);
    expect(e).toBeCloseTo(334368.634, 3);
    expect(n).toBeCloseTo(6250948.345, 3);
  });

  it('names an EPSG code it does not carry and lists the supported ones', () => {
    expect(() => crsResolveEpsg(9999, 'g.csv')).toThrow(/^g\.csv: EPSG:9999 is not a coordinate system stratplot knows; supported: 4326, /);
  });
});
