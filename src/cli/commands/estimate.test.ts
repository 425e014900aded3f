import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { runCli } from '../main';

// Invented plot file and field results for an invented site (not real data).
const plots = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 2, mappedM2: 60_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 3, reserves: 1, mappedM2: 40_000, usableM2: 30_000 },
]);

function workdir(results: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'stratplot-estimate-'));
  writeFileSync(join(dir, 'plots.geojson'), JSON.stringify(plots));
  writeFileSync(join(dir, 'results.csv'), results);
  return dir;
}

async function run(argv: string[], cwd: string) {
  let out = '';
  let err = '';
  const code = await runCli(argv, { out: (t) => (out += t), err: (t) => (err += t), cwd });
  return { code, out, err };
}

const RESULTS =
  '\ufeffplot_id;stems;status;replaced_by\r\nHEA-01;3;done;\r\nHEA-02;;rejected;HEA-R1\r\nHEA-R1;5;done;\r\nHEA-03;4;;\r\nHEA-04;8;;\r\nSAL-01;1,5;;\r\nSAL-02;0;;\r\nSAL-03;2;;\r\n';

describe('stratplot estimate', () => {
  it('prints the JSON members in the documented order', async () => {
    const dir = workdir(RESULTS);
    const r = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'stems', '--json'], dir);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j).slice(0, 10)).toEqual(['variable', 'strata', 'mean', 'se', 'ci95', 'df', 'total', 'total_ci95', 'deff', 'kind']);
    expect(Object.keys(j.strata[0])).toEqual(['stratum', 'n', 'mean', 'sd', 'se', 'weight']);
    expect(j.variable).toBe('stems');
    // "stems" holds 1,5, so it is read as a measurement, not a count (counts are whole).
    expect(j.kind).toBe('measure');
    // By hand: heath 3, 5, 4, 8 → 5; saltmarsh 1.5, 0, 2 → 7/6; W = 5/8, 3/8.
    expect(j.mean).toBeCloseTo(5 * 0.625 + (7 / 6) * 0.375, 12);
    expect(j.strata.map((s: { n: number }) => s.n)).toEqual([4, 3]);
    expect(j.ci95[0]).toBeLessThan(j.mean);
    expect(j.total).toBeCloseTo(j.mean * 100 * 8, 9);
    expect(j.population).toContain('usable area');
  });

  it('prints a readable table with the population statement and formulas', async () => {
    const dir = workdir(RESULTS);
    const r = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'stems'], dir);
    expect(r.code).toBe(0);
    expect(r.out).toContain('Stratified estimate of stems (measure)');
    expect(r.out).toContain('Coastal heath');
    expect(r.out).toContain('Estimates cover the usable area');
    // By hand (Cochran 1977 ch. 5, docs/references.md §3): heath 3, 5, 4, 8 → ȳ 5, s² 14/3, n 4, f 0.008;
    // saltmarsh 1.5, 0, 2 → ȳ 7/6, s² 13/12, n 3, f 0.01; W = 5/8, 3/8.
    // ȳ_st = 3.125 + 0.4375 = 3.5625; v = (25/64)(0.992)(14/3)/4 + (9/64)(0.99)(13/12)/3
    //   = 0.4520833 + 0.0502734 = 0.5023568, SE 0.7088; Satterthwaite df
    //   = v² / (0.4520833²/3 + 0.0502734²/2) = 3.64.
    const line = r.out.split('\n').find((l) => l.startsWith('mean'))!;
    expect(line).toMatch(/^mean {3}3\.5625 {3}SE 0\.7088 {3}95 % CI (\S+) to (\S+) {3}df 3\.6$/);
    const [, lo, hi] = line.match(/CI (\S+) to (\S+)/)!.map(Number);
    // t(0.975, 3.64) lies between the tabled t(0.975, 4) = 2.776 and t(0.975, 3) = 3.182 (standard t tables).
    const t = (hi - lo) / 2 / 0.7087713;
    expect(t).toBeGreaterThan(2.776);
    expect(t).toBeLessThan(3.182);
    expect((lo + hi) / 2).toBeCloseTo(3.5625, 4);
    // Stratum rows by hand: sd √(14/3) = 2.1602, se √(0.992 · (14/3)/4) = 1.0758; sd √(13/12) = 1.0408,
    // se √(0.99 · (13/12)/3) = 0.5979.
    expect(r.out).toContain('Coastal heath  4  5.0000  2.1602  1.0758  0.6250\nSaltmarsh      3  1.1667  1.0408  0.5979  0.3750\n');
  });

  it('writes the estimates CSV in the results file’s style', async () => {
    const dir = workdir(RESULTS);
    const r = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'stems', '--out', 'est.csv'], dir);
    expect(r.code).toBe(0);
    const csv = readFileSync(join(dir, 'est.csv'), 'utf8');
    expect(csv.split('\r\n')[0]).toBe('level;stratum;n;mean;sd;se;ci95_low;ci95_high;df;weight;basis_ha;sampling_fraction;total;total_ci95_low;total_ci95_high;deff');
  });

  it('collapses a one-plot stratum on request', async () => {
    const dir = workdir('plot_id,v\nHEA-01,3\nHEA-02,5\nHEA-03,4\nHEA-04,8\nSAL-01,1\n');
    const plain = JSON.parse((await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'v', '--json'], dir)).out);
    expect(plain.se).toBeNull();
    expect(plain.ci95).toBeNull();
    const c = JSON.parse((await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'v', '--json', '--collapse'], dir)).out);
    // The mean keeps both strata; only the variance is collapsed (Cochran 1977 §5A.12). By hand:
    // W = 5/8, 3/8; means 5 and 1 → ȳ_st = 3.5; v = 4 W_1² W_2² (5 − 1)²/(W_1 + W_2)² = 3.515625, 1 df.
    expect(c.strata.map((s: { stratum: string }) => s.stratum)).toEqual(['Coastal heath', 'Saltmarsh']);
    expect(c.mean).toBeCloseTo(3.5, 12);
    expect(c.se).toBeCloseTo(Math.sqrt(3.515625), 12);
    expect(c.collapsed_groups).toEqual([{ strata: ['Coastal heath', 'Saltmarsh'], variance: expect.closeTo(3.515625, 12), df: 1, pooled_sd: expect.any(Number) }]);
    const text = (await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'v', '--collapse'], dir)).out;
    expect(text).toContain('collapsed for the variance: Coastal heath + Saltmarsh (between-strata variance 3.515625, 1 df; conservative)');
  });

  it('sizes next season from the observed SDs on request', async () => {
    const dir = workdir(RESULTS);
    const j = JSON.parse((await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'stems', '--json', '--next-halfwidth', '25%'], dir)).out);
    expect(j.next_season.target_halfwidth).toBeCloseTo(0.25 * j.mean, 12);
    expect(j.next_season.neyman.halfwidth).toBeLessThanOrEqual(j.next_season.target_halfwidth);
    expect(j.next_season.proportional.plots.map((p: { stratum: string }) => p.stratum)).toEqual(['Coastal heath', 'Saltmarsh']);
    const text = (await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'stems', '--next-halfwidth', '0.5'], dir)).out;
    expect(text).toContain('Next season, for a 95 % CI half-width of 0.5000');
    const bad = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'stems', '--next-halfwidth', 'x%'], dir);
    expect(bad.err).toBe('stratplot estimate: --next-halfwidth must be a number > 0, optionally with %, got "x%"\n');
  });

  it('says why next season cannot be sized when a stratum has one plot', async () => {
    const dir = workdir('plot_id,v\nHEA-01,3\nHEA-02,5\nHEA-03,4\nHEA-04,8\nSAL-01,1\n');
    const r = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'v', '--next-halfwidth', '1'], dir);
    expect(r.code).toBe(0);
    expect(r.out).toContain('next season: not sized — stratum "Saltmarsh" has no observed SD (fewer than 2 plots)');
  });

  it('exits 2 with one line naming the row and column of bad input', async () => {
    const dir = workdir('plot_id,v\nHEA-01,3\nHEA-02,lots\n');
    const r = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'v'], dir);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toBe('stratplot estimate: results.csv row 3, column v: "lots" is not a number\n');
  });

  it('exits 2 for a missing column, a missing file, a bad kind and a bad option', async () => {
    const dir = workdir('plot_id,v\nHEA-01,3\n');
    const missing = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'cover'], dir);
    expect(missing.err).toBe('stratplot estimate: results.csv: no column "cover"; columns are plot_id, v\n');
    const nofile = await run(['estimate', 'nope.geojson', 'results.csv', '--value', 'v'], dir);
    expect(nofile.err).toBe('stratplot estimate: file not found: nope.geojson\n');
    const kind = await run(['estimate', 'plots.geojson', 'results.csv', '--value', 'v', '--kind', 'weight'], dir);
    expect(kind.err).toBe('stratplot estimate: --kind must be one of measure, cover, count, presence, got "weight"\n');
    const opt = await run(['estimate', 'plots.geojson', 'results.csv', '--valu', 'v'], dir);
    expect(opt.code).toBe(2);
    expect(opt.err.split('\n').length).toBe(2);
    const noValue = await run(['estimate', 'plots.geojson', 'results.csv'], dir);
    expect(noValue.err).toBe('stratplot estimate: --value FIELD is required: the results column to estimate\n');
  });
});
