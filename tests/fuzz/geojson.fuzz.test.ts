import fc from 'fast-check';
import { describe, it } from 'vitest';
import { X0, Y0 } from '../hostile/hostileFiles';
import { areasAgree, FUZZ_SEED, fuzzCli, fuzzDir, fuzzReport, fuzzRuns, fuzzTally, polygonAreaM2 } from './fuzzHarness';

// GeoJSON structure and values: invented strata (star-shaped polygons, so simple by construction,
// some with a hole, some MultiPolygons), then zero to three mutations of the document or its text.
// `stratplot areas --json` must exit 0 with every stratum's area equal to GeographicLib's geodesic
// area of what the file holds, or exit 2 with one line.

type Json = Record<string, unknown>;

const STRATA = ['Heath (invented)', 'Dune (invented)', 'Marsh (invented)'];
/** Values a fuzzed coordinate or property may become; "@@…@@" strings are written bare into the text. */
const ODD_VALUES: unknown[] = [null, '1', true, [], {}, 181, -91, 1e308, -1e308, 5e-324, '@@1e400@@', '@@-1e400@@', '@@NaN@@', 0, -0];

const star = (cx: number, cy: number, radii: number[], r: number): number[][] => {
  const ring = radii.map((f, j) => {
    const a = (2 * Math.PI * j) / radii.length;
    return [cx + r * f * Math.cos(a), cy + r * f * Math.sin(a)];
  });
  return [...ring, ring[0]];
};

const stratumArb = fc.record({
  key: fc.constantFrom(...STRATA),
  radii: fc.array(fc.double({ min: 0.3, max: 1, noNaN: true }), { minLength: 3, maxLength: 10 }),
  hole: fc.boolean(),
  multi: fc.boolean(),
});

const mutationArb = fc.oneof(
  fc.record({ op: fc.constant('value' as const), f: fc.nat(), v: fc.nat(), value: fc.constantFrom(...ODD_VALUES) }),
  fc.record({ op: fc.constant('dropVertex' as const), f: fc.nat(), v: fc.nat() }),
  fc.record({ op: fc.constant('type' as const), f: fc.nat(), to: fc.constantFrom('Point', 'LineString', 'MultiPolygon', 'Polygon', 'GeometryCollection', 'Circle', 7) }),
  fc.record({ op: fc.constant('wrap' as const), f: fc.nat(), depth: fc.integer({ min: 1, max: 40 }) }),
  fc.record({ op: fc.constant('nest' as const), f: fc.nat(), depth: fc.integer({ min: 1, max: 6 }) }),
  fc.record({ op: fc.constant('deleteKey' as const), f: fc.nat(), key: fc.constantFrom('type', 'geometry', 'properties', 'coordinates') }),
  fc.record({ op: fc.constant('stratum' as const), f: fc.nat(), value: fc.constantFrom(...ODD_VALUES, '', '   ', 'x'.repeat(300), 'Heath (invented)', 42) }),
  fc.record({ op: fc.constant('crs' as const), value: fc.constantFrom('EPSG:4326', 'urn:ogc:def:crs:OGC:1.3:CRS84', 'EPSG:99999', 'garbage', 7) }),
  fc.record({ op: fc.constant('truncate' as const), at: fc.nat() }),
  fc.record({ op: fc.constant('insert' as const), at: fc.nat(), text: fc.constantFrom(',', ']', '[', '{', '"', '-', 'e', '0', '\u0000', '\ufeff', ' ') }),
);

function mutate(doc: Json, m: { op: string; [k: string]: unknown }): Json {
  const features = doc.features as Json[];
  const pick = <T>(list: T[], i: unknown): T | undefined => (list.length ? list[(i as number) % list.length] : undefined);
  const f = pick(features, m.f);
  const g = f?.geometry as Json | null | undefined;
  const ringOf = (geom: Json | null | undefined): unknown[] | undefined => {
    const c = geom?.coordinates as unknown[] | undefined;
    if (!Array.isArray(c) || !Array.isArray(c[0])) return undefined;
    return Array.isArray((c[0] as unknown[])[0]) && Array.isArray(((c[0] as unknown[])[0] as unknown[])[0]) ? ((c[0] as unknown[])[0] as unknown[]) : (c[0] as unknown[]);
  };
  switch (m.op) {
    case 'value': {
      const ring = ringOf(g);
      const p = ring && (pick(ring, m.v) as unknown[] | undefined);
      if (Array.isArray(p)) p[(m.v as number) % 2] = m.value;
      break;
    }
    case 'dropVertex': {
      const ring = ringOf(g);
      if (ring?.length) ring.splice((m.v as number) % ring.length, 1);
      break;
    }
    case 'type':
      if (g) g.type = m.to;
      break;
    case 'wrap':
      if (f) for (let k = 0; k < (m.depth as number); k++) f.geometry = { type: 'GeometryCollection', geometries: [f.geometry] };
      break;
    case 'nest':
      if (g) for (let k = 0; k < (m.depth as number); k++) g.coordinates = [g.coordinates];
      break;
    case 'deleteKey':
      if (f && m.key === 'coordinates') delete g?.coordinates;
      else if (f) delete f[m.key as string];
      break;
    case 'stratum':
      if (f) f.properties = { ...(f.properties as Json), stratum: m.value };
      break;
    case 'crs':
      doc.crs = { type: 'name', properties: { name: m.value } };
      break;
  }
  return doc;
}

/** The per-stratum areas the file describes, worked out independently of stratplot (GeographicLib). */
function expectedAreas(text: string): Map<string, number> | null {
  let doc: Json;
  try {
    // A leading byte-order mark may be ignored (RFC 8259 §8.1), as stratplot does.
    doc = JSON.parse(text.replace(/^\ufeff/, ''));
  } catch {
    return null;
  }
  const out = new Map<string, number>();
  for (const f of (doc.features as Json[]) ?? []) {
    const g = f.geometry as Json;
    const p = f.properties as Json;
    const raw = p?.stratum;
    const key = typeof raw === 'string' ? raw.trim() : typeof raw === 'number' && Number.isFinite(raw) ? String(raw) : '';
    const polys = (g.type === 'Polygon' ? [g.coordinates] : g.coordinates) as number[][][][];
    const area = polys.reduce((s, rings) => s + polygonAreaM2(rings), 0);
    out.set(key, (out.get(key) ?? 0) + area);
  }
  return out;
}

describe('fuzz: GeoJSON strata files through stratplot areas', () => {
  it('exit 0 with GeographicLib areas, or one error line with exit 2', async () => {
    const dir = fuzzDir('geojson');
    const tally = fuzzTally('geojson');
    await fc.assert(
      fc.asyncProperty(fc.array(stratumArb, { minLength: 1, maxLength: 4 }), fc.array(mutationArb, { maxLength: 3 }), async (strata, mutations) => {
        const R = 0.003;
        const features: Json[] = strata.map((s, i) => {
          const cx = X0 + i * 0.01;
          const cy = Y0;
          const geometry = s.multi
            ? { type: 'MultiPolygon', coordinates: [[star(cx - 0.002, cy, s.radii, R / 3)], [star(cx + 0.002, cy, s.radii, R / 3)]] }
            : { type: 'Polygon', coordinates: s.hole ? [star(cx, cy, s.radii, R), star(cx, cy, s.radii, 0.2 * R).reverse()] : [star(cx, cy, s.radii, R)] };
          return { type: 'Feature', properties: { stratum: s.key }, geometry };
        });
        let doc: Json = { type: 'FeatureCollection', features };
        let text = '';
        for (const m of mutations) if (m.op !== 'truncate' && m.op !== 'insert') doc = mutate(doc, m);
        text = JSON.stringify(doc).replace(/"@@(.*?)@@"/g, '$1');
        for (const m of mutations) {
          if (m.op === 'truncate') text = text.slice(0, (m.at as number) % (text.length + 1));
          if (m.op === 'insert') {
            const at = (m.at as number) % (text.length + 1);
            text = text.slice(0, at) + (m.text as string) + text.slice(at);
          }
        }
        const r = await fuzzCli(tally, dir, { 'strata.geojson': text }, ['areas', 'strata.geojson', '--json']);
        if (r.code !== 0) return;
        const want = expectedAreas(text);
        if (!want) throw new Error('stratplot read a file that is not JSON');
        const got = JSON.parse(r.out).strata as { stratum: string; area_m2: number }[];
        if (got.length !== want.size) throw new Error(`${got.length} strata reported, the file has ${want.size}`);
        for (const s of got) {
          const expected = want.get(s.stratum);
          if (expected === undefined || !areasAgree(s.area_m2, expected)) throw new Error(`stratum ${s.stratum}: ${s.area_m2} m², GeographicLib gives ${expected}`);
        }
      }),
      { seed: FUZZ_SEED, numRuns: fuzzRuns(60) },
    );
    fuzzReport(tally);
  });
});
