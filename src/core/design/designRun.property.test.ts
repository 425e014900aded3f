import fc from 'fast-check';
import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { designRun } from './designRun';
import { designSettingsDefault } from './designSettingsDefault';
import type { Footprint, PlotCollection } from '../model/designTypes';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import type { Exclusion, Site } from '../model/types';

// Every geometric check here is made on the WGS84 ellipsoid with GeographicLib (geographiclib-geodesic
// 2.2.0, Karney 2013), independently of the UTM frame the engine works in.
const G = geodesic.Geodesic.WGS84;
const dist = (lon1: number, lat1: number, lon2: number, lat2: number) => G.Inverse(lat1, lon1, lat2, lon2).s12 as number;
const move = (lon: number, lat: number, azi: number, s: number): [number, number] => {
  const r = G.Direct(lat, lon, azi, s);
  return [r.lon2 as number, r.lat2 as number];
};
// 7-decimal coordinates move a plot by up to ~0.6 cm; densifying at 0.25 m adds under 1 cm.
const TOL_M = 0.03;

function ringContains(ring: number[][], x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Points around a footprint's outline, from its centre, by geodesic offsets. */
function outline(lon: number, lat: number, fp: Footprint): [number, number][] {
  if (fp.shape === 'point') return [[lon, lat]];
  if (fp.shape === 'circle') return Array.from({ length: 72 }, (_, i) => move(lon, lat, i * 5, fp.radiusM));
  const w = fp.shape === 'square' ? fp.sideM : fp.widthM;
  const h = fp.shape === 'square' ? fp.sideM : fp.heightM;
  const a = fp.angleDeg;
  const corners = [
    [-w / 2, -h / 2],
    [w / 2, -h / 2],
    [w / 2, h / 2],
    [-w / 2, h / 2],
  ].map(([x, y]) => move(lon, lat, a + (Math.atan2(x, y) * 180) / Math.PI, Math.hypot(x, y)));
  const out: [number, number][] = [];
  for (let i = 0; i < 4; i++) {
    const [x0, y0] = corners[i];
    const [x1, y1] = corners[(i + 1) % 4];
    const n = Math.ceil(Math.max(w, h) / 0.25);
    for (let k = 0; k < n; k++) out.push([x0 + ((x1 - x0) * k) / n, y0 + ((y1 - y0) * k) / n]);
  }
  return out;
}

function densify(line: number[][], stepDeg: number): number[][] {
  const out: number[][] = [];
  for (let i = 1; i < line.length; i++) {
    const [x0, y0] = line[i - 1];
    const [x1, y1] = line[i];
    const n = Math.max(1, Math.ceil(Math.hypot(x1 - x0, y1 - y0) / stepDeg));
    for (let k = 0; k < n; k++) out.push([x0 + ((x1 - x0) * k) / n, y0 + ((y1 - y0) * k) / n]);
  }
  out.push(line[line.length - 1]);
  return out;
}

function exclusionLines(e: Exclusion): number[][][] {
  const g = e.geometry;
  if (g.type === 'Point') return [[g.coordinates]];
  if (g.type === 'LineString') return [g.coordinates];
  if (g.type === 'Polygon') return g.coordinates;
  throw new Error('fixture uses Point, LineString and Polygon only');
}

function checkDesign(site: Site, r: PlotCollection, fp: Footprint, spacingM: number): void {
  const plots = r.features.map((f) => f.properties);
  for (const p of plots) {
    const pts = outline(p.lon, p.lat, fp);
    const reach = fp.shape === 'point' ? 0 : fp.shape === 'circle' ? fp.radiusM : fp.shape === 'square' ? fp.sideM * Math.SQRT1_2 : Math.hypot(fp.widthM, fp.heightM) / 2;
    const polys = site.parts.filter((q) => q.stratum === p.stratum).map((q) => (q.geometry.type === 'Polygon' ? q.geometry.coordinates[0] : []));
    for (const [x, y] of pts) expect(polys.some((ring) => ringContains(ring, x, y)), `${p.plot_id} footprint inside ${p.stratum}`).toBe(true);
    for (const e of site.exclusions) {
      if (e.geometry.type === 'Polygon') for (const [x, y] of pts) expect(ringContains(e.geometry.coordinates[0], x, y)).toBe(false);
      // Local metres per degree from two geodesics make a flat-earth distance good to ~1e-6 over tens
      // of metres; it finds the closest outline/exclusion pair, which is then measured as a geodesic.
      const ky = dist(p.lon, p.lat, p.lon, p.lat + 1e-3) / 1e-3;
      const kx = dist(p.lon, p.lat, p.lon + 1e-3, p.lat) / 1e-3;
      let best = Number.POSITIVE_INFINITY;
      let pair: number[] = [];
      for (const line of exclusionLines(e)) {
        for (const [ex, ey] of densify(line, 0.25 / 111320)) {
          if (Math.hypot((ex - p.lon) * kx, (ey - p.lat) * ky) > e.bufferM + reach + 1) continue;
          for (const [x, y] of pts) {
            const d = Math.hypot((x - ex) * kx, (y - ey) * ky);
            if (d < best) {
              best = d;
              pair = [x, y, ex, ey];
            }
          }
        }
      }
      if (pair.length) {
        const d = dist(pair[0], pair[1], pair[2], pair[3]);
        expect(d, `${p.plot_id} vs exclusion ${e.id} (buffer ${e.bufferM} m)`).toBeGreaterThanOrEqual(e.bufferM - TOL_M);
      }
    }
  }
  for (let i = 0; i < plots.length; i++) {
    for (let j = i + 1; j < plots.length; j++) {
      expect(dist(plots[i].lon, plots[i].lat, plots[j].lon, plots[j].lat)).toBeGreaterThanOrEqual(spacingM - TOL_M);
    }
  }
}

const footprints: Footprint[] = [
  { shape: 'point' },
  { shape: 'square', sideM: 10, angleDeg: 0 },
  { shape: 'rect', widthM: 20, heightM: 5, angleDeg: 30 },
  { shape: 'circle', radiusM: 6 },
];

describe('designRun on invented random sites (seeded property test, fast-check seed 7001)', () => {
  it('keeps every footprint inside its stratum, clear of every buffered exclusion, and every pair at the spacing (geodesic checks)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1e6 }),
        fc.integer({ min: 0, max: 3 }),
        fc.constantFrom('random', 'balanced', 'grid'),
        fc.integer({ min: 0, max: 40 }),
        fc.integer({ min: 0, max: 2 }),
        (siteSeed, fpIndex, method, spacingM, reserve) => {
          const site = siteInventedRandom(siteSeed, 3, 5);
          const footprint = footprints[fpIndex];
          const settings = designSettingsDefault({ plots: 24, spacingM, footprint, reservePerStratum: reserve, method, gridSpacingM: 60, seed: siteSeed, edgeBufferM: 2 });
          const r = designRun(site, settings);
          checkDesign(site, r, footprint, spacingM);
          if (method !== 'grid') {
            for (const row of r.design.allocation) {
              const placed = r.features.filter((f) => f.properties.stratum === row.stratum && f.properties.role === 'primary').length;
              expect(placed).toBe(row.plots);
            }
            const total = r.design.allocation.reduce((a, row) => a + row.plots, 0);
            if (total < 24) {
              expect(r.design.allocation.some((row) => row.capacity !== null)).toBe(true);
              expect(r.design.warnings.join(' ')).toMatch(/holds only/);
            } else expect(total).toBe(24);
          }
        },
      ),
      { numRuns: 20, seed: 7001 },
    );
  });

  it('keeps transect quadrats inside their strata, clear of buffered exclusions and at the spacing (seed 7002)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1e6 }), fc.integer({ min: 0, max: 3 }), (siteSeed, fpIndex) => {
        const site = siteInventedRandom(siteSeed, 3, 5);
        const ring = (site.parts[0].geometry.coordinates as number[][][])[0];
        const [lon0, lat0] = ring[0];
        // A baseline along the south edge of the site, running east (quadrats on its left, to the north).
        const baseline = [
          [lon0 - 0.001, lat0 - 0.0001],
          [lon0 + 0.03, lat0 - 0.0001],
        ];
        const footprint = footprints[fpIndex];
        const settings = designSettingsDefault({ method: 'transect', baseline, transectIntervalM: 90, quadratIntervalM: 40, spacingM: 15, footprint, reservePerStratum: 1, seed: siteSeed, minPerStratum: 0 });
        const r = designRun(site, settings);
        expect(r.features.length).toBeGreaterThan(0);
        for (const f of r.features) expect(f.properties.transect).toBeGreaterThanOrEqual(1);
        checkDesign(site, r, footprint, 15);
      }),
      { numRuns: 5, seed: 7002 },
    );
  });

  it('gives byte-identical output for the same seed and different plots for another seed', () => {
    const site = siteInventedRandom(42, 3, 4);
    const s = designSettingsDefault({ plots: 20, spacingM: 20, footprint: { shape: 'square', sideM: 10, angleDeg: 0 }, reservePerStratum: 2, seed: 9 });
    const a = JSON.stringify(designRun(site, s));
    expect(JSON.stringify(designRun(site, s))).toBe(a);
    expect(JSON.stringify(designRun(site, { ...s, seed: 10 }))).not.toBe(a);
  });

  it('reports a shortfall with the capacity, and redistributes it to strata with room when asked', () => {
    const site = siteInventedRandom(5, 3, 0);
    // 60 m spacing in a 250 m star stratum holds far fewer than 40 plots.
    const s = designSettingsDefault({ plots: 120, allocation: 'equal', spacingM: 60, seed: 3 });
    const short = designRun(site, s);
    const full = short.design.allocation.filter((r) => r.capacity !== null);
    expect(full.length).toBeGreaterThan(0);
    for (const row of full) expect(row.plots).toBe(row.capacity);
    expect(short.design.warnings.join(' ')).toMatch(/holds only \d+ of its 40 plots/);
    const moved = designRun(site, { ...s, redistributeShortfall: true });
    const total = (c: PlotCollection) => c.design.allocation.reduce((a, r) => a + r.plots, 0);
    expect(total(moved)).toBeGreaterThanOrEqual(total(short));
    expect(moved.design.warnings.join(' ')).toMatch(/redistributed|every stratum is full/);
  });
});
