/** Where a cell of the grid lies against the stratum. */
export const CELL_OUT = 0;
export const CELL_IN = 1;
export const CELL_BOUNDARY = 2;

/** Cells per boundary segment the grid aims at, and its bounds (common practice, no source). */
const CELLS_PER_SEGMENT = 4;
const MIN_CELLS = 256;
const MAX_CELLS = 1 << 22;

/**
 * A square grid over one stratum, for drawing and testing points without triangulating it: every
 * cell is wholly inside, wholly outside, or crossed by the boundary, and each row of cells lists
 * the boundary segments that reach into it.
 */
export interface StratumCellsXY {
  /** South-west corner of the grid and the side of a cell, grid metres. */
  x0: number;
  y0: number;
  side: number;
  /** Columns and rows. */
  nx: number;
  ny: number;
  /** CELL_OUT, CELL_IN or CELL_BOUNDARY for cell row · nx + column. */
  state: Uint8Array;
  /** The cells that hold ground of the stratum (inside or crossed by its boundary), in index order. */
  ground: Int32Array;
  /** Offsets into `rowSegments` of each row's segments, and one past the last (length ny + 1). */
  rowStarts: Int32Array;
  /** Segment indexes (into the outline's edges, 4 values each) reaching into each row. */
  rowSegments: Int32Array;
}

/** The first and last row (clamped to the grid) that a y-range reaches into, with a margin against rounding. */
function rowRange(g: { y0: number; side: number; ny: number }, ya: number, yb: number, margin: number): [number, number] {
  const lo = Math.max(0, Math.floor((Math.min(ya, yb) - margin - g.y0) / g.side));
  const hi = Math.min(g.ny - 1, Math.floor((Math.max(ya, yb) + margin - g.y0) / g.side));
  return [lo, hi];
}

/**
 * The cell grid of a stratum's outline (its box and boundary segments x1, y1, x2, y2 in grid
 * metres): square cells, about four per boundary segment (256 at least, 4 194 304 at most); a cell is marked as
 * crossed by the boundary where any segment passes through it (its stretch within each row,
 * widened by a margin far above rounding, so no crossed cell is missed; a cell marked in excess is
 * only tested more), and the others take the side of their centre, by the crossing number of the
 * row's segments along the row's middle line. Every point of the stratum lies in a cell of
 * `ground`.
 * Source: crossing-number point-in-polygon test (Haines, "Point in polygon strategies", Graphics
 * Gems IV, 1994) applied by rows, as in scan-line polygon filling.
 */
export function stratumCellsXY(bbox: readonly [number, number, number, number], edges: Float64Array): StratumCellsXY {
  const segments = edges.length / 4;
  const width = bbox[2] - bbox[0];
  const height = bbox[3] - bbox[1];
  if (!(width > 0 && height > 0) || segments < 3) {
    return { x0: 0, y0: 0, side: 1, nx: 0, ny: 0, state: new Uint8Array(0), ground: new Int32Array(0), rowStarts: new Int32Array(1), rowSegments: new Int32Array(0) };
  }
  const target = Math.min(MAX_CELLS, Math.max(MIN_CELLS, CELLS_PER_SEGMENT * segments));
  let side = Math.sqrt((width * height) / target);
  // A sliver's cells are no wider than the sliver: the grid then keeps at least one row and column.
  side = Math.min(side, width, height) || Math.max(width, height);
  const nx = Math.max(1, Math.ceil(width / side));
  const ny = Math.max(1, Math.ceil(height / side));
  const grid = { x0: bbox[0], y0: bbox[1], side, ny };
  // Far above the rounding of coordinates of a few hundred kilometres, far below a cell.
  const margin = Math.max(1e-6, side * 1e-9) + Math.max(Math.abs(bbox[0]), Math.abs(bbox[1]), Math.abs(bbox[2]), Math.abs(bbox[3])) * 1e-12;
  const state = new Uint8Array(nx * ny);
  // Rows each segment reaches into: counted, then filled.
  const rowStarts = new Int32Array(ny + 1);
  for (let i = 0; i < segments; i++) {
    const o = 4 * i;
    const [lo, hi] = rowRange(grid, edges[o + 1], edges[o + 3], margin);
    for (let r = lo; r <= hi; r++) rowStarts[r + 1]++;
  }
  for (let r = 0; r < ny; r++) rowStarts[r + 1] += rowStarts[r];
  const rowSegments = new Int32Array(rowStarts[ny]);
  const fill = rowStarts.slice(0, ny);
  for (let i = 0; i < segments; i++) {
    const o = 4 * i;
    const ax = edges[o];
    const ay = edges[o + 1];
    const bx = edges[o + 2];
    const by = edges[o + 3];
    const [lo, hi] = rowRange(grid, ay, by, margin);
    for (let r = lo; r <= hi; r++) {
      rowSegments[fill[r]++] = i;
      // The segment's stretch within the row's band (the whole segment where it is level).
      let xa = ax;
      let xb = bx;
      if (ay !== by) {
        const yLo = grid.y0 + r * side - margin;
        const yHi = grid.y0 + (r + 1) * side + margin;
        const ta = Math.min(1, Math.max(0, (yLo - ay) / (by - ay)));
        const tb = Math.min(1, Math.max(0, (yHi - ay) / (by - ay)));
        xa = ax + ta * (bx - ax);
        xb = ax + tb * (bx - ax);
      }
      const c0 = Math.max(0, Math.floor((Math.min(xa, xb) - margin - grid.x0) / side));
      const c1 = Math.min(nx - 1, Math.floor((Math.max(xa, xb) + margin - grid.x0) / side));
      for (let c = c0; c <= c1; c++) state[r * nx + c] = CELL_BOUNDARY;
    }
  }
  // Cells no segment passes through: inside when an odd number of crossings of the row's middle line lie east of the centre.
  const crossings: number[] = [];
  let groundCount = 0;
  for (let r = 0; r < ny; r++) {
    const y = grid.y0 + (r + 0.5) * side;
    crossings.length = 0;
    for (let k = rowStarts[r]; k < rowStarts[r + 1]; k++) {
      const o = 4 * rowSegments[k];
      const ay = edges[o + 1];
      const by = edges[o + 3];
      if (ay > y !== by > y) crossings.push(edges[o] + ((y - ay) * (edges[o + 2] - edges[o])) / (by - ay));
    }
    crossings.sort((p, q) => p - q);
    let west = 0;
    for (let c = 0; c < nx; c++) {
      const cell = r * nx + c;
      if (state[cell] === CELL_BOUNDARY) {
        groundCount++;
        continue;
      }
      const x = grid.x0 + (c + 0.5) * side;
      while (west < crossings.length && crossings[west] < x) west++;
      if ((crossings.length - west) % 2 === 1) {
        state[cell] = CELL_IN;
        groundCount++;
      }
    }
  }
  const ground = new Int32Array(groundCount);
  for (let cell = 0, k = 0; cell < state.length; cell++) if (state[cell] !== CELL_OUT) ground[k++] = cell;
  return { x0: grid.x0, y0: grid.y0, side, nx, ny, state, ground, rowStarts, rowSegments };
}

/**
 * Whether (x, y) lies inside the stratum: the state of its cell, or for a cell the boundary
 * crosses, the crossing number of the row's segments east of the point (half-open in y).
 */
export function stratumCellsContain(g: StratumCellsXY, edges: Float64Array, x: number, y: number): boolean {
  const r = Math.floor((y - g.y0) / g.side);
  const c = Math.floor((x - g.x0) / g.side);
  if (!(r >= 0 && r < g.ny && c >= 0 && c < g.nx)) return false;
  const s = g.state[r * g.nx + c];
  if (s !== CELL_BOUNDARY) return s === CELL_IN;
  let inside = false;
  for (let k = g.rowStarts[r]; k < g.rowStarts[r + 1]; k++) {
    const o = 4 * g.rowSegments[k];
    const ay = edges[o + 1];
    const by = edges[o + 3];
    if (ay > y !== by > y && x < edges[o] + ((y - ay) * (edges[o + 2] - edges[o])) / (by - ay)) inside = !inside;
  }
  return inside;
}
