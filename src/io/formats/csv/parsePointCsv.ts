import type { Feature, FeatureCollection } from 'geojson';
import Papa from 'papaparse';
import { InputError } from '../../../core/common/InputError';
import { type CrsTransform, crsResolveEpsg, crsWgs84 } from '../../crs/crsResolve';
import { csvCellUnescape } from '../../common/csvCell';
import type { ImportOptions } from '../../common/importOptions';
import { textDecoderFor } from '../../common/textDecoderFor';

const LON_NAMES = ['lon', 'lng', 'long', 'longitude', 'x'];
const LAT_NAMES = ['lat', 'latitude', 'y'];
const EAST_NAMES = ['easting', 'east', 'e', 'utm_e', 'x_m'];
const NORTH_NAMES = ['northing', 'north', 'n', 'utm_n', 'y_m'];

/** Text that is a plain decimal number (no leading zeros, so ids like "007" stay text). */
const NUMBER_TEXT = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?$/;

/** A coordinate as a spreadsheet writes it: decimal digits, optional sign, point and exponent (no "0x10", no "Infinity"). */
const COORDINATE_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function find(columns: string[], names: string[]): string | undefined {
  return names.map((n) => columns.find((c) => c.trim().toLowerCase() === n)).find((c) => c !== undefined);
}

function cellValue(text: string): string | number | null {
  if (text === '') return null;
  if (NUMBER_TEXT.test(text)) return Number(text);
  return csvCellUnescape(text);
}

/** EPSG code of a WGS84 UTM zone written like "55S" or "10N", else null. */
function utmZoneEpsg(zone: string): number | null {
  const m = /^(\d{1,2})\s*([NS])$/i.exec(zone.trim());
  if (!m || Number(m[1]) < 1 || Number(m[1]) > 60) return null;
  return (m[2].toUpperCase() === 'N' ? 32600 : 32700) + Number(m[1]);
}

/**
 * Reads a CSV of points (papaparse; header row required; UTF-8 unless `options.encoding`) as
 * WGS84 GeoJSON points. Coordinates
 * come from `options.csvColumns` ({x, y, epsg?}) or auto-detected columns: lon/lng/longitude/x with
 * lat/latitude/y (WGS84 unless `options.epsg` says otherwise), else easting/northing with
 * `options.epsg` or a per-row `utm_zone` column ("55S"). Other columns become properties:
 * plain numbers as numbers, empty cells as null, apostrophe-neutralised text restored.
 * Throws InputError naming the file, row (1 = first row after the header) and column for a
 * missing column, a non-numeric or out-of-range coordinate, or malformed CSV.
 */
export async function parsePointCsv(fileName: string, bytes: Uint8Array, options: ImportOptions = {}): Promise<FeatureCollection> {
  let text: string;
  try {
    text = textDecoderFor(options.encoding ?? 'utf-8')(bytes);
  } catch {
    throw new InputError(`${fileName}: unknown text encoding "${options.encoding}"`);
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy', dynamicTyping: false });
  const bad = parsed.errors.find((e) => e.type !== 'Delimiter');
  if (bad) throw new InputError(`${fileName}: row ${(bad.row ?? 0) + 1}: ${bad.message}`);
  const columns = parsed.meta.fields ?? [];
  if (columns.length === 0) throw new InputError(`${fileName}: no header row`);
  let x = options.csvColumns?.x;
  let y = options.csvColumns?.y;
  for (const c of [x, y]) {
    if (c !== undefined && !columns.includes(c)) throw new InputError(`${fileName}: no column "${c}"; columns are: ${columns.join(', ')}`);
  }
  const epsg = options.csvColumns?.epsg ?? options.epsg;
  let crs: CrsTransform | null = epsg !== undefined ? crsResolveEpsg(epsg, fileName) : null;
  let zoneColumn: string | undefined;
  if (x === undefined || y === undefined) {
    const lon = find(columns, LON_NAMES);
    const lat = find(columns, LAT_NAMES);
    if (lon && lat) {
      [x, y] = [lon, lat];
    } else {
      const e = find(columns, EAST_NAMES);
      const n = find(columns, NORTH_NAMES);
      if (!e || !n) {
        throw new InputError(
          `${fileName}: cannot tell which columns hold the coordinates (looked for lon/lat or easting/northing); columns are: ${columns.join(', ')}`,
        );
      }
      [x, y] = [e, n];
      zoneColumn = crs ? undefined : find(columns, ['utm_zone', 'zone']);
      if (!crs && !zoneColumn) throw new InputError(`${fileName}: columns "${e}" and "${n}" are projected; give their EPSG code (--epsg)`);
    }
  }
  crs ??= zoneColumn ? null : crsWgs84();
  const zoneCrs = new Map<number, CrsTransform>();
  let degreeSized = crs !== null && !crs.isGeographic;
  const features: Feature[] = parsed.data.map((row, i) => {
    const where = `${fileName}: row ${i + 1}`;
    const number = (column: string): number => {
      const raw = (row[column] ?? '').trim();
      const v = Number(raw);
      if (!COORDINATE_TEXT.test(raw) || !Number.isFinite(v)) throw new InputError(`${where}, column "${column}": "${raw.slice(0, 40)}" is not a number`);
      return v;
    };
    const vx = number(x!);
    const vy = number(y!);
    if (Math.abs(vx) > 180 || Math.abs(vy) > 90) degreeSized = false;
    let rowCrs = crs;
    if (!rowCrs) {
      const code = utmZoneEpsg(row[zoneColumn!] ?? '');
      if (code === null) throw new InputError(`${where}, column "${zoneColumn}": "${row[zoneColumn!]}" is not a UTM zone like 55S`);
      rowCrs = zoneCrs.get(code) ?? crsResolveEpsg(code, fileName);
      zoneCrs.set(code, rowCrs);
    }
    const [lon, lat] = rowCrs.toWgs84(vx, vy);
    if (!(Math.abs(lat) <= 90 && Math.abs(lon) <= 180)) {
      throw new InputError(`${where}, columns "${x}"/"${y}": ${vx}, ${vy} is not a position in ${rowCrs.label}`);
    }
    const properties: Record<string, unknown> = {};
    for (const c of columns) properties[c] = cellValue(row[c] ?? '');
    return { type: 'Feature', properties, geometry: { type: 'Point', coordinates: [lon, lat] } };
  });
  if (degreeSized && features.length > 0) {
    throw new InputError(
      `${fileName}: columns "${x}"/"${y}" hold degree-sized values (row 1: ${parsed.data[0][x!]}, ${parsed.data[0][y!]}), but the coordinate system given is ${crs!.label}, a projected system in metres; give the coordinate system the file really uses`,
    );
  }
  return { type: 'FeatureCollection', features };
}
