import Flatbush from 'flatbush';
import { exclusionBufferPartsXY } from '../geometry/exclusionBufferPartsXY';
import type { LocalFrame } from '../geo/localFrame';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { type PolygonsLonLat, polygonCoveredAreaM2 } from '../geometry/polygonCoveredAreaM2';
import { usableAreaByGrid } from './usableAreaByGrid';
import type { ExclusionGeometry, LonLat, Site } from '../model/types';

type Box = [number, number, number, number];

/** Relative agreement of the covered-area measurement with the mapped area (see polygonCoveredAreaM2). */
const COVERED_TOLERANCE = 1e-6;

/** The lon/lat box of `positions`, widening `b` when given (so many rings share one box without being joined first). */
function boxOf(positions: Iterable<LonLat>, b: Box = [Infinity, Infinity, -Infinity, -Infinity]): Box {
  for (const p of positions) {
    if (p[0] < b[0]) b[0] = p[0];
    if (p[1] < b[1]) b[1] = p[1];
    if (p[0] > b[2]) b[2] = p[0];
    if (p[1] > b[3]) b[3] = p[1];
  }
  return b;
}

function* exclusionPositions(g: ExclusionGeometry): Iterable<LonLat> {
  if (g.type === 'Point') yield g.coordinates;
  else if (g.type === 'MultiPoint' || g.type === 'LineString') yield* g.coordinates;
  else if (g.type === 'MultiLineString' || g.type === 'Polygon') for (const l of g.coordinates) yield* l;
  else for (const poly of g.coordinates) for (const l of poly) yield* l;
}

/** Each buffered piece of an exclusion as its own lon/lat polygon, with its lon/lat box. */
function bufferPiecesLonLat(e: Site['exclusions'][number], frame: LocalFrame): { piece: PolygonsLonLat; box: Box }[] {
  const anchor = exclusionPositions(e.geometry)[Symbol.iterator]().next().value;
  if (!anchor) return [];
  const [ax, ay] = frame.toXY(anchor[0], anchor[1]);
  // Buffers are drawn near the exclusion, away from the frame origin, to keep their precision.
  const origin: [number, number] = [Math.round(ax), Math.round(ay)];
  return exclusionBufferPartsXY(e, frame, origin).map((poly) => {
    const piece = [poly.map((ring) => ring.map(([x, y]) => frame.toLonLat(x + origin[0], y + origin[1])))];
    return { piece, box: boxOf(piece[0][0]) };
  });
}


/** One part's mapped and usable area, m² on the WGS84 ellipsoid, and a warning when it had to be counted on a grid. */
export interface PartAreas {
  mapped: number;
  usable: number;
  warning: string | null;
}

/**
 * A measurer of one part's mapped and usable area (by its index in `site.parts`); it keeps the
 * exclusion index and each exclusion's buffered pieces between calls. A part that no buffered
 * exclusion comes near keeps its mapped area exactly; from the others, the ground under the union
 * of the buffered pieces that reach them (exclusionBufferPartsXY, each exclusion buffered once,
 * pieces left overlapping) is measured directly by {@link polygonCoveredAreaM2} and taken away, so
 * a large part is never clipped. This agrees with clipping the part (stratumUsableRegion) to within
 * 1e-6 of its area (tested). Should that measurement fail, the part's usable area is counted on a
 * fine grid instead ({@link usableAreaByGrid}) and the warning says so. An InputError (a limit met)
 * is thrown on.
 * Source of the areas: polygonAreaM2 (Snyder 1987 equal-area route or Karney 2013) and Green's theorem.
 */
export function partAreasMeasurer(site: Site, frame: LocalFrame): (partIndex: number) => PartAreas {
  const exBoxes = site.exclusions.map((e) => {
    const b = boxOf(exclusionPositions(e.geometry));
    // Degrees per metre, generous: 1/110 000 of latitude, and of longitude widened by the latitude.
    const lat = Math.max(Math.abs(b[1]), Math.abs(b[3]));
    const dLat = (e.bufferM + 1) / 110000;
    const dLon = dLat / Math.max(0.01, Math.cos((Math.min(89, lat) * Math.PI) / 180));
    return [b[0] - dLon, b[1] - dLat, b[2] + dLon, b[3] + dLat] as Box;
  });
  let exIndex: Flatbush | null = null;
  if (exBoxes.length) {
    exIndex = new Flatbush(exBoxes.length);
    for (const b of exBoxes) exIndex.add(b[0], b[1], b[2], b[3]);
    exIndex.finish();
  }
  const pieceCache = new Map<number, { piece: PolygonsLonLat; box: Box }[]>();
  const piecesOf = (i: number) => {
    let hit = pieceCache.get(i);
    if (!hit) pieceCache.set(i, (hit = bufferPiecesLonLat(site.exclusions[i], frame)));
    return hit;
  };
  return (partIndex) => {
    const part = site.parts[partIndex];
    const area = polygonAreaM2(part.geometry);
    const rings = part.geometry.type === 'Polygon' ? part.geometry.coordinates : part.geometry.coordinates.flat();
    const b = boxOf([]);
    for (const ring of rings) boxOf(ring, b);
    const near = exIndex ? exIndex.search(b[0], b[1], b[2], b[3]) : [];
    if (near.length === 0) return { mapped: area, usable: area, warning: null };
    near.sort((x, y) => x - y);
    try {
      const pieces = near.flatMap(piecesOf).filter(({ box }) => box[0] <= b[2] && box[2] >= b[0] && box[1] <= b[3] && box[3] >= b[1]);
      const polygons = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
      const lost = pieces.length ? polygonCoveredAreaM2(polygons, pieces.map((p) => p.piece)) : 0;
      // The covered area is measured with straight edges in an equal-area projection, the mapped
      // area with geodesic ones; they agree to 1e-6 of the part (far better for metre-scale edges),
      // so a part covered to within that is taken as wholly covered rather than left with a sliver.
      return { mapped: area, usable: lost >= area * (1 - COVERED_TOLERANCE) ? 0 : Math.min(area, Math.max(0, area - lost)), warning: null };
    } catch (error) {
      if (error instanceof Error && error.name === 'InputError') throw error;
      const sub: Site = { ...site, parts: [part], exclusions: near.map((i) => site.exclusions[i]) };
      // Exact clipping can fail on awkward geometry; count instead, and say so with the error bound.
      const est = usableAreaByGrid({ ...sub, strata: site.strata.filter((x) => x.key === part.stratum) }, frame, area);
      return {
        mapped: area,
        usable: est.areaM2,
        warning: `usable area of part "${part.id}" (stratum "${part.stratum}") was counted on a fine grid because exact clipping failed (${(error as Error).message.slice(0, 80)}); it is ${est.areaM2.toFixed(0)} m² ± ${est.errorM2.toFixed(0)} m².`,
      };
    }
  };
}
