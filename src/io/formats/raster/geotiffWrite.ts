import { zlibSync } from 'fflate';
import { InputError } from '../../../core/common/InputError';

/** Where a north-up raster sits in a projected CRS. */
export interface GeoTiffPlacement {
  /** EPSG code of the projected CRS, e.g. 32750 for WGS 84 / UTM zone 50S. */
  epsg: number;
  /** Easting of the top-left corner of the top-left pixel, in CRS units (metres). */
  originX: number;
  /** Northing of the top-left corner of the top-left pixel, in CRS units (metres). */
  originY: number;
  /** Pixel width and height on the ground, in CRS units (metres), both positive. */
  pixelSizeM: number;
  /** Text put in GTCitationGeoKey, e.g. "WGS 84 / UTM zone 50S". */
  citation?: string;
}

export interface GeoTiffWriteOptions {
  /** 'deflate' (TIFF compression 8, zlib stream) or 'none'. Default 'deflate'. */
  compression?: 'deflate' | 'none';
  /** Rows per strip; default 64. */
  rowsPerStrip?: number;
}

// Tag and GeoKey numbers: TIFF 6.0 (Adobe 1992) §8 and OGC GeoTIFF 1.1 (OGC 19-008r4) §7.
const TAG = {
  ImageWidth: 256,
  ImageLength: 257,
  BitsPerSample: 258,
  Compression: 259,
  Photometric: 262,
  StripOffsets: 273,
  SamplesPerPixel: 277,
  RowsPerStrip: 278,
  StripByteCounts: 279,
  PlanarConfiguration: 284,
  SampleFormat: 339,
  ModelPixelScale: 33550,
  ModelTiepoint: 33922,
  GeoKeyDirectory: 34735,
  GeoAsciiParams: 34737,
} as const;
const SHORT = 3;
const LONG = 4;
const ASCII = 2;
const DOUBLE = 12;
const TYPE_SIZE: Record<number, number> = { [ASCII]: 1, [SHORT]: 2, [LONG]: 4, [DOUBLE]: 8 };

interface Entry {
  tag: number;
  type: number;
  values: number[] | string;
}

/**
 * Encodes an 8-bit RGB raster as a little-endian baseline GeoTIFF: chunky pixels (PlanarConfiguration
 * 1) in strips, optionally Deflate-compressed, placed by ModelPixelScale + ModelTiepoint and a
 * GeoKeyDirectory naming a projected CRS by EPSG code (ProjectedCSTypeGeoKey), pixels as areas.
 * @param width pixels per row; @param height rows; @param rgb width × height × 3 bytes, row-major.
 * @returns the file's bytes.
 * Throws InputError when the sizes disagree, the placement is not finite and positive, or the EPSG
 * code is not a projected CRS's.
 * Sources: TIFF Revision 6.0 (Adobe, 1992); OGC GeoTIFF Standard 1.1 (OGC 19-008r4, 2019).
 */
export function geotiffWrite(
  width: number,
  height: number,
  rgb: Uint8Array,
  place: GeoTiffPlacement,
  options: GeoTiffWriteOptions = {},
): Uint8Array {
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new InputError(`GeoTIFF: image size ${width} × ${height} must be whole positive numbers of pixels`);
  }
  if (rgb.length !== width * height * 3) {
    throw new InputError(`GeoTIFF: ${rgb.length} bytes of pixels given, ${width} × ${height} RGB needs ${width * height * 3}`);
  }
  if (!(place.pixelSizeM > 0) || !Number.isFinite(place.originX) || !Number.isFinite(place.originY)) {
    throw new InputError('GeoTIFF: origin must be finite and pixel size positive');
  }
  // EPSG codes 4000–4999 are geographic (lon/lat) CRSs, which belong in GeographicTypeGeoKey instead.
  if (!Number.isInteger(place.epsg) || place.epsg < 1024 || place.epsg > 32766 || (place.epsg >= 4000 && place.epsg < 5000)) {
    throw new InputError(`GeoTIFF: EPSG code ${place.epsg} is not a projected CRS code`);
  }
  const compression = options.compression ?? 'deflate';
  const rowsPerStrip = Math.max(1, Math.min(height, options.rowsPerStrip ?? 64));
  const strips: Uint8Array[] = [];
  for (let y = 0; y < height; y += rowsPerStrip) {
    const raw = rgb.subarray(y * width * 3, Math.min(height, y + rowsPerStrip) * width * 3);
    strips.push(compression === 'deflate' ? zlibSync(raw, { level: 9 }) : raw);
  }

  const citation = `${place.citation ?? `EPSG:${place.epsg}`}|`;
  // GeoKeyDirectory: header (version 1, revision 1.1, key count) then [key, location, count, value].
  const keys: number[][] = [
    [1024, 0, 1, 1], // GTModelTypeGeoKey = ModelTypeProjected
    [1025, 0, 1, 1], // GTRasterTypeGeoKey = RasterPixelIsArea
    [1026, TAG.GeoAsciiParams, citation.length, 0], // GTCitationGeoKey
    [3072, 0, 1, place.epsg], // ProjectedCSTypeGeoKey
    [3076, 0, 1, 9001], // ProjLinearUnitsGeoKey = metre
  ];
  const geoKeys = [1, 1, 1, keys.length, ...keys.flat()];

  const entries: Entry[] = [
    { tag: TAG.ImageWidth, type: LONG, values: [width] },
    { tag: TAG.ImageLength, type: LONG, values: [height] },
    { tag: TAG.BitsPerSample, type: SHORT, values: [8, 8, 8] },
    { tag: TAG.Compression, type: SHORT, values: [compression === 'deflate' ? 8 : 1] },
    { tag: TAG.Photometric, type: SHORT, values: [2] },
    { tag: TAG.StripOffsets, type: LONG, values: strips.map(() => 0) },
    { tag: TAG.SamplesPerPixel, type: SHORT, values: [3] },
    { tag: TAG.RowsPerStrip, type: LONG, values: [rowsPerStrip] },
    { tag: TAG.StripByteCounts, type: LONG, values: strips.map((s) => s.length) },
    { tag: TAG.PlanarConfiguration, type: SHORT, values: [1] },
    { tag: TAG.SampleFormat, type: SHORT, values: [1, 1, 1] },
    { tag: TAG.ModelPixelScale, type: DOUBLE, values: [place.pixelSizeM, place.pixelSizeM, 0] },
    { tag: TAG.ModelTiepoint, type: DOUBLE, values: [0, 0, 0, place.originX, place.originY, 0] },
    { tag: TAG.GeoKeyDirectory, type: SHORT, values: geoKeys },
    { tag: TAG.GeoAsciiParams, type: ASCII, values: citation },
  ];

  // Layout: header (8) | IFD | out-of-line values | strips.
  const ifdSize = 2 + entries.length * 12 + 4;
  const valueBytes = (e: Entry) => (typeof e.values === 'string' ? e.values.length + 1 : e.values.length) * TYPE_SIZE[e.type];
  let extraSize = 0;
  for (const e of entries) {
    const n = valueBytes(e);
    if (n > 4) extraSize += n + (n % 2);
  }
  const stripStart = 8 + ifdSize + extraSize;
  let offset = stripStart;
  const stripOffsets = strips.map((s) => {
    const at = offset;
    offset += s.length;
    return at;
  });
  entries[5].values = stripOffsets;
  const total = offset;
  const out = new Uint8Array(total);
  const view = new DataView(out.buffer);
  out[0] = 0x49;
  out[1] = 0x49;
  view.setUint16(2, 42, true);
  view.setUint32(4, 8, true);

  let p = 8;
  view.setUint16(p, entries.length, true);
  p += 2;
  let extra = 8 + ifdSize;
  const writeValues = (e: Entry, at: number) => {
    if (typeof e.values === 'string') {
      for (let i = 0; i < e.values.length; i++) out[at + i] = e.values.charCodeAt(i) & 0x7f;
      out[at + e.values.length] = 0;
      return;
    }
    e.values.forEach((v, i) => {
      if (e.type === SHORT) view.setUint16(at + i * 2, v, true);
      else if (e.type === LONG) view.setUint32(at + i * 4, v, true);
      else view.setFloat64(at + i * 8, v, true);
    });
  };
  for (const e of entries) {
    const count = typeof e.values === 'string' ? e.values.length + 1 : e.values.length;
    view.setUint16(p, e.tag, true);
    view.setUint16(p + 2, e.type, true);
    view.setUint32(p + 4, count, true);
    const n = valueBytes(e);
    if (n <= 4) {
      writeValues(e, p + 8);
    } else {
      view.setUint32(p + 8, extra, true);
      writeValues(e, extra);
      extra += n + (n % 2);
    }
    p += 12;
  }
  view.setUint32(p, 0, true);
  strips.forEach((s, i) => {
    out.set(s, stripOffsets[i]);
  });
  return out;
}
