import type { Position } from 'geojson';
import { problemMake } from '../common/problemMake';
import type { Problem, ProblemLocation } from '../model/types';

/** Interior angles below this, in degrees, are reported as spikes (common practice, no source). */
export const SPIKE_ANGLE_DEG = 1;

const same = (a: Position, b: Position) => a[0] === b[0] && a[1] === b[1];

/** How many distinct points `points` has, counting no further than three (one pass, no allocation). */
function distinctUpToThree(points: readonly Position[]): number {
  if (points.length === 0) return 0;
  const a = points[0];
  let b: Position | null = null;
  for (const p of points) {
    if (same(p, a)) continue;
    if (b === null) b = p;
    else if (!same(p, b)) return 3;
  }
  return b === null ? 1 : 2;
}

/**
 * Problems of one polygon ring on its own: not closed (error), fewer than 3 distinct points
 * (error), duplicate consecutive vertices (warning; repairable), and spikes — a vertex where the
 * boundary turns back on itself at less than {@link SPIKE_ANGLE_DEG}, measured with longitudes
 * scaled by cos(latitude) (error). `where` names the feature and ring.
 */
export function ringProblems(ring: readonly Position[], where: ProblemLocation): Problem[] {
  const problems: Problem[] = [];
  if (ring.length === 0) return [problemMake('error', 'ring-too-few-points', where, 'ring has no points')];
  const closed = ring.length > 1 && same(ring[0], ring[ring.length - 1]);
  if (!closed) {
    problems.push(problemMake('error', 'ring-not-closed', { ...where, lonLat: ring[ring.length - 1] }, 'ring is not closed (its last point differs from its first)'));
  }
  const open = closed ? ring.slice(0, -1) : ring.slice();
  const distinct: Position[] = [];
  let duplicates = 0;
  let firstDuplicate = -1;
  for (let i = 0; i < open.length; i++) {
    if (distinct.length > 0 && same(open[i], distinct[distinct.length - 1])) {
      duplicates++;
      if (firstDuplicate < 0) firstDuplicate = i;
      continue;
    }
    distinct.push(open[i]);
  }
  while (distinct.length > 1 && same(distinct[0], distinct[distinct.length - 1])) {
    distinct.pop();
    duplicates++;
    if (firstDuplicate < 0) firstDuplicate = open.length - 1;
  }
  if (duplicates > 0) {
    problems.push(
      problemMake('warning', 'ring-duplicate-vertices', { ...where, vertex: firstDuplicate, lonLat: open[firstDuplicate] },
        `${duplicates} duplicate consecutive vertex${duplicates > 1 ? 'es' : ''} (first at vertex ${firstDuplicate})`),
    );
  }
  const unique = distinctUpToThree(distinct);
  if (unique < 3) {
    problems.push(problemMake('error', 'ring-too-few-points', { ...where, lonLat: open[0] }, `ring has ${unique} distinct point${unique === 1 ? '' : 's'}; a polygon needs at least 3`));
    return problems;
  }
  const n = distinct.length;
  const cosLat = Math.cos((distinct[0][1] * Math.PI) / 180);
  const limit = (SPIKE_ANGLE_DEG * Math.PI) / 180;
  for (let i = 0; i < n; i++) {
    const a = distinct[(i + n - 1) % n];
    const b = distinct[i];
    const c = distinct[(i + 1) % n];
    const ux = (a[0] - b[0]) * cosLat;
    const uy = a[1] - b[1];
    const vx = (c[0] - b[0]) * cosLat;
    const vy = c[1] - b[1];
    const angle = Math.abs(Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy));
    if (angle < limit) {
      problems.push(
        problemMake('error', 'ring-spike', { ...where, lonLat: b }, `spike: the boundary turns back on itself (angle ${((angle * 180) / Math.PI).toFixed(2)}°)`),
      );
      break;
    }
  }
  return problems;
}
