import { InputError } from './InputError';

/*
 * Every size limit stratplot puts on what it reads and on the designs it makes, in one place so the
 * README's "Limits" table, the error messages and the checks agree. Each limit sits far above any
 * real survey site (the invented demo site has about 1 400 vertices and 60 plots) and far enough
 * below what this machine's memory and a person's patience can take; the figures are common
 * practice, no source. A limit that is reached is refused with a one-line InputError naming the
 * count found and the limit (limitExceeded).
 */

/** Nesting of containers: GeoJSON GeometryCollections, KML Folders/Documents and MultiGeometry, WKB collections. */
export const MAX_NESTING_DEPTH = 32;

/** Depth of XML elements in a KML or GPX document (a real KML file is about 10 deep). */
export const MAX_XML_DEPTH = 100;

/** Bytes of one file named on the command line (a JavaScript string holds at most about 512 Mi characters). */
export const MAX_FILE_BYTES = 512 * 1024 * 1024;

/** Bytes one zip entry (a .shp, .dbf or the KML of a KMZ) may inflate to. */
export const MAX_ZIP_ENTRY_BYTES = 256 * 1024 * 1024;

/** Bytes all the entries read from one zip archive may inflate to together. */
export const MAX_ZIP_TOTAL_BYTES = 512 * 1024 * 1024;

/** Vertices (positions) in one map file; a later speed-up may raise it. */
export const MAX_FILE_VERTICES = 2_000_000;

/**
 * Vertices in one stratum polygon (shell and holes) that placement triangulates, which it does only
 * to remake a design of random generator version 1 or 2 (version 3 draws from a cell grid): ear
 * clipping slows down faster than the vertex count on long wavy rings (a 200 000-vertex ring takes
 * about 4 s here, a 2 000 000-vertex one about 6 min), so larger polygons are refused for such
 * designs; areas are measured for them all the same.
 */
export const MAX_POLYGON_VERTICES = 200_000;

/** Access points in one site (the nearest one is looked up for every plot). */
export const MAX_ACCESS_POINTS = 1_000;

/** Plots in one design, primaries and reserves together (a GeoJSON plot file of this size is ~40 MB). */
export const MAX_DESIGN_PLOTS = 100_000;

/** Candidate positions a grid or transect layout may ask for in one stratum. */
export const MAX_LAYOUT_POSITIONS = 5_000_000;

/** Characters in a plot id, a feature id or a stratum code. */
export const MAX_ID_LENGTH = 100;

/** Characters in a name: stratum, site, access point, exclusion. */
export const MAX_NAME_LENGTH = 200;

/** Characters in a note or description that goes onto field sheets. */
export const MAX_NOTE_LENGTH = 2_000;

/** Measurements a plan can ask for at each plot (the field form's variables). */
export const MAX_FIELD_VARIABLES = 50;

/**
 * Farthest ground distance, km, of any stratum vertex from the central meridian of the site's UTM
 * zone (a UTM zone itself reaches about 330 km at the equator). Placement stays correct beyond the
 * zone because every ground distance is scaled by the largest UTM scale factor over the site, but
 * that margin grows with the square of the reach (about 1.2 % at 1 000 km) and one meridian
 * convergence stands for the whole site; a site reaching farther is too large for one UTM frame.
 */
export const MAX_FRAME_REACH_KM = 1_000;

/**
 * Largest coordinate magnitude a file may hold in any coordinate system: projected systems stay
 * within a few times 10⁷ m (or feet), degrees within 540; a word beyond this is damage, not a position.
 */
export const MAX_COORDINATE_MAGNITUDE = 1e9;

/** Widest safety buffer, metres, an exclusion may ask for (10 km). */
export const MAX_BUFFER_M = 10_000;

/** Largest magnitude of a measured value in a results table. */
export const MAX_RESULT_MAGNITUDE = 1e12;

/** Largest area in m² a plot file may state for a stratum: the surface of the WGS84 ellipsoid, 5.10 × 10¹⁴ m². */
export const MAX_AREA_M2 = 5.1007e14;

/** Numbers in messages with thousands grouped, e.g. 2 000 000 → "2,000,000". */
export function limitNumber(n: number): string {
  return Number.isFinite(n) ? Math.round(n).toLocaleString('en-US') : String(n);
}

/**
 * An InputError for a limit that was reached: `${where}: ${what}; stratplot's limit is ${limit}`.
 * @param where the file, feature or option
 * @param what what was found, e.g. "5,000,000 vertices"
 * @param limit the limit as a number (grouped) or text (e.g. "256 MiB")
 */
export function limitExceeded(where: string, what: string, limit: number | string): InputError {
  const shown = typeof limit === 'number' ? limitNumber(limit) : limit;
  return new InputError(`${where}: ${what}; stratplot's limit is ${shown}`);
}

/** Bytes in words: "256 MiB", "1.5 GiB", "812 bytes". */
export function limitBytes(n: number): string {
  if (n >= 1024 ** 3) return `${(n / 1024 ** 3).toFixed(n % 1024 ** 3 === 0 ? 0 : 1)} GiB`;
  if (n >= 1024 ** 2) return `${(n / 1024 ** 2).toFixed(n % 1024 ** 2 === 0 ? 0 : 1)} MiB`;
  if (n >= 1024) return `${(n / 1024).toFixed(n % 1024 === 0 ? 0 : 1)} KiB`;
  return `${n} bytes`;
}

/**
 * Checks the length of a text that reaches documents (an id, a name, a note) and returns it.
 * Throws InputError `${where}: <what> is N characters long; stratplot's limit is M characters` when it is longer.
 */
export function limitText(text: string, max: number, where: string, what: string): string {
  if (text.length > max) throw limitExceeded(where, `${what} is ${limitNumber(text.length)} characters long`, `${limitNumber(max)} characters`);
  return text;
}

/** A value as shown inside a message: JSON text cut to `max` characters, so a huge value cannot make a huge message. */
export function limitShown(value: unknown, max = 60): string {
  let text: string;
  try {
    text = typeof value === 'string' ? JSON.stringify(value.length > max ? value.slice(0, max) : value) : (JSON.stringify(value) ?? String(value));
  } catch {
    text = String(value);
  }
  return text.length > max ? `${text.slice(0, max)}…` : text;
}

/** Whether a parsed JSON value nests objects or arrays deeper than `max`, found without recursion. */
export function jsonDepthOver(value: unknown, max: number): boolean {
  const stack: [unknown, number][] = [[value, 1]];
  while (stack.length > 0) {
    const [v, depth] = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (depth > max) return true;
    for (const child of Array.isArray(v) ? v : Object.values(v)) {
      if (child !== null && typeof child === 'object') stack.push([child, depth + 1]);
    }
  }
  return false;
}
