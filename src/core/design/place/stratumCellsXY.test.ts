import { booleanPointInPolygon, multiPolygon } from '@turf/turf';
import type { Position } from 'geojson';
import { describe, expect, it } from 'vitest';
import { localFrameAt } from '../../geo/localFrame';
import { rngCreate } from './rng';
import { CELL_BOUNDARY, CELL_IN, CELL_OUT, stratumCellsContain, stratumCellsXY } from './stratumCellsXY';
import { stratumOutlineXY } from './stratumOutlineXY';

// An invented stratum of two parts in frame metres: a wavy-topped block with a hole, and a block east
// of it whose west side is the first part's east side, digitised the other way round (a shared edge).
const frame = localFrameAt(117.9, -35.02);
const [e0, n0] = frame.toXY(117.9, -35.02);
const wavy: [number, number][] = [[0, 0], [600, 0]];
for (let i = 0; i <= 24; i++) wavy.push([600 - 25 * i, 400 + 60 * Math.sin(i * 1.3)]);
const shared: [number, number][] = [[600, 0], [600, 100], [620, 180], [590, 260], [600, 400 + 60 * Math.sin(0)]];
const westShell: [number, number][] = [[0, 0], ...shared, ...wavy.slice(3)];
const hole: [number, number][] = [[150, 120], [150, 260], [330, 240], [300, 110]];
const eastShell: [number, number][] = [...[...shared].reverse(), [1010, 30], [950, 420]];
const close = (ring: [number, number][]): Position[] => [...ring, ring[0]].map(([x, y]) => frame.toLonLat(e0 + x, n0 + y));
const polygons: Position[][][] = [[close(westShell), close(hole)], [close(eastShell)]];
const stratum = multiPolygon(polygons);

describe('stratumCellsXY', () => {
  const outline = stratumOutlineXY(polygons, frame);
  const cells = stratumCellsXY(outline.bbox, outline.edges);

  it('leaves out the edge the two parts share, in either direction', () => {
    const ringSegments = westShell.length + hole.length + eastShell.length;
    expect(outline.edges.length / 4).toBe(ringSegments - 2 * (shared.length - 1));
  });

  it('says inside or outside as turf booleanPointInPolygon (7.4, docs/references.md §8) does, for 20 000 random points over the box and near the edges', () => {
    const rng = rngCreate(11);
    const [x0, y0, x1, y1] = outline.bbox;
    let disagree = 0;
    let inside = 0;
    const check = (x: number, y: number) => {
      const ours = stratumCellsContain(cells, outline.edges, x, y);
      const turf = booleanPointInPolygon(frame.toLonLat(x, y), stratum);
      if (ours !== turf) disagree++;
      if (ours) inside++;
    };
    for (let i = 0; i < 10_000; i++) check(x0 - 20 + rng.float() * (x1 - x0 + 40), y0 - 20 + rng.float() * (y1 - y0 + 40));
    // Points within a metre of a boundary vertex, where the boundary cells do the work.
    const seg = outline.edges;
    for (let i = 0; i < 10_000; i++) {
      const k = 4 * Math.floor(rng.float() * (seg.length / 4));
      check(seg[k] + (rng.float() - 0.5) * 2, seg[k + 1] + (rng.float() - 0.5) * 2);
    }
    expect(disagree).toBe(0);
    expect(inside).toBeGreaterThan(5000);
  });

  it('marks cells wholly inside, wholly outside or crossed, so inside cells bound the area from below and ground cells from above', () => {
    expect(cells.nx * cells.ny).toBeGreaterThanOrEqual(256);
    let inCells = 0;
    let groundCells = 0;
    for (let cell = 0; cell < cells.state.length; cell++) {
      const col = cell % cells.nx;
      const row = (cell - col) / cells.nx;
      const corners = [0, 1].flatMap((dx) => [0, 1].map((dy) => frame.toLonLat(cells.x0 + (col + dx) * cells.side, cells.y0 + (row + dy) * cells.side)));
      const turfInside = corners.map((p) => booleanPointInPolygon(p, stratum));
      if (cells.state[cell] === CELL_IN) expect(turfInside).toEqual([true, true, true, true]);
      if (cells.state[cell] === CELL_OUT) expect(turfInside).toEqual([false, false, false, false]);
      if (cells.state[cell] === CELL_IN) inCells++;
      if (cells.state[cell] !== CELL_OUT) groundCells++;
    }
    expect(cells.ground.length).toBe(groundCells);
    expect(cells.ground.every((c) => cells.state[c] === CELL_IN || cells.state[c] === CELL_BOUNDARY)).toBe(true);
    const a = cells.side * cells.side;
    expect(inCells * a).toBeLessThan(outline.areaGrid);
    expect(groundCells * a).toBeGreaterThan(outline.areaGrid);
  });

  it('has no cells for a stratum with no area', () => {
    const flat = stratumCellsXY([0, 0, 0, 10], new Float64Array([0, 0, 0, 10, 0, 10, 0, 0]));
    expect(flat.ground.length).toBe(0);
    expect(stratumCellsContain(flat, new Float64Array(0), 0, 5)).toBe(false);
  });
});
