import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import booleanPointInPolygon from '@turf/boolean-point-in-polygon';
import fc from 'fast-check';
import geodesic from 'geographiclib-geodesic';
import type { Feature, Point } from 'geojson';
import { describe, it } from 'vitest';
import { collectionText, feature, siteStrata, X0, Y0 } from '../hostile/hostileFiles';
import { FUZZ_SEED, fuzzCli, fuzzDir, fuzzReport, fuzzRuns, fuzzTally } from './fuzzHarness';

// CLI option values: `stratplot plan` on the invented two-stratum site with every placement option
// drawn from sensible values and from values people mistype (negative, fractional, hexadecimal,
// 1e400, empty, huge). It must exit 0 or 3 (a short design) with every plot inside its stratum and
// at least the spacing from every other (GeographicLib distances), or exit 2 with one line, within
// the time budget.

const ODD = ['-1', '2.5', '0x10', '1e400', '', 'abc', 'Infinity', ' 7 ', '1e9', '100001'];
const count = (max: number) => fc.oneof({ weight: 12, arbitrary: fc.integer({ min: 0, max }).map(String) }, { weight: 1, arbitrary: fc.constantFrom(...ODD) });
const metres = (max: number, min = 0) => fc.oneof({ weight: 12, arbitrary: fc.double({ min, max, noNaN: true }).map((v) => String(Math.round(v * 100) / 100)) }, { weight: 1, arbitrary: fc.constantFrom(...ODD, '1e-9', '0') });
const mostly = <T>(good: T[], odd: T[]) => fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...good) }, { weight: 1, arbitrary: fc.constantFrom(...odd) });
/** Present about one time in three, so most designs change a few options at a time. */
const sometimes = <T>(a: fc.Arbitrary<T>) => fc.option(a, { freq: 2, nil: undefined });

const optionsArb = fc.record({
  plots: count(60),
  spacing: sometimes(metres(60)),
  reserve: sometimes(count(4)),
  footprint: sometimes(mostly(['point', 'square:10', 'square:10@45', 'rect:20x5@30', 'circle:5', 'square:5000'], ['circle:0', 'square:-1', 'hexagon:5', 'square:1e400', 'rect:5x'])),
  method: sometimes(mostly(['random', 'balanced', 'grid', 'transect'], ['spiral'])),
  'grid-spacing': sometimes(metres(120, 5)),
  'min-per-stratum': sometimes(count(5)),
  'edge-buffer': sometimes(metres(30)),
  allocation: sometimes(mostly(['proportional', 'equal'], ['neyman', 'optimal'])),
  seed: fc.oneof({ weight: 12, arbitrary: fc.integer({ min: 0, max: 2 ** 31 }).map(String) }, { weight: 1, arbitrary: fc.constantFrom(...ODD) }),
  'transect-interval': metres(120, 5),
  'quadrat-interval': metres(60, 2),
  redistribute: sometimes(fc.constant(true)),
});

const G = geodesic.Geodesic.WGS84;

describe('fuzz: plan option values', () => {
  it('exit 0 or 3 with every plot inside its stratum and spaced, or one error line with exit 2', async () => {
    const dir = fuzzDir('options');
    const tally = fuzzTally('options');
    const site = siteStrata();
    const baseline = collectionText(feature({}, { type: 'LineString', coordinates: [[X0, Y0 - 0.0005], [X0 + 0.007, Y0 - 0.0005]] }));
    const files = { 'site.geojson': JSON.stringify(site), 'baseline.geojson': baseline };
    await fc.assert(
      fc.asyncProperty(optionsArb, async (o) => {
        const argv = ['plan', 'site.geojson', '--out', 'plots.geojson', '--baseline', 'baseline.geojson'];
        for (const [k, v] of Object.entries(o)) {
          if (v === true) argv.push(`--${k}`);
          else if (typeof v === 'string') argv.push(`--${k}`, v);
        }
        rmSync(join(dir, 'plots.geojson'), { force: true });
        const r = await fuzzCli(tally, dir, files, argv, [0, 2, 3]);
        if (r.code === 2) return;
        if (!existsSync(join(dir, 'plots.geojson'))) throw new Error(`exit ${r.code} without the plot file`);
        const plots = JSON.parse(readFileSync(join(dir, 'plots.geojson'), 'utf8')).features as Feature<Point, { stratum: string; plot_id: string }>[];
        for (const p of plots) {
          const home = site.features.filter((f) => f.properties?.stratum === p.properties.stratum);
          const [lon, lat] = p.geometry.coordinates;
          // Coordinates are written to 7 decimals (about 1 cm): a plot on its stratum's edge may round 1e-7° across it.
          const near = [0, 1e-7, -1e-7].flatMap((dx) => [0, 1e-7, -1e-7].map((dy) => [lon + dx, lat + dy]));
          if (!home.some((f) => near.some((q) => booleanPointInPolygon(q, f.geometry as never)))) {
            throw new Error(`plot ${p.properties.plot_id} lies outside its stratum`);
          }
        }
        const spacing = Number(o.spacing ?? 0);
        if (spacing > 0) {
          for (let i = 0; i < plots.length; i++) {
            for (let j = i + 1; j < plots.length; j++) {
              const [a, b] = [plots[i].geometry.coordinates, plots[j].geometry.coordinates];
              const d = G.Inverse(a[1], a[0], b[1], b[0]).s12 as number;
              // 7-decimal coordinates move a plot by up to ~0.6 cm (as in designRun.property.test).
              if (d < spacing - 0.03) throw new Error(`plots ${plots[i].properties.plot_id} and ${plots[j].properties.plot_id} are ${d} m apart, under ${spacing} m`);
            }
          }
        }
      }),
      { seed: FUZZ_SEED, numRuns: fuzzRuns(40) },
    );
    fuzzReport(tally);
  });
});
