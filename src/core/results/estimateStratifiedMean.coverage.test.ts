import type { Feature, FeatureCollection } from 'geojson';
import { describe, expect, it } from 'vitest';
import exclusionsText from '../../../demo-maps/ochre-spit-exclusions.geojson?raw';
import strataText from '../../../demo-maps/ochre-spit-strata.geojson?raw';
import { designRun } from '../design/designRun';
import { designSettingsDefault } from '../design/designSettingsDefault';
import type { PlotCollection } from '../model/designTypes';
import { estimateFromResults } from './estimateFromResults';
import type { ResultsTable } from './resultsCheck';
import type { AreaGeometry, ExclusionGeometry, ExclusionKind, Site } from '../model/types';

// The invented Ochre Spit demo site with its buffered exclusions, read straight from demo-maps/.
const strataFc = JSON.parse(strataText) as FeatureCollection;
const exclusionsFc = JSON.parse(exclusionsText) as FeatureCollection;
const site: Site = {
  name: 'Ochre Spit (invented demo)',
  strata: strataFc.features.map((f) => ({ key: String(f.properties?.stratum), label: String(f.properties?.label), code: String(f.properties?.code), colour: String(f.properties?.colour) })),
  parts: strataFc.features.map((f, i) => ({ id: `s${i}`, stratum: String(f.properties?.stratum), geometry: f.geometry as AreaGeometry })),
  exclusions: exclusionsFc.features.map((f: Feature, i) => ({ id: `x${i}`, kind: f.properties?.kind as ExclusionKind, bufferM: Number(f.properties?.buffer_m), geometry: f.geometry as ExclusionGeometry })),
  access: [],
  boundary: null,
};

// An invented population over the site: a smooth surface in the site's UTM metres plus a level for
// each stratum, so strata differ and values vary within them. Its origin is the first point it is
// asked about (the truth grid's first point) and stays fixed from then on.
const LEVEL: Record<string, number> = { 'Coastal heath': 40, 'Dune grassland': 25, Saltmarsh: 70, 'Banksia scrub': 55, 'Eucalypt woodland': 35, 'Wet meadow': 80 };
let origin: [number, number] | null = null;
function z(stratum: string, easting: number, northing: number): number {
  origin ??= [easting, northing];
  const dx = easting - origin[0];
  const dy = northing - origin[1];
  return LEVEL[stratum] + 0.01 * dx + 12 * Math.sin((2 * Math.PI * dy) / 900) + 6 * Math.cos((2 * Math.PI * dx) / 1300);
}

function tableOf(c: PlotCollection): ResultsTable {
  const rows = c.features
    .filter((f) => f.properties.role === 'primary')
    .map((f, i) => ({ row: i + 2, cells: { plot_id: f.properties.plot_id, v: String(z(f.properties.stratum, f.properties.easting, f.properties.northing)) } }));
  return { fileName: 'invented.csv', columns: ['plot_id', 'v'], idColumn: 'plot_id', delimiter: ',', decimal: '.', rows };
}

describe('stratified CI coverage through the design engine', () => {
  it('covers the true mean of the demo site’s usable area in about 95 % of designs over consecutive seeds', () => {
    // Truth: the mean over the usable ground, from a 12 m systematic grid the design engine lays over
    // every stratum (all points clear of the buffered exclusions), each stratum's grid mean weighted
    // by its usable area — a Riemann sum that is independent of the random placement under test.
    const grid = designRun(site, designSettingsDefault({ method: 'grid', gridSpacingM: 12, minPerStratum: 0, seed: 1 }));
    const usable = new Map(grid.design.allocation.map((r) => [r.stratum, r.usable_m2]));
    const totalUsable = [...usable.values()].reduce((a, b) => a + b, 0);
    const sums = new Map<string, { s: number; n: number }>();
    for (const f of grid.features) {
      if (f.properties.role !== 'primary') continue;
      const e = sums.get(f.properties.stratum) ?? { s: 0, n: 0 };
      e.s += z(f.properties.stratum, f.properties.easting, f.properties.northing);
      e.n += 1;
      sums.set(f.properties.stratum, e);
    }
    const truth = [...sums].reduce((a, [k, e]) => a + ((usable.get(k) as number) / totalUsable) * (e.s / e.n), 0);
    expect(Math.min(...[...sums.values()].map((e) => e.n))).toBeGreaterThan(500);

    // 300 stratified random designs of 36 point plots (seeds 1–300), each estimated as a crew's results would be.
    const reps = 300;
    let covered = 0;
    let sum = 0;
    let sumSq = 0;
    for (let seed = 1; seed <= reps; seed++) {
      const design = designRun(site, designSettingsDefault({ plots: 36, minPerStratum: 3, seed }));
      const r = estimateFromResults(design, tableOf(design), { value: 'v', kind: 'measure', collapse: false });
      const [lo, hi] = r.ci95 as [number, number];
      if (lo <= truth && truth <= hi) covered += 1;
      sum += r.mean as number;
      sumSq += (r.mean as number) ** 2;
    }
    const coverage = covered / reps;
    console.log(`95 % CI coverage over ${reps} engine designs on the demo site: ${(100 * coverage).toFixed(1)} % (true mean ${truth.toFixed(4)})`);
    // Binomial(300, 0.95): SE 1.26 %; 90.5–98.7 % is ±3.5 SE (common practice, no source).
    expect(coverage).toBeGreaterThanOrEqual(0.905);
    expect(coverage).toBeLessThanOrEqual(0.987);
    // Unbiased: the average estimate lies within 4 Monte Carlo SEs of the truth.
    const average = sum / reps;
    const monteCarloSe = Math.sqrt((sumSq / reps - average * average) / reps);
    expect(Math.abs(average - truth)).toBeLessThan(4 * monteCarloSe);
  });
});
