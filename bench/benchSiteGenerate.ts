import type { Feature, FeatureCollection } from 'geojson';
import { rngCreate } from '../src/core/design/place/rng';

/** An invented benchmark site as GeoJSON layers: strata, and exclusion lines, polygons and points. */
export interface BenchSite {
  strata: FeatureCollection;
  lines: FeatureCollection;
  polygons: FeatureCollection;
  points: FeatureCollection;
  vertices: number;
}

const KINDS = ['Coastal heath', 'Dune grassland', 'Banksia scrub', 'Eucalypt woodland', 'Wet meadow'];

/**
 * A seeded, invented site of about `vertices` stratum vertices: `cells` × `cells` wiggly star-shaped
 * polygons (one per 1 km cell, five strata in turn), `exclusionsPerLayer` cliff lines, ponds and
 * hazard points scattered over it. Invented data: no real place; the origin is only a plausible
 * setting on the south coast of Western Australia.
 */
export function benchSiteGenerate(seed: number, vertices: number, cells: number, exclusionsPerLayer: number): BenchSite {
  const rng = rngCreate(seed);
  const lat0 = -34.6;
  const lon0 = 118.2;
  const kLat = 1 / 111320;
  const kLon = 1 / (111320 * Math.cos((lat0 * Math.PI) / 180));
  const perPolygon = Math.max(8, Math.round(vertices / (cells * cells)));
  const strata: Feature[] = [];
  let count = 0;
  for (let i = 0; i < cells; i++) {
    for (let j = 0; j < cells; j++) {
      const cx = (i + 0.5) * 1000;
      const cy = (j + 0.5) * 1000;
      const phase = rng.float() * 6.283;
      const ring: number[][] = [];
      for (let v = 0; v < perPolygon; v++) {
        const a = (v / perPolygon) * 2 * Math.PI;
        const r = 380 + 50 * Math.sin(7 * a + phase) + 15 * Math.sin(53 * a) + rng.float() * 4;
        ring.push([lon0 + (cx + Math.cos(a) * r) * kLon, lat0 + (cy + Math.sin(a) * r) * kLat]);
      }
      ring.push(ring[0]);
      count += perPolygon;
      strata.push({ type: 'Feature', properties: { stratum: KINDS[(i * cells + j) % KINDS.length], invented: true }, geometry: { type: 'Polygon', coordinates: [ring] } });
    }
  }
  const span = cells * 1000;
  const at = (): [number, number] => [rng.float() * span, rng.float() * span];
  const ll = (x: number, y: number) => [lon0 + x * kLon, lat0 + y * kLat];
  const lines: Feature[] = [];
  const polygons: Feature[] = [];
  const points: Feature[] = [];
  for (let e = 0; e < exclusionsPerLayer; e++) {
    const [x, y] = at();
    const coords = Array.from({ length: 12 }, (_, k) => ll(x + k * 25, y + 30 * Math.sin(k / 2)));
    lines.push({ type: 'Feature', properties: { kind: 'cliff', buffer_m: 15, invented: true }, geometry: { type: 'LineString', coordinates: coords } });
    const [px, py] = at();
    const pond = Array.from({ length: 16 }, (_, k) => ll(px + 40 * Math.cos((k / 16) * 2 * Math.PI), py + 30 * Math.sin((k / 16) * 2 * Math.PI)));
    pond.push(pond[0]);
    polygons.push({ type: 'Feature', properties: { kind: 'water', buffer_m: 10, invented: true }, geometry: { type: 'Polygon', coordinates: [pond] } });
    const [hx, hy] = at();
    points.push({ type: 'Feature', properties: { kind: 'hazard', buffer_m: 30, invented: true }, geometry: { type: 'Point', coordinates: ll(hx, hy) } });
  }
  const fc = (features: Feature[]): FeatureCollection => ({ type: 'FeatureCollection', features });
  return { strata: fc(strata), lines: fc(lines), polygons: fc(polygons), points: fc(points), vertices: count };
}
