import type { Feature, FeatureCollection, Polygon } from 'geojson';
import type { Footprint, PlotCollection } from '../../core/model/designTypes';
import { type LocalFrame, localFrameAt } from '../../core/geo/localFrame';
import { plotFieldStates } from '../../core/field/plotFieldState';
import type { Site } from '../../core/model/types';

const EMPTY: FeatureCollection = { type: 'FeatureCollection', features: [] };

/** Rough size of a part for ordering labels: its bounding box in square degrees (no units needed). */
function partSize(geometry: Site['parts'][number]['geometry']): number {
  let w = Infinity;
  let s = Infinity;
  let e = -Infinity;
  let n = -Infinity;
  const rings = geometry.type === 'Polygon' ? [geometry.coordinates[0]] : geometry.coordinates.map((p) => p[0]);
  for (const ring of rings) {
    for (const [x, y] of ring) {
      w = Math.min(w, x);
      s = Math.min(s, y);
      e = Math.max(e, x);
      n = Math.max(n, y);
    }
  }
  return Number.isFinite(w) ? (e - w) * (n - s) : 0;
}

/**
 * Stratum features coloured by their stratum, with the label and code the map prints and a
 * `label_rank` for placing labels: each stratum's largest feature first (smaller strata before
 * larger, as they have less room), then the other features, so every stratum keeps at least one
 * label where labels would collide — a freshly drawn stratum as well as imported ones.
 */
export function strataSource(site: Site): FeatureCollection {
  const info = new Map(site.strata.map((s) => [s.key, s]));
  const sizes = site.parts.map((p) => partSize(p.geometry));
  const largest = new Map<string, number>();
  site.parts.forEach((p, i) => {
    const at = largest.get(p.stratum);
    if (at === undefined || sizes[i] > sizes[at]) largest.set(p.stratum, i);
  });
  const biggest = Math.max(1e-12, ...sizes);
  return {
    type: 'FeatureCollection',
    features: site.parts.map((p, i) => {
      const s = info.get(p.stratum);
      const rank = (largest.get(p.stratum) === i ? 0 : 2) + sizes[i] / biggest;
      return {
        type: 'Feature',
        geometry: p.geometry,
        properties: { id: p.id, stratum: p.stratum, label: s?.label ?? p.stratum, code: s?.code ?? '?', colour: s?.colour ?? '#777777', label_rank: rank },
      };
    }),
  };
}

/** Exclusions as drawn (lines, points, polygons), with kind and name. */
export function exclusionsSource(site: Site): FeatureCollection {
  return {
    type: 'FeatureCollection',
    features: site.exclusions.map((e) => ({ type: 'Feature', geometry: e.geometry, properties: { id: e.id, kind: e.kind, name: e.name ?? e.kind, buffer_m: e.bufferM } })),
  };
}

/** Access points with their names. */
export function accessSource(site: Site): FeatureCollection {
  return {
    type: 'FeatureCollection',
    features: site.access.map((a) => ({ type: 'Feature', geometry: { type: 'Point', coordinates: [a.lon, a.lat] }, properties: { id: a.id, name: a.name, kind: a.kind } })),
  };
}

/** Rejected plots are drawn first (under the others), then reserves, then primaries and promoted reserves. */
const DRAW_ORDER: Record<string, number> = { rejected: 0, reserve: 1 };

/** Plots as points in drawing order; `state` is the plot's field state (plotFieldStates), the key of its symbol. */
export function plotsSource(result: PlotCollection | null): FeatureCollection {
  if (!result) return EMPTY;
  const states = plotFieldStates(result.features.map((f) => f.properties));
  const features = result.features.map((f): Feature => {
    const p = f.properties;
    const s = states.get(p.plot_id)!;
    const replaces = s.key === 'promoted' ? s.replaces : '';
    return { type: 'Feature', geometry: f.geometry, properties: { plot_id: p.plot_id, stratum: p.stratum, role: p.role, rank: p.rank, state: s.key, replaces } };
  });
  // Drawing order is source order (the layer's symbol-z-order): a per-feature sort key would make
  // the map issue one draw call per plot, which stalls every frame once thousands are drawn.
  const layer = (f: Feature) => DRAW_ORDER[f.properties?.state as string] ?? 2;
  return { type: 'FeatureCollection', features: features.map((f, i) => ({ f, i })).sort((a, b) => layer(a.f) - layer(b.f) || a.i - b.i).map((x) => x.f) };
}

/**
 * One footprint's ring in lon/lat around its plot. The ring is laid out in the frame (UTM, so
 * shapes and true north hold), then carried back by the frame's local linear map at the plot
 * (a forward difference over 1e-4°): over a footprint's few tens of metres the curvature of the
 * projection moves a corner by well under a millimetre, and it costs three projections a plot
 * instead of one per vertex.
 */
function footprintRingLonLat(fp: Footprint, frame: LocalFrame, lon: number, lat: number): [number, number][] | null {
  const d = 1e-4;
  const [cx, cy] = frame.toXY(lon, lat);
  // True north in grid terms differs from grid north by the meridian convergence: measure it here.
  const [nx, ny] = frame.toXY(lon, lat + d);
  const [ex, ey] = frame.toXY(lon + d, lat);
  const len = Math.hypot(nx - cx, ny - cy);
  const north = [(nx - cx) / len, (ny - cy) / len];
  const east = [north[1], -north[0]];
  // Inverse of the Jacobian [[∂x/∂lon, ∂x/∂lat], [∂y/∂lon, ∂y/∂lat]].
  const j11 = (ex - cx) / d;
  const j12 = (nx - cx) / d;
  const j21 = (ey - cy) / d;
  const j22 = (ny - cy) / d;
  const det = j11 * j22 - j12 * j21;
  const at = (e: number, n: number, angleDeg: number): [number, number] => {
    const a = (angleDeg * Math.PI) / 180;
    // Rotate clockwise from true north by the footprint angle.
    const er = e * Math.cos(a) + n * Math.sin(a);
    const nr = -e * Math.sin(a) + n * Math.cos(a);
    const dx = er * east[0] + nr * north[0];
    const dy = er * east[1] + nr * north[1];
    return [lon + (j22 * dx - j12 * dy) / det, lat + (-j21 * dx + j11 * dy) / det];
  };
  if (fp.shape === 'square' || fp.shape === 'rect') {
    const w = (fp.shape === 'square' ? fp.sideM : fp.widthM) / 2;
    const h = (fp.shape === 'square' ? fp.sideM : fp.heightM) / 2;
    const ring = [at(-w, -h, fp.angleDeg), at(w, -h, fp.angleDeg), at(w, h, fp.angleDeg), at(-w, h, fp.angleDeg)];
    return [...ring, ring[0]];
  }
  if (fp.shape === 'circle') {
    const ring: [number, number][] = [];
    for (let i = 0; i <= 48; i++) {
      const t = (i / 48) * 2 * Math.PI;
      ring.push(at(fp.radiusM * Math.cos(t), fp.radiusM * Math.sin(t), 0));
    }
    return ring;
  }
  return null;
}

/** Plot footprints (square, rectangle or circle, true-north aligned) as polygons, for high zooms. */
export function footprintsSource(result: PlotCollection | null): FeatureCollection {
  if (!result || result.features.length === 0) return EMPTY;
  const fp = result.design.settings.footprint;
  if (fp.shape === 'point') return EMPTY;
  const first = result.features[0].geometry.coordinates;
  // Any conformal frame near the plots draws the footprints true to shape; the first plot's UTM zone is one.
  const frame = localFrameAt(first[0], first[1]);
  const features: Feature<Polygon>[] = [];
  for (const f of result.features) {
    const ring = footprintRingLonLat(fp, frame, f.geometry.coordinates[0], f.geometry.coordinates[1]);
    if (!ring) continue;
    features.push({ type: 'Feature', geometry: { type: 'Polygon', coordinates: [ring] }, properties: { plot_id: f.properties.plot_id, role: f.properties.role } });
  }
  return { type: 'FeatureCollection', features };
}
