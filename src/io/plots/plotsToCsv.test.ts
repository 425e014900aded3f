import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { featuresToCsv } from '../formats/csv/featuresToCsv';
import { positionGapDeg, sampleFeatures, samplePlots } from '../fixtures/ioSamples';
import { parsePointCsv } from '../formats/csv/parsePointCsv';
import { PLOT_CSV_COLUMNS, plotsToCsv } from './plotsToCsv';

const enc = (s: string) => new TextEncoder().encode(s);

describe('plotsToCsv', () => {
  it('starts with the fixed columns, then the navigation columns the plots carry', () => {
    const header = plotsToCsv(samplePlots()).split('\r\n')[0].split(',');
    expect(header.slice(0, PLOT_CSV_COLUMNS.length)).toEqual([...PLOT_CSV_COLUMNS]);
    expect(header.slice(PLOT_CSV_COLUMNS.length)).toEqual(['design_density_per_ha', 'distance_m', 'bearing_true_deg', 'bearing_mag_deg']);
  });

  // Cases from OWASP "CSV Injection": cells beginning with = + - @ tab or CR are formulas to a spreadsheet.
  it('neutralises text cells that start like formulas (=, +, -, @, tab, CR) while numbers stay numbers', () => {
    const text = plotsToCsv(samplePlots());
    const rows = text.split('\r\n');
    // The sample plots carry no stratum code or field state of their own: those cells are empty.
    expect(rows[1]).toBe(`P001,Forêt humide,,primary,1,,,37.7749,-122.4194,10N,551234.5,4180123.25,10SEG5123480123,42.5,cliff,"'=HYPERLINK(""http://example.invalid"")",0.125,250.5,0,-13.5`);
    const parsed = Papa.parse<string[]>(text, { skipEmptyLines: true }).data;
    const notes = parsed.slice(1).map((r) => r[15]);
    expect(notes).toEqual([`'=HYPERLINK("http://example.invalid")`, "'+1 steep", "'-2 m drop", "'@crew", "'\tindented", "'\rreturn"]);
    // A negative longitude is a bare number, never quoted or prefixed.
    expect(parsed.slice(1).every((r) => /^-\d+\.\d+$/.test(r[8]))).toBe(true);
    expect(rows[3]).toContain(',,,'); // null nearest exclusion distance and kind are empty cells
  });

  it('carries the caution in a last column on every row, which spreadsheets and point readers still read', async () => {
    const caution = 'Caution: a planning aid only (invented wording for the test).';
    const text = plotsToCsv(samplePlots(), { caution });
    // papaparse 5 (a reference CSV reader) with a header row, as spreadsheets read it: row 1 is the header.
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields?.at(-1)).toBe('caution');
    expect(parsed.meta.fields?.[0]).toBe('plot_id');
    expect(parsed.data.map((r) => r.caution)).toEqual(Array(6).fill(caution));
    // The app's own point reader (what phone exports go back through) still finds lat/lon.
    const back = await parsePointCsv('plots.csv', enc(text));
    expect(back.features).toHaveLength(6);
    expect(back.features[0].properties?.caution).toBe(caution);
  });

  // Full-width forms (Unicode FF1D, FF0B, FF0D, FF20) that some spreadsheet programs read as = + - @
  // (OWASP "CSV Injection" lists the ASCII ones; the full-width twins: common practice, no source).
  it('neutralises full-width formula characters too, and reads them back unchanged', async () => {
    const fc = samplePlots();
    const notes = ['＝SUM(A1:A9)', '＋1 steep', '－2 m drop', '＠crew'];
    fc.features.slice(0, 4).forEach((f, i) => {
      (f.properties as unknown as Record<string, unknown>).notes = notes[i];
    });
    const parsed = Papa.parse<string[]>(plotsToCsv(fc), { skipEmptyLines: true }).data;
    expect(parsed.slice(1, 5).map((r) => r[15])).toEqual(notes.map((n) => `'${n}`));
    const back = await parsePointCsv('plots.csv', enc(plotsToCsv(fc)));
    expect(back.features.slice(0, 4).map((f) => f.properties?.notes)).toEqual(notes);
  });

  it('adds a UTF-8 byte-order mark only when asked', () => {
    expect(plotsToCsv(samplePlots(), { bom: true }).charCodeAt(0)).toBe(0xfeff);
    expect(plotsToCsv(samplePlots()).charCodeAt(0)).toBe(0x70);
  });

  it('round-trips plots through parsePointCsv with the same coordinates and attributes', async () => {
    const plots = samplePlots();
    const back = await parsePointCsv('plots.csv', enc(plotsToCsv(plots, { bom: true })));
    back.features.forEach((f, i) => {
      expect(positionGapDeg(f, plots.features[i])).toBeLessThanOrEqual(1e-7);
      const want = { ...plots.features[i].properties } as Record<string, unknown>;
      for (const k of Object.keys(f.properties ?? {})) want[k] ??= null;
      expect(f.properties).toEqual(want);
    });
  });

  it('writes polygons and lines as WKT when the collection is not all points', () => {
    const text = featuresToCsv(sampleFeatures(0, 0));
    expect(text.split('\r\n')[0]).toBe('stratum,note,cover_pct,wkt');
    expect(text).toContain('"POLYGON ((0 0, 0.002 0, 0.002 0.0015, 0 0.0015, 0 0), ');
  });
});

describe('parsePointCsv', () => {
  it('detects easting/northing with a utm_zone column and converts them (GeoConvert manual example)', async () => {
    // GeographicLib GeoConvert manual: 33.3°N 44.4°E = 38N 444140.54 3684706.36 (docs/references.md §2).
    const back = await parsePointCsv('utm.csv', enc('id,Easting,Northing,utm_zone\nA,444140.54,3684706.36,38N\n'));
    const [lon, lat] = (back.features[0].geometry as { coordinates: number[] }).coordinates;
    expect(lon).toBeCloseTo(44.4, 6);
    expect(lat).toBeCloseTo(33.3, 6);
  });

  it('uses an explicit column mapping and EPSG code', async () => {
    // Same published point as above, columns named freely, EPSG:32638 (WGS 84 / UTM zone 38N).
    const back = await parsePointCsv('p.csv', enc('name;E_m;N_m\nA;444140.54;3684706.36\n'), { csvColumns: { x: 'E_m', y: 'N_m', epsg: 32638 } });
    expect((back.features[0].geometry as { coordinates: number[] }).coordinates[1]).toBeCloseTo(33.3, 6);
  });

  it('names the row and column of a bad coordinate', async () => {
    await expect(parsePointCsv('p.csv', enc('plot,lat,lon\nA,1,2\nB,north,3\n'))).rejects.toThrow('p.csv: row 2, column "lat": "north" is not a number');
    await expect(parsePointCsv('p.csv', enc('plot,lat,lon\nA,95,2\n'))).rejects.toThrow('p.csv: row 1, columns "lon"/"lat": 2, 95 is not a position in EPSG:4326');
  });

  it('asks for the EPSG code of projected columns without a zone', async () => {
    await expect(parsePointCsv('p.csv', enc('id,easting,northing\nA,1,2\n'))).rejects.toThrow(
      'p.csv: columns "easting" and "northing" are projected; give their EPSG code (--epsg)',
    );
  });

  it('lists the columns when it cannot find coordinates', async () => {
    await expect(parsePointCsv('p.csv', enc('a,b\n1,2\n'))).rejects.toThrow('p.csv: cannot tell which columns hold the coordinates (looked for lon/lat or easting/northing); columns are: a, b');
  });
});
