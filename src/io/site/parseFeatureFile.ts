import type { FeatureCollection } from 'geojson';
import { InputError, isInputError } from '../../core/common/InputError';
import { featuresLimitCheck } from './featuresLimitCheck';
import type { ImportOptions } from '../common/importOptions';
import { parseGeoJson } from '../formats/geojson/parseGeoJson';
import { textDecoderFor } from '../common/textDecoderFor';

/** Options a reader may use: a layer of a multi-layer file, a CRS for files without one, a text encoding. */
export interface FeatureFileOptions {
  layer?: string;
  /** EPSG code of the coordinates when the file does not say (default: WGS84 lon/lat). */
  epsg?: number;
  /** Text encoding of the file (default utf-8). */
  encoding?: string;
  /** Point CSV: the coordinate columns, when not auto-detected. */
  csvColumns?: ImportOptions['csvColumns'];
  /** GeoPackage: sql.js loader (the browser passes one that knows where the wasm is served). */
  sqlJsInit?: ImportOptions['sqlJsInit'];
}

type Reader = (fileName: string, bytes: Uint8Array, options: FeatureFileOptions) => Promise<FeatureCollection>;

/**
 * JSON text is UTF-8 (RFC 8259 §8.1): by default invalid bytes are refused rather than shown as
 * U+FFFD, and a byte-order mark is dropped (TextDecoder does; parseGeoJson also tolerates one).
 * An explicit encoding goes through textDecoderFor, which decodes windows-1252 correctly on Node 20.
 */
function decodeText(fileName: string, bytes: Uint8Array, encoding: string | undefined): string {
  let decode: (bytes: Uint8Array) => string;
  try {
    decode = textDecoderFor(encoding ?? 'utf-8', encoding === undefined);
  } catch {
    throw new InputError(`${fileName}: unknown text encoding "${encoding}"`);
  }
  try {
    return decode(bytes);
  } catch {
    throw new InputError(`${fileName}: the file is not UTF-8 text, as JSON must be (RFC 8259); save it as UTF-8 or give its encoding (--encoding)`);
  }
}

const readGeoJson: Reader = async (fileName, bytes, options) =>
  parseGeoJson(fileName, decodeText(fileName, bytes, options.encoding), options.epsg);

/**
 * Readers by lower-case file extension (without the dot). All but GeoJSON's are loaded when first
 * used: their libraries (XML, shapefile, CSV, SQLite) are a large share of the code every command
 * would otherwise compile at start.
 */
const READERS: Record<string, Reader> = {
  geojson: readGeoJson,
  json: readGeoJson,
  zip: async (fileName, bytes, options) => (await import('../formats/shapefile/parseShapefileZip')).parseShapefileZip(fileName, bytes, options),
  kml: async (fileName, bytes, options) => (await import('../formats/kml/parseKml')).parseKml(fileName, bytes, options),
  kmz: async (fileName, bytes, options) => (await import('../formats/kml/parseKml')).parseKml(fileName, bytes, options),
  gpx: async (fileName, bytes) => (await import('../formats/gpx/parseGpx')).parseGpx(fileName, bytes),
  gpkg: async (fileName, bytes, options) => (await import('../formats/geopackage/parseGeoPackage')).parseGeoPackage(fileName, bytes, options),
  csv: async (fileName, bytes, options) => (await import('../formats/csv/parsePointCsv')).parsePointCsv(fileName, bytes, options),
};

/**
 * Reads a map file into a WGS84 GeoJSON FeatureCollection, choosing the reader by the file's
 * extension, then checks it against the size limits (featuresLimitCheck). Throws InputError for an
 * unsupported extension (listing the supported ones), for anything the chosen reader finds wrong,
 * and for a limit reached. A library inside a reader that fails on a damaged file in its own way
 * is reported the same way, as a file that cannot be read, so no reader's failure escapes as
 * anything but an InputError.
 */
export async function parseFeatureFile(
  fileName: string,
  bytes: Uint8Array,
  options: FeatureFileOptions = {},
): Promise<FeatureCollection> {
  const dot = fileName.lastIndexOf('.');
  const ext = dot >= 0 ? fileName.slice(dot + 1).toLowerCase() : '';
  const reader = READERS[ext];
  if (!reader) {
    const supported = Object.keys(READERS).map((e) => `.${e}`).join(', ');
    throw new InputError(`${fileName}: unsupported file type${ext ? ` ".${ext}"` : ''}; supported: ${supported}`);
  }
  let fc: FeatureCollection;
  try {
    fc = await reader(fileName, bytes, options);
  } catch (error) {
    if (isInputError(error)) throw error;
    const message = error instanceof Error ? error.message : String(error);
    throw new InputError(`${fileName}: the file cannot be read (${message.split('\n')[0].slice(0, 200)})`);
  }
  featuresLimitCheck(fc, fileName);
  return fc;
}
