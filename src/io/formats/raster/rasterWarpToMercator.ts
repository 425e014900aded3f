import { geodesicDistanceM } from '../../../core/geo/bearingDistance';
import { InputError } from '../../../core/common/InputError';
import type { LonLat } from '../../../core/model/types';
import type { CrsTransform } from '../../crs/crsResolve';
import { warpMappingLattice } from './warpMappingLattice';

/** Sphere radius of Web Mercator (EPSG:3857), metres. */
const MERC_R = 6378137;
const DEG = Math.PI / 180;
/** Web Mercator's latitude limit, where the square world ends (EPSG:3857). */
const MERC_MAX_LAT = 85.0511287798;

/** Decoded pixels of a source image: 4 bytes per pixel, rows top to bottom. */
export interface RgbaRaster {
  width: number;
  height: number;
  rgba: Uint8ClampedArray | Uint8Array;
}

/**
 * Pixel → source CRS affine, GDAL geotransform order, pixel CORNER based:
 * x = t[0] + t[1]·col + t[2]·row, y = t[3] + t[4]·col + t[5]·row, where (0, 0) is the outer
 * corner of the top-left pixel and (0.5, 0.5) its centre.
 */
export type PixelGeoTransform = readonly [number, number, number, number, number, number];

/** A raster resampled onto a Web Mercator grid, ready for a maplibre `image` source. */
export interface WarpedImage {
  width: number;
  height: number;
  /** 4 bytes per pixel, rows north to south; alpha 0 where the source has no data. */
  rgba: Uint8ClampedArray;
  /** [lon, lat] of the outer corners: top-left, top-right, bottom-right, bottom-left. */
  corners: [LonLat, LonLat, LonLat, LonLat];
  /** EPSG code of the source image's CRS (null when it came from a bare definition). */
  sourceEpsg: number | null;
  /** Ground size of one output pixel at the image centre, metres (geodesic, mean of x and y). */
  pixelSizeM: number;
  /** Ground size of one source pixel at the image centre, metres. */
  sourcePixelSizeM: number;
  /** Largest error, in source pixels, of the interpolated pixel mapping against exact projection. */
  mappingErrorPx: number;
}

export interface WarpOptions {
  /** Longest side of the output, pixels (default 2048). */
  maxSizePx?: number;
  /** Resampling of source pixels (default 'bilinear'). */
  resampling?: 'bilinear' | 'nearest';
}

function mercX(lon: number): number {
  return MERC_R * lon * DEG;
}
function mercY(lat: number): number {
  return MERC_R * Math.log(Math.tan(Math.PI / 4 + (lat * DEG) / 2));
}
function mercLat(y: number): number {
  return Math.atan(Math.sinh(y / MERC_R)) / DEG;
}

function invertGeoTransform(t: PixelGeoTransform): PixelGeoTransform {
  const det = t[1] * t[5] - t[2] * t[4];
  if (!Number.isFinite(det) || Math.abs(det) < 1e-300) {
    throw new InputError('the image georeferencing has zero pixel size (its transform cannot be inverted)');
  }
  // col = i0 + i1·(x − t0) + i2·(y − t3), row = j0 + …
  return [t[5] / det, -t[2] / det, -t[4] / det, t[1] / det, t[0], t[3]];
}

function groundDistanceM(a: LonLat, b: LonLat): number {
  return geodesicDistanceM(a[0], a[1], b[0], b[1]);
}

/**
 * Warps a georeferenced RGBA raster onto a Web Mercator aligned grid, pixel by pixel: each output
 * pixel centre goes Mercator x,y → lon/lat → source CRS → source pixel, sampled bilinearly (or
 * nearest). The exact chain is evaluated on a lattice of nodes and interpolated between them; the
 * lattice is refined until the interpolation error is below 0.02 source pixels (the approximate
 * transformer idea of GDAL's gdalwarp, whose default tolerance is 0.125 px). The result placed by
 * its four corners in a maplibre image source lands where the source pixels are.
 * Formulas: spherical Web Mercator as defined for EPSG:3857 (IOGP Guidance Note 7-2, method 1024).
 * @param source decoded pixels, 4 bytes each
 * @param transform pixel corner → source CRS affine
 * @param crs source CRS with its WGS84 transforms
 * @returns the warped image; throws InputError when the image lies outside Web Mercator's range
 */
export function rasterWarpToMercator(
  source: RgbaRaster,
  transform: PixelGeoTransform,
  crs: CrsTransform,
  options: WarpOptions = {},
): WarpedImage {
  const maxSizePx = options.maxSizePx ?? 2048;
  if (!(Number.isInteger(maxSizePx) && maxSizePx >= 2 && maxSizePx <= 16384)) {
    throw new InputError(`maximum image size ${maxSizePx} px must be a whole number from 2 to 16384`);
  }
  const { width: sw, height: sh } = source;
  if (!(sw > 0 && sh > 0) || source.rgba.length < sw * sh * 4) {
    throw new InputError(`the image pixels (${sw} × ${sh}) do not match the decoded data`);
  }
  const toLonLat = (col: number, row: number): LonLat => {
    const x = transform[0] + transform[1] * col + transform[2] * row;
    const y = transform[3] + transform[4] * col + transform[5] * row;
    return crs.toWgs84(x, y);
  };

  // Footprint: the outline sampled densely, longitudes unwrapped against the first corner.
  let minLon = Infinity;
  let maxLon = -Infinity;
  let minLat = Infinity;
  let maxLat = -Infinity;
  const edgeSteps = 64;
  const lon0 = toLonLat(0, 0)[0];
  for (let k = 0; k <= edgeSteps; k++) {
    const f = k / edgeSteps;
    for (const [c, r] of [
      [f * sw, 0],
      [sw, f * sh],
      [f * sw, sh],
      [0, f * sh],
    ]) {
      const p = toLonLat(c, r);
      if (!Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
        throw new InputError(`the image corner region at pixel ${c}, ${r} does not project to longitude/latitude`);
      }
      const lon = p[0] + 360 * Math.round((lon0 - p[0]) / 360);
      minLon = Math.min(minLon, lon);
      maxLon = Math.max(maxLon, lon);
      minLat = Math.min(minLat, p[1]);
      maxLat = Math.max(maxLat, p[1]);
    }
  }
  if (minLat < -MERC_MAX_LAT || maxLat > MERC_MAX_LAT) {
    throw new InputError(
      `the image reaches latitude ${(minLat < -MERC_MAX_LAT ? minLat : maxLat).toFixed(3)}°, beyond the map's ±85.05° limit`,
    );
  }
  if (maxLon - minLon >= 180) {
    throw new InputError(`the image spans ${(maxLon - minLon).toFixed(1)}° of longitude; imagery must cover less than 180°`);
  }

  const cc = toLonLat(sw / 2, sh / 2);
  const srcPxX = groundDistanceM(toLonLat(sw / 2 - 0.5, sh / 2), toLonLat(sw / 2 + 0.5, sh / 2));
  const srcPxY = groundDistanceM(toLonLat(sw / 2, sh / 2 - 0.5), toLonLat(sw / 2, sh / 2 + 0.5));
  const sourcePixelSizeM = Math.sqrt(srcPxX * srcPxY);

  const mx0 = mercX(minLon);
  const mx1 = mercX(maxLon);
  const my0 = mercY(minLat);
  const my1 = mercY(maxLat);
  // Mercator metres per ground metre is 1/cos(lat) on the sphere: keep the source's ground resolution.
  let cellM = sourcePixelSizeM / Math.cos(cc[1] * DEG);
  const longest = Math.max(mx1 - mx0, my1 - my0);
  if (longest / cellM > maxSizePx) cellM = longest / maxSizePx;
  const ow = Math.max(1, Math.min(maxSizePx, Math.ceil((mx1 - mx0) / cellM)));
  const oh = Math.max(1, Math.min(maxSizePx, Math.ceil((my1 - my0) / cellM)));
  const dxM = (mx1 - mx0) / ow;
  const dyM = (my1 - my0) / oh;

  const inv = invertGeoTransform(transform);
  const colLon = new Float64Array(ow);
  for (let i = 0; i < ow; i++) colLon[i] = (mx0 + (i + 0.5) * dxM) / MERC_R / DEG;
  const rowLat = new Float64Array(oh);
  for (let j = 0; j < oh; j++) rowLat[j] = mercLat(my1 - (j + 0.5) * dyM);
  // Exact source pixel (centre based: 0 is the centre of the first pixel) of output pixel i, j.
  const exact = (i: number, j: number, out: Float64Array, at: number) => {
    const [x, y] = crs.fromWgs84(colLon[i], rowLat[j]);
    const dx = x - inv[4];
    const dy = y - inv[5];
    out[at] = inv[0] * dx + inv[1] * dy - 0.5;
    out[at + 1] = inv[2] * dx + inv[3] * dy - 0.5;
  };

  const { map: srcPos, errorPx } = warpMappingLattice(ow, oh, exact);
  const rgba = new Uint8ClampedArray(ow * oh * 4);
  if (options.resampling === 'nearest') sampleNearest(source, srcPos, rgba);
  else sampleBilinear(source, srcPos, rgba);

  const lonW = minLon;
  const lonE = maxLon;
  const pixelSizeM =
    (groundDistanceM([cc[0] - (dxM / MERC_R / DEG) / 2, cc[1]], [cc[0] + (dxM / MERC_R / DEG) / 2, cc[1]]) +
      groundDistanceM([cc[0], mercLat(mercY(cc[1]) - dyM / 2)], [cc[0], mercLat(mercY(cc[1]) + dyM / 2)])) /
    2;
  return {
    width: ow,
    height: oh,
    rgba,
    corners: [
      [lonW, maxLat],
      [lonE, maxLat],
      [lonE, minLat],
      [lonW, minLat],
    ],
    sourceEpsg: crs.epsg,
    pixelSizeM,
    sourcePixelSizeM,
    mappingErrorPx: errorPx,
  };
}

function sampleNearest(source: RgbaRaster, pos: Float32Array, out: Uint8ClampedArray): void {
  const { width: sw, height: sh, rgba: src } = source;
  const n = out.length / 4;
  for (let p = 0; p < n; p++) {
    const c = Math.round(pos[p * 2]);
    const r = Math.round(pos[p * 2 + 1]);
    if (c < 0 || r < 0 || c >= sw || r >= sh) continue;
    const s = (r * sw + c) * 4;
    out[p * 4] = src[s];
    out[p * 4 + 1] = src[s + 1];
    out[p * 4 + 2] = src[s + 2];
    out[p * 4 + 3] = src[s + 3];
  }
}

function sampleBilinear(source: RgbaRaster, pos: Float32Array, out: Uint8ClampedArray): void {
  const { width: sw, height: sh, rgba: src } = source;
  const n = out.length / 4;
  for (let p = 0; p < n; p++) {
    const x = pos[p * 2];
    const y = pos[p * 2 + 1];
    // Outside the outer pixel edges there is no image; inside the outer half pixel, clamp.
    if (x < -0.5 || y < -0.5 || x > sw - 0.5 || y > sh - 0.5) continue;
    const xc = Math.min(Math.max(x, 0), sw - 1);
    const yc = Math.min(Math.max(y, 0), sh - 1);
    const c0 = Math.min(Math.floor(xc), Math.max(sw - 2, 0));
    const r0 = Math.min(Math.floor(yc), Math.max(sh - 2, 0));
    const c1 = Math.min(c0 + 1, sw - 1);
    const r1 = Math.min(r0 + 1, sh - 1);
    const fx = xc - c0;
    const fy = yc - r0;
    const w00 = (1 - fx) * (1 - fy);
    const w10 = fx * (1 - fy);
    const w01 = (1 - fx) * fy;
    const w11 = fx * fy;
    const s00 = (r0 * sw + c0) * 4;
    const s10 = (r0 * sw + c1) * 4;
    const s01 = (r1 * sw + c0) * 4;
    const s11 = (r1 * sw + c1) * 4;
    // Weight colour by alpha so transparent neighbours do not darken the edge.
    const a00 = src[s00 + 3] * w00;
    const a10 = src[s10 + 3] * w10;
    const a01 = src[s01 + 3] * w01;
    const a11 = src[s11 + 3] * w11;
    const a = a00 + a10 + a01 + a11;
    if (a <= 0) continue;
    const o = p * 4;
    for (let c = 0; c < 3; c++) {
      out[o + c] = (src[s00 + c] * a00 + src[s10 + c] * a10 + src[s01 + c] * a01 + src[s11 + c] * a11) / a + 0.5;
    }
    out[o + 3] = a + 0.5;
  }
}
