import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import type { PlotCollection } from '../../core/model/designTypes';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { runCli } from '../main';

// An invented site (no real place): two strata side by side, the second carrying its own label and
// code as a strata file exported from the planner after a rename does.
const box = (lon0: number, lat0: number) => [[[lon0, lat0], [lon0 + 0.006, lat0], [lon0 + 0.006, lat0 + 0.004], [lon0, lat0 + 0.004], [lon0, lat0]]];
const strata = {
  type: 'FeatureCollection',
  features: [
    { type: 'Feature', properties: { stratum: 'Banksia woodland', code: 'BAW' }, geometry: { type: 'Polygon', coordinates: box(146.5, -41.2) } },
    { type: 'Feature', properties: { stratum: 'Stratum 7', label: 'Farm paddock', code: 'FAR' }, geometry: { type: 'Polygon', coordinates: box(146.506, -41.2) } },
  ],
};

function workdir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'stratplot-reject-'));
  writeFileSync(join(dir, 'strata.geojson'), JSON.stringify(strata));
  return dir;
}

async function cli(dir: string, ...args: string[]) {
  let out = '';
  let err = '';
  const code = await runCli(args, { out: (t) => (out += t), err: (t) => (err += t), cwd: dir });
  return { code, out, err };
}

async function planned(dir: string): Promise<PlotCollection> {
  const r = await cli(dir, 'plan', 'strata.geojson', '--plots', '8', '--reserve', '2', '--spacing', '20', '--seed', '4', '--out', 'plots.geojson');
  expect(r.code).toBe(0);
  return JSON.parse(readFileSync(join(dir, 'plots.geojson'), 'utf8'));
}

describe('stratplot reject and restore', () => {
  it('records the reason and time, promotes the next reserve in rank order, and restore gives back the same file', async () => {
    const dir = workdir();
    const plots = await planned(dir);
    // Plot ids use the code; every plot carries the stratum's current name.
    const victim = plots.features.find((f) => f.properties.stratum_code === 'FAR' && f.properties.role === 'primary')!.properties.plot_id;
    expect(victim).toMatch(/^FAR-0\d$/);
    expect(JSON.stringify(plots)).not.toContain('Stratum 7');
    const r = await cli(dir, 'reject', 'plots.geojson', '--plot', victim, '--reason', 'Unsafe to reach', '--at', '2026-12-01T09:30:00Z', '--out', 'rejected.geojson');
    expect(r).toEqual({ code: 0, err: '', out: `${victim} rejected (Unsafe to reach); reserve FAR-R1 replaces it.\nwrote rejected.geojson\n` });
    const after: PlotCollection = JSON.parse(readFileSync(join(dir, 'rejected.geojson'), 'utf8'));
    const props = (id: string) => after.features.find((f) => f.properties.plot_id === id)!.properties;
    expect(props(victim)).toMatchObject({ status: 'rejected', reject_reason: 'Unsafe to reach', rejected_at: '2026-12-01T09:30:00.000Z' });
    expect(props('FAR-R1')).toMatchObject({ status: 'promoted', replaces: victim });
    expect(props('FAR-R2').status).toBe('planned');
    // A second rejection in the stratum takes the next reserve in rank order.
    const other = plots.features.find((f) => f.properties.stratum_code === 'FAR' && f.properties.role === 'primary' && f.properties.plot_id !== victim)!.properties.plot_id;
    const r2 = await cli(dir, 'reject', 'rejected.geojson', '--plot', other, '--reason', 'Under water', '--out', 'twice.geojson');
    expect(r2.out).toContain('reserve FAR-R2 replaces it');
    const back = await cli(dir, 'restore', 'rejected.geojson', '--plot', victim, '--out', 'restored.geojson');
    expect(back).toEqual({ code: 0, err: '', out: `${victim} restored: visit it again; reserve FAR-R1 goes back to waiting.\nwrote restored.geojson\n` });
    expect(readFileSync(join(dir, 'restored.geojson'), 'utf8')).toBe(readFileSync(join(dir, 'plots.geojson'), 'utf8'));
  });

  it('export honours the field states in the plot file it reads', async () => {
    const dir = workdir();
    const plots = await planned(dir);
    const victim = plots.features.find((f) => f.properties.stratum_code === 'BAW' && f.properties.role === 'primary')!.properties.plot_id;
    await cli(dir, 'reject', 'plots.geojson', '--plot', victim, '--reason', 'Entry refused by the landholder', '--at', '2026-12-01T10:00:00Z', '--out', 'plots.geojson');
    expect((await cli(dir, 'export', 'plots.geojson', '--format', 'csv', '--out', 'p.csv', '--strata', 'strata.geojson')).code).toBe(0);
    const rows = Papa.parse<Record<string, string>>(readFileSync(join(dir, 'p.csv'), 'utf8'), { header: true, skipEmptyLines: true }).data;
    expect(rows.find((x) => x.plot_id === victim)).toMatchObject({ field_state: 'rejected', reject_reason: 'Entry refused by the landholder' });
    expect(rows.find((x) => x.plot_id === 'BAW-R1')).toMatchObject({ field_state: 'promoted', replaces: victim });
    expect(rows.find((x) => x.stratum_code === 'FAR')?.stratum).toBe('Farm paddock');
    expect((await cli(dir, 'export', 'plots.geojson', '--format', 'gpx', '--out', 'p.gpx')).code).toBe(0);
    const gpx = readFileSync(join(dir, 'p.gpx'), 'utf8');
    expect(gpx).not.toContain(`<name>${victim}</name>`);
    expect(gpx).toContain(`${victim} rejected 2026-12-01 10:00 UTC: Entry refused by the landholder; replaced by BAW-R1.`);
  });

  it('says in one line what is wrong, and exits 2', async () => {
    const dir = workdir();
    const plots = await planned(dir);
    const primary = plots.features.find((f) => f.properties.role === 'primary')!.properties.plot_id;
    const cases: [string[], string][] = [
      [['reject', 'plots.geojson', '--plot', 'NOPE-01', '--reason', 'x', '--out', 'o.geojson'], 'stratplot reject: no plot "NOPE-01" in this plot file\n'],
      [['reject', 'plots.geojson', '--plot', primary, '--out', 'o.geojson'], 'stratplot reject: --reason TEXT is required: why the plot cannot be sampled\n'],
      [['reject', 'plots.geojson', '--plot', primary, '--reason', 'x', '--at', 'soon', '--out', 'o.geojson'], 'stratplot reject: --at needs an ISO 8601 time such as 2026-12-01T09:30:00Z, got "soon"\n'],
      [['reject', 'plots.geojson', '--plot', primary, '--reason', 'x', '--out', 'o.csv'], 'stratplot reject: --out o.csv: a plot file is written as .geojson (or .json)\n'],
      [['reject', 'plots.geojson', '--plot', 'BAW-R2', '--reason', 'x', '--out', 'o.geojson'], 'stratplot reject: plot BAW-R2 is an unused reserve; only primaries and promoted reserves can be rejected\n'],
      [['restore', 'plots.geojson', '--plot', primary, '--out', 'o.geojson'], `stratplot restore: plot ${primary} is not rejected, so there is nothing to restore\n`],
      [['restore', 'missing.geojson', '--plot', primary, '--out', 'o.geojson'], 'stratplot restore: file not found: missing.geojson\n'],
    ];
    for (const [args, err] of cases) expect(await cli(dir, ...args), args.join(' ')).toEqual({ code: 2, out: '', err });
  });
});

describe('the CSV plot table from every command', () => {
  it('carries the safety caution in its last column, from export, plan --out and traps --out', async () => {
    const dir = workdir();
    await planned(dir);
    await cli(dir, 'plan', 'strata.geojson', '--plots', '8', '--seed', '4', '--out', 'plan.csv');
    await cli(dir, 'export', 'plots.geojson', '--format', 'csv', '--out', 'export.csv');
    await cli(dir, 'traps', 'strata.geojson', '--grids', '1', '--rows', '2', '--cols', '2', '--spacing', '10', '--seed', '4', '--out', 'traps.csv');
    for (const name of ['plan.csv', 'export.csv', 'traps.csv']) {
      const parsed = Papa.parse<Record<string, string>>(readFileSync(join(dir, name), 'utf8'), { header: true, skipEmptyLines: true });
      expect(parsed.meta.fields?.[0], name).toBe('plot_id');
      expect(parsed.meta.fields?.at(-1), name).toBe('caution');
      expect(parsed.data.length, name).toBeGreaterThan(0);
      expect(parsed.data.every((r) => r.caution === FIELD_CAUTION), name).toBe(true);
    }
  });
});
