import type { FeatureCollection } from 'geojson';
import { InputError, isInputError } from '../core/common/InputError';
import { crsResolveEpsg } from '../io/crs/crsResolve';
import { dbfEncodingLabel } from '../io/formats/shapefile/dbfRead';
import { type FeatureFileOptions, parseFeatureFile } from '../io/site/parseFeatureFile';

/** parseArgs option specs of the flags that say how to read a map file; spread into a command's options. */
export const IMPORT_FLAG_SPECS = {
  layer: { type: 'string' },
  epsg: { type: 'string' },
  encoding: { type: 'string' },
  'x-column': { type: 'string' },
  'y-column': { type: 'string' },
} as const;

/** The parsed values of {@link IMPORT_FLAG_SPECS} as parseArgs returns them. */
export interface ImportFlagValues {
  layer?: string;
  epsg?: string;
  encoding?: string;
  'x-column'?: string;
  'y-column'?: string;
}

/** Reader options for the files a command reads: the strata file, and every other map file. */
export interface ImportChoices {
  strata: FeatureFileOptions;
  /** Exclusions, access points, boundary, baseline: only the CSV column choice reaches them. */
  other: FeatureFileOptions;
}

/**
 * `--help` lines for the import flags. `strataFile` names the file they apply to as the command
 * calls it (e.g. "<strata-file>" or "--strata FILE").
 */
export function importFlagsHelp(strataFile: string): string {
  return `Reading the strata file (${strataFile}); other files must carry their own CRS and layer:
  --layer NAME      layer to read from a GeoPackage, a zip of several shapefiles or a KML/KMZ
                    folder (the error lists the layers when one is needed)
  --epsg CODE       EPSG code of its coordinates, e.g. 27700 or EPSG:32755, for a shapefile without
                    .prj or a GeoJSON without "crs"; it replaces the CRS a .prj or GeoPackage states
  --encoding NAME   text encoding of a .dbf without .cpg, or of a CSV or (non-UTF-8) GeoJSON
                    file, e.g. windows-1252 (also 1252, latin1)
  --x-column NAME   with --y-column: coordinate columns of point CSV files; these two also apply
  --y-column NAME   to CSVs given with --exclude/--access (in --epsg when given, else lon/lat)`;
}

function epsgRead(text: string): number {
  const digits = /^\s*(?:EPSG:)?(\d{4,6})\s*$/i.exec(text)?.[1];
  if (!digits) throw new InputError(`--epsg needs an EPSG code such as 27700 or EPSG:32755, got "${text}"`);
  const code = Number(digits);
  crsResolveEpsg(code, `--epsg ${text.trim()}`);
  return code;
}

/**
 * Turns the parsed import flags into parseFeatureFile options, checking each flag first so a bad
 * value is reported as the flag's own problem rather than as a problem of the file.
 * @returns options for the strata file and for every other map file
 * Throws InputError for an EPSG code stratplot does not carry (listing the supported ones), an
 * unknown encoding, or only one of --x-column/--y-column.
 */
export function importFlagsRead(values: ImportFlagValues): ImportChoices {
  const strata: FeatureFileOptions = {};
  if (values.layer !== undefined) {
    if (values.layer.trim() === '') throw new InputError('--layer needs a layer name');
    strata.layer = values.layer;
  }
  if (values.epsg !== undefined) strata.epsg = epsgRead(values.epsg);
  if (values.encoding !== undefined) strata.encoding = dbfEncodingLabel(values.encoding, '--encoding');
  const x = values['x-column'];
  const y = values['y-column'];
  if ((x === undefined) !== (y === undefined)) {
    throw new InputError(`give --x-column and --y-column together (only ${x === undefined ? '--y-column' : '--x-column'} was given)`);
  }
  const other: FeatureFileOptions = {};
  if (x !== undefined && y !== undefined) {
    if (x === y) throw new InputError(`--x-column and --y-column name the same column "${x}"`);
    strata.csvColumns = { x, y, epsg: strata.epsg };
    other.csvColumns = { x, y, epsg: strata.epsg };
  }
  return { strata, other };
}

/** Which import flags each reader uses, by lower-case extension, and why the others do not apply. */
const APPLIES: Record<string, { flags: readonly ('layer' | 'epsg' | 'encoding')[]; why: string }> = {
  geojson: { flags: ['epsg', 'encoding'], why: 'a GeoJSON file holds one layer' },
  json: { flags: ['epsg', 'encoding'], why: 'a GeoJSON file holds one layer' },
  zip: { flags: ['layer', 'epsg', 'encoding'], why: '' },
  kml: { flags: ['layer'], why: 'KML coordinates are always WGS84 longitude/latitude and the file states its own encoding' },
  kmz: { flags: ['layer'], why: 'KML coordinates are always WGS84 longitude/latitude and the file states its own encoding' },
  gpx: { flags: [], why: 'GPX holds one layer of WGS84 longitude/latitude and states its own encoding' },
  gpkg: { flags: ['layer', 'epsg'], why: 'a GeoPackage stores its text in the Unicode encoding SQLite declares' },
  csv: { flags: ['epsg', 'encoding'], why: 'a CSV file holds one layer' },
};

/**
 * The strata file's reader options after checking that each flag given means something for its
 * format, so that a flag is never silently ignored (e.g. --epsg on a KML file, which is WGS84 by
 * definition, OGC KML 2.2). Unknown extensions are left to parseFeatureFile to refuse.
 * Throws InputError naming the flag, the file and why the flag does not apply.
 */
export function importOptionsFor(fileName: string, options: FeatureFileOptions): FeatureFileOptions {
  const dot = fileName.lastIndexOf('.');
  const rule = APPLIES[dot >= 0 ? fileName.slice(dot + 1).toLowerCase() : ''];
  if (!rule) return options;
  for (const flag of ['layer', 'epsg', 'encoding'] as const) {
    if (options[flag] !== undefined && !rule.flags.includes(flag)) {
      throw new InputError(`--${flag} does not apply to ${fileName}: ${rule.why}`);
    }
  }
  return options;
}

/** What to do instead, for a file other than the strata file, when its reader asks for a flag. */
const OTHER_FILE_INSTEAD = {
  layer: 'keep it to one layer',
  epsg: 'give it its coordinate system (a .prj, or save it as GeoJSON in WGS84)',
  encoding: 'put a .cpg file naming its encoding beside its .dbf',
} as const;

/**
 * Reads a map file other than the strata file (exclusions, access points, boundary, baseline) with
 * the options meant for it. Readers ask for --layer, --epsg or --encoding when a file needs one;
 * those flags read the strata file only, so such a message is completed with what to do instead.
 * Throws InputError as parseFeatureFile does.
 */
export async function importOtherFile(fileName: string, bytes: Uint8Array, imports: ImportChoices): Promise<FeatureCollection> {
  try {
    return await parseFeatureFile(fileName, bytes, imports.other);
  } catch (error) {
    if (!isInputError(error)) throw error;
    const asked = /--(layer|epsg|encoding)\b/.exec(error.message)?.[1] as 'layer' | 'epsg' | 'encoding' | undefined;
    if (!asked) throw error;
    throw new InputError(`${error.message} — but --${asked} reads the strata file only: ${OTHER_FILE_INSTEAD[asked]}`);
  }
}
