import Flatbush from 'flatbush';
import type { LocalFrame } from './localFrame';
import { polygonAreaM2 } from './polygonAreaM2';
import { stratumUsableRegion } from './stratumUsableRegion';
import { usableAreaByGrid } from './usableAreaByGrid';
import type { ExclusionGeometry, LonLat, Site } from './types';

type Box = [number, number, number, number];

function boxOf(positions: Iterable<LonLat>): Box {
  const b: Box = [Infinity, Infinity, -Infinity, -Infinity];
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

/**
 * Mapped and usable area of every stratum, m² on the WGS84 ellipsoid, in site order. Usable area is
 * worked out part by part: a part that no buffered exclusion comes near keeps its mapped area
 * exactly, and only the parts an exclusion's buffered box reaches go through
 * {@link stratumUsableRegion} (with just those exclusions), which keeps large maps with few
 * exclusions fast. Summing parts equals the stratum's usable area because parts of a valid site do
 * not overlap (overlaps are errors in siteValidate). When exact clipping of a part fails, its usable
 * area is counted on a fine grid instead ({@link usableAreaByGrid}) and a warning says so.
 * Source of the areas: Karney (2013) via polygonAreaM2; clipping as in stratumUsableRegion.
 */
export function designUsableAreas(
  site: Site,
  frame: LocalFrame,
  tick: () => void = () => {},
): { mapped: number[]; usable: number[]; warnings: string[] } {
  const warnings: string[] = [];
  const index = new Map(site.strata.map((s, i) => [s.key, i]));
  const mapped = site.strata.map(() => 0);
  const usable = site.strata.map(() => 0);
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
  for (const part of site.parts) {
    const s = index.get(part.stratum);
    if (s === undefined) continue;
    tick();
    const area = polygonAreaM2(part.geometry);
    mapped[s] += area;
    const rings = part.geometry.type === 'Polygon' ? part.geometry.coordinates : part.geometry.coordinates.flat();
    const b = boxOf(rings[0] ? rings.flat() : []);
    const near = exIndex ? exIndex.search(b[0], b[1], b[2], b[3]) : [];
    if (near.length === 0) {
      usable[s] += area;
      continue;
    }
    const sub: Site = { ...site, parts: [part], exclusions: near.sort((x, y) => x - y).map((i) => site.exclusions[i]) };
    try {
      usable[s] += stratumUsableRegion(sub, part.stratum, frame).areaM2;
    } catch (error) {
      if (error instanceof Error && error.name === 'InputError') throw error;
      // Exact clipping can fail on awkward geometry; count instead, and say so with the error bound.
      const est = usableAreaByGrid({ ...sub, strata: site.strata.filter((x) => x.key === part.stratum) }, frame, area);
      usable[s] += est.areaM2;
      warnings.push(
        `usable area of part "${part.id}" (stratum "${part.stratum}") was counted on a fine grid because exact clipping failed (${(error as Error).message.slice(0, 80)}); it is ${est.areaM2.toFixed(0)} m² ± ${est.errorM2.toFixed(0)} m².`,
      );
    }
  }
  return { mapped, usable, warnings };
}
