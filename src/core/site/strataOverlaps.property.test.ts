import fc from 'fast-check';
import type { Position } from 'geojson';
import { describe, expect, it } from 'vitest';
import { rngCreate } from '../design/place/rng';
import { strataOverlaps } from './strataOverlaps';
import { strataOverlapCandidates } from './strataOverlapCandidates';
import { partBox, strataOverlapsByClipping } from './strataOverlapsByClipping';
import type { StratumPart } from '../model/types';

// The reference is strataOverlapsByClipping: polyclip-ts 0.16.8 (an outside, general-purpose exact
// clipper) intersecting every pair of features whose boxes overlap, the method strataOverlaps used
// before its screen (docs/references.md §10). The screen must change nothing: the same problems, in the same order.

const CELL_M = 100;
const LAT0 = -34.6;
const LON0 = 118.2;
const ll = (x: number, y: number): Position => [LON0 + x / (111320 * Math.cos((LAT0 * Math.PI) / 180)), LAT0 + y / 111320];

type Change =
  | { kind: 'blob'; x: number; y: number; r: number; sides: number }
  | { kind: 'duplicate'; cell: number; reverse: boolean; rotate: number }
  | { kind: 'nudge'; cell: number; at: number; dx: number; dy: number }
  | { kind: 'island'; cell: number; dx: number; dy: number }
  | { kind: 'corner'; node: number }
  | { kind: 'merge'; cell: number }
  | { kind: 'strip'; y: number; widthM: number };

/** A small invented mosaic: cols × rows cells whose shared edges are wiggly lines used by both neighbours. */
function mosaic(seed: number, cols: number, rows: number, perEdge: number, changes: Change[], flips: number[]): StratumPart[] {
  const rng = rngCreate(seed);
  const node: [number, number][][] = [];
  for (let i = 0; i <= cols; i++) {
    node.push([]);
    for (let j = 0; j <= rows; j++) node[i].push([i * CELL_M + (i % cols ? (rng.float() - 0.5) * 30 : 0), j * CELL_M + (j % rows ? (rng.float() - 0.5) * 30 : 0)]);
  }
  const curve = (a: [number, number], b: [number, number]): Position[] => {
    const [dx, dy] = [b[0] - a[0], b[1] - a[1]];
    const len = Math.hypot(dx, dy);
    const pts: Position[] = [ll(a[0], a[1])];
    for (let k = 1; k < perEdge; k++) {
      const t = k / perEdge;
      const off = (rng.float() - 0.5) * 0.2 * len * 4 * t * (1 - t);
      pts.push(ll(a[0] + dx * t - (dy / len) * off, a[1] + dy * t + (dx / len) * off));
    }
    pts.push(ll(b[0], b[1]));
    return pts;
  };
  const hor = Array.from({ length: cols }, (_, i) => Array.from({ length: rows + 1 }, (_, j) => curve(node[i][j], node[i + 1][j])));
  const ver = Array.from({ length: cols + 1 }, (_, i) => Array.from({ length: rows }, (_, j) => curve(node[i][j], node[i][j + 1])));
  const rings: Position[][][] = [];
  for (let j = 0; j < rows; j++) {
    for (let i = 0; i < cols; i++) {
      const shell = [...hor[i][j], ...ver[i + 1][j].slice(1), ...hor[i][j + 1].slice().reverse().slice(1), ...ver[i][j].slice().reverse().slice(1)];
      rings.push([shell]);
    }
  }
  const centre = (c: number) => {
    const [i, j] = [c % cols, Math.floor(c / cols)];
    return [0, 1, 2, 3].map((k) => node[i + (k & 1)][j + (k >> 1)]).reduce((a, p) => [a[0] + p[0] / 4, a[1] + p[1] / 4], [0, 0]);
  };
  const extra: { stratum: string; geometry: StratumPart['geometry'] }[] = [];
  const merged = new Set<number>();
  for (const ch of changes) {
    const cell = 'cell' in ch ? ch.cell % rings.length : 0;
    if (ch.kind === 'blob') {
      const pts = Array.from({ length: ch.sides }, (_, k) => {
        const a = (k / ch.sides) * 2 * Math.PI;
        return ll(ch.x * cols * CELL_M + Math.cos(a) * ch.r, ch.y * rows * CELL_M + Math.sin(a) * ch.r);
      });
      extra.push({ stratum: 'Blob', geometry: { type: 'Polygon', coordinates: [[...pts, pts[0]]] } });
    } else if (ch.kind === 'duplicate') {
      const shell = rings[cell][0].slice(0, -1);
      const turned = [...shell.slice(ch.rotate % shell.length), ...shell.slice(0, ch.rotate % shell.length)];
      const ring = ch.reverse ? turned.reverse() : turned;
      extra.push({ stratum: 'Copy', geometry: { type: 'Polygon', coordinates: [[...ring, ring[0]]] } });
    } else if (ch.kind === 'nudge') {
      // Moves one vertex of this cell's copy of an edge only (the neighbour keeps the old one).
      const shell = rings[cell][0];
      const k = 1 + (ch.at % (shell.length - 2));
      const [x, y] = shell[k];
      shell[k] = [x + ch.dx * 1e-6, y + ch.dy * 1e-6];
    } else if (ch.kind === 'island') {
      const [cx, cy] = centre(cell);
      const square = [ll(cx - 20, cy - 20), ll(cx - 20, cy + 20), ll(cx + 20, cy + 20), ll(cx + 20, cy - 20)];
      if (rings[cell].length === 1) rings[cell].push([...square, square[0]]);
      const moved = square.reverse().map(([x, y]) => [x + ch.dx * 1e-5, y + ch.dy * 1e-5]);
      extra.push({ stratum: 'Island', geometry: { type: 'Polygon', coordinates: [[...moved, moved[0]]] } });
    } else if (ch.kind === 'corner') {
      // A square outside the mosaic touching it at one corner node of the outline.
      const [x, y] = node[0][ch.node % (rows + 1)];
      const sq = [ll(x, y), ll(x - 30, y), ll(x - 30, y + 30), ll(x, y + 30)];
      const start = ll(x, y);
      sq[0] = start;
      extra.push({ stratum: 'Corner', geometry: { type: 'Polygon', coordinates: [[...sq, sq[0]]] } });
    } else if (ch.kind === 'strip') {
      // A thin strip across the whole mosaic: it crosses shared edges far from where their runs are tested.
      const [x0, x1, y0] = [-20, cols * CELL_M + 20, ch.y * rows * CELL_M];
      const strip = [ll(x0, y0), ll(x1, y0), ll(x1, y0 + ch.widthM), ll(x0, y0 + ch.widthM)];
      extra.push({ stratum: 'Strip', geometry: { type: 'Polygon', coordinates: [[...strip, strip[0]]] } });
    } else if (ch.kind === 'merge') {
      merged.add(cell);
    }
  }
  const parts: StratumPart[] = [];
  const mergedList = [...merged].filter((c) => c + 1 < rings.length && !merged.has(c + 1));
  const skip = new Set(mergedList.map((c) => c + 1));
  rings.forEach((r, c) => {
    if (skip.has(c)) return;
    const geometry: StratumPart['geometry'] = mergedList.includes(c) ? { type: 'MultiPolygon', coordinates: [r, rings[c + 1]] } : { type: 'Polygon', coordinates: r };
    parts.push({ id: `cell-${c}`, stratum: `Unit ${c % 3}`, geometry });
  });
  for (const [k, e] of extra.entries()) parts.push({ id: `extra-${k}`, stratum: e.stratum, geometry: e.geometry });
  for (const f of flips) {
    const part = parts[f % parts.length];
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) poly[0] = poly[0].slice().reverse();
  }
  return parts;
}

const change: fc.Arbitrary<Change> = fc.oneof(
  fc.record({ kind: fc.constant('blob' as const), x: fc.double({ min: -0.1, max: 1.1, noNaN: true }), y: fc.double({ min: -0.1, max: 1.1, noNaN: true }), r: fc.double({ min: 3, max: 90, noNaN: true }), sides: fc.integer({ min: 3, max: 12 }) }),
  fc.record({ kind: fc.constant('duplicate' as const), cell: fc.nat(), reverse: fc.boolean(), rotate: fc.nat() }),
  fc.record({ kind: fc.constant('nudge' as const), cell: fc.nat(), at: fc.nat(), dx: fc.double({ min: -40, max: 40, noNaN: true }), dy: fc.double({ min: -40, max: 40, noNaN: true }) }),
  fc.record({ kind: fc.constant('island' as const), cell: fc.nat(), dx: fc.constantFrom(0, 0, 0.5, -1, 3), dy: fc.constantFrom(0, 0, 1, -0.5, 3) }),
  fc.record({ kind: fc.constant('corner' as const), node: fc.nat() }),
  fc.record({ kind: fc.constant('merge' as const), cell: fc.nat() }),
  fc.record({ kind: fc.constant('strip' as const), y: fc.double({ min: 0.05, max: 0.95, noNaN: true }), widthM: fc.double({ min: 0.5, max: 6, noNaN: true }) }),
);

describe('strataOverlaps', () => {
  it('finds the same overlaps as clipping every pair, on random mosaics with overlaps, touches, copies and islands', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1e6 }),
        fc.integer({ min: 1, max: 4 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer({ min: 1, max: 6 }),
        fc.array(change, { maxLength: 4 }),
        fc.array(fc.nat(), { maxLength: 3 }),
        (seed, cols, rows, perEdge, changes, flips) => {
          const parts = mosaic(seed, cols, rows, perEdge, changes, flips);
          expect(strataOverlaps(parts)).toEqual(strataOverlapsByClipping(parts));
        },
      ),
      { numRuns: 150, seed: 20261203 },
    );
  });

  it('finds nothing on a clean mosaic with a hole filled by its island, without clipping a pair', () => {
    const parts = mosaic(5, 4, 3, 8, [{ kind: 'island', cell: 5, dx: 0, dy: 0 }, { kind: 'merge', cell: 1 }], [2]);
    expect(strataOverlapsByClipping(parts)).toEqual([]);
    expect(strataOverlapCandidates(parts, parts.map(partBox)).size).toBe(0);
    expect(strataOverlaps(parts)).toEqual([]);
  });

  it('treats −0 and 0 as the same coordinate on an edge two strata share at the prime meridian', () => {
    const west: StratumPart = { id: 'w', stratum: 'West', geometry: { type: 'Polygon', coordinates: [[[-0.001, 0.5], [-0, 0.5], [-0, 0.501], [-0.001, 0.501], [-0.001, 0.5]]] } };
    const east: StratumPart = { id: 'e', stratum: 'East', geometry: { type: 'Polygon', coordinates: [[[0, 0.5], [0.001, 0.5], [0.001, 0.501], [0, 0.501], [0, 0.5]]] } };
    const parts = [west, east];
    expect(strataOverlapCandidates(parts, parts.map(partBox)).size).toBe(0);
    expect(strataOverlaps(parts)).toEqual(strataOverlapsByClipping(parts));
  });

  it('reports every cell a thin strip crosses, as the clipper does', () => {
    const parts = mosaic(11, 4, 2, 6, [{ kind: 'strip', y: 0.3, widthM: 2 }], []);
    const found = strataOverlaps(parts);
    expect(found).toEqual(strataOverlapsByClipping(parts));
    expect(found.length).toBe(4);
  });

  it('reports an island shifted over its hole rim, and a copied cell, as the clipper does', () => {
    const parts = mosaic(9, 3, 2, 5, [{ kind: 'island', cell: 4, dx: 3, dy: 3 }, { kind: 'duplicate', cell: 1, reverse: true, rotate: 3 }], []);
    const found = strataOverlaps(parts);
    expect(found).toEqual(strataOverlapsByClipping(parts));
    expect(found.map((p) => p.code)).toEqual(expect.arrayContaining(['strata-overlap']));
    expect(found.length).toBeGreaterThanOrEqual(2);
  });
});
