import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { zipSync } from 'fflate';
import geodesic from 'geographiclib-geodesic';
import geomagnetism from 'geomagnetism';
import Papa from 'papaparse';
import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { featuresToGeoPackage } from '../../io/formats/geopackage/featuresToGeoPackage';
import { featuresToShapefileFiles } from '../../io/formats/shapefile/featuresToShapefileZip';
import { runCli } from '../main';

const root = join(__dirname, '..', '..', '..');
const WGS84 = geodesic.Geodesic.WGS84;
const SET = 'demo-maps/check-example/ochre-spit-plots-to-check.geojson';
const CLEAN = 'demo-maps/check-example/ochre-spit-plots-clean.geojson';
const SITE = ['--strata', 'demo-maps/ochre-spit-strata.geojson', '--exclude', 'demo-maps/ochre-spit-exclusions.geojson', '--access', 'demo-maps/ochre-spit-access.geojson', '--survey-date', '2027-03-15'];

async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await runCli(args, { out: (t) => (out += t), err: (t) => (err += t), cwd: root });
  return { code, out, err };
}

type LonLat = [number, number];
interface Plot {
  id: string;
  at: LonLat;
}
const readJson = (path: string) => JSON.parse(readFileSync(join(root, path), 'utf8'));
const handMade: Plot[] = readJson(SET).features.map((f: { properties: { plot_id: string }; geometry: { coordinates: LonLat } }) => ({ id: f.properties.plot_id, at: f.geometry.coordinates }));
const exclusions = readJson('demo-maps/ochre-spit-exclusions.geojson').features as { id?: string; properties: { name: string; buffer_m: number }; geometry: { type: string; coordinates: unknown } }[];
const access = readJson('demo-maps/ochre-spit-access.geojson').features as { properties: { name: string }; geometry: { coordinates: LonLat } }[];

/**
 * Geodesic distance from a point to a path of geodesic segments and the nearest point on it, by
 * GeographicLib (geographiclib-geodesic 2.2, Karney 2013): golden-section search along each
 * segment's geodesic (distance to a point along a short geodesic is unimodal).
 */
function geodesicToPath(p: LonLat, path: LonLat[]): { distanceM: number; at: LonLat } {
  let best = { distanceM: Number.POSITIVE_INFINITY, at: path[0] };
  const to = (q: LonLat) => WGS84.Inverse(p[1], p[0], q[1], q[0]).s12!;
  if (path.length === 1) return { distanceM: to(path[0]), at: path[0] };
  for (let i = 1; i < path.length; i++) {
    const line = WGS84.InverseLine(path[i - 1][1], path[i - 1][0], path[i][1], path[i][0]);
    const along = (s: number): LonLat => {
      const q = line.Position(s);
      return [q.lon2!, q.lat2!];
    };
    let [a, b] = [0, line.s13!];
    const g = (Math.sqrt(5) - 1) / 2;
    for (let k = 0; k < 60; k++) {
      const c = b - g * (b - a);
      const d = a + g * (b - a);
      if (to(along(c)) < to(along(d))) b = d;
      else a = c;
    }
    const q = along((a + b) / 2);
    const d = to(q);
    if (d < best.distanceM) best = { distanceM: d, at: q };
  }
  return best;
}
const exclusionPath = (name: string): LonLat[] => {
  const g = exclusions.find((e) => e.properties.name === name)!.geometry;
  return g.type === 'Point' ? [g.coordinates as LonLat] : g.type === 'Polygon' ? (g.coordinates as LonLat[][])[0] : (g.coordinates as LonLat[]);
};

/** The hand-made set in every format the tool reads, written without stratplot's writers where the format is text. */
async function handMadeFiles(dir: string): Promise<{ file: string; flags: string[] }[]> {
  const write = (name: string, data: string | Uint8Array) => {
    const path = join(dir, name);
    writeFileSync(path, data);
    return path;
  };
  const gpx = `<?xml version="1.0" encoding="UTF-8"?>\n<gpx version="1.1" creator="invented test set" xmlns="http://www.topografix.com/GPX/1/1">\n${handMade
    .map((p) => `  <wpt lat="${p.at[1]}" lon="${p.at[0]}"><name>${p.id}</name></wpt>`)
    .join('\n')}\n</gpx>\n`;
  const kml = `<?xml version="1.0" encoding="UTF-8"?>\n<kml xmlns="http://www.opengis.net/kml/2.2"><Document><name>invented</name>\n${handMade
    .map((p) => `<Placemark><name>${p.id}</name><Point><coordinates>${p.at[0]},${p.at[1]}</coordinates></Point></Placemark>`)
    .join('\n')}\n</Document></kml>\n`;
  const csv = `plot_id,lat,lon\n${handMade.map((p) => `${p.id},${p.at[1]},${p.at[0]}`).join('\n')}\n`;
  // Eastings and northings in UTM 50S by proj4 (EPSG:32750 definition from the EPSG dataset).
  const utm = proj4('EPSG:4326', '+proj=utm +zone=50 +south +datum=WGS84 +units=m +no_defs');
  const csvUtm = `plot,E,N\n${handMade.map((p) => `${p.id},${utm.forward(p.at).map((v: number) => v.toFixed(3)).join(',')}`).join('\n')}\n`;
  const fc = readJson(SET);
  return [
    { file: join(root, SET), flags: [] },
    { file: write('set.gpx', gpx), flags: [] },
    { file: write('set.kml', kml), flags: [] },
    { file: write('set.kmz', zipSync({ 'doc.kml': new TextEncoder().encode(kml) })), flags: [] },
    { file: write('set.csv', csv), flags: [] },
    { file: write('set-utm.csv', csvUtm), flags: ['--epsg', '32750', '--x-column', 'E', '--y-column', 'N'] },
    { file: write('set.zip', zipSync(featuresToShapefileFiles(fc, { layerName: 'plots' }))), flags: [] },
    { file: write('set.gpkg', await featuresToGeoPackage([{ name: 'plots', features: fc }])), flags: [] },
  ];
}

/** The problems each hand-made plot is placed to have (demo-maps/check-example, see scripts/make-check-example.ts). */
const EXPECTED: Record<string, string[]> = {
  'HEA-07': ['excluded'],
  'EUC-12': ['excluded'],
  'HEA-09': ['outside-strata'],
  'BAN-03': ['spacing'],
  'BAN-04': ['spacing'],
  'BAN-05': ['duplicate-id'],
  'BAN-06': [],
  'EUC-20': [],
};

interface JsonPlot {
  id: string;
  ok: boolean;
  lon: number;
  lat: number;
  problems: string[];
  problem_codes: string[];
  exclusions: { name: string; distance_m: number; inside: boolean }[];
  nearest_exclusion: Record<string, { name: string; distance_m: number }>;
  nearest_plot: { id: string; distance_m: number } | null;
  access: { name: string; distance_m: number; bearing_true_deg: number; bearing_mag_deg: number } | null;
}

describe('stratplot check', () => {
  it('flags exactly the expected plots of the hand-made set in every input format, with GeographicLib distances, and exits 4', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'check-'));
    const files = await handMadeFiles(dir);
    for (const { file, flags } of files) {
      const r = await cli(['check', file, ...SITE, '--spacing', '50', '--json', ...flags]);
      expect(r.code, `${file}: ${r.err}`).toBe(4);
      const report = JSON.parse(r.out) as { plots: JsonPlot[]; counts: { failing: number } };
      expect(report.plots.map((p) => p.id), file).toEqual(handMade.map((p) => p.id));
      for (const p of report.plots) expect(p.problem_codes, `${file} ${p.id}`).toEqual(EXPECTED[p.id]);
      expect(report.counts.failing).toBe(7);
      for (const [i, p] of report.plots.entries()) {
        expect(p.problems.every((t) => t.includes(p.id)), `${p.id}: every sentence names the plot`).toBe(true);
        // Distances against GeographicLib (geographiclib-geodesic 2.2) within 0.5 m.
        for (const [kind, near] of Object.entries(p.nearest_exclusion)) {
          // 0 m means inside the polygon, which the plot's own exclusion record says.
          if (near.distance_m === 0) expect(p.exclusions.some((e) => e.name === near.name && e.inside), `${p.id} ${kind}`).toBe(true);
          else expect(Math.abs(near.distance_m - geodesicToPath([p.lon, p.lat], exclusionPath(near.name)).distanceM), `${p.id} ${kind}`).toBeLessThan(0.5);
        }
        for (const e of p.exclusions) expect(Math.abs(e.distance_m - geodesicToPath([p.lon, p.lat], exclusionPath(e.name)).distanceM)).toBeLessThan(0.5);
        const others = handMade.filter((_, j) => j !== i).map((q) => ({ id: q.id, d: WGS84.Inverse(p.lat, p.lon, q.at[1], q.at[0]).s12! }));
        const closest = others.sort((a, b) => a.d - b.d)[0];
        expect(p.nearest_plot!.id).toBe(closest.id);
        expect(Math.abs(p.nearest_plot!.distance_m - closest.d)).toBeLessThan(0.5);
        const routes = access.map((a) => ({ name: a.properties.name, r: WGS84.Inverse(a.geometry.coordinates[1], a.geometry.coordinates[0], p.lat, p.lon) }));
        const from = routes.sort((a, b) => a.r.s12! - b.r.s12!)[0];
        expect(p.access!.name).toBe(from.name);
        expect(Math.abs(p.access!.distance_m - from.r.s12!)).toBeLessThan(0.5);
        expect(Math.abs(p.access!.bearing_true_deg - ((from.r.azi1! + 360) % 360))).toBeLessThan(0.06);
        // Magnetic = true − declination at the access point (geomagnetism 0.2, WMM2025, survey day 2027-03-15).
        const gate = access.find((a) => a.properties.name === from.name)!.geometry.coordinates;
        const decl = geomagnetism.model(new Date('2027-03-15T12:00:00Z')).point([gate[1], gate[0]]).decl;
        expect(Math.abs(p.access!.bearing_mag_deg - ((((from.r.azi1! - decl) % 360) + 360) % 360))).toBeLessThan(0.06);
      }
      const cliff = report.plots.find((p) => p.id === 'HEA-07')!;
      // Made 6 m inland of the cliff edge by a GeographicLib direct step.
      expect(cliff.exclusions[0]).toMatchObject({ name: 'Ochre Spit cliff edge', inside: false });
      expect(Math.abs(cliff.exclusions[0].distance_m - 6)).toBeLessThan(0.5);
      const priv = report.plots.find((p) => p.id === 'EUC-12')!;
      expect(priv.exclusions[0]).toMatchObject({ name: 'Freehold block', inside: true });
      expect(Math.abs(priv.exclusions[0].distance_m - geodesicToPath([priv.lon, priv.lat], exclusionPath('Freehold block')).distanceM)).toBeLessThan(0.5);
      expect(Math.abs(report.plots.find((p) => p.id === 'BAN-03')!.nearest_plot!.distance_m - 3)).toBeLessThan(0.01);
    }
  }, 120_000);

  it('passes the clean set with exit 0, and flags the footprint that enters a buffer', async () => {
    const clean = await cli(['check', CLEAN, ...SITE, '--spacing', '50']);
    expect(clean.code).toBe(0);
    expect(clean.out).toMatch(/3 plots checked: 3 pass, 0 fail\./);
    const fp = await cli(['check', SET, ...SITE, '--spacing', '50', '--footprint', 'square:20', '--json']);
    expect(fp.code).toBe(4);
    const plots = (JSON.parse(fp.out) as { plots: JsonPlot[] }).plots;
    const creek = plots.find((p) => p.id === 'EUC-20')!;
    expect(creek.problem_codes).toEqual(['excluded']);
    expect(creek.problems[0]).toMatch(/^The footprint of plot EUC-20 \(square:20\) comes within \d+\.\d m of water "Pipit Creek", inside its 10 m buffer \(the plot centre is 18\.0 m away\)\.$/);
    expect(plots.find((p) => p.id === 'HEA-07')!.problem_codes).toEqual(['excluded', 'stratum-edge']);
  }, 60_000);

  it('passes every plot stratplot plan writes, and fails the one moved 1 m into a buffer', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'check-round-'));
    const planned = join(dir, 'plan.geojson');
    const site = SITE.slice(0, 6);
    const settings = ['--spacing', '50', '--footprint', 'square:20', '--edge-buffer', '5'];
    const plan = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', ...site.slice(2), '--plots', '60', '--reserve', '2', '--seed', '4', ...settings, '--out', planned]);
    expect(plan.code, plan.err).toBe(0);
    const back = await cli(['check', planned, ...site, ...settings, '--json']);
    expect(back.code, back.out.slice(0, 400)).toBe(0);
    expect((JSON.parse(back.out) as { counts: { plots: number } }).counts.plots).toBe(72);
    // The GPX of the same design carries access points and exclusions too: only its plot waypoints are checked.
    const gpx = join(dir, 'plan.gpx');
    expect((await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', ...site.slice(2), '--access', 'demo-maps/ochre-spit-access.geojson', '--plots', '60', '--reserve', '2', '--seed', '4', ...settings, '--out', gpx])).code).toBe(0);
    const fromGpx = await cli(['check', gpx, ...site, ...settings]);
    expect(fromGpx.code, fromGpx.out.slice(0, 400)).toBe(0);
    expect(fromGpx.out).toMatch(/72 plots checked: 72 pass, 0 fail/);
    expect(fromGpx.err).toMatch(/access point or exclusion features were not read as plots/);

    // A point design, then the plot closest to a buffered exclusion is moved to 1 m inside its buffer.
    const pointPlan = join(dir, 'points.geojson');
    expect((await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', ...site.slice(2), '--plots', '60', '--seed', '9', '--spacing', '50', '--out', pointPlan])).code).toBe(0);
    const checked = JSON.parse((await cli(['check', pointPlan, ...site, '--spacing', '50', '--json'])).out) as { plots: JsonPlot[] };
    const candidates = checked.plots.flatMap((p) =>
      Object.values(p.nearest_exclusion).map((n) => ({ p, n, buffer: exclusions.find((e) => e.properties.name === n.name)!.properties.buffer_m })),
    );
    const { p, n, buffer } = candidates.filter((c) => c.buffer > 0).sort((a, b) => a.n.distance_m - a.buffer - (b.n.distance_m - b.buffer))[0];
    const nearest = geodesicToPath([p.lon, p.lat], exclusionPath(n.name));
    const toward = WGS84.Inverse(p.lat, p.lon, nearest.at[1], nearest.at[0]);
    const moved = WGS84.Direct(p.lat, p.lon, toward.azi1!, nearest.distanceM - buffer + 1);
    const fcPoints = JSON.parse(readFileSync(pointPlan, 'utf8'));
    const feature = fcPoints.features.find((f: { properties: { plot_id: string } }) => f.properties.plot_id === p.id);
    feature.geometry.coordinates = [moved.lon2, moved.lat2];
    const movedFile = join(dir, 'moved.geojson');
    writeFileSync(movedFile, JSON.stringify(fcPoints));
    const after = await cli(['check', movedFile, ...site, '--spacing', '50', '--json']);
    expect(after.code).toBe(4);
    const plots = (JSON.parse(after.out) as { plots: JsonPlot[] }).plots;
    const hit = plots.find((x) => x.id === p.id)!;
    expect(hit.problem_codes).toContain('excluded');
    expect(hit.problems[0]).toContain(`"${n.name}"`);
    expect(Math.abs(hit.exclusions[0].distance_m - (buffer - 1))).toBeLessThan(0.5);
    // Any other plot that fails does so only for its spacing to the moved plot.
    for (const other of plots.filter((x) => !x.ok && x.id !== p.id)) {
      expect(other.problem_codes).toEqual(['spacing']);
      expect(other.nearest_plot!.id).toBe(p.id);
    }
  }, 120_000);

  it('writes the report as CSV with the caution, the date and the files checked, and as a PDF', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'check-out-'));
    const csvFile = join(dir, 'report.csv');
    expect((await cli(['check', SET, ...SITE, '--spacing', '50', '--out', csvFile])).code).toBe(4);
    const rows = Papa.parse<Record<string, string>>(readFileSync(csvFile, 'utf8'), { header: true, skipEmptyLines: true }).data;
    expect(rows.map((r) => r.plot_id).slice(0, 3)).toEqual(['HEA-07', 'EUC-12', 'HEA-09']);
    expect(rows.filter((r) => r.ok === 'FAIL')).toHaveLength(7);
    expect(rows.every((r) => r.caution.startsWith('Caution: plot positions and notes are a planning aid') && /^\d{4}-\d{2}-\d{2}$/.test(r.checked_on))).toBe(true);
    expect(rows[0].files_checked).toContain('plots: demo-maps/check-example/ochre-spit-plots-to-check.geojson');
    expect(rows[0].problems).toBe('Plot HEA-07 lies 6.0 m from cliff edge "Ochre Spit cliff edge", inside its 15 m buffer.');
    const pdfFile = join(dir, 'report.pdf');
    expect((await cli(['check', SET, ...SITE, '--spacing', '50', '--out', pdfFile])).code).toBe(4);
    expect(new TextDecoder().decode(readFileSync(pdfFile).subarray(0, 5))).toBe('%PDF-');
    let text: string | null = null;
    try {
      // Text as poppler's pdftotext (Debian poppler-utils) extracts it: an outside reader of our PDF.
      text = execFileSync('pdftotext', [pdfFile, '-'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
    } catch {
      text = null;
    }
    if (text !== null) {
      const flat = text.replace(/\s+/g, ' ');
      for (const want of ['Plot check', 'Caution', 'ochre-spit-plots-to-check.geojson', 'Checked and approved', 'Plot EUC-12 lies inside private land "Freehold block"', 'inference from this set cannot cover it']) {
        expect(flat, want).toContain(want);
      }
    }
  }, 60_000);

  it('exits 2 with one line for bad input', async () => {
    for (const [args, message] of [
      [['check', SET], /--strata FILE is required/],
      [['check', SET, ...SITE, '--out', 'report.docx'], /the report is written as \.pdf or \.csv/],
      [['check', 'demo-maps/ochre-spit-strata.geojson', ...SITE], /no point features to check as plots/],
      [['check', SET, ...SITE, '--spacing', 'wide'], /--spacing needs a distance/],
      [['check', SET, ...SITE, '--id-field', 'plot_no'], /no feature has the property "plot_no"/],
    ] as [string[], RegExp][]) {
      const r = await cli(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.err.trim().split('\n'), args.join(' ')).toHaveLength(1);
      expect(r.err).toMatch(message);
    }
  }, 60_000);
});
