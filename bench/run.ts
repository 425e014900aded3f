import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as turf from '@turf/turf';
import geodesic from 'geographiclib-geodesic';
import type { Feature, LineString, Point, Polygon } from 'geojson';
import { designPlace } from '../src/core/design/designPlace';
import { designUsableAreas } from '../src/core/design/designUsableAreas';
import { designSettingsDefault } from '../src/core/design/designSettingsDefault';
import { geodesicRingAreaM2 } from '../src/core/geo/geodesicRingAreaM2';
import { placementConstraintsBuild } from '../src/core/design/place/placementConstraints';
import { RNG_VERSION_CURRENT, rngCreate } from '../src/core/design/place/rng';
import { rngStreams } from '../src/core/design/place/rngStreams';
import { siteLocalFrame } from '../src/core/geo/siteLocalFrame';
import { polygonSelfIntersections } from '../src/core/geometry/polygonSelfIntersections';
import { siteValidate } from '../src/core/site/siteValidate';
import { stratumUsableRegion } from '../src/core/site/stratumUsableRegion';
import { utmForwardArray } from '../src/core/geo/utmForwardArray';
import type { Site } from '../src/core/model/types';
import { exclusionsFromFeatures } from '../src/io/site/exclusionsFromFeatures';
import { strataFromFeatures } from '../src/io/site/strataFromFeatures';
import { type BenchSite, benchSiteGenerate } from './benchSiteGenerate';

// Seeded benchmarks of the design engine (invented sites, see benchSiteGenerate). Prints times and
// ratios; nothing here asserts an absolute time.
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const dir = mkdtempSync(join(tmpdir(), 'stratplot-bench-'));
let sink = 0;

function writeSite(name: string, s: BenchSite): string[] {
  const files = (['strata', 'lines', 'polygons', 'points'] as const).map((k) => {
    const path = join(dir, `${name}-${k}.geojson`);
    writeFileSync(path, JSON.stringify(s[k]));
    return path;
  });
  return files;
}

function siteOf(s: BenchSite): Site {
  const { strata, parts } = strataFromFeatures(s.strata, { fileName: 'strata' });
  const exclusions = [s.lines, s.polygons, s.points].flatMap((fc, i) => exclusionsFromFeatures(fc, { fileName: `layer${i}` }));
  return { name: 'bench (invented)', strata, parts, exclusions, access: [], boundary: null };
}

function peakRssMb(): number {
  return process.resourceUsage().maxRSS / 1024;
}

/** The engine's placement: constraint indexes, then sequential inhibition with a grid hash. */
function enginePlace(site: Site, plots: number, spacingM: number, sideM: number, seed: number): number {
  const frame = siteLocalFrame(site.parts);
  const c = placementConstraintsBuild(site, frame, { footprint: { shape: 'square', sideM, angleDeg: 0 }, edgeBufferM: 0 });
  const h = site.strata.length;
  const wanted = site.strata.map((_, i) => Math.floor(plots / h) + (i < plots % h ? 1 : 0));
  const settings = designSettingsDefault({ plots, spacingM, footprint: { shape: 'square', sideM, angleDeg: 0 }, seed });
  const p = designPlace(c, settings, { wanted, weights: wanted, basisM2: wanted, streams: rngStreams(seed, RNG_VERSION_CURRENT) });
  for (let i = 0; i < p.placed.x.length; i++) sink += p.placed.x[i] * 1e-9;
  return p.placed.x.length;
}

/**
 * The straightforward approach: random points in the site's box; keep one when turf says it is in a
 * stratum polygon, outside every exclusion polygon, farther than each exclusion's buffer from every
 * exclusion (turf distances), and farther than the spacing from every earlier plot. Points only (no
 * footprint test), which flatters it.
 */
function naivePlace(s: BenchSite, plots: number, spacingM: number, seed: number): number {
  const rng = rngCreate(seed);
  const bbox = turf.bbox(s.strata);
  const strata = s.strata.features as Feature<Polygon>[];
  const lines = s.lines.features as Feature<LineString>[];
  const ponds = s.polygons.features as Feature<Polygon>[];
  const pondEdges = ponds.map((f) => turf.polygonToLine(f) as Feature<LineString>);
  const hazards = s.points.features as Feature<Point>[];
  const kept: Feature<Point>[] = [];
  let tries = 0;
  while (kept.length < plots && tries < plots * 1000) {
    tries++;
    const pt = turf.point([bbox[0] + rng.float() * (bbox[2] - bbox[0]), bbox[1] + rng.float() * (bbox[3] - bbox[1])]);
    if (!strata.some((f) => turf.booleanPointInPolygon(pt, f))) continue;
    if (lines.some((f) => turf.pointToLineDistance(pt, f, { units: 'meters' }) < (f.properties?.buffer_m ?? 0))) continue;
    if (ponds.some((f, i) => turf.booleanPointInPolygon(pt, f) || turf.pointToLineDistance(pt, pondEdges[i], { units: 'meters' }) < (f.properties?.buffer_m ?? 0))) continue;
    if (hazards.some((f) => turf.distance(pt, f, { units: 'meters' }) < (f.properties?.buffer_m ?? 0))) continue;
    if (kept.some((q) => turf.distance(pt, q, { units: 'meters' }) < spacingM)) continue;
    kept.push(pt);
    sink += pt.geometry.coordinates[0] * 1e-9;
  }
  return kept.length;
}

function time<T>(fn: () => T): { ms: number; value: T } {
  (globalThis as { gc?: () => void }).gc?.();
  const t = performance.now();
  const value = fn();
  return { ms: performance.now() - t, value };
}

function cliRun(files: string[], plots: number): { ms: number; peakMb: number | null; code: number; err: string } {
  const args = [join(root, 'bin/stratplot.mjs'), 'plan', files[0], '--exclude', files[1], '--exclude', files[2], '--exclude', files[3]];
  args.push('--plots', String(plots), '--spacing', '20', '--footprint', 'square:10', '--seed', '1', '--out', join(dir, 'plots.geojson'));
  const useTime = existsSync('/usr/bin/time');
  const t = performance.now();
  const r = useTime ? spawnSync('/usr/bin/time', ['-f', 'PEAK_KB %M', process.execPath, ...args], { encoding: 'utf8' }) : spawnSync(process.execPath, args, { encoding: 'utf8' });
  const ms = performance.now() - t;
  const m = /PEAK_KB (\d+)/.exec(r.stderr ?? '');
  return { ms, peakMb: m ? Number(m[1]) / 1024 : null, code: r.status ?? -1, err: (r.stderr ?? '').replace(/PEAK_KB \d+\s*/, '').trim() };
}

console.log(`stratplot bench — node ${process.version}, ${process.platform}/${process.arch}`);
try {
  console.log(`cpu: ${execFileSync('sh', ['-c', "grep -m1 'model name' /proc/cpuinfo | cut -d: -f2"], { encoding: 'utf8' }).trim()}, ${execFileSync('nproc', { encoding: 'utf8' }).trim()} cores`);
} catch {
  // Not Linux: the node line above still identifies the run.
}

// 1. Placement engine against the straightforward approach: 100 000 vertices, 2 000 plots.
const small = benchSiteGenerate(7, 100_000, 10, 100);
const smallSite = siteOf(small);
enginePlace(smallSite, 200, 20, 10, 99); // warm-up
naivePlace(small, 50, 20, 99); // warm-up
const ours = time(() => enginePlace(smallSite, 2000, 20, 10, 1));
const naive = time(() => naivePlace(small, 2000, 20, 1));
console.log(`\n100k vertices, ${small.strata.features.length} polygons, 300 exclusions, 2 000 plots at 20 m spacing:`);
console.log(`  engine (flatbush + earcut + grid hash, 10 m square footprint): ${ours.ms.toFixed(0)} ms, ${ours.value} plots`);
console.log(`  straightforward (bbox points, turf tests against everything, points only): ${naive.ms.toFixed(0)} ms, ${naive.value} plots`);
console.log(`  ratio: ${(naive.ms / ours.ms).toFixed(1)}x (target ≥ 50x)`);
console.log(`  peak RSS of this process so far: ${peakRssMb().toFixed(0)} MB`);

// 2. The whole CLI process on 1 000 000 vertices, 10 000 plots.
const big = benchSiteGenerate(1, 1_000_000, 20, 300);
const files = writeSite('big', big);
const bigSite = siteOf(big);
const engineBig = time(() => enginePlace(bigSite, 10000, 20, 10, 1));
console.log(`\n1M vertices (${big.vertices}), 400 polygons, 900 exclusions (lines, polygons, points), 10 000 plots at 20 m, 10 m square:`);
console.log(`  engine in process (indexes + placement): ${engineBig.ms.toFixed(0)} ms, ${engineBig.value} plots`);
// Where the CLI's time goes, stage by stage, in this process.
const bigFrame = siteLocalFrame(bigSite.parts);
const validate = time(() => siteValidate(bigSite).length);
const areas = time(() => designUsableAreas(bigSite, bigFrame).usable.length);
console.log(`  stages in process: siteValidate ${validate.ms.toFixed(0)} ms, mapped + usable areas ${areas.ms.toFixed(0)} ms, indexes + placement ${engineBig.ms.toFixed(0)} ms`);
// Baselines for the two area stages, measured in this run on the same site.
const partRings = bigSite.parts.flatMap((part) => (part.geometry.type === 'Polygon' ? [part.geometry.coordinates[0]] : part.geometry.coordinates.map((p) => p[0])));
const fastArea = time(() => partRings.reduce((a, ring) => a + geodesicRingAreaM2(ring), 0));
const libArea = time(() =>
  partRings.reduce((a, ring) => {
    const poly = geodesic.Geodesic.WGS84.Polygon(false);
    for (let i = 0; i < ring.length - 1; i++) poly.AddPoint(ring[i][1], ring[i][0]);
    return a + (poly.Compute(false, true).area ?? 0);
  }, 0),
);
sink += fastArea.value * 1e-12 + libArea.value * 1e-12;
console.log(
  `  ellipsoidal area of all ${partRings.length} rings: equal-area route ${fastArea.ms.toFixed(0)} ms, GeographicLib PolygonArea ${libArea.ms.toFixed(0)} ms` +
    ` — ratio ${(libArea.ms / fastArea.ms).toFixed(1)}x, relative difference of the totals ${Math.abs(fastArea.value / libArea.value - 1).toExponential(1)}`,
);
// Projecting every stratum vertex into the UTM frame: one flat pass against proj4 point by point.
const flatRings = partRings.map((ring) => Float64Array.from(ring.flat()));
const flatXY = time(() => flatRings.map((f) => utmForwardArray(bigFrame, f)));
const proj4XY = time(() => partRings.map((ring) => ring.map(([lon, lat]) => bigFrame.toXY(lon, lat))));
let projDiff = 0;
for (let r = 0; r < partRings.length; r++) {
  const xy = flatXY.value[r];
  const ref = proj4XY.value[r];
  for (let i = 0; i < ref.length; i++) projDiff = Math.max(projDiff, Math.abs(xy[2 * i] - ref[i][0]), Math.abs(xy[2 * i + 1] - ref[i][1]));
}
sink += flatXY.value.length + proj4XY.value.length;
console.log(
  `  UTM projection of all ${big.vertices + partRings.length} ring vertices: flat Krüger series ${flatXY.ms.toFixed(0)} ms, proj4 point by point ${proj4XY.ms.toFixed(0)} ms` +
    ` — ratio ${(proj4XY.ms / flatXY.ms).toFixed(1)}x, largest difference ${projDiff} m`,
);
// Self-intersection check of the same rings against turf's kinks (the tests' reference), on a sample.
const sampleRings = partRings.slice(0, 40);
const ourKinks = time(() => sampleRings.reduce((a, ring) => a + polygonSelfIntersections([ring], { featureIndex: 0, layer: 'strata' }).length, 0));
const turfKinks = time(() => sampleRings.reduce((a, ring) => a + turf.kinks(turf.polygon([ring])).features.length, 0));
console.log(
  `  self-intersection check of ${sampleRings.length} rings: sweep ${ourKinks.ms.toFixed(0)} ms, turf kinks ${turfKinks.ms.toFixed(0)} ms — ratio ${(turfKinks.ms / ourKinks.ms).toFixed(1)}x (${ourKinks.value} and ${turfKinks.value} found)`,
);
// Clipping each stratum part with polyclip-ts (stratumUsableRegion), on a sample of parts, scaled up.
const sampleParts = bigSite.parts.slice(0, 40);
const clipped = time(() => sampleParts.reduce((a, part) => a + stratumUsableRegion({ ...bigSite, parts: [part] }, part.stratum, bigFrame).areaM2, 0));
const direct = time(() => designUsableAreas({ ...bigSite, parts: sampleParts }, bigFrame).usable.reduce((a, x) => a + x, 0));
console.log(
  `  usable area of ${sampleParts.length} parts: measured directly ${direct.ms.toFixed(0)} ms, clipping each part (polyclip-ts) ${clipped.ms.toFixed(0)} ms` +
    ` — ratio ${(clipped.ms / direct.ms).toFixed(1)}x, relative difference ${Math.abs(direct.value / clipped.value - 1).toExponential(1)}`,
);
const cli = cliRun(files, 10000);
console.log(`  whole CLI process (bin/stratplot.mjs plan … --out): ${cli.ms.toFixed(0)} ms (target ≤ 1 500 ms), exit ${cli.code}` + (cli.peakMb ? `, peak RSS ${cli.peakMb.toFixed(0)} MB` : ''));
if (cli.code !== 0) console.log(`  CLI said: ${cli.err.split('\n')[0]}`);
console.log(`\n(result sink ${sink.toFixed(3)})`);
rmSync(dir, { recursive: true, force: true });
