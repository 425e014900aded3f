import fc from 'fast-check';
import { describe, it } from 'vitest';
import { shapefileParts, shpVertexOffset, zipOf } from '../hostile/hostileFiles';
import { areasAgree, FUZZ_SEED, fuzzCli, fuzzDir, fuzzReport, fuzzRuns, fuzzTally, ringAreaSignedM2 } from './fuzzHarness';

// Shapefile and DBF byte mutations: the invented site's two strata written by the project's own
// writer, then bytes, coordinate words, counts and header fields changed. `stratplot areas` must
// exit 0 with the total area an independent reading of the same bytes gives (ESRI 1998 layout, rings
// measured with GeographicLib), or exit 2 with one line: never a ring lost without a word.

const ODD_DOUBLES = [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 1e300, -1e300, 5e-324, 0, 200, -95, 150.5005, -35.0995];
const ODD_INTS = [0, 1, -1, 2, 3, 5, 7, 1000, 0x7fffffff, -0x80000000];

const mutationArb = fc.oneof(
  fc.record({ op: fc.constant('byte' as const), file: fc.constantFrom('shp', 'dbf'), at: fc.nat(), value: fc.integer({ min: 0, max: 255 }) }),
  fc.record({ op: fc.constant('double' as const), record: fc.integer({ min: 0, max: 1 }), vertex: fc.nat({ max: 12 }), axis: fc.integer({ min: 0, max: 1 }), value: fc.constantFrom(...ODD_DOUBLES) }),
  fc.record({ op: fc.constant('shpInt' as const), field: fc.constantFrom(24, 32, 100 + 4, 100 + 8, 100 + 44, 100 + 48, 100 + 52), value: fc.constantFrom(...ODD_INTS), big: fc.boolean() }),
  fc.record({ op: fc.constant('dbfHeader' as const), field: fc.constantFrom(4, 8, 10), value: fc.constantFrom(...ODD_INTS) }),
  fc.record({ op: fc.constant('deleted' as const), record: fc.integer({ min: 0, max: 1 }) }),
  fc.record({ op: fc.constant('truncate' as const), file: fc.constantFrom('shp', 'dbf'), at: fc.nat() }),
);
type Mutation = typeof mutationArb extends fc.Arbitrary<infer T> ? T : never;

function apply(files: Record<string, Uint8Array>, m: Mutation): void {
  const shp = files['strata.shp'];
  const dbf = files['strata.dbf'];
  const sv = new DataView(shp.buffer, shp.byteOffset, shp.byteLength);
  const dv = new DataView(dbf.buffer, dbf.byteOffset, dbf.byteLength);
  switch (m.op) {
    case 'byte': {
      const b = m.file === 'shp' ? shp : dbf;
      if (b.length) b[m.at % b.length] = m.value;
      break;
    }
    case 'double': {
      try {
        const at = shpVertexOffset(shp, m.record, m.vertex) + 8 * m.axis;
        if (at + 8 <= shp.length) sv.setFloat64(at, m.value, true);
      } catch {
        // An earlier mutation already broke the record walk; leave this one out.
      }
      break;
    }
    case 'shpInt':
      if (m.field + 4 <= shp.length) sv.setInt32(m.field, m.value, !m.big);
      break;
    case 'dbfHeader':
      if (dbf.length < 12) break;
      if (m.field === 4) dv.setUint32(4, m.value >>> 0, true);
      else dv.setUint16(m.field, m.value & 0xffff, true);
      break;
    case 'deleted': {
      if (dbf.length < 12) break;
      const at = dv.getUint16(8, true) + m.record * dv.getUint16(10, true);
      if (at < dbf.length) dbf[at] = 0x2a;
      break;
    }
    case 'truncate': {
      const key = m.file === 'shp' ? 'strata.shp' : 'strata.dbf';
      files[key] = files[key].slice(0, m.at % (files[key].length + 1));
      break;
    }
  }
}

/** Total area by an independent reading of the bytes: polygon records, deleted .dbf rows left out, |Σ −signed ring areas| per record. */
function independentTotal(shp: Uint8Array, dbf: Uint8Array): number {
  const v = new DataView(shp.buffer, shp.byteOffset, shp.byteLength);
  const d = new DataView(dbf.buffer, dbf.byteOffset, dbf.byteLength);
  const headerLen = d.getUint16(8, true);
  const recordLen = d.getUint16(10, true);
  let total = 0;
  let at = 100;
  for (let r = 0; at + 8 <= shp.length; r++) {
    const len = v.getInt32(at + 4, false) * 2;
    const c = at + 8;
    at = c + len;
    if (len === 0 || v.getInt32(c, true) === 0) continue;
    if (dbf[headerLen + r * recordLen] === 0x2a) continue;
    const parts = v.getInt32(c + 36, true);
    const points = v.getInt32(c + 40, true);
    const starts = Array.from({ length: parts }, (_, k) => v.getInt32(c + 44 + 4 * k, true));
    const base = c + 44 + 4 * parts;
    let sum = 0;
    for (let k = 0; k < parts; k++) {
      const ring: number[][] = [];
      for (let p = starts[k]; p < (k + 1 < parts ? starts[k + 1] : points); p++) ring.push([v.getFloat64(base + 16 * p, true), v.getFloat64(base + 16 * p + 8, true)]);
      if (ring.length) sum -= ringAreaSignedM2(ring);
    }
    total += Math.abs(sum);
  }
  return total;
}

describe('fuzz: shapefile and DBF bytes through stratplot areas', () => {
  it('exit 0 with the area the bytes hold, or one error line with exit 2', async () => {
    const dir = fuzzDir('shapefile');
    const tally = fuzzTally('shapefile');
    const base = shapefileParts();
    await fc.assert(
      fc.asyncProperty(fc.array(mutationArb, { minLength: 1, maxLength: 3 }), async (mutations) => {
        const files = Object.fromEntries(Object.entries(base).map(([k, b]) => [k, b.slice()]));
        for (const m of mutations) apply(files, m);
        const r = await fuzzCli(tally, dir, { 'strata.zip': zipOf(files) }, ['areas', 'strata.zip', '--json']);
        if (r.code !== 0) return;
        const got = (JSON.parse(r.out).strata as { area_m2: number }[]).reduce((s, x) => s + x.area_m2, 0);
        const want = independentTotal(files['strata.shp'], files['strata.dbf']);
        if (!areasAgree(got, want)) throw new Error(`stratplot reads ${got} m² in all; the bytes hold ${want} m²`);
      }),
      { seed: FUZZ_SEED, numRuns: fuzzRuns(60) },
    );
    fuzzReport(tally);
  });
});
