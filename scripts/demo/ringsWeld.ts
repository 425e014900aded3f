// Welding of the demo site's rings so neighbouring strata share vertices exactly.
import type { P, Ring } from './shapesXY';

const CELL = 25;

const cellKey = (x: number, y: number) => `${Math.floor(x / CELL)},${Math.floor(y / CELL)}`;
function canonical(grid: Map<string, P[]>, p: P): P {
  const cx = Math.floor(p[0] / CELL);
  const cy = Math.floor(p[1] / CELL);
  for (let i = -1; i <= 1; i++) {
    for (let j = -1; j <= 1; j++) {
      for (const q of grid.get(`${cx + i},${cy + j}`) ?? []) if (Math.hypot(q[0] - p[0], q[1] - p[1]) < 1e-4) return q;
    }
  }
  const k = cellKey(p[0], p[1]);
  const list = grid.get(k) ?? [];
  list.push(p);
  grid.set(k, list);
  return p;
}
function weld(grid: Map<string, P[]>, ring: Ring): Ring {
  const out: Ring = [ring[0]];
  for (let i = 1; i < ring.length; i++) {
    const a = ring[i - 1];
    const b = ring[i];
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const len2 = dx * dx + dy * dy;
    const found: { t: number; p: P }[] = [];
    const x0 = Math.floor(Math.min(a[0], b[0]) / CELL) - 1;
    const x1 = Math.floor(Math.max(a[0], b[0]) / CELL) + 1;
    const y0 = Math.floor(Math.min(a[1], b[1]) / CELL) - 1;
    const y1 = Math.floor(Math.max(a[1], b[1]) / CELL) + 1;
    for (let cx = x0; cx <= x1; cx++) {
      for (let cy = y0; cy <= y1; cy++) {
        for (const q of grid.get(`${cx},${cy}`) ?? []) {
          if (q === a || q === b) continue;
          const t = ((q[0] - a[0]) * dx + (q[1] - a[1]) * dy) / len2;
          if (t <= 1e-9 || t >= 1 - 1e-9) continue;
          const dist = Math.abs((q[0] - a[0]) * dy - (q[1] - a[1]) * dx) / Math.sqrt(len2);
          if (dist < 1e-4) found.push({ t, p: q });
        }
      }
    }
    found.sort((u, v) => u.t - v.t);
    for (const f of found) out.push(f.p);
    out.push(b);
  }
  return out;
}


/**
 * Welds a set of planar rings into one consistent mesh, in place: points closer than 0.1 mm become
 * the same point, and every point lying on another ring's edge is inserted into that edge, so two
 * rings that share a boundary carry the very same vertex sequence along it (no T-junctions).
 */
export function ringsWeld(rings: Ring[]): void {
  const grid = new Map<string, P[]>();
  for (const ring of rings) for (let i = 0; i < ring.length; i++) ring[i] = canonical(grid, ring[i]);
  const welded = rings.map((ring) => weld(grid, ring));
  rings.forEach((ring, i) => {
    ring.splice(0, ring.length, ...welded[i]);
  });
}
