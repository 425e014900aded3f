import { describe, expect, it } from 'vitest';
import { jsonStringifyKeepingGeometry } from './jsonStringifyKeepingGeometry';

const ring = (x: number) => [[x, -35], [x + 0.01, -35], [x + 0.01, -34.99], [x, -34.99], [x, -35]];

/** The platform's JSON.stringify (ECMA-262 §25.5.2) with each UTF-16 unit above U+00FF as a \u escape (RFC 8259 §7). */
const reference = (v: unknown) => JSON.stringify(v).replace(/[\u0100-\uffff]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);

describe('jsonStringifyKeepingGeometry', () => {
  it('writes the text JSON.stringify writes, nested geometries, odd strings and all', () => {
    const plan = {
      name: 'Mosaic "north" (invented)',
      parts: [
        { id: 'a', geometry: { type: 'Polygon', coordinates: [ring(150)] }, properties: { note: 'x\u0000y café' } },
        { id: 'b', geometry: { type: 'MultiPolygon', coordinates: [[ring(150.1)], [ring(150.2)]] } },
      ],
      exclusions: [{ geometry: { type: 'LineString', coordinates: [[150, -35], [150.1, -35.1]] }, bufferM: 30 }, { geometry: { type: 'Point', coordinates: [150, -35] } }],
      result: { type: 'FeatureCollection', features: [{ type: 'Feature', geometry: { type: 'Point', coordinates: [150.001, -35.002] }, properties: { plot_id: 'HEA-1' } }], design: { seed: 3 } },
      empty: [],
      missing: undefined,
      n: 1e-7,
    };
    // Nothing above Latin-1 here: the very text of JSON.stringify.
    expect(jsonStringifyKeepingGeometry(plan)).toBe(JSON.stringify(plan));
    // Second call: texts come from the kept copies.
    expect(jsonStringifyKeepingGeometry(plan)).toBe(JSON.stringify(plan));
  });

  it('sees a replaced geometry, since it is a new object', () => {
    const part = { geometry: { type: 'Polygon', coordinates: [ring(150)] } };
    jsonStringifyKeepingGeometry(part);
    const moved = { ...part, geometry: { type: 'Polygon', coordinates: [ring(151)] } };
    expect(jsonStringifyKeepingGeometry(moved)).toBe(JSON.stringify(moved));
  });

  it('falls back to the plain text when a user text equals its marker', () => {
    const odd = { name: '\u0000g', geometry: { type: 'LineString', coordinates: [[1, 2], [3, 4]] } };
    expect(jsonStringifyKeepingGeometry(odd)).toBe(JSON.stringify(odd));
  });

  it('writes characters above Latin-1 as escapes, the same JSON value in one-byte text', () => {
    const plan = {
      name: 'Kōwhai — north ’scrub’ 🌿 café \u2028',
      parts: [{ geometry: { type: 'Polygon', coordinates: [ring(150)] }, properties: { note: 'ā' } }],
      result: { type: 'FeatureCollection', features: [{ type: 'Feature', geometry: null, properties: { text: 'edges face TRUE north — the UTM' } }] },
    };
    const text = jsonStringifyKeepingGeometry(plan);
    // RFC 8259 §7: any character may be escaped; parsing gives the same value.
    expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(plan)));
    expect(/[\u0100-\uffff]/.test(text)).toBe(false);
    expect(text).toContain('café'); // é is Latin-1: kept as it is
    expect(text).toContain('K\\u014dwhai \\u2014');
    expect(text).toBe(reference(plan));
    expect(jsonStringifyKeepingGeometry(plan)).toBe(reference(plan));
  });
});
