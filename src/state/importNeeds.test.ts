import { zipSync } from 'fflate';
import type { FeatureCollection, Polygon } from 'geojson';
import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../core/geo/polygonAreaM2';
import { crsResolveEpsg } from '../io/crs/crsResolve';
import { featuresToGeoPackage } from '../io/formats/geopackage/featuresToGeoPackage';
import { featuresToShapefileFiles } from '../io/formats/shapefile/featuresToShapefileZip';
import { importAttempt } from './importActions';
import { importEncodingChoices, importNeedsOf } from './importNeeds';

// Invented strata near an invented coastal site in UTM zone 50S.
const ring: [number, number][] = [[119.1235, -34.44], [119.1255, -34.44], [119.1255, -34.4385], [119.1235, -34.4385], [119.1235, -34.44]];
const strata: FeatureCollection = {
  type: 'FeatureCollection',
  features: [{ type: 'Feature', properties: { habitat: 'Cafe heath' }, geometry: { type: 'Polygon', coordinates: [ring] } }],
};
const utm50s = crsResolveEpsg(32750, 'test');

function shapefileFiles(layerName: string): Record<string, Uint8Array> {
  return featuresToShapefileFiles(strata, { layerName, crs: utm50s, prj: 'PROJCS["WGS 84 / UTM zone 50S"]', date: new Date('2026-01-01T00:00:00Z') });
}

function withoutPrj(files: Record<string, Uint8Array>): Record<string, Uint8Array> {
  return Object.fromEntries(Object.entries(files).filter(([name]) => !name.endsWith('.prj') && !name.endsWith('.cpg')));
}

function geodesicAreaM2(r: [number, number][]): number {
  const poly = geodesic.Geodesic.WGS84.Polygon(false);
  for (const [lon, lat] of r.slice(0, -1)) poly.AddPoint(lat, lon);
  return Math.abs(poly.Compute(false, true).area ?? Number.NaN);
}

const csv = (text: string) => new TextEncoder().encode(text);

describe('finding what a map file needs chosen before it can be read', () => {
  it('asks for the EPSG code of a zipped shapefile without a .prj before reading it', async () => {
    const bytes = zipSync(withoutPrj(shapefileFiles('strata')));
    const attempt = await importAttempt('veg.zip', bytes);
    expect(attempt).toMatchObject({ needs: { epsg: true, encoding: false, layers: [], csvColumns: null } });
    const read = await importAttempt('veg.zip', bytes, { epsg: 32750 });
    if (!('preview' in read)) throw new Error('expected the file to read with its EPSG code');
    // Reference: GeographicLib's JavaScript port (geographiclib-geodesic 2.2), geodesic area on WGS84.
    const areaM2 = polygonAreaM2(read.preview.features.features[0].geometry as Polygon);
    expect(Math.abs(areaM2 - geodesicAreaM2(ring))).toBeLessThan(0.05);
  });

  it('lists the layers of a zip holding two shapefiles and reads the one chosen', async () => {
    const bytes = zipSync({ ...shapefileFiles('heath'), ...shapefileFiles('scrub') });
    const attempt = await importAttempt('two.zip', bytes);
    expect(attempt).toMatchObject({ needs: { layers: ['heath', 'scrub'], epsg: false } });
    const read = await importAttempt('two.zip', bytes, { layer: 'scrub' });
    expect('preview' in read && read.preview.polygons).toBe(1);
  });

  it('asks for the encoding of a .dbf without .cpg whose text is Windows-1252, and decodes it when given', async () => {
    const files = shapefileFiles('strata');
    const dbf = files['strata.dbf'].slice();
    const at = new TextDecoder('latin1').decode(dbf).indexOf('Cafe');
    dbf[at + 3] = 0xe9; // "é" in Windows-1252 (WHATWG index-windows-1252), not valid UTF-8 on its own
    const noCpg = zipSync(Object.fromEntries(Object.entries({ ...files, 'strata.dbf': dbf }).filter(([n]) => !n.endsWith('.cpg'))));
    expect(await importAttempt('latin.zip', noCpg)).toMatchObject({ needs: { encoding: true, epsg: false } });
    const read = await importAttempt('latin.zip', noCpg, { encoding: 'windows-1252' });
    expect('preview' in read && read.preview.features.features[0].properties?.habitat).toBe('Café heath');
  });

  it('asks for the columns of a point CSV whose coordinate columns are not recognised', async () => {
    const bytes = csv('gate,E_grid,N_grid\nNorth gate,551234.5,6188765.25\n');
    const attempt = await importAttempt('gates.csv', bytes);
    expect(attempt).toMatchObject({ needs: { csvColumns: ['gate', 'E_grid', 'N_grid'] } });
    const read = await importAttempt('gates.csv', bytes, { csvColumns: { x: 'E_grid', y: 'N_grid', epsg: 32750 } });
    if (!('preview' in read)) throw new Error('expected the CSV to read with its columns');
    // Reference: GeographicLib GeoConvert (Debian geographiclib-tools): `GeoConvert -g -p 6` on
    // "50s 551234.5 6188765.25" gives -34.441350 117.557697.
    const [lon, lat] = (read.preview.features.features[0].geometry as { coordinates: number[] }).coordinates;
    expect(lon).toBeCloseTo(117.557697, 6);
    expect(lat).toBeCloseTo(-34.44135, 6);
  });

  it('asks only for the EPSG code of a CSV of eastings and northings without a zone column', async () => {
    const bytes = csv('name,easting,northing\nGate,551234.5,6188765.25\n');
    expect(await importAttempt('pts.csv', bytes)).toMatchObject({ needs: { epsg: true, csvColumns: null } });
    expect('preview' in (await importAttempt('pts.csv', bytes, { epsg: 32750 }))).toBe(true);
  });

  it('offers the folders of a KML file, reading every folder together also allowed', async () => {
    // KML 2.2 (OGC 07-147r2): Folder and Placemark elements; coordinates are lon,lat.
    const kml = `<?xml version="1.0" encoding="UTF-8"?><kml xmlns="http://www.opengis.net/kml/2.2"><Document>
      <Folder><name>Heath</name><Placemark><name>a</name><Point><coordinates>119.12,-34.44</coordinates></Point></Placemark></Folder>
      <Folder><name>Scrub</name><Placemark><name>b</name><Point><coordinates>119.13,-34.44</coordinates></Point></Placemark></Folder>
    </Document></kml>`;
    const bytes = new TextEncoder().encode(kml);
    expect(await importAttempt('site.kml', bytes)).toMatchObject({ needs: { layers: ['Heath', 'Scrub'], layerOptional: true } });
    const one = await importAttempt('site.kml', bytes, { layer: 'Scrub' });
    expect('preview' in one && one.preview.points).toBe(1);
  });

  it('lists the feature tables of a GeoPackage holding two layers', async () => {
    const bytes = await featuresToGeoPackage([
      { name: 'heath', features: strata },
      { name: 'scrub', features: strata },
    ]);
    expect(await importAttempt('site.gpkg', bytes)).toMatchObject({ needs: { layers: ['heath', 'scrub'], layerOptional: false } });
    const read = await importAttempt('site.gpkg', bytes, { layer: 'heath' });
    expect('preview' in read && read.preview.polygons).toBe(1);
  });

  it('asks for the EPSG code of a GeoJSON file whose "crs" member names no EPSG code', async () => {
    const bytes = new TextEncoder().encode(JSON.stringify({ ...strata, crs: { type: 'name', properties: { name: 'local grid' } } }));
    expect(await importAttempt('grid.geojson', bytes)).toMatchObject({ needs: { epsg: true }, refusal: expect.stringContaining('grid.geojson') });
  });

  it('needs nothing for a GeoJSON file in longitude/latitude', async () => {
    const bytes = new TextEncoder().encode(JSON.stringify(strata));
    expect(await importNeedsOf('veg.geojson', bytes, {}, null)).toBeNull();
  });

  it('offers UTF-8, Windows-1252 and ISO-8859-1 among the encodings the runtime decodes', () => {
    expect(importEncodingChoices()).toEqual(expect.arrayContaining(['utf-8', 'windows-1252', 'iso-8859-1']));
  });
});
