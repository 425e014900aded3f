import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { PlotCollection } from '../../core/designTypes';
import { runCli } from '../main';

const root = join(__dirname, '..', '..', '..');

async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await runCli(args, { out: (t) => (out += t), err: (t) => (err += t), cwd: root });
  return { code, out, err };
}

describe('stratplot plan', () => {
  it('designs 60 plots with 3 reserves per stratum on the invented demo site and writes them as GeoJSON', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'plan-')), 'x.geojson');
    const r = await cli([
      'plan',
      'demo-maps/ochre-spit-strata.geojson',
      '--exclude',
      'demo-maps/ochre-spit-exclusions.geojson',
      '--plots',
      '60',
      '--spacing',
      '50',
      '--footprint',
      'square:20',
      '--reserve',
      '3',
      '--seed',
      '1',
      '--out',
      file,
    ]);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const c = JSON.parse(readFileSync(file, 'utf8')) as PlotCollection;
    const primaries = c.features.filter((f) => f.properties.role === 'primary');
    expect(primaries.length).toBe(60);
    expect(c.design.allocation.reduce((a, row) => a + row.plots, 0)).toBe(60);
    expect(c.design.allocation.every((row) => row.reserve === 3)).toBe(true);
    expect(c.design.seed).toBe(1);
    expect(c.design.crs.epsg).toBe(32750);
    expect(r.out).toMatch(/CRS: WGS84 \/ UTM zone 50S/);
    for (const f of c.features) expect(f.properties.plot_id.length).toBeLessThanOrEqual(10);
  });

  it('prints the design summary as JSON with --json and repeats the design for the same seed', async () => {
    const args = ['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '20', '--seed', '5', '--method', 'balanced'];
    const a = await cli([...args, '--json']);
    expect(a.code).toBe(0);
    const design = JSON.parse(a.out);
    expect(design.settings.method).toBe('balanced');
    expect(design.statements.join(' ')).toMatch(/Inference covers the usable area only/);
    const g1 = await cli(args);
    const g2 = await cli(args);
    expect(g1.out).toBe(g2.out);
  });

  it('exits 2 with one line naming the bad option', async () => {
    const r = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '20', '--footprint', 'hexagon:3', '--seed', '1']);
    expect(r.code).toBe(2);
    expect(r.err.trim().split('\n')).toHaveLength(1);
    expect(r.err).toMatch(/--footprint "hexagon:3" is not understood/);
    const s = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '20', '--allocation', 'neyman', '--seed', '1']);
    expect(s.code).toBe(2);
    expect(s.err).toMatch(/standard deviation for stratum/);
    const m = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '3', '--seed', '1']);
    expect(m.code).toBe(2);
    expect(m.err).toMatch(/minimum of 2 plots in each of 6 strata needs 12 plots/);
  });

  it('writes other formats through the design exports, and refuses an unknown extension before any work', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'plan-')), 'x.gpx');
    const r = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '12', '--seed', '1', '--out', file]);
    expect(r.code).toBe(0);
    expect(readFileSync(file, 'utf8')).toMatch(/<gpx version="1.1"[^>]*xmlns="http:\/\/www.topografix.com\/GPX\/1\/1"/);
    const bad = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '12', '--seed', '1', '--out', 'x.xyz']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--out x.xyz: unknown format; use one of .geojson/);
  });

  it('says which random generator made the design, and makes version-1 designs on request', async () => {
    const base = ['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '12', '--seed', '3', '--json'];
    const now = JSON.parse((await cli(base)).out);
    expect(now.settings.rngVersion).toBe(2);
    expect(now.statements.join(' ')).toContain('Seed 3, random generator version 2');
    const old = JSON.parse((await cli([...base, '--rng-version', '1'])).out);
    expect(old.settings.rngVersion).toBe(1);
    expect(old.warnings.join(' ')).toContain('random generator version 1');
    const bad = await cli([...base, '--rng-version', '3']);
    expect(bad.code).toBe(2);
    expect(bad.err).toBe('stratplot plan: --rng-version needs 1 or 2, got "3"\n');
  });

  it('refuses strata that cross themselves, naming the feature', async () => {
    const r = await cli(['plan', 'src/core/fixtures/in/bow-tie.geojson', '--plots', '4', '--min-per-stratum', '0', '--seed', '1']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^stratplot plan: [^\n]*\.geojson: feature 0 [^\n]*\n$/);
  });

  it('sizes the design for a relative target half-width from pilot SDs', async () => {
    const keys = ['Coastal heath', 'Dune grassland', 'Saltmarsh', 'Banksia scrub', 'Eucalypt woodland', 'Wet meadow'];
    const sd = keys.map((k) => `${k}=12`).join(',');
    const r = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--target-halfwidth', '10%', '--pilot-mean', '40', '--sd', sd, '--seed', '2', '--json']);
    expect(r.code).toBe(0);
    const design = JSON.parse(r.out);
    // Proportional, no fpc (point plots): n0 = S² (z/d)² = 144 · (1.96/4)² = 34.57 (Cochran 1977, ch. 5; REFERENCES.md §3);
    // with the minimum of 2 in each small stratum the smallest whole design meeting d is a little larger.
    expect(design.statements.join(' ')).toMatch(/continuous formula gave 34\.57/);
    const n = design.allocation.reduce((a: number, row: { plots: number }) => a + row.plots, 0);
    expect(n).toBeGreaterThanOrEqual(35);
    expect(n).toBeLessThanOrEqual(40);
  });

  it('gives a CSV for the crew with routes from the access points and a boundary check', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'plan-')), 'x.csv');
    const r = await cli([
      'plan', 'demo-maps/ochre-spit-strata.geojson', '--exclude', 'demo-maps/ochre-spit-exclusions.geojson',
      '--access', 'demo-maps/ochre-spit-access.geojson', '--boundary', 'demo-maps/ochre-spit-boundary.geojson',
      '--plots', '14', '--seed', '5', '--out', file,
    ]);
    expect(r.code, r.err).toBe(0);
    // The invented demo's strata tile its boundary exactly, so no gap is reported.
    expect(r.err).not.toMatch(/gap/);
    const [head, ...rows] = readFileSync(file, 'utf8').trim().split(/\r?\n/);
    expect(head.split(',')).toEqual(expect.arrayContaining(['access_point', 'distance_m', 'bearing_true_deg', 'bearing_mag_deg', 'notes']));
    expect(rows).toHaveLength(14);
  });
});
