import type { Position } from 'geojson';
import type { StratumSampling } from '../core/design/place/placementStrata';
import { stratumCellsXY } from '../core/design/place/stratumCellsXY';
import { type StratumOutlineXY, stratumOutlineXY } from '../core/design/place/stratumOutlineXY';
import { type StratumTrianglesXY, stratumTrianglesXY } from '../core/design/place/stratumTrianglesXY';
import type { LocalFrame } from '../core/geo/localFrame';

/**
 * One stratum job of `stratplot plan`'s threads: the stratum's outline, with what the design samples
 * it by: its triangles, or its cell grid (`cellGrid`, stratumCellsXY of the outline's box and edges).
 */
export function stratumMade(polygons: readonly (readonly Position[])[][], frame: LocalFrame, sampling: StratumSampling): StratumOutlineXY {
  if (sampling === 'triangles') return stratumTrianglesXY(polygons, frame);
  const outline = stratumOutlineXY(polygons, frame);
  return { ...outline, cellGrid: stratumCellsXY(outline.bbox, outline.edges) };
}

/** The buffers of a made stratum, handed to the other thread without copying. */
export function stratumMadeBuffers(shape: StratumOutlineXY): ArrayBuffer[] {
  const arrays: ArrayBufferView[] = [shape.edges, shape.coords, shape.polygonStarts, shape.holeStarts, shape.polygonHoles];
  if ('triangles' in shape) arrays.push((shape as StratumTrianglesXY).triangles, (shape as StratumTrianglesXY).cumulativeArea);
  const grid = shape.cellGrid;
  if (grid) arrays.push(grid.state, grid.ground, grid.rowStarts, grid.rowSegments);
  // Views of one buffer (an outline's subarrays) hand it over once.
  return [...new Set(arrays.map((a) => a.buffer as ArrayBuffer))];
}
