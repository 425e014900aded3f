// Paints the invented synthetic aerial image of the invented Ochre Spit Coastal Reserve from the
// demo GeoJSON files and writes demo-maps/ochre-spit-aerial.tif (GeoTIFF, RGB 8-bit, UTM 50S).
// Nothing here is a photograph: habitats are textures made of seeded value noise.
// Run: npm run demo:image [-- --dir <folder>] [-- --preview <file.ppm>]
import { readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { FeatureCollection, LineString, MultiPolygon, Polygon, Position } from 'geojson';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { localFrameAt } from '../src/core/geo/localFrame';
import { geotiffWrite } from '../src/io/formats/raster/geotiffWrite';
import { chamferDistanceM, fillRings, strokeLinePx } from './demo/raster';
import { valueNoise } from './demo/valueNoise';

/** Seed of every texture in the demo image. */
export const DEMO_IMAGE_SEED = 4_181_959;
const PIXEL_M = 2.5;
const MARGIN_M = 300;

// `--dir <folder>` reads the GeoJSON from and writes the image to another folder; `--preview <file>`
// also writes the pixels as a binary PPM for a quick look.
const argValue = (name: string) => {
  const at = process.argv.indexOf(name);
  return at > 0 ? process.argv[at + 1] : undefined;
};
const dirArg = argValue('--dir');
const dir = dirArg ? resolve(dirArg) : resolve(import.meta.dirname, '../demo-maps');
const load = (name: string) => JSON.parse(readFileSync(resolve(dir, name), 'utf8')) as FeatureCollection;
const strata = load('ochre-spit-strata.geojson');
const exclusions = load('ochre-spit-exclusions.geojson');
const boundary = load('ochre-spit-boundary.geojson');
const context = load('ochre-spit-context.geojson');

const ring0 = (boundary.features[0].geometry as Polygon).coordinates[0];
let minLon = Infinity;
let maxLon = -Infinity;
let minLat = Infinity;
let maxLat = -Infinity;
for (const [lon, lat] of ring0) {
  minLon = Math.min(minLon, lon);
  maxLon = Math.max(maxLon, lon);
  minLat = Math.min(minLat, lat);
  maxLat = Math.max(maxLat, lat);
}
const frame = localFrameAt((minLon + maxLon) / 2, (minLat + maxLat) / 2);
let minX = Infinity;
let maxX = -Infinity;
let minY = Infinity;
let maxY = -Infinity;
for (const [lon, lat] of ring0) {
  const [x, y] = frame.toXY(lon, lat);
  minX = Math.min(minX, x);
  maxX = Math.max(maxX, x);
  minY = Math.min(minY, y);
  maxY = Math.max(maxY, y);
}
const originX = Math.floor((minX - MARGIN_M) / 10) * 10;
const originY = Math.ceil((maxY + MARGIN_M) / 10) * 10;
const W = Math.ceil((maxX + MARGIN_M - originX) / PIXEL_M);
const H = Math.ceil((originY - (minY - MARGIN_M)) / PIXEL_M);
const toPx = ([lon, lat]: Position): [number, number] => {
  const [x, y] = frame.toXY(lon, lat);
  return [(x - originX) / PIXEL_M, (originY - y) / PIXEL_M];
};

// ---- classes, painted in order so later ones win
const C = { farm: 0, sea: 1, beach: 2, heath: 3, dune: 4, salt: 5, scrub: 6, wood: 7, meadow: 8, pond: 9 } as const;
const STRATUM_CLASS: Record<string, number> = {
  'Coastal heath': C.heath,
  'Dune grassland': C.dune,
  Saltmarsh: C.salt,
  'Banksia scrub': C.scrub,
  'Eucalypt woodland': C.wood,
  'Wet meadow': C.meadow,
};
const cls = new Uint8Array(W * H);

const fillPolygon = (geom: Polygon | MultiPolygon, value: number) =>
  fillRings(cls, W, H, (geom.type === 'Polygon' ? [geom.coordinates] : geom.coordinates).flat().map((r) => r.map(toPx)), value);
const strokeLine = (line: Position[], halfWidthM: number, mask: Uint8Array, value: number) =>
  strokeLinePx(mask, W, H, line.map(toPx), halfWidthM / PIXEL_M, value);

for (const f of context.features) {
  if (f.properties?.role === 'beach') fillPolygon(f.geometry as Polygon, C.beach);
}
for (const f of context.features) {
  if (f.properties?.role === 'sea') fillPolygon(f.geometry as Polygon, C.sea);
}
for (const f of strata.features) {
  fillPolygon(f.geometry as Polygon | MultiPolygon, STRATUM_CLASS[String(f.properties?.stratum)] ?? C.farm);
}
const overlay = new Uint8Array(W * H); // 1 track, 2 road, 3 creek, 4 creek bank
for (const f of exclusions.features) {
  if (f.geometry.type === 'Polygon' && f.properties?.kind === 'water') fillPolygon(f.geometry, C.pond);
  if (f.geometry.type === 'LineString' && f.properties?.kind === 'water') {
    strokeLine(f.geometry.coordinates, 7, overlay, 4);
    strokeLine(f.geometry.coordinates, 2.6, overlay, 3);
  }
}
for (const f of context.features) {
  const role = f.properties?.role;
  if (role === 'track') strokeLine((f.geometry as LineString).coordinates, 2.2, overlay, 1);
  if (role === 'road') strokeLine((f.geometry as LineString).coordinates, 3.5, overlay, 2);
  if (role === 'channel') strokeLine((f.geometry as LineString).coordinates, 5, overlay, 3);
}

const distanceFrom = (isSource: (i: number) => boolean) => chamferDistanceM(W, H, PIXEL_M, isSource);
const seaDistM = distanceFrom((i) => cls[i] !== C.sea);
const shoreDistM = distanceFrom((i) => cls[i] === C.sea);
const pondDistM = distanceFrom((i) => cls[i] === C.pond);

// ---- seeded value noise
const rng = xoroshiro128plus(DEMO_IMAGE_SEED);
const { rnd2, fbm } = valueNoise(() => uniformFloat64(rng));
const mix = (a: number[], b: number[], t: number) => [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t];
const clamp01 = (t: number) => Math.max(0, Math.min(1, t));

/** Tree crown cover at (x, y) metres: 0 in a gap, up to 1 at a crown's sunny top; -1 in its shadow. */
function crowns(x: number, y: number, spacingM: number, cover: number): number {
  const gx = Math.floor(x / spacingM);
  const gy = Math.floor(y / spacingM);
  let best = 0;
  for (let i = -1; i <= 1; i++) {
    for (let j = -1; j <= 1; j++) {
      const cx = gx + i;
      const cy = gy + j;
      if (rnd2(cx * 7 + 3, cy * 13 + 1) > cover) continue;
      const px = (cx + rnd2(cx, cy * 3 + 7)) * spacingM;
      const py = (cy + rnd2(cx * 5 + 2, cy)) * spacingM;
      const radius = spacingM * (0.35 + 0.3 * rnd2(cx + 11, cy + 29));
      const dx = x - px;
      const dy = y - py;
      const d2 = (dx * dx + dy * dy) / (radius * radius);
      if (d2 < 1) best = Math.max(best, 0.35 + 0.65 * clamp01(1 - d2) * clamp01(0.6 + (dy + dx * 0.3) / radius));
      // Sun from the north at this latitude: shadows fall to the south.
      const sy = dy + radius * 0.7;
      if (best === 0 && (dx * dx + sy * sy) / (radius * radius) < 1) best = -1;
    }
  }
  return best;
}

function colourAt(k: number, x: number, y: number, i: number): number[] {
  const big = fbm(x, y, 90);
  const mid = fbm(x, y, 14);
  const fine = rnd2(Math.floor(x / PIXEL_M), Math.floor(y / PIXEL_M) + 97);
  switch (k) {
    case C.sea: {
      const d = seaDistM[i];
      let c = mix([48, 132, 138], [18, 58, 92], clamp01(d / 320));
      c = mix(c, [12, 44, 78], clamp01((big - 0.5) * 0.6));
      const surf = clamp01(1 - Math.abs(d - 14 - 10 * mid) / 7) * (0.5 + 0.5 * fine);
      const wash = clamp01(1 - d / 10) * 0.7;
      return mix(c, [232, 238, 236], Math.max(surf * 0.85, wash));
    }
    case C.beach: {
      const wet = clamp01(1 - seaDistM[i] / 14);
      if (cliffMask[i] === 1) return mix([176, 112, 62], [122, 78, 48], clamp01(mid * 1.3 - 0.1 + (fine - 0.5) * 0.4));
      return mix(mix([228, 214, 178], [214, 198, 160], mid), [176, 164, 138], wet * 0.8);
    }
    case C.heath: {
      let c = mix([118, 112, 68], [170, 144, 86], clamp01(mid * 1.2 - 0.1 + (fine - 0.5) * 0.9));
      if (big > 0.68) c = mix(c, [206, 190, 150], clamp01((big - 0.68) * 6) * 0.7);
      const shrub = crowns(x, y, 4, 0.3 + 0.25 * mid);
      return shrub < 0 ? mix(c, [60, 56, 34], 0.5) : shrub > 0 ? mix(c, [84, 92, 50], 0.4 + 0.4 * shrub) : c;
    }
    case C.dune: {
      let c = mix([214, 202, 156], [178, 170, 118], clamp01(mid * 1.3 - 0.2 + (fine - 0.5) * 0.3));
      if (big > 0.6) c = mix(c, [234, 224, 194], clamp01((big - 0.6) * 5));
      const tussock = crowns(x, y, 3, 0.2 + 0.3 * (1 - big));
      return tussock > 0 ? mix(c, [150, 150, 96], 0.3 + 0.3 * tussock) : c;
    }
    case C.salt: {
      const chan = Math.abs(fbm(x + 500, y, 60) - 0.5);
      if (chan < 0.012 + 0.006 * mid) return [58, 82, 86];
      const c = mix([112, 134, 100], [142, 146, 112], clamp01(mid + (fine - 0.5) * 0.4));
      return big > 0.62 ? mix(c, [156, 146, 120], 0.5) : c;
    }
    case C.scrub: {
      const t = crowns(x, y, 6, 0.55 + 0.4 * mid);
      if (t < 0) return [34, 40, 26];
      const base = mix([52, 64, 40], [96, 98, 64], clamp01(mid * 1.6 - 0.3));
      return t === 0 ? mix(base, [132, 122, 88], 0.55) : mix(base, [104, 116, 70], t * 0.5 + (fine - 0.5) * 0.2);
    }
    case C.wood: {
      const t = crowns(x, y, 12, 0.6 + 0.25 * big);
      if (t < 0) return [34, 44, 30];
      if (t === 0) return mix([128, 122, 84], [100, 104, 66], clamp01(mid + (fine - 0.5) * 0.5));
      return mix([40, 72, 42], [96, 122, 70], t * 0.75 + (fine - 0.5) * 0.15);
    }
    case C.meadow: {
      const c = mix([104, 158, 58], [146, 184, 84], clamp01(mid * 1.2 - 0.1 + (fine - 0.5) * 0.3));
      // A reed fringe a few metres wide around open water.
      const reed = clamp01(1.6 - (pondDistM[i] - 10 * mid) / 10);
      return mix(c, mix([92, 96, 50], [132, 126, 72], fine), reed);
    }
    case C.pond:
      return mix([28, 52, 54], [44, 70, 66], clamp01(shoreDistM[i] > 0 ? big : mid));
    default: {
      // Outside the reserve the coastal belt carries on; inland of it, dry pasture in paddocks on
      // a cadastral grid turned off north, with fence lines.
      const fromSea = shoreDistM[i] + 60 * (big - 0.5);
      if (fromSea < 190) return colourAt(C.dune, x, y, i);
      if (fromSea < 470) return colourAt(C.heath, x, y, i);
      const u = (x * 0.978 + y * 0.208) / 260;
      // Rows of paddocks staggered from one column to the next, as subdivided farms are.
      const v = (y * 0.978 - x * 0.208) / (170 + 110 * rnd2(Math.floor(u), 3)) + rnd2(Math.floor(u), 5);
      const fu = u - Math.floor(u);
      const fv = v - Math.floor(v);
      if (fu < 0.006 || fv < 0.008) return [112, 106, 74];
      const pad = rnd2(Math.floor(u), Math.floor(v) + 41);
      const c = mix([186, 170, 116], [146, 150, 92], pad);
      return mix(c, [126, 120, 80], clamp01((mid - 0.5) * 0.8 + (fine - 0.5) * 0.2));
    }
  }
}

const cliffMask = new Uint8Array(W * H);
for (const f of exclusions.features) {
  if (f.properties?.kind === 'cliff' && f.geometry.type === 'LineString') strokeLine(f.geometry.coordinates, 28, cliffMask, 1);
}

// ---- paint
const rgb = new Uint8Array(W * H * 3);
for (let r = 0; r < H; r++) {
  for (let c = 0; c < W; c++) {
    const i = r * W + c;
    const x = originX + (c + 0.5) * PIXEL_M;
    const y = originY - (r + 0.5) * PIXEL_M;
    // Habitats blur into each other over a few metres on the ground; look up the class slightly off.
    const wc = Math.min(W - 1, Math.max(0, c + Math.round((fbm(x, y, 9) - 0.5) * 5)));
    const wr = Math.min(H - 1, Math.max(0, r + Math.round((fbm(x + 300, y, 9) - 0.5) * 5)));
    const kw = cls[wr * W + wc];
    const k = cls[i] === C.sea || kw === C.sea || cls[i] === C.pond || kw === C.pond ? cls[i] : kw;
    let col = colourAt(k, x, y, i);
    const o = overlay[i];
    const land = k !== C.sea && k !== C.pond;
    if (land && o === 4) col = k === C.salt ? col : mix(col, [38, 60, 36], 0.6);
    if (o === 3 && land) col = mix([30, 46, 44], [48, 66, 60], fbm(x, y, 20));
    if (o === 1 && land) col = mix([214, 200, 168], [190, 176, 146], fbm(x, y, 6));
    if (o === 2 && land) col = mix([168, 162, 150], [150, 146, 136], fbm(x, y, 6));
    if (land) {
      // Gentle relief: light from the north-west on a smooth height field.
      const h0 = fbm(x, y, 420);
      const shade = 1 + 7 * (fbm(x - 6, y + 6, 420) - h0);
      col = [col[0] * shade, col[1] * shade, col[2] * shade];
    }
    rgb[i * 3] = Math.max(0, Math.min(255, Math.round(col[0])));
    rgb[i * 3 + 1] = Math.max(0, Math.min(255, Math.round(col[1])));
    rgb[i * 3 + 2] = Math.max(0, Math.min(255, Math.round(col[2])));
  }
}

const tif = geotiffWrite(W, H, rgb, {
  epsg: frame.epsg,
  originX,
  originY,
  pixelSizeM: PIXEL_M,
  citation: `WGS 84 / UTM zone ${frame.utmZone} (invented synthetic image)`,
});
writeFileSync(resolve(dir, 'ochre-spit-aerial.tif'), tif);
const preview = argValue('--preview');
if (preview) {
  const head = new TextEncoder().encode(`P6\n${W} ${H}\n255\n`);
  const ppm = new Uint8Array(head.length + rgb.length);
  ppm.set(head);
  ppm.set(rgb, head.length);
  writeFileSync(preview, ppm);
}
console.log(`${W} × ${H} px at ${PIXEL_M} m, EPSG:${frame.epsg}, ${(tif.length / 1e6).toFixed(2)} MB, seed ${DEMO_IMAGE_SEED}`);
