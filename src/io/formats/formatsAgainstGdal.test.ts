import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { FeatureCollection } from 'geojson';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../../core/geo/polygonAreaM2';
import type { AreaGeometry } from '../../core/model/types';
import { crsResolveEpsg } from '../crs/crsResolve';
import { featuresToGeoPackage } from './geopackage/featuresToGeoPackage';
import { featuresToGpx } from './gpx/featuresToGpx';
import { featuresToKml } from './kml/featuresToKml';
import { featuresToShapefileZip } from './shapefile/featuresToShapefileZip';
import { NON_ASCII_NAMES, positionGapDeg, sampleExclusions, sampleFeatures, samplePlots } from '../fixtures/ioSamples';
import { parseGeoPackage } from './geopackage/parseGeoPackage';
import { parseGpx } from './gpx/parseGpx';
import { parseKml } from './kml/parseKml';
import { parseShapefileZip } from './shapefile/parseShapefileZip';

/*
 * Cross-checks against GDAL/OGR (Debian gdal-bin, 3.6), the reference reader and writer of these
 * formats, and PROJ behind it: GDAL must read what we write, and we must read what GDAL writes.
 * Runs where ogr2ogr is installed (apt-get install gdal-bin); skipped elsewhere.
 */
const HAS_GDAL = (() => {
  try {
    execFileSync('ogr2ogr', ['--version'], { stdio: 'pipe' });
    return true;
  } catch {
    return false;
  }
})();

const FIXTURES = join(dirname(fileURLToPath(import.meta.url)), '..', 'fixtures');

function dir(): string {
  return mkdtempSync(join(tmpdir(), 'stratplot-gdal-'));
}

function ogrToGeoJson(source: string, layer?: string, extra: string[] = []): FeatureCollection {
  const d = dir();
  const out = join(d, 'out.geojson');
  execFileSync('ogr2ogr', ['-f', 'GeoJSON', '-lco', 'COORDINATE_PRECISION=12', ...extra, out, source, ...(layer ? [layer] : [])], { stdio: 'pipe' });
  return JSON.parse(readFileSync(out, 'utf8'));
}

describe.skipIf(!HAS_GDAL)('formats against GDAL/OGR', () => {
  it('GDAL reprojects our NZTM shapefile to the same WGS84 coordinates as our reader', async () => {
    const d = dir();
    const fc = sampleFeatures(172.6, -43.5);
    // ESRI WKT of NZTM as GDAL itself writes it for EPSG:2193.
    const prj =
      'PROJCS["NZGD_2000_New_Zealand_Transverse_Mercator",GEOGCS["GCS_NZGD_2000",DATUM["D_NZGD_2000",SPHEROID["GRS_1980",6378137.0,298.257222101]],' +
      'PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",1600000.0],' +
      'PARAMETER["False_Northing",10000000.0],PARAMETER["Central_Meridian",173.0],PARAMETER["Scale_Factor",0.9996],PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]';
    const zip = featuresToShapefileZip(fc, { layerName: 'nz', crs: crsResolveEpsg(2193, 't'), prj });
    writeFileSync(join(d, 'nz.zip'), zip);
    const gdal = ogrToGeoJson(`/vsizip/${join(d, 'nz.zip')}`, 'nz', ['-t_srs', 'EPSG:4326']);
    const ours = await parseShapefileZip('nz.zip', zip);
    expect(gdal.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    gdal.features.forEach((f, i) => {
      // Same rings in the same order (shell first: GDAL read our winding as the specification's),
      // vertices within 1e-7° after PROJ's and proj4's separate inverse projections.
      expect(positionGapDeg(f, ours.features[i])).toBeLessThanOrEqual(1e-7);
      const a = polygonAreaM2(f.geometry as AreaGeometry);
      const b = polygonAreaM2(ours.features[i].geometry as AreaGeometry);
      expect(Math.abs(a - b) / b).toBeLessThanOrEqual(1e-6);
      expect(Math.abs(b - polygonAreaM2(fc.features[i].geometry as AreaGeometry)) / b).toBeLessThanOrEqual(1e-6);
    });
  });

  it('PROJ converts the British National Grid fixture to the same WGS84 coordinates as our reader', async () => {
    // The source CRS is given to GDAL as the proj string of EPSG:27700 with the published EPSG:1314
    // Helmert shift, so PROJ cannot pick a grid (OSTN15) where one is installed: this checks our
    // transverse Mercator and Helmert against PROJ's own code, the parameters against IOGP 7-2 elsewhere.
    const file = join(FIXTURES, 'strata-bng-27700.zip');
    const gdal = ogrToGeoJson(`/vsizip/${file}`, undefined, ['-s_srs', crsResolveEpsg(27700, 't').definition, '-t_srs', 'EPSG:4326']);
    const ours = await parseShapefileZip('bng.zip', new Uint8Array(readFileSync(file)));
    for (const [i, f] of gdal.features.entries()) expect(positionGapDeg(f, ours.features[i])).toBeLessThanOrEqual(1e-7);
  });

  it('GDAL decodes the legacy fixture as windows-1252 to the same names our reader gives', async () => {
    const file = join(FIXTURES, 'strata-legacy-cp1252-no-cpg.zip');
    const gdal = ogrToGeoJson(`/vsizip/${file}`, undefined, ['--config', 'SHAPE_ENCODING', 'CP1252']);
    const ours = await parseShapefileZip('legacy.zip', new Uint8Array(readFileSync(file)), { encoding: 'windows-1252' });
    expect(ours.features.map((f) => f.properties?.stratum)).toEqual(gdal.features.map((f) => f.properties?.stratum));
    expect(gdal.features[1].properties?.stratum).toBe('Prés salés à 5 €');
  });

  it('we read a UTM shapefile that GDAL wrote, with its .prj, .cpg and attributes', async () => {
    const d = dir();
    const fc = sampleFeatures(147.3, -42.9);
    writeFileSync(join(d, 'in.geojson'), JSON.stringify(fc));
    execFileSync('ogr2ogr', ['-f', 'ESRI Shapefile', '-t_srs', 'EPSG:32755', '-lco', 'ENCODING=UTF-8', join(d, 'gdal.shp'), join(d, 'in.geojson')], { stdio: 'pipe' });
    execFileSync('zip', ['-q', '-j', join(d, 'gdal.zip'), ...['shp', 'shx', 'dbf', 'prj', 'cpg'].map((e) => join(d, `gdal.${e}`))], { stdio: 'pipe' });
    const back = await parseShapefileZip('gdal.zip', new Uint8Array(readFileSync(join(d, 'gdal.zip'))));
    expect(back.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    expect(back.features.map((f) => f.properties?.cover_pct)).toEqual([62.5, 18, 91.25]);
    back.features.forEach((f, i) => {
      const want = polygonAreaM2(fc.features[i].geometry as AreaGeometry);
      expect(Math.abs(polygonAreaM2(f.geometry as AreaGeometry) - want) / want).toBeLessThanOrEqual(1e-6);
    });
  });

  it('GDAL opens our GeoPackage and reads the same features and attributes', async () => {
    const d = dir();
    const layers = [
      { name: 'plots', features: samplePlots() as FeatureCollection },
      { name: 'strata', features: sampleFeatures(174.77, -41.29) },
    ];
    writeFileSync(join(d, 'site.gpkg'), await featuresToGeoPackage(layers));
    for (const layer of layers) {
      const gdal = ogrToGeoJson(join(d, 'site.gpkg'), layer.name);
      expect(gdal.features).toHaveLength(layer.features.features.length);
      gdal.features.forEach((f, i) => {
        expect(positionGapDeg(f, layer.features.features[i])).toBeLessThanOrEqual(1e-9);
        expect(f.properties?.stratum).toBe(layer.features.features[i].properties?.stratum);
      });
    }
  });

  it('we read a GeoPackage that GDAL wrote, in WGS84 and in NZTM', async () => {
    const d = dir();
    const fc = sampleFeatures(174.77, -41.29);
    writeFileSync(join(d, 'in.geojson'), JSON.stringify(fc));
    execFileSync('ogr2ogr', ['-f', 'GPKG', '-nln', 'strata', join(d, 'g.gpkg'), join(d, 'in.geojson')], { stdio: 'pipe' });
    execFileSync('ogr2ogr', ['-f', 'GPKG', '-t_srs', 'EPSG:2193', '-nln', 'strata_nztm', '-update', join(d, 'g.gpkg'), join(d, 'in.geojson')], { stdio: 'pipe' });
    const bytes = new Uint8Array(readFileSync(join(d, 'g.gpkg')));
    const wgs = await parseGeoPackage('g.gpkg', bytes, { layer: 'strata' });
    for (const [i, f] of wgs.features.entries()) expect(positionGapDeg(f, fc.features[i])).toBeLessThanOrEqual(1e-12);
    expect(wgs.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    const nz = await parseGeoPackage('g.gpkg', bytes, { layer: 'strata_nztm' });
    nz.features.forEach((f, i) => {
      const want = polygonAreaM2(fc.features[i].geometry as AreaGeometry);
      expect(Math.abs(polygonAreaM2(f.geometry as AreaGeometry) - want) / want).toBeLessThanOrEqual(1e-6);
    });
  });

  it('GDAL reads our KML folders and our GPX waypoints and tracks', () => {
    const d = dir();
    writeFileSync(join(d, 'site.kml'), featuresToKml([
      { name: 'Plots', features: samplePlots() as FeatureCollection },
      { name: 'Strata', features: sampleFeatures(-3.2, 55.95) },
    ]));
    const kmlPlots = ogrToGeoJson(join(d, 'site.kml'), 'Plots');
    expect(kmlPlots.features.map((f) => f.properties?.Name)).toEqual(['P001', 'P002', 'P003', 'P004', 'P005 (reserve)', 'P006 (reserve)']);
    expect(ogrToGeoJson(join(d, 'site.kml'), 'Strata').features).toHaveLength(3);
    writeFileSync(join(d, 'site.gpx'), featuresToGpx({ type: 'FeatureCollection', features: [...samplePlots().features, ...sampleExclusions(-3.2, 55.95).features] }));
    const wpts = ogrToGeoJson(join(d, 'site.gpx'), 'waypoints');
    expect(wpts.features.map((f) => f.properties?.name)).toEqual(['P001', 'P002', 'P003', 'P004', 'P005', 'P006', '旧井戸 old well (invented)']);
    for (const [i, f] of wpts.features.slice(0, 6).entries()) expect(positionGapDeg(f, samplePlots().features[i])).toBeLessThanOrEqual(1e-12);
    expect(ogrToGeoJson(join(d, 'site.gpx'), 'tracks').features).toHaveLength(1);
  });

  it('we read KML and GPX that GDAL wrote', async () => {
    const d = dir();
    const fc = { type: 'FeatureCollection', features: [...sampleFeatures(-3.2, 55.95).features] } as FeatureCollection;
    writeFileSync(join(d, 'in.geojson'), JSON.stringify(fc));
    execFileSync('ogr2ogr', ['-f', 'KML', join(d, 'g.kml'), join(d, 'in.geojson')], { stdio: 'pipe' });
    const kml = await parseKml('g.kml', new Uint8Array(readFileSync(join(d, 'g.kml'))));
    expect(kml.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    for (const [i, f] of kml.features.entries()) expect(positionGapDeg(f, fc.features[i])).toBeLessThanOrEqual(1e-7);
    const pts = { type: 'FeatureCollection', features: samplePlots().features.map((f) => ({ type: 'Feature', geometry: f.geometry, properties: { name: f.properties.plot_id, desc: f.properties.stratum } })) };
    writeFileSync(join(d, 'pts.geojson'), JSON.stringify(pts));
    execFileSync('ogr2ogr', ['-f', 'GPX', join(d, 'g.gpx'), join(d, 'pts.geojson')], { stdio: 'pipe' });
    const gpx = await parseGpx('g.gpx', new Uint8Array(readFileSync(join(d, 'g.gpx'))));
    expect(gpx.features.map((f) => f.properties?.desc)).toEqual(samplePlots().features.map((f) => f.properties.stratum));
    for (const [i, f] of gpx.features.entries()) expect(positionGapDeg(f, samplePlots().features[i])).toBeLessThanOrEqual(1e-7);
  });
});
