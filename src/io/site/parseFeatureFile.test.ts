import { describe, expect, it } from 'vitest';
import { parseFeatureFile } from './parseFeatureFile';

const enc = (s: string) => new TextEncoder().encode(s);
const square = { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]]] };

describe('parseFeatureFile', () => {
  it('reads a FeatureCollection and keeps ids and properties', async () => {
    const text = JSON.stringify({ type: 'FeatureCollection', features: [{ type: 'Feature', id: 'a', properties: { stratum: 'Heath' }, geometry: square }] });
    const fc = await parseFeatureFile('site.geojson', enc(text));
    expect(fc.features).toHaveLength(1);
    expect(fc.features[0].id).toBe('a');
    expect(fc.features[0].properties).toEqual({ stratum: 'Heath' });
  });

  it('wraps a single Feature and a bare geometry in a collection', async () => {
    const one = await parseFeatureFile('f.json', enc(JSON.stringify({ type: 'Feature', properties: null, geometry: square })));
    expect(one.features).toHaveLength(1);
    const bare = await parseFeatureFile('g.geojson', enc(JSON.stringify(square)));
    expect(bare.features[0].geometry).toEqual(square);
  });

  it('skips a UTF-8 byte-order mark', async () => {
    const fc = await parseFeatureFile('bom.geojson', enc(`\ufeff${JSON.stringify(square)}`));
    expect(fc.features).toHaveLength(1);
  });

  it('says where the JSON breaks, by line and column', async () => {
    await expect(parseFeatureFile('bad.geojson', enc('{\n  "type": "FeatureCollection",\n  features: []\n}'))).rejects.toThrow(
      'bad.geojson: not valid JSON (line 3, column 3)',
    );
    await expect(parseFeatureFile('cut.geojson', enc('{"type": '))).rejects.toThrow('cut.geojson: not valid JSON (line 1, column 10)');
  });

  it('rejects unknown file types and lists the supported ones', async () => {
    await expect(parseFeatureFile('notes.txt', enc('x'))).rejects.toThrow(/notes\.txt: unsupported file type "\.txt"; supported: .*\.geojson/);
  });

  it('names the feature whose coordinates are malformed', async () => {
    const text = JSON.stringify({
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', properties: {}, geometry: square },
        { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[0, 0], ['x', 1], [1, 1]]] } },
      ],
    });
    await expect(parseFeatureFile('m.geojson', enc(text))).rejects.toThrow(/m\.geojson: feature 1: Polygon has a position that is not \[lon, lat\] numbers/);
  });

  it('passes CRS84 and EPSG:4326 through unchanged', async () => {
    for (const name of ['urn:ogc:def:crs:OGC:1.3:CRS84', 'EPSG:4326', 'urn:ogc:def:crs:EPSG::4326']) {
      const fc = await parseFeatureFile('c.geojson', enc(JSON.stringify({ type: 'FeatureCollection', crs: { type: 'name', properties: { name } }, features: [{ type: 'Feature', properties: {}, geometry: square }] })));
      expect(fc.features[0].geometry).toEqual(square);
    }
  });

  it('reprojects a UTM file named by its crs member to the published lon/lat', async () => {
    // docs/references.md §2 (proj4 2.22, Krüger series and GeoConvert agree to 1 mm):
    // −33.8688, 151.2093 is 56S E 334368.634 N 6250948.345.
    const pt = { type: 'Point', coordinates: [334368.634, 6250948.345] };
    const fc = await parseFeatureFile('utm.geojson', enc(JSON.stringify({ type: 'FeatureCollection', crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::32756' } }, features: [{ type: 'Feature', properties: {}, geometry: pt }] })));
    const [lon, lat] = (fc.features[0].geometry as { coordinates: number[] }).coordinates;
    expect(lon).toBeCloseTo(151.2093, 7);
    expect(lat).toBeCloseTo(-33.8688, 7);
  });

  it('uses the epsg option when the file has no crs member', async () => {
    // docs/references.md §2: 40.5, −73.5 is 18N E 627103.087 N 4484335.402.
    const pt = { type: 'Point', coordinates: [627103.087, 4484335.402] };
    const fc = await parseFeatureFile('p.geojson', enc(JSON.stringify(pt)), { epsg: 32618 });
    const [lon, lat] = (fc.features[0].geometry as { coordinates: number[] }).coordinates;
    expect(lon).toBeCloseTo(-73.5, 7);
    expect(lat).toBeCloseTo(40.5, 7);
  });

  it('names a coordinate system it cannot convert and lists the ones it can', async () => {
    const text = JSON.stringify({ type: 'FeatureCollection', crs: { type: 'name', properties: { name: 'EPSG:3111' } }, features: [] });
    await expect(parseFeatureFile('vicgrid.geojson', enc(text))).rejects.toThrow(/^vicgrid\.geojson: EPSG:3111 is not a coordinate system stratplot knows; supported: 4326, /);
  });

  it('refuses bytes that are not UTF-8 unless an encoding is given', async () => {
    // "Forêt" in windows-1252 (ê = 0xEA, WHATWG index-windows-1252): not valid UTF-8.
    const head = enc('{"type":"Feature","properties":{"stratum":"For');
    const tail = enc(`t"},"geometry":${JSON.stringify(square)}}`);
    const bytes = Uint8Array.from([...head, 0xea, ...tail]);
    await expect(parseFeatureFile('legacy.geojson', bytes)).rejects.toThrow(/^legacy\.geojson: the file is not UTF-8 text, as JSON must be \(RFC 8259\)/);
    const fc = await parseFeatureFile('legacy.geojson', bytes, { encoding: 'windows-1252' });
    expect(fc.features[0].properties?.stratum).toBe('Forêt');
  });

  it('rejects JSON that is not GeoJSON', async () => {
    await expect(parseFeatureFile('x.json', enc('[1,2]'))).rejects.toThrow('x.json: not GeoJSON');
    await expect(parseFeatureFile('x.json', enc('{"type":"Topology"}'))).rejects.toThrow('x.json: not GeoJSON (type is "Topology")');
  });
});
