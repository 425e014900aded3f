import { describe, expect, it } from 'vitest';
import { designSettingsDefault } from './designSettingsDefault';
import { designRun } from './designRun';
import { designSizeCheck, placementPolygonOver, placementPolygonsCheck, stratumCapacityBound } from './designSizeCheck';
import { localFrameAt } from '../geo/localFrame';
import { placementConstraintsBuild } from './place/placementConstraints';
import type { Site } from '../model/types';

const square: Site = {
  name: 'invented',
  strata: [{ key: 'Heath', label: 'Heath', code: 'HEA', colour: '#cc6677' }],
  parts: [{ id: 'p', stratum: 'Heath', geometry: { type: 'Polygon', coordinates: [[[150.5, -35.1], [150.511, -35.1], [150.511, -35.091], [150.5, -35.091], [150.5, -35.1]]] } }],
  exclusions: [],
  access: [],
  boundary: null,
};

describe('stratumCapacityBound', () => {
  it('is never below a packing that exists (a square lattice) and falls as the spacing grows', () => {
    const c = placementConstraintsBuild(square, localFrameAt(150.505, -35.095), { footprint: { shape: 'point' }, edgeBufferM: 0 });
    // The stratum is about 1 000 m square: a square lattice 100 m apart holds 10 × 10 plots inside it (common practice, no source).
    const at100 = stratumCapacityBound(c, 0, 100);
    expect(at100).toBeGreaterThanOrEqual(100);
    expect(at100).toBeLessThan(400);
    expect(stratumCapacityBound(c, 0, 200)).toBeLessThan(at100);
    expect(stratumCapacityBound(c, 0, 0)).toBe(Number.POSITIVE_INFINITY);
  });
});

describe('designSizeCheck', () => {
  it('refuses plots, reserves and minimums beyond the design limit, naming each', () => {
    expect(() => designSizeCheck(designSettingsDefault({ plots: 100_001 }), 3)).toThrow("number of plots: 100,001 plots asked for; stratplot's limit is 100,000 plots in one design");
    expect(() => designSizeCheck(designSettingsDefault({ plots: 10, reservePerStratum: 50_000 }), 3)).toThrow('reserve plots per stratum: 50,000 reserves in each of 3 strata and 10 primaries make 150,010 plots');
    expect(() => designSizeCheck(designSettingsDefault({ plots: 10, minPerStratum: 40_000 }), 3)).toThrow('minimum plots per stratum: 40,000 in each of 3 strata make 120,000 plots');
    expect(() => designSizeCheck(designSettingsDefault({ plots: 100_000 }), 3)).not.toThrow();
  });
});

describe('placementPolygonsCheck', () => {
  it('refuses a polygon of more vertices than placement triangulates in good time, naming the count and the limit', () => {
    // One shared position repeated keeps the test light; the check counts positions.
    const ring = new Array<number[]>(200_001).fill([150.5, -35.1]);
    const big: Site = { ...square, parts: [{ id: 'p', stratum: 'Heath', geometry: { type: 'Polygon', coordinates: [ring] } }] };
    expect(() => placementPolygonsCheck(big)).toThrow(
      'stratum "Heath", feature 0: 200,001 vertices is more than placement triangulates in good time (its area is measured all the same); simplify the outline; stratplot\'s limit is 200,000 vertices per polygon in a design',
    );
    expect(() => placementPolygonsCheck(square)).not.toThrow();
  });
});

describe('designs on a polygon over the triangulation limit', () => {
  it('are made by generator version 3, which draws from a cell grid, and refused for version 2, which triangulates', () => {
    // An invented wavy ring of 250 001 positions around a 1.1 km disc.
    const n = 250_000;
    const ring: number[][] = [];
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / n;
      const r = 0.006 * (1 + 0.05 * Math.sin(37 * t) + 0.01 * Math.sin(4001 * t));
      ring.push([150.505 + (r * Math.cos(t)) / Math.cos((35.095 * Math.PI) / 180), -35.095 + r * Math.sin(t)]);
    }
    ring.push(ring[0]);
    const big: Site = { ...square, parts: [{ id: 'p', stratum: 'Heath', geometry: { type: 'Polygon', coordinates: [ring] } }] };
    expect(placementPolygonOver(big.parts)).toEqual({ part: 0, polygon: 0, polygons: 1, vertices: 250_001 });
    const made = designRun(big, designSettingsDefault({ plots: 200, spacingM: 20, seed: 5, rngVersion: 3 }));
    expect(made.features.filter((f) => f.properties.role === 'primary')).toHaveLength(200);
    expect(() => designRun(big, designSettingsDefault({ plots: 200, spacingM: 20, seed: 5, rngVersion: 2 }))).toThrow(/250,001 vertices is more than placement triangulates/);
  });
});
