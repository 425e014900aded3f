import type { FeatureCollection, Geometry, Position } from 'geojson';
import { InputError } from '../../core/common/InputError';
import type { CrsTransform } from './crsResolve';

function firstPosition(g: Geometry | null): Position | undefined {
  if (!g) return undefined;
  if (g.type === 'GeometryCollection') {
    for (const m of g.geometries) {
      const p = firstPosition(m);
      if (p) return p;
    }
    return undefined;
  }
  let c: unknown = g.coordinates;
  while (Array.isArray(c) && Array.isArray(c[0])) c = c[0];
  return Array.isArray(c) && c.length >= 2 ? (c as Position) : undefined;
}

function everyPosition(g: Geometry | null, test: (p: Position) => boolean): boolean {
  if (!g) return true;
  if (g.type === 'GeometryCollection') return g.geometries.every((m) => everyPosition(m, test));
  const walk = (c: unknown): boolean => (typeof (c as number[])[0] === 'number' ? test(c as Position) : (c as unknown[]).every(walk));
  return walk(g.coordinates);
}

/**
 * Refuses coordinates that are all degree-sized (|x| ≤ 180, |y| ≤ 90) while the file's coordinate
 * system is a projected one in metres or feet: read as metres they would put the whole site within
 * a few hundred metres of the projection's false origin (a stratum of about a square centimetre),
 * a silent wrong answer. No real projected site lies that close to its false origin.
 * @param fc the features in the file's own coordinates (before conversion)
 * @param where the file (and layer) for the message
 * Throws InputError naming the file, the first feature's position and the coordinate system.
 */
export function crsDegreesCheck(fc: FeatureCollection, crs: CrsTransform, where: string): void {
  if (crs.isGeographic) return;
  const degreeSized = (p: Position) => Math.abs(p[0]) <= 180 && Math.abs(p[1]) <= 90;
  let first: { index: number; p: Position } | null = null;
  for (let i = 0; i < fc.features.length; i++) {
    const g = fc.features[i].geometry;
    if (!everyPosition(g, degreeSized)) return;
    const p = firstPosition(g);
    if (!first && p) first = { index: i, p };
  }
  if (!first) return;
  throw new InputError(
    `${where}: feature ${first.index}: coordinates ${first.p[0]}, ${first.p[1]} look like longitude/latitude degrees, but the coordinate system given for the file is ${crs.label}, a projected system in metres; give the coordinate system the file really uses`,
  );
}
