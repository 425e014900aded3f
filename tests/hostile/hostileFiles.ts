// Hand-made hostile input files for an invented site (nothing here describes real ground): each
// builder returns the bytes of one damaged, extreme or tricky file, for the CLI tests, the fuzz
// suite and the browser test of hostile imports.
import { zipSync } from 'fflate';
import type { Feature, FeatureCollection, Polygon } from 'geojson';
import { featuresToGeoPackage } from '../../src/io/formats/geopackage/featuresToGeoPackage';
import { featuresToShapefileFiles } from '../../src/io/formats/shapefile/featuresToShapefileZip';
import { sqlJsLoad } from '../../src/io/formats/geopackage/sqlJsLoad';

/** The invented site's corner, about 150.5°E 35.1°S (UTM zone 56 south). */
export const X0 = 150.5;
export const Y0 = -35.1;

/** A closed lon/lat rectangle ring, counter-clockwise (RFC 7946 §3.1.6 winding for shells). */
export function boxRing(x: number, y: number, dx: number, dy: number): number[][] {
  return [[x, y], [x + dx, y], [x + dx, y + dy], [x, y + dy], [x, y]];
}

export function boxPolygon(x: number, y: number, dx: number, dy: number, holes: number[][][] = []): Polygon {
  return { type: 'Polygon', coordinates: [boxRing(x, y, dx, dy), ...holes] };
}

export function feature(properties: Record<string, unknown>, geometry: unknown): Feature {
  return { type: 'Feature', properties, geometry } as Feature;
}

export function collectionText(...features: unknown[]): string {
  return JSON.stringify({ type: 'FeatureCollection', features });
}

/** Two invented strata: a heath with a hole (clockwise, as a hole in RFC 7946) and a dune block. */
export function siteStrata(): FeatureCollection {
  const hole = boxRing(X0 + 0.001, Y0 + 0.001, 0.001, 0.001).reverse();
  return {
    type: 'FeatureCollection',
    features: [
      feature({ stratum: 'Heath (invented)' }, boxPolygon(X0, Y0, 0.004, 0.003, [hole])),
      feature({ stratum: 'Dune (invented)' }, boxPolygon(X0 + 0.004, Y0, 0.003, 0.003)),
    ],
  };
}

const encoder = new TextEncoder();
const text = (s: string) => encoder.encode(s);

/** The site's strata as a zipped shapefile, with its parts for byte surgery. */
export function shapefileParts(fc: FeatureCollection = siteStrata()): Record<string, Uint8Array> {
  return featuresToShapefileFiles(fc, { layerName: 'strata', date: new Date('2026-01-01T00:00:00Z') });
}

export function zipOf(files: Record<string, Uint8Array>): Uint8Array {
  return zipSync(files, { level: 6, mtime: new Date('2000-01-01T00:00:00Z') });
}

/** Byte offset of vertex `v` of record `r` (0-based) in a polygon .shp (ESRI 1998 record layout). */
export function shpVertexOffset(shp: Uint8Array, r: number, v: number): number {
  const view = new DataView(shp.buffer, shp.byteOffset, shp.byteLength);
  let at = 100;
  for (let k = 0; k < r; k++) at += 8 + view.getInt32(at + 4, false) * 2;
  const parts = view.getInt32(at + 8 + 36, true);
  return at + 8 + 44 + 4 * parts + 16 * v;
}

/** The site shapefile with one coordinate word of a vertex replaced. */
export function shapefileWithVertexWord(record: number, vertex: number, axis: 0 | 1, value: number): Uint8Array {
  const files = shapefileParts();
  const shp = files['strata.shp'].slice();
  new DataView(shp.buffer).setFloat64(shpVertexOffset(shp, record, vertex) + 8 * axis, value, true);
  return zipOf({ ...files, 'strata.shp': shp });
}

/** The site shapefile with the .dbf header's record length (offset 10) or record count (offset 4) changed. */
export function shapefileWithDbfHeader(field: 'recordLength' | 'recordCount', value: number): Uint8Array {
  const files = shapefileParts();
  const dbf = files['strata.dbf'].slice();
  const view = new DataView(dbf.buffer);
  if (field === 'recordLength') view.setUint16(10, value, true);
  else view.setUint32(4, value, true);
  return zipOf({ ...files, 'strata.dbf': dbf });
}

/**
 * A shapefile whose second record has an island written counter-clockwise beside a clockwise shell:
 * the island is a "hole" inside no shell, which polygon assembly would drop.
 */
export function shapefileWithOrphanHole(): Uint8Array {
  const island = boxRing(X0 + 0.010, Y0, 0.001, 0.001);
  const fc = siteStrata();
  fc.features[1].geometry = { type: 'MultiPolygon', coordinates: [[boxRing(X0 + 0.004, Y0, 0.003, 0.003)], [island]] };
  const files = shapefileParts(fc);
  // Rewrite the island ring's vertices in reverse (counter-clockwise in shapefile terms = a hole).
  const shp = files['strata.shp'].slice();
  const view = new DataView(shp.buffer);
  const start = shpVertexOffset(shp, 1, 5);
  const pts = [...island];
  pts.forEach((p, k) => {
    view.setFloat64(start + 16 * k, p[0], true);
    view.setFloat64(start + 16 * k + 8, p[1], true);
  });
  return zipOf({ ...files, 'strata.shp': shp });
}

/** A zip whose central directory says an entry inflates to `declared` bytes (also in its local header). */
export function zipWithDeclaredSize(name: string, content: Uint8Array, declared: number): Uint8Array {
  const zip = zipSync({ [name]: content }, { level: 9, mtime: new Date('2000-01-01T00:00:00Z') }).slice();
  const view = new DataView(zip.buffer);
  view.setUint32(22, declared, true); // local header: uncompressed size
  for (let at = zip.length - 22; at >= 0; at--) {
    if (view.getUint32(at, true) !== 0x06054b50) continue;
    const cd = view.getUint32(at + 16, true);
    view.setUint32(cd + 24, declared, true);
    break;
  }
  return zip;
}

/** KML of one placemark whose polygon ring holds the given coordinate text. */
export function kmlWithRing(coordinates: string, name = 'Heath (invented)'): Uint8Array {
  return text(
    `<?xml version="1.0" encoding="UTF-8"?><kml xmlns="http://www.opengis.net/kml/2.2"><Document><Placemark><name>${name}</name>` +
      `<ExtendedData><Data name="stratum"><value>${name}</value></Data></ExtendedData>` +
      `<Polygon><outerBoundaryIs><LinearRing><coordinates>${coordinates}</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark></Document></kml>`,
  );
}

/** The heath's outer ring as KML coordinate text. */
export function kmlRingText(ring: number[][] = boxRing(X0, Y0, 0.004, 0.003)): string {
  return ring.map((p) => `${p[0]},${p[1]}`).join(' ');
}

/** KML with `depth` nested folders around one placemark. */
export function kmlDeepFolders(depth: number): Uint8Array {
  const inner = `<Placemark><name>A</name><Polygon><outerBoundaryIs><LinearRing><coordinates>${kmlRingText()}</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>`;
  return text(`<kml xmlns="http://www.opengis.net/kml/2.2"><Document>${'<Folder>'.repeat(depth)}${inner}${'</Folder>'.repeat(depth)}</Document></kml>`);
}

/** KML with `depth` nested MultiGeometry elements around one polygon. */
export function kmlDeepMultiGeometry(depth: number): Uint8Array {
  const poly = `<Polygon><outerBoundaryIs><LinearRing><coordinates>${kmlRingText()}</coordinates></LinearRing></outerBoundaryIs></Polygon>`;
  return text(`<kml xmlns="http://www.opengis.net/kml/2.2"><Placemark><name>A</name>${'<MultiGeometry>'.repeat(depth)}${poly}${'</MultiGeometry>'.repeat(depth)}</Placemark></kml>`);
}

/** GeoJSON of one feature whose geometry is `depth` GeometryCollections around a polygon. */
export function geojsonDeepCollections(depth: number): string {
  const open = '{"type":"GeometryCollection","geometries":['.repeat(depth);
  const close = ']}'.repeat(depth);
  return `{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"stratum":"A"},"geometry":${open}${JSON.stringify(boxPolygon(X0, Y0, 0.004, 0.003))}${close}}]}`;
}

/** GeoJSON of a polygon whose coordinates are nested `depth` arrays deep. */
export function geojsonDeepCoordinates(depth: number): string {
  return `{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"stratum":"A"},"geometry":{"type":"Polygon","coordinates":${'['.repeat(depth)}${']'.repeat(depth)}}}]}`;
}

/** GPX of access waypoints with the given latitude texts. */
export function gpxWaypoints(lats: string[]): Uint8Array {
  const wpts = lats.map((lat, i) => `<wpt lat="${lat}" lon="${X0 + 0.002}"><name>Gate ${i + 1}</name></wpt>`).join('');
  return text(`<?xml version="1.0"?><gpx version="1.1" creator="stratplot tests" xmlns="http://www.topografix.com/GPX/1/1">${wpts}</gpx>`);
}

/** The site's strata as a GeoPackage, changed afterwards by `sql` (run with sql.js). */
export async function geoPackageWith(sql: string, params: (string | number | Uint8Array)[] = []): Promise<Uint8Array> {
  const bytes = await featuresToGeoPackage([{ name: 'strata', features: siteStrata() }]);
  if (!sql) return bytes;
  const SQL = await sqlJsLoad();
  const db = new SQL.Database(bytes);
  try {
    db.run(sql, params);
    return db.export();
  } finally {
    db.close();
  }
}

/** A GeoPackage geometry blob (GeoPackage 1.3 §2.1.3, no envelope) of `depth` nested WKB GeometryCollections around one point. */
export function wkbDeepCollectionBlob(depth: number): Uint8Array {
  const out = new Uint8Array(8 + depth * 9 + 21);
  const view = new DataView(out.buffer);
  out.set([0x47, 0x50, 0, 0x01]);
  view.setInt32(4, 4326, true);
  let at = 8;
  for (let k = 0; k < depth; k++) {
    view.setUint8(at, 1);
    view.setUint32(at + 1, 7, true);
    view.setUint32(at + 5, 1, true);
    at += 9;
  }
  view.setUint8(at, 1);
  view.setUint32(at + 1, 1, true);
  view.setFloat64(at + 5, X0, true);
  view.setFloat64(at + 13, Y0, true);
  return out;
}

/** A point CSV of `n` access points (one header row), for the stack-depth case. */
export function accessCsv(n: number): Uint8Array {
  const rows = ['name,kind,lon,lat'];
  for (let i = 0; i < n; i++) rows.push(`Gate ${i},gate,${(X0 + 0.002).toFixed(6)},${(Y0 + 0.001).toFixed(6)}`);
  return text(`${rows.join('\n')}\n`);
}
