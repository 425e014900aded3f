import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { FeatureCollection } from 'geojson';
import { GPX_XSD } from '../../../tests/schemas/paths';
import { describe, expect, it } from 'vitest';
import { plotCollectionForField } from '../../core/field/plotCollectionForField';
import { featuresToGpx } from '../formats/gpx/featuresToGpx';
import { NON_ASCII_NAMES, positionGapDeg, sampleExclusions, sampleFeatures, samplePlots } from '../fixtures/ioSamples';
import { parseGpx } from '../formats/gpx/parseGpx';
import { designOutputBytes } from './designOutput';

/** The GPX the field kit writes for a plot list with no site: the real writer, not a copy. */
async function fieldKitGpx(plots: ReturnType<typeof samplePlots>): Promise<string> {
  return new TextDecoder().decode(await designOutputBytes('plots.gpx', plots));
}

// The GPX 1.1 schema as published by Topografix (copy in tests/schemas, see docs/references.md §9).
const XSD = GPX_XSD;

function xmllint(text: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'stratplot-gpx-'));
  const file = join(dir, 'out.gpx');
  writeFileSync(file, text);
  try {
    execFileSync('xmllint', ['--noout', '--schema', XSD, file], { stdio: 'pipe' });
    return 'valid';
  } catch (error) {
    return String((error as { stderr?: Buffer }).stderr ?? error);
  }
}

describe('the field-kit GPX of a plot list', () => {
  it('writes waypoints that validate against the GPX 1.1 schema with xmllint', async () => {
    expect(xmllint(await fieldKitGpx(samplePlots()))).toBe('valid');
  });

  it('labels each waypoint with plot id, field state, what to do, stratum and rank, and the notes', async () => {
    const text = await fieldKitGpx(samplePlots());
    expect(text).toContain('<name>P001</name><cmt>primary 1: =HYPERLINK(&quot;http://example.invalid&quot;)</cmt><desc>Primary plot, rank 1: sample it. Stratum: Forêt humide.</desc><type>primary</type>');
    expect(text).toContain('<name>P002</name><cmt>primary 2: +1 steep</cmt><desc>Primary plot, rank 2: sample it. Stratum: Ngā otaota.</desc><type>primary</type>');
    expect(text).toContain('<name>P005</name><cmt>reserve 1: &#9;indented</cmt><desc>Reserve, rank 1, waiting: use it only to replace a rejected plot of its stratum, in rank order. Stratum: Ngā otaota.</desc><type>reserve</type>');
  });

  it('reads back the same coordinates and every plot attribute, notes with tab and CR included', async () => {
    const plots = samplePlots();
    const back = await parseGpx('plots.gpx', new TextEncoder().encode(await fieldKitGpx(plots)));
    expect(back.features).toHaveLength(plots.features.length);
    const field = plotCollectionForField(plots);
    back.features.forEach((f, i) => {
      expect(positionGapDeg(f, plots.features[i])).toBeLessThanOrEqual(1e-7);
      expect(f.properties).toEqual(field.features[i].properties);
    });
    expect(back.features[5].properties?.notes).toBe('\rreturn');
  });
});

describe('featuresToGpx and parseGpx', () => {
  it('round-trips strata polygons and exclusion lines and points, and still validates', async () => {
    const fc: FeatureCollection = {
      type: 'FeatureCollection',
      features: [...sampleFeatures(-70.6, -33.4).features, ...sampleExclusions(-70.6, -33.4).features],
    };
    const text = featuresToGpx(fc, { name: 'Invented site — 草地' });
    expect(xmllint(text)).toBe('valid');
    const back = await parseGpx('site.gpx', new TextEncoder().encode(text));
    for (const original of fc.features) {
      const match = back.features.find((f) => JSON.stringify(f.properties) === JSON.stringify(original.properties));
      expect(match, JSON.stringify(original.properties)).toBeDefined();
      expect(positionGapDeg(match!, original)).toBeLessThanOrEqual(1e-7);
    }
    expect(back.features.filter((f) => f.geometry.type === 'Polygon' || f.geometry.type === 'MultiPolygon').map((f) => f.properties?.stratum).sort()).toEqual(
      [...NON_ASCII_NAMES].sort(),
    );
  });

  it('reads a plain GPX from another source: tracks and routes as lines, waypoints as points', async () => {
    const text = `<?xml version="1.0"?><gpx version="1.1" creator="hand" xmlns="http://www.topografix.com/GPX/1/1">
      <wpt lat="-41.29" lon="174.78"><name>Gate 3</name><desc>locked</desc></wpt>
      <rte><name>Access road</name><rtept lat="-41.29" lon="174.78"/><rtept lat="-41.3" lon="174.79"/></rte>
      <trk><name>Ridge walk</name><trkseg><trkpt lat="-41.31" lon="174.8"/><trkpt lat="-41.32" lon="174.81"/></trkseg></trk></gpx>`;
    const back = await parseGpx('hand.gpx', new TextEncoder().encode(text));
    const byName = Object.fromEntries(back.features.map((f) => [f.properties?.name, f.geometry]));
    expect(byName['Gate 3']).toEqual({ type: 'Point', coordinates: [174.78, -41.29] });
    expect(byName['Access road'].type).toBe('LineString');
    expect(byName['Ridge walk']).toEqual({ type: 'LineString', coordinates: [[174.8, -41.31], [174.81, -41.32]] });
  });

  it('names a waypoint whose latitude is not a number instead of skipping it', async () => {
    const text = '<gpx version="1.1" creator="x" xmlns="http://www.topografix.com/GPX/1/1"><wpt lat="1" lon="2"/><wpt lat="north" lon="2"><name>Gate</name></wpt></gpx>';
    await expect(parseGpx('w.gpx', new TextEncoder().encode(text))).rejects.toThrow('w.gpx: <wpt> 2 ("Gate"): lat="north" is not a latitude (−90 to 90)');
  });

  it('says what is wrong with a file that is not GPX or not XML', async () => {
    await expect(parseGpx('a.gpx', new TextEncoder().encode('<kml/>'))).rejects.toThrow('a.gpx: not a GPX file (the root element is <kml>, not <gpx>)');
    await expect(parseGpx('b.gpx', new TextEncoder().encode('<gpx><wpt></gpx>'))).rejects.toThrow(/^b\.gpx: not well-formed XML at line 1/);
  });
});
