import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Feature, FeatureCollection } from 'geojson';
import { GPX_XSD } from '../../../tests/schemas/paths';
import { describe, expect, it } from 'vitest';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { plotCollectionForField } from '../../core/field/plotCollectionForField';
import { plotCollectionNamed } from '../../core/field/plotCollectionNamed';
import type { Site } from '../../core/model/types';
import { designOutputBytes } from './designOutput';
import { NON_ASCII_NAMES, positionGapDeg, sampleExclusions, sampleFeatures, samplePlots, withoutNulls } from '../fixtures/ioSamples';
import { listLayers } from '../site/listLayers';
import { parseFeatureFile } from '../site/parseFeatureFile';
import { dbfFieldNames } from '../formats/shapefile/dbfWrite';

function sampleSite(): Site {
  const strata = sampleFeatures(-122.42, 37.77);
  const excl = sampleExclusions(-122.42, 37.77);
  return {
    name: 'Invented test site',
    strata: NON_ASCII_NAMES.map((key, i) => ({ key, label: key, code: ['FOR', 'NGA', 'GRA'][i], colour: ['#1b9e77', '#d95f02', '#7570b3'][i] })),
    parts: strata.features.map((f: Feature, i) => ({ id: `part-${i}`, stratum: String(f.properties?.stratum), geometry: f.geometry as Site['parts'][number]['geometry'] })),
    exclusions: excl.features.map((f, i) => ({
      id: `x${i}`,
      kind: f.properties?.kind,
      bufferM: f.properties?.buffer_m,
      name: f.properties?.name,
      geometry: f.geometry as Site['exclusions'][number]['geometry'],
    })),
    access: [{ id: 'a1', name: 'Barrière est (invented)', kind: 'gate', lon: -122.418, lat: 37.771 }],
    boundary: null,
  };
}

// The GPX 1.1 schema as published by Topografix (copy in tests/schemas, see docs/references.md §9).
function xmllint(text: string): string {
  const file = join(mkdtempSync(join(tmpdir(), 'stratplot-out-')), 'out.gpx');
  writeFileSync(file, text);
  try {
    execFileSync('xmllint', ['--noout', '--schema', GPX_XSD, file], { stdio: 'pipe' });
    return 'valid';
  } catch (error) {
    return String((error as { stderr?: Buffer }).stderr ?? error);
  }
}

const PLOT_LAYER: Record<string, string | undefined> = { zip: 'plots', kml: 'plots', kmz: 'plots', gpkg: 'plots' };

describe('designOutputBytes', () => {
  for (const ext of ['geojson', 'json', 'gpx', 'kml', 'kmz', 'csv', 'zip', 'gpkg']) {
    it(`writes .${ext} that parseFeatureFile reads back with the same plots`, async () => {
      const site = sampleSite();
      const bytes = await designOutputBytes(`out.${ext}`, samplePlots(), site);
      // What every file carries: strata by current name and code, and each plot's field state spelled out.
      const plots = plotCollectionForField(plotCollectionNamed(samplePlots(), site.strata));
      const back = await parseFeatureFile(`out.${ext}`, bytes, { layer: PLOT_LAYER[ext] });
      const read = back.features.filter((f) => typeof f.properties?.plot_id === 'string');
      expect(read).toHaveLength(plots.features.length);
      const names = dbfFieldNames(Object.keys(plots.features[0].properties).concat('distance_m', 'bearing_true_deg'));
      read.forEach((f, i) => {
        const original = plots.features[i];
        expect(positionGapDeg(f, original)).toBeLessThanOrEqual(1e-7);
        const want = withoutNulls(original.properties as unknown as Record<string, unknown>);
        if (ext === 'csv') want.caution = FIELD_CAUTION;
        const got = withoutNulls(f.properties);
        if (ext === 'zip') {
          // Shapefile field names are cut to 10 characters (dBASE limit).
          for (const [k, v] of Object.entries(want)) expect(got[names.get(k)!], k).toEqual(v);
        } else {
          expect(got).toEqual(want);
        }
      });
    });
  }

  it('puts strata, exclusions and access points in the multi-layer formats', async () => {
    for (const ext of ['kml', 'gpkg', 'zip']) {
      const bytes = await designOutputBytes(`out.${ext}`, samplePlots(), sampleSite());
      const layers = await listLayers(`out.${ext}`, bytes);
      expect(layers, ext).toEqual(
        expect.arrayContaining(ext === 'zip' ? ['plots', 'strata', 'exclusions_lines', 'exclusions_points', 'access'] : ['plots', 'strata', 'exclusions', 'access']),
      );
      const strata: FeatureCollection = await parseFeatureFile(`out.${ext}`, bytes, { layer: 'strata' });
      expect(strata.features.map((f) => f.properties?.stratum)).toEqual([...NON_ASCII_NAMES]);
    }
  });

  it('carries the safety caution in the GPX metadata and the KML document', async () => {
    const gpx = new TextDecoder().decode(await designOutputBytes('out.gpx', samplePlots(), sampleSite()));
    expect(gpx).toContain(`<metadata><name>Invented test site</name><desc>${FIELD_CAUTION.replace(/'/g, '&apos;')}</desc></metadata>`);
    expect(xmllint(gpx)).toBe('valid');
    const kml = new TextDecoder().decode(await designOutputBytes('out.kml', samplePlots(), sampleSite()));
    expect(kml).toContain(`<description>${FIELD_CAUTION.replace(/'/g, '&apos;')}</description>`);
  });

  it('labels GPX waypoints of access points and tracks of exclusions for the crew', async () => {
    const text = new TextDecoder().decode(await designOutputBytes('out.gpx', samplePlots(), sampleSite()));
    expect(text).toContain('<name>Barrière est (invented)</name><desc>access: gate</desc><type>access</type>');
    expect(text).toContain('<name>Falaise nord — invented</name><desc>keep out: cliff, buffer 15 m</desc><type>exclusion-cliff</type>');
  });

  it('writes the design report and field sheets as PDF', async () => {
    const report = await designOutputBytes('r.pdf', samplePlots(), sampleSite(), { paper: 'letter' });
    expect(new TextDecoder().decode(report.subarray(0, 5))).toBe('%PDF-');
    const sheets = await designOutputBytes('s.pdf', samplePlots(), sampleSite(), { pdf: 'sheets', surveyDate: new Date('2026-03-01T00:00:00Z') });
    expect(new TextDecoder().decode(sheets.subarray(0, 5))).toBe('%PDF-');
  });

  it('names the output file and the feature when a writer refuses the input', async () => {
    const plots = samplePlots();
    plots.features[1].geometry.coordinates = [200, 37.7];
    await expect(designOutputBytes('out.gpx', plots)).rejects.toThrow('out.gpx: feature 1: position 200, 37.7 is not a WGS84 longitude/latitude');
  });

  it('lists the formats it writes when the extension is unknown', async () => {
    await expect(designOutputBytes('plots.txt', samplePlots())).rejects.toThrow(
      'plots.txt: cannot tell the export format from the extension ".txt"; use one of .geojson, .json, .gpx, .kml, .kmz, .csv, .zip, .gpkg, .pdf',
    );
  });
});
