import type { Footprint } from '../../model/designTypes';

/** A footprint as the placement tests use it: vertex offsets from the centre in grid metres, or a radius. */
export interface FootprintXY {
  /** Vertex offsets (x east, y north of the grid) of a square or rectangle; empty for a circle or point. */
  vx: Float64Array;
  vy: Float64Array;
  /** Radius in grid metres for a circle; 0 for a point or polygon. */
  radius: number;
  /** Half the side of the smallest grid-aligned square around the footprint, grid metres. */
  halfExtent: number;
}

/**
 * Turns a footprint into grid offsets: sizes × `scale` (grid metres per ground metre) and corners
 * turned clockwise by its angle plus the meridian convergence, so that an angle of 0 puts the edges
 * on true north. A clockwise turn by β maps (x, y) to (x cos β + y sin β, −x sin β + y cos β).
 * @param convergenceDeg bearing of true north from grid north, degrees clockwise
 */
export function footprintShapeXY(fp: Footprint, scale: number, convergenceDeg: number): FootprintXY {
  if (fp.shape === 'point') return { vx: new Float64Array(0), vy: new Float64Array(0), radius: 0, halfExtent: 0 };
  if (fp.shape === 'circle') {
    const r = fp.radiusM * scale;
    return { vx: new Float64Array(0), vy: new Float64Array(0), radius: r, halfExtent: r };
  }
  const w = (fp.shape === 'square' ? fp.sideM : fp.widthM) * scale;
  const h = (fp.shape === 'square' ? fp.sideM : fp.heightM) * scale;
  const beta = ((fp.angleDeg + convergenceDeg) * Math.PI) / 180;
  const c = Math.cos(beta);
  const s = Math.sin(beta);
  const corners = [
    [-w / 2, -h / 2],
    [w / 2, -h / 2],
    [w / 2, h / 2],
    [-w / 2, h / 2],
  ];
  const vx = new Float64Array(4);
  const vy = new Float64Array(4);
  let ext = 0;
  corners.forEach(([x, y], i) => {
    vx[i] = x * c + y * s;
    vy[i] = -x * s + y * c;
    ext = Math.max(ext, Math.abs(vx[i]), Math.abs(vy[i]));
  });
  return { vx, vy, radius: 0, halfExtent: ext };
}
