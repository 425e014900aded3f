import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../main';

// An invented site (not a real place): one square stratum with a pond that has a 10 m buffer.
const ring = (lon0: number, lat0: number, d: number) => [
  [
    [lon0, lat0],
    [lon0 + d, lat0],
    [lon0 + d, lat0 + d],
    [lon0, lat0 + d],
    [lon0, lat0],
  ],
];
const strata = {
  type: 'FeatureCollection',
  features: [{ type: 'Feature', properties: { stratum: 'Coastal heath' }, geometry: { type: 'Polygon', coordinates: ring(153.1, -27.41, 0.01) } }],
};
const exclusions = {
  type: 'FeatureCollection',
  features: [{ type: 'Feature', properties: { kind: 'water', buffer_m: 10 }, geometry: { type: 'Polygon', coordinates: ring(153.104, -27.406, 0.001) } }],
};

function workdir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'stratplot-traps-'));
  writeFileSync(join(dir, 'strata.geojson'), JSON.stringify(strata));
  writeFileSync(join(dir, 'excl.geojson'), JSON.stringify(exclusions));
  return dir;
}

async function run(argv: string[], cwd: string) {
  let out = '';
  let err = '';
  const code = await runCli(argv, { out: (t) => (out += t), err: (t) => (err += t), cwd });
  return { code, out, err };
}

const ARGS = ['traps', 'strata.geojson', '--exclude', 'excl.geojson', '--grids', '3', '--rows', '4', '--cols', '4', '--spacing', '15', '--separation', '80', '--seed', '5'];

describe('stratplot traps', () => {
  it('writes a plot file of stations that stratplot estimate can read', async () => {
    const dir = workdir();
    const r = await run([...ARGS, '--out', 'traps.geojson'], dir);
    expect(r.code).toBe(0);
    expect(r.out).toContain('3 trap grids, 48 stations');
    expect(r.out).toContain('landholder');
    const fc = JSON.parse(readFileSync(join(dir, 'traps.geojson'), 'utf8'));
    expect(fc.features[0].properties.plot_id).toBe('G1-A01');
    expect(fc.features.every((f: { properties: { role: string } }) => f.properties.role === 'primary')).toBe(true);
    // Invented catches per station, estimated as a stratified mean over the one stratum.
    const rows = ['plot_id,captures', ...fc.features.map((f: { properties: { plot_id: string } }, i: number) => `${f.properties.plot_id},${i % 3}`)];
    writeFileSync(join(dir, 'catches.csv'), `${rows.join('\n')}\n`);
    const e = await run(['estimate', 'traps.geojson', 'catches.csv', '--value', 'captures', '--kind', 'count', '--json'], dir);
    expect(e.err).toBe('');
    expect(JSON.parse(e.out).strata[0].n).toBe(48);
  });

  it('prints the grids as JSON and the same layout for the same seed', async () => {
    const dir = workdir();
    const a = JSON.parse((await run([...ARGS, '--json'], dir)).out);
    const b = JSON.parse((await run([...ARGS, '--json'], dir)).out);
    expect(a.grids.length).toBe(3);
    expect(a.grids.map((g: { grid: string }) => g.grid)).toEqual(['G1', 'G2', 'G3']);
    expect(a).toEqual(b);
  });

  it('exits 2 with one line for bad options', async () => {
    const dir = workdir();
    expect((await run(['traps', 'strata.geojson', '--grids', '2', '--rows', '30', '--cols', '3', '--spacing', '10'], dir)).err).toBe(
      'stratplot traps: rows must be a whole number from 1 to 26, got 30\n',
    );
    expect((await run(['traps', 'strata.geojson', '--rows', '3', '--cols', '3', '--spacing', '10'], dir)).err).toBe(
      'stratplot traps: --grids is required (see stratplot traps --help)\n',
    );
    expect((await run(['traps', 'strata.geojson', '--grids', 'Dune=2', '--rows', '3', '--cols', '3', '--spacing', '10'], dir)).err).toBe(
      'stratplot traps: --grids: no stratum "Dune"; strata are "Coastal heath"\n',
    );
    expect((await run(['traps', 'strata.geojson', '--grids', '2', '--rows', '3', '--cols', '3', '--spacing', 'ten'], dir)).err).toBe(
      'stratplot traps: --spacing needs a number, got "ten"\n',
    );
  });
});
