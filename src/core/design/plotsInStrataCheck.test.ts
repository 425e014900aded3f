import { describe, expect, it } from 'vitest';
import { plotsInStrataCheck } from './plotsInStrataCheck';
import type { Site } from '../model/types';

const ring = (x: number, y: number, dx: number, dy: number) => [[x, y], [x + dx, y], [x + dx, y + dy], [x, y + dy], [x, y]];
const site = (rings: number[][][][]): Site => ({
  name: 'invented',
  strata: [{ key: 'Heath', label: 'Heath', code: 'HEA', colour: '#cc6677' }],
  parts: rings.map((r, i) => ({ id: `p${i}`, stratum: 'Heath', geometry: { type: 'Polygon', coordinates: r } })),
  exclusions: [],
  access: [],
  boundary: null,
});

describe('plotsInStrataCheck', () => {
  it('accepts plots inside their stratum, across the antimeridian too', () => {
    const s = site([[ring(179.95, -16.5, 0.05, 0.02)], [ring(-180, -16.5, 0.05, 0.02)]]);
    expect(() => plotsInStrataCheck(s, [{ id: 'A', stratum: 'Heath', lon: 179.99, lat: -16.49 }, { id: 'B', stratum: 'Heath', lon: -179.99, lat: -16.49 }])).not.toThrow();
  });

  it('accepts a plot a few millimetres outside an edge (the edge models differ that much), refuses one in a hole or far away', () => {
    const s = site([[ring(150.5, -35.1, 0.01, 0.01), ring(150.503, -35.097, 0.002, 0.002).reverse()]]);
    // 1e-8° of longitude at 35°S is about 0.9 mm.
    expect(() => plotsInStrataCheck(s, [{ id: 'A', stratum: 'Heath', lon: 150.51 + 1e-8, lat: -35.095 }])).not.toThrow();
    // The hole point is 0.001° of latitude (about 91 m, 111.0 km per degree) from the nearest hole edge.
    expect(() => plotsInStrataCheck(s, [{ id: 'H', stratum: 'Heath', lon: 150.504, lat: -35.096 }])).toThrow(/^plot H was placed at 150\.504000, -35\.096000, 91\.\d m outside its stratum "Heath" on the ellipsoid/);
    expect(() => plotsInStrataCheck(s, [{ id: 'F', stratum: 'Heath', lon: 176.5, lat: -35.1 }])).toThrow(/^plot F .* outside its stratum "Heath"/);
  });
});
