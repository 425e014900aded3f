import type { Feature, FeatureCollection, Geometry, Position } from 'geojson';
import { parseShp } from 'shpjs';
import { InputError } from '../../../core/common/InputError';
import { crsDegreesCheck } from '../../crs/crsDegreesCheck';
import { crsFromPrj } from '../../crs/crsFromPrj';
import { type CrsTransform, crsResolveEpsg } from '../../crs/crsResolve';
import { dbfEncodingLabel, dbfRead } from './dbfRead';
import { geometryMapPositions } from '../../crs/featuresToWgs84';
import type { ImportOptions } from '../../common/importOptions';
import { shpValidate } from './shpValidate';
import { zipEntries, zipEntryNoCase, zipEntryPaths } from '../../common/zipEntries';

/** Names of the shapefile layers in a zip (paths of the .shp entries without the extension), from its entries or their paths. */
export function shapefileLayers(entries: Record<string, Uint8Array> | readonly string[]): string[] {
  return (Array.isArray(entries) ? entries : Object.keys(entries))
    .filter((p) => p.toLowerCase().endsWith('.shp'))
    .map((p) => p.slice(0, -4))
    .sort();
}

function pickLayer(fileName: string, layers: string[], wanted: string | undefined): string {
  if (layers.length === 0) throw new InputError(`${fileName}: the zip holds no shapefile (.shp)`);
  if (wanted === undefined) {
    if (layers.length === 1) return layers[0];
    throw new InputError(`${fileName}: holds ${layers.length} shapefiles; choose one with --layer: ${layers.join(', ')}`);
  }
  const hit = layers.find((l) => l === wanted) ?? layers.find((l) => l.split('/').pop()!.toLowerCase() === wanted.toLowerCase());
  if (!hit) throw new InputError(`${fileName}: no layer "${wanted}"; layers are: ${layers.join(', ')}`);
  return hit;
}

/** The sidecar files of one layer that the reader uses (.shp, .dbf, .prj, .cpg), by path ignoring case. */
function isLayerFile(path: string, layer: string): boolean {
  const lower = path.toLowerCase();
  const base = layer.toLowerCase();
  return ['.shp', '.dbf', '.prj', '.cpg'].some((ext) => lower === base + ext);
}

function ringsOf(g: Geometry | null): number {
  if (!g) return 0;
  if (g.type === 'Polygon' || g.type === 'MultiLineString') return g.coordinates.filter((r) => r.length > 0).length;
  if (g.type === 'MultiPolygon') return g.coordinates.reduce((n, p) => n + p.filter((r) => r.length > 0).length, 0);
  if (g.type === 'LineString' || g.type === 'MultiPoint') return g.coordinates.length > 0 ? 1 : 0;
  return 1;
}

/**
 * The assembled shapes must hold every part the file has: a ring left over while holes are matched
 * to outer rings (a counter-clockwise ring inside no clockwise one, ESRI's ring order) would shrink
 * the stratum without a word, so it is refused, naming the record.
 */
function shapesMatchLayout(shapes: (Geometry | null)[], parts: number[], where: string): void {
  if (shapes.length !== parts.length) throw new InputError(`${where}: the .shp has ${parts.length} records but only ${shapes.length} could be read`);
  shapes.forEach((g, i) => {
    const got = ringsOf(g);
    if (got === parts[i]) return;
    throw new InputError(
      `${where}: feature ${i}: ${parts[i] - got} of its ${parts[i]} rings cannot be placed: a hole (a counter-clockwise ring) lies inside no outer (clockwise) ring; fix the ring order`,
    );
  });
}

function layerCrs(where: string, prj: Uint8Array | undefined, epsg: number | undefined): CrsTransform {
  if (epsg !== undefined) return crsResolveEpsg(epsg, where);
  if (!prj) {
    throw new InputError(`${where}: has no .prj, so its coordinate system is unknown; give the EPSG code (--epsg)`);
  }
  return crsFromPrj(new TextDecoder().decode(prj), where);
}

function checkPosition(p: Position, where: string, index: number, crs: CrsTransform): void {
  const [lon, lat] = p;
  if (!Number.isFinite(lon) || !Number.isFinite(lat) || Math.abs(lat) > 90 || Math.abs(lon) > 540) {
    throw new InputError(
      `${where}: feature ${index}: coordinates do not fit ${crs.label} (check the .prj or --epsg)`,
    );
  }
}

/**
 * Reads one layer of a zipped shapefile as WGS84 GeoJSON. Geometry is parsed by shpjs in the
 * file's own coordinates, then every position is reprojected from the CRS of the .prj (or
 * `options.epsg`, which overrides it). Attributes come from the .dbf, decoded with the .cpg's
 * encoding, else `options.encoding`, else strict UTF-8. Throws InputError (file, layer, feature)
 * when there is no .shp, several and no `options.layer`, no .prj and no EPSG code, an unknown
 * CRS, a damaged file, or a .dbf whose record count does not match the shapes.
 */
export async function parseShapefileZip(fileName: string, bytes: Uint8Array, options: ImportOptions = {}): Promise<FeatureCollection> {
  const layer = pickLayer(fileName, shapefileLayers(zipEntryPaths(fileName, bytes)), options.layer);
  const entries = zipEntries(fileName, bytes, (p) => isLayerFile(p, layer));
  const where = `${fileName} (${layer}.shp)`;
  const crs = layerCrs(where, zipEntryNoCase(entries, `${layer}.prj`), options.epsg);
  const shp = zipEntryNoCase(entries, `${layer}.shp`)!;
  const layout = shpValidate(shp, where);
  let shapes: (Geometry | null)[];
  try {
    shapes = parseShp(shp);
  } catch (error) {
    throw new InputError(`${where}: the .shp is damaged or of an unsupported shape type (${(error as Error).message})`);
  }
  shapesMatchLayout(shapes, layout.parts, where);
  crsDegreesCheck({ type: 'FeatureCollection', features: shapes.map((g) => ({ type: 'Feature', properties: {}, geometry: g as Geometry })) }, crs, where);
  const dbfBytes = zipEntryNoCase(entries, `${layer}.dbf`);
  const cpg = zipEntryNoCase(entries, `${layer}.cpg`);
  const encodingText = cpg ? new TextDecoder().decode(cpg) : options.encoding;
  const encoding = encodingText ? dbfEncodingLabel(encodingText, where) : undefined;
  const rows = dbfBytes ? dbfRead(dbfBytes, where, encoding).rows : shapes.map(() => ({}));
  if (rows.length !== shapes.length) {
    throw new InputError(`${where}: the .shp has ${shapes.length} shapes but the .dbf has ${rows.length} records`);
  }
  const features: Feature[] = [];
  shapes.forEach((shape, i) => {
    const properties = rows[i];
    if (properties === null) return; // deleted in the .dbf
    let geometry: Geometry | null = null;
    if (shape) {
      geometry = crs.epsg === 4326 && crs.isGeographic ? shape : geometryMapPositions(shape, (p) => crs.toWgs84(p[0], p[1]));
      geometryMapPositions(geometry, (p) => {
        checkPosition(p, where, i, crs);
        return p;
      });
      delete (geometry as { bbox?: unknown }).bbox;
    }
    features.push({ type: 'Feature', geometry: geometry as Geometry, properties: { ...properties } });
  });
  return { type: 'FeatureCollection', features };
}
