import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { unzipSync, zipSync } from 'fflate';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../core/geo/polygonAreaM2';
import type { AreaGeometry } from '../core/model/types';
import { crsResolveEpsg } from '../io/crs/crsResolve';
import { featuresToGeoPackage } from '../io/formats/geopackage/featuresToGeoPackage';
import { featuresToShapefileZip } from '../io/formats/shapefile/featuresToShapefileZip';
import { NON_ASCII_NAMES, sampleExclusions, sampleFeatures } from '../io/fixtures/ioSamples';
import { runCli } from './main';
import { importFlagsRead, importOptionsFor } from './importFlags';

// The invented sample site, placed in Tasmania (UTM zone 55S).
const LON0 = 147.3;
const LAT0 = -42.9;
const site = sampleFeatures(LON0, LAT0);
const strataOnly = { ...site, features: site.features.filter((f) => f.geometry.type !== 'LineString' && f.geometry.type !== 'Point') };
const utm55s = crsResolveEpsg(32755, 'test');

/** A UTM 55S shapefile whose .prj was lost, as happens when only .shp/.shx/.dbf are copied. */
function zipWithoutPrj(): Uint8Array {
  const files = unzipSync(featuresToShapefileZip(strataOnly, { layerName: 'strata', crs: utm55s, prj: 'PROJCS["WGS 84 / UTM zone 55S"]' }));
  delete files['strata.prj'];
  return zipSync(files);
}

const dir = mkdtempSync(join(tmpdir(), 'stratplot-import-'));
const FIXTURES = join(dirname(fileURLToPath(import.meta.url)), '../io/fixtures');
writeFileSync(join(dir, 'noprj.zip'), zipWithoutPrj());
writeFileSync(join(dir, 'legacy.zip'), readFileSync(join(FIXTURES, 'strata-legacy-cp1252-no-cpg.zip')));
writeFileSync(join(dir, 'bom.geojson'), `\ufeff${JSON.stringify(strataOnly)}`);
// An invented 30 m hazard inside the first stratum, as a CSV of UTM 55S eastings/northings in
// columns the reader cannot guess.
const [hazardE, hazardN] = utm55s.fromWgs84(LON0 + 0.0015, LAT0 + 0.001);
writeFileSync(join(dir, 'hazard.csv'), `pos_x,pos_y,kind,buffer_m,name\n${hazardE.toFixed(3)},${hazardN.toFixed(3)},hazard,30,Old shaft (invented)\n`);
const gpkgReady = featuresToGeoPackage([
  { name: 'strata', features: strataOnly },
  { name: 'hazards', features: sampleExclusions(LON0, LAT0) },
]).then((bytes) => writeFileSync(join(dir, 'site.gpkg'), bytes));

async function cli(...argv: string[]) {
  await gpkgReady;
  let out = '';
  let err = '';
  const code = await runCli(argv, { out: (t) => { out += t; }, err: (t) => { err += t; }, cwd: dir });
  return { code, out, err };
}

const wantAreasM2 = strataOnly.features.map((f) => polygonAreaM2(f.geometry as AreaGeometry));

describe('import flags on the command line', () => {
  it('asks for --epsg when a shapefile has no .prj, and reads it in that system when given', async () => {
    const missing = await cli('areas', 'noprj.zip');
    expect(missing.code).toBe(2);
    expect(missing.err).toBe('stratplot areas: noprj.zip (strata.shp): has no .prj, so its coordinate system is unknown; give the EPSG code (--epsg)\n');
    const given = await cli('areas', 'noprj.zip', '--epsg', '32755', '--json');
    expect(given.code).toBe(0);
    const doc = JSON.parse(given.out);
    expect(doc.strata.map((s: { stratum: string }) => s.stratum)).toEqual([...NON_ASCII_NAMES]);
    // Written from WGS84 through UTM and read back: areas agree with the source polygons' geodesic
    // areas (polygonAreaM2, checked against GeographicLib elsewhere) to 1e-6.
    doc.strata.forEach((s: { area_m2: number }, i: number) => {
      expect(Math.abs(s.area_m2 / wantAreasM2[i] - 1)).toBeLessThan(1e-6);
    });
    expect(doc.crs).toEqual({ utm_zone: '55S', epsg: 32755 });
  });

  it('accepts the EPSG: prefix and refuses codes it does not carry', async () => {
    expect((await cli('areas', 'noprj.zip', '--epsg', 'EPSG:32755')).code).toBe(0);
    const unknown = await cli('areas', 'noprj.zip', '--epsg', '3111');
    expect(unknown.code).toBe(2);
    expect(unknown.err).toMatch(/^stratplot areas: --epsg 3111: EPSG:3111 is not a coordinate system stratplot knows; supported: 4326, /);
    const words = await cli('areas', 'noprj.zip', '--epsg', 'utm55');
    expect(words.err).toBe('stratplot areas: --epsg needs an EPSG code such as 27700 or EPSG:32755, got "utm55"\n');
  });

  it('needs --layer for a GeoPackage with two layers and reads the one named', async () => {
    const two = await cli('areas', 'site.gpkg');
    expect(two.code).toBe(2);
    expect(two.err).toBe('stratplot areas: site.gpkg: holds 2 layers; choose one with --layer: hazards, strata\n');
    const named = await cli('areas', 'site.gpkg', '--layer', 'strata', '--json');
    expect(named.code).toBe(0);
    expect(JSON.parse(named.out).strata.map((s: { stratum: string }) => s.stratum)).toEqual([...NON_ASCII_NAMES]);
    const wrong = await cli('areas', 'site.gpkg', '--layer', 'plots');
    expect(wrong.code).toBe(2);
    expect(wrong.err).toMatch(/^stratplot areas: site\.gpkg: .*plots/);
  });

  it('decodes a windows-1252 .dbf without .cpg with --encoding windows-1252', async () => {
    const refused = await cli('areas', 'legacy.zip');
    expect(refused.code).toBe(2);
    expect(refused.err).toMatch(/text is not UTF-8 and there is no \.cpg file; give the encoding of the \.dbf \(e\.g\. --encoding windows-1252\)/);
    const read = await cli('areas', 'legacy.zip', '--encoding', 'windows-1252', '--json');
    expect(read.code).toBe(0);
    // windows-1252 bytes per the WHATWG Encoding Standard's index (0x80 = €); names as the fixture wrote them.
    expect(JSON.parse(read.out).strata.map((s: { stratum: string }) => s.stratum)).toEqual(['Forêt humide', 'Prés salés à 5 €', 'Lande sèche']);
    const unknown = await cli('areas', 'legacy.zip', '--encoding', 'klingon');
    expect(unknown.err).toBe('stratplot areas: --encoding: unknown text encoding "klingon" (try utf-8, windows-1252 or latin1)\n');
  });

  it('reads a point CSV of exclusions from the columns named by --x-column and --y-column', async () => {
    const guess = await cli('areas', 'noprj.zip', '--epsg', '32755', '--exclude', 'hazard.csv');
    expect(guess.code).toBe(2);
    expect(guess.err).toMatch(/^stratplot areas: hazard\.csv: cannot tell which columns hold the coordinates/);
    const named = await cli('areas', 'noprj.zip', '--epsg', '32755', '--exclude', 'hazard.csv', '--x-column', 'pos_x', '--y-column', 'pos_y', '--json');
    expect(named.code).toBe(0);
    const first = JSON.parse(named.out).strata[0];
    // The 30 m hazard lies wholly inside the first stratum (34 m from its hole): it loses π·30² m²
    // (elementary geometry), within 0.2 % as the buffer is drawn as a many-sided polygon.
    expect(Math.abs((first.area_m2 - first.usable_m2) / (Math.PI * 900) - 1)).toBeLessThan(2e-3);
    const without = JSON.parse((await cli('areas', 'noprj.zip', '--epsg', '32755', '--json')).out).strata[0];
    expect(without.usable_m2).toBeCloseTo(without.area_m2, 3);
    const half = await cli('areas', 'noprj.zip', '--x-column', 'pos_x');
    expect(half.err).toBe('stratplot areas: give --x-column and --y-column together (only --x-column was given)\n');
  });

  it('says what to do when an exclusions file needs a flag that reads only the strata file', async () => {
    const prj = await cli('areas', 'bom.geojson', '--exclude', 'noprj.zip');
    expect(prj.code).toBe(2);
    expect(prj.err).toBe(
      'stratplot areas: noprj.zip (strata.shp): has no .prj, so its coordinate system is unknown; give the EPSG code (--epsg)' +
        ' — but --epsg reads the strata file only: give it its coordinate system (a .prj, or save it as GeoJSON in WGS84)\n',
    );
    const layers = await cli('plan', 'bom.geojson', '--plots', '3', '--seed', '1', '--exclude', 'site.gpkg');
    expect(layers.code).toBe(2);
    expect(layers.err).toMatch(/^stratplot plan: site\.gpkg: holds 2 layers; choose one with --layer: hazards, strata — but --layer reads the strata file only: keep it to one layer\n$/);
  });

  it('reads a GeoJSON strata file that starts with a UTF-8 byte-order mark', async () => {
    const r = await cli('areas', 'bom.geojson', '--json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).strata[0].stratum).toBe(NON_ASCII_NAMES[0]);
    const layer = await cli('areas', 'bom.geojson', '--layer', 'strata');
    expect([layer.code, layer.err]).toEqual([2, 'stratplot areas: --layer does not apply to bom.geojson: a GeoJSON file holds one layer\n']);
  });

  it('passes the flags to plan, traps and export', async () => {
    const plan = await cli('plan', 'noprj.zip', '--epsg', '32755', '--plots', '6', '--min-per-stratum', '1', '--seed', '7', '--json');
    expect(plan.code).toBe(0);
    expect(JSON.parse(plan.out).crs.epsg).toBe(32755);
    const traps = await cli('traps', 'site.gpkg', '--layer', 'strata', '--grids', '1', '--rows', '2', '--cols', '2', '--spacing', '10', '--seed', '3', '--json');
    expect(traps.code).toBe(0);
    expect(JSON.parse(traps.out).stations).toBe(12);
    const lone = await cli('export', 'plots.geojson', '--format', 'gpx', '--out', 'p.gpx', '--layer', 'strata');
    expect(lone.err).toBe('stratplot export: --layer, --epsg, --encoding and --x-column/--y-column say how to read --strata FILE; give --strata\n');
  });

  it('says in every command\'s help which file the flags read', async () => {
    for (const [command, file] of [['areas', '<strata-file>'], ['plan', '<strata-file>'], ['traps', '<strata-file>'], ['export', '--strata FILE']]) {
      const help = (await cli(command, '--help')).out;
      expect(help).toContain(`Reading the strata file (${file})`);
      for (const flag of ['--layer NAME', '--epsg CODE', '--encoding NAME', '--x-column NAME', '--y-column NAME']) expect(help).toContain(flag);
    }
  });
});

describe('importFlagsRead', () => {
  it('gives the strata file every choice and other files only the CSV columns', () => {
    const { strata, other } = importFlagsRead({ layer: 'strata', epsg: '27700', encoding: '1252', 'x-column': 'E', 'y-column': 'N' });
    expect(strata).toEqual({ layer: 'strata', epsg: 27700, encoding: 'windows-1252', csvColumns: { x: 'E', y: 'N', epsg: 27700 } });
    expect(other).toEqual({ csvColumns: { x: 'E', y: 'N', epsg: 27700 } });
    expect(importFlagsRead({})).toEqual({ strata: {}, other: {} });
  });

  it('refuses a flag the strata file\'s format has no use for, rather than ignoring it', () => {
    expect(() => importOptionsFor('site.kml', { epsg: 27700 })).toThrow('--epsg does not apply to site.kml: KML coordinates are always WGS84 longitude/latitude');
    expect(() => importOptionsFor('strata.geojson', { layer: 'a' })).toThrow('--layer does not apply to strata.geojson: a GeoJSON file holds one layer');
    expect(() => importOptionsFor('site.gpkg', { encoding: 'windows-1252' })).toThrow('--encoding does not apply to site.gpkg: a GeoPackage stores its text in the Unicode encoding SQLite declares');
    expect(importOptionsFor('strata.zip', { layer: 'a', epsg: 2193, encoding: 'utf-8' })).toEqual({ layer: 'a', epsg: 2193, encoding: 'utf-8' });
  });
});
