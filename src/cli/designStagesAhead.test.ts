import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildCli } from '../../scripts/build-cli.mjs';
import { partAreasMeasurer } from '../core/design/partAreas';
import { stratumPolygons } from '../core/design/place/placementStrata';
import { stratumCellsXY } from '../core/design/place/stratumCellsXY';
import { type StratumTrianglesXY, stratumTrianglesXY } from '../core/design/place/stratumTrianglesXY';
import { siteLocalFrame } from '../core/geo/siteLocalFrame';
import type { Site } from '../core/model/types';
import { exclusionsFromFeatures } from '../io/site/exclusionsFromFeatures';
import { strataFromFeatures } from '../io/site/strataFromFeatures';
import { designStagesAhead } from './designStagesAhead';

const root = join(import.meta.dirname, '../..');
const demo = (name: string) => join(root, `demo-maps/ochre-spit-${name}.geojson`);
const bytesOf = (a: ArrayBufferView) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

function demoSite(): Site {
  const { strata, parts } = strataFromFeatures(JSON.parse(readFileSync(demo('strata'), 'utf8')), { fileName: 'strata' });
  const exclusions = exclusionsFromFeatures(JSON.parse(readFileSync(demo('exclusions'), 'utf8')), { fileName: 'exclusions' });
  return { name: 'Ochre Spit (invented)', strata, parts, exclusions, access: [], boundary: null };
}

beforeAll(async () => {
  await buildCli();
}, 120_000);

describe('designStagesAhead (the second thread of stratplot plan)', () => {
  it.each(['triangles', 'cells'] as const)('shares the jobs with the bundled worker and gives exactly what one thread makes (sampling by %s)', async (sampling) => {
    const site = demoSite();
    const ahead = designStagesAhead(sampling, 2, pathToFileURL(join(root, 'dist-cli/designStagesWorker.mjs')));
    expect(ahead).not.toBeNull();
    ahead!.strataRead(site.strata, site.parts);
    // Handed over before the site is checked, as stratplot plan does: the other thread may take part jobs at once.
    ahead!.exclusionsRead(site.exclusions);
    // Time for the worker to start and take the stratum jobs before this thread joins.
    await new Promise((resolve) => setTimeout(resolve, 1500));
    const got = await ahead!.finish(site);
    expect(got).not.toBeNull();
    expect(got!.otherThreadJobs).toBeGreaterThan(0);
    const frame = siteLocalFrame(site.parts);
    site.strata.forEach((s, i) => {
      const one = stratumTrianglesXY(stratumPolygons(site, s.key), frame);
      const two = got!.made.strata[i] as Partial<StratumTrianglesXY>;
      expect(two.bbox).toEqual(one.bbox);
      expect(two.areaGrid).toBe(one.areaGrid);
      for (const k of ['edges', 'coords', 'polygonStarts', 'holeStarts', 'polygonHoles'] as const) expect(bytesOf(two[k]!).equals(bytesOf(one[k]))).toBe(true);
      // Triangles only where the design samples by them: a cell design never triangulates, and gets its cell grid made.
      if (sampling === 'cells') {
        expect(two.triangles).toBeUndefined();
        const grid = stratumCellsXY(one.bbox, one.edges);
        const made = got!.made.strata[i].cellGrid!;
        expect([made.x0, made.y0, made.side, made.nx, made.ny]).toEqual([grid.x0, grid.y0, grid.side, grid.nx, grid.ny]);
        for (const k of ['state', 'ground', 'rowStarts', 'rowSegments'] as const) expect(bytesOf(made[k]).equals(bytesOf(grid[k]))).toBe(true);
      } else {
        expect(got!.made.strata[i].cellGrid).toBeUndefined();
        for (const k of ['triangles', 'cumulativeArea'] as const) expect(bytesOf(two[k]!).equals(bytesOf(one[k]))).toBe(true);
      }
    });
    const measure = partAreasMeasurer(site, frame);
    for (let i = 0; i < site.parts.length; i++) expect(got!.made.partAreas[i]).toEqual(measure(i));
  }, 60_000);

  it('is not started where it cannot help: one thread asked for, or no worker file', () => {
    expect(designStagesAhead('cells', 1)).toBeNull();
    expect(designStagesAhead('cells', 2, pathToFileURL(join(tmpdir(), 'no-such-worker.mjs')))).toBeNull();
  });

  it('gives null rather than part areas measured against another list of exclusions than the site has', async () => {
    const site = demoSite();
    const ahead = designStagesAhead('cells', 2, pathToFileURL(join(root, 'dist-cli/designStagesWorker.mjs')));
    ahead!.strataRead(site.strata, site.parts);
    ahead!.exclusionsRead(site.exclusions.slice(1));
    expect(await ahead!.finish(site)).toBeNull();
    ahead!.stop();
  }, 60_000);

  it('leaves the design byte for byte as one thread makes it (whole command, bundled)', () => {
    const bundle = join(root, 'dist-cli/stratplot.mjs');
    expect(existsSync(bundle)).toBe(true);
    const dir = mkdtempSync(join(tmpdir(), 'stratplot-threads-'));
    const run = (threads: string) => {
      const out = join(dir, `plots-${threads}.geojson`);
      const args = [bundle, 'plan', demo('strata'), '--exclude', demo('exclusions'), '--plots', '40', '--spacing', '25', '--reserve', '2'];
      args.push('--footprint', 'circle:5', '--seed', '7', '--json', '--out', out);
      const summary = execFileSync(process.execPath, args, { env: { ...process.env, STRATPLOT_THREADS: threads }, encoding: 'utf8' });
      return { summary, plots: readFileSync(out, 'utf8') };
    };
    const one = run('1');
    const two = run('2');
    expect(two.plots).toBe(one.plots);
    expect(two.summary).toBe(one.summary);
    expect(JSON.parse(one.plots).features.length).toBe(40 + 2 * 6);
  }, 60_000);
});
