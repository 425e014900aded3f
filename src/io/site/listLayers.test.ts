import { describe, expect, it } from 'vitest';
import { featuresToGeoPackage } from '../formats/geopackage/featuresToGeoPackage';
import { featuresToKmz } from '../formats/kml/featuresToKml';
import { featuresToShapefileZip } from '../formats/shapefile/featuresToShapefileZip';
import { sampleExclusions, sampleFeatures } from '../fixtures/ioSamples';
import { listLayers } from './listLayers';

describe('listLayers', () => {
  it('lists shapefiles in a zip, KMZ folders and GeoPackage tables', async () => {
    const strata = sampleFeatures(0, 0);
    const excl = sampleExclusions(0, 0);
    const mixed = { type: 'FeatureCollection' as const, features: [...strata.features, ...excl.features] };
    expect(await listLayers('a.zip', featuresToShapefileZip(mixed, { layerName: 'site' }))).toEqual(['site_lines', 'site_points', 'site_polygons']);
    expect(await listLayers('a.kmz', featuresToKmz([{ name: 'Strata', features: strata }, { name: 'Exclusions', features: excl }]))).toEqual(['Strata', 'Exclusions']);
    expect(await listLayers('a.gpkg', await featuresToGeoPackage([{ name: 'strata', features: strata }]))).toEqual(['strata']);
  });

  it('gives no layers for single-layer formats and refuses an unknown type', async () => {
    expect(await listLayers('a.gpx', new Uint8Array(0))).toEqual([]);
    await expect(listLayers('a.dxf', new Uint8Array(0))).rejects.toThrow('a.dxf: unsupported file type ".dxf"');
  });
});
