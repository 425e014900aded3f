import type { Feature, FeatureCollection, Position } from 'geojson';
import { zipSync } from 'fflate';
import { InputError } from '../../../core/common/InputError';
import type { CrsTransform } from '../../crs/crsResolve';
import { dbfFieldNames, dbfWrite } from './dbfWrite';
import { SHP_MULTIPOINT, SHP_POINT, SHP_POLYGON, SHP_POLYLINE, shpParts, shpWriteLayer } from './shpWrite';

/** ESRI WKT of WGS84 geographic coordinates, as .prj files beside WGS84 shapefiles carry it. */
export const PRJ_WGS84 =
  'GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]],' +
  'PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]]';

/** Options of {@link featuresToShapefileZip}. */
export interface ShapefileWriteOptions {
  /** Base name of the files inside the zip (default "features"). */
  layerName?: string;
  /** Target CRS (default WGS84); requires `prj`, the WKT to store beside it. */
  crs?: CrsTransform;
  prj?: string;
  /** Header date of the .dbf (default now). */
  date?: Date;
}

const KIND_SUFFIX: Record<number, string> = {
  [SHP_POINT]: 'points',
  [SHP_MULTIPOINT]: 'multipoints',
  [SHP_POLYLINE]: 'lines',
  [SHP_POLYGON]: 'polygons',
};

function propertyKeys(features: Feature[]): string[] {
  const keys = new Set<string>();
  for (const f of features) for (const k of Object.keys(f.properties ?? {})) keys.add(k);
  return [...keys];
}

/**
 * A zipped shapefile of any feature collection: .shp, .shx, .dbf (UTF-8), .cpg and .prj per
 * layer. A shapefile holds one shape type, so a collection mixing points, lines and polygons
 * becomes one layer per type ("name_points", "name_lines", "name_polygons"); a single type gives
 * one layer named `layerName`. Rings are written shells clockwise, holes counter-clockwise (ESRI
 * Shapefile Technical Description, July 1998). Field names are shortened to 10 characters by
 * `dbfFieldNames` (see {@link shapefileFieldNames}). Throws InputError for a GeometryCollection
 * (no shapefile type holds one).
 */
export function featuresToShapefileZip(fc: FeatureCollection, options: ShapefileWriteOptions = {}): Uint8Array {
  return zipSync(featuresToShapefileFiles(fc, options), { level: 6, mtime: options.date ?? new Date('2000-01-01T00:00:00Z') });
}

function layerBase(name: string, groupCount: number, type: number): string {
  return groupCount === 1 ? name : `${name}_${KIND_SUFFIX[type]}`;
}

/**
 * The field names each .dbf of {@link featuresToShapefileFiles} uses, by file base name: every
 * property key with the (at most 10-character) name it is written under.
 */
export function shapefileFieldNames(fc: FeatureCollection, layerName = 'features'): { file: string; names: Map<string, string> }[] {
  const name = layerName.replace(/[\\/:*?"<>|]/g, '_');
  const byType = new Map<number, Feature[]>();
  for (const f of fc.features) {
    const type = f.geometry?.type === 'GeometryCollection' ? null : shpParts(f.geometry)?.type;
    if (type === null) continue;
    const key = type ?? -1;
    byType.set(key, [...(byType.get(key) ?? []), f]);
  }
  // Features without geometry join the first typed layer, as featuresToShapefileFiles does.
  const nulls = byType.get(-1) ?? [];
  byType.delete(-1);
  if (byType.size === 0) byType.set(SHP_POINT, []);
  const first = byType.keys().next().value!;
  byType.set(first, [...byType.get(first)!, ...nulls]);
  return [...byType].map(([type, features]) => ({ file: layerBase(name, byType.size, type), names: dbfFieldNames(propertyKeys(features)) }));
}

/**
 * The files of {@link featuresToShapefileZip} by name, unzipped, so several collections can share
 * one archive (each with its own `layerName`).
 */
export function featuresToShapefileFiles(fc: FeatureCollection, options: ShapefileWriteOptions = {}): Record<string, Uint8Array> {
  const name = (options.layerName ?? 'features').replace(/[\\/:*?"<>|]/g, '_');
  if (options.crs && !options.prj) throw new Error('featuresToShapefileZip: a target crs needs its prj text');
  const toFile = options.crs ? options.crs.fromWgs84 : (lon: number, lat: number) => [lon, lat];
  const prj = options.prj ?? PRJ_WGS84;
  const groups = new Map<number, { features: Feature[]; parts: (Position[][] | null)[] }>();
  const nulls: Feature[] = [];
  fc.features.forEach((f, i) => {
    if (f.geometry?.type === 'GeometryCollection') {
      throw new InputError(`feature ${i}: a GeometryCollection cannot be written to a shapefile; split it first`);
    }
    const parts = shpParts(f.geometry);
    if (!parts) {
      nulls.push(f);
      return;
    }
    const type = parts.type;
    const projected = parts.parts.map((part) => part.map((p) => toFile(p[0], p[1])));
    const g = groups.get(type) ?? { features: [], parts: [] };
    g.features.push(f);
    g.parts.push(projected);
    groups.set(type, g);
  });
  if (groups.size === 0) groups.set(SHP_POINT, { features: [], parts: [] });
  const first = groups.values().next().value!;
  for (const f of nulls) {
    first.features.push(f);
    first.parts.push(null);
  }
  const files: Record<string, Uint8Array> = {};
  const enc = new TextEncoder();
  for (const [type, g] of groups) {
    const base = layerBase(name, groups.size, type);
    const { shp, shx } = shpWriteLayer(type, g.parts);
    let keys = propertyKeys(g.features);
    let rows = g.features.map((f) => (f.properties ?? {}) as Record<string, unknown>);
    if (keys.length === 0) {
      // dBASE tables need at least one column; number the records.
      keys = ['fid'];
      rows = rows.map((_, i) => ({ fid: i + 1 }));
    }
    files[`${base}.shp`] = shp;
    files[`${base}.shx`] = shx;
    files[`${base}.dbf`] = dbfWrite(rows, keys, options.date);
    files[`${base}.cpg`] = enc.encode('UTF-8');
    files[`${base}.prj`] = enc.encode(prj);
  }
  return files;
}
