import type { FeatureCollection } from 'geojson';
import { describe, expect, it } from 'vitest';
import { crsResolveEpsg } from '../../crs/crsResolve';
import { featuresToGeoPackage } from './featuresToGeoPackage';
import { NON_ASCII_NAMES, positionGapDeg, sampleExclusions, sampleFeatures, samplePlots, withoutNulls } from '../../fixtures/ioSamples';
import { gpkgGeometryRead, gpkgGeometryWrite } from './gpkgGeometry';
import { geoPackageLayers, parseGeoPackage } from './parseGeoPackage';
import { sqlJsLoad } from './sqlJsLoad';

function layers() {
  return [
    { name: 'plots', features: samplePlots() as FeatureCollection },
    { name: 'strata', features: sampleFeatures(174.77, -41.29) },
    { name: 'exclusions', features: sampleExclusions(174.77, -41.29) },
  ];
}

describe('gpkgGeometryWrite and gpkgGeometryRead', () => {
  it('writes POINT(1 2) as the standard little-endian WKB after a GP header', () => {
    // WKB of OGC 06-103r4 §8.2.7: byte order 01, type 1 (uint32 LE), x and y as IEEE doubles LE.
    // 1.0 = 000000000000F03F, 2.0 = 0000000000000040 (IEEE 754 binary64).
    const blob = gpkgGeometryWrite({ type: 'Point', coordinates: [1, 2] }, 4326);
    const hex = Buffer.from(blob.subarray(40)).toString('hex').toUpperCase();
    expect(hex).toBe('0101000000000000000000F03F0000000000000040');
    // GeoPackage 1.3 §2.1.3.1.1: "GP", version 0, flags 0b00000011 (xy envelope, little endian), srs_id.
    expect([...blob.subarray(0, 8)]).toEqual([0x47, 0x50, 0, 3, 0xe6, 0x10, 0, 0]);
  });

  it('reads big-endian WKB and ISO Z geometries, dropping Z', () => {
    // Hand-built: header without envelope, big-endian WKB LineString Z (type 1002) of two points.
    const b = new Uint8Array(8 + 9 + 48);
    const v = new DataView(b.buffer);
    b.set([0x47, 0x50, 0, 0]);
    v.setInt32(4, 4326, false);
    b[8] = 0;
    v.setUint32(9, 1002, false);
    v.setUint32(13, 2, false);
    [1, 2, 3, 4, 5, 6].forEach((n, i) => {
      v.setFloat64(17 + 8 * i, n, false);
    });
    expect(gpkgGeometryRead(b).geometry).toEqual({ type: 'LineString', coordinates: [[1, 2], [4, 5]] });
  });
});

describe('featuresToGeoPackage and parseGeoPackage', () => {
  it('writes the tables and pragmas GeoPackage 1.3 requires', async () => {
    const bytes = await featuresToGeoPackage(layers());
    const SQL = await sqlJsLoad();
    const db = new SQL.Database(bytes);
    // GeoPackage 1.3 Req 2 (application_id 0x47504B47 "GPKG") and Req 3 (user_version 10300).
    expect(db.exec('PRAGMA application_id')[0].values[0][0]).toBe(0x47504b47);
    expect(db.exec('PRAGMA user_version')[0].values[0][0]).toBe(10300);
    // Req 11: rows for srs_id -1, 0 and 4326 exist.
    expect(db.exec('SELECT srs_id FROM gpkg_spatial_ref_sys ORDER BY srs_id')[0].values.flat()).toEqual([-1, 0, 4326]);
    expect(db.exec('SELECT table_name, geometry_type_name FROM gpkg_geometry_columns ORDER BY table_name')[0].values).toEqual([
      ['exclusions', 'GEOMETRY'],
      ['plots', 'POINT'],
      ['strata', 'GEOMETRY'],
    ]);
    expect(db.exec('PRAGMA integrity_check')[0].values[0][0]).toBe('ok');
    db.close();
  });

  it('describes every layer in gpkg_contents (the caution, in exports)', async () => {
    const bytes = await featuresToGeoPackage(layers(), { description: 'Caution: a planning aid (invented text).' });
    const SQL = await sqlJsLoad();
    const db = new SQL.Database(bytes);
    // GeoPackage 1.3 §1.1.3.1.1, gpkg_contents.description: "a human-readable description".
    expect(db.exec('SELECT table_name, description FROM gpkg_contents ORDER BY table_name')[0].values).toEqual(
      ['exclusions', 'plots', 'strata'].map((t) => [t, 'Caution: a planning aid (invented text).']),
    );
    db.close();
  });

  it('round-trips every layer with the same coordinates, typed attributes and non-ASCII names', async () => {
    const bytes = await featuresToGeoPackage(layers());
    expect(await geoPackageLayers('site.gpkg', bytes)).toEqual(['exclusions', 'plots', 'strata']);
    for (const layer of layers()) {
      const back = await parseGeoPackage('site.gpkg', bytes, { layer: layer.name });
      back.features.forEach((f, i) => {
        const original = layer.features.features[i];
        expect(positionGapDeg(f, original)).toBeLessThanOrEqual(1e-7);
        expect(withoutNulls(f.properties)).toEqual(withoutNulls(original.properties));
      });
    }
    const strata = await parseGeoPackage('site.gpkg', bytes, { layer: 'strata' });
    expect(strata.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
  });

  it('reprojects a layer stored in UTM back to WGS84 through gpkg_spatial_ref_sys', async () => {
    const fc = sampleFeatures(-122.42, 37.77);
    const wkt = 'PROJCS["WGS 84 / UTM zone 10N",GEOGCS["WGS 84",DATUM["WGS_1984",SPHEROID["WGS 84",6378137,298.257223563]]],AUTHORITY["EPSG","32610"]]';
    const bytes = await featuresToGeoPackage([{ name: 'strata', features: fc }], { crs: { transform: crsResolveEpsg(32610, 't'), epsg: 32610, wkt, name: 'WGS 84 / UTM zone 10N' } });
    const back = await parseGeoPackage('utm.gpkg', bytes);
    for (const [i, f] of back.features.entries()) expect(positionGapDeg(f, fc.features[i])).toBeLessThanOrEqual(1e-7);
  });

  it('asks for a layer when there are several, and names an unknown one', async () => {
    const bytes = await featuresToGeoPackage(layers());
    await expect(parseGeoPackage('site.gpkg', bytes)).rejects.toThrow('site.gpkg: holds 3 layers; choose one with --layer: exclusions, plots, strata');
    await expect(parseGeoPackage('site.gpkg', bytes, { layer: 'roads' })).rejects.toThrow('site.gpkg: no layer "roads"; layers are: exclusions, plots, strata');
  });

  it('says when a file is not a GeoPackage', async () => {
    await expect(parseGeoPackage('x.gpkg', new TextEncoder().encode('hello'))).rejects.toThrow('x.gpkg: not a GeoPackage (not an SQLite database)');
  });
});
