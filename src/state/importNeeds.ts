import Papa from 'papaparse';
import type { InputError } from '../core/common/InputError';
import { crsFromPrj } from '../io/crs/crsFromPrj';
import { dbfRead } from '../io/formats/shapefile/dbfRead';
import { listLayers } from '../io/site/listLayers';
import { type FeatureFileOptions, parseFeatureFile } from '../io/site/parseFeatureFile';
import { shapefileLayers } from '../io/formats/shapefile/parseShapefileZip';
import { textDecoderFor } from '../io/common/textDecoderFor';
import { zipEntries, zipEntryNoCase, zipEntryPaths } from '../io/common/zipEntries';

/** The choices a file still needs from the user before it can be read. */
export interface ImportNeeds {
  /** Layers to choose from (more than one), or empty when the file holds one layer or one is chosen. */
  layers: string[];
  /** True when a KML/KMZ may also be read whole (every folder), so choosing a folder is optional. */
  layerOptional: boolean;
  /** The coordinates' EPSG code is unknown (shapefile without a usable .prj, projected CSV...). */
  epsg: boolean;
  /** A .dbf without .cpg whose text is not UTF-8: its encoding is needed. */
  encoding: boolean;
  /** Point CSV whose coordinate columns were not recognised: its column names, else null. */
  csvColumns: string[] | null;
}

/**
 * Text encodings offered for a .dbf without .cpg (or a CSV), as TextDecoder labels: those of
 * the .cpg names dbfRead knows that this browser or runtime can decode (WHATWG Encoding Standard).
 */
export function importEncodingChoices(): string[] {
  const labels = ['utf-8', 'windows-1252', 'iso-8859-1', 'windows-1250', 'windows-1251', 'ibm866', 'gbk', 'shift_jis', 'big5', 'euc-kr'];
  return labels.filter((label) => {
    try {
      textDecoderFor(label);
      return true;
    } catch {
      return false;
    }
  });
}

function extOf(fileName: string): string {
  return fileName.slice(fileName.lastIndexOf('.') + 1).toLowerCase();
}

function isDbfUtf8Refused(dbf: Uint8Array, where: string): boolean {
  try {
    dbfRead(dbf, where);
    return false;
  } catch {
    // Refused as UTF-8 but readable as a single-byte code page: the encoding is what is missing.
    try {
      dbfRead(dbf, where, 'windows-1252');
      return true;
    } catch {
      return false;
    }
  }
}

function shapefileNeeds(fileName: string, bytes: Uint8Array, options: FeatureFileOptions, needs: ImportNeeds): void {
  const layers = shapefileLayers(zipEntryPaths(fileName, bytes));
  const layer = options.layer ?? (layers.length === 1 ? layers[0] : undefined);
  if (layer === undefined || !layers.includes(layer)) return;
  // Only the small sidecar files say what is missing; the .shp itself is not inflated here.
  const wanted = ['.prj', '.dbf', '.cpg'].map((ext) => `${layer}${ext}`.toLowerCase());
  const entries = zipEntries(fileName, bytes, (p) => wanted.includes(p.toLowerCase()));
  const where = `${fileName} (${layer}.shp)`;
  if (options.epsg === undefined) {
    const prj = zipEntryNoCase(entries, `${layer}.prj`);
    if (!prj) needs.epsg = true;
    else {
      try {
        crsFromPrj(new TextDecoder().decode(prj), where);
      } catch {
        needs.epsg = true;
      }
    }
  }
  const dbf = zipEntryNoCase(entries, `${layer}.dbf`);
  if (options.encoding === undefined && dbf && !zipEntryNoCase(entries, `${layer}.cpg`)) needs.encoding = isDbfUtf8Refused(dbf, where);
}

async function readsWith(fileName: string, bytes: Uint8Array, options: FeatureFileOptions): Promise<boolean> {
  try {
    await parseFeatureFile(fileName, bytes, options);
    return true;
  } catch {
    return false;
  }
}

async function csvNeeds(fileName: string, bytes: Uint8Array, options: FeatureFileOptions, needs: ImportNeeds): Promise<void> {
  if (options.csvColumns) return;
  const text = textDecoderFor(options.encoding ?? 'utf-8')(bytes).replace(/^\uFEFF/, '');
  const columns = Papa.parse<string[]>(text, { preview: 1 }).data[0] ?? [];
  if (columns.length === 0) return;
  // The header alone goes through the same reader: with a CRS given, only unrecognised columns fail;
  // without one, projected columns lacking a zone column fail too.
  const header = new TextEncoder().encode(`${Papa.unparse([columns])}\n`);
  if (!(await readsWith(fileName, header, { ...options, epsg: options.epsg ?? 4326 }))) needs.csvColumns = columns;
  else if (options.epsg === undefined && !(await readsWith(fileName, header, options))) needs.epsg = true;
}

/**
 * What a map file needs chosen before it can be read: a layer when it holds several
 * (listLayers), an EPSG code when a shapefile layer has no .prj or one that is not understood,
 * an encoding when a .dbf without .cpg is not UTF-8, CSV columns when they are not recognised.
 * The checks look at the file itself (layers, zip entries, the CSV header read by the same
 * reader); only for GeoJSON and GeoPackage is an EPSG code inferred from the reader's message
 * asking for one. `error` is the reader's refusal, if it refused.
 * @returns the needs, or null when nothing is missing (the file reads, or fails for another reason)
 * Throws InputError when the file cannot be opened at all (damaged zip, not a GeoPackage...).
 */
export async function importNeedsOf(
  fileName: string,
  bytes: Uint8Array,
  options: FeatureFileOptions,
  error: InputError | null,
): Promise<ImportNeeds | null> {
  const ext = extOf(fileName);
  const needs: ImportNeeds = { layers: [], layerOptional: ext === 'kml' || ext === 'kmz', epsg: false, encoding: false, csvColumns: null };
  if (options.layer === undefined && ['zip', 'kml', 'kmz', 'gpkg'].includes(ext)) {
    const layers = await listLayers(fileName, bytes, { sqlJsInit: options.sqlJsInit });
    if (layers.length > 1) needs.layers = layers;
  }
  if (ext === 'zip' && needs.layers.length === 0) shapefileNeeds(fileName, bytes, options, needs);
  else if (ext === 'csv' && error) await csvNeeds(fileName, bytes, options, needs);
  else if (error && options.epsg === undefined && /\bgive (?:the|their|the file's) EPSG code\b/i.test(error.message)) needs.epsg = true;
  if (needs.layers.length === 0 && !needs.epsg && !needs.encoding && needs.csvColumns === null) return null;
  return needs;
}
