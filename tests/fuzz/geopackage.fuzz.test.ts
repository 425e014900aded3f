import fc from 'fast-check';
import { describe, it } from 'vitest';
import { sqlJsLoad } from '../../src/io/formats/geopackage/sqlJsLoad';
import { geoPackageWith } from '../hostile/hostileFiles';
import { areasAgree, FUZZ_SEED, fuzzCli, fuzzDir, fuzzReport, fuzzRuns, fuzzTally, polygonAreaM2 } from './fuzzHarness';

// GeoPackage geometry blob mutations: the invented site's strata written by the project's own
// GeoPackage writer, then bytes of one stored geometry blob changed, cut or lengthened.
// `stratplot areas` must exit 0 with the total area an independent reading of the blobs gives
// (GeoPackage 1.3 §2.1.3 header, ISO WKB per OGC 06-103r4, rings measured with GeographicLib), or
// exit 2 with one line.

const ODD_BYTES = [0, 1, 2, 3, 6, 7, 0x10, 0x80, 0xff, 0x7f, 0xe8, 0x03];

/** Rings of every polygon in a blob, read independently; null when the blob does not follow the layout. */
function independentPolygons(blob: Uint8Array): number[][][][] | null {
  if (blob.length < 8 || blob[0] !== 0x47 || blob[1] !== 0x50) return null;
  const flags = blob[3];
  if (flags & 0x10) return [];
  const env = [0, 32, 48, 48, 64][(flags >> 1) & 7];
  if (env === undefined) return null;
  const v = new DataView(blob.buffer, blob.byteOffset, blob.byteLength);
  let at = 8 + env;
  let little = true;
  const need = (n: number) => {
    if (at + n > blob.length) throw new Error('short');
  };
  const u32 = () => {
    need(4);
    const x = v.getUint32(at, little);
    at += 4;
    return x;
  };
  const f64 = () => {
    need(8);
    const x = v.getFloat64(at, little);
    at += 8;
    return x;
  };
  const geometry = (depth: number): number[][][][] => {
    if (depth > 40) throw new Error('deep');
    need(1);
    const order = blob[at++];
    if (order > 1) throw new Error('order');
    little = order === 1;
    const raw = u32();
    let code = raw & 0x0fffffff;
    let dims = 2 + (raw & 0x80000000 ? 1 : 0) + (raw & 0x40000000 ? 1 : 0);
    if (code > 1000) {
      const z = Math.floor(code / 1000);
      if (z > 3) throw new Error('type');
      dims = z === 3 ? 4 : 3;
      code %= 1000;
    }
    const points = () => {
      const n = u32();
      if (n * 8 * dims > blob.length - at) throw new Error('count');
      return Array.from({ length: n }, () => {
        const p = [f64(), f64()];
        for (let d = 2; d < dims; d++) f64();
        return p;
      });
    };
    if (code === 3) {
      const n = u32();
      if (n * 4 > blob.length - at) throw new Error('count');
      return [Array.from({ length: n }, points)];
    }
    if (code === 6 || code === 7) {
      const n = u32();
      if (n * 9 > blob.length - at) throw new Error('count');
      return Array.from({ length: n }, () => geometry(depth + 1)).flat();
    }
    throw new Error('not polygonal');
  };
  try {
    return geometry(0);
  } catch {
    return null;
  }
}

const editArb = fc.oneof(
  fc.record({ kind: fc.constant('set' as const), at: fc.nat(), value: fc.oneof(fc.constantFrom(...ODD_BYTES), fc.integer({ min: 0, max: 255 })) }),
  fc.record({ kind: fc.constant('cut' as const), at: fc.nat() }),
  fc.record({ kind: fc.constant('grow' as const), bytes: fc.uint8Array({ maxLength: 40 }) }),
);

describe('fuzz: GeoPackage geometry blobs through stratplot areas', () => {
  it('exit 0 with the area the blobs hold, or one error line with exit 2', async () => {
    const dir = fuzzDir('gpkg');
    const tally = fuzzTally('gpkg');
    const base = await geoPackageWith('');
    const SQL = await sqlJsLoad();
    const original = (() => {
      const db = new SQL.Database(base);
      const rows = db.exec('SELECT fid, geom FROM "strata" ORDER BY fid')[0].values as [number, Uint8Array][];
      db.close();
      return rows;
    })();
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 0, max: original.length - 1 }), fc.array(editArb, { minLength: 1, maxLength: 3 }), async (row, edits) => {
        let blob = original[row][1].slice();
        for (const e of edits) {
          if (e.kind === 'set') blob[e.at % blob.length] = e.value;
          else if (e.kind === 'cut') blob = blob.slice(0, e.at % (blob.length + 1));
          else blob = Uint8Array.from([...blob, ...e.bytes]);
        }
        const db = new SQL.Database(base);
        db.run('UPDATE "strata" SET geom = ? WHERE fid = ?', [blob, original[row][0]]);
        const bytes = db.export();
        db.close();
        const r = await fuzzCli(tally, dir, { 'strata.gpkg': bytes }, ['areas', 'strata.gpkg', '--json']);
        if (r.code !== 0) return;
        const blobs = original.map(([, b], i) => (i === row ? blob : b));
        let want = 0;
        for (const b of blobs) {
          const polys = independentPolygons(b);
          if (polys === null) throw new Error('stratplot read a blob that does not follow the GeoPackage/WKB layout');
          for (const rings of polys) want += polygonAreaM2(rings);
        }
        const got = (JSON.parse(r.out).strata as { area_m2: number }[]).reduce((s, x) => s + x.area_m2, 0);
        if (!areasAgree(got, want)) throw new Error(`stratplot reads ${got} m² in all; the blobs hold ${want} m²`);
      }),
      { seed: FUZZ_SEED, numRuns: fuzzRuns(40) },
    );
    fuzzReport(tally);
  });
});
