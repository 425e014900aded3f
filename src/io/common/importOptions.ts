import type { SqlJsStatic } from 'sql.js';

/** Options every importer accepts; each uses the ones that apply to its format. */
export interface ImportOptions {
  /** Layer to read from a file holding several (GeoPackage table, KML folder, shapefile in a zip). */
  layer?: string;
  /** EPSG code of the coordinates when the file does not say (shapefile without .prj, CSV). */
  epsg?: number;
  /** Text encoding of a shapefile's .dbf when it has no .cpg, e.g. "windows-1252". */
  encoding?: string;
  /** Column mapping for point CSV files; columns are auto-detected when absent. */
  csvColumns?: { x: string; y: string; epsg?: number };
  /** Loads sql.js for GeoPackage files (the browser passes one with its wasm location). */
  sqlJsInit?: () => Promise<SqlJsStatic>;
}
