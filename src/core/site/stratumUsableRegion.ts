import type { MultiPolygon, Position } from 'geojson';
import { polygonsDifference, polygonsUnion } from '../geometry/polygonClip';
import { ARC_TOLERANCE_M } from '../geometry/bufferShapesXY';
import { exclusionBufferPiecesXY, type MultiPolygonXY } from '../geometry/exclusionBufferXY';
import { InputError } from '../common/InputError';
import type { LocalFrame } from '../geo/localFrame';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import type { Exclusion, Site } from '../model/types';

type Box = [minX: number, minY: number, maxX: number, maxY: number];

/** Usable ground of one stratum, in the site frame and in WGS84. */
export interface UsableRegion {
  /** Polygons → rings → [x, y] metres in the frame; the first ring of each polygon is the shell. */
  xy: number[][][][];
  geometry: MultiPolygon;
  /** Ellipsoidal area of `geometry`, m². */
  areaM2: number;
}

/** True when the bbox of a piece's shell overlaps `b`. */
function pieceMeetsBox(piece: MultiPolygonXY[number], b: Box): boolean {
  let [x0, y0, x1, y1] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [x, y] of piece[0]) {
    if (x < x0) x0 = x;
    if (y < y0) y0 = y;
    if (x > x1) x1 = x;
    if (y > y1) y1 = y;
  }
  return x0 <= b[2] && x1 >= b[0] && y0 <= b[3] && y1 >= b[1];
}

const bboxCache = new WeakMap<Exclusion, { epsg: number; box: Box }>();

function positionsOf(e: Exclusion): Position[] {
  const g = e.geometry;
  if (g.type === 'Point') return [g.coordinates];
  if (g.type === 'MultiPoint' || g.type === 'LineString') return g.coordinates;
  if (g.type === 'MultiLineString' || g.type === 'Polygon') return g.coordinates.flat();
  return g.coordinates.flat(2);
}

/** Frame bbox of an exclusion grown by its buffer (cached per exclusion and frame). */
function exclusionBoxXY(e: Exclusion, frame: LocalFrame): Box {
  const hit = bboxCache.get(e);
  if (hit && hit.epsg === frame.epsg) return hit.box;
  const box: Box = [Infinity, Infinity, -Infinity, -Infinity];
  for (const p of positionsOf(e)) {
    const [x, y] = frame.toXY(p[0], p[1]);
    if (x < box[0]) box[0] = x;
    if (y < box[1]) box[1] = y;
    if (x > box[2]) box[2] = x;
    if (y > box[3]) box[3] = y;
  }
  const grow = e.bufferM + ARC_TOLERANCE_M;
  const grown: Box = [box[0] - grow, box[1] - grow, box[2] + grow, box[3] + grow];
  bboxCache.set(e, { epsg: frame.epsg, box: grown });
  return grown;
}

/**
 * One stratum's usable region: its parts (unioned) minus every exclusion's buffered footprint
 * ({@link exclusionBufferPiecesXY}), nothing else. Clipping is planar in the site's UTM frame by
 * polyclip-ts (Martinez–Rueda–Feito sweep line), near a local origin for precision; the area is
 * then measured on the WGS84 ellipsoid from the unprojected vertices by polygonAreaM2, so mapped
 * and usable areas share one model (a stratum no exclusion touches keeps its own coordinates and
 * exactly its mapped area).
 * @param frame the site frame, normally siteLocalFrame(site.parts)
 * @returns rings in frame metres, the same region as a lon/lat MultiPolygon, and its area in m²
 * Throws InputError when the site has no parts for `stratumKey`.
 */
export function stratumUsableRegion(site: Site, stratumKey: string, frame: LocalFrame): UsableRegion {
  const parts = site.parts.filter((p) => p.stratum === stratumKey);
  if (parts.length === 0) throw new InputError(`stratum "${stratumKey}" has no mapped polygons`);
  const polygons: Position[][][] = parts.flatMap((p) => (p.geometry.type === 'Polygon' ? [p.geometry.coordinates] : p.geometry.coordinates));
  const box: Box = [Infinity, Infinity, -Infinity, -Infinity];
  const partsXY: MultiPolygonXY = polygons.map((poly) =>
    poly.map((ring) =>
      ring.map((p) => {
        const [x, y] = frame.toXY(p[0], p[1]);
        if (x < box[0]) box[0] = x;
        if (y < box[1]) box[1] = y;
        if (x > box[2]) box[2] = x;
        if (y > box[3]) box[3] = y;
        return [x, y] as [number, number];
      }),
    ),
  );
  const cutters = site.exclusions.filter((e) => {
    const b = exclusionBoxXY(e, frame);
    return b[0] <= box[2] && b[2] >= box[0] && b[1] <= box[3] && b[3] >= box[1];
  });
  const origin: [number, number] = [Math.round(box[0]), Math.round(box[1])];
  const localBox: Box = [box[0] - origin[0], box[1] - origin[1], box[2] - origin[0], box[3] - origin[1]];
  // Many-point exclusions spread over a site: only the discs that reach this stratum go to the clipper.
  const pieces = cutters.flatMap((e) => exclusionBufferPiecesXY(e, frame, origin)).filter((piece) => pieceMeetsBox(piece, localBox));
  if (pieces.length === 0 && polygons.length === 1) {
    const geometry: MultiPolygon = { type: 'MultiPolygon', coordinates: polygons };
    return { xy: partsXY, geometry, areaM2: polygonAreaM2(geometry) };
  }
  const local = partsXY.map((poly) => poly.map((ring) => ring.map(([x, y]) => [x - origin[0], y - origin[1]] as [number, number])));
  let region = polygonsUnion(local[0], ...local.slice(1)) as MultiPolygonXY;
  if (pieces.length > 0 && region.length > 0) region = polygonsDifference(region, ...pieces) as MultiPolygonXY;
  const xy = region.map((poly) => poly.map((ring) => ring.map(([x, y]) => [x + origin[0], y + origin[1]])));
  const geometry: MultiPolygon = {
    type: 'MultiPolygon',
    coordinates: xy.map((poly) => poly.map((ring) => ring.map(([x, y]) => frame.toLonLat(x, y)))),
  };
  return { xy, geometry, areaM2: polygonAreaM2(geometry) };
}
