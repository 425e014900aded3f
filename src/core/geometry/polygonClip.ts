import * as polyclip from 'polyclip-ts';

/** Polygons as nested coordinate arrays: [polygon][ring][vertex][x, y] (GeoJSON MultiPolygon coordinates). */
export type ClipPolygons = number[][][][];
/** A single polygon ([ring][vertex][x, y]) or several. */
export type ClipInput = number[][][] | ClipPolygons;

const geom = (g: ClipInput) => g as unknown as polyclip.Geom;

/**
 * The only place stratplot calls polyclip-ts (Martínez–Rueda–Feito sweep line with exact
 * arithmetic): union, difference and intersection of polygons in any one plane (lon/lat or a local
 * frame). Results are MultiPolygon coordinates, empty when nothing is left.
 */
export function polygonsUnion(first: ClipInput, ...rest: ClipInput[]): ClipPolygons {
  return polyclip.union(geom(first), ...rest.map(geom)) as unknown as ClipPolygons;
}

/** `subject` minus every clip polygon (see {@link polygonsUnion}). */
export function polygonsDifference(subject: ClipInput, ...clips: ClipInput[]): ClipPolygons {
  return polyclip.difference(geom(subject), ...clips.map(geom)) as unknown as ClipPolygons;
}

/** The ground common to all inputs (see {@link polygonsUnion}). */
export function polygonsIntersection(first: ClipInput, ...rest: ClipInput[]): ClipPolygons {
  return polyclip.intersection(geom(first), ...rest.map(geom)) as unknown as ClipPolygons;
}
