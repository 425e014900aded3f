import type { Feature, FeatureCollection, Geometry, Position } from 'geojson';
import { parseShp } from 'shpjs';
import { InputError } from '../core/InputError';
import { crsFromPrj } from './crsFromPrj';
import { type CrsTransform, crsResolveEpsg } from './crsResolve';
import { dbfEncodingLabel, dbfRead } from './dbfRead';
import { geometryMapPositions } from './featuresToWgs84';
import type { ImportOptions } from './importOptions';
import { zipEntries, zipEntryNoCase } from './zipEntries';

/** Names of the shapefile layers in a zip (paths of the .shp entries without the extension). */
export function shapefileLayers(entries: Record<string, Uint8Array>): string[] {
  return Object.keys(entries)
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
  const entries = zipEntries(fileName, bytes);
  const layer = pickLayer(fileName, shapefileLayers(entries), options.layer);
  const where = `${fileName} (${layer}.shp)`;
  const crs = layerCrs(where, zipEntryNoCase(entries, `${layer}.prj`), options.epsg);
  let shapes: (Geometry | null)[];
  try {
    shapes = parseShp(zipEntryNoCase(entries, `${layer}.shp`)!);
  } catch (error) {
    throw new InputError(`${where}: the .shp is damaged or of an unsupported shape type (${(error as Error).message})`);
  }
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
