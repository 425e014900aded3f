import type { FeatureCollection } from 'geojson';
import { unzipSync } from 'fflate';
import { describe, expect, it } from 'vitest';
import { featuresToKml, featuresToKmz } from './featuresToKml';
import { NON_ASCII_NAMES, positionGapDeg, sampleExclusions, sampleFeatures, samplePlots, withoutNulls } from '../../fixtures/ioSamples';
import { kmlLayers, parseKml } from './parseKml';
import { xmlParse } from '../../common/xmlParse';

const KML_NS = 'http://www.opengis.net/kml/2.2';

function layers() {
  return [
    { name: 'Plots', features: samplePlots() as FeatureCollection },
    { name: 'Strata', features: sampleFeatures(-3.2, 55.95) },
    { name: 'Exclusions', features: sampleExclusions(-3.2, 55.95) },
  ];
}

/*
 * No offline copy of the OGC KML 2.2 XML schema exists here, so the document is checked
 * structurally against OGC 07-147r2 (KML 2.2): the namespace, coordinates as lon,lat[,alt]
 * tuples, closed LinearRings of at least 4 positions, and the child order the schema's
 * sequences prescribe (Feature: name, description, styleUrl, ExtendedData, then the geometry;
 * Document: Feature elements and styles, Schema, then the Folders).
 */
describe('featuresToKml', () => {
  it('writes a KML 2.2 document whose structure follows the OGC KML 2.2 standard', () => {
    const doc = xmlParse('out.kml', featuresToKml(layers(), { name: 'Invented site' }));
    expect(doc.documentElement.namespaceURI).toBe(KML_NS);
    expect(doc.documentElement.localName).toBe('kml');
    const coords = Array.from(doc.getElementsByTagNameNS(KML_NS, 'coordinates'));
    expect(coords.length).toBeGreaterThan(10);
    for (const c of coords) {
      for (const tuple of (c.textContent ?? '').trim().split(/\s+/)) {
        expect(tuple).toMatch(/^-?\d+(\.\d+)?,-?\d+(\.\d+)?(,-?\d+(\.\d+)?)?$/);
        const [lon, lat] = tuple.split(',').map(Number);
        expect(Math.abs(lon)).toBeLessThanOrEqual(180);
        expect(Math.abs(lat)).toBeLessThanOrEqual(90);
      }
    }
    for (const ring of Array.from(doc.getElementsByTagNameNS(KML_NS, 'LinearRing'))) {
      const tuples = (ring.textContent ?? '').trim().split(/\s+/);
      expect(tuples.length).toBeGreaterThanOrEqual(4);
      expect(tuples[0]).toBe(tuples[tuples.length - 1]);
    }
    const order = ['name', 'description', 'styleUrl', 'ExtendedData', 'Point', 'LineString', 'Polygon', 'MultiGeometry'];
    for (const pm of Array.from(doc.getElementsByTagNameNS(KML_NS, 'Placemark'))) {
      const names = Array.from(pm.childNodes).filter((n) => n.nodeType === 1).map((n) => (n as Element).localName);
      const ranks = names.map((n) => order.indexOf(n));
      expect(ranks.every((r) => r >= 0)).toBe(true);
      expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
    }
    const top = Array.from(doc.getElementsByTagNameNS(KML_NS, 'Document')[0].childNodes)
      .filter((n) => n.nodeType === 1)
      .map((n) => (n as Element).localName);
    expect(top[0]).toBe('name');
    expect(top.lastIndexOf('Style')).toBeLessThan(top.indexOf('Schema'));
    expect(top.indexOf('Schema')).toBeLessThan(top.indexOf('Folder'));
  });

  it('styles the four field states by the shared symbol code, and names reserves as such', () => {
    const text = featuresToKml(layers());
    // KML colours are aabbggrr (OGC KML 2.2, kml:colorType): #1d2a2e → ff2e2a1d, #ee3377 → ff7733ee.
    expect(text).toContain('<Style id="sp-plot-primary"><IconStyle><color>ff2e2a1d</color>');
    expect(text).toContain('<Style id="sp-plot-reserve"><IconStyle><color>ffffffff</color>');
    expect(text).toContain('<Style id="sp-plot-promoted"><IconStyle><color>ff7733ee</color>');
    expect(text).toContain('<Style id="sp-plot-rejected"><IconStyle><color>ff6d6d6d</color>');
    expect(text).toContain('<Placemark><name>P005 (reserve)</name>');
    expect(text).toContain('<styleUrl>#sp-plot-reserve</styleUrl>');
  });

  it('colours exclusions by kind as the planner does', () => {
    const text = featuresToKml(layers());
    // Cliff #D55E00 → ff005ed5 (line colour) in aabbggrr.
    expect(text).toMatch(/<Style id="sp-excl-cliff"><IconStyle><color>ff005ed5<\/color>/);
  });

  it('round-trips plots, strata and exclusions with typed attributes and non-ASCII names through KML', async () => {
    const bytes = new TextEncoder().encode(featuresToKml(layers()));
    expect(kmlLayers('site.kml', bytes)).toEqual(['Plots', 'Strata', 'Exclusions']);
    for (const layer of layers()) {
      const back = await parseKml('site.kml', bytes, { layer: layer.name });
      expect(back.features).toHaveLength(layer.features.features.length);
      back.features.forEach((f, i) => {
        const original = layer.features.features[i];
        expect(positionGapDeg(f, original)).toBeLessThanOrEqual(1e-7);
        expect(f.properties).toEqual(withoutNulls(original.properties));
      });
    }
    const strata = await parseKml('site.kml', bytes, { layer: 'strata' });
    expect(strata.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    expect((await parseKml('site.kml', bytes)).features).toHaveLength(11);
  });

  it('packs KMZ with doc.kml and the four plot icons, and reads it back the same', async () => {
    const kmz = featuresToKmz(layers(), { name: 'Invented site' });
    const files = unzipSync(kmz);
    expect(Object.keys(files).sort()).toEqual(['doc.kml', 'files/plot-primary.png', 'files/plot-promoted.png', 'files/plot-rejected.png', 'files/plot-reserve.png']);
    // PNG signature (PNG specification §5.2).
    expect([...files['files/plot-primary.png'].subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const back = await parseKml('site.kmz', kmz, { layer: 'Plots' });
    const plots = samplePlots();
    back.features.forEach((f, i) => {
      expect(positionGapDeg(f, plots.features[i])).toBeLessThanOrEqual(1e-7);
      expect(f.properties).toEqual(withoutNulls(plots.features[i].properties as unknown as Record<string, unknown>));
    });
  });

  it('names the missing folder and lists those there are', async () => {
    const bytes = new TextEncoder().encode(featuresToKml(layers()));
    await expect(parseKml('site.kml', bytes, { layer: 'Roads' })).rejects.toThrow('site.kml: no folder "Roads"; folders are: Plots, Strata, Exclusions');
  });

  it('reads a hand-written KML from elsewhere, keeping name, description and ExtendedData only', async () => {
    const text = `<kml xmlns="${KML_NS}"><Document><Style id="s"><LineStyle><color>ff0000ff</color></LineStyle></Style>
      <Placemark><name>Creek</name><description>seasonal</description><styleUrl>#s</styleUrl>
      <ExtendedData><Data name="kind"><value>water</value></Data></ExtendedData>
      <LineString><coordinates>172.1,-43.1 172.2,-43.2,15</coordinates></LineString></Placemark></Document></kml>`;
    const back = await parseKml('creek.kml', new TextEncoder().encode(text));
    expect(back.features[0].properties).toEqual({ name: 'Creek', description: 'seasonal', kind: 'water' });
    expect(back.features[0].geometry).toEqual({ type: 'LineString', coordinates: [[172.1, -43.1], [172.2, -43.2, 15]] });
  });

  it('refuses a polygon ring of two positions, naming the layer and feature', () => {
    const fc: FeatureCollection = { type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[0, 0], [1, 1]]] } }] };
    expect(() => featuresToKml([{ name: 'Strata', features: fc }])).toThrow('Strata: feature 0: a polygon ring has fewer than 3 distinct positions');
  });
});

describe('parseKml on bad input', () => {
  it('names the placemark whose coordinates are not longitude,latitude', async () => {
    const text = `<kml xmlns="${KML_NS}"><Placemark><name>Stake</name><Point><coordinates>172.1,-143.1</coordinates></Point></Placemark></kml>`;
    await expect(parseKml('bad.kml', new TextEncoder().encode(text))).rejects.toThrow('bad.kml: placemark 0 ("Stake"): coordinate 1 "172.1,-143.1" is not longitude,latitude[,altitude] in WGS84 degrees');
  });

  it('says a file is not KML', async () => {
    await expect(parseKml('x.kml', new TextEncoder().encode('<gpx/>'))).rejects.toThrow('x.kml: not a KML file (the root element is <gpx>, not <kml>)');
  });
});
