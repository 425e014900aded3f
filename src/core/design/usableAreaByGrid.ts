import type { LocalFrame } from '../geo/localFrame';
import { FIT_EXCLUDED, placementConstraintsBuild } from './place/placementConstraints';
import type { Site } from '../model/types';

/** Most grid points one estimate may test (bounds the time; common practice, no source). */
const MAX_POINTS = 2_000_000;

/**
 * Usable area of a one-part site by counting: a square grid of points over the buffered boxes of
 * its exclusions, each point tested exactly (inside the part and within an exclusion's buffer: the
 * same test placement uses), excluded area = count × cell area, scaled from grid to ellipsoidal m² by
 * the part's mapped/grid area ratio. Used only when exact polygon clipping fails; the error is about
 * half a cell times the buffered outline's length, returned as `errorM2`.
 * Source: midpoint-rule area integration (common practice, no source).
 * @param mappedM2 the part's ellipsoidal area
 */
export function usableAreaByGrid(site: Site, frame: LocalFrame, mappedM2: number): { areaM2: number; errorM2: number } {
  // By cells, not triangles: this fallback must not triangulate a polygon too large for earcut.
  const c = placementConstraintsBuild(site, frame, { footprint: { shape: 'point' }, edgeBufferM: 0, sampling: 'cells' });
  const st = c.strata[0];
  const gridArea = st.areaGrid;
  if (!(gridArea > 0)) return { areaM2: 0, errorM2: 0 };
  const boxes: [number, number, number, number][] = [];
  let outline = 0;
  for (const e of site.exclusions) {
    const b: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
    const g = e.geometry;
    const pts = g.type === 'Point' ? [g.coordinates] : g.type === 'MultiPoint' || g.type === 'LineString' ? g.coordinates : g.type === 'MultiPolygon' ? g.coordinates.flat(2) : g.coordinates.flat();
    for (const p of pts) {
      const [x, y] = frame.toXY(p[0], p[1]);
      b[0] = Math.min(b[0], x);
      b[1] = Math.min(b[1], y);
      b[2] = Math.max(b[2], x);
      b[3] = Math.max(b[3], y);
    }
    const grow = e.bufferM * c.scale + 1;
    const box: [number, number, number, number] = [Math.max(b[0] - grow, st.bbox[0]), Math.max(b[1] - grow, st.bbox[1]), Math.min(b[2] + grow, st.bbox[2]), Math.min(b[3] + grow, st.bbox[3])];
    if (box[2] > box[0] && box[3] > box[1]) {
      boxes.push(box);
      outline += 2 * (box[2] - box[0] + box[3] - box[1]);
    }
  }
  const boxArea = boxes.reduce((a, b) => a + (b[2] - b[0]) * (b[3] - b[1]), 0);
  const h = Math.max(0.25, Math.sqrt(boxArea / MAX_POINTS));
  let excluded = 0;
  boxes.forEach((b, k) => {
    for (let y = Math.floor(b[1] / h) * h + h / 2; y < b[3]; y += h) {
      for (let x = Math.floor(b[0] / h) * h + h / 2; x < b[2]; x += h) {
        // Count each point once: skip it when an earlier box already held it.
        let seen = false;
        for (let j = 0; j < k && !seen; j++) seen = x >= boxes[j][0] && x < boxes[j][2] && y >= boxes[j][1] && y < boxes[j][3];
        if (!seen && c.check(0, x, y) === FIT_EXCLUDED) excluded++;
      }
    }
  });
  const ratio = mappedM2 / gridArea;
  return { areaM2: Math.max(0, mappedM2 - excluded * h * h * ratio), errorM2: (outline * h * ratio) / 2 };
}
