import type { Position } from 'geojson';
import { problemMake } from '../common/problemMake';
import type { Problem, ProblemLocation } from '../model/types';

/** One feature to check: where it is reported and every position it has, in runs (rings, lines) numbered on across runs. */
export interface PositionedFeature {
  where: ProblemLocation;
  runs: readonly (readonly Position[])[];
}

/**
 * Coordinates out of range, one problem per feature at its first bad position: apparently
 * swapped (latitude beyond ±90 while the longitude is within ±90), projected metres (when every
 * position of the whole input has a coordinate beyond ±360, no degree value, the file is
 * probably in a projected CRS), or simply out of range (longitude beyond ±180, latitude beyond ±90) or not finite.
 * All are errors. Ranges: WGS84 degrees, RFC 7946 §3.1.1.
 */
export function coordinateProblems(features: readonly PositionedFeature[]): Problem[] {
  let total = 0;
  let beyond = 0;
  for (const f of features) {
    for (const run of f.runs) {
      total += run.length;
      for (let i = 0; i < run.length; i++) if (Math.max(Math.abs(run[i][0]), Math.abs(run[i][1])) > 360) beyond++;
    }
  }
  const looksProjected = total > 0 && beyond === total;
  const problems: Problem[] = [];
  for (const f of features) {
    const found = firstProblem(f, looksProjected);
    if (found) problems.push(found);
  }
  return problems;
}

/** The problem of a feature's first bad position, or null when every position is good. */
function firstProblem(f: PositionedFeature, looksProjected: boolean): Problem | null {
  let v = -1;
  for (const run of f.runs) {
    for (let k = 0; k < run.length; k++) {
      v++;
      const p = run[k];
      const lon = p[0];
      const lat = p[1];
      // The common case, a good vertex, allocates nothing (this runs once per vertex of the map).
      if (!looksProjected && Math.abs(lon) <= 180 && Math.abs(lat) <= 90) continue;
      const where = { ...f.where, vertex: v };
      if (!Number.isFinite(lon) || !Number.isFinite(lat)) {
        return problemMake('error', 'coordinate-not-finite', where, `vertex ${v} is not a finite number pair`);
      }
      if (looksProjected) {
        return problemMake('error', 'coordinates-projected', where,
          `coordinates ${lon}, ${lat} look like projected metres, not degrees; give WGS84 longitude/latitude or say which EPSG code the file uses`);
      }
      if (Math.abs(lat) > 90 && Math.abs(lon) <= 90) {
        // Zoom to where the vertex would be if swapped back; the message says so.
        return problemMake('error', 'coordinates-swapped', { ...where, lonLat: [lat, lon] },
          `vertex ${v} has latitude ${lat} beyond ±90 — longitude and latitude look swapped (GeoJSON order is longitude, latitude); swapped back it lies`);
      }
      if (Math.abs(lon) > 180 || Math.abs(lat) > 90) {
        return problemMake('error', 'coordinate-out-of-range', where, `vertex ${v} (${lon}, ${lat}) is outside longitude ±180 / latitude ±90`);
      }
    }
  }
  return null;
}
