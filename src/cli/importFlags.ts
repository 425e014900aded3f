import { InputError } from '../core/InputError';
import { crsResolveEpsg } from '../io/crsResolve';
import { dbfEncodingLabel } from '../io/dbfRead';
import type { FeatureFileOptions } from '../io/parseFeatureFile';

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
  --epsg CODE       EPSG code of its coordinates, e.g. 27700 or EPSG:32755: for a shapefile without
                    .prj or a GeoJSON without "crs"; replaces the CRS the file states
  --encoding NAME   text encoding of a .dbf without .cpg, e.g. windows-1252 (or 1252, latin1)
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
