import * as turf from '@turf/turf';
import geodesicPkg from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import type { Site } from '../model/types';
import { trapGridsPlace } from './trapGridsPlace';

const geod = geodesicPkg.Geodesic.WGS84;
const inverse = (a: number[], b: number[]) => {
  const r = geod.Inverse(a[1], a[0], b[1], b[0]);
  return { s12: r.s12 as number, azi1: r.azi1 as number };
};

// An invented site (not a real place): two strata side by side, a pond with a 10 m buffer in the
// first and a cliff line with a 15 m buffer in the second.
const sq = (lon0: number, lat0: number, dLon: number, dLat: number) => [
  [
    [lon0, lat0],
    [lon0 + dLon, lat0],
    [lon0 + dLon, lat0 + dLat],
    [lon0, lat0 + dLat],
    [lon0, lat0],
  ],
];
const pond = sq(153.104, -27.406, 0.001, 0.001);
const cliff = [
  [153.116, -27.41],
  [153.116, -27.402],
];
const site: Site = {
  name: 'Invented test site',
  strata: [
    { key: 'Coastal heath', label: 'Coastal heath', code: 'HEA', colour: '#44aa99' },
    { key: 'Banksia scrub', label: 'Banksia scrub', code: 'BAN', colour: '#ddcc77' },
  ],
  parts: [
    { id: 'p1', stratum: 'Coastal heath', geometry: { type: 'Polygon', coordinates: sq(153.1, -27.41, 0.01, 0.008) } },
    { id: 'p2', stratum: 'Banksia scrub', geometry: { type: 'Polygon', coordinates: sq(153.11, -27.41, 0.01, 0.008) } },
  ],
  exclusions: [
    { id: 'e1', kind: 'water', geometry: { type: 'Polygon', coordinates: pond }, bufferM: 10 },
    { id: 'e2', kind: 'cliff', geometry: { type: 'LineString', coordinates: cliff }, bufferM: 15 },
  ],
  access: [],
  boundary: null,
};

/**
 * Geodesic distance from a point to a polyline, through vertices densified every 1 m; points that a
 * quick spherical estimate (turf) puts more than 100 m away are returned as that estimate.
 */
function distanceToLineM(p: number[], line: number[][]): number {
  const rough = turf.pointToLineDistance(p, turf.lineString(line), { units: 'meters' });
  if (rough > 100) return rough;
  let best = Number.POSITIVE_INFINITY;
  for (let i = 1; i < line.length; i++) {
    const seg = geod.InverseLine(line[i - 1][1], line[i - 1][0], line[i][1], line[i][0]);
    const steps = Math.ceil(seg.s13);
    for (let k = 0; k <= steps; k++) {
      const q = seg.Position((seg.s13 * k) / steps);
      best = Math.min(best, inverse(p, [q.lon2 as number, q.lat2 as number]).s12);
    }
  }
  return best;
}

const options = { gridsPerStratum: 3, rows: 4, cols: 5, spacingM: 20, minSeparationM: 100, seed: 7 };

describe('trapGridsPlace', () => {
  const layout = trapGridsPlace(site, options);
  const stations = layout.features.map((f) => f.properties);

  it('places G grids of r × c stations per stratum with ids like G1-A03', () => {
    expect(layout.grids.length).toBe(6);
    expect(layout.features.length).toBe(6 * 20);
    expect(layout.design.warnings).toEqual([]);
    expect(layout.design.allocation.map((r) => r.plots)).toEqual([60, 60]);
    expect(stations.every((p) => /^G\d-[A-D]0[1-5]$/.test(p.plot_id) && p.role === 'primary')).toBe(true);
    expect(stations.filter((p) => p.plot_id.startsWith('G1-')).map((p) => p.plot_id).slice(0, 6)).toEqual([
      'G1-A01',
      'G1-A02',
      'G1-A03',
      'G1-A04',
      'G1-A05',
      'G1-B01',
    ]);
    expect(new Set(stations.map((p) => p.plot_id)).size).toBe(stations.length);
    expect(layout.design.statements.join(' ')).toContain('landholder');
  });

  it('keeps every station inside its stratum and clear of the buffered exclusions (geodesic check)', () => {
    // Distances from geographiclib-geodesic 2.2 (WGS84 Inverse), not from the placement frame.
    for (const p of stations) {
      const part = site.parts.find((q) => q.stratum === p.stratum)!;
      expect(turf.booleanPointInPolygon([p.lon, p.lat], part.geometry)).toBe(true);
      expect(turf.booleanPointInPolygon([p.lon, p.lat], { type: 'Polygon', coordinates: pond })).toBe(false);
      // 0.1 m allows for the 7-decimal rounding of lon/lat (about 1 cm) and densifying.
      expect(distanceToLineM([p.lon, p.lat], pond[0])).toBeGreaterThanOrEqual(10 - 0.1);
      expect(distanceToLineM([p.lon, p.lat], cliff)).toBeGreaterThanOrEqual(15 - 0.1);
    }
  });

  it('spaces stations on the ground and runs rows along true east', () => {
    const a1 = layout.features.find((f) => f.properties.plot_id === 'G2-A01')!.properties;
    const a2 = layout.features.find((f) => f.properties.plot_id === 'G2-A02')!.properties;
    const b1 = layout.features.find((f) => f.properties.plot_id === 'G2-B01')!.properties;
    const east = inverse([a1.lon, a1.lat], [a2.lon, a2.lat]);
    const south = inverse([a1.lon, a1.lat], [b1.lon, b1.lat]);
    // Never shorter than asked; longer by at most the UTM scale margin (~0.04 % here) plus rounding.
    expect(east.s12).toBeGreaterThanOrEqual(20 - 0.02);
    expect(east.s12).toBeLessThan(20.03);
    expect(east.azi1).toBeCloseTo(90, 1);
    expect(Math.abs(south.azi1)).toBeCloseTo(180, 1);
  });

  it('keeps grids at least the separation apart', () => {
    const byGrid = new Map<string, number[][]>();
    for (const p of stations) {
      const g = p.plot_id.split('-')[0];
      byGrid.set(g, [...(byGrid.get(g) ?? []), [p.lon, p.lat]]);
    }
    const list = [...byGrid.values()];
    for (let i = 0; i < list.length; i++) {
      for (let j = i + 1; j < list.length; j++) {
        let best = Number.POSITIVE_INFINITY;
        for (const a of list[i]) for (const b of list[j]) best = Math.min(best, inverse(a, b).s12);
        expect(best).toBeGreaterThanOrEqual(100 - 0.05);
      }
    }
  });

  it('gives the same layout for the same seed and another for another seed', () => {
    expect(trapGridsPlace(site, options)).toEqual(layout);
    expect(trapGridsPlace(site, { ...options, seed: 8 }).features[0].properties.lon).not.toBe(layout.features[0].properties.lon);
  });

  it('says how many grids fit when the stratum is too small for all of them', () => {
    const crowded = trapGridsPlace(site, { ...options, gridsPerStratum: { 'Coastal heath': 40 }, minSeparationM: 200, maxTriesPerGrid: 500 });
    expect(crowded.grids.length).toBeLessThan(40);
    expect(crowded.design.warnings[0]).toMatch(/^stratum "Coastal heath": only \d+ of 40 trap grids fit/);
  });

  it('refuses sizes it cannot name or place', () => {
    expect(() => trapGridsPlace(site, { ...options, rows: 27 })).toThrow('rows must be a whole number from 1 to 26, got 27');
    expect(() => trapGridsPlace(site, { ...options, spacingM: 0 })).toThrow('station spacing must be > 0 m, got 0');
    expect(() => trapGridsPlace(site, { ...options, gridsPerStratum: { Dune: 2 } })).toThrow('grids given for stratum "Dune", which is not in the site');
  });
});
