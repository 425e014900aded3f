import Flatbush from 'flatbush';
import type { LocalFrame } from './localFrame';
import { polygonAreaM2 } from './polygonAreaM2';
import { stratumUsableRegion } from './stratumUsableRegion';
import { usableAreaByGrid } from './usableAreaByGrid';
import type { MultiPolygon } from 'geojson';
import { polygonClipToBox } from './polygonClipToBox';
import type { ExclusionGeometry, LonLat, Site, StratumPart } from './types';

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

/** Frame boxes of buffered exclusions, grown past any buffer piece, merged until none overlap. */
function clusterBoxes(site: Site, frame: LocalFrame): { box: Box; members: number[] }[] {
  let clusters = site.exclusions.map((e, i) => {
    const b: Box = [Infinity, Infinity, -Infinity, -Infinity];
    for (const p of exclusionPositions(e.geometry)) {
      const [x, y] = frame.toXY(p[0], p[1]);
      if (x < b[0]) b[0] = x;
      if (y < b[1]) b[1] = y;
      if (x > b[2]) b[2] = x;
      if (y > b[3]) b[3] = y;
    }
    const grow = e.bufferM * 1.01 + 2;
    return { box: [b[0] - grow, b[1] - grow, b[2] + grow, b[3] + grow] as Box, members: [i] };
  });
  for (let merged = true; merged; ) {
    merged = false;
    const next: typeof clusters = [];
    for (const c of clusters) {
      const hit = next.find((n) => n.box[0] <= c.box[2] && n.box[2] >= c.box[0] && n.box[1] <= c.box[3] && n.box[3] >= c.box[1]);
      if (!hit) {
        next.push(c);
        continue;
      }
      hit.box = [Math.min(hit.box[0], c.box[0]), Math.min(hit.box[1], c.box[1]), Math.max(hit.box[2], c.box[2]), Math.max(hit.box[3], c.box[3])];
      hit.members.push(...c.members);
      merged = true;
    }
    clusters = next;
  }
  return clusters;
}

/**
 * Ellipsoidal area of one part that its exclusions take away. The buffered exclusions are grouped
 * into disjoint frame boxes; in each box the part is first cut to the box (polygonClipToBox), and only
 * that small piece goes through stratumUsableRegion, so a large part is never clipped whole. Exact
 * up to one modelling detail: where a box side cuts a long part edge, the cut point lies on the
 * straight grid line rather than on the geodesic, which moves the area by about edge length × the
 * line's sagitta (under 1e-4 relative for kilometre edges, nothing for the metre-scale edges of
 * mapped habitat). Outside the boxes no buffered exclusion reaches the part.
 */
function excludedByWindows(sub: Site, part: StratumPart, frame: LocalFrame): number {
  const polygons = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
  const xy = polygons.map((poly) => poly.map((ring) => ring.map((p) => frame.toXY(p[0], p[1]) as unknown as number[])));
  let excluded = 0;
  for (const { box, members } of clusterBoxes(sub, frame)) {
    const pieces: LonLat[][][] = [];
    for (const poly of xy) {
      const shell = polygonClipToBox(poly[0], box);
      if (shell.length === 0) continue;
      const holes = poly.slice(1).map((ring) => polygonClipToBox(ring, box)).filter((r) => r.length > 0);
      pieces.push([shell, ...holes].map((ring) => ring.map(([x, y]) => frame.toLonLat(x, y))));
    }
    if (pieces.length === 0) continue;
    const geometry: MultiPolygon = { type: 'MultiPolygon', coordinates: pieces };
    const windowSite: Site = { ...sub, parts: [{ ...part, geometry }], exclusions: members.map((i) => sub.exclusions[i]) };
    excluded += polygonAreaM2(geometry) - stratumUsableRegion(windowSite, part.stratum, frame).areaM2;
  }
  return excluded;
}

/**
 * Mapped and usable area of every stratum, m² on the WGS84 ellipsoid, in site order. Usable area is
 * worked out part by part: a part that no buffered exclusion comes near keeps its mapped area
 * exactly, and for the others only the windows around their buffered exclusions go through
 * {@link stratumUsableRegion} (with just those exclusions), which keeps large maps fast. Summing parts equals the stratum's usable area because parts of a valid site do
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
      // Rounding can leave a fully covered part a hair below zero or above its mapped area.
      usable[s] += Math.min(area, Math.max(0, area - excludedByWindows(sub, part, frame)));
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
