import { InputError } from '../../core/common/InputError';
import type { ImportOptions } from '../common/importOptions';
import { geoPackageLayers } from '../formats/geopackage/parseGeoPackage';
import { kmlLayers } from '../formats/kml/parseKml';
import { shapefileLayers } from '../formats/shapefile/parseShapefileZip';
import { zipEntryPaths } from '../common/zipEntries';

/**
 * Layer names of a map file that can hold several, for `options.layer`: the shapefiles in a zip,
 * the folders of a KML/KMZ, the feature tables of a GeoPackage. Single-layer formats (GeoJSON,
 * GPX, CSV) give an empty list. Throws InputError naming the file when it cannot be read.
 */
export async function listLayers(fileName: string, bytes: Uint8Array, options: Pick<ImportOptions, 'sqlJsInit'> = {}): Promise<string[]> {
  const ext = fileName.slice(fileName.lastIndexOf('.') + 1).toLowerCase();
  switch (ext) {
    case 'zip':
      return shapefileLayers(zipEntryPaths(fileName, bytes));
    case 'kml':
    case 'kmz':
      return kmlLayers(fileName, bytes);
    case 'gpkg':
      return geoPackageLayers(fileName, bytes, options);
    case 'geojson':
    case 'json':
    case 'gpx':
    case 'csv':
      return [];
    default:
      throw new InputError(`${fileName}: unsupported file type ".${ext}"`);
  }
}
