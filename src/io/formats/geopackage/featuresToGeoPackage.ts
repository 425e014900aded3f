import type { Feature, FeatureCollection, Geometry } from 'geojson';
import type { SqlJsStatic } from 'sql.js';
import { InputError } from '../../../core/common/InputError';
import type { CrsTransform } from '../../crs/crsResolve';
import { geometryMapPositions } from '../../crs/featuresToWgs84';
import { gpkgGeometryWrite } from './gpkgGeometry';
import { sqlJsLoad } from './sqlJsLoad';

/** One feature table of a GeoPackage. */
export interface GpkgLayer {
  name: string;
  features: FeatureCollection;
}

/** Options of {@link featuresToGeoPackage}. */
export interface GpkgWriteOptions {
  sqlJsInit?: () => Promise<SqlJsStatic>;
  /** Target CRS (default WGS84, srs_id 4326); needs its EPSG code and WKT definition. */
  crs?: { transform: CrsTransform; epsg: number; wkt: string; name: string };
  /** Description of every layer in gpkg_contents (e.g. the safety caution); default empty. */
  description?: string;
}

/** OGC WKT of WGS 84 as the GeoPackage standard's required gpkg_spatial_ref_sys row gives it (Table 6 / Annex). */
const WKT_4326 =
  'GEOGCS["WGS 84",DATUM["WGS_1984",SPHEROID["WGS 84",6378137,298.257223563,AUTHORITY["EPSG","7030"]],' +
  'AUTHORITY["EPSG","6326"]],PRIMEM["Greenwich",0,AUTHORITY["EPSG","8901"]],UNIT["degree",0.0174532925199433,' +
  'AUTHORITY["EPSG","9122"]],AUTHORITY["EPSG","4326"]]';

const quoteId = (s: string) => `"${s.replace(/"/g, '""')}"`;

function geometryTypeName(features: Feature[]): string {
  const types = new Set(features.map((f) => f.geometry?.type).filter((t): t is Geometry['type'] => Boolean(t)));
  // Polygon is not a subtype of MultiPolygon (GeoPackage 1.3 Annex G), so mixed layers are GEOMETRY.
  return types.size === 1 ? [...types][0].toUpperCase() : 'GEOMETRY';
}

function columnTypes(features: Feature[]): Map<string, string> {
  const kinds = new Map<string, Set<string>>();
  for (const f of features) {
    for (const [k, v] of Object.entries(f.properties ?? {})) {
      if (v === null || v === undefined) {
        if (!kinds.has(k)) kinds.set(k, new Set());
        continue;
      }
      const kind = typeof v === 'number' ? (Number.isInteger(v) ? 'INTEGER' : 'REAL') : typeof v === 'boolean' ? 'BOOLEAN' : 'TEXT';
      kinds.set(k, (kinds.get(k) ?? new Set()).add(kind));
    }
  }
  const out = new Map<string, string>();
  for (const [k, set] of kinds) {
    if (set.size === 0) out.set(k, 'TEXT');
    else if (set.size === 1) out.set(k, [...set][0]);
    else if ([...set].every((t) => t === 'INTEGER' || t === 'REAL')) out.set(k, 'REAL');
    else out.set(k, 'TEXT');
  }
  return out;
}

function cellValue(v: unknown, type: string): string | number | null {
  if (v === null || v === undefined) return null;
  if (type === 'BOOLEAN') return v ? 1 : 0;
  if (typeof v === 'number') return v;
  return typeof v === 'object' ? JSON.stringify(v) : String(v);
}

/**
 * A GeoPackage 1.3 file (OGC 12-128r18) with one feature table per layer: application_id
 * "GPKG", user_version 10300, the required gpkg_spatial_ref_sys rows (-1, 0, 4326) plus the
 * target CRS, gpkg_contents with each layer's extent, gpkg_geometry_columns, and geometry
 * blobs per §2.1.3. Column types follow the values (INTEGER, REAL, BOOLEAN, TEXT; objects as JSON
 * text), and `description` in each layer's gpkg_contents row (§1.1.3.1.1: "a human-readable
 * description", which QGIS and GDAL show as the layer's description). No spatial index (the rtree
 * extension is optional). Throws InputError for a duplicate or empty layer name.
 */
export async function featuresToGeoPackage(layers: GpkgLayer[] | FeatureCollection, options: GpkgWriteOptions = {}): Promise<Uint8Array> {
  const list = Array.isArray(layers) ? layers : [{ name: 'features', features: layers }];
  const names = new Set<string>();
  for (const l of list) {
    if (!l.name.trim()) throw new InputError('a GeoPackage layer needs a name');
    if (names.has(l.name.toLowerCase())) throw new InputError(`two GeoPackage layers are named "${l.name}"`);
    names.add(l.name.toLowerCase());
  }
  const SQL = await sqlJsLoad(options.sqlJsInit);
  const db = new SQL.Database();
  try {
    const srsId = options.crs?.epsg ?? 4326;
    const toFile = options.crs ? options.crs.transform.fromWgs84 : null;
    db.run(`PRAGMA application_id = ${0x47504b47}; PRAGMA user_version = 10300;`);
    db.run(`CREATE TABLE gpkg_spatial_ref_sys (srs_name TEXT NOT NULL, srs_id INTEGER NOT NULL PRIMARY KEY,
      organization TEXT NOT NULL, organization_coordsys_id INTEGER NOT NULL, definition TEXT NOT NULL, description TEXT);
      CREATE TABLE gpkg_contents (table_name TEXT NOT NULL PRIMARY KEY, data_type TEXT NOT NULL, identifier TEXT UNIQUE,
      description TEXT DEFAULT '', last_change DATETIME NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')),
      min_x DOUBLE, min_y DOUBLE, max_x DOUBLE, max_y DOUBLE, srs_id INTEGER,
      CONSTRAINT fk_gc_r_srs_id FOREIGN KEY (srs_id) REFERENCES gpkg_spatial_ref_sys(srs_id));
      CREATE TABLE gpkg_geometry_columns (table_name TEXT NOT NULL, column_name TEXT NOT NULL,
      geometry_type_name TEXT NOT NULL, srs_id INTEGER NOT NULL, z TINYINT NOT NULL, m TINYINT NOT NULL,
      CONSTRAINT pk_geom_cols PRIMARY KEY (table_name, column_name), CONSTRAINT uk_gc_table_name UNIQUE (table_name),
      CONSTRAINT fk_gc_tn FOREIGN KEY (table_name) REFERENCES gpkg_contents(table_name),
      CONSTRAINT fk_gc_srs FOREIGN KEY (srs_id) REFERENCES gpkg_spatial_ref_sys (srs_id));`);
    const srs = db.prepare('INSERT INTO gpkg_spatial_ref_sys VALUES (?, ?, ?, ?, ?, ?)');
    srs.run(['Undefined cartesian SRS', -1, 'NONE', -1, 'undefined', 'undefined cartesian coordinate reference system']);
    srs.run(['Undefined geographic SRS', 0, 'NONE', 0, 'undefined', 'undefined geographic coordinate reference system']);
    srs.run(['WGS 84 geodetic', 4326, 'EPSG', 4326, WKT_4326, 'longitude/latitude coordinates in decimal degrees on the WGS 84 spheroid']);
    if (options.crs && srsId !== 4326) srs.run([options.crs.name, srsId, 'EPSG', srsId, options.crs.wkt, null]);
    srs.free();
    for (const layer of list) {
      const features = layer.features.features;
      const types = columnTypes(features);
      const pk = types.has('fid') ? 'sp_fid' : 'fid';
      const geomCol = types.has('geom') ? 'sp_geom' : 'geom';
      const geomType = geometryTypeName(features);
      const cols = [...types];
      const table = quoteId(layer.name);
      db.run(
        `CREATE TABLE ${table} (${quoteId(pk)} INTEGER PRIMARY KEY AUTOINCREMENT NOT NULL, ${quoteId(geomCol)} ${geomType}` +
          cols.map(([k, t]) => `, ${quoteId(k)} ${t}`).join('') +
          ')',
      );
      const insert = db.prepare(
        `INSERT INTO ${table} (${[geomCol, ...cols.map(([k]) => k)].map(quoteId).join(', ')}) VALUES (${['?', ...cols.map(() => '?')].join(', ')})`,
      );
      let box = [Infinity, Infinity, -Infinity, -Infinity];
      for (const f of features) {
        const g = f.geometry && toFile ? geometryMapPositions(f.geometry, (p) => toFile(p[0], p[1])) : f.geometry;
        const blob = gpkgGeometryWrite(g, srsId);
        if (g) {
          const e = new DataView(blob.buffer, 8, 32);
          box = [Math.min(box[0], e.getFloat64(0, true)), Math.min(box[1], e.getFloat64(16, true)), Math.max(box[2], e.getFloat64(8, true)), Math.max(box[3], e.getFloat64(24, true))];
        }
        insert.run([blob, ...cols.map(([k, t]) => cellValue(f.properties?.[k], t))]);
      }
      insert.free();
      const extent = Number.isFinite(box[0]) ? box : [null, null, null, null];
      db.run('INSERT INTO gpkg_contents (table_name, data_type, identifier, description, min_x, min_y, max_x, max_y, srs_id) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)', [
        layer.name, 'features', layer.name, options.description ?? '', ...extent, srsId,
      ]);
      db.run('INSERT INTO gpkg_geometry_columns VALUES (?, ?, ?, ?, 0, 0)', [layer.name, geomCol, geomType, srsId]);
    }
    return db.export();
  } finally {
    db.close();
  }
}
