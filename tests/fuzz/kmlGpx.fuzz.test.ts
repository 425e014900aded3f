import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../src/core/common/InputError';
import { parseFeatureFile } from '../../src/io/site/parseFeatureFile';
import { boxRing, X0, Y0 } from '../hostile/hostileFiles';
import { areasAgree, FUZZ_SEED, fuzzCli, fuzzDir, fuzzReport, fuzzRuns, fuzzTally, polygonAreaM2 } from './fuzzHarness';

// KML and GPX text mutations. KML: two invented strata (one with a hole) whose coordinate text
// and markup get characters replaced, inserted or deleted; `stratplot areas` must exit 0 with the
// area a strict reading of every <coordinates> gives (GeographicLib), or exit 2 with one line.
// GPX: waypoints whose lat/lon attributes are fuzzed; the reader must give exactly the decimal
// values written (xsd:decimal, GPX 1.1) or refuse the file with an InputError.

const CHARS = ['0', '1', '5', '9', '.', ',', '-', '+', ' ', '\n', 'e', 'E', 'x', 'a', 'N', '<', '>', '/', '"', '&', '\u00a0', '١'];

function kmlDocument(): string {
  const ringText = (ring: number[][]) => ring.map((p) => `${p[0]},${p[1]}`).join(' ');
  const placemark = (name: string, outer: number[][], inner?: number[][]) =>
    `<Placemark><name>${name}</name><Polygon><outerBoundaryIs><LinearRing><coordinates>${ringText(outer)}</coordinates></LinearRing></outerBoundaryIs>` +
    (inner ? `<innerBoundaryIs><LinearRing><coordinates>${ringText(inner)}</coordinates></LinearRing></innerBoundaryIs>` : '') +
    '</Polygon></Placemark>';
  return (
    '<?xml version="1.0" encoding="UTF-8"?><kml xmlns="http://www.opengis.net/kml/2.2"><Document>' +
    placemark('Heath (invented)', boxRing(X0, Y0, 0.004, 0.003), boxRing(X0 + 0.001, Y0 + 0.001, 0.001, 0.001).reverse()) +
    placemark('Dune (invented)', boxRing(X0 + 0.004, Y0, 0.003, 0.003)) +
    '</Document></kml>'
  );
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Areas by placemark name from a strict reading of the text (regular expressions, not a KML library), or null when a tuple is unreadable. */
function independentAreas(text: string): Map<string, number> | null {
  const out = new Map<string, number>();
  const tuples = (body: string): number[][] | null => {
    const list = body.trim().split(/\s+/).filter(Boolean).map((t) => t.split(','));
    if (!list.every((v) => (v.length === 2 || v.length === 3) && v.every((x) => NUMBER.test(x)))) return null;
    return list.map((v) => v.map(Number));
  };
  // Tags as XML allows them: white space may stand before the closing ">" of a tag.
  for (const pm of text.match(/<Placemark\s*>[\s\S]*?<\/Placemark\s*>/g) ?? []) {
    const name = /<name\s*>([^<]*)<\/name\s*>/.exec(pm)?.[1]?.trim() ?? '';
    // Stray text between the tags (an edit can leave "0" there) does not stop a KML reader from reading the ring.
    const outer = /<outerBoundaryIs\s*>[^<]*<LinearRing\s*>[^<]*<coordinates\s*>([^<]*)<\/coordinates\s*>/.exec(pm)?.[1];
    const inner = /<innerBoundaryIs\s*>[^<]*<LinearRing\s*>[^<]*<coordinates\s*>([^<]*)<\/coordinates\s*>/.exec(pm)?.[1];
    if (outer === undefined) continue;
    const rings = [tuples(outer), ...(inner === undefined ? [] : [tuples(inner)])];
    if (rings.some((r) => r === null)) return null;
    out.set(name, (out.get(name) ?? 0) + polygonAreaM2(rings as number[][][]));
  }
  return out;
}

const editArb = fc.record({ at: fc.nat(), kind: fc.constantFrom('replace', 'insert', 'delete'), ch: fc.constantFrom(...CHARS), inCoordinates: fc.boolean() });

describe('fuzz: KML text through stratplot areas', () => {
  it('exit 0 with the area a strict reading of the coordinates gives, or one error line with exit 2', async () => {
    const dir = fuzzDir('kml');
    const tally = fuzzTally('kml');
    const base = kmlDocument();
    const spans = [...base.matchAll(/<coordinates>([^<]*)<\/coordinates>/g)].map((m) => [m.index! + 13, m.index! + 13 + m[1].length]);
    await fc.assert(
      fc.asyncProperty(fc.array(editArb, { minLength: 1, maxLength: 4 }), async (edits) => {
        let text = base;
        for (const e of edits) {
          // Most edits land inside coordinate text (where readers drop things silently), some anywhere.
          const span = spans[e.at % spans.length];
          const at = e.inCoordinates ? span[0] + (e.at % Math.max(1, span[1] - span[0])) : e.at % text.length;
          if (e.kind === 'replace') text = text.slice(0, at) + e.ch + text.slice(at + 1);
          else if (e.kind === 'insert') text = text.slice(0, at) + e.ch + text.slice(at);
          else text = text.slice(0, at) + text.slice(at + 1);
        }
        const r = await fuzzCli(tally, dir, { 'strata.kml': text }, ['areas', 'strata.kml', '--field', 'name', '--json']);
        if (r.code !== 0) return;
        const want = independentAreas(text);
        if (!want) throw new Error('stratplot read a coordinate tuple a strict reading refuses');
        for (const s of JSON.parse(r.out).strata as { stratum: string; area_m2: number }[]) {
          const expected = want.get(s.stratum);
          if (expected === undefined || !areasAgree(s.area_m2, expected)) throw new Error(`stratum ${s.stratum}: ${s.area_m2} m², a strict reading gives ${expected}`);
        }
      }),
      { seed: FUZZ_SEED, numRuns: fuzzRuns(60) },
    );
    fuzzReport(tally);
  });
});

const GPX_DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)$/;

describe('fuzz: GPX waypoint attributes through the reader', () => {
  it('gives exactly the decimal values written, or refuses the file with a one-line InputError', async () => {
    const valueArb = fc.oneof(
      fc.double({ min: -90, max: 90, noNaN: true }).map((v) => String(v)),
      fc.constantFrom('0x10', '1e1', '16', ' 12.5 ', '+3', '-0', '.5', '5.', '', 'NaN', 'Infinity', '９0', '1,5', '-35.1', '91', '-180.0001', '1e-400'),
    );
    let runs = 0;
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(valueArb, valueArb), { minLength: 1, maxLength: 4 }), async (points) => {
        runs++;
        const wpts = points.map(([lat, lon], i) => `<wpt lat="${lat}" lon="${lon}"><name>Gate ${i + 1}</name></wpt>`).join('');
        const text = `<?xml version="1.0"?><gpx version="1.1" creator="stratplot tests" xmlns="http://www.topografix.com/GPX/1/1">${wpts}</gpx>`;
        const valid = points.every(([lat, lon]) => GPX_DECIMAL.test(lat.trim()) && GPX_DECIMAL.test(lon.trim()) && Math.abs(Number(lat)) <= 90 && Math.abs(Number(lon)) <= 180);
        try {
          const fcOut = await parseFeatureFile('access.gpx', new TextEncoder().encode(text));
          expect(valid).toBe(true);
          expect(fcOut.features.map((f) => (f.geometry as { coordinates: number[] }).coordinates)).toEqual(points.map(([lat, lon]) => [Number(lon), Number(lat)]));
        } catch (error) {
          if (!isInputError(error)) throw error;
          expect(valid).toBe(false);
          expect((error as Error).message).not.toContain('\n');
        }
      }),
      { seed: FUZZ_SEED, numRuns: fuzzRuns(60) },
    );
    if (process.env.STRATPLOT_FUZZ_RUNS) console.log(`fuzz gpx: ${runs} inputs`);
  });
});
