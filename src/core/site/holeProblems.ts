import type { Position } from 'geojson';
import { problemMake } from '../common/problemMake';
import { edgeCrossesRayEast } from '../geometry/edgeCrossesRayEast';
import type { Problem, ProblemLocation } from '../model/types';

/** Even–odd ray test of a point against a closed ring (planar in lon/lat; ring closure optional). */
export function ringContainsPoint(ring: readonly Position[], x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (edgeCrossesRayEast(x, y, xi, yi, xj, yj)) inside = !inside;
  }
  return inside;
}

/**
 * Holes lying wholly outside their polygon's shell, as errors. A hole that crosses its shell is
 * reported by polygonSelfIntersections (its edges cross the shell's).
 * Source of the rule: OGC Simple Features 1.2.1 §6.1.11.1 (interior rings lie within the exterior ring).
 */
export function holeProblems(rings: readonly (readonly Position[])[], where: ProblemLocation): Problem[] {
  const problems: Problem[] = [];
  const shell = rings[0];
  if (!shell || shell.length < 4) return problems;
  for (let r = 1; r < rings.length; r++) {
    const hole = rings[r];
    if (hole.length === 0) continue;
    if (hole.some((p) => ringContainsPoint(shell, p[0], p[1]))) continue;
    problems.push(problemMake('error', 'hole-outside-shell', { ...where, ring: r, lonLat: hole[0] }, 'hole lies outside its shell'));
  }
  return problems;
}
