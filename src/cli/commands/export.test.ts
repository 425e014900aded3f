import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import geodesic from 'geographiclib-geodesic';
import Papa from 'papaparse';
import { GPX_XSD } from '../../../tests/schemas/paths';
import { describe, expect, it } from 'vitest';
import { samplePlots, sampleExclusions, sampleFeatures } from '../../io/fixtures/ioSamples';
import { parseFeatureFile } from '../../io/site/parseFeatureFile';
import { runCli } from '../main';

function workspace() {
  const dir = mkdtempSync(join(tmpdir(), 'stratplot-export-'));
  writeFileSync(join(dir, 'plots.geojson'), JSON.stringify(samplePlots()));
  writeFileSync(join(dir, 'strata.geojson'), JSON.stringify(sampleFeatures(-122.42, 37.77)));
  writeFileSync(join(dir, 'excl.geojson'), JSON.stringify(sampleExclusions(-122.42, 37.77)));
  return dir;
}

async function run(dir: string, ...argv: string[]) {
  let out = '';
  let err = '';
  const code = await runCli(['export', ...argv], { out: (t) => (out += t), err: (t) => (err += t), cwd: dir });
  return { code, out, err };
}

describe('stratplot export', () => {
  it('writes GPX that validates against the GPX 1.1 schema', async () => {
    const dir = workspace();
    const r = await run(dir, 'plots.geojson', '--format', 'gpx', '--out', 'plots.gpx');
    expect(r).toMatchObject({ code: 0, err: '' });
    expect(r.out).toBe('wrote plots.gpx (gpx): 4 primary and 2 reserve plots\n');
    // Topografix GPX 1.1 schema (docs/references.md §9): xmllint exits 0 when the file is valid.
    execFileSync('xmllint', ['--noout', '--schema', GPX_XSD, join(dir, 'plots.gpx')], { stdio: 'pipe' });
  });

  it('writes a shapefile zip with strata and exclusions that reads back by layer', async () => {
    const dir = workspace();
    const r = await run(dir, 'plots.geojson', '--format', 'shp', '--out', 'site.zip', '--strata', 'strata.geojson', '--exclude', 'excl.geojson');
    expect(r.code).toBe(0);
    const bytes = new Uint8Array(readFileSync(join(dir, 'site.zip')));
    const strata = await parseFeatureFile('site.zip', bytes, { layer: 'strata' });
    expect(strata.features.map((f) => f.properties?.stratum)).toEqual(['Forêt humide', 'Ngā otaota', '草地']);
    const plots = await parseFeatureFile('site.zip', bytes, { layer: 'plots' });
    expect(plots.features.map((f) => f.properties?.plot_id)).toEqual(['P001', 'P002', 'P003', 'P004', 'P005', 'P006']);
  });

  it('writes CSV with a byte-order mark when asked', async () => {
    const dir = workspace();
    expect((await run(dir, 'plots.geojson', '--format', 'csv', '--out', 'p.csv', '--bom')).code).toBe(0);
    expect([...readFileSync(join(dir, 'p.csv')).subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  });

  it('writes field sheets as a PDF', async () => {
    const dir = workspace();
    const r = await run(dir, 'plots.geojson', '--format', 'sheets', '--out', 'sheets.pdf', '--paper', 'letter', '--survey-date', '2026-03-01');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    expect(readFileSync(join(dir, 'sheets.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('refuses an unknown format with one line listing the formats, exit 2', async () => {
    const r = await run(workspace(), 'plots.geojson', '--format', 'dxf', '--out', 'x.dxf');
    expect(r).toEqual({ code: 2, out: '', err: 'stratplot export: --format "dxf" is not one of gpx, kml, kmz, csv, geojson, shp, gpkg, sheets, report\n' });
  });

  it('refuses an output name whose extension does not match the format', async () => {
    const r = await run(workspace(), 'plots.geojson', '--format', 'shp', '--out', 'site.shp');
    expect(r).toEqual({ code: 2, out: '', err: 'stratplot export: --out site.shp: a shp export is written as .zip; name the file *.zip\n' });
  });

  it('says that exclusions need the strata file', async () => {
    const r = await run(workspace(), 'plots.geojson', '--format', 'kml', '--out', 'x.kml', '--exclude', 'excl.geojson');
    expect(r.err).toBe('stratplot export: --exclude and --access need --strata (the map the design was made on)\n');
    expect(r.code).toBe(2);
  });

  it('names a missing plot file', async () => {
    const r = await run(workspace(), 'nope.geojson', '--format', 'kml', '--out', 'x.kml');
    expect(r).toEqual({ code: 2, out: '', err: 'stratplot export: file not found: nope.geojson\n' });
  });
});

describe('stratplot export with the site', () => {
  const demo = (name: string) => fileURLToPath(new URL(`../../../demo-maps/ochre-spit-${name}.geojson`, import.meta.url));

  it('adds each plot’s route from the chosen access point and the safety notes at the given thresholds', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'stratplot-export-site-'));
    const planned = await runCli(
      ['plan', demo('strata'), '--exclude', demo('exclusions'), '--plots', '12', '--seed', '3', '--out', 'plots.geojson'],
      { out: () => undefined, err: () => undefined, cwd: dir },
    );
    expect(planned).toBe(0);
    const r = await run(
      dir, 'plots.geojson', '--format', 'csv', '--out', 'p.csv', '--strata', demo('strata'), '--exclude', demo('exclusions'),
      '--access', demo('access'), '--from', 'North car park', '--cliff-near-m', '5000', '--survey-date', '2026-06-01',
    );
    expect(r.code, r.err).toBe(0);
    const rows = Papa.parse<Record<string, string>>(readFileSync(join(dir, 'p.csv'), 'utf8'), { header: true, skipEmptyLines: true }).data;
    expect(rows).toHaveLength(12);
    const car = [119.1001937, -34.4353495]; // North car park in the invented demo's access file
    for (const row of rows) {
      expect(row.access_point).toBe('access-north');
      // Independent check: geodesic distance and azimuth from geographiclib-geodesic 2.2 (Karney 2013).
      const g = geodesic.Geodesic.WGS84.Inverse(car[1], car[0], Number(row.lat), Number(row.lon));
      expect(Math.abs(Number(row.distance_m) - (g.s12 ?? 0))).toBeLessThan(0.06);
      expect(Math.abs(Number(row.bearing_true_deg) - (((g.azi1 ?? 0) + 360) % 360))).toBeLessThan(0.06);
      // A 5 km threshold takes in the whole invented site, so every plot is noted near the cliff.
      expect(row.notes).toMatch(/Cliff edge .* away/);
      expect(row.mag_model).toMatch(/^WMM-2025/);
    }
  });

  it('refuses an access point the site does not have, listing those it has', async () => {
    const dir = workspace();
    const r = await run(dir, 'plots.geojson', '--format', 'csv', '--out', 'p.csv', '--strata', demo('strata'), '--access', demo('access'), '--from', 'South jetty');
    expect(r.code).toBe(2);
    expect(r.err).toBe('stratplot export: --from "South jetty" is not an access point of the site; known: "North car park" (access-north), "Creek Road gate" (access-east)\n');
  });

  it('names the site in the GPS file as asked', async () => {
    const dir = workspace();
    const r = await run(dir, 'plots.geojson', '--format', 'gpx', '--out', 'p.gpx', '--strata', demo('strata'), '--site-name', 'Ochre Spit (invented)');
    expect(r.code, r.err).toBe(0);
    expect(readFileSync(join(dir, 'p.gpx'), 'utf8')).toContain('<metadata><name>Ochre Spit (invented)</name>');
  });
});
