import earcut from 'earcut';
import type { Position } from 'geojson';
import type { LocalFrame } from '../../geo/localFrame';
import { type StratumOutlineXY, stratumOutlineXY } from './stratumOutlineXY';

/** A stratum's triangles in frame metres, flat, for picking a random point by area. */
export interface StratumTriangles {
  /** Triangles, six values each: ax, ay, bx, by, cx, cy. */
  triangles: Float64Array;
  /** Running total of triangle areas (m² in the grid), for picking a triangle by area. */
  cumulativeArea: Float64Array;
}

/** One stratum in frame metres as flat arrays only: its outline and its triangles. */
export interface StratumTrianglesXY extends StratumOutlineXY, StratumTriangles {}

/**
 * The earcut triangles of each polygon of a stratum's outline (holes cut out), with their running area.
 * Source of the triangulation: earcut (ear clipping with z-order hashing, Mapbox).
 */
export function stratumTriangulate(outline: StratumOutlineXY): StratumTriangles {
  const { coords, polygonStarts, holeStarts, polygonHoles } = outline;
  const parts: { coords: Float64Array; idx: number[] }[] = [];
  let values = 0;
  for (let p = 0; p + 1 < polygonStarts.length; p++) {
    const c = coords.subarray(polygonStarts[p], polygonStarts[p + 1]);
    const holes = Array.from(holeStarts.subarray(polygonHoles[p], polygonHoles[p + 1]));
    const idx = earcut(c, holes.length ? holes : null, 2);
    parts.push({ coords: c, idx });
    values += idx.length * 2;
  }
  // Corners are written straight into one array, sized once.
  const triangles = new Float64Array(values);
  let off = 0;
  for (const { coords: c, idx } of parts) {
    for (let k = 0; k < idx.length; k++) {
      const v = idx[k] * 2;
      triangles[off++] = c[v];
      triangles[off++] = c[v + 1];
    }
  }
  const nt = triangles.length / 6;
  const cumulativeArea = new Float64Array(nt);
  let total = 0;
  for (let t = 0; t < nt; t++) {
    const o = t * 6;
    total += Math.abs((triangles[o + 2] - triangles[o]) * (triangles[o + 5] - triangles[o + 1]) - (triangles[o + 4] - triangles[o]) * (triangles[o + 3] - triangles[o + 1])) / 2;
    cumulativeArea[t] = total;
  }
  return { triangles, cumulativeArea };
}

/**
 * One stratum's polygons (lon/lat rings, shells then holes) in frame metres: its outline
 * (stratumOutlineXY) and the earcut triangles of each polygon (stratumTriangulate).
 */
export function stratumTrianglesXY(polygons: readonly (readonly Position[])[][], frame: LocalFrame): StratumTrianglesXY {
  const outline = stratumOutlineXY(polygons, frame);
  return { ...outline, ...stratumTriangulate(outline) };
}
