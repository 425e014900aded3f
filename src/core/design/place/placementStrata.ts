import Flatbush from 'flatbush';
import type { LocalFrame } from '../../geo/localFrame';
import type { Site } from '../../model/types';
import { type StratumCellsXY, stratumCellsContain, stratumCellsXY } from './stratumCellsXY';
import { type StratumOutlineXY, stratumOutlineXY } from './stratumOutlineXY';
import { type StratumTriangles, type StratumTrianglesXY, stratumTriangulate } from './stratumTrianglesXY';

/**
 * How placement draws and tests points of a stratum: from its earcut triangles (random generator
 * versions 1 and 2) or from its cell grid (version 3 on), which needs no triangulation.
 */
export type StratumSampling = 'triangles' | 'cells';

/** One stratum in frame metres, ready for sampling and containment tests. */
export interface StratumShapeXY extends StratumOutlineXY, StratumTriangles {
  key: string;
  /** Index of runs of {@link EDGE_CHUNK} consecutive segments of `edges` (item k: segments k·EDGE_CHUNK …). */
  edgeIndex: Flatbush | null;
  /** The stratum's cell grid (stratumCellsXY), made on first use. */
  cells(): StratumCellsXY;
  /**
   * Whether a point lies in the stratum (not in a hole): by a triangle index built on first use,
   * or with cell sampling by the cell grid.
   */
  contains(x: number, y: number): boolean;
}

/** Segments per box of a stratum's edge index. */
export const EDGE_CHUNK = 8;

/** The polygons (rings of lon/lat) of every part of one stratum, in site order. */
export function stratumPolygons(site: Site, key: string) {
  return site.parts.filter((p) => p.stratum === key).flatMap((p) => (p.geometry.type === 'Polygon' ? [p.geometry.coordinates] : p.geometry.coordinates));
}

/**
 * Every stratum of the site in frame metres, in site order: its outline (stratumOutlineXY, or
 * `made` where another thread has made it, triangles or cell grid and all, for this site and frame), boundary
 * segments in a flatbush index, and a point-in-stratum test. Triangles and the cell grid are made
 * when first asked for, so a design that samples by cells never triangulates.
 */
export function stratumShapesXY(site: Site, frame: LocalFrame, made?: readonly (StratumOutlineXY | StratumTrianglesXY)[], sampling: StratumSampling = 'triangles'): StratumShapeXY[] {
  return site.strata.map((info, i) => {
    const outline = made?.[i] ?? stratumOutlineXY(stratumPolygons(site, info.key), frame);
    const { bbox, edges: seg } = outline;
    let triangulated: StratumTriangles | null = 'triangles' in outline ? (outline as StratumTrianglesXY) : null;
    const triangulation = () => (triangulated ??= stratumTriangulate(outline));
    let grid: StratumCellsXY | null = outline.cellGrid ?? null;
    const cells = () => (grid ??= stratumCellsXY(bbox, seg));
    const ns = seg.length / 4;
    // Runs of EDGE_CHUNK consecutive segments share one index box: far fewer boxes to sort and search.
    const chunks = Math.ceil(ns / EDGE_CHUNK);
    let edgeIndex: Flatbush | null = null;
    if (chunks > 0) {
      edgeIndex = new Flatbush(chunks);
      for (let k = 0; k < chunks; k++) {
        let x0 = Infinity;
        let y0 = Infinity;
        let x1 = -Infinity;
        let y1 = -Infinity;
        const end = Math.min(ns, (k + 1) * EDGE_CHUNK) * 4;
        for (let o = k * EDGE_CHUNK * 4; o < end; o += 2) {
          if (seg[o] < x0) x0 = seg[o];
          if (seg[o] > x1) x1 = seg[o];
          if (seg[o + 1] < y0) y0 = seg[o + 1];
          if (seg[o + 1] > y1) y1 = seg[o + 1];
        }
        edgeIndex.add(x0, y0, x1, y1);
      }
      edgeIndex.finish();
    }
    let triIndex: Flatbush | null = null;
    const containsByTriangles = (x: number, y: number): boolean => {
      const { triangles } = triangulation();
      const nt = triangles.length / 6;
      if (nt === 0 || x < bbox[0] || x > bbox[2] || y < bbox[1] || y > bbox[3]) return false;
      if (!triIndex) {
        triIndex = new Flatbush(nt);
        for (let t = 0; t < nt; t++) {
          const o = t * 6;
          triIndex.add(
            Math.min(triangles[o], triangles[o + 2], triangles[o + 4]),
            Math.min(triangles[o + 1], triangles[o + 3], triangles[o + 5]),
            Math.max(triangles[o], triangles[o + 2], triangles[o + 4]),
            Math.max(triangles[o + 1], triangles[o + 3], triangles[o + 5]),
          );
        }
        triIndex.finish();
      }
      return triIndex.collides(x, y, x, y, (t) => isInTriangle(triangles, t * 6, x, y));
    };
    const containsByCells = (x: number, y: number): boolean => stratumCellsContain(cells(), seg, x, y);
    return {
      key: info.key,
      bbox,
      edges: seg,
      areaGrid: outline.areaGrid,
      coords: outline.coords,
      polygonStarts: outline.polygonStarts,
      holeStarts: outline.holeStarts,
      polygonHoles: outline.polygonHoles,
      get triangles() {
        return triangulation().triangles;
      },
      get cumulativeArea() {
        return triangulation().cumulativeArea;
      },
      edgeIndex,
      cells,
      contains: sampling === 'cells' ? containsByCells : containsByTriangles,
    };
  });
}

function isInTriangle(t: Float64Array, o: number, px: number, py: number): boolean {
  const d1 = (px - t[o + 2]) * (t[o + 1] - t[o + 3]) - (t[o] - t[o + 2]) * (py - t[o + 3]);
  const d2 = (px - t[o + 4]) * (t[o + 3] - t[o + 5]) - (t[o + 2] - t[o + 4]) * (py - t[o + 5]);
  const d3 = (px - t[o]) * (t[o + 5] - t[o + 1]) - (t[o + 4] - t[o]) * (py - t[o + 1]);
  const hasNeg = d1 < 0 || d2 < 0 || d3 < 0;
  const hasPos = d1 > 0 || d2 > 0 || d3 > 0;
  return !(hasNeg && hasPos);
}
