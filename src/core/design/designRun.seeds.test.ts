import { booleanPointInPolygon, polygon as turfPolygon } from '@turf/turf';
import geodesic from 'geographiclib-geodesic';
import type { Feature, FeatureCollection, MultiPolygon, Position } from 'geojson';
import { jStat } from 'jstat';
import { describe, expect, it } from 'vitest';
import { designRun } from './designRun';
import { designSettingsDefault } from './designSettingsDefault';
import type { RngVersion } from '../model/designTypes';
import type { Site } from '../model/types';
import strataText from '../../../demo-maps/ochre-spit-strata.geojson?raw';

// The invented demo's Dune grassland: one stratum of two patches (a MultiPolygon), here on its own
// and without exclusions, so a simple random point plot falls in a patch with probability equal to
// the patch's share of the stratum's area.
const strataFile = JSON.parse(strataText) as FeatureCollection;
const dune = strataFile.features.find((f) => f.properties?.stratum === 'Dune grassland') as Feature<MultiPolygon>;
const site: Site = {
  name: 'Dune grassland of the Ochre Spit demo (invented)',
  strata: [{ key: 'Dune grassland', label: 'Dune grassland', code: 'DUN', colour: '#cc6677' }],
  parts: [{ id: 'dune', stratum: 'Dune grassland', geometry: dune.geometry }],
  exclusions: [],
  access: [],
  boundary: null,
};

/** Geodesic area of a one-ring polygon, m² (geographiclib-geodesic 2.2, Karney 2013). */
function areaM2(ring: Position[]): number {
  const p = geodesic.Geodesic.WGS84.Polygon(false);
  for (const [lon, lat] of ring.slice(0, -1)) p.AddPoint(lat, lon);
  return Math.abs(p.Compute(false, true).area ?? Number.NaN);
}

/** Plots in the first patch for each of `seeds` consecutive seeds, 10 primaries each. */
function patchCounts(seeds: number, version: RngVersion): number[] {
  const first = turfPolygon(dune.geometry.coordinates[0]);
  const counts: number[] = [];
  for (let seed = 1; seed <= seeds; seed++) {
    const r = designRun(site, designSettingsDefault({ plots: 10, minPerStratum: 0, seed, rngVersion: version }));
    counts.push(r.features.filter((f) => booleanPointInPolygon(f.geometry.coordinates, first)).length);
  }
  return counts;
}

describe('designRun over consecutive seeds', () => {
  // Version 2 draws from each stratum's triangles, version 3 from a grid of cells over it.
  it.each([2, 3] as const)('puts primaries in the two Dune grassland patches in proportion to their areas, independently from seed to seed (generator version %i)', (version) => {
    expect(dune.geometry.coordinates.map((p) => p.length)).toEqual([1, 1]);
    const [a, b] = dune.geometry.coordinates.map((p) => areaM2(p[0]));
    const p = a / (a + b);
    // GeographicLib areas 137 049.714 and 59 868.410 m²: the first patch holds 69.60 % of the stratum.
    expect(p).toBeCloseTo(0.69597, 5);
    const seeds = 1000;
    const counts = patchCounts(seeds, version);
    const n = 10;
    const inFirst = counts.reduce((s, x) => s + x, 0);
    const total = seeds * n;
    // Pooled χ² (1 df) of plots per patch against the area shares; upper 0.001 point 10.83 (standard tables).
    const pooled = (inFirst - total * p) ** 2 / (total * p) + (total - inFirst - total * (1 - p)) ** 2 / (total * (1 - p));
    expect(pooled).toBeLessThan(10.83);
    // Seed-to-seed spread: Σ (x_s − n p)² / (n p (1 − p)) is χ² on `seeds` df when seeds are independent
    // binomial draws; both tails at 0.001 (jstat 1.9.6 chisquare.inv, which gives the tabled 148.2 at 99 df).
    expect(jStat.chisquare.inv(0.999, 99)).toBeCloseTo(148.2, 1);
    const spread = counts.reduce((s, x) => s + (x - n * p) ** 2, 0) / (n * p * (1 - p));
    expect(spread).toBeGreaterThan(jStat.chisquare.inv(0.001, seeds));
    expect(spread).toBeLessThan(jStat.chisquare.inv(0.999, seeds));
    // Neighbouring seeds: the count of seed s and of seed s + 1 uncorrelated (|r| < 3.291/√399, p = 0.001).
    const r = jStat.corrcoeff(counts.slice(0, -1), counts.slice(1));
    console.log(
      `Dune grassland, generator version ${version}, ${seeds} consecutive seeds × ${n} plots: ${((100 * inFirst) / total).toFixed(2)} % in the patch of ${(100 * p).toFixed(2)} % of the area; pooled χ² ${pooled.toFixed(2)} (1 df), spread χ² ${spread.toFixed(1)} (${seeds} df), lag-1 r ${r.toFixed(3)}`,
    );
    expect(Math.abs(r)).toBeLessThan(3.291 / Math.sqrt(seeds - 1));
  });

  it('records the generator version, and flags a version-1 design (also when settings carry no version)', () => {
    const r = designRun(site, designSettingsDefault({ plots: 3, minPerStratum: 0, seed: 7, rngVersion: 1 }));
    expect(r.design.settings.rngVersion).toBe(1);
    expect(r.design.warnings.join(' ')).toMatch(/random generator version 1/);
    expect(r.design.statements.join(' ')).toMatch(/Seed 7, random generator version 1/);
    const again = designRun(site, { ...designSettingsDefault({ plots: 3, minPerStratum: 0, seed: 7 }), rngVersion: undefined });
    expect(again.features).toEqual(r.features);
    const current = designRun(site, designSettingsDefault({ plots: 3, minPerStratum: 0, seed: 7 }));
    expect(current.design.settings.rngVersion).toBe(3);
    expect(current.design.warnings).toEqual([]);
    expect(current.design.statements.join(' ')).toMatch(/Seed 7, random generator version 3 \(seed expanded by splitmix64.*grid of cells/);
    const two = designRun(site, designSettingsDefault({ plots: 3, minPerStratum: 0, seed: 7, rngVersion: 2 }));
    expect(two.design.warnings).toEqual([]);
    expect(two.design.statements.join(' ')).toMatch(/Seed 7, random generator version 2 \(seed expanded by splitmix64[^;]*\)/);
  });
});
