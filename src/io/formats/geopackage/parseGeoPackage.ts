import type { Feature, FeatureCollection, Geometry } from 'geojson';
import type { Database, SqlValue } from 'sql.js';
import { InputError } from '../../../core/common/InputError';
import { crsDegreesCheck } from '../../crs/crsDegreesCheck';
import { crsFromPrj } from '../../crs/crsFromPrj';
import { type CrsTransform, crsProj4Definition, crsResolveEpsg, crsWgs84 } from '../../crs/crsResolve';
import { geometryMapPositions } from '../../crs/featuresToWgs84';
import { GpkgGeometryError, gpkgGeometryRead } from './gpkgGeometry';
import type { ImportOptions } from '../../common/importOptions';
import { sqlJsLoad } from './sqlJsLoad';

/** Rows of a query; SQLite's own refusal (a damaged page, a table that is not there) is said as the file's problem, naming `where`. */
function rows(db: Database, sql: string, params: SqlValue[] = [], where = 'the GeoPackage'): Record<string, SqlValue>[] {
  let stmt: ReturnType<Database['prepare']>;
  try {
    stmt = db.prepare(sql);
  } catch (error) {
    throw new InputError(`${where}: the GeoPackage cannot be read (SQLite: ${(error as Error).message})`);
  }
  try {
    stmt.bind(params);
    const out: Record<string, SqlValue>[] = [];
    while (stmt.step()) out.push(stmt.getAsObject());
    return out;
  } catch (error) {
    throw new InputError(`${where}: the GeoPackage cannot be read (SQLite: ${(error as Error).message})`);
  } finally {
    stmt.free();
  }
}

async function openGeoPackage(fileName: string, bytes: Uint8Array, options: ImportOptions): Promise<Database> {
  const SQL = await sqlJsLoad(options.sqlJsInit);
  let db: Database;
  try {
    db = new SQL.Database(bytes);
    db.exec('SELECT count(*) FROM sqlite_master');
  } catch {
    throw new InputError(`${fileName}: not a GeoPackage (not an SQLite database)`);
  }
  let has: Record<string, SqlValue>[];
  try {
    has = rows(db, "SELECT name FROM sqlite_master WHERE type IN ('table','view') AND name IN ('gpkg_contents','gpkg_geometry_columns','gpkg_spatial_ref_sys')", [], fileName);
  } catch (error) {
    db.close();
    throw error;
  }
  if (has.length < 3) {
    db.close();
    throw new InputError(`${fileName}: not a GeoPackage (an SQLite file without the gpkg_contents, gpkg_geometry_columns and gpkg_spatial_ref_sys tables)`);
  }
  return db;
}

function featureLayers(db: Database, fileName: string): string[] {
  return rows(db, "SELECT table_name FROM gpkg_contents WHERE lower(data_type) = 'features' ORDER BY table_name", [], fileName).map((r) => String(r.table_name));
}

/** Names of the vector feature tables of a GeoPackage (gpkg_contents rows of data_type "features"). */
export async function geoPackageLayers(fileName: string, bytes: Uint8Array, options: ImportOptions = {}): Promise<string[]> {
  const db = await openGeoPackage(fileName, bytes, options);
  try {
    return featureLayers(db, fileName);
  } finally {
    db.close();
  }
}

function layerCrs(db: Database, srsId: number, where: string, epsg: number | undefined): CrsTransform {
  if (epsg !== undefined) return crsResolveEpsg(epsg, where);
  if (srsId === 0 || srsId === 4326) return crsWgs84();
  if (srsId === -1) throw new InputError(`${where}: the layer's coordinates are in an undefined cartesian system; give the EPSG code (--epsg)`);
  const [srs] = rows(db, 'SELECT organization, organization_coordsys_id, definition FROM gpkg_spatial_ref_sys WHERE srs_id = ?', [srsId], where);
  if (!srs) throw new InputError(`${where}: srs_id ${srsId} is missing from gpkg_spatial_ref_sys`);
  const code = Number(srs.organization_coordsys_id);
  if (String(srs.organization).toUpperCase() === 'EPSG' && crsProj4Definition(code)) return crsResolveEpsg(code, where);
  return crsFromPrj(String(srs.definition ?? ''), where);
}

/**
 * Reads one vector layer of a GeoPackage (OGC GeoPackage 1.2/1.3) as WGS84 GeoJSON with sql.js:
 * the geometry column named in gpkg_geometry_columns is decoded from its blobs, the CRS comes
 * from gpkg_spatial_ref_sys (EPSG codes we carry, else its WKT definition; `options.epsg`
 * overrides), every other column except the integer primary key becomes a property (BOOLEAN
 * columns as booleans). Throws InputError naming the file, layer and row for a file that is
 * not a GeoPackage, several layers and no `options.layer` (listing them), an unknown layer, or
 * a damaged geometry.
 */
export async function parseGeoPackage(fileName: string, bytes: Uint8Array, options: ImportOptions = {}): Promise<FeatureCollection> {
  const db = await openGeoPackage(fileName, bytes, options);
  try {
    const layers = featureLayers(db, fileName);
    if (layers.length === 0) throw new InputError(`${fileName}: the GeoPackage has no vector feature layers`);
    let layer = options.layer;
    if (layer === undefined) {
      if (layers.length > 1) throw new InputError(`${fileName}: holds ${layers.length} layers; choose one with --layer: ${layers.join(', ')}`);
      layer = layers[0];
    }
    const name = layers.find((l) => l === layer) ?? layers.find((l) => l.toLowerCase() === layer!.toLowerCase());
    if (!name) throw new InputError(`${fileName}: no layer "${layer}"; layers are: ${layers.join(', ')}`);
    const where = `${fileName} (layer ${name})`;
    const [table] = rows(db, "SELECT name FROM sqlite_master WHERE type IN ('table','view') AND name = ?", [name], where);
    if (!table) throw new InputError(`${where}: gpkg_contents lists the layer, but the file has no table "${name}" (the GeoPackage is damaged)`);
    const [gc] = rows(db, 'SELECT column_name, srs_id FROM gpkg_geometry_columns WHERE table_name = ?', [name], where);
    if (!gc) throw new InputError(`${where}: no entry in gpkg_geometry_columns`);
    const geomCol = String(gc.column_name);
    const crs = layerCrs(db, Number(gc.srs_id), where, options.epsg);
    const info = rows(db, `PRAGMA table_info("${name.replace(/"/g, '""')}")`, [], where);
    if (!info.some((c) => String(c.name) === geomCol)) throw new InputError(`${where}: gpkg_geometry_columns names the column "${geomCol}", which the table does not have`);
    const pk = info.find((c) => Number(c.pk) === 1 && String(c.type).toUpperCase() === 'INTEGER')?.name;
    const booleans = new Set(info.filter((c) => String(c.type).toUpperCase() === 'BOOLEAN').map((c) => String(c.name)));
    const read: { row: Record<string, SqlValue>; geometry: Geometry | null }[] = rows(db, `SELECT * FROM "${name.replace(/"/g, '""')}"`, [], where).map((row, i) => {
      const blob = row[geomCol];
      if (blob === null || blob === undefined) return { row, geometry: null };
      if (!(blob instanceof Uint8Array)) throw new InputError(`${where}: row ${i + 1}: the geometry column "${geomCol}" holds ${typeof blob === 'string' ? 'text' : 'a number'}, not a geometry blob`);
      try {
        return { row, geometry: gpkgGeometryRead(blob).geometry };
      } catch (error) {
        if (error instanceof GpkgGeometryError) throw new InputError(`${where}: row ${i + 1}: ${error.message}`);
        throw error;
      }
    });
    crsDegreesCheck({ type: 'FeatureCollection', features: read.map((r) => ({ type: 'Feature', properties: {}, geometry: r.geometry as Geometry })) }, crs, where);
    const features: Feature[] = read.map(({ row, geometry }, i) => {
      if (geometry && !(crs.epsg === 4326 && crs.isGeographic)) {
        geometry = geometryMapPositions(geometry, (p) => {
          const [lon, lat] = crs.toWgs84(p[0], p[1]);
          if (!(Math.abs(lat) <= 90 && Number.isFinite(lon))) throw new InputError(`${where}: row ${i + 1}: coordinates do not fit ${crs.label}`);
          return [lon, lat];
        });
      }
      const properties: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(row)) {
        if (k === geomCol || k === pk || v instanceof Uint8Array) continue;
        properties[k] = booleans.has(k) && v !== null ? Boolean(v) : v;
      }
      return { type: 'Feature', properties, geometry: geometry as Geometry };
    });
    return { type: 'FeatureCollection', features };
  } finally {
    db.close();
  }
}
