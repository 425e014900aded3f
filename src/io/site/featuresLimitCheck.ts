import type { FeatureCollection, Geometry } from 'geojson';
import { limitExceeded, limitNumber, MAX_FILE_VERTICES, MAX_NESTING_DEPTH } from '../../core/common/inputLimits';

/**
 * Checks what a reader produced against the size limits every later step relies on: at most
 * {@link MAX_FILE_VERTICES} positions in the file and GeometryCollections nested at most
 * {@link MAX_NESTING_DEPTH} deep. Walks the geometries without recursion, so it is safe on any
 * reader's output.
 * @param where the file, for the message
 * @returns the number of positions
 * Throws InputError naming the file (and feature), the count found and the limit.
 */
export function featuresLimitCheck(fc: FeatureCollection, where: string): number {
  let vertices = 0;
  for (let i = 0; i < fc.features.length; i++) {
    const stack: [Geometry, number][] = [];
    const g = fc.features[i].geometry;
    if (g) stack.push([g, 0]);
    while (stack.length > 0) {
      const [geometry, depth] = stack.pop()!;
      if (geometry.type === 'GeometryCollection') {
        if (depth >= MAX_NESTING_DEPTH) {
          throw limitExceeded(`${where}: feature ${i}`, `geometry collections are nested more than ${MAX_NESTING_DEPTH} deep`, `${MAX_NESTING_DEPTH} levels`);
        }
        for (const m of geometry.geometries) stack.push([m, depth + 1]);
        continue;
      }
      vertices += positionCount(geometry);
    }
    if (vertices > MAX_FILE_VERTICES) {
      throw limitExceeded(where, `it holds more than ${limitNumber(MAX_FILE_VERTICES)} vertices (${limitNumber(vertices)} by feature ${i})`, `${limitNumber(MAX_FILE_VERTICES)} vertices per file`);
    }
  }
  return vertices;
}

function positionCount(g: Exclude<Geometry, { type: 'GeometryCollection' }>): number {
  switch (g.type) {
    case 'Point':
      return 1;
    case 'MultiPoint':
    case 'LineString':
      return g.coordinates.length;
    case 'MultiLineString':
    case 'Polygon':
      return g.coordinates.reduce((n, r) => n + r.length, 0);
    case 'MultiPolygon':
      return g.coordinates.reduce((n, p) => n + p.reduce((m, r) => m + r.length, 0), 0);
  }
}
