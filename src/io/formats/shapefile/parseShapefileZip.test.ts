import { readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Feature, FeatureCollection, Polygon, Position } from 'geojson';
import { unzipSync, zipSync } from 'fflate';
import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../../../core/geo/polygonAreaM2';
import type { AreaGeometry } from '../../../core/model/types';
import { crsResolveEpsg } from '../../crs/crsResolve';
import { dbfWrite } from './dbfWrite';
import { featuresToShapefileZip } from './featuresToShapefileZip';
import { NON_ASCII_NAMES, sampleExclusions, sampleFeatures } from '../../fixtures/ioSamples';
import { parseShapefileZip } from './parseShapefileZip';

/*
 * .prj texts in OGC WKT1 as the EPSG registry publishes them (epsg.org "WKT" export; typed from
 * the registry's parameter values, the TOWGS84 of British National Grid is EPSG transformation
 * 1314). The projected fixtures are built here with our own shapefile writer and proj4.
 */
const PRJ_27700 =
  'PROJCS["OSGB 1936 / British National Grid",GEOGCS["OSGB 1936",DATUM["OSGB_1936",SPHEROID["Airy 1830",6377563.396,299.3249646,' +
  'AUTHORITY["EPSG","7001"]],TOWGS84[446.448,-125.157,542.06,0.15,0.247,0.842,-20.489],AUTHORITY["EPSG","6277"]],' +
  'PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433],AUTHORITY["EPSG","4277"]],PROJECTION["Transverse_Mercator"],' +
  'PARAMETER["latitude_of_origin",49],PARAMETER["central_meridian",-2],PARAMETER["scale_factor",0.9996012717],' +
  'PARAMETER["false_easting",400000],PARAMETER["false_northing",-100000],UNIT["metre",1],AUTHORITY["EPSG","27700"]]';
const PRJ_2193_ESRI =
  'PROJCS["NZGD_2000_New_Zealand_Transverse_Mercator",GEOGCS["GCS_NZGD_2000",DATUM["D_NZGD_2000",SPHEROID["GRS_1980",6378137.0,298.257222101]],' +
  'PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",1600000.0],' +
  'PARAMETER["False_Northing",10000000.0],PARAMETER["Central_Meridian",173.0],PARAMETER["Scale_Factor",0.9996],' +
  'PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]';
const PRJ_UTM55S_ESRI =
  'PROJCS["WGS_1984_UTM_Zone_55S",GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]],' +
  'PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",500000.0],' +
  'PARAMETER["False_Northing",10000000.0],PARAMETER["Central_Meridian",147.0],PARAMETER["Scale_Factor",0.9996],' +
  'PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]';

const LEGACY_NAMES = ['Forêt humide', 'Prés salés à 5 €', 'Lande sèche'];

/** A shapefile whose .dbf is windows-1252 and which has no .cpg, as legacy desktop tools wrote them. */
function legacyZip(): Uint8Array {
  const fc = sampleFeatures(2.35, 48.85);
  const files = unzipSync(featuresToShapefileZip(fc, { layerName: 'legacy' }));
  delete files['legacy.cpg'];
  // windows-1252 bytes: Latin-1 letters keep their code points, € is 0x80 (WHATWG Encoding, index-windows-1252).
  const cp1252 = (s: string) => Uint8Array.from([...s].map((c) => (c === '€' ? 0x80 : c.charCodeAt(0))));
  const rows = LEGACY_NAMES.map((stratum) => ({ stratum }));
  const utf8 = dbfWrite(rows, ['stratum']);
  // Same header layout with single-byte text: field width from the cp1252 lengths.
  const width = Math.max(...rows.map((r) => cp1252(r.stratum).length));
  const dbf = new Uint8Array(32 + 32 + 1 + (1 + width) * rows.length + 1);
  dbf.set(utf8.subarray(0, 65));
  new DataView(dbf.buffer).setUint16(10, 1 + width, true);
  dbf[32 + 16] = width;
  rows.forEach((r, i) => {
    const at = 65 + i * (1 + width);
    dbf.fill(0x20, at, at + 1 + width);
    dbf.set(cp1252(r.stratum), at + 1);
  });
  dbf[dbf.length - 1] = 0x1a;
  files['legacy.dbf'] = dbf;
  return zipSync(files, { mtime: new Date('2000-01-01T00:00:00Z') });
}

/*
 * Fixture files in src/io/fixtures, built by our own shapefile writer with proj4 from the
 * invented sample map; STRATPLOT_REGEN_FIXTURES=1 rewrites them (review the diff).
 */
const FIXTURES = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures');
const FIXTURE_FILES: [string, () => Uint8Array][] = [
  ['strata-bng-27700.zip', () => featuresToShapefileZip(sampleFeatures(-1.5, 52.5), { layerName: 'strata-bng', crs: crsResolveEpsg(27700, 'fixture'), prj: PRJ_27700, date: new Date('2026-01-01T00:00:00Z') })],
  ['strata-nztm-2193.zip', () => featuresToShapefileZip(sampleFeatures(172.6, -43.5), { layerName: 'strata-nztm', crs: crsResolveEpsg(2193, 'fixture'), prj: PRJ_2193_ESRI, date: new Date('2026-01-01T00:00:00Z') })],
  ['strata-legacy-cp1252-no-cpg.zip', legacyZip],
];
if (process.env.STRATPLOT_REGEN_FIXTURES === '1') for (const [name, build] of FIXTURE_FILES) writeFileSync(join(FIXTURES, name), build());

describe('committed shapefile fixtures', () => {
  it('reads the British National Grid fixture with WGS84 areas within 1e-6', async () => {
    const back = await parseShapefileZip('strata-bng-27700.zip', new Uint8Array(readFileSync(join(FIXTURES, 'strata-bng-27700.zip'))));
    sampleFeatures(-1.5, 52.5).features.forEach((f, i) => {
      const want = polygonAreaM2(f.geometry as AreaGeometry);
      expect(Math.abs(polygonAreaM2(back.features[i].geometry as AreaGeometry) - want) / want).toBeLessThanOrEqual(1e-6);
    });
  });

  it('reads the NZTM fixture with WGS84 areas within 1e-6', async () => {
    const back = await parseShapefileZip('strata-nztm-2193.zip', new Uint8Array(readFileSync(join(FIXTURES, 'strata-nztm-2193.zip'))));
    expect(back.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    sampleFeatures(172.6, -43.5).features.forEach((f, i) => {
      const want = polygonAreaM2(f.geometry as AreaGeometry);
      expect(Math.abs(polygonAreaM2(back.features[i].geometry as AreaGeometry) - want) / want).toBeLessThanOrEqual(1e-6);
    });
  });

  it('reads the legacy windows-1252 fixture with the encoding option', async () => {
    const back = await parseShapefileZip('legacy.zip', new Uint8Array(readFileSync(join(FIXTURES, 'strata-legacy-cp1252-no-cpg.zip'))), { encoding: '1252' });
    expect(back.features.map((f) => f.properties?.stratum)).toEqual(LEGACY_NAMES);
  });
});

function positions(fc: FeatureCollection): Position[] {
  const out: Position[] = [];
  const walk = (c: unknown): void => {
    if (typeof (c as number[])[0] === 'number') out.push(c as Position);
    else (c as unknown[]).forEach(walk);
  };
  for (const f of fc.features) if (f.geometry && 'coordinates' in f.geometry) walk(f.geometry.coordinates);
  return out;
}

/** Shoelace formula: positive for a counter-clockwise ring (x east, y north). */
function ringSignedArea(ring: Position[]): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return s / 2;
}

describe('parseShapefileZip and featuresToShapefileZip', () => {
  it('round-trips polygons with holes and multipolygons in WGS84 with attributes and non-ASCII names', async () => {
    const fc = sampleFeatures(151.2, -33.87);
    const zip = featuresToShapefileZip(fc, { layerName: 'strata' });
    const back = await parseShapefileZip('strata.zip', zip);
    expect(back.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    expect(back.features.map((f) => f.properties?.cover_pct)).toEqual([62.5, 18, 91.25]);
    expect(back.features[0].geometry.type).toBe('Polygon');
    expect((back.features[0].geometry as Polygon).coordinates).toHaveLength(2);
    expect(back.features[1].geometry.type).toBe('MultiPolygon');
    for (let i = 0; i < fc.features.length; i++) {
      const a = polygonAreaM2(fc.features[i].geometry as AreaGeometry);
      expect(polygonAreaM2(back.features[i].geometry as AreaGeometry)).toBeCloseTo(a, 6);
    }
  });

  it('writes shells clockwise and holes counter-clockwise as the shapefile specification requires', async () => {
    const fc = sampleFeatures(10, 50);
    const files = unzipSync(featuresToShapefileZip(fc, { layerName: 's' }));
    // Read the first record's rings straight from the .shp bytes (ESRI Shapefile Technical Description, 1998).
    const shp = files['s.shp'];
    const v = new DataView(shp.buffer, shp.byteOffset);
    const rec = 100 + 8;
    const numParts = v.getInt32(rec + 36, true);
    const numPoints = v.getInt32(rec + 40, true);
    const starts = Array.from({ length: numParts }, (_, i) => v.getInt32(rec + 44 + 4 * i, true));
    const pts = rec + 44 + 4 * numParts;
    const ring = (k: number) => {
      const end = k + 1 < numParts ? starts[k + 1] : numPoints;
      return Array.from({ length: end - starts[k] }, (_, i) => [v.getFloat64(pts + 16 * (starts[k] + i), true), v.getFloat64(pts + 16 * (starts[k] + i) + 8, true)]);
    };
    expect(numParts).toBe(2);
    expect(ringSignedArea(ring(0))).toBeLessThan(0);
    expect(ringSignedArea(ring(1))).toBeGreaterThan(0);
    // The sample shell runs SW → SE → NE (counter-clockwise); written clockwise it goes SW → NW first.
    expect(ring(0)[0]).toEqual([10, 50]);
    expect(ring(0)[1]).toEqual([10, 50.0015]);
  });

  it('splits a mixed collection into one layer per shape type and reads each by name', async () => {
    const fc = { type: 'FeatureCollection', features: [...sampleFeatures(0, 0).features, ...sampleExclusions(0, 0).features] } as FeatureCollection;
    const zip = featuresToShapefileZip(fc, { layerName: 'site' });
    await expect(parseShapefileZip('site.zip', zip)).rejects.toThrow(/site_lines, site_points, site_polygons/);
    const lines = await parseShapefileZip('site.zip', zip, { layer: 'site_lines' });
    expect(lines.features[0].properties?.name).toBe('Falaise nord — invented');
    const points = await parseShapefileZip('site.zip', zip, { layer: 'site_points' });
    expect(points.features[0].properties?.name).toBe('旧井戸 old well (invented)');
    expect(points.features[0].geometry).toEqual(sampleExclusions(0, 0).features[1].geometry);
  });

  const projected: [string, number, string, number, number][] = [
    ['British National Grid (OGC WKT with TOWGS84)', 27700, PRJ_27700, -1.5, 52.5],
    ['NZTM (ESRI WKT, no authority)', 2193, PRJ_2193_ESRI, 172.6, -43.5],
    ['UTM 55S (ESRI WKT, no authority)', 32755, PRJ_UTM55S_ESRI, 147.3, -42.9],
  ];
  for (const [label, epsg, prj, lon0, lat0] of projected) {
    it(`imports a shapefile in ${label} with the same coordinates and areas as in WGS84`, async () => {
      const fc = sampleFeatures(lon0, lat0);
      const zip = featuresToShapefileZip(fc, { layerName: 'p', crs: crsResolveEpsg(epsg, 'test'), prj });
      const raw = unzipSync(zip)['p.shp'];
      // The file really holds metres: the first shell vertex is far from any degree value.
      expect(Math.abs(new DataView(raw.buffer, raw.byteOffset).getFloat64(100 + 8 + 44 + 8, true))).toBeGreaterThan(1000);
      const back = await parseShapefileZip('p.zip', zip);
      const a = positions(fc);
      const b = positions(back);
      // Shells are re-wound on write, so compare as sets of rounded positions.
      const key = (p: Position) => `${p[0].toFixed(6)},${p[1].toFixed(6)}`;
      expect(new Set(b.map(key))).toEqual(new Set(a.map(key)));
      const nearest = (p: Position) => Math.min(...b.map((q) => Math.max(Math.abs(q[0] - p[0]), Math.abs(q[1] - p[1]))));
      for (const p of a) expect(nearest(p)).toBeLessThanOrEqual(1e-7);
      for (let i = 0; i < fc.features.length; i++) {
        const want = polygonAreaM2(fc.features[i].geometry as AreaGeometry);
        const got = polygonAreaM2(back.features[i].geometry as AreaGeometry);
        expect(Math.abs(got - want) / want).toBeLessThanOrEqual(1e-6);
      }
    });
  }

  it('projects the IOGP Guidance Note 7-2 British National Grid example with our EPSG:27700 definition', () => {
    // IOGP Publication 373-7-2 (Guidance Note 7 part 2), Transverse Mercator example: OSGB 1936
    // 50°30'N 0°30'E → E 577274.99, N 69740.50 (docs/references.md §2). The example is on OSGB 1936
    // itself, so the datum shift is left out: Airy 1830 geographic → our projection parameters.
    const def = crsResolveEpsg(27700, 'test').definition.replace(/\+towgs84=\S+/, '');
    const [e, n] = proj4('+proj=longlat +ellps=airy +no_defs', def, [0.5, 50.5]);
    expect(e).toBeCloseTo(577274.99, 1);
    expect(n).toBeCloseTo(69740.5, 1);
  });

  it('refuses a shapefile without a .prj and reads it when the EPSG code is given', async () => {
    const fc = sampleFeatures(172.6, -43.5);
    const zip = featuresToShapefileZip(fc, { layerName: 'nz', crs: crsResolveEpsg(2193, 't'), prj: PRJ_2193_ESRI });
    const files = unzipSync(zip);
    delete files['nz.prj'];
    const bare = zipSync(files);
    await expect(parseShapefileZip('nz.zip', bare)).rejects.toThrow('nz.zip (nz.shp): has no .prj, so its coordinate system is unknown; give the EPSG code (--epsg)');
    const back = await parseShapefileZip('nz.zip', bare, { epsg: 2193 });
    expect(polygonAreaM2(back.features[0].geometry as AreaGeometry)).toBeCloseTo(polygonAreaM2(fc.features[0].geometry as AreaGeometry), 3);
  });

  it('refuses a .prj it cannot understand and asks for the EPSG code', async () => {
    const files = unzipSync(featuresToShapefileZip(sampleFeatures(0, 0), { layerName: 'x' }));
    files['x.prj'] = new TextEncoder().encode('this is not WKT');
    await expect(parseShapefileZip('x.zip', zipSync(files))).rejects.toThrow(/x\.zip \(x\.shp\): the \.prj file is not WKT text; give the EPSG code/);
  });

  it('decodes a legacy windows-1252 .dbf without .cpg when the encoding is given, and refuses to guess otherwise', async () => {
    const zip = legacyZip();
    await expect(parseShapefileZip('legacy.zip', zip)).rejects.toThrow(
      'legacy.zip (legacy.shp): record 1, field stratum: text is not UTF-8 and there is no .cpg file; give the encoding of the .dbf (e.g. --encoding windows-1252)',
    );
    const back = await parseShapefileZip('legacy.zip', zip, { encoding: 'windows-1252' });
    expect(back.features.map((f: Feature) => f.properties?.stratum)).toEqual(LEGACY_NAMES);
  });

  it('says which file is not a zip', async () => {
    await expect(parseShapefileZip('bad.zip', new Uint8Array([1, 2, 3]))).rejects.toThrow('bad.zip: not a readable zip archive');
  });
});
