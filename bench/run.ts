import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as turf from '@turf/turf';
import geodesic from 'geographiclib-geodesic';
import type { Feature, LineString, Point, Polygon } from 'geojson';
import { designPlace } from '../src/core/design/designPlace';
import { designUsableAreas } from '../src/core/design/designUsableAreas';
import { designSampling } from '../src/core/design/designRun';
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
import type { RngVersion } from '../src/core/model/designTypes';
import type { Site } from '../src/core/model/types';
import { exclusionsFromFeatures } from '../src/io/site/exclusionsFromFeatures';
import { strataFromFeatures } from '../src/io/site/strataFromFeatures';
import { benchMosaicGenerate } from './benchMosaicGenerate';
import { type BenchSite, benchSiteGenerate } from './benchSiteGenerate';
import { strataOverlaps } from '../src/core/site/strataOverlaps';
import { strataOverlapsByClipping } from '../src/core/site/strataOverlapsByClipping';

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

/** The engine's placement: constraint indexes, then sequential inhibition with a grid hash. */
function enginePlace(site: Site, plots: number, spacingM: number, sideM: number, seed: number, version: RngVersion = RNG_VERSION_CURRENT): number {
  const frame = siteLocalFrame(site.parts);
  const c = placementConstraintsBuild(site, frame, { footprint: { shape: 'square', sideM, angleDeg: 0 }, edgeBufferM: 0, sampling: designSampling(version) });
  const h = site.strata.length;
  const wanted = site.strata.map((_, i) => Math.floor(plots / h) + (i < plots % h ? 1 : 0));
  const settings = designSettingsDefault({ plots, spacingM, footprint: { shape: 'square', sideM, angleDeg: 0 }, seed });
  const p = designPlace(c, settings, { wanted, weights: wanted, basisM2: wanted, streams: rngStreams(seed, version) });
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


/** Runs per measurement after one warm-up (STRATPLOT_BENCH_RUNS, default 5). */
const RUNS = Math.max(1, Number(process.env.STRATPLOT_BENCH_RUNS ?? 5));
/** Sizes of the mosaic family: 100k and 1M, and 5M when STRATPLOT_BENCH_5M=1. */
const MOSAIC_SIZES = process.env.STRATPLOT_BENCH_5M === '1' ? [100_000, 1_000_000, 5_000_000] : [100_000, 1_000_000];
/** The command-line reader refuses files of more vertices (MAX_FILE_VERTICES); larger mosaics are timed in process only. */
const CLI_MAX_VERTICES = 2_000_000;

interface Timing {
  minMs: number;
  medianMs: number;
  runs: number;
}
const record: { date: string; node: string; cpu: string; cores: number; loadBefore: number[]; loadAfter?: number[]; runs: number; stages: Record<string, Timing>; ratios: Record<string, number>; slopes: Record<string, number> } = {
  date: new Date().toISOString(),
  node: process.version,
  cpu: '',
  cores: 0,
  loadBefore: loadavg().map((x) => Number(x.toFixed(2))),
  runs: RUNS,
  stages: {},
  ratios: {},
  slopes: {},
};

function median(xs: number[]): number {
  const s = xs.slice().sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

function once<T>(fn: () => T): { ms: number; value: T } {
  (globalThis as { gc?: () => void }).gc?.();
  const t = performance.now();
  const value = fn();
  return { ms: performance.now() - t, value };
}

/** One warm-up run (`warm`, default `fn`), then `runs` timed runs; the stage's min and median go into the record under `name`. */
function measure<T>(name: string, fn: () => T, runs = RUNS, warm: () => unknown = fn): Timing & { value: T } {
  warm();
  let value = undefined as T;
  const ms: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t = once(fn);
    ms.push(t.ms);
    value = t.value;
  }
  const timing = { minMs: Math.min(...ms), medianMs: median(ms), runs };
  record.stages[name] = timing;
  return { ...timing, value };
}

const fmt = (t: Timing) => (t.medianMs >= 1000 ? `${(t.medianMs / 1000).toFixed(2)} s (min ${(t.minMs / 1000).toFixed(2)} s)` : `${t.medianMs.toFixed(0)} ms (min ${t.minMs.toFixed(0)} ms)`);

function cliArgs(files: string[], plots: number, bundle = join(root, 'bin/stratplot.mjs')): string[] {
  const args = [bundle, 'plan', files[0], '--exclude', files[1], '--exclude', files[2], '--exclude', files[3]];
  args.push('--plots', String(plots), '--spacing', '20', '--footprint', 'square:10', '--seed', '1', '--out', join(dir, 'plots.geojson'));
  return args;
}

function cliOnce(args: string[], threads?: '1'): { ms: number; peakMb: number | null; code: number; err: string } {
  const useTime = existsSync('/usr/bin/time');
  const env = threads ? { ...process.env, STRATPLOT_THREADS: threads } : process.env;
  const t = performance.now();
  const r = useTime
    ? spawnSync('/usr/bin/time', ['-f', 'PEAK_KB %M', process.execPath, ...args], { encoding: 'utf8', env })
    : spawnSync(process.execPath, args, { encoding: 'utf8', env });
  const ms = performance.now() - t;
  const m = /PEAK_KB (\d+)/.exec(r.stderr ?? '');
  return { ms, peakMb: m ? Number(m[1]) / 1024 : null, code: r.status ?? -1, err: (r.stderr ?? '').replace(/PEAK_KB \d+\s*/, '').trim() };
}

/** The whole CLI process: one warm-up (file cache, bundle), then RUNS runs. */
function cliMeasure(name: string, files: string[], plots: number): Timing & { peakMb: number | null; code: number } {
  const args = cliArgs(files, plots);
  const first = cliOnce(args);
  if (first.code !== 0) console.log(`  CLI said (exit ${first.code}): ${first.err.split('\n')[0]}`);
  const runs = Array.from({ length: RUNS }, () => cliOnce(args));
  const timing = { minMs: Math.min(...runs.map((r) => r.ms)), medianMs: median(runs.map((r) => r.ms)), runs: RUNS };
  record.stages[name] = timing;
  return { ...timing, peakMb: Math.max(...runs.map((r) => r.peakMb ?? 0)) || null, code: first.code };
}

/**
 * The straightforward way to make the same plan, in this process (so it pays no start-up): read the
 * files, check each stratum ring for self-intersections with turf `kinks`, intersect every pair of
 * strata whose boxes overlap with turf `intersect` (polyclip-ts) to find overlaps, then place
 * points with turf tests against everything (naivePlace). No usable area and no footprint, which
 * flatters it.
 */
function straightforwardPlan(files: string[], plots: number, seed: number): number {
  const [strata, lines, polygons, points] = files.map((f) => JSON.parse(readFileSync(f, 'utf8')));
  const features = strata.features as Feature<Polygon>[];
  let found = 0;
  for (const f of features) found += turf.kinks(f).features.length;
  const boxes = features.map((f) => turf.bbox(f));
  for (let i = 0; i < features.length; i++) {
    for (let j = i + 1; j < features.length; j++) {
      const [a, b] = [boxes[i], boxes[j]];
      if (a[0] > b[2] || b[0] > a[2] || a[1] > b[3] || b[1] > a[3]) continue;
      const common = turf.intersect(turf.featureCollection([features[i], features[j]]));
      if (common && turf.area(common) >= 0.01) found++;
    }
  }
  if (found > 0) return -found;
  return naivePlace({ strata, lines, polygons, points, vertices: 0 }, plots, 20, seed);
}

/** Least-squares slope of log(time) against log(vertices): 1 is linear growth. */
function slope(sizes: number[], ms: number[]): number {
  const xs = sizes.map(Math.log);
  const ys = ms.map(Math.log);
  const mx = xs.reduce((a, b) => a + b, 0) / xs.length;
  const my = ys.reduce((a, b) => a + b, 0) / ys.length;
  let num = 0;
  let den = 0;
  for (let i = 0; i < xs.length; i++) {
    num += (xs[i] - mx) * (ys[i] - my);
    den += (xs[i] - mx) ** 2;
  }
  return num / den;
}

console.log(`stratplot bench — node ${process.version}, ${process.platform}/${process.arch}; ${RUNS} runs after a warm-up, median (min)`);
try {
  record.cpu = execFileSync('sh', ['-c', "grep -m1 'model name' /proc/cpuinfo | cut -d: -f2"], { encoding: 'utf8' }).trim();
  record.cores = Number(execFileSync('nproc', { encoding: 'utf8' }).trim());
  console.log(`cpu: ${record.cpu}, ${record.cores} cores; load average before: ${record.loadBefore.join(' ')}`);
} catch {
  // Not Linux: the node line above still identifies the run.
}

// 1. Separate star-shaped strata (the first family). Placement engine against the straightforward approach.
const small = benchSiteGenerate(7, 100_000, 10, 100);
const smallSite = siteOf(small);
const ours = measure('stars-100k/placement', () => enginePlace(smallSite, 2000, 20, 10, 1));
const naive = measure('stars-100k/placement-straightforward', () => naivePlace(small, 2000, 20, 1), Math.min(RUNS, 3), () => naivePlace(small, 50, 20, 99));
record.ratios['stars-100k/placement'] = naive.medianMs / ours.medianMs;
console.log(`\nstars, 100k vertices, ${small.strata.features.length} polygons, 300 exclusions, 2 000 plots at 20 m spacing:`);
console.log(`  engine (flatbush + cell grid + spacing hash, 10 m square footprint): ${fmt(ours)}, ${ours.value} plots`);
console.log(`  straightforward (bbox points, turf tests against everything, points only): ${fmt(naive)}, ${naive.value} plots`);
console.log(`  ratio: ${(naive.medianMs / ours.medianMs).toFixed(1)}x (target ≥ 50x)`);

const big = benchSiteGenerate(1, 1_000_000, 20, 300);
const files = writeSite('big', big);
const bigSite = siteOf(big);
const bigFrame = siteLocalFrame(bigSite.parts);
console.log(`\nstars, 1M vertices (${big.vertices}), 400 polygons, 900 exclusions (lines, polygons, points), 10 000 plots at 20 m, 10 m square:`);
const validate = measure('stars-1m/siteValidate', () => siteValidate(bigSite).length);
const areas = measure('stars-1m/areas', () => designUsableAreas(bigSite, bigFrame).usable.length);
const engineBig = measure('stars-1m/placement', () => enginePlace(bigSite, 10000, 20, 10, 1));
console.log(`  in process: siteValidate ${fmt(validate)}, mapped + usable areas ${fmt(areas)}, indexes + placement ${fmt(engineBig)}`);
const partRings = bigSite.parts.flatMap((part) => (part.geometry.type === 'Polygon' ? [part.geometry.coordinates[0]] : part.geometry.coordinates.map((p) => p[0])));
const fastArea = measure('stars-1m/area-equal-area', () => partRings.reduce((a, ring) => a + geodesicRingAreaM2(ring), 0));
const libArea = measure(
  'stars-1m/area-geographiclib',
  () =>
    partRings.reduce((a, ring) => {
      const poly = geodesic.Geodesic.WGS84.Polygon(false);
      for (let i = 0; i < ring.length - 1; i++) poly.AddPoint(ring[i][1], ring[i][0]);
      return a + (poly.Compute(false, true).area ?? 0);
    }, 0),
  Math.min(RUNS, 3),
);
sink += fastArea.value * 1e-12 + libArea.value * 1e-12;
record.ratios['stars-1m/area'] = libArea.medianMs / fastArea.medianMs;
console.log(
  `  ellipsoidal area of all ${partRings.length} rings: equal-area route ${fmt(fastArea)}, GeographicLib PolygonArea ${fmt(libArea)}` +
    ` — ratio ${(libArea.medianMs / fastArea.medianMs).toFixed(1)}x, relative difference of the totals ${Math.abs(fastArea.value / libArea.value - 1).toExponential(1)}`,
);
const flatRings = partRings.map((ring) => Float64Array.from(ring.flat()));
const flatXY = measure('stars-1m/utm-flat', () => flatRings.map((f) => utmForwardArray(bigFrame, f)));
const proj4XY = measure('stars-1m/utm-proj4', () => partRings.map((ring) => ring.map(([lon, lat]) => bigFrame.toXY(lon, lat))), Math.min(RUNS, 3));
let projDiff = 0;
for (let r = 0; r < partRings.length; r++) {
  const xy = flatXY.value[r];
  const ref = proj4XY.value[r];
  for (let i = 0; i < ref.length; i++) projDiff = Math.max(projDiff, Math.abs(xy[2 * i] - ref[i][0]), Math.abs(xy[2 * i + 1] - ref[i][1]));
}
record.ratios['stars-1m/utm'] = proj4XY.medianMs / flatXY.medianMs;
console.log(`  UTM projection of all ring vertices: flat Krüger series ${fmt(flatXY)}, proj4 point by point ${fmt(proj4XY)} — ratio ${(proj4XY.medianMs / flatXY.medianMs).toFixed(1)}x, largest difference ${projDiff} m`);
const sampleRings = partRings.slice(0, 40);
const ourKinks = measure('stars-1m/kinks-sweep', () => sampleRings.reduce((a, ring) => a + polygonSelfIntersections([ring], { featureIndex: 0, layer: 'strata' }).length, 0));
const turfKinks = measure('stars-1m/kinks-turf', () => sampleRings.reduce((a, ring) => a + turf.kinks(turf.polygon([ring])).features.length, 0), Math.min(RUNS, 3));
record.ratios['stars-1m/kinks'] = turfKinks.medianMs / ourKinks.medianMs;
console.log(`  self-intersection check of ${sampleRings.length} rings: sweep ${fmt(ourKinks)}, turf kinks ${fmt(turfKinks)} — ratio ${(turfKinks.medianMs / ourKinks.medianMs).toFixed(1)}x (${ourKinks.value} and ${turfKinks.value} found)`);
const sampleParts = bigSite.parts.slice(0, 40);
const clipped = measure('stars-1m/usable-clipping', () => sampleParts.reduce((a, part) => a + stratumUsableRegion({ ...bigSite, parts: [part] }, part.stratum, bigFrame).areaM2, 0), Math.min(RUNS, 3));
const direct = measure('stars-1m/usable-direct', () => designUsableAreas({ ...bigSite, parts: sampleParts }, bigFrame).usable.reduce((a, x) => a + x, 0));
record.ratios['stars-1m/usable'] = clipped.medianMs / direct.medianMs;
console.log(`  usable area of ${sampleParts.length} parts: measured directly ${fmt(direct)}, clipping each part (polyclip-ts) ${fmt(clipped)} — ratio ${(clipped.medianMs / direct.medianMs).toFixed(1)}x, relative difference ${Math.abs(direct.value / clipped.value - 1).toExponential(1)}`);
const cli = cliMeasure('stars-1m/cli', files, 10000);
console.log(`  whole CLI process (bin/stratplot.mjs plan … --out): ${fmt(cli)} (target ≤ 1.5 s), exit ${cli.code}` + (cli.peakMb ? `, peak RSS ${cli.peakMb.toFixed(0)} MB` : ''));

// 2. Mosaics shaped like real vegetation maps: shared wiggly boundaries, holes with islands, a MultiPolygon stratum.
const mosaicCli: number[] = [];
const mosaicStages: number[] = [];
const cliSizes: number[] = [];
for (const size of MOSAIC_SIZES) {
  const m = benchMosaicGenerate(3, size);
  const label = `mosaic-${size >= 1e6 ? `${size / 1e6}m` : `${size / 1e3}k`}`;
  const mFiles = writeSite(label, m);
  const mSite = siteOf(m);
  const mFrame = siteLocalFrame(mSite.parts);
  const plots = size <= 100_000 ? 2000 : 10000;
  console.log(`\n${label}: ${m.vertices} stratum vertices, ${m.strata.features.length} features (57 strata), 20 cliff lines (38 km, 30 m), 200 ponds, 12 private blocks, 100 hazard points; ${plots} plots at 20 m, 10 m square:`);
  const v = measure(`${label}/siteValidate`, () => siteValidate({ ...mSite, exclusions: [] }).length);
  const ov = measure(`${label}/overlaps`, () => strataOverlaps(mSite.parts).length);
  const a = measure(`${label}/areas`, () => designUsableAreas(mSite, mFrame).usable.length);
  const p = measure(`${label}/placement`, () => enginePlace(mSite, plots, 20, 10, 1));
  console.log(`  in process: siteValidate ${fmt(v)} (of which overlap check ${fmt(ov)}), mapped + usable areas ${fmt(a)}, indexes + placement ${fmt(p)} (${p.value} plots)`);
  // The sampler of generator version 2 (earcut triangles of every stratum) beside version 3's cell grid
  // (not at 5 000 000 vertices, where triangulating takes minutes).
  if (size <= 1_000_000) {
    const p2 = measure(`${label}/placement-triangles`, () => enginePlace(mSite, plots, 20, 10, 1, 2), Math.min(RUNS, 3));
    record.ratios[`${label}/placement-cells`] = p2.medianMs / p.medianMs;
    console.log(`  placement from triangles (generator version 2) ${fmt(p2)}: the cell grid is ${(p2.medianMs / p.medianMs).toFixed(1)}x faster`);
  }
  mosaicStages.push(v.medianMs + a.medianMs + p.medianMs);
  if (size === 100_000) {
    const ref = measure(`${label}/overlaps-clipping-every-pair`, () => strataOverlapsByClipping(mSite.parts).length, Math.min(RUNS, 3));
    record.ratios[`${label}/overlaps`] = ref.medianMs / ov.medianMs;
    console.log(`  overlap check: screen then clip ${fmt(ov)}, clipping every pair (polyclip-ts) ${fmt(ref)} — ratio ${(ref.medianMs / ov.medianMs).toFixed(0)}x, ${ov.value} and ${ref.value} found`);
  }
  if (m.vertices > CLI_MAX_VERTICES) {
    console.log(`  whole CLI process: not run (the reader refuses map files over ${CLI_MAX_VERTICES} vertices)`);
    continue;
  }
  if (size === 100_000) {
    // Alternating runs: the whole CLI process against the straightforward plan in this process.
    const args = cliArgs(mFiles, plots);
    cliOnce(args);
    // Its warm-up: the placement on a few plots (each full run takes minutes, so none is spent warming up).
    once(() => naivePlace(m, 50, 20, 99));
    const mine: number[] = [];
    const theirs: number[] = [];
    let theirPlots = 0;
    for (let r = 0; r < RUNS; r++) {
      mine.push(cliOnce(args).ms);
      const t = once(() => straightforwardPlan(mFiles, plots, 1));
      theirs.push(t.ms);
      theirPlots = t.value;
    }
    const t1 = { minMs: Math.min(...mine), medianMs: median(mine), runs: RUNS };
    const t2 = { minMs: Math.min(...theirs), medianMs: median(theirs), runs: RUNS };
    record.stages[`${label}/cli`] = t1;
    record.stages[`${label}/straightforward`] = t2;
    record.ratios[`${label}/whole`] = t2.medianMs / t1.medianMs;
    mosaicCli.push(t1.medianMs);
    cliSizes.push(m.vertices);
    console.log(`  whole CLI process ${fmt(t1)}; straightforward plan (turf kinks, turf intersect of every box-overlapping pair, turf point tests; in process, no usable area, no footprint) ${fmt(t2)}, ${theirPlots} plots`);
    console.log(`  ratio: ${(t2.medianMs / t1.medianMs).toFixed(1)}x (target ≥ 50x), ${RUNS} alternating runs`);
    continue;
  }
  // Alternating runs: the second thread on (the default) and off (STRATPLOT_THREADS=1).
  const args = cliArgs(mFiles, plots);
  const first = cliOnce(args);
  if (first.code !== 0) console.log(`  CLI said (exit ${first.code}): ${first.err.split('\n')[0]}`);
  const two: ReturnType<typeof cliOnce>[] = [];
  const one: ReturnType<typeof cliOnce>[] = [];
  for (let r = 0; r < RUNS; r++) {
    two.push(cliOnce(args));
    one.push(cliOnce(args, '1'));
  }
  const timing = (runs: ReturnType<typeof cliOnce>[]) => ({ minMs: Math.min(...runs.map((x) => x.ms)), medianMs: median(runs.map((x) => x.ms)), runs: RUNS });
  const c = timing(two);
  const c1 = timing(one);
  record.stages[`${label}/cli`] = c;
  record.stages[`${label}/cli-one-thread`] = c1;
  record.ratios[`${label}/second-thread`] = c1.medianMs / c.medianMs;
  const peak = (runs: ReturnType<typeof cliOnce>[]) => (runs[0].peakMb ? `, peak RSS ${Math.max(...runs.map((x) => x.peakMb ?? 0)).toFixed(0)} MB` : '');
  mosaicCli.push(c.medianMs);
  cliSizes.push(m.vertices);
  console.log(`  whole CLI process: ${fmt(c)} (target ≤ 1.5 s at 1M), exit ${first.code}${peak(two)}`);
  console.log(`  one thread (STRATPLOT_THREADS=1): ${fmt(c1)}${peak(one)} — the second thread saves ${((1 - c.medianMs / c1.medianMs) * 100).toFixed(0)} %, ${RUNS} alternating runs`);
}
if (MOSAIC_SIZES.length > 1) {
  record.slopes['mosaic/stages'] = slope(MOSAIC_SIZES, mosaicStages);
  console.log(`\nmosaic growth, slope of log time against log vertices (1 = linear): in-process stages ${record.slopes['mosaic/stages'].toFixed(2)} over ${MOSAIC_SIZES.join(', ')}`);
  if (cliSizes.length > 1) {
    record.slopes['mosaic/cli'] = slope(cliSizes, mosaicCli);
    console.log(`  whole CLI process ${record.slopes['mosaic/cli'].toFixed(2)} over ${cliSizes.join(', ')} (includes Node's start and fixed costs of the exclusions)`);
  }
}

// 3. Against the committed record: stages more than 20 % slower (medians) are reported.
record.loadAfter = loadavg().map((x) => Number(x.toFixed(2)));
console.log(`\nload average after: ${record.loadAfter.join(' ')}`);
const baselinePath = join(root, 'bench/baseline.json');
if (existsSync(baselinePath)) {
  const base = JSON.parse(readFileSync(baselinePath, 'utf8')) as typeof record;
  const slower = Object.entries(record.stages).filter(([k, t]) => base.stages[k] && t.medianMs > 1.2 * base.stages[k].medianMs);
  console.log(slower.length === 0 ? `no stage more than 20 % slower than bench/baseline.json (${base.date})` : `slower than bench/baseline.json (${base.date}) by more than 20 %:`);
  for (const [k, t] of slower) console.log(`  ${k}: ${t.medianMs.toFixed(0)} ms against ${base.stages[k].medianMs.toFixed(0)} ms (${((t.medianMs / base.stages[k].medianMs - 1) * 100).toFixed(0)} % slower)`);
}
const out = process.env.STRATPLOT_BENCH_SAVE === '1' ? baselinePath : join(root, 'bench/last-run.json');
writeFileSync(out, `${JSON.stringify(record, null, 2)}\n`);
console.log(`record written to ${out}`);
console.log(`\n(result sink ${sink.toFixed(3)})`);
rmSync(dir, { recursive: true, force: true });
