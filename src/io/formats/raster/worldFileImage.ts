import { InputError } from '../../../core/common/InputError';
import { type CrsTransform, crsFromDefinition, crsResolveEpsg } from '../../crs/crsResolve';
import {
  type PixelGeoTransform,
  type RgbaRaster,
  rasterWarpToMercator,
  type WarpedImage,
  type WarpOptions,
} from './rasterWarpToMercator';

/**
 * The six numbers of a world file (.pgw, .jgw, .tfw, .wld), in file order A, D, B, E, C, F:
 * x = A·col + B·row + C, y = D·col + E·row + F, where (col, row) = (0, 0) is the CENTRE of the
 * top-left pixel. Units are those of the CRS the file is used with (it names none).
 */
export interface WorldFile {
  a: number;
  d: number;
  b: number;
  e: number;
  c: number;
  f: number;
}

const NAMES = ['A (x size of a pixel)', 'D (row rotation)', 'B (column rotation)', 'E (y size of a pixel, negative)', 'C (x of the top-left pixel centre)', 'F (y of the top-left pixel centre)'];
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Parses a world file. Blank lines at the end are allowed; anything else must be six numbers,
 * one per line, with a point as the decimal mark.
 * Source: the world file layout as documented for ESRI ArcGIS ("World files for raster
 * datasets") and GDAL's WLD reader.
 * @param text the file's contents
 * @param fileName used in messages
 * @throws InputError naming the file and line for a missing, extra or malformed value, or
 *   pixel sizes that make the transform degenerate
 */
export function worldFileParse(text: string, fileName = 'world file'): WorldFile {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  while (lines.length > 0 && lines[lines.length - 1].trim() === '') lines.pop();
  if (lines.length !== 6) {
    throw new InputError(`${fileName}: a world file has 6 lines (A, D, B, E, C, F); this one has ${lines.length}`);
  }
  const v = lines.map((raw, k) => {
    const s = raw.trim();
    if (NUMBER.test(s)) return Number(s);
    if (/^[+-]?\d*,\d+$/.test(s)) {
      throw new InputError(`${fileName}, line ${k + 1}: "${s}" uses a comma; world files use a point as the decimal mark`);
    }
    throw new InputError(`${fileName}, line ${k + 1}: ${NAMES[k]} must be a number, found "${s}"`);
  });
  const wf: WorldFile = { a: v[0], d: v[1], b: v[2], e: v[3], c: v[4], f: v[5] };
  if (wf.a === 0 && wf.b === 0) throw new InputError(`${fileName}, line 1: A (x size of a pixel) is 0`);
  if (wf.e === 0 && wf.d === 0) throw new InputError(`${fileName}, line 4: E (y size of a pixel) is 0`);
  if (wf.a * wf.e - wf.b * wf.d === 0) {
    throw new InputError(`${fileName}: lines 1–4 give pixels of no area (A·E − B·D = 0)`);
  }
  return wf;
}

/** The world file as a pixel-corner geotransform (shifts C, F back by half a pixel). */
export function worldFileToGeoTransform(wf: WorldFile): PixelGeoTransform {
  return [wf.c - 0.5 * wf.a - 0.5 * wf.b, wf.a, wf.b, wf.f - 0.5 * wf.d - 0.5 * wf.e, wf.d, wf.e];
}

/** The CRS to pair with a world file: an EPSG code from our table, or a proj4 definition. */
export type WorldFileCrs = number | { epsg?: number; proj4Definition: string };

function resolveCrs(crs: WorldFileCrs, where: string): CrsTransform {
  if (typeof crs === 'number') return crsResolveEpsg(crs, where);
  return crsFromDefinition(crs.proj4Definition, 'given definition', crs.epsg ?? null, where);
}

/**
 * Warps a decoded PNG/JPEG with its world file onto a Web Mercator grid (see
 * rasterWarpToMercator). Decoding happens in the browser (createImageBitmap → canvas →
 * getImageData) so this stays pure. Checks that the world file's numbers suit the CRS: degrees
 * for a geographic one, and not degree-sized values for a projected one.
 * @param pixels decoded RGBA
 * @param worldFileText contents of the .pgw/.jgw/.tfw/.wld
 * @param crs EPSG code or proj4 definition of the coordinates in the world file
 * @param options output size, resampling, and the file names used in messages
 * @throws InputError for a malformed world file, an unknown EPSG code, or coordinates that do
 *   not fit the chosen CRS
 */
export function worldFileImageWarp(
  pixels: RgbaRaster,
  worldFileText: string,
  crs: WorldFileCrs,
  options: WarpOptions & { worldFileName?: string } = {},
): WarpedImage {
  const where = options.worldFileName ?? 'world file';
  const wf = worldFileParse(worldFileText, where);
  const transform = resolveCrs(crs, where);
  const label = typeof crs === 'number' ? `EPSG:${crs}` : 'the given coordinate system';
  const degreeLike = Math.abs(wf.c) <= 180 && Math.abs(wf.f) <= 90 && Math.abs(wf.a) < 0.01;
  if (transform.isGeographic && !(Math.abs(wf.c) <= 540 && Math.abs(wf.f) <= 90)) {
    throw new InputError(`${where}: the top-left pixel ${wf.c}, ${wf.f} is not a longitude/latitude, but ${label} is in degrees`);
  }
  if (!transform.isGeographic && degreeLike) {
    throw new InputError(`${where}: the top-left pixel ${wf.c}, ${wf.f} looks like degrees, but ${label} is in metres; choose a geographic EPSG code such as 4326`);
  }
  return rasterWarpToMercator(pixels, worldFileToGeoTransform(wf), transform, options);
}
