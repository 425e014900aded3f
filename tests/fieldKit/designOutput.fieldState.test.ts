import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { unzipSync } from 'fflate';
import type { FeatureCollection } from 'geojson';
import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import { GPX_XSD } from '../schemas/paths';
import { designRun } from '../../src/core/design/designRun';
import type { PlotCollection } from '../../src/core/model/designTypes';
import { FIELD_CAUTION, FIELD_CAUTION_LINE } from '../../src/core/field/fieldCaution';
import { plotsRejectAndPromote } from '../../src/core/field/plotsRejectAndPromote';
import { plotsRestore } from '../../src/core/field/plotsRestore';
import type { Site } from '../../src/core/model/types';
import { planFileParse } from '../../src/state/planFile';
import { designOutputBytes } from '../../src/io/plots/designOutput';
import { parseFeatureFile } from '../../src/io/site/parseFeatureFile';
import { parseKml } from '../../src/io/formats/kml/parseKml';
import { parsePlotFile } from '../../src/io/plots/parsePlotFile';

/*
 * One rejection, every format: each file is read back by an outside reader where one is installed
 * (GDAL/OGR for GPX, KML, shapefile and GeoPackage; papaparse for CSV; poppler's pdftotext for the
 * PDFs; xmllint with the Topografix GPX 1.1 schema) and by our own readers. The rejected plot must
 * not read as a plot to visit anywhere, the promoted reserve must read as active and as replacing
 * it, and restoring the plot must give back the files of before.
 */
const PLAN = join(import.meta.dirname, '..', '..', 'src', 'state', 'fixtures', 'plan-v1-renamed-stratum-rejected-plot.stratplot.json');
const SURVEY = new Date('2026-12-01T12:00:00Z');
const REASON = 'Unsafe to reach';
const AT = '2026-12-01T09:30:00.000Z';

const HAS_GDAL = (() => {
  try {
    execFileSync('ogr2ogr', ['--version'], { stdio: 'pipe' });
    return true;
  } catch {
    return false;
  }
})();

const dir = () => mkdtempSync(join(tmpdir(), 'stratplot-state-'));

function ogr(file: string, layer?: string): FeatureCollection {
  const out = join(dir(), 'out.geojson');
  execFileSync('ogr2ogr', ['-f', 'GeoJSON', out, file, ...(layer ? [layer] : [])], { stdio: 'pipe' });
  return JSON.parse(readFileSync(out, 'utf8'));
}

function pdfText(bytes: Uint8Array, pages?: [number, number]): string {
  const file = join(dir(), 'out.pdf');
  writeFileSync(file, bytes);
  const range = pages ? ['-f', String(pages[0]), '-l', String(pages[1])] : [];
  return execFileSync('pdftotext', ['-layout', ...range, file, '-'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
}

const FORMATS = ['geojson', 'gpx', 'kml', 'kmz', 'csv', 'zip', 'gpkg', 'sheets', 'report'] as const;
type Format = (typeof FORMATS)[number];

async function exportAll(plots: PlotCollection, site: Site): Promise<Record<Format, Uint8Array>> {
  const out = {} as Record<Format, Uint8Array>;
  for (const f of FORMATS) {
    const pdf = f === 'sheets' || f === 'report' ? f : undefined;
    out[f] = await designOutputBytes(`plots.${pdf ? 'pdf' : f}`, plots, site, { surveyDate: SURVEY, pdf });
  }
  return out;
}

let site: Site;
let original: PlotCollection;
let rejected: PlotCollection;
let victim: string;
let stand: string;
let before: Record<Format, Uint8Array>;
let after: Record<Format, Uint8Array>;
let restored: Record<Format, Uint8Array>;

beforeAll(async () => {
  // The invented Tarn Flat site, its drawn stratum renamed "Farm paddock" (FAR); a fresh run of its
  // design, so plot positions come from the generator as it is now.
  const plan = planFileParse(readFileSync(PLAN, 'utf8'), 'plan.stratplot.json');
  site = plan.site;
  original = designRun(site, plan.design);
  victim = original.features.find((f) => f.properties.stratum === 'Stratum 2' && f.properties.role === 'primary')!.properties.plot_id;
  const r = plotsRejectAndPromote(original, victim, REASON, AT);
  rejected = r.collection;
  stand = r.rejection.replacement!;
  before = await exportAll(original, site);
  after = await exportAll(rejected, site);
  restored = await exportAll(plotsRestore(rejected, victim).collection, site);
}, 60_000);

const text = (b: Uint8Array) => new TextDecoder().decode(b);

describe('a rejected plot and its promoted reserve in every file', () => {
  it('promotes the first reserve of the renamed stratum', () => {
    expect(victim).toMatch(/^FAR-/);
    expect(stand).toBe('FAR-R1');
  });

  it('GeoJSON plot file: the field state reads back as recorded, and stratplot export reads it', async () => {
    const plots = parsePlotFile('plots.geojson', after.geojson);
    const v = plots.features.find((f) => f.properties.plot_id === victim)!.properties;
    expect(v).toMatchObject({ stratum: 'Farm paddock', stratum_code: 'FAR', status: 'rejected', reject_reason: REASON, rejected_at: AT });
    expect(plots.features.find((f) => f.properties.plot_id === stand)!.properties).toMatchObject({ status: 'promoted', replaces: victim });
    const raw = JSON.parse(text(after.geojson));
    expect(raw.features.find((f: { properties: { plot_id: string } }) => f.properties.plot_id === victim).properties).toMatchObject({ field_state: 'rejected' });
  });

  it('GPX: no waypoint leads to the rejected plot, the reason is in the file description, the reserve is a promoted waypoint', async () => {
    const gpx = text(after.gpx);
    expect(gpx).not.toContain(`<name>${victim}</name>`);
    expect(gpx).toMatch(new RegExp(`<metadata><name>[^<]+</name><desc>Caution: [^<]*Rejected plots, left out of this file: ${victim} rejected 2026-12-01 09:30 UTC: ${REASON}; replaced by ${stand}\\.</desc>`));
    expect(gpx).toContain(`<name>${stand}</name><cmt>promoted, replaces ${victim} 1`);
    expect(gpx).toMatch(new RegExp(`<name>${stand}</name><cmt>[^<]*</cmt><desc>Promoted reserve, rank 1: replaces rejected plot ${victim}\\. Sample it\\. Stratum: Farm paddock \\(FAR\\)\\.</desc><type>promoted</type>`));
    const file = join(dir(), 'plots.gpx');
    writeFileSync(file, gpx);
    // Topografix GPX 1.1 schema: xmllint exits 0 when the file is valid.
    execFileSync('xmllint', ['--noout', '--schema', GPX_XSD, file], { stdio: 'pipe' });
    const ours = await parseFeatureFile('plots.gpx', after.gpx);
    expect(ours.features.some((f) => f.properties?.plot_id === victim)).toBe(false);
    if (!HAS_GDAL) return;
    const wpts = ogr(file, 'waypoints').features;
    expect(wpts.map((f) => f.properties?.name)).not.toContain(victim);
    expect(wpts.find((f) => f.properties?.name === stand)?.properties).toMatchObject({ type: 'promoted' });
  });

  for (const ext of ['kml', 'kmz'] as const) {
    it(`${ext.toUpperCase()}: the rejected plot is named, styled and described as rejected with its reason`, async () => {
      const kml = ext === 'kml' ? text(after.kml) : text(unzipSync(after.kmz)['doc.kml']);
      const placemark = (id: string) => kml.split('<Placemark>').find((p) => p.includes(`<SimpleData name="plot_id">${id}</SimpleData>`))!;
      expect(placemark(victim)).toContain(`<name>${victim} REJECTED</name>`);
      expect(placemark(victim)).toContain('<styleUrl>#sp-plot-rejected</styleUrl>');
      expect(placemark(victim)).toContain(`<description>REJECTED 2026-12-01 09:30 UTC: ${REASON}. Do not visit; replaced by ${stand}.`);
      expect(placemark(stand)).toContain(`<name>${stand} (replaces ${victim})</name>`);
      expect(placemark(stand)).toContain('<styleUrl>#sp-plot-promoted</styleUrl>');
      expect(placemark(stand)).toContain(`<description>Promoted reserve, rank 1: replaces rejected plot ${victim}. Sample it.`);
      const ours = await parseKml(`plots.${ext}`, ext === 'kml' ? after.kml : after.kmz, { layer: 'plots' });
      expect(ours.features.find((f) => f.properties?.plot_id === victim)?.properties).toMatchObject({ field_state: 'rejected', status: 'rejected', reject_reason: REASON });
      if (ext === 'kmz') expect(Object.keys(unzipSync(after.kmz))).toContain('files/plot-rejected.png');
      if (!HAS_GDAL) return;
      const file = join(dir(), `plots.${ext}`);
      writeFileSync(file, ext === 'kml' ? after.kml : after.kmz);
      const gdal = ogr(file, 'plots').features;
      const v = gdal.find((f) => String(f.properties?.Name).startsWith(victim))?.properties ?? {};
      expect(v).toMatchObject({ Name: `${victim} REJECTED` });
      // GDAL reads our typed fields from a plain KML (from a KMZ it gives name and description only).
      if (ext === 'kml') expect(v).toMatchObject({ field_state: 'rejected' });
      // GDAL's LIBKML driver calls it "description", its KML driver "Description".
      expect(String(v.description ?? v.Description)).toMatch(/^REJECTED/);
    });
  }

  it('CSV: the row says rejected with the reason, the reserve says promoted, every row carries the caution', () => {
    const rows = Papa.parse<Record<string, string>>(text(after.csv), { header: true, skipEmptyLines: true }).data;
    const v = rows.find((r) => r.plot_id === victim)!;
    expect(v).toMatchObject({ stratum: 'Farm paddock', stratum_code: 'FAR', field_state: 'rejected', status: 'rejected', reject_reason: REASON, rejected_at: AT });
    expect(v.field_note).toBe(`REJECTED 2026-12-01 09:30 UTC: ${REASON}. Do not visit; replaced by ${stand}.`);
    expect(rows.find((r) => r.plot_id === stand)).toMatchObject({ field_state: 'promoted', status: 'promoted', replaces: victim });
    expect(rows.every((r) => r.caution === FIELD_CAUTION)).toBe(true);
  });

  it('shapefile zip: the attributes say rejected, CAUTION.txt lists the decision and the full field names', async () => {
    const files = unzipSync(after.zip);
    const caution = text(files['CAUTION.txt']);
    expect(caution).toContain('Caution: plot positions and notes are a planning aid');
    expect(caution).toContain(`- ${victim} rejected 2026-12-01 09:30 UTC: ${REASON}; replaced by ${stand}.`);
    for (const [short, full] of [['fld_state', 'field_state'], ['access_pt', 'access_point'], ['decl_deg', 'declination_deg'], ['strat_code', 'stratum_code'], ['rej_at', 'rejected_at']]) {
      expect(caution).toMatch(new RegExp(`^  ${short} +${full}$`, 'm'));
    }
    const ours = await parseFeatureFile('plots.zip', after.zip, { layer: 'plots' });
    expect(ours.features.find((f) => f.properties?.plot_id === victim)?.properties).toMatchObject({ fld_state: 'rejected', rej_reason: REASON, stratum: 'Farm paddock' });
    if (!HAS_GDAL) return;
    const file = join(dir(), 'plots.zip');
    writeFileSync(file, after.zip);
    const gdal = ogr(`/vsizip/${file}`, 'plots').features;
    const fields = Object.keys(gdal[0].properties ?? {});
    // No blind cut at ten characters: every field name is one of ours.
    expect(fields).not.toContain('access_poi');
    expect(fields).not.toContain('declinatio');
    expect(gdal.find((f) => f.properties?.plot_id === victim)?.properties).toMatchObject({ fld_state: 'rejected', rej_at: AT });
    expect(gdal.find((f) => f.properties?.plot_id === stand)?.properties).toMatchObject({ fld_state: 'promoted', replaces: victim });
  });

  it('GeoPackage: the rows say rejected and promoted, every layer is described with the caution and the decision', async () => {
    const ours = await parseFeatureFile('plots.gpkg', after.gpkg, { layer: 'plots' });
    expect(ours.features.find((f) => f.properties?.plot_id === victim)?.properties).toMatchObject({ field_state: 'rejected', reject_reason: REASON });
    if (!HAS_GDAL) return;
    const file = join(dir(), 'plots.gpkg');
    writeFileSync(file, after.gpkg);
    const info = execFileSync('ogrinfo', ['-so', file, 'plots'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
    expect(info).toContain(`DESCRIPTION=${FIELD_CAUTION} Field decisions: ${victim} rejected 2026-12-01 09:30 UTC: ${REASON}; replaced by ${stand}.`);
    const gdal = ogr(file, 'plots').features;
    expect(gdal.find((f) => f.properties?.plot_id === stand)?.properties).toMatchObject({ field_state: 'promoted', replaces: victim });
  });

  it('field sheets: the rejected plot is struck out with its reason and left out of the walking order; the reserve replaces it', () => {
    const sheets = pdfText(after.sheets);
    expect(sheets).toContain('Farm paddock');
    expect(sheets).not.toContain('Stratum 2');
    expect(sheets).toContain('REJECTED: do not visit · 2026-12-01 09:30 UTC · Farm paddock (FAR)');
    expect(sheets).toContain(`REJECTED 2026-12-01 09:30 UTC: ${REASON}. Do not visit; replaced by ${stand}.`);
    expect(sheets).toMatch(new RegExp(`PROMOTED RESERVE, rank 1: sample it, replaces ${victim} \\(${REASON}\\)`));
    expect(sheets).not.toMatch(new RegExp(`${stand} +RESERVE, rank 1, waiting`));
    expect(pdfText(before.sheets)).toMatch(new RegExp(`${stand} +RESERVE, rank 1, waiting`));
    // The crew briefing lists the plot first, as not to visit.
    expect(sheets).toMatch(/Rejected plots: do not visit/);
    // Walking order: legs run over active plots only.
    const walk = sheets.slice(sheets.indexOf('Suggested walking order'), sheets.indexOf('Suggested walking order') + 6000);
    expect(walk).not.toMatch(new RegExp(`→ ${victim}\\b`));
    expect(walk).toMatch(new RegExp(`→ ${stand}\\b`));
    const pages = sheets.split('\f').filter((p) => p.trim());
    for (const page of pages) expect(page.replace(/\s+/g, ' ')).toContain(FIELD_CAUTION_LINE);
  });

  it('design report: the caution is on page 1 beside the map, the decision is listed, the footprint reads as the CLI writes it', () => {
    const first = pdfText(after.report, [1, 1]).replace(/\s+/g, ' ');
    expect(first).toContain('Caution');
    expect(first).toContain('Never enter ground that is unsafe on the day');
    const all = pdfText(after.report).replace(/\s+/g, ' ');
    expect(all).toContain(`${victim} rejected 2026-12-01 09:30 UTC: ${REASON}; replaced by ${stand}.`);
    expect(all).toContain('Plot footprint square:20');
    expect(all).not.toMatch(/sideM|angleDeg/);
    expect(all).toContain('Farm paddock (FAR)');
    expect(all).not.toContain('Stratum 2');
  });
});

describe('restoring the rejected plot', () => {
  it('gives back the text formats byte for byte', () => {
    for (const f of ['geojson', 'gpx', 'kml', 'kmz', 'csv'] as const) expect(Buffer.from(restored[f]).equals(Buffer.from(before[f])), f).toBe(true);
  });

  it('gives back the same shapefiles, GeoPackage rows and PDF text', async () => {
    const zipA = unzipSync(restored.zip);
    const zipB = unzipSync(before.zip);
    expect(Object.keys(zipA).sort()).toEqual(Object.keys(zipB).sort());
    for (const name of Object.keys(zipA)) {
      // A .dbf header holds the day it was written; everything after it must match.
      const skip = name.endsWith('.dbf') ? 4 : 0;
      expect(Buffer.from(zipA[name].subarray(skip)).equals(Buffer.from(zipB[name].subarray(skip))), name).toBe(true);
    }
    for (const layer of ['plots', 'strata', 'exclusions', 'access']) {
      const a = await parseFeatureFile('a.gpkg', restored.gpkg, { layer });
      const b = await parseFeatureFile('b.gpkg', before.gpkg, { layer });
      expect(a).toEqual(b);
    }
    expect(pdfText(restored.sheets)).toBe(pdfText(before.sheets));
    expect(pdfText(restored.report).replace(/\d{4}-\d{2}-\d{2}/g, 'DATE')).toBe(pdfText(before.report).replace(/\d{4}-\d{2}-\d{2}/g, 'DATE'));
  });
});
