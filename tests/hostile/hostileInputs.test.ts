import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import booleanPointInPolygon from '@turf/boolean-point-in-polygon';
import { strToU8 } from 'fflate';
import geodesic from 'geographiclib-geodesic';
import type { Feature, Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/main';
import { plotCollectionInvented } from '../../src/core/field/plotCollectionInvented';
import {
  MAX_ACCESS_POINTS,
  MAX_DESIGN_PLOTS,
  MAX_FILE_VERTICES,
  MAX_FRAME_REACH_KM,
  MAX_ID_LENGTH,
  MAX_NESTING_DEPTH,
  MAX_XML_DEPTH,
  MAX_ZIP_ENTRY_BYTES,
} from '../../src/core/common/inputLimits';
import { featuresLimitCheck } from '../../src/io/site/featuresLimitCheck';
import {
  accessCsv,
  boxPolygon,
  boxRing,
  collectionText,
  feature,
  geojsonDeepCollections,
  geojsonDeepCoordinates,
  geoPackageWith,
  gpxWaypoints,
  kmlDeepFolders,
  kmlDeepMultiGeometry,
  kmlRingText,
  kmlWithRing,
  shapefileWithDbfHeader,
  shapefileWithOrphanHole,
  shapefileWithVertexWord,
  siteStrata,
  wkbDeepCollectionBlob,
  X0,
  Y0,
  zipWithDeclaredSize,
} from './hostileFiles';

// Each case is one hostile input from issue 14 run through the CLI in this process: the answer is
// either a right result (exit 0) or exactly one line on stderr with exit 2 (3 for a short design),
// never "internal error", a stack trace or a silent wrong answer.
const dir = mkdtempSync(join(tmpdir(), 'stratplot-hostile-'));
const put = (name: string, bytes: Uint8Array | string) => writeFileSync(join(dir, name), bytes);

async function cli(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await runCli(argv, { out: (t) => (out += t), err: (t) => (err += t), cwd: dir });
  return { code, out, err };
}

/** Runs a command that must fail on bad input: exit 2, one line on stderr matching `pattern`, nothing on stdout. */
async function refused(pattern: RegExp, ...argv: string[]) {
  const r = await cli(...argv);
  expect(r.err).toMatch(pattern);
  expect(r.err.endsWith('\n') && r.err.indexOf('\n') === r.err.length - 1).toBe(true);
  expect(r.err).not.toMatch(/internal error|\bat .*\.ts:\d+/);
  expect(r.code).toBe(2);
  return r;
}

put('site.geojson', JSON.stringify(siteStrata()));

describe('shapefiles and their tables', () => {
  it('refuses a NaN, infinite or absurd coordinate word instead of dropping its ring', async () => {
    put('nan.zip', shapefileWithVertexWord(0, 7, 0, Number.NaN));
    await refused(/nan\.zip \(strata\.shp\): feature 0, vertex 7: the X coordinate is NaN, not a finite number/, 'areas', 'nan.zip');
    put('inf.zip', shapefileWithVertexWord(0, 2, 1, Number.POSITIVE_INFINITY));
    await refused(/feature 0, vertex 2: the Y coordinate is Infinity/, 'areas', 'inf.zip');
    put('absurd.zip', shapefileWithVertexWord(1, 1, 0, 1e300));
    await refused(/feature 1, vertex 1: the X coordinate 1e\+300 is beyond ±1000000000/, 'areas', 'absurd.zip');
  });

  it('refuses a hole that lies inside no outer ring rather than losing it', async () => {
    put('orphan.zip', shapefileWithOrphanHole());
    await refused(/feature 1: 1 of its 2 rings cannot be placed: a hole \(a counter-clockwise ring\) lies inside no outer/, 'areas', 'orphan.zip');
  });

  it('refuses a .dbf whose record length is 0 or whose record count the file cannot hold', async () => {
    put('reclen.zip', shapefileWithDbfHeader('recordLength', 0));
    await refused(/the \.dbf header gives records of 0 bytes, but its 1 fields take \d+/, 'areas', 'reclen.zip');
    put('reccount.zip', shapefileWithDbfHeader('recordCount', 5000));
    await refused(/the \.dbf header says 5000 records, but the file holds only 2/, 'areas', 'reccount.zip');
  });
});

describe('zip archives', () => {
  it('refuses an entry declaring more than the per-entry limit before inflating it', async () => {
    const started = Date.now();
    put('bomb.kmz', zipWithDeclaredSize('doc.kml', kmlWithRing(kmlRingText()), 1024 ** 3));
    await refused(/bomb\.kmz: doc\.kml: inflates to 1 GiB; stratplot's limit is 256 MiB per file in an archive/, 'areas', 'bomb.kmz', '--field', 'name');
    expect(Date.now() - started).toBeLessThan(2000);
    expect(MAX_ZIP_ENTRY_BYTES).toBe(256 * 1024 * 1024);
  });

  it('refuses an entry that inflates past its tampered size field as soon as it does', async () => {
    put('tampered.kmz', zipWithDeclaredSize('doc.kml', kmlWithRing(kmlRingText()), 100));
    await refused(/tampered\.kmz: not a readable zip archive \(doc\.kml inflates to more than the 100 bytes its header states\)/, 'areas', 'tampered.kmz');
  });
});

describe('KML and GPX text', () => {
  it('refuses an unreadable coordinate tuple instead of dropping it (a square stays a square)', async () => {
    const ring = boxRing(X0, Y0, 0.004, 0.003);
    const tuples = ring.map((p) => `${p[0]},${p[1]}`);
    tuples[2] = 'abc,def';
    put('tuple.kml', kmlWithRing(tuples.join(' ')));
    await refused(/tuple\.kml: placemark 0 \("Heath \(invented\)"\): coordinate 3 "abc,def" is not longitude,latitude\[,altitude\]/, 'areas', 'tuple.kml', '--field', 'name');
  });

  it('refuses a hole of too few positions (a KML reader would drop it) and a ring outside the boundary elements', async () => {
    const outer = kmlRingText();
    const hole = `${X0 + 0.001},${Y0 + 0.001} ${X0 + 0.002},${Y0 + 0.001} ${X0 + 0.001},${Y0 + 0.001}`;
    const kml = (inner: string) =>
      `<kml xmlns="http://www.opengis.net/kml/2.2"><Placemark><name>Heath</name><Polygon><outerBoundaryIs><LinearRing><coordinates>${outer}</coordinates></LinearRing></outerBoundaryIs>${inner}</Polygon></Placemark></kml>`;
    put('shorthole.kml', kml(`<innerBoundaryIs><LinearRing><coordinates>${hole}</coordinates></LinearRing></innerBoundaryIs>`));
    await refused(/shorthole\.kml: placemark 0 \("Heath"\): ring 1 has 3 positions; a ring needs at least 3 corners and the closing position/, 'areas', 'shorthole.kml', '--field', 'name');
    put('stray.kml', kml(`<innerBoundary><LinearRing><coordinates>${kmlRingText(boxRing(X0 + 0.001, Y0 + 0.001, 0.001, 0.001))}</coordinates></LinearRing></innerBoundary>`));
    await refused(/stray\.kml: placemark 0 \("Heath"\): ring 1 is not inside <outerBoundaryIs> or <innerBoundaryIs> \(it is in <innerBoundary>\)/, 'areas', 'stray.kml', '--field', 'name');
  });

  it('refuses folders and MultiGeometry nested deeper than the XML depth limit', async () => {
    put('folders.kml', kmlDeepFolders(50_000));
    await refused(new RegExp(`folders\\.kml: its elements are nested more than ${MAX_XML_DEPTH} levels deep; stratplot's limit is ${MAX_XML_DEPTH} levels`), 'areas', 'folders.kml');
    put('multi.kml', kmlDeepMultiGeometry(50_000));
    await refused(/multi\.kml: its elements are nested more than 100 levels deep/, 'areas', 'multi.kml');
  });

  it('refuses a GPX latitude written in hexadecimal instead of reading 0x10 as 16°', async () => {
    put('hex.gpx', gpxWaypoints(['-35.099', '0x10']));
    await refused(/hex\.gpx: <wpt> 2 \("Gate 2"\): lat="0x10" is not a latitude/, 'plan', 'site.geojson', '--plots', '4', '--seed', '1', '--access', 'hex.gpx');
  });
});

describe('GeoJSON structure and coordinate systems', () => {
  it('refuses GeometryCollections and coordinate arrays nested without end', async () => {
    put('deepgc.geojson', geojsonDeepCollections(100_000));
    await refused(new RegExp(`deepgc\\.geojson: feature 0: GeometryCollections are nested more than ${MAX_NESTING_DEPTH} deep`), 'areas', 'deepgc.geojson');
    put('deepcoords.geojson', geojsonDeepCoordinates(100_000));
    await refused(/deepcoords\.geojson: feature 0: Polygon has a position that is not \[lon, lat\] numbers: \[\[…\]\]/, 'areas', 'deepcoords.geojson');
  });

  it('refuses degrees under a crs member that names a projected system (no 1 cm² stratum)', async () => {
    const fc = { ...siteStrata(), crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::32756' } } };
    put('crs.geojson', JSON.stringify(fc));
    await refused(/crs\.geojson: feature 0: coordinates 150\.5, -35\.1 look like longitude\/latitude degrees, but the coordinate system given for the file is EPSG:32756/, 'areas', 'crs.geojson');
  });

  it('refuses a MultiPolygon whose own polygons overlap (no double-counted area)', async () => {
    const overlapping = { type: 'MultiPolygon', coordinates: [[boxRing(X0, Y0, 0.004, 0.003)], [boxRing(X0 + 0.002, Y0 + 0.001, 0.004, 0.003)]] };
    put('multi.geojson', collectionText(feature({ stratum: 'Heath' }, overlapping)));
    await refused(/multi\.geojson: feature 0 \(HEA-1\): polygons 0 and 1 of this MultiPolygon overlap by \d+\.\d\d m²/, 'areas', 'multi.geojson');
  });

  it('refuses a polygon with more vertices than the file limit, naming the count and the limit', () => {
    // One shared position repeated keeps this test light; the check counts positions, not distinct ones.
    const ring = new Array<number[]>(MAX_FILE_VERTICES + 1).fill([X0, Y0]);
    const fc = { type: 'FeatureCollection' as const, features: [feature({}, { type: 'Polygon', coordinates: [ring] })] };
    expect(() => featuresLimitCheck(fc, 'huge.geojson')).toThrow(
      "huge.geojson: it holds more than 2,000,000 vertices (2,000,001 by feature 0); stratplot's limit is 2,000,000 vertices per file",
    );
  });
});

describe('the site frame', () => {
  // Two halves of one invented stratum split at the antimeridian (RFC 7946 §3.1.9), near 16.5°S.
  const west: Polygon = boxPolygon(179.95, -16.5, 0.05, 0.02);
  const east: Polygon = boxPolygon(-180, -16.5, 0.05, 0.02);

  it('puts a site split at ±180° in zone 60 or 1 with real northings, every plot inside its stratum', async () => {
    put('split.geojson', collectionText(feature({ stratum: 'Reef flat (invented)' }, west), feature({ stratum: 'Reef flat (invented)' }, east)));
    const r = await cli('plan', 'split.geojson', '--plots', '12', '--seed', '4', '--spacing', '20', '--out', 'split-plots.geojson');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const plots = JSON.parse(readFileSync(join(dir, 'split-plots.geojson'), 'utf8'));
    expect(['60S', '1S']).toContain(plots.design.crs.utm_zone);
    expect(plots.features).toHaveLength(12);
    for (const f of plots.features as Feature<{ type: 'Point'; coordinates: number[] }>[]) {
      const p = f.geometry.coordinates;
      expect(booleanPointInPolygon(p, west) || booleanPointInPolygon(p, east)).toBe(true);
      // Southern-hemisphere northings are 10 000 km less the distance to the equator (NGA.SIG.0012): ~8 175 km here.
      expect((f.properties as { northing: number }).northing).toBeGreaterThan(8_000_000);
    }
  });

  it('takes a ring running from 179.9° to −179.9° where its ground is', async () => {
    const ring = [[179.97, -16.5], [-179.97, -16.5], [-179.97, -16.48], [179.97, -16.48], [179.97, -16.5]];
    put('ring.geojson', collectionText(feature({ stratum: 'Lagoon (invented)' }, { type: 'Polygon', coordinates: [ring] })));
    const r = await cli('areas', 'ring.geojson', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(['60S', '1S']).toContain(j.crs.utm_zone);
    // Reference: geographiclib-geodesic 2.2 (Karney 2013) geodesic polygon area of the same ring on WGS84.
    const poly = geodesic.Geodesic.WGS84.Polygon(false);
    for (const [lon, lat] of ring.slice(0, -1)) poly.AddPoint(lat, lon);
    expect(j.strata[0].area_m2).toBeCloseTo(Math.abs(poly.Compute(false, true).area ?? Number.NaN), 0);
  });

  it('refuses a stratum spanning most of the globe, naming its reach and the limit', async () => {
    const band = [[-170, 10], [-90, 10], [0, 10], [90, 10], [170, 10], [170, 11], [90, 11], [0, 11], [-90, 11], [-170, 11], [-170, 10]];
    put('band.geojson', collectionText(feature({ stratum: 'Band' }, { type: 'Polygon', coordinates: [band] })));
    await refused(new RegExp(`the site: it is too large for one UTM frame: its strata reach [\\d,]+ km from the central meridian of UTM zone \\d+ .*stratplot's limit is ${MAX_FRAME_REACH_KM.toLocaleString('en-US')} km`), 'plan', 'band.geojson', '--plots', '5', '--seed', '1');
  });
});

describe('access points, GeoPackages and plot files', () => {
  it('refuses an access file with no points, and one with more points than the limit without overflowing', async () => {
    put('noaccess.geojson', collectionText());
    await refused(/noaccess\.geojson: no access points \(the file has no features\)/, 'plan', 'site.geojson', '--plots', '4', '--seed', '1', '--access', 'noaccess.geojson');
    put('many.csv', accessCsv(150_000));
    await refused(new RegExp(`many\\.csv: 150,000 access points; stratplot's limit is ${MAX_ACCESS_POINTS.toLocaleString('en-US')} access points`), 'plan', 'site.geojson', '--plots', '4', '--seed', '1', '--access', 'many.csv');
  });

  it('refuses a GeoPackage whose contents name a missing table, and nested WKB collections', async () => {
    put('missing.gpkg', await geoPackageWith('DROP TABLE "strata"'));
    await refused(/missing\.gpkg \(layer strata\): gpkg_contents lists the layer, but the file has no table "strata"/, 'areas', 'missing.gpkg');
    put('wkb.gpkg', await geoPackageWith('UPDATE "strata" SET geom = ? WHERE fid = 1', [wkbDeepCollectionBlob(10_000)]));
    await refused(/wkb\.gpkg \(layer strata\): row 1: geometry collections are nested more than 32 deep/, 'areas', 'wkb.gpkg');
  });

  it('refuses a plot file with a plot that has no position, instead of exporting a placemark without one', async () => {
    const plots = plotCollectionInvented([{ key: 'Heath', code: 'HEA', primaries: 2, reserves: 0, mappedM2: 1e4, usableM2: 1e4 }]);
    (plots.features[1] as { geometry: unknown }).geometry = null;
    put('nogeom.geojson', JSON.stringify(plots));
    await refused(/nogeom\.geojson: feature 1 \(HEA-02\) has no Point position/, 'export', 'nogeom.geojson', '--format', 'kml', '--out', 'x.kml');
  });

  it('refuses a 3 MB plot id before laying out sheets', async () => {
    const plots = plotCollectionInvented([{ key: 'Heath', code: 'HEA', primaries: 2, reserves: 0, mappedM2: 1e4, usableM2: 1e4 }]);
    plots.features[0].properties.plot_id = 'H'.repeat(3_000_000);
    put('longid.geojson', JSON.stringify(plots));
    const started = Date.now();
    await refused(new RegExp(`longid\\.geojson: feature 0: its plot_id is 3,000,000 characters long; stratplot's limit is ${MAX_ID_LENGTH} characters`), 'export', 'longid.geojson', '--format', 'sheets', '--out', 'x.pdf');
    expect(Date.now() - started).toBeLessThan(3000);
  });
});

describe('design size', () => {
  it('refuses a billion plots, a million plots and a million reserves at once', async () => {
    for (const [flag, value] of [['--plots', '1000000000'], ['--plots', '1000000']] as const) {
      const started = Date.now();
      await refused(new RegExp(`number of plots: [\\d,]+ plots asked for; stratplot's limit is ${MAX_DESIGN_PLOTS.toLocaleString('en-US')} plots in one design`), 'plan', 'site.geojson', flag, value, '--seed', '1');
      expect(Date.now() - started).toBeLessThan(2000);
    }
    await refused(/reserve plots per stratum: 1,000,000 reserves in each of 2 strata and 10 primaries make 2,000,010 plots/, 'plan', 'site.geojson', '--plots', '10', '--reserve', '1000000', '--seed', '1');
  });

  it('refuses a million trap grids at once instead of trying each', async () => {
    const started = Date.now();
    await refused(/trap grids: 2,000,000 grids of 5 × 5 stations make 50,000,000 stations; stratplot's limit is 100,000 plots in one design/, 'traps', 'site.geojson', '--grids', '1000000', '--rows', '5', '--cols', '5', '--spacing', '10', '--seed', '1');
    expect(Date.now() - started).toBeLessThan(2000);
  });

  it('refuses more plots than the strata can hold at the spacing, before placing any', async () => {
    await refused(/5,000 plots \(primaries and reserves\) cannot fit at 50 m spacing: the strata have room for at most \d+ plots/, 'plan', 'site.geojson', '--plots', '5000', '--spacing', '50', '--seed', '1');
  });

  it('refuses transects and grids with intervals too small to lay out', async () => {
    put('baseline.geojson', collectionText(feature({}, { type: 'LineString', coordinates: [[X0, Y0 - 0.0005], [X0 + 0.007, Y0 - 0.0005]] })));
    const started = Date.now();
    await refused(/transect interval 1e-9 m: it gives [\d,]+ transects along the baseline; stratplot's limit is 5,000,000 layout positions/, 'plan', 'site.geojson', '--method', 'transect', '--baseline', 'baseline.geojson', '--transect-interval', '1e-9', '--quadrat-interval', '10', '--seed', '1');
    await refused(/quadrat interval 0\.0001 m: with \d+ transects it gives [\d,]+ quadrat positions/, 'plan', 'site.geojson', '--method', 'transect', '--baseline', 'baseline.geojson', '--transect-interval', '50', '--quadrat-interval', '0.0001', '--seed', '1');
    await refused(/grid spacing 0\.01 m: it gives about [\d,]+ plots over the strata/, 'plan', 'site.geojson', '--method', 'grid', '--grid-spacing', '0.01', '--seed', '1');
    expect(Date.now() - started).toBeLessThan(3000);
  });

  it('exits 3 when fewer plots fit than asked, keeps the shortfall in the output, and 0 with --allow-short', async () => {
    // 60 plots 60 m apart in 20 ha: random placement jams well before that (sequential inhibition fills ~55 % of a packing).
    const args = ['plan', 'site.geojson', '--plots', '60', '--spacing', '60', '--seed', '2', '--out', 'short.geojson'];
    const short = await cli(...args);
    expect(short.code).toBe(3);
    expect(short.err).toMatch(/^stratplot plan: the design is short: \d+ of 60 plots placed \(.*holds \d+.*\); it was written with the shortfall per stratum in its summary; give --allow-short to accept a short design\n$/);
    expect(short.out).toMatch(/plots +reserve +capacity/);
    expect(short.out).toMatch(/holds only \d+ of its \d+ plots/);
    const written = JSON.parse(readFileSync(join(dir, 'short.geojson'), 'utf8'));
    expect(written.design.allocation.some((r: { capacity: number | null }) => r.capacity !== null)).toBe(true);
    const allowed = await cli(...args, '--allow-short');
    expect(allowed.code).toBe(0);
  });

  it('prints nothing before the one error line, not even the seed line', async () => {
    const r = await refused(/^stratplot plan: --footprint "hexagon:5" is not understood/, 'plan', 'site.geojson', '--plots', '4', '--footprint', 'hexagon:5');
    expect(r.err).not.toMatch(/seed/);
  });

  it('says why an output file cannot be written, in one line', async () => {
    await refused(/^stratplot plan: cannot write no-such-folder\/plots\.geojson: its folder does not exist\n$/, 'plan', 'site.geojson', '--plots', '4', '--seed', '1', '--out', 'no-such-folder/plots.geojson');
  });

  it('refuses option values that Number would misread: 0x10, Infinity, 1e400', async () => {
    for (const v of ['0x10', 'Infinity', '1e400', '12abc']) await refused(new RegExp(`--spacing needs a number, got "${v}"`), 'plan', 'site.geojson', '--plots', '4', '--spacing', v);
  });
});

describe('estimate', () => {
  const plots = plotCollectionInvented([
    { key: 'Heath', code: 'HEA', primaries: 3, reserves: 1, mappedM2: 6e4, usableM2: 5e4 },
    { key: 'Dune', code: 'DUN', primaries: 3, reserves: 0, mappedM2: 4e4, usableM2: 3e4 },
  ]);
  put('plots.geojson', JSON.stringify(plots));
  const results = (rows: string[]) => strToU8(`plot_id,status,cover_pct,stems,notes\n${rows.join('\n')}\n`);
  const good = ['HEA-01,done,10,3,', 'HEA-02,done,20,4,', 'HEA-03,done,30,5,', 'DUN-01,done,40,1,', 'DUN-02,done,50,2,', 'DUN-03,rejected,,,flooded (invented)'];

  it('refuses areas that overflow rather than reporting a mean of 0', async () => {
    const big = structuredClone(plots);
    big.design.allocation[0].usable_m2 = 1e308;
    big.design.allocation[1].usable_m2 = 1e308;
    put('big.geojson', JSON.stringify(big));
    put('r.csv', results(good));
    await refused(/big\.geojson: design allocation row 0 \("Heath"\) states an area larger than the Earth's surface/, 'estimate', 'big.geojson', 'r.csv', '--value', 'cover_pct');
  });

  it('warns, naming row and column, about a done row with an empty value', async () => {
    put('r.csv', results(good.map((r) => (r.startsWith('HEA-02') ? 'HEA-02,done,,4,' : r))));
    const r = await cli('estimate', 'plots.geojson', 'r.csv', '--value', 'cover_pct');
    expect(r.code).toBe(0);
    expect(r.out).toContain('r.csv row 3, column cover_pct: plot HEA-02 is marked "done" but has no value; it is left out of the estimate');
  });

  it('refuses a fractional count, a value of 1e400, an empty table and a text column', async () => {
    put('r.csv', results(good.map((r) => (r.startsWith('HEA-02') ? 'HEA-02,done,20,2.5,' : r))));
    await refused(/r\.csv row 3, column stems: count 2\.5 is not a whole number/, 'estimate', 'plots.geojson', 'r.csv', '--value', 'stems', '--kind', 'count');
    put('r.csv', results(good.map((r) => (r.startsWith('HEA-02') ? 'HEA-02,done,1e400,4,' : r))));
    await refused(/r\.csv row 3, column cover_pct: 1e400 is beyond ±1000000000000/, 'estimate', 'plots.geojson', 'r.csv', '--value', 'cover_pct');
    put('r.csv', results([]));
    await refused(/r\.csv: no data rows under the header; nothing to estimate/, 'estimate', 'plots.geojson', 'r.csv', '--value', 'cover_pct');
    put('r.csv', results(good));
    await refused(/r\.csv row 7, column notes: "flooded \(invented\)" is not a number, and no other cell of column notes is: it is a text column/, 'estimate', 'plots.geojson', 'r.csv', '--value', 'notes');
  });
});
