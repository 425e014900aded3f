import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../../core/geo/polygonAreaM2';
import { runCli } from '../main';

const X = 150.5;
const Y = -35.1;
const box = (x: number, y: number, dx: number, dy: number) => ({
  type: 'Polygon' as const,
  coordinates: [[[x, y], [x + dx, y], [x + dx, y + dy], [x, y + dy], [x, y]]],
});
const feature = (properties: Record<string, unknown>, geometry: unknown) => ({ type: 'Feature', properties, geometry });
const collection = (...features: unknown[]) => JSON.stringify({ type: 'FeatureCollection', features });

// An invented two-stratum site and one hazard, written to a fresh folder for each run.
const dir = mkdtempSync(join(tmpdir(), 'stratplot-areas-'));
const write = (name: string, text: string) => writeFileSync(join(dir, name), text);
write('strata.geojson', collection(
  feature({ stratum: 'Heath' }, box(X, Y, 0.004, 0.003)),
  feature({ stratum: 'Heath' }, box(X, Y + 0.003, 0.002, 0.001)),
  feature({ stratum: 'Dune' }, box(X + 0.004, Y, 0.004, 0.003)),
));
write('hazard.geojson', collection(feature({ kind: 'hazard', buffer_m: 30, name: 'Old shaft' }, { type: 'Point', coordinates: [X + 0.002, Y + 0.0015] })));
write('broken.json', '{"type": "FeatureCollection",\n "features": [,]}');
write('points.geojson', collection(feature({ stratum: 'Heath' }, { type: 'Point', coordinates: [X, Y] })));
write('bowtie.geojson', collection(feature({ stratum: 'Heath' }, { type: 'Polygon', coordinates: [[[X, Y], [X + 0.002, Y + 0.002], [X + 0.002, Y], [X, Y + 0.002], [X, Y]]] })));
write('empty.geojson', collection());
write('boundary.geojson', collection(feature({ name: 'Invented reserve' }, box(X, Y, 0.009, 0.004))));

async function cli(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await runCli(['areas', ...argv], { out: (t) => { out += t; }, err: (t) => { err += t; }, cwd: dir });
  return { code, out, err };
}

describe('stratplot areas', () => {
  it('prints the JSON document with exactly the published fields', async () => {
    const { code, out, err } = await cli('strata.geojson', '--exclude', 'hazard.geojson', '--json');
    expect(err).toBe('');
    expect(code).toBe(0);
    const doc = JSON.parse(out);
    expect(Object.keys(doc)).toEqual(['strata', 'total_m2', 'crs']);
    expect(doc.strata.map((s: object) => Object.keys(s))).toEqual(Array(2).fill(['stratum', 'features', 'area_m2', 'area_ha', 'share', 'usable_m2']));
    expect(doc.crs).toEqual({ utm_zone: '56S', epsg: 32756 });
    const [heath, dune] = doc.strata;
    expect([heath.stratum, heath.features, dune.stratum, dune.features]).toEqual(['Heath', 2, 'Dune', 1]);
    // Mapped areas are geodesic (Karney 2013); checked against polygonAreaM2 to the printed 0.001 m².
    const heathM2 = polygonAreaM2(box(X, Y, 0.004, 0.003)) + polygonAreaM2(box(X, Y + 0.003, 0.002, 0.001));
    expect(heath.area_m2).toBeCloseTo(heathM2, 3);
    expect(doc.total_m2).toBeCloseTo(heath.area_m2 + dune.area_m2, 3);
    expect(heath.share + dune.share).toBeCloseTo(1, 8);
    // The 30 m hazard sits inside the heath: it loses π·30² (elementary geometry) within 0.1 %.
    expect(Math.abs((heath.area_m2 - heath.usable_m2) / (Math.PI * 900) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(dune.usable_m2 / dune.area_m2 - 1)).toBeLessThan(1e-9);
  });

  it('prints a readable table with a total row and the frame', async () => {
    const { code, out } = await cli('strata.geojson');
    expect(code).toBe(0);
    const lines = out.split('\n');
    expect(lines[0]).toMatch(/^stratum\s+features\s+mapped ha\s+share %\s+usable ha$/);
    expect(lines.find((l) => l.startsWith('Heath'))).toMatch(/^Heath\s+2\s+\d+\.\d{4}\s+\d+\.\d\s+\d+\.\d{4}$/);
    expect(lines.find((l) => l.startsWith('total'))).toMatch(/^total\s+3\s+\d+\.\d{4}\s+100\.0\s+\d+\.\d{4}$/);
    expect(out).toContain('UTM zone 56S (EPSG:32756)');
  });

  it.each([
    [['nowhere.geojson'], 'stratplot areas: file not found: nowhere.geojson'],
    [['broken.json'], 'stratplot areas: broken.json: not valid JSON (line 2, column 15)'],
    [['empty.geojson'], 'stratplot areas: empty.geojson: no polygons (the file has no features)'],
    [['points.geojson'], 'stratplot areas: points.geojson: feature 0 is a Point; strata must be Polygon or MultiPolygon features'],
    [['bowtie.geojson'], 'stratplot areas: bowtie.geojson: feature 0 (HEA-1), ring 0: crosses itself: edges 0 and 2 meet at 150.50100, -35.09900'],
    [['strata.geojson', '--field', 'habitat'], 'stratplot areas: strata.geojson: no feature has the field "habitat"; fields present: stratum'],
    [['strata.geojson', '--exclude', 'strata.geojson'], 'stratplot areas: strata.geojson: feature 0 has no kind; give kind = one of cliff, water, private, hazard, other'],
    [['strata.geojson', '--colour'], 'stratplot areas: unknown option --colour (see stratplot areas --help)'],
    [['strata.geojson', '--field'], 'stratplot areas: option --field needs a value (see stratplot areas --help)'],
    [[], 'stratplot areas: give one strata file (see stratplot areas --help)'],
  ])('exits 2 with one line for %j', async (argv, line) => {
    const { code, out, err } = await cli(...argv);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err).toBe(`${line}\n`);
  });

  it('warns on stderr of ground inside the boundary that no stratum covers, and still exits 0', async () => {
    // The boundary reaches 0.001° east of the dune and 0.001°/0.002° north of the strata.
    const { code, out, err } = await cli('strata.geojson', '--boundary', 'boundary.geojson', '--json');
    expect(code).toBe(0);
    expect(JSON.parse(out).strata).toHaveLength(2);
    const lines = err.trim().split('\n');
    expect(lines.length).toBeGreaterThan(0);
    for (const line of lines) expect(line).toMatch(/^warning: boundary\.geojson: boundary 0: gap of [\d.]+ m² inside the site boundary that no stratum covers at 150\.5\d{4}, -35\.0\d{4}$/);
  });
});
