import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { jStat } from 'jstat';
import { describe, expect, it } from 'vitest';
import type { PlotCollection } from '../../core/model/designTypes';
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
    expect(now.settings.rngVersion).toBe(3);
    expect(now.statements.join(' ')).toContain('Seed 3, random generator version 3');
    const two = JSON.parse((await cli([...base, '--rng-version', '2'])).out);
    expect(two.settings.rngVersion).toBe(2);
    expect(two.warnings.join(' ')).not.toContain('random generator version');
    const old = JSON.parse((await cli([...base, '--rng-version', '1'])).out);
    expect(old.settings.rngVersion).toBe(1);
    expect(old.warnings.join(' ')).toContain('random generator version 1');
    const bad = await cli([...base, '--rng-version', '4']);
    expect(bad.code).toBe(2);
    expect(bad.err).toBe('stratplot plan: --rng-version needs 1, 2 or 3, got "4"\n');
  });

  it('refuses strata that cross themselves, naming the feature', async () => {
    const r = await cli(['plan', 'src/core/fixtures/in/bow-tie.geojson', '--plots', '4', '--min-per-stratum', '0', '--seed', '1']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^stratplot plan: [^\n]*\.geojson: feature 0 [^\n]*\n$/);
  });

  it('reports an error of the strata file itself before an exclusion file that cannot be read, and a missing exclusion file by name', async () => {
    // Exclusion files are read before the strata are checked (for the second thread); the order of messages is unchanged.
    const both = await cli(['plan', 'src/core/fixtures/in/bow-tie.geojson', '--exclude', 'no-such-exclusions.geojson', '--plots', '4', '--seed', '1']);
    expect(both.code).toBe(2);
    expect(both.err).toMatch(/^stratplot plan: [^\n]*bow-tie\.geojson: feature 0 [^\n]*\n$/);
    const missing = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--exclude', 'demo-maps/ochre-spit-exclusions.geojson', '--exclude', 'no-such-exclusions.geojson', '--plots', '4', '--seed', '1']);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/^stratplot plan: [^\n]*no-such-exclusions\.geojson[^\n]*\n$/);
    // A named file's own problem comes before a later file that cannot be read.
    const crossed = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--exclude', 'src/core/fixtures/in/bow-tie.geojson', '--exclude', 'no-such-exclusions.geojson', '--plots', '4', '--seed', '1']);
    expect(crossed.code).toBe(2);
    expect(crossed.err).toMatch(/^stratplot plan: [^\n]*bow-tie\.geojson: [^\n]*\n$/);
  });

  it('sizes the design for a relative target half-width from pilot SDs: exactly the smallest n whose t interval meets it', async () => {
    const keys = ['Coastal heath', 'Dune grassland', 'Saltmarsh', 'Banksia scrub', 'Eucalypt woodland', 'Wet meadow'];
    const sd = keys.map((k) => `${k}=12`).join(',');
    const r = await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--target-halfwidth', '10%', '--pilot-mean', '40', '--sd', sd, '--seed', '2', '--json']);
    expect(r.code).toBe(0);
    const design = JSON.parse(r.out);
    // Proportional, no fpc (point plots): n0 = S² (z/d)² = 144 · (1.96/4)² = 34.57 (Cochran 1977, ch. 5;
    // docs/references.md §3) in the normal approximation; the reported CI uses t on the Satterthwaite df.
    expect(design.statements.join(' ')).toMatch(/normal-approximation formula gave 34\.57/);
    const rows = design.allocation as { share: number; plots: number }[];
    expect(rows.reduce((a, row) => a + row.plots, 0)).toBe(39);
    // By hand from the allocation: v = Σ W_h² S²/n_h, ν = v² / Σ (W_h² S²/n_h)²/(n_h − 1), half-width
    // t(0.975, ν) √v with jstat 1.9.6's t quantile: at most 4 with these 39 plots …
    const halfwidth = (plots: number[]) => {
      const part = rows.map((row, i) => (row.share ** 2 * 144) / plots[i]);
      const v = part.reduce((a, b) => a + b, 0);
      const df = v ** 2 / part.reduce((a, p, i) => a + p ** 2 / (plots[i] - 1), 0);
      return jStat.studentt.inv(0.975, df) * Math.sqrt(v);
    };
    expect(halfwidth(rows.map((row) => row.plots))).toBeLessThanOrEqual(4);
    // … and more than 4 with the 38-plot design the same allocation rules give.
    const fewer = JSON.parse((await cli(['plan', 'demo-maps/ochre-spit-strata.geojson', '--plots', '38', '--sd', sd, '--seed', '2', '--json'])).out);
    const fewerPlots = (fewer.allocation as { plots: number }[]).map((row) => row.plots);
    expect(fewerPlots.reduce((a, b) => a + b, 0)).toBe(38);
    expect(halfwidth(fewerPlots)).toBeGreaterThan(4);
    // The design states the expected half-width at the chosen n, from the pilot SDs.
    const at38 = (fewer.statements as string[]).find((x) => x.startsWith('Expected precision at n = 38'));
    expect(Number(at38?.match(/half-width of ([\d.]+)/)?.[1])).toBeCloseTo(halfwidth(fewerPlots), 5);
  });

  it('sizes the design by a budget with a fixed overhead', async () => {
    const keys = ['Coastal heath', 'Dune grassland', 'Saltmarsh', 'Banksia scrub', 'Eucalypt woodland', 'Wet meadow'];
    const sd = keys.map((k, i) => `${k}=${[10, 20, 5, 10, 15, 8][i]}`).join(',');
    const cost = keys.map((k, i) => `${k}=${[40, 90, 60, 50, 40, 120][i]}`).join(',');
    const args = ['plan', 'demo-maps/ochre-spit-strata.geojson', '--allocation', 'neyman', '--sd', sd, '--cost', cost, '--budget', '5000', '--overhead', '1200', '--min-per-stratum', '1', '--seed', '2', '--json'];
    const r = await cli(args);
    expect(r.code, r.err).toBe(0);
    const design = JSON.parse(r.out);
    const rows = design.allocation as { share: number; plots: number }[];
    // Cochran 1977 §5.5 by hand from the shares: n = (C − c0) Σ W S/√c / Σ W S √c.
    const S = [10, 20, 5, 10, 15, 8];
    const c = [40, 90, 60, 50, 40, 120];
    const a = rows.reduce((x, row, i) => x + (row.share * S[i]) / Math.sqrt(c[i]), 0);
    const b = rows.reduce((x, row, i) => x + row.share * S[i] * Math.sqrt(c[i]), 0);
    const real = (3800 * a) / b;
    const spent = rows.reduce((x, row, i) => x + row.plots * c[i], 0);
    expect(spent).toBeLessThanOrEqual(3800);
    expect(design.statements.join(' ')).toContain(`gives ${Math.round(real * 100) / 100} plots in real numbers`);
    expect(design.statements.join(' ')).toContain(`whole plots cost ${spent}, the largest design within the budget`);
    const bad = await cli(args.map((x) => (x === '1200' ? '6000' : x)));
    expect(bad.code).toBe(2);
    expect(bad.err).toBe('stratplot plan: the fixed overhead 6000 leaves nothing of the budget 5000 for plots\n');
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
