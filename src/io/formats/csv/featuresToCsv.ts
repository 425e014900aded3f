import type { FeatureCollection, Geometry, Position } from 'geojson';
import Papa from 'papaparse';
import { csvCell } from '../../common/csvCell';

/** Options of {@link featuresToCsv}. */
export interface CsvWriteOptions {
  /** Start the text with a UTF-8 byte-order mark (helps some spreadsheets detect UTF-8). */
  bom?: boolean;
  /** Columns written first, in this order; every other property follows in first-seen order. */
  leading?: string[];
  /** Columns written last, in this order. */
  trailing?: string[];
}

function wktPositions(ps: Position[]): string {
  return `(${ps.map((p) => `${p[0]} ${p[1]}`).join(', ')})`;
}

/** OGC Simple Features WKT of a geometry (ISO 19125-1 §7), lon lat order. */
export function geometryToWkt(g: Geometry): string {
  switch (g.type) {
    case 'Point':
      return `POINT (${g.coordinates[0]} ${g.coordinates[1]})`;
    case 'MultiPoint':
      return `MULTIPOINT ${wktPositions(g.coordinates)}`;
    case 'LineString':
      return `LINESTRING ${wktPositions(g.coordinates)}`;
    case 'MultiLineString':
      return `MULTILINESTRING (${g.coordinates.map(wktPositions).join(', ')})`;
    case 'Polygon':
      return `POLYGON (${g.coordinates.map(wktPositions).join(', ')})`;
    case 'MultiPolygon':
      return `MULTIPOLYGON (${g.coordinates.map((p) => `(${p.map(wktPositions).join(', ')})`).join(', ')})`;
    case 'GeometryCollection':
      return `GEOMETRYCOLLECTION (${g.geometries.map(geometryToWkt).join(', ')})`;
  }
}

/**
 * CSV text (RFC 4180: comma separated, CRLF, quoted where needed) of any feature collection.
 * Points get `lon` and `lat` columns (unless the properties already carry them); other
 * geometries a `wkt` column. Cells go through {@link csvCell}: numbers stay numbers, text that a
 * spreadsheet would run as a formula is neutralised. UTF-8; optional byte-order mark.
 */
export function featuresToCsv(fc: FeatureCollection, options: CsvWriteOptions = {}): string {
  const keys = new Set<string>(options.leading ?? []);
  const allPoints = fc.features.every((f) => f.geometry?.type === 'Point');
  const geometryCols = allPoints ? ['lon', 'lat'] : ['wkt'];
  for (const f of fc.features) for (const k of Object.keys(f.properties ?? {})) keys.add(k);
  for (const c of geometryCols) if (!keys.has(c)) keys.add(c);
  const trailing = options.trailing ?? [];
  const fields = [...[...keys].filter((k) => !trailing.includes(k)), ...trailing];
  const data = fc.features.map((f) => {
    const p = { ...(f.properties ?? {}) } as Record<string, unknown>;
    const g = f.geometry;
    if (g?.type === 'Point' && allPoints) {
      p.lon ??= g.coordinates[0];
      p.lat ??= g.coordinates[1];
    } else if (g && !allPoints) {
      p.wkt ??= geometryToWkt(g);
    }
    return fields.map((k) => csvCell(p[k]));
  });
  const text = Papa.unparse({ fields, data }, { newline: '\r\n', escapeFormulae: false, quotes: false });
  return `${options.bom ? '\uFEFF' : ''}${text}\r\n`;
}
