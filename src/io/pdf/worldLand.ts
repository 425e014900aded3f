import type { Feature, FeatureCollection, LineString, MultiPolygon, Polygon, Position } from 'geojson';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';

/** Web maps stop short of the poles; land beyond this latitude is cut away, degrees. */
export const WORLD_LAND_MAX_LAT = 85;

/** Offline land and coastline, in WGS84 lon/lat, safe to draw on a Web Mercator map. */
export interface WorldLand {
  /** Land polygons, each inside −180…180° longitude and ±85° latitude, RFC 7946 winding. */
  land: FeatureCollection<Polygon>;
  /** Coastlines as lines, cut where they cross the antimeridian or leave ±85°. */
  coast: FeatureCollection<LineString>;
}

type Ring = Position[];

/** Longitudes made continuous along the ring (no jumps of more than 180°). */
function unwrapRing(ring: Ring): Ring {
  const out: Ring = [[ring[0][0], ring[0][1]]];
  for (let k = 1; k < ring.length; k++) {
    const prev = out[k - 1][0];
    let lon = ring[k][0];
    lon += 360 * Math.round((prev - lon) / 360);
    out.push([lon, ring[k][1]]);
  }
  return out;
}

function signedAreaDeg2(ring: Ring): number {
  let s = 0;
  for (let k = 0, n = ring.length; k < n; k++) {
    const a = ring[k];
    const b = ring[(k + 1) % n];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s / 2;
}

function withWinding(ring: Ring, counterClockwise: boolean): Ring {
  return signedAreaDeg2(ring) > 0 === counterClockwise ? ring : [...ring].reverse();
}

/**
 * One polygon of the (spherically stitched) topology as planar polygons: rings unwrapped, a ring
 * that circles a pole closed along that pole, latitudes clamped to ±85°, then cut into 360°
 * strips each shifted back into −180…180.
 */
function polygonPieces(rings: Ring[]): Position[][][] {
  const planar: Ring[] = [];
  for (const [index, raw] of rings.entries()) {
    if (raw.length < 4) continue;
    let ring = unwrapRing(raw);
    const wind = ring[ring.length - 1][0] - ring[0][0];
    if (Math.abs(wind) > 180) {
      // The ring goes once round the Earth: it bounds a polar cap (Antarctica in this data).
      const meanLat = ring.reduce((s, p) => s + p[1], 0) / ring.length;
      const pole = meanLat < 0 ? -90 : 90;
      ring = [...ring, [ring[ring.length - 1][0], pole], [ring[0][0], pole], ring[0]];
    } else if (index > 0 && planar.length > 0) {
      // Put a hole in the same 360° copy as its shell.
      const shellMid = (Math.min(...planar[0].map((p) => p[0])) + Math.max(...planar[0].map((p) => p[0]))) / 2;
      const shift = 360 * Math.round((shellMid - ring[0][0]) / 360);
      if (shift !== 0) ring = ring.map((p) => [p[0] + shift, p[1]]);
    }
    if (ring.every((p) => Math.abs(p[1]) > WORLD_LAND_MAX_LAT)) continue;
    // Only Antarctica reaches past 85°: clamping keeps its fill down to the map's edge.
    ring = ring.map((p) => [p[0], Math.max(-WORLD_LAND_MAX_LAT, Math.min(WORLD_LAND_MAX_LAT, p[1]))]);
    // Rings collapsed to a line by quantisation carry no land.
    if (signedAreaDeg2(ring) === 0) {
      if (planar.length === 0) return [];
      continue;
    }
    planar.push(withWinding(ring, planar.length === 0));
  }
  if (planar.length === 0) return [];
  let minLon = Infinity;
  let maxLon = -Infinity;
  for (const p of planar[0]) {
    minLon = Math.min(minLon, p[0]);
    maxLon = Math.max(maxLon, p[0]);
  }
  if (minLon >= -180 && maxLon <= 180) return [planar];
  const pieces: Position[][][] = [];
  for (let k = Math.floor((minLon + 180) / 360); k * 360 - 180 < maxLon; k++) {
    const west = k * 360 - 180;
    const rings: Ring[] = [];
    for (const ring of planar) {
      const cut = clipAtLon(clipAtLon(ring, west, 1), west + 360, -1);
      if (cut.length < 4 || signedAreaDeg2(cut) === 0) {
        if (rings.length === 0) break;
        continue;
      }
      rings.push(cut.map((p) => [p[0] - 360 * k, p[1]]));
    }
    if (rings.length > 0) pieces.push(rings);
  }
  return pieces;
}

/**
 * Sutherland–Hodgman clip of a closed ring to one side of a meridian (side 1 keeps lon ≥ cut,
 * −1 keeps lon ≤ cut). Land crosses the antimeridian in a few simple places (Chukotka, Wrangel
 * Island, Fiji), two crossings per ring, where this gives exact simple pieces.
 * Source: Sutherland & Hodgman, "Reentrant polygon clipping", CACM 17(1), 1974.
 */
function clipAtLon(ring: Ring, cutLon: number, side: 1 | -1): Ring {
  const out: Ring = [];
  const n = ring.length - 1;
  const inside = (p: Position) => (p[0] - cutLon) * side >= 0;
  for (let k = 0; k < n; k++) {
    const a = ring[k];
    const b = ring[k + 1];
    const ina = inside(a);
    const inb = inside(b);
    if (ina) out.push(a);
    if (ina !== inb) {
      const t = (cutLon - a[0]) / (b[0] - a[0]);
      out.push([cutLon, a[1] + (b[1] - a[1]) * t]);
    }
  }
  if (out.length > 0) out.push(out[0]);
  return out;
}

/** Coastline pieces of one ring: unwrapped, cut at each ±180° crossing and where |lat| > 85°. */
function coastPieces(raw: Ring): Ring[] {
  const ring = unwrapRing(raw);
  const out: Ring[] = [];
  let current: Ring = [];
  const flush = () => {
    const [first] = current;
    if (current.some((q) => q[0] !== first[0] || q[1] !== first[1])) out.push(current);
    current = [];
  };
  const strip = (lon: number) => Math.floor((lon + 180) / 360);
  const inside = (lat: number) => Math.abs(lat) <= WORLD_LAND_MAX_LAT;
  let currentStrip = 0;
  for (let k = 1; k < ring.length; k++) {
    const a = ring[k - 1];
    const p = ring[k];
    // Break points strictly inside the segment: strip edges and the latitude limits, in order.
    const cuts: number[] = [];
    const sa = strip(a[0]);
    const sb = strip(p[0]);
    for (let s = Math.min(sa, sb) + 1; s <= Math.max(sa, sb); s++) cuts.push((s * 360 - 180 - a[0]) / (p[0] - a[0]));
    for (const limit of [-WORLD_LAND_MAX_LAT, WORLD_LAND_MAX_LAT]) cuts.push((limit - a[1]) / (p[1] - a[1]));
    const ts = cuts.filter((t) => t > 0 && t < 1).sort((x, y) => x - y);
    ts.push(1);
    let t0 = 0;
    for (const t of ts) {
      if (t <= t0) continue;
      const at = (f: number): Position => [a[0] + (p[0] - a[0]) * f, a[1] + (p[1] - a[1]) * f];
      const mid = at((t0 + t) / 2);
      const s = strip(mid[0]);
      if (!inside(mid[1])) {
        flush();
      } else {
        if (current.length > 0 && s !== currentStrip) flush();
        if (current.length === 0) {
          const start = at(t0);
          current.push([start[0] - 360 * s, start[1]]);
          currentStrip = s;
        }
        const end = at(t);
        current.push([end[0] - 360 * s, end[1]]);
      }
      t0 = t;
    }
  }
  flush();
  return out;
}

/**
 * Land polygons and coastlines from a world-atlas TopoJSON (Natural Earth land, public domain),
 * made safe for Web Mercator: each ring's longitudes unwrapped, polygons that cross the
 * antimeridian split there, the ring round Antarctica closed along the pole, fills clamped and
 * coastlines cut at ±85°.
 * Without this, maplibre fills long false bands across the map.
 * @param topology a world-atlas land topology (land-50m.json or land-110m.json)
 * @param objectName the object to read (default "land")
 * @returns land polygons (one Feature per polygon) and coastline lines, WGS84 degrees
 * @throws Error when the object is missing (a packaging fault, not user input)
 */
export function worldLandFromTopology(topology: Topology, objectName = 'land'): WorldLand {
  const object = topology.objects[objectName] as GeometryCollection | undefined;
  if (!object) throw new Error(`world land topology has no object "${objectName}"`);
  const collection = feature(topology, object) as FeatureCollection<Polygon | MultiPolygon>;
  const land: Feature<Polygon>[] = [];
  const coast: Feature<LineString>[] = [];
  for (const f of collection.features) {
    if (!f.geometry) continue;
    const polygons = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates;
    for (const rings of polygons) {
      for (const poly of polygonPieces(rings)) {
        land.push({ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: poly } });
      }
      for (const ring of rings) {
        for (const line of coastPieces(ring)) {
          coast.push({ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: line } });
        }
      }
    }
  }
  return { land: { type: 'FeatureCollection', features: land }, coast: { type: 'FeatureCollection', features: coast } };
}

/**
 * Offline land at 1:50 million (world-atlas land-50m, ~0.5 MB, loaded as its own chunk) or
 * 1:110 million (~55 kB) for small screens. See {@link worldLandFromTopology}.
 */
export async function worldLandLoad(scale: '50m' | '110m' = '50m'): Promise<WorldLand> {
  const module =
    scale === '50m' ? await import('world-atlas/land-50m.json') : await import('world-atlas/land-110m.json');
  const topology = (module as { default?: unknown }).default ?? module;
  return worldLandFromTopology(topology as Topology);
}
