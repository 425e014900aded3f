import type { Feature, FeatureCollection, Position } from 'geojson';
import { rngCreate, type Rng } from '../src/core/design/place/rng';
import type { BenchSite } from './benchSiteGenerate';

const COLS = 8;
const ROWS = 7;
const CELL_M = 1000;

/**
 * Offsets across a chord at `n + 1` evenly spaced stations, zero at both ends: a sum of sines of
 * whole half-waves with amplitudes falling as 1/k (a Brownian-like profile), damped by 4t(1−t)
 * near the ends so curves leaving one node stay in a narrow cone. The curve is a graph over its
 * chord, so it never crosses itself.
 */
function profile(rng: Rng, n: number, lengthM: number): Float64Array {
  const terms = 48;
  const amp = new Float64Array(terms);
  const phase = new Float64Array(terms);
  let total = 0;
  for (let k = 0; k < terms; k++) {
    amp[k] = (rng.float() * 2 - 1) / (k + 1);
    total += Math.abs(amp[k]);
  }
  for (let k = 0; k < terms; k++) phase[k] = rng.float() < 0.5 ? 1 : -1;
  const scale = (0.07 * lengthM) / total;
  const out = new Float64Array(n + 1);
  for (let i = 1; i < n; i++) {
    const t = i / n;
    let s = 0;
    for (let k = 0; k < terms; k++) s += amp[k] * phase[k] * Math.sin((k + 1) * Math.PI * t);
    // A little digitising jitter, also zero at the ends.
    s += (rng.float() - 0.5) * 0.0004 * total;
    out[i] = s * scale * 4 * t * (1 - t);
  }
  return out;
}

/** A wiggly curve from a to b of `n` segments in metres, as flat [x0, y0, x1, y1, …]. */
function edgeCurve(rng: Rng, a: [number, number], b: [number, number], n: number): Float64Array {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len = Math.hypot(dx, dy);
  const off = profile(rng, n, len);
  const nx = -dy / len;
  const ny = dx / len;
  const xy = new Float64Array(2 * (n + 1));
  for (let i = 0; i <= n; i++) {
    const t = i / n;
    xy[2 * i] = i === n ? b[0] : a[0] + dx * t + nx * off[i];
    xy[2 * i + 1] = i === n ? b[1] : a[1] + dy * t + ny * off[i];
  }
  return xy;
}

/** A closed star-shaped wiggly loop of `n` segments around (cx, cy), counter-clockwise, first point repeated. */
function loopCurve(rng: Rng, cx: number, cy: number, radiusM: number, n: number): [number, number][] {
  const terms = 24;
  const amp = Array.from({ length: terms }, (_, k) => (rng.float() * 2 - 1) / (k + 2));
  const phase = Array.from({ length: terms }, () => rng.float() * 2 * Math.PI);
  const total = amp.reduce((s, a) => s + Math.abs(a), 0);
  const pts: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    const a = (i / n) * 2 * Math.PI;
    let s = 0;
    for (let k = 0; k < terms; k++) s += amp[k] * Math.sin((k + 2) * a + phase[k]);
    const r = radiusM * (1 + (0.3 * s) / total);
    pts.push([cx + Math.cos(a) * r, cy + Math.sin(a) * r]);
  }
  pts.push(pts[0]);
  return pts;
}

/**
 * A seeded, invented vegetation-map mosaic of about `vertices` stratum vertices, shaped like a real
 * one: 56 strata on a jittered 8 × 7 grid of ~1 km cells whose shared edges are wiggly curves
 * digitised once and used by both neighbours (reversed), so every boundary is exactly shared; three
 * cells have a hole filled by an island, two islands forming one MultiPolygon stratum and the third
 * its own stratum (57 strata, 58 features). Exclusions: cliff lines of 38 km in all (30 m buffer),
 * 200 ponds (10 m), 12 private blocks and 100 hazard points (25 m). Invented data: no real place; the
 * origin is only a plausible setting on the south coast of Western Australia.
 */
export function benchMosaicGenerate(seed: number, vertices: number): BenchSite {
  const rng = rngCreate(seed);
  const lat0 = -34.6;
  const lon0 = 118.2;
  const kLat = 1 / 111320;
  const kLon = 1 / (111320 * Math.cos((lat0 * Math.PI) / 180));
  const ll = (x: number, y: number): Position => [lon0 + x * kLon, lat0 + y * kLat];
  // Nodes of the grid, jittered inside; the outline stays straight-sided at the corners.
  const node: [number, number][][] = [];
  for (let i = 0; i <= COLS; i++) {
    node.push([]);
    for (let j = 0; j <= ROWS; j++) {
      const jx = i === 0 || i === COLS ? 0 : (rng.float() - 0.5) * 0.3 * CELL_M;
      const jy = j === 0 || j === ROWS ? 0 : (rng.float() - 0.5) * 0.3 * CELL_M;
      node[i].push([i * CELL_M + jx, j * CELL_M + jy]);
    }
  }
  const inner = COLS * (ROWS - 1) + (COLS - 1) * ROWS;
  const outline = 2 * (COLS + ROWS);
  const holeSegments = 0.25;
  // Inner edges appear in two rings, outline edges (a sixteenth as dense) in one; each hole loop twice.
  const perEdge = Math.max(4, Math.round(vertices / (2 * inner + outline / 16 + 6 * holeSegments * Math.PI * 2)));
  const horizontal: Float64Array[][] = [];
  const vertical: Float64Array[][] = [];
  for (let i = 0; i < COLS; i++) {
    horizontal.push([]);
    for (let j = 0; j <= ROWS; j++) horizontal[i].push(edgeCurve(rng, node[i][j], node[i + 1][j], j === 0 || j === ROWS ? Math.max(4, perEdge >> 4) : perEdge));
  }
  for (let i = 0; i <= COLS; i++) {
    vertical.push([]);
    for (let j = 0; j < ROWS; j++) vertical[i].push(edgeCurve(rng, node[i][j], node[i][j + 1], i === 0 || i === COLS ? Math.max(4, perEdge >> 4) : perEdge));
  }
  const append = (ring: Position[], xy: Float64Array, reverse: boolean) => {
    const n = xy.length / 2;
    for (let k = 1; k < n; k++) {
      const p = reverse ? n - 1 - k : k;
      ring.push(ll(xy[2 * p], xy[2 * p + 1]));
    }
  };
  const holeCells = new Map<string, number>([
    ['2,2', 0],
    ['5,4', 1],
    ['6,1', 2],
  ]);
  const loopN = Math.max(8, Math.round(perEdge * holeSegments * Math.PI * 2));
  const islands: Position[][] = [];
  const features: Feature[] = [];
  let count = 0;
  for (let j = 0; j < ROWS; j++) {
    for (let i = 0; i < COLS; i++) {
      // Counter-clockwise: bottom edge forward, right edge up, top edge back, left edge down.
      const [sx, sy] = node[i][j];
      const shell: Position[] = [ll(sx, sy)];
      append(shell, horizontal[i][j], false);
      append(shell, vertical[i + 1][j], false);
      append(shell, horizontal[i][j + 1], true);
      append(shell, vertical[i][j], true);
      const rings: Position[][] = [shell];
      const h = holeCells.get(`${i},${j}`);
      if (h !== undefined) {
        const c = [0, 1, 2, 3].map((k) => node[i + (k & 1)][j + (k >> 1)]).reduce((a, p) => [a[0] + p[0] / 4, a[1] + p[1] / 4], [0, 0]);
        const loop = loopCurve(rng, c[0], c[1], 0.2 * CELL_M, loopN).map(([x, y]) => ll(x, y));
        islands.push(loop);
        rings.push(loop.slice().reverse());
      }
      for (const r of rings) count += r.length - 1;
      const name = `Unit ${String(j * COLS + i + 1).padStart(2, '0')}`;
      features.push({ type: 'Feature', properties: { stratum: name, invented: true }, geometry: { type: 'Polygon', coordinates: rings } });
    }
  }
  count += islands.reduce((s, r) => s + r.length - 1, 0);
  features.push({ type: 'Feature', properties: { stratum: 'Sedge islands', invented: true }, geometry: { type: 'MultiPolygon', coordinates: [[islands[0]], [islands[1]]] } });
  features.push({ type: 'Feature', properties: { stratum: 'Paperbark island', invented: true }, geometry: { type: 'Polygon', coordinates: [islands[2]] } });

  const spanX = COLS * CELL_M;
  const spanY = ROWS * CELL_M;
  const at = (margin: number): [number, number] => [margin + rng.float() * (spanX - 2 * margin), margin + rng.float() * (spanY - 2 * margin)];
  const lines: Feature[] = [];
  // Cliff lines: 20 wandering lines of 1.9 km each (38 km), a vertex every 5 m.
  for (let e = 0; e < 20; e++) {
    let [x, y] = at(1200);
    let heading = rng.float() * 2 * Math.PI;
    const coords: Position[] = [ll(x, y)];
    for (let k = 0; k < 380; k++) {
      heading += (rng.float() - 0.5) * 0.3;
      x = Math.min(spanX - 50, Math.max(50, x + 5 * Math.cos(heading)));
      y = Math.min(spanY - 50, Math.max(50, y + 5 * Math.sin(heading)));
      coords.push(ll(x, y));
    }
    lines.push({ type: 'Feature', properties: { kind: 'cliff', buffer_m: 30, invented: true }, geometry: { type: 'LineString', coordinates: coords } });
  }
  const polygons: Feature[] = [];
  for (let e = 0; e < 200; e++) {
    const [px, py] = at(100);
    const r = 8 + rng.float() * 25;
    const pond = loopCurve(rng, px, py, r, 24).map(([x, y]) => ll(x, y));
    polygons.push({ type: 'Feature', properties: { kind: 'water', buffer_m: 10, invented: true }, geometry: { type: 'Polygon', coordinates: [pond] } });
  }
  for (let e = 0; e < 12; e++) {
    const [bx, by] = at(400);
    const w = 120 + rng.float() * 200;
    const h = 100 + rng.float() * 200;
    const block = [ll(bx, by), ll(bx + w, by), ll(bx + w, by + h), ll(bx, by + h), ll(bx, by)];
    polygons.push({ type: 'Feature', properties: { kind: 'private', buffer_m: 0, invented: true }, geometry: { type: 'Polygon', coordinates: [block] } });
  }
  const points: Feature[] = [];
  for (let e = 0; e < 100; e++) {
    const [hx, hy] = at(50);
    points.push({ type: 'Feature', properties: { kind: 'hazard', buffer_m: 25, invented: true }, geometry: { type: 'Point', coordinates: ll(hx, hy) } });
  }
  const fc = (list: Feature[]): FeatureCollection => ({ type: 'FeatureCollection', features: list });
  return { strata: fc(features), lines: fc(lines), polygons: fc(polygons), points: fc(points), vertices: count };
}
