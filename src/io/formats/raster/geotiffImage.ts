import { fromArrayBuffer, type GeoTIFFImage, type TypedArray } from 'geotiff';
import { InputError } from '../../../core/common/InputError';
import { type CrsTransform, crsFromDefinition, crsResolveEpsg } from '../../crs/crsResolve';
import { type PixelGeoTransform, type RgbaRaster, rasterWarpToMercator, type WarpedImage } from './rasterWarpToMercator';
import { worldFileParse, worldFileToGeoTransform } from './worldFileImage';

export type { WarpedImage } from './rasterWarpToMercator';

export interface GeotiffImageOptions {
  /** File name used in messages (default "image.tif"). */
  fileName?: string;
  /** Longest side of the warped output, pixels (default 2048). */
  maxSizePx?: number;
  resampling?: 'bilinear' | 'nearest';
  /** EPSG code to use when the file carries none (or a user-defined one). */
  epsg?: number;
  /** proj4 definition to use instead of the file's code, e.g. for a CRS we do not carry. */
  proj4Definition?: string;
  /** Contents of a .tfw world file for a plain TIFF; replaces the file's own georeferencing. */
  worldFileText?: string;
  /** Name of that world file, for messages (default "image.tfw"). */
  worldFileName?: string;
}

/** GeoTIFF key values (GeoTIFF 1.1, OGC 19-008r4, clause 7). */
const USER_DEFINED = 32767;
const RASTER_PIXEL_IS_POINT = 2;
const MODEL_GEOGRAPHIC = 2;
/** TIFF 6.0 PhotometricInterpretation and ExtraSamples codes. */
const PI_WHITE_IS_ZERO = 0;
const PI_BLACK_IS_ZERO = 1;
const PI_RGB = 2;
const PI_PALETTE = 3;

type GeoKeys = Partial<Record<string, unknown>>;

function sourceCrs(keys: GeoKeys | null, options: GeotiffImageOptions, where: string): CrsTransform {
  if (options.proj4Definition) {
    return crsFromDefinition(options.proj4Definition, 'given definition', options.epsg ?? null, where);
  }
  if (options.epsg !== undefined) return crsResolveEpsg(options.epsg, where);
  const projected = Number(keys?.ProjectedCSTypeGeoKey);
  const geographic = Number(keys?.GeographicTypeGeoKey);
  const model = Number(keys?.GTModelTypeGeoKey);
  let code = 0;
  if (Number.isInteger(projected) && projected > 0 && model !== MODEL_GEOGRAPHIC) code = projected;
  else if (Number.isInteger(geographic) && geographic > 0) code = geographic;
  if (code === USER_DEFINED) {
    throw new InputError(
      `${where}: the image uses a user-defined coordinate system; give its EPSG code or a proj4 definition`,
    );
  }
  if (code === 0) {
    throw new InputError(`${where}: the image names no coordinate system (no EPSG code in its GeoTIFF keys); give its EPSG code`);
  }
  return crsResolveEpsg(code, `${where} (EPSG:${code} from its GeoTIFF keys; give a proj4 definition for it)`);
}

async function pixelTransform(image: GeoTIFFImage, keys: GeoKeys | null, where: string): Promise<PixelGeoTransform> {
  const dir = image.getFileDirectory();
  const m = (await dir.loadValue('ModelTransformation')) as number[] | undefined;
  const tie = (await dir.loadValue('ModelTiepoint')) as number[] | undefined;
  const scale = (await dir.loadValue('ModelPixelScale')) as number[] | undefined;
  let t: [number, number, number, number, number, number];
  if (m && m.length >= 8) {
    t = [m[3], m[0], m[1], m[7], m[4], m[5]];
  } else if (tie && tie.length >= 6 && scale && scale.length >= 2) {
    const [i, j, , x, y] = tie;
    t = [x - i * scale[0], scale[0], 0, y + j * scale[1], 0, -scale[1]];
  } else {
    throw new InputError(`${where}: the image has no georeferencing (no ModelTiepoint + ModelPixelScale or ModelTransformation tag)`);
  }
  if (!t.every(Number.isFinite)) throw new InputError(`${where}: the image georeferencing holds a value that is not a number`);
  // PixelIsPoint puts raster (0, 0) at the centre of the first pixel (GeoTIFF 1.1 clause 7.2.3).
  if (Number(keys?.GTRasterTypeGeoKey) === RASTER_PIXEL_IS_POINT) {
    t[0] -= 0.5 * (t[1] + t[2]);
    t[3] -= 0.5 * (t[4] + t[5]);
  }
  return t;
}

/** 8-bit copy of one band: as is for 8-bit data, else a 0.5–99.5 % linear stretch (common practice, no source). */
function bandToBytes(band: TypedArray, valid: Uint8Array, isByte: boolean): Uint8Array {
  if (isByte) return band as Uint8Array;
  const sample: number[] = [];
  const stride = Math.max(1, Math.floor(band.length / 20000));
  for (let k = 0; k < band.length; k += stride) if (valid[k] && Number.isFinite(band[k])) sample.push(band[k]);
  sample.sort((a, b) => a - b);
  const lo = sample.length ? sample[Math.floor(sample.length * 0.005)] : 0;
  const hi = sample.length ? sample[Math.min(sample.length - 1, Math.floor(sample.length * 0.995))] : 1;
  const k = hi > lo ? 255 / (hi - lo) : 0;
  const out = new Uint8Array(band.length);
  for (let p = 0; p < band.length; p++) out[p] = Math.max(0, Math.min(255, Math.round((band[p] - lo) * k)));
  return out;
}

async function decodeRgba(image: GeoTIFFImage, rw: number, rh: number, where: string): Promise<RgbaRaster> {
  const dir = image.getFileDirectory();
  const pi = Number(dir.getValue('PhotometricInterpretation') ?? PI_BLACK_IS_ZERO);
  const n = rw * rh;
  const rgba = new Uint8ClampedArray(n * 4);
  const read = { width: rw, height: rh, resampleMethod: 'bilinear' } as const;
  if (pi !== PI_RGB && pi !== PI_BLACK_IS_ZERO && pi !== PI_WHITE_IS_ZERO) {
    // Palette, YCbCr, CMYK, CIELab: geotiff's own conversion to 8-bit RGB.
    let rgb: ArrayLike<number>;
    try {
      rgb = await image.readRGB({ ...read, resampleMethod: pi === PI_PALETTE ? 'nearest' : 'bilinear', interleave: true });
    } catch {
      throw new InputError(`${where}: colour type ${pi} (TIFF PhotometricInterpretation) cannot be shown; save it as RGB`);
    }
    for (let p = 0; p < n; p++) {
      rgba[p * 4] = rgb[p * 3];
      rgba[p * 4 + 1] = rgb[p * 3 + 1];
      rgba[p * 4 + 2] = rgb[p * 3 + 2];
      rgba[p * 4 + 3] = 255;
    }
    return { width: rw, height: rh, rgba };
  }
  const samples = image.getSamplesPerPixel();
  const colourBands = pi === PI_RGB ? 3 : 1;
  if (samples < colourBands) throw new InputError(`${where}: an RGB image needs 3 bands, this one has ${samples}`);
  const extra = (dir.getValue('ExtraSamples') as number[] | number | undefined) ?? [];
  const firstExtra = Array.isArray(extra) ? extra[0] : extra;
  const hasAlpha = samples > colourBands && (firstExtra === 1 || firstExtra === 2);
  const wanted = Array.from({ length: colourBands + (hasAlpha ? 1 : 0) }, (_, k) => k);
  const bands = (await image.readRasters({ ...read, samples: wanted, interleave: false })) as unknown as TypedArray[];
  const noData = image.getGDALNoData();
  const valid = new Uint8Array(n).fill(1);
  if (noData !== null && Number.isFinite(noData)) {
    for (let p = 0; p < n; p++) {
      let allNoData = true;
      for (let b = 0; b < colourBands; b++) if (bands[b][p] !== noData) allNoData = false;
      if (allNoData) valid[p] = 0;
    }
  }
  const isByte = image.getBitsPerSample(0) === 8 && image.getSampleFormat(0) === 1;
  const bytes = bands.slice(0, colourBands).map((b) => bandToBytes(b, valid, isByte));
  const alpha = hasAlpha ? bandToBytes(bands[colourBands], valid, image.getBitsPerSample(colourBands) === 8) : null;
  const invert = pi === PI_WHITE_IS_ZERO;
  for (let p = 0; p < n; p++) {
    for (let c = 0; c < 3; c++) {
      const v = bytes[colourBands === 3 ? c : 0][p];
      rgba[p * 4 + c] = invert ? 255 - v : v;
    }
    rgba[p * 4 + 3] = valid[p] ? (alpha ? alpha[p] : 255) : 0;
  }
  return { width: rw, height: rh, rgba };
}

/**
 * Reads a GeoTIFF (first image) and warps it onto a Web Mercator grid for display by its four
 * corners. The CRS comes from ProjectedCSTypeGeoKey or GeographicTypeGeoKey (GeoTIFF 1.1,
 * OGC 19-008r4) resolved by our EPSG table; pixel placement from ModelTransformation or
 * ModelTiepoint + ModelPixelScale, PixelIsPoint honoured, or from a .tfw world file given in
 * the options (a plain TIFF then needs `epsg`). Images much larger than the output are
 * decoded at reduced size first. 8-bit bands are used as they are; other depths are stretched.
 * @param bytes the whole file
 * @returns warped RGBA, corners [lon, lat] (top-left, top-right, bottom-right, bottom-left), EPSG, pixel size (m)
 * @throws InputError when the file is not a TIFF, has no georeferencing, or names an unknown CRS
 */
export async function geotiffImageWarp(
  bytes: ArrayBuffer | Uint8Array,
  options: GeotiffImageOptions = {},
): Promise<WarpedImage> {
  const where = options.fileName ?? 'image.tif';
  const buffer =
    bytes instanceof Uint8Array ? (bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer) : bytes;
  let image: GeoTIFFImage;
  try {
    const tiff = await fromArrayBuffer(buffer);
    image = await tiff.getImage(0);
  } catch {
    throw new InputError(`${where}: not a readable TIFF file`);
  }
  const keys = (await image.getGeoKeys()) as GeoKeys | null;
  const crs = sourceCrs(keys, options, where);
  const transform =
    options.worldFileText !== undefined
      ? worldFileToGeoTransform(worldFileParse(options.worldFileText, options.worldFileName ?? 'image.tfw'))
      : await pixelTransform(image, keys, where);
  const w = image.getWidth();
  const h = image.getHeight();
  // Decoding more than ~1.5 source pixels per output pixel only costs memory.
  const maxSizePx = options.maxSizePx ?? 2048;
  const shrink = Math.max(1, Math.max(w, h) / (maxSizePx * 1.5));
  const rw = Math.max(1, Math.round(w / shrink));
  const rh = Math.max(1, Math.round(h / shrink));
  let source: RgbaRaster;
  try {
    source = await decodeRgba(image, rw, rh, where);
  } catch (error) {
    if (error instanceof InputError) throw error;
    throw new InputError(`${where}: the image pixels could not be decoded (${(error as Error).message})`);
  }
  const sx = w / rw;
  const sy = h / rh;
  const scaled: PixelGeoTransform = [transform[0], transform[1] * sx, transform[2] * sy, transform[3], transform[4] * sx, transform[5] * sy];
  return rasterWarpToMercator(source, scaled, crs, { maxSizePx, resampling: options.resampling });
}
